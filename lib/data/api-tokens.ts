import "server-only";
import { and, desc, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { apiTokens } from "@/db/schema";
import { hashSecret, newSecret } from "@/lib/auth/secrets";
import { AppError } from "@/lib/errors";
import { assertCan, type Actor } from "@/lib/authz";
import type { ApiTokenDto } from "@/lib/contracts/people";

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
}
