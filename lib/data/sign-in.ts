import "server-only";
import { and, eq, lt, sql } from "drizzle-orm";
import { db } from "@/db";
import { signInCounters, signInFailures, users, type User } from "@/db/schema";
import { verifyPassword } from "@/lib/auth/passwords";
import { addressKey } from "@/lib/client-address";
import { audit } from "@/lib/log";

/**
 * The sign-in limit. Every attempt is counted before its password is checked, in one statement, so
 * parallel attempts cannot all slip under it:
 * - per account and client address: past `perAddress` attempts in the window, further ones from that
 *   address are refused without a check (the owner, elsewhere, is not affected);
 * - per account across all addresses: past `perAccount` checks in the window, each further check waits
 *   `delayStepMs` more (at most `maxDelayMs`) — slower guessing, never a lockout.
 * A new password through a reset link lifts both (lib/data/users.ts); the reset link itself is never limited here.
 */
export const signInLimit = { windowMinutes: 15, perAddress: 10, perAccount: 10, delayStepMs: 500, maxDelayMs: 5_000 } as const;

/** The scope of the per-account counter; other scopes are address keys. */
const ALL_ADDRESSES = "*";

export type CredentialsResult = { kind: "ok"; user: User } | { kind: "invalid" } | { kind: "rateLimited" };

/** Counts one attempt and answers the count in the current window, atomically (one INSERT … ON CONFLICT DO UPDATE). */
async function countAttempt(email: string, scope: string): Promise<number> {
  const expired = sql`${signInCounters.windowStartedAt} <= now() - make_interval(mins => ${signInLimit.windowMinutes})`;
  const [row] = await db
    .insert(signInCounters)
    .values({ email, scope, attempts: 1 })
    .onConflictDoUpdate({
      target: [signInCounters.email, signInCounters.scope],
      set: {
        attempts: sql`CASE WHEN ${expired} THEN 1 ELSE ${signInCounters.attempts} + 1 END`,
        windowStartedAt: sql`CASE WHEN ${expired} THEN now() ELSE ${signInCounters.windowStartedAt} END`,
      },
    })
    .returning({ attempts: signInCounters.attempts });
  return row.attempts;
}

/** The wait before the next check of an account already checked `checks` times in the window. */
export function accountDelayMs(checks: number): number {
  const over = checks - signInLimit.perAccount;
  return over > 0 ? Math.min(signInLimit.maxDelayMs, over * signInLimit.delayStepMs) : 0;
}

/**
 * Checks an e-mail and password for a sign-in from `address` (the client's, from scripts/server.ts;
 * null when unknown: then only the per-account slowdown applies).
 */
export async function checkCredentials(rawEmail: string, password: string, address: string | null): Promise<CredentialsResult> {
  const email = rawEmail.trim().toLowerCase();
  const scope = address ? addressKey(address) : null;
  if (scope && (await countAttempt(email, scope)) > signInLimit.perAddress) {
    audit("signIn.limited", null, { email, address: scope });
    return { kind: "rateLimited" };
  }
  const wait = accountDelayMs(await countAttempt(email, ALL_ADDRESSES));
  if (wait > 0) await new Promise((resolve) => setTimeout(resolve, wait));

  const [user] = await db.select().from(users).where(eq(sql`lower(${users.email})`, email)).limit(1);
  const passwordOk = await verifyPassword(user?.passwordHash ?? null, password);
  if (!user || !passwordOk || user.disabled) {
    await db.insert(signInFailures).values({ email, address });
    // Old rows and counters are of no use once a day has passed.
    const dayAgo = new Date(Date.now() - 24 * 60 * 60_000);
    await db.delete(signInFailures).where(lt(signInFailures.at, dayAgo));
    await db.delete(signInCounters).where(lt(signInCounters.windowStartedAt, dayAgo));
    audit("signIn.failed", user ? { id: user.id, role: user.role, name: user.name } : null, { email, address: scope, reason: !user ? "unknownEmail" : user.disabled ? "disabled" : "wrongPassword" });
    return { kind: "invalid" };
  }
  // The owner proved the password: this address starts afresh, and the check does not count against the account.
  if (scope) await db.delete(signInCounters).where(and(eq(signInCounters.email, email), eq(signInCounters.scope, scope)));
  await db
    .update(signInCounters)
    .set({ attempts: sql`greatest(${signInCounters.attempts} - 1, 0)` })
    .where(and(eq(signInCounters.email, email), eq(signInCounters.scope, ALL_ADDRESSES)));
  audit("signIn.succeeded", { id: user.id, role: user.role, name: user.name }, { email, address: scope });
  return { kind: "ok", user };
}

/** After a new password is set through a reset link: the account's limits no longer apply. */
export async function clearSignInLimits(email: string, executor: Pick<typeof db, "delete"> = db): Promise<void> {
  await executor.delete(signInCounters).where(eq(signInCounters.email, email.trim().toLowerCase()));
}
