import "server-only";
import { and, count, eq, gt, isNull, lt } from "drizzle-orm";
import { db } from "@/db";
import { userSessions } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";

/** How long a sign-in lasts; the cookie (lib/auth/config.ts) and its row end together. */
export const sessionLifetimeSeconds = 12 * 60 * 60;

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
export const isSessionId = (value: unknown): value is string => typeof value === "string" && uuidPattern.test(value);

/** A row for a new sign-in; its id goes into the session cookie. */
export async function openSession(userId: string): Promise<string> {
  const [row] = await db
    .insert(userSessions)
    .values({ userId, expiresAt: new Date(Date.now() + sessionLifetimeSeconds * 1000) })
    .returning({ id: userSessions.id });
  // Rows a day past their end are of no use any more.
  await db.delete(userSessions).where(lt(userSessions.expiresAt, new Date(Date.now() - 24 * 60 * 60_000)));
  return row.id;
}

/** Signing out: the cookie's row is revoked, so a copy of the cookie stops working too. */
export async function revokeSession(sessionId: unknown): Promise<void> {
  if (!isSessionId(sessionId)) return;
  await db.update(userSessions).set({ revokedAt: new Date() }).where(and(eq(userSessions.id, sessionId), isNull(userSessions.revokedAt)));
}

const active = (userId: string) => and(eq(userSessions.userId, userId), isNull(userSessions.revokedAt), gt(userSessions.expiresAt, new Date()));

/** Whether a cookie's session row still lets its user in (lib/session.ts). */
export async function sessionIsActive(sessionId: unknown, userId: string): Promise<boolean> {
  if (!isSessionId(sessionId)) return false;
  const [row] = await db
    .select({ id: userSessions.id })
    .from(userSessions)
    .where(and(eq(userSessions.id, sessionId), active(userId)))
    .limit(1);
  return !!row;
}

export async function countActiveSessions(actor: Actor): Promise<number> {
  assertCan(actor, "account:self");
  const [{ n }] = await db.select({ n: count() }).from(userSessions).where(active(actor.id));
  return n;
}

/** "Sign out everywhere": ends every session of the actor, on every device; API tokens are not touched. */
export async function revokeAllSessions(actor: Actor): Promise<number> {
  assertCan(actor, "account:self");
  const ended = await db.update(userSessions).set({ revokedAt: new Date() }).where(active(actor.id)).returning({ id: userSessions.id });
  return ended.length;
}
