import { createHash, randomBytes } from "node:crypto";

/** A URL-safe random secret with a readable prefix ("cg_" for API tokens). */
export function newSecret(prefix = ""): string {
  return prefix + randomBytes(32).toString("base64url");
}

/** Secrets are stored only as SHA-256: they are long and random, so no slow hash is needed. */
export function hashSecret(secret: string): string {
  return createHash("sha256").update(secret).digest("hex");
}
