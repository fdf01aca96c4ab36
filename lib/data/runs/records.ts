import "server-only";
import { and, eq, inArray, isNull, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { runFindings, runProgress, runReadings, runs, runStages, runStageStamps, stamps, waxRecipes, waxStockMovements, waxUses, type RunRow, type RunStageRow } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import type { FlaggedStampDto, RunDto, RunFindingDto, RunReadingDto } from "@/lib/contracts/runs";
import { AppError, type FieldMessage } from "@/lib/errors";
import { currentStage, measuredRecoveryOf, progressGrams, progressIssuesForKind, readingWarnings } from "@/lib/runs";
import type { RecordFindingInput, RecordProgressInput, RecordReadingInput } from "@/lib/validation/runs";
import { impressionsOfWaxing } from "@/lib/wax";
import type { ImpressionsToAdd } from "../stamps/impressions";
import { planForWax } from "../wax/plans";
import { writeWaxUse } from "../wax/uses";
import { findRun, flaggedNow, recordRunEvent, runDto, toFindingDto } from "./shared";

// What happens at the stages: progress (a waxing writes the wax room's wax use — the same record the calibration
// fits, with its stock movements and impressions — in the same transaction), pot readings with their cautions,
// the boil-off's recovered wax back into stock, and quality findings with the flag rule for stamps.

async function stageOf(tx: Transaction, runId: string, stageId: string, lock: boolean): Promise<{ run: RunRow; stage: RunStageRow }> {
  const run = await findRun(tx, runId, lock);
  const [stage] = await tx.select().from(runStages).where(and(eq(runStages.id, stageId), eq(runStages.runId, runId))).limit(1);
  if (!stage) throw new AppError("notFound");
  return { run, stage };
}

/** Who records what: waxing and the boil-off are the wax masters'; dye and bleach progress the planners'. */
const progressPermission = (stage: RunStageRow) => (stage.kind === "wax" || stage.kind === "boil_off" ? "runs:recordWaxing" : "runs:write");

const fieldsOf = (issues: { field: string; code: string }[]): Record<string, FieldMessage[]> => Object.fromEntries(issues.map((i) => [i.field, [i.code]]));

/** Moves the run on: setup → underway at the first record; complete when every stage is done. */
async function advanceRun(tx: Transaction, actor: Actor, run: RunRow) {
  const stages = await tx.select({ position: runStages.position, state: runStages.state }).from(runStages).where(eq(runStages.runId, run.id));
  const next = currentStage(stages) === null ? "complete" : run.state === "setup" ? "underway" : run.state;
  if (next === run.state || run.state === "halted") return;
  const version = run.version + 1;
  await tx.update(runs).set({ state: next, version, updatedAt: new Date(), updatedBy: actor.id, updatedByName: actor.name }).where(eq(runs.id, run.id));
  await recordRunEvent(tx, run.id, actor, "state", version, [{ field: "state", from: run.state, to: next }]);
}

/**
 * Records a day's work at a stage, in one transaction: the progress row, and for a waxing its wax use (wax out of
 * stock by the recipe's shares, the impressions onto the stamps — given per stamp, given for the stage's one
 * stamp, else counted from the plan like a wax use), for the boil-off the recovered wax back into stock as
 * "recovery" movements split like the run's wax went out. Any failure leaves none of it.
 */
export async function recordProgress(actor: Actor, runId: string, stageId: string, input: RecordProgressInput): Promise<RunDto> {
  await db.transaction(async (tx) => {
    const { run, stage } = await stageOf(tx, runId, stageId, true);
    assertCan(actor, progressPermission(stage));
    if (run.state === "complete" || run.state === "halted") throw new AppError("runClosed");
    const issues = progressIssuesForKind(stage.kind, input);
    if (issues.length) throw new AppError("unprocessable", {}, fieldsOf(issues));
    if (input.stampImpressions && stage.kind !== "wax") throw new AppError("unprocessable", {}, { stampImpressions: ["runs.onlyWaxing"] });

    let waxUseId: string | null = null;
    let impressions: number | null = input.impressions ?? null;
    const grams = progressGrams(input);
    if (stage.kind === "wax") {
      if (!stage.recipeId) throw new AppError("unprocessable", {}, { recipeId: ["runs.stageNeedsRecipe"] });
      const plan = stage.planId ? await planForWax(actor, stage.planId) : null;
      const area = plan?.waxedAreaPerMetreM2 ?? input.waxedAreaPerMetreM2;
      if (!area) throw new AppError("unprocessable", {}, { waxedAreaPerMetreM2: ["runs.screenNeedsArea"] });
      const stageStamps = await tx.select({ id: stamps.id, code: stamps.code }).from(runStageStamps).innerJoin(stamps, eq(stamps.id, runStageStamps.stampId)).where(eq(runStageStamps.stageId, stage.id));
      let additions: ImpressionsToAdd[] = [];
      if (input.stampImpressions?.length) {
        const byCode = new Map(stageStamps.map((s) => [s.code, s.id]));
        const fields: Record<string, FieldMessage[]> = {};
        input.stampImpressions.forEach((x, i) => {
          if (!byCode.has(x.code.toUpperCase())) fields[`stampImpressions.${i}.code`] = [{ key: "runs.stampUnknown", values: { code: x.code } }];
        });
        if (Object.keys(fields).length) throw new AppError("unprocessable", {}, fields);
        additions = input.stampImpressions.map((x) => ({ stampId: byCode.get(x.code.toUpperCase())!, impressions: x.impressions }));
        impressions = input.stampImpressions.reduce((a, x) => a + x.impressions, 0);
      } else if (input.impressions !== undefined) {
        if (stageStamps.length > 1) throw new AppError("unprocessable", {}, { impressions: ["runs.impressionsPerStamp"] });
        if (stageStamps.length === 1) additions = [{ stampId: stageStamps[0].id, impressions: input.impressions }];
      } else if (plan && plan.stampId) {
        const made = impressionsOfWaxing(plan, input.metres!, stage.passes);
        additions = made.total > 0 ? [{ stampId: plan.stampId, impressions: made.front, backFace: made.back }] : [];
        impressions = made.total;
      }
      waxUseId = await writeWaxUse(
        tx,
        actor,
        {
          usedOn: input.doneOn,
          planId: stage.planId,
          runStageId: stage.id,
          recipeId: stage.recipeId,
          cloth: run.cloth,
          waxedAreaPerMetreM2: area,
          metres: input.metres!,
          passes: stage.passes,
          gramsUsed: input.gramsUsed,
          potBeforeG: input.potBeforeG,
          potAfterG: input.potAfterG,
          potAddedG: input.potAddedG,
          note: input.note ?? null,
        },
        additions,
        { kind: "runStage", id: stage.id },
      );
    }
    if (stage.kind === "boil_off" && input.recoveredG && input.recoveredG > 0) {
      const out = await tx
        .select({ materialId: waxStockMovements.materialId, kg: sql<number>`sum(${waxStockMovements.kg})`.mapWith(Number) })
        .from(waxStockMovements)
        .innerJoin(waxUses, eq(waxUses.id, waxStockMovements.waxUseId))
        .innerJoin(runStages, eq(runStages.id, waxUses.runStageId))
        .where(and(eq(runStages.runId, run.id), eq(waxStockMovements.kind, "use"), isNull(waxUses.withdrawnAt)))
        .groupBy(waxStockMovements.materialId);
      const totalOut = out.reduce((a, m) => a - m.kg, 0);
      if (!(totalOut > 0)) throw new AppError("unprocessable", {}, { recoveredG: ["runs.nothingWaxed"] });
      await tx.insert(waxStockMovements).values(
        out.filter((m) => m.kg < 0).map((m) => ({ materialId: m.materialId, kind: "recovery" as const, kg: ((input.recoveredG! / 1000) * -m.kg) / totalOut, note: run.name, actorId: actor.id, actorName: actor.name })),
      );
    }
    await tx.insert(runProgress).values({
      stageId: stage.id,
      doneOn: input.doneOn,
      metres: input.metres ?? null,
      pieces: input.pieces ?? null,
      impressions,
      waxUseId,
      potBeforeG: input.potBeforeG ?? null,
      potAfterG: input.potAfterG ?? null,
      potAddedG: input.potAddedG ?? null,
      waxUsedG: stage.kind === "wax" ? grams : null,
      recoveredG: input.recoveredG ?? null,
      note: input.note ?? null,
      recordedBy: actor.id,
      recordedByName: actor.name,
    });
    await tx.update(runStages).set({ state: input.finished ? "done" : "underway" }).where(eq(runStages.id, stage.id));
    await recordRunEvent(tx, run.id, actor, "progress", run.version, [], { stageId: stage.id, waxUseId, grams, recoveredG: input.recoveredG ?? null, impressions });
    await advanceRun(tx, actor, run);
  });
  return runDto(db, runId);
}

/** A pot reading at a waxing or the boil-off (runs:recordWaxing), answered with the cautions it calls for. */
export async function recordReading(actor: Actor, runId: string, stageId: string, input: RecordReadingInput): Promise<RunReadingDto> {
  assertCan(actor, "runs:recordWaxing");
  return db.transaction(async (tx) => {
    const { run, stage } = await stageOf(tx, runId, stageId, false);
    if (stage.kind !== "wax" && stage.kind !== "boil_off") throw new AppError("unprocessable", {}, { tempC: ["runs.readingsOnlyHot"] });
    const [r] = await tx
      .insert(runReadings)
      .values({ stageId, tempC: input.tempC, at: input.at ? new Date(input.at) : new Date(), note: input.note ?? null, recordedBy: actor.id, recordedByName: actor.name })
      .returning();
    const [recipe] = stage.recipeId ? await tx.select({ minC: waxRecipes.workingMinC, maxC: waxRecipes.workingMaxC }).from(waxRecipes).where(eq(waxRecipes.id, stage.recipeId)) : [];
    const warnings = readingWarnings(r.tempC, recipe ?? null);
    await recordRunEvent(tx, run.id, actor, "reading", run.version, [], { stageId, tempC: r.tempC, warnings });
    return { id: r.id, stageId, at: r.at.toISOString(), tempC: r.tempC, warnings, note: r.note, recordedByName: r.recordedByName };
  });
}

/** A quality finding (runs:recordFindings); its stamp by code (422 when unknown), its stage of this run. */
export async function recordFinding(actor: Actor, runId: string, input: RecordFindingInput): Promise<{ finding: RunFindingDto; flagged: boolean }> {
  assertCan(actor, "runs:recordFindings");
  return db.transaction(async (tx) => {
    const run = await findRun(tx, runId);
    if (input.stageId) {
      const [stage] = await tx.select({ id: runStages.id }).from(runStages).where(and(eq(runStages.id, input.stageId), eq(runStages.runId, runId)));
      if (!stage) throw new AppError("unprocessable", {}, { stageId: ["runs.stageUnknown"] });
    }
    let stamp: { id: string; code: string } | null = null;
    if (input.stampCode) {
      [stamp] = await tx.select({ id: stamps.id, code: stamps.code }).from(stamps).where(eq(stamps.code, input.stampCode.toUpperCase())).limit(1);
      if (!stamp) throw new AppError("unprocessable", {}, { stampCode: [{ key: "runs.stampUnknown", values: { code: input.stampCode } }] });
    }
    const [f] = await tx
      .insert(runFindings)
      .values({
        runId,
        stageId: input.stageId ?? null,
        foundOn: input.foundOn,
        kind: input.kind,
        location: input.location || null,
        count: input.count,
        stampId: stamp?.id ?? null,
        stampCode: stamp?.code ?? null,
        photoKey: input.photoKey || null,
        repair: input.repair,
        repairNote: input.repairNote || null,
        recordedBy: actor.id,
        recordedByName: actor.name,
      })
      .returning();
    await recordRunEvent(tx, run.id, actor, "finding", run.version, [], { findingId: f.id, kind: f.kind, stampCode: f.stampCode });
    const flagged = stamp ? (await flaggedNow(tx)).some((x) => x.stampId === stamp!.id && x.kind === f.kind) : false;
    return { finding: toFindingDto(f), flagged };
  });
}

export async function listFindings(actor: Actor, runId: string): Promise<RunFindingDto[]> {
  assertCan(actor, "data:read");
  await findRun(db, runId);
  return (await db.select().from(runFindings).where(eq(runFindings.runId, runId)).orderBy(runFindings.foundOn)).map(toFindingDto);
}

/** Stamps the findings rule flags today, for the keepers. */
export async function listFlaggedStamps(actor: Actor): Promise<FlaggedStampDto[]> {
  assertCan(actor, "data:read");
  const flags = await flaggedNow(db);
  if (!flags.length) return [];
  const rows = await db.select({ id: stamps.id, code: stamps.code, name: stamps.name }).from(stamps).where(inArray(stamps.id, [...new Set(flags.map((f) => f.stampId))]));
  const byId = new Map(rows.map((r) => [r.id, r]));
  return flags.flatMap((f) => (byId.has(f.stampId) ? [{ stamp: byId.get(f.stampId)!, kind: f.kind, findings: f.findings, firstOn: f.firstOn, lastOn: f.lastOn }] : []));
}

/**
 * The recovery % measured at the boil-offs recorded (Σ recovered ÷ Σ wax used of those runs), or null before the
 * first; the estimator offers it as the default recovery instead of the wax master's setting.
 */
export async function measuredRecovery(tx: Transaction | typeof db = db): Promise<number | null> {
  return (await measuredRecoveryFigures(tx))?.pct ?? null;
}

/** The measured recovery % with how many runs' boil-offs it comes from (the estimate form says so), or null. */
export async function measuredRecoveryFigures(tx: Transaction | typeof db = db): Promise<{ pct: number; boilOffs: number } | null> {
  const rows = await tx
    .select({
      runId: runStages.runId,
      used: sql<number>`coalesce(sum(${runProgress.waxUsedG}), 0)`.mapWith(Number),
      recovered: sql<number>`coalesce(sum(${runProgress.recoveredG}), 0)`.mapWith(Number),
    })
    .from(runProgress)
    .innerJoin(runStages, eq(runStages.id, runProgress.stageId))
    .groupBy(runStages.runId);
  return measuredRecoveryOf(rows.map((r) => ({ gramsUsed: r.used, gramsRecovered: r.recovered })));
}
