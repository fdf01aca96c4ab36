import "server-only";
import { and, eq, isNull } from "drizzle-orm";
import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { cache } from "react";
import { db } from "@/db";
import { apiTokens, users } from "@/db/schema";
import { auth } from "@/lib/auth/config";
import { hashSecret } from "@/lib/auth/secrets";
import { sessionIsActive } from "@/lib/data/sessions";
import { AppError } from "@/lib/errors";
import { assertCan, toActor, type Actor } from "@/lib/authz";
import type { Permission } from "@/lib/permissions";

async function actorFromToken(secret: string): Promise<Actor | null> {
  const [row] = await db
    .select({ user: users, tokenId: apiTokens.id, lastUsedAt: apiTokens.lastUsedAt })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(and(eq(apiTokens.tokenHash, hashSecret(secret)), isNull(apiTokens.revokedAt)))
    .limit(1);
  if (!row || row.user.disabled) return null;
  if (!row.lastUsedAt || Date.now() - row.lastUsedAt.getTime() > 60_000) {
    await db.update(apiTokens).set({ lastUsedAt: new Date() }).where(eq(apiTokens.id, row.tokenId));
  }
  return toActor(row.user, "token");
}

async function actorFromSession(): Promise<Actor | null> {
  const session = await auth();
  const claimed = session?.user;
  if (!claimed?.id) return null;
  const [[user], sessionActive] = await Promise.all([db.select().from(users).where(eq(users.id, claimed.id)).limit(1), sessionIsActive(claimed.sessionId, claimed.id)]);
  // Signing out revokes the cookie's session row; a role change, new password or disabling bumps
  // sessionVersion. Either way older cookies end here, copies included.
  if (!user || !sessionActive || user.disabled || user.sessionVersion !== claimed.sessionVersion) return null;
  return toActor(user, "session");
}

/** Who is asking: a Bearer API token wins over the session cookie. Cached per request. */
export const currentActor = cache(async (): Promise<Actor | null> => {
  const authorization = (await headers()).get("authorization");
  if (authorization) {
    const match = /^Bearer\s+(\S+)$/i.exec(authorization);
    return match ? actorFromToken(match[1]) : null;
  }
  return actorFromSession();
});

export async function requireActor(): Promise<Actor> {
  const actor = await currentActor();
  if (!actor) throw new AppError("unauthenticated");
  return actor;
}

export async function requirePermission(permission: Permission): Promise<Actor> {
  const actor = await requireActor();
  assertCan(actor, permission);
  return actor;
}

/** For pages: send people without a valid session to the sign-in page. */
export async function requirePageActor(): Promise<Actor> {
  const actor = await currentActor();
  if (!actor) redirect("/signin");
  return actor;
}

export { assertCan, type Actor };
