import "server-only";
import { and, asc, desc, eq, gte, inArray, isNull, lte, ne, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { checkouts, locations, plans, stampRequestItems, stampRequests, stamps, users, type StampRequest } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import type { StampRequestDto } from "@/lib/contracts/plans";
import { canBeCheckedOut } from "@/lib/stamps/condition";
import type { CreateStampRequestInput, DeclineRequestInput, StampRequestListQuery } from "@/lib/validation/plans";
import { workshopToday } from "../settings";
import { recordEvent } from "../stamps/events";
import { toLocationRef } from "../stamps/shared";
import { mailKeepersAboutRequest, mailRequesterAnswer, type RequestMailFacts } from "./mail";

// Stamp (check-out) requests: anyone asks for stamps for some days; keepers accept (all the stamps checked out in one
// transaction, or on the request's first day when it starts later) or decline with a reason. Both sides get mail.

async function findRequest(tx: Transaction | typeof db, id: string, lock = false): Promise<StampRequest> {
  const query = tx.select().from(stampRequests).where(eq(stampRequests.id, id)).limit(1);
  const [row] = lock ? await query.for("update") : await query;
  if (!row) throw new AppError("notFound");
  return row;
}

async function itemsOf(requestIds: string[]) {
  if (requestIds.length === 0) return [];
  return db
    .select({ requestId: stampRequestItems.requestId, stampId: stamps.id, code: stamps.code, name: stamps.name, location: locations, checkoutId: checkouts.id })
    .from(stampRequestItems)
    .innerJoin(stamps, eq(stamps.id, stampRequestItems.stampId))
    .leftJoin(locations, eq(locations.id, stamps.locationId))
    .leftJoin(checkouts, and(eq(checkouts.stampId, stamps.id), isNull(checkouts.returnedAt)))
    .where(inArray(stampRequestItems.requestId, requestIds))
    .orderBy(asc(stamps.code));
}

async function toDtos(rows: StampRequest[]): Promise<StampRequestDto[]> {
  const [items, planRows] = await Promise.all([
    itemsOf(rows.map((r) => r.id)),
    rows.some((r) => r.planId)
      ? db
          .select({ id: plans.id, name: plans.name })
          .from(plans)
          .where(inArray(plans.id, rows.flatMap((r) => (r.planId ? [r.planId] : []))))
      : [],
  ]);
  const planName = new Map(planRows.map((p) => [p.id, p.name]));
  return rows.map((r) => ({
    id: r.id,
    plan: r.planId && planName.has(r.planId) ? { id: r.planId, name: planName.get(r.planId)! } : null,
    requesterName: r.requesterName,
    requesterEmail: r.requesterEmail,
    forWhom: r.forWhom,
    workstation: r.workstation,
    fromOn: r.fromOn,
    untilOn: r.untilOn,
    note: r.note,
    state: r.state,
    stamps: items.filter((i) => i.requestId === r.id).map((i) => ({ code: i.code, name: i.name, location: toLocationRef(i.location), out: i.checkoutId !== null })),
    answeredByName: r.answeredByName,
    answeredAt: r.answeredAt?.toISOString() ?? null,
    declineReason: r.declineReason,
    checkoutProblem: r.checkoutProblem,
    version: r.version,
    createdAt: r.createdAt.toISOString(),
  }));
}

async function mailFacts(r: StampRequest): Promise<RequestMailFacts> {
  const [dto] = await toDtos([r]);
  return { id: r.id, requesterId: r.requestedBy, requesterName: r.requesterName, requesterEmail: r.requesterEmail, forWhom: r.forWhom, workstation: r.workstation, codes: dto.stamps.map((s) => s.code), fromOn: r.fromOn, untilOn: r.untilOn, plan: dto.plan, note: r.note };
}

/** Asks the keepers for stamps (any role may). The days must not lie in the past; every code must be a library stamp. */
export async function createStampRequest(actor: Actor, input: CreateStampRequestInput, from: { runStageId?: string } = {}): Promise<StampRequestDto> {
  assertCan(actor, "stamps:request");
  const today = await workshopToday();
  if (input.fromOn < today) throw new AppError("unprocessable", {}, { fromOn: [{ key: "validation.dateInPast", values: { today } }] });
  const codes = [...new Set(input.stampCodes)];
  const found = await db.select({ id: stamps.id, code: stamps.code }).from(stamps).where(inArray(stamps.code, codes));
  const unknown = codes.filter((c) => !found.some((f) => f.code === c));
  if (unknown.length) throw new AppError("unprocessable", {}, { stampCodes: [{ key: "validation.stampsUnknown", values: { codes: unknown.join(", ") } }] });
  if (input.planId) {
    const [plan] = await db.select({ id: plans.id }).from(plans).where(eq(plans.id, input.planId));
    if (!plan) throw new AppError("unprocessable", {}, { planId: ["validation.planUnknown"] });
  }
  const row = await db.transaction(async (tx) => {
    const [request] = await tx
      .insert(stampRequests)
      .values({
        planId: input.planId ?? null,
        runStageId: from.runStageId ?? null,
        requestedBy: actor.id,
        requesterName: actor.name,
        requesterEmail: actor.email,
        forWhom: input.forWhom,
        workstation: input.workstation,
        fromOn: input.fromOn,
        untilOn: input.untilOn,
        note: input.note ?? null,
      })
      .returning();
    await tx.insert(stampRequestItems).values(found.map((s) => ({ requestId: request.id, stampId: s.id })));
    return request;
  });
  await mailKeepersAboutRequest(await mailFacts(row));
  return (await toDtos([row]))[0];
}

/** Requests, newest first; `pending` = open or accepted and not yet out. Keepers looking catch up on first days. */
export async function listStampRequests(actor: Actor, query: StampRequestListQuery = {}): Promise<StampRequestDto[]> {
  assertCan(actor, "data:read");
  const state =
    query.state === "pending" ? inArray(stampRequests.state, ["open", "accepted"]) : query.state ? eq(stampRequests.state, query.state) : undefined;
  const rows = await db
    .select()
    .from(stampRequests)
    .where(and(state, query.plan ? eq(stampRequests.planId, query.plan) : undefined))
    .orderBy(sql`(${stampRequests.state} = 'open') DESC`, asc(stampRequests.fromOn), desc(stampRequests.createdAt))
    .limit(300);
  return toDtos(rows);
}

export async function getStampRequest(actor: Actor, id: string): Promise<StampRequestDto> {
  assertCan(actor, "data:read");
  return (await toDtos([await findRequest(db, id)]))[0];
}

/** Other accepted requests, not yet out, that promise one of these stamps on one of these days. */
async function reservedElsewhere(tx: Transaction, r: StampRequest, stampIds: string[]): Promise<string[]> {
  const rows = await tx
    .selectDistinct({ code: stamps.code })
    .from(stampRequestItems)
    .innerJoin(stampRequests, eq(stampRequests.id, stampRequestItems.requestId))
    .innerJoin(stamps, eq(stamps.id, stampRequestItems.stampId))
    .where(
      and(
        ne(stampRequests.id, r.id),
        eq(stampRequests.state, "accepted"),
        inArray(stampRequestItems.stampId, stampIds),
        lte(stampRequests.fromOn, r.untilOn),
        gte(stampRequests.untilOn, r.fromOn),
      ),
    )
    .orderBy(stamps.code);
  return rows.map((s) => s.code);
}

/**
 * Checks out every stamp of a request to its requester, in the caller's transaction: the stamp rows are locked in
 * one order (so two keepers cannot interleave), and if any stamp is out or not fit for work nothing is checked out.
 */
async function checkOutAll(tx: Transaction, r: StampRequest, keeper: { id: string | null; name: string }): Promise<void> {
  const items = await tx.select({ stampId: stampRequestItems.stampId }).from(stampRequestItems).where(eq(stampRequestItems.requestId, r.id));
  const ids = items.map((i) => i.stampId).sort();
  const locked = ids.length ? await tx.select().from(stamps).where(inArray(stamps.id, ids)).orderBy(asc(stamps.id)).for("update") : [];
  const open = ids.length ? await tx.select({ stampId: checkouts.stampId }).from(checkouts).where(and(inArray(checkouts.stampId, ids), isNull(checkouts.returnedAt))) : [];
  const unavailable = locked.filter((s) => !canBeCheckedOut(s.condition) || open.some((o) => o.stampId === s.id)).map((s) => s.code);
  if (unavailable.length) throw new AppError("requestStampsUnavailable", { stamps: unavailable.sort().join(", "), count: unavailable.length });
  const [requester] = r.requestedBy ? await tx.select({ name: users.name }).from(users).where(eq(users.id, r.requestedBy)) : [];
  const borrowerId = requester && requester.name.trim().toLowerCase() === r.forWhom.trim().toLowerCase() ? r.requestedBy : null;
  for (const stamp of locked) {
    const [checkout] = await tx
      .insert(checkouts)
      .values({ stampId: stamp.id, borrowerId, borrowerName: r.forWhom, borrowerEmail: r.requesterEmail, workstation: r.workstation, dueOn: r.untilOn, note: r.note, checkedOutBy: keeper.id })
      .returning({ id: checkouts.id });
    await tx.update(stampRequestItems).set({ checkoutId: checkout.id }).where(and(eq(stampRequestItems.requestId, r.id), eq(stampRequestItems.stampId, stamp.id)));
    await recordEvent(tx, stamp.id, { id: keeper.id as string, name: keeper.name }, { kind: "checked_out", to: r.forWhom, note: r.note, details: { workstation: r.workstation, dueOn: r.untilOn, request: r.id } });
  }
}

/**
 * Accepts a request made from `version`. Starting today (or earlier): every stamp is checked out now, in one
 * transaction, or none (409 requestStampsUnavailable naming them). Starting later: accepted, and checked out on its
 * first day (checkOutDueRequests). Stamps promised to another accepted request on overlapping days are refused.
 */
export async function acceptStampRequest(actor: Actor, id: string, version: number): Promise<StampRequestDto> {
  assertCan(actor, "stamps:write");
  const today = await workshopToday();
  const row = await db.transaction(async (tx) => {
    const r = await findRequest(tx, id, true);
    if (r.version !== version) throw new AppError("versionConflict");
    if (r.state !== "open") throw new AppError("requestAnswered", { state: r.state });
    const items = await tx.select({ stampId: stampRequestItems.stampId }).from(stampRequestItems).where(eq(stampRequestItems.requestId, r.id));
    const reserved = await reservedElsewhere(tx, r, items.map((i) => i.stampId));
    if (reserved.length) throw new AppError("requestStampsReserved", { stamps: reserved.join(", "), count: reserved.length });
    const now = r.fromOn <= today;
    if (now) await checkOutAll(tx, r, actor);
    const [updated] = await tx
      .update(stampRequests)
      .set({
        state: now ? "checked_out" : "accepted",
        answeredBy: actor.id,
        answeredByName: actor.name,
        answeredAt: sql`now()`,
        checkedOutAt: now ? sql`now()` : null,
        version: sql`${stampRequests.version} + 1`,
        updatedAt: sql`now()`,
      })
      .where(eq(stampRequests.id, r.id))
      .returning();
    return updated;
  });
  await mailRequesterAnswer(await mailFacts(row), row.state === "checked_out" ? "checkedOut" : "accepted", actor.name, null);
  return (await toDtos([row]))[0];
}

/** Declines an open (or accepted, not yet out) request with a reason the requester reads. */
export async function declineStampRequest(actor: Actor, id: string, input: DeclineRequestInput): Promise<StampRequestDto> {
  assertCan(actor, "stamps:write");
  const row = await db.transaction(async (tx) => {
    const r = await findRequest(tx, id, true);
    if (r.version !== input.version) throw new AppError("versionConflict");
    if (r.state !== "open" && r.state !== "accepted") throw new AppError("requestAnswered", { state: r.state });
    const [updated] = await tx
      .update(stampRequests)
      .set({ state: "declined", declineReason: input.reason, answeredBy: actor.id, answeredByName: actor.name, answeredAt: sql`now()`, version: sql`${stampRequests.version} + 1`, updatedAt: sql`now()` })
      .where(eq(stampRequests.id, r.id))
      .returning();
    return updated;
  });
  await mailRequesterAnswer(await mailFacts(row), "declined", actor.name, input.reason);
  return (await toDtos([row]))[0];
}

/**
 * Checks out the accepted requests whose first day has come (a daily job, and whenever keepers open the queue).
 * Each request is its own transaction: all its stamps or none; one that cannot go out keeps `accepted` and says why
 * (`checkoutProblem`), so keepers see it in the queue. The keeper who accepted is named in the stamps' history.
 */
export async function checkOutDueRequests(today?: string): Promise<{ checkedOut: string[]; waiting: { id: string; problem: string }[] }> {
  const day = today ?? (await workshopToday());
  const due = await db
    .select({ id: stampRequests.id })
    .from(stampRequests)
    .where(and(eq(stampRequests.state, "accepted"), lte(stampRequests.fromOn, day)))
    .orderBy(asc(stampRequests.fromOn));
  const result = { checkedOut: [] as string[], waiting: [] as { id: string; problem: string }[] };
  for (const { id } of due) {
    try {
      const row = await db.transaction(async (tx) => {
        const r = await findRequest(tx, id, true);
        if (r.state !== "accepted" || r.fromOn > day) return null;
        await checkOutAll(tx, r, { id: r.answeredBy, name: r.answeredByName ?? r.requesterName });
        const [updated] = await tx
          .update(stampRequests)
          .set({ state: "checked_out", checkedOutAt: sql`now()`, checkoutProblem: null, version: sql`${stampRequests.version} + 1`, updatedAt: sql`now()` })
          .where(eq(stampRequests.id, r.id))
          .returning();
        return updated;
      });
      if (!row) continue;
      result.checkedOut.push(id);
      await mailRequesterAnswer(await mailFacts(row), "checkedOut", row.answeredByName ?? "", null);
    } catch (error) {
      if (!(error instanceof AppError && error.code === "requestStampsUnavailable")) throw error;
      const problem = String(error.params.stamps);
      await db.update(stampRequests).set({ checkoutProblem: problem, updatedAt: sql`now()` }).where(eq(stampRequests.id, id));
      result.waiting.push({ id, problem });
    }
  }
  return result;
}
