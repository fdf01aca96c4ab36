import "server-only";
import { and, desc, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { apiTokens, users } from "@/db/schema";
import { hashSecret, newSecret } from "@/lib/auth/secrets";
import { AppError } from "@/lib/errors";
import { assertCan, type Actor } from "@/lib/authz";
import type { ApiTokenDto, OwnedApiTokenDto } from "@/lib/contracts/people";
import { audit } from "@/lib/log";

export async function listApiTokens(actor: Actor): Promise<ApiTokenDto[]> {
  assertCan(actor, "account:self");
  const rows = await db
    .select()
    .from(apiTokens)
    .where(and(eq(apiTokens.userId, actor.id), isNull(apiTokens.revokedAt)))
    .orderBy(desc(apiTokens.createdAt));
  return rows.map((r) => ({ id: r.id, name: r.name, prefix: r.prefix, createdAt: r.createdAt.toISOString(), lastUsedAt: r.lastUsedAt?.toISOString() ?? null }));
}

/** Creates a token for the actor; the secret is returned this once and only its hash is kept. */
export async function createApiToken(actor: Actor, name: string): Promise<ApiTokenDto & { secret: string }> {
  assertCan(actor, "account:self");
  // Tokens cannot mint tokens: a leaked token must not be able to outlive its revocation.
  if (actor.via === "token") throw new AppError("forbidden");
  const secret = newSecret("cg_");
  const [row] = await db
    .insert(apiTokens)
    .values({ userId: actor.id, name, tokenHash: hashSecret(secret), prefix: secret.slice(0, 7) })
    .returning();
  return { id: row.id, name: row.name, prefix: row.prefix, createdAt: row.createdAt.toISOString(), lastUsedAt: null, secret };
}

export async function revokeApiToken(actor: Actor, id: string) {
  assertCan(actor, "account:self");
  const [row] = await db
    .update(apiTokens)
    .set({ revokedAt: new Date() })
    .where(and(eq(apiTokens.id, id), eq(apiTokens.userId, actor.id), isNull(apiTokens.revokedAt)))
    .returning({ id: apiTokens.id });
  if (!row) throw new AppError("notFound");
  audit("record.deleted", actor, { kind: "apiToken", id });
}

/** Every live API token of every user, newest first (administrators). */
export async function listAllApiTokens(actor: Actor): Promise<OwnedApiTokenDto[]> {
  assertCan(actor, "users:manage");
  const rows = await db
    .select({ token: apiTokens, owner: { id: users.id, name: users.name, email: users.email, disabled: users.disabled } })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(isNull(apiTokens.revokedAt))
    .orderBy(desc(apiTokens.createdAt));
  return rows.map(({ token: r, owner }) => ({ id: r.id, name: r.name, prefix: r.prefix, createdAt: r.createdAt.toISOString(), lastUsedAt: r.lastUsedAt?.toISOString() ?? null, owner }));
}

/** Revokes anyone's token (administrators); scripts using it get 401 from then on. */
export async function revokeAnyApiToken(actor: Actor, id: string): Promise<{ name: string; ownerName: string }> {
  assertCan(actor, "users:manage");
  const [row] = await db
    .update(apiTokens)
    .set({ revokedAt: new Date() })
    .where(and(eq(apiTokens.id, id), isNull(apiTokens.revokedAt)))
    .returning({ name: apiTokens.name, userId: apiTokens.userId });
  if (!row) throw new AppError("notFound");
  const [owner] = await db.select({ name: users.name }).from(users).where(eq(users.id, row.userId));
  const result = { name: row.name, ownerName: owner?.name ?? "" };
  audit("record.deleted", actor, { kind: "apiToken", id });
  return result;
}
