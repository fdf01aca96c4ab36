import { hash, verify } from "@node-rs/argon2";

// argon2id with the library's defaults (19 MiB, 2 passes: the OWASP minimum).
export function hashPassword(password: string): Promise<string> {
  return hash(password);
}

export async function verifyPassword(passwordHash: string | null, password: string): Promise<boolean> {
  // Hash anyway when the user has no password yet, so the timing does not tell.
  if (!passwordHash) {
    await hash(password);
    return false;
  }
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}
