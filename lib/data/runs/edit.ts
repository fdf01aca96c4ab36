import "server-only";
import { and, asc, count, eq, inArray, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { motifColourways, motifColours, plans, runFindings, runPlans, runProgress, runReadings, runs, runStages, runStageStamps, stamps, type RunRow } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import type { RunDto } from "@/lib/contracts/runs";
import { AppError, type FieldMessage } from "@/lib/errors";
import { defaultStages, scheduleStages, stageNeed, type StageSpec } from "@/lib/runs";
import type { CreateRunInput, UpdateRunInput } from "@/lib/validation/runs";
import { estimateComponents } from "@/lib/wax";
import { currentSettings } from "../settings";
import { calibratedRateFor } from "../wax/calibration";
import { planForWax } from "../wax/plans";
import { loadMaterials, loadRecipes, toDomainMaterial } from "../wax/shared";
import { findRun, recordRunEvent, runDto, totalMetresOf } from "./shared";
import { audit } from "@/lib/log";

// Creating, editing and deleting runs. Each change runs in one transaction with its history row; an edit from an
// old version → 409 versionConflict. A stage's estimates (wax from the wax room's estimator at the calibrated
// rate for its recipe and the run's cloth, else the default; impressions and stamper hours from its plan) are
// computed whenever the run or the stage is saved and kept with the stage.

type StageWithId = StageSpec & { id?: string };

async function defaultStagesFor(tx: Transaction, motifId: string, colourwayId: string, planId: string | null, recipeId: string | null): Promise<StageWithId[]> {
  const [colourway] = await tx.select({ id: motifColourways.id }).from(motifColourways).where(and(eq(motifColourways.id, colourwayId), eq(motifColourways.motifId, motifId))).limit(1);
  if (!colourway) throw new AppError("unprocessable", {}, { colourwayId: ["runs.colourwayUnknown"] });
  const colours = await tx.select().from(motifColours).where(eq(motifColours.colourwayId, colourwayId)).orderBy(asc(motifColours.position));
  const stampIds = [...new Set(colours.flatMap((c) => c.waxStampIds))];
  const codes = new Map(stampIds.length ? (await tx.select({ id: stamps.id, code: stamps.code }).from(stamps).where(inArray(stamps.id, stampIds))).map((s) => [s.id, s.code]) : []);
  return defaultStages(
    colours.map((c) => ({ position: c.position, name: c.name, swatch: c.swatch, face: c.face, bleach: c.bleach, waxStamps: c.waxStampIds.flatMap((id) => (codes.has(id) ? [codes.get(id)!] : [])) })),
  ).map((s) => ({ ...s, planId: s.kind === "wax" ? planId : null, recipeId: s.kind === "wax" ? recipeId : null, passes: 1 }));
}

interface StageEstimate {
  estimate: Record<string, unknown> | null;
  kgEstimated: number;
  impressionsEstimated: number;
  hoursEstimated: number;
}

const noEstimate: StageEstimate = { estimate: null, kgEstimated: 0, impressionsEstimated: 0, hoursEstimated: 0 };

/** The wax, impressions and stamper hours a stamped waxing stage needs; nothing for other stages or one still without plan or recipe. */
async function estimateStage(tx: Transaction, actor: Actor, run: Pick<RunRow, "cloth" | "metres" | "pieces" | "pieceLengthMm">, stage: StageWithId, field: string): Promise<StageEstimate> {
  if (stage.kind !== "wax" || stage.waxMethod !== "stamp" || !stage.planId || !stage.recipeId) return noEstimate;
  const plan = await planForWax(actor, stage.planId);
  if (!plan) throw new AppError("unprocessable", {}, { [`${field}.planId`]: ["runs.planUnknown"] });
  const [recipe] = await loadRecipes(tx, [stage.recipeId]);
  if (!recipe) throw new AppError("unprocessable", {}, { [`${field}.recipeId`]: ["runs.recipeUnknown"] });
  const [{ settings }, materials, calibrated] = await Promise.all([currentSettings(), loadMaterials(tx), calibratedRateFor(tx, stage.recipeId, run.cloth)]);
  const rateGPerM2 = calibrated ? calibrated.rateGPerM2 : settings.waxRateGPerM2;
  const metres = totalMetresOf(run);
  const need = stageNeed({
    plan,
    metres,
    pieces: run.pieces ?? Math.max(1, Math.round(metres)),
    passes: stage.passes ?? 1,
    rateGPerM2,
    lossPct: settings.waxLossPct,
    components: estimateComponents(
      recipe.components.map((c) => ({ material: c.materialId, pct: c.pct })),
      materials.map(toDomainMaterial),
    ),
    impressionsPerHour: settings.impressionsPerHour,
  });
  return {
    estimate: { gramsPerMetre: need.gramsPerMetre, rateGPerM2, rateBasis: calibrated ? calibrated.basis : "default", lossPct: settings.waxLossPct, byMaterial: need.byMaterial, metres },
    kgEstimated: need.kgEstimated,
    impressionsEstimated: need.impressions,
    hoursEstimated: need.hours,
  };
}

async function stampIdsOf(tx: Transaction, stages: readonly StageWithId[]): Promise<Map<string, string>> {
  const codes = [...new Set(stages.flatMap((s) => (s.stamps ?? []).map((x) => x.code.toUpperCase())))];
  const rows = codes.length ? await tx.select({ id: stamps.id, code: stamps.code }).from(stamps).where(inArray(stamps.code, codes)) : [];
  const byCode = new Map(rows.map((r) => [r.code, r.id]));
  const fields: Record<string, FieldMessage[]> = {};
  stages.forEach((s, i) =>
    (s.stamps ?? []).forEach((x, j) => {
      if (!byCode.has(x.code.toUpperCase())) fields[`stages.${i}.stamps.${j}.code`] = [{ key: "runs.stampUnknown", values: { code: x.code } }];
    }),
  );
  if (Object.keys(fields).length) throw new AppError("unprocessable", {}, fields);
  return byCode;
}

/** Stages that have records (progress, readings, findings) cannot be dropped or change kind. */
async function stagesWithRecords(tx: Transaction, stageIds: string[]): Promise<Set<string>> {
  if (!stageIds.length) return new Set();
  const [p, r, f] = await Promise.all([
    tx.selectDistinct({ id: runProgress.stageId }).from(runProgress).where(inArray(runProgress.stageId, stageIds)),
    tx.selectDistinct({ id: runReadings.stageId }).from(runReadings).where(inArray(runReadings.stageId, stageIds)),
    tx.selectDistinct({ id: runFindings.stageId }).from(runFindings).where(inArray(runFindings.stageId, stageIds)),
  ]);
  return new Set([...p, ...r, ...f].flatMap((x) => (x.id ? [x.id] : [])));
}

/** Writes the run's stage list (kept stages by id, new ones inserted, unlisted ones without records deleted). */
async function writeStages(tx: Transaction, actor: Actor, run: RunRow, specs: readonly StageWithId[], startOn?: string) {
  const existing = await tx.select().from(runStages).where(eq(runStages.runId, run.id));
  const byId = new Map(existing.map((s) => [s.id, s]));
  const recorded = await stagesWithRecords(tx, existing.map((s) => s.id));
  const fields: Record<string, FieldMessage[]> = {};
  specs.forEach((s, i) => {
    if (s.id && !byId.has(s.id)) fields[`stages.${i}.id`] = ["runs.stageUnknown"];
    else if (s.id && recorded.has(s.id) && byId.get(s.id)!.kind !== s.kind) fields[`stages.${i}.kind`] = ["runs.stageHasRecords"];
  });
  if (Object.keys(fields).length) throw new AppError("unprocessable", {}, fields);
  const kept = new Set(specs.flatMap((s) => (s.id ? [s.id] : [])));
  const dropped = existing.filter((s) => !kept.has(s.id));
  const droppedWithRecords = dropped.filter((s) => recorded.has(s.id));
  if (droppedWithRecords.length) throw new AppError("runStageHasRecords", { stages: droppedWithRecords.map((s) => s.position + 1).join(", ") });
  if (dropped.length) await tx.delete(runStages).where(inArray(runStages.id, dropped.map((s) => s.id)));
  // Move kept stages out of the way first, so the new order never meets the unique (run, position) index halfway.
  if (kept.size) await tx.update(runStages).set({ position: sql`${runStages.position} + 10000` }).where(inArray(runStages.id, [...kept]));

  const stampIds = await stampIdsOf(tx, specs);
  const estimates: StageEstimate[] = [];
  for (const [i, s] of specs.entries()) estimates.push(await estimateStage(tx, actor, run, s, `stages.${i}`));
  // A new run's unplanned stages get days one after the other from its start, by their estimated hours.
  const scheduled = startOn ? scheduleStages(specs.map((s, i) => ({ kind: s.kind, hours: estimates[i].hoursEstimated })), startOn) : null;
  for (const [i, s] of specs.entries()) {
    const est = estimates[i];
    const values = {
      runId: run.id,
      position: i,
      kind: s.kind,
      colourPosition: s.colourPosition ?? null,
      colourName: s.colourName ?? null,
      swatch: s.swatch ?? null,
      plannedStartOn: s.plannedStartOn ?? (s.plannedEndOn ? null : (scheduled?.[i].plannedStartOn ?? null)),
      plannedEndOn: s.plannedEndOn ?? (s.plannedStartOn ? null : (scheduled?.[i].plannedEndOn ?? null)),
      waxMethod: s.kind === "wax" ? (s.waxMethod ?? "stamp") : null,
      planId: s.kind === "wax" ? (s.planId ?? null) : null,
      recipeId: s.kind === "wax" ? (s.recipeId ?? null) : null,
      faces: s.kind === "wax" ? (s.faces ?? "front") : null,
      passes: s.passes ?? 1,
      dyeMethod: s.kind === "dye" ? (s.dyeMethod ?? "bath") : null,
      notes: s.notes ?? null,
      ...est,
    };
    let stageId = s.id;
    if (stageId) await tx.update(runStages).set(values).where(eq(runStages.id, stageId));
    else [{ id: stageId }] = await tx.insert(runStages).values(values).returning({ id: runStages.id });
    await tx.delete(runStageStamps).where(eq(runStageStamps.stageId, stageId!));
    const stageStamps = new Map((s.stamps ?? []).map((x) => [stampIds.get(x.code.toUpperCase())!, x.face]));
    if (s.kind === "wax" && stageStamps.size) await tx.insert(runStageStamps).values([...stageStamps].map(([stampId, face]) => ({ stageId: stageId!, stampId, face })));
  }
}

async function checkPlans(tx: Transaction, planIds: readonly string[]) {
  if (!planIds.length) return;
  const found = await tx.select({ id: plans.id }).from(plans).where(inArray(plans.id, [...planIds]));
  const ids = new Set(found.map((p) => p.id));
  const missing = planIds.findIndex((id) => !ids.has(id));
  if (missing >= 0) throw new AppError("unprocessable", {}, { [`planIds.${missing}`]: ["runs.planUnknown"] });
}

async function writePlans(tx: Transaction, runId: string, planIds: readonly string[]) {
  await tx.delete(runPlans).where(eq(runPlans.runId, runId));
  const unique = [...new Set(planIds)];
  if (unique.length) await tx.insert(runPlans).values(unique.map((planId, position) => ({ runId, planId, position })));
}

/** A new run (runs:write): its stages as given, else the colourway's defaults waxing with the first plan and the recipe. */
export async function createRun(actor: Actor, input: CreateRunInput): Promise<RunDto> {
  assertCan(actor, "runs:write");
  const id = await db.transaction(async (tx) => {
    const [colourway] = await tx.select({ id: motifColourways.id }).from(motifColourways).where(and(eq(motifColourways.id, input.colourwayId), eq(motifColourways.motifId, input.motifId))).limit(1);
    if (!colourway) throw new AppError("unprocessable", {}, { colourwayId: ["runs.colourwayUnknown"] });
    const planIds = input.planIds ?? [];
    await checkPlans(tx, planIds);
    if (input.recipeId && !(await loadRecipes(tx, [input.recipeId])).length) throw new AppError("unprocessable", {}, { recipeId: ["runs.recipeUnknown"] });
    const [run] = await tx
      .insert(runs)
      .values({
        name: input.name,
        motifId: input.motifId,
        colourwayId: input.colourwayId,
        cloth: input.cloth,
        metres: input.metres ?? null,
        pieces: input.pieces ?? null,
        pieceLengthMm: input.pieceLengthMm ?? null,
        dueOn: input.dueOn ?? null,
        notes: input.notes ?? null,
        createdBy: actor.id,
        createdByName: actor.name,
        updatedBy: actor.id,
        updatedByName: actor.name,
      })
      .returning();
    await writePlans(tx, run.id, planIds);
    const stages = input.stages ?? (await defaultStagesFor(tx, input.motifId, input.colourwayId, planIds[0] ?? null, input.recipeId ?? null));
    await writeStages(tx, actor, run, stages, input.startOn ?? undefined);
    await recordRunEvent(tx, run.id, actor, "created", 1);
    return run.id;
  });
  return runDto(db, id);
}

const editable = ["name", "cloth", "metres", "pieces", "pieceLengthMm", "dueOn", "state", "stateNote", "notes"] as const;

/** Changes the fields named from `version`; a change that changes nothing keeps the version. */
export async function updateRun(actor: Actor, id: string, input: UpdateRunInput): Promise<RunDto> {
  assertCan(actor, "runs:write");
  await db.transaction(async (tx) => {
    const run = await findRun(tx, id, true);
    if (run.version !== input.version) throw new AppError("versionConflict");
    const patch: Partial<RunRow> = {};
    const changes: { field: string; from: unknown; to: unknown }[] = [];
    const sizeGiven = input.metres !== undefined || input.pieces !== undefined || input.pieceLengthMm !== undefined;
    for (const field of editable) {
      let value = input[field];
      if (value === undefined && sizeGiven && (field === "metres" || field === "pieces" || field === "pieceLengthMm")) value = null;
      if (value === undefined || value === run[field]) continue;
      (patch as Record<string, unknown>)[field] = value;
      changes.push({ field, from: run[field], to: value });
    }
    if (input.planIds) {
      await checkPlans(tx, input.planIds);
      const before = (await tx.select({ planId: runPlans.planId }).from(runPlans).where(eq(runPlans.runId, id)).orderBy(asc(runPlans.position))).map((p) => p.planId);
      if (before.join() !== input.planIds.join()) {
        await writePlans(tx, id, input.planIds);
        changes.push({ field: "planIds", from: before, to: input.planIds });
      }
    }
    const next = { ...run, ...patch };
    if (input.stages) {
      await writeStages(tx, actor, next, input.stages);
      changes.push({ field: "stages", from: null, to: input.stages.length });
    } else if (sizeGiven || patch.cloth !== undefined) {
      // The size or the cloth changed: every stage's estimate follows.
      const stages = await tx.select().from(runStages).where(eq(runStages.runId, id)).orderBy(asc(runStages.position));
      const stageStamps = await tx.select({ stageId: runStageStamps.stageId, code: stamps.code, face: runStageStamps.face }).from(runStageStamps).innerJoin(stamps, eq(stamps.id, runStageStamps.stampId));
      await writeStages(
        tx,
        actor,
        next,
        stages.map((s) => ({ ...s, stamps: stageStamps.filter((x) => x.stageId === s.id).map((x) => ({ code: x.code, face: x.face })) }) as StageWithId),
      );
    }
    if (!changes.length) return;
    const version = run.version + 1;
    await tx.update(runs).set({ ...patch, version, updatedBy: actor.id, updatedByName: actor.name, updatedAt: new Date() }).where(eq(runs.id, id));
    await recordRunEvent(tx, id, actor, patch.state ? "state" : "edited", version, changes);
  });
  return runDto(db, id);
}

/**
 * Deletes a run that has no records yet. One whose stages hold recorded work (wax uses point at them, and the
 * calibration, stock and impressions came from them) is refused with 409 runHasRecords: halt it instead.
 */
export async function deleteRun(actor: Actor, id: string, version?: number): Promise<void> {
  assertCan(actor, "runs:write");
  await db.transaction(async (tx) => {
    const run = await findRun(tx, id, true);
    if (version !== undefined && run.version !== version) throw new AppError("versionConflict");
    const stageIds = (await tx.select({ id: runStages.id }).from(runStages).where(eq(runStages.runId, id))).map((s) => s.id);
    const [{ n: progressCount }] = stageIds.length ? await tx.select({ n: count() }).from(runProgress).where(inArray(runProgress.stageId, stageIds)) : [{ n: 0 }];
    const [{ n: findingCount }] = await tx.select({ n: count() }).from(runFindings).where(eq(runFindings.runId, id));
    if (progressCount + findingCount > 0) throw new AppError("runHasRecords", { progress: progressCount, findings: findingCount });
    await tx.delete(runs).where(eq(runs.id, id));
  });
  audit("record.deleted", actor, { kind: "run", id });
}
