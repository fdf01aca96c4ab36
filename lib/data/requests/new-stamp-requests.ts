import "server-only";
import { desc, eq, inArray, sql } from "drizzle-orm";
import { db } from "@/db";
import { newStampRequests, plans, type NewStampRequest } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import type { NewStampRequestDto } from "@/lib/contracts/plans";
import type { CreateNewStampRequestInput, DeclineRequestInput } from "@/lib/validation/plans";

// New-stamp requests: "make a stamp W × H mm" from a plan's fit helper, for the keepers' queue on the shelf. The
// motif archive extends them (sketches, roles, motifs, and turning a request into a stamp: state `made`).

async function toDtos(rows: NewStampRequest[]): Promise<NewStampRequestDto[]> {
  const ids = rows.flatMap((r) => (r.planId ? [r.planId] : []));
  const planRows = ids.length ? await db.select({ id: plans.id, name: plans.name }).from(plans).where(inArray(plans.id, ids)) : [];
  const name = new Map(planRows.map((p) => [p.id, p.name]));
  return rows.map((r) => ({
    id: r.id,
    widthMm: r.widthMm,
    heightMm: r.heightMm,
    plan: r.planId && name.has(r.planId) ? { id: r.planId, name: name.get(r.planId)! } : null,
    note: r.note,
    state: r.state,
    requesterName: r.requesterName,
    answeredByName: r.answeredByName,
    answeredAt: r.answeredAt?.toISOString() ?? null,
    declineReason: r.declineReason,
    version: r.version,
    createdAt: r.createdAt.toISOString(),
  }));
}

export async function createNewStampRequest(actor: Actor, input: CreateNewStampRequestInput): Promise<NewStampRequestDto> {
  assertCan(actor, "stamps:requestNew");
  if (input.planId) {
    const [plan] = await db.select({ id: plans.id }).from(plans).where(eq(plans.id, input.planId));
    if (!plan) throw new AppError("unprocessable", {}, { planId: ["validation.planUnknown"] });
  }
  const [row] = await db
    .insert(newStampRequests)
    .values({ widthMm: input.widthMm, heightMm: input.heightMm, planId: input.planId ?? null, note: input.note ?? null, requestedBy: actor.id, requesterName: actor.name })
    .returning();
  return (await toDtos([row]))[0];
}

/** New-stamp requests, open ones first, newest first. */
export async function listNewStampRequests(actor: Actor, query: { state?: NewStampRequest["state"] } = {}): Promise<NewStampRequestDto[]> {
  assertCan(actor, "data:read");
  const rows = await db
    .select()
    .from(newStampRequests)
    .where(query.state ? eq(newStampRequests.state, query.state) : undefined)
    .orderBy(sql`(${newStampRequests.state} = 'open') DESC`, desc(newStampRequests.createdAt))
    .limit(300);
  return toDtos(rows);
}

/** Keepers decline an open new-stamp request with a reason. */
export async function declineNewStampRequest(actor: Actor, id: string, input: DeclineRequestInput): Promise<NewStampRequestDto> {
  assertCan(actor, "stamps:write");
  const row = await db.transaction(async (tx) => {
    const [r] = await tx.select().from(newStampRequests).where(eq(newStampRequests.id, id)).for("update");
    if (!r) throw new AppError("notFound");
    if (r.version !== input.version) throw new AppError("versionConflict");
    if (r.state !== "open") throw new AppError("requestAnswered", { state: r.state });
    const [updated] = await tx
      .update(newStampRequests)
      .set({ state: "declined", declineReason: input.reason, answeredBy: actor.id, answeredByName: actor.name, answeredAt: sql`now()`, version: sql`${newStampRequests.version} + 1`, updatedAt: sql`now()` })
      .where(eq(newStampRequests.id, id))
      .returning();
    return updated;
  });
  return (await toDtos([row]))[0];
}
