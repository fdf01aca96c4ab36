import "server-only";
import { and, count, eq, gt, lt, sql } from "drizzle-orm";
import { db } from "@/db";
import { signInFailures, users, type User } from "@/db/schema";
import { verifyPassword } from "@/lib/auth/passwords";

/** At most this many failed sign-ins per e-mail address in the window; then wait, no lockout. */
export const signInLimit = { failures: 10, windowMinutes: 15 } as const;

export type CredentialsResult = { kind: "ok"; user: User } | { kind: "invalid" } | { kind: "rateLimited" };

export async function checkCredentials(rawEmail: string, password: string): Promise<CredentialsResult> {
  const email = rawEmail.trim().toLowerCase();
  const windowStart = new Date(Date.now() - signInLimit.windowMinutes * 60_000);
  const [{ failures }] = await db
    .select({ failures: count() })
    .from(signInFailures)
    .where(and(eq(signInFailures.email, email), gt(signInFailures.at, windowStart)));
  if (failures >= signInLimit.failures) return { kind: "rateLimited" };

  const [user] = await db.select().from(users).where(eq(sql`lower(${users.email})`, email)).limit(1);
  const passwordOk = await verifyPassword(user?.passwordHash ?? null, password);
  if (!user || !passwordOk || user.disabled) {
    await db.insert(signInFailures).values({ email });
    // Old rows are of no use once outside the window.
    await db.delete(signInFailures).where(lt(signInFailures.at, new Date(Date.now() - 24 * 60 * 60_000)));
    return { kind: "invalid" };
  }
  await db.delete(signInFailures).where(eq(signInFailures.email, email));
  return { kind: "ok", user };
}
