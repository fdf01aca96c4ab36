import "server-only";
import { asc, count, eq, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { planStamps, plans, runPlans, runs, runStages, waxEstimates, waxUses, type Plan } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { pickLocale } from "@/lib/i18n/config";
import { translator } from "@/lib/i18n/translator";
import type { PlanDto } from "@/lib/contracts/plans";
import type { BorderRequest } from "@/lib/validation/layout";
import type { CreatePlanInput, PlanLayout, UpdatePlanInput } from "@/lib/validation/plans";
import { computePlan, type ComputedPlan } from "./compute";
import { planDto, withCurrentCodes } from "./record";
import { findPlan, recordPlanEvent } from "./shared";
import { audit } from "@/lib/log";

// Saving, changing, copying, recomputing and deleting plans. Every change runs in one transaction with its
// history entry; a change made from an older version is refused (409 versionConflict), never saved over.

/** The columns a computed plan sets: its summary, the figures copied out for the table, geometry and stamp. */
function computedColumns(layout: PlanLayout, borders: BorderRequest[], computed: ComputedPlan) {
  return {
    layout: layout as unknown as Record<string, unknown>,
    borders: borders as unknown as Record<string, unknown>[],
    arrangement: layout.arrangement,
    clothWidthMm: layout.cloth.widthMm,
    sides: layout.sides,
    summary: computed.summary as unknown as Record<string, unknown>,
    impressionsPerMetre: computed.summary.impressionsPerMetre,
    waxedAreaPerMetreM2: computed.summary.waxedAreaPerMetreM2,
    stampGeometry: computed.geometry as unknown as Record<string, unknown>[],
    geometryFingerprint: computed.fingerprint,
    stampId: computed.stampIds.find((s) => s.role === "field")?.stampId ?? null,
    computedAt: new Date(),
  };
}

/** Codes are kept upper case, as the shelf keeps them. */
function normalised(layout: PlanLayout, borders: BorderRequest[]): { layout: PlanLayout; borders: BorderRequest[] } {
  const up = <T extends { stamp: object }>(x: T): T => ("code" in x.stamp ? { ...x, stamp: { code: (x.stamp as { code: string }).code.trim().toUpperCase() } } : x);
  return { layout: up(layout), borders: borders.map(up) };
}

async function setPlanStamps(tx: Transaction, planId: string, computed: ComputedPlan) {
  await tx.delete(planStamps).where(eq(planStamps.planId, planId));
  if (computed.stampIds.length) await tx.insert(planStamps).values(computed.stampIds.map((s) => ({ planId, stampId: s.stampId, role: s.role })));
}

const keyFigures = (summary: ComputedPlan["summary"] | Record<string, unknown>) => {
  const s = summary as { impressionsPerMetre: number; waxedAreaPerMetreM2: number; impressionsTotal: number };
  return { impressionsPerMetre: s.impressionsPerMetre, waxedAreaPerMetreM2: s.waxedAreaPerMetreM2, impressionsTotal: s.impressionsTotal };
};

/** Saves a new plan with the engine's summary of it (refusals name the input's fields). */
export async function createPlan(actor: Actor, input: CreatePlanInput, copyOf?: Pick<Plan, "id" | "name">): Promise<PlanDto> {
  assertCan(actor, "plans:write");
  const { layout, borders } = normalised(input.layout, input.borders ?? []);
  const computed = await computePlan(layout, borders);
  const plan = await db.transaction(async (tx) => {
    const [row] = await tx
      .insert(plans)
      .values({
        name: input.name,
        notes: input.notes ?? null,
        motifId: input.motifId ?? null,
        ...computedColumns(layout, borders, computed),
        createdBy: actor.id,
        createdByName: actor.name,
        updatedBy: actor.id,
        updatedByName: actor.name,
      })
      .returning();
    await setPlanStamps(tx, row.id, computed);
    const from = copyOf ? { from: { id: copyOf.id, name: copyOf.name } } : {};
    await recordPlanEvent(tx, row.id, actor, copyOf ? "duplicated" : "created", row.version, { ...from, figures: keyFigures(computed.summary) });
    return row;
  });
  return planDto(plan);
}

/** The same value, whatever the order of object keys (jsonb keeps its own order). */
const canonical = (v: unknown): unknown =>
  Array.isArray(v) ? v.map(canonical) : v && typeof v === "object" ? Object.fromEntries(Object.keys(v).sort().map((k) => [k, canonical((v as Record<string, unknown>)[k])])) : v;
const same = (a: unknown, b: unknown) => JSON.stringify(canonical(a ?? null)) === JSON.stringify(canonical(b ?? null));

/**
 * Applies a change made from `input.version`: name, notes, motif, and the layout or borders (which computes the
 * summary again from the stamps as they are now). A change that changes nothing keeps the version.
 */
export async function updatePlan(actor: Actor, id: string, input: UpdatePlanInput): Promise<PlanDto> {
  assertCan(actor, "plans:write");
  const before = await findPlan(db, id);
  const current = withCurrentCodes(before, await roleCodes(id));
  const inputs = normalised(input.layout ?? current.layout, input.borders ?? current.borders);
  const inputsChanged = (input.layout !== undefined && !same(inputs.layout, current.layout)) || (input.borders !== undefined && !same(inputs.borders, current.borders));
  // The engine runs before the transaction: its refusals cost no lock, and it reads only the stamps.
  const computed = inputsChanged ? await computePlan(inputs.layout, inputs.borders) : null;
  const plan = await db.transaction(async (tx) => {
    const row = await findPlan(tx, id, true);
    if (row.version !== input.version) throw new AppError("versionConflict");
    const changes: { field: string; from?: unknown; to?: unknown }[] = [];
    const set: Partial<typeof plans.$inferInsert> = {};
    for (const field of ["name", "notes", "motifId"] as const) {
      if (input[field] === undefined || same(row[field], input[field])) continue;
      changes.push({ field, from: row[field] ?? null, to: input[field] ?? null });
      (set as Record<string, unknown>)[field] = input[field];
    }
    if (computed) {
      if (input.layout !== undefined && !same(inputs.layout, current.layout)) changes.push({ field: "layout" });
      if (input.borders !== undefined && !same(inputs.borders, current.borders)) changes.push({ field: "borders" });
      Object.assign(set, computedColumns(inputs.layout, inputs.borders, computed));
      await setPlanStamps(tx, id, computed);
    }
    if (changes.length === 0) return row;
    const [updated] = await tx
      .update(plans)
      .set({ ...set, version: sql`${plans.version} + 1`, updatedAt: sql`now()`, updatedBy: actor.id, updatedByName: actor.name })
      .where(eq(plans.id, id))
      .returning();
    const renamedOnly = changes.every((c) => c.field === "name");
    await recordPlanEvent(tx, id, actor, renamedOnly ? "renamed" : "edited", updated.version, {
      changes,
      ...(computed ? { figures: { before: keyFigures(row.summary), after: keyFigures(computed.summary) } } : {}),
    });
    return updated;
  });
  return planDto(plan);
}

async function roleCodes(planId: string): Promise<Map<string, string>> {
  const rows = await db.execute<{ role: string; code: string }>(sql`SELECT ps.role, s.code FROM plan_stamps ps JOIN stamps s ON s.id = ps.stamp_id WHERE ps.plan_id = ${planId}`);
  return new Map([...rows].map((r) => [r.role, r.code]));
}

/** Computes the summary again from the saved inputs and the stamps as they are now (clears `stale`). */
export async function recomputePlan(actor: Actor, id: string, version: number): Promise<PlanDto> {
  assertCan(actor, "plans:write");
  const before = await findPlan(db, id);
  const { layout, borders } = withCurrentCodes(before, await roleCodes(id));
  const computed = await computePlan(layout, borders);
  const plan = await db.transaction(async (tx) => {
    const row = await findPlan(tx, id, true);
    if (row.version !== version) throw new AppError("versionConflict");
    const [updated] = await tx
      .update(plans)
      .set({ ...computedColumns(layout, borders, computed), version: sql`${plans.version} + 1`, updatedAt: sql`now()`, updatedBy: actor.id, updatedByName: actor.name })
      .where(eq(plans.id, id))
      .returning();
    await setPlanStamps(tx, id, computed);
    await recordPlanEvent(tx, id, actor, "recomputed", updated.version, { figures: { before: keyFigures(row.summary), after: keyFigures(computed.summary) } });
    return updated;
  });
  return planDto(plan);
}

/** A copy of a plan under a new name (default: "Copy of …" in the actor's language), computed afresh. */
export async function duplicatePlan(actor: Actor, id: string, name?: string): Promise<PlanDto> {
  assertCan(actor, "plans:write");
  const source: Plan = await findPlan(db, id);
  const { layout, borders } = withCurrentCodes(source, await roleCodes(id));
  const copyName = name ?? translator(pickLocale(actor.locale))("plans.copyName", { name: source.name }).slice(0, 120);
  return createPlan(actor, { name: copyName, notes: source.notes, motifId: source.motifId, layout, borders }, source);
}

/** Deletes a plan made from `version` (409 versionConflict otherwise); its requests keep their stamps, without the plan. */
export async function deletePlan(actor: Actor, id: string, version: number): Promise<void> {
  assertCan(actor, "plans:write");
  await db.transaction(async (tx) => {
    const row = await findPlan(tx, id, true);
    if (row.version !== version) throw new AppError("versionConflict");
    await refuseIfInWaxRecords(tx, id);
    await refuseIfInRuns(tx, id);
    await tx.delete(plans).where(eq(plans.id, id));
  });
  audit("record.deleted", actor, { kind: "plan", id });
}

/** Refuses (409 planInRuns, naming them) to delete a plan that production runs stamp; the foreign keys back this up. */
async function refuseIfInRuns(tx: Transaction, planId: string) {
  const named = await tx
    .selectDistinct({ id: runs.id, name: runs.name })
    .from(runs)
    .leftJoin(runPlans, eq(runPlans.runId, runs.id))
    .leftJoin(runStages, eq(runStages.runId, runs.id))
    .where(sql`${runPlans.planId} = ${planId} OR ${runStages.planId} = ${planId}`)
    .orderBy(asc(runs.name));
  if (named.length === 0) return;
  const names = named.slice(0, 5).map((r) => `“${r.name}”`);
  if (named.length > 5) names.push("…");
  throw new AppError("planInRuns", { count: named.length, names: names.join(", ") }, undefined, { runs: named });
}

/**
 * Refuses (409 planInWaxRecords, naming them) to delete a plan that saved wax estimates or recorded wax uses name:
 * estimates can be deleted first, a waxing that happened stays on record with its plan. The foreign keys back this up.
 */
async function refuseIfInWaxRecords(tx: Transaction, planId: string) {
  const [estimates, [{ uses }]] = await Promise.all([
    tx.select({ id: waxEstimates.id, name: waxEstimates.name }).from(waxEstimates).where(eq(waxEstimates.planId, planId)).orderBy(asc(waxEstimates.name)),
    tx.select({ uses: count() }).from(waxUses).where(eq(waxUses.planId, planId)),
  ]);
  if (estimates.length === 0 && uses === 0) return;
  const names = estimates.slice(0, 5).map((e) => `“${e.name}”`);
  if (estimates.length > 5) names.push("…");
  throw new AppError("planInWaxRecords", { estimates: estimates.length, uses, names: names.join(", ") || "–" }, undefined, { estimates, uses });
}
