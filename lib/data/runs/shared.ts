import "server-only";
import { and, asc, eq, gte, inArray, isNull } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import {
  checkouts,
  motifColourways,
  motifs,
  plans,
  runEvents,
  runFindings,
  runPlans,
  runProgress,
  runReadings,
  runs,
  runStages,
  runStageStamps,
  stamps,
  waxRecipes,
  type RunEventKind,
  type RunRow,
  type RunStageRow,
} from "@/db/schema";
import type { Actor } from "@/lib/authz";
import type { RunDto, RunFindingDto, RunStageDto, RunSummaryDto } from "@/lib/contracts/runs";
import { AppError } from "@/lib/errors";
import { currentStage, FLAG_WINDOW_DAYS, flaggedStamps, readingWarnings, runTotals, type FindingKind } from "@/lib/runs";
import { todayIso } from "@/lib/dates";
import { workshopToday } from "../settings";
import { stampAvailability, stageStampRequests } from "./availability";

export type Db = Transaction | typeof db;

export async function findRun(tx: Db, id: string, lock = false): Promise<RunRow> {
  const query = tx.select().from(runs).where(eq(runs.id, id)).limit(1);
  const [run] = lock ? await query.for("update") : await query;
  if (!run) throw new AppError("notFound");
  return run;
}

export async function recordRunEvent(
  tx: Transaction,
  runId: string,
  actor: Pick<Actor, "id" | "name">,
  kind: RunEventKind,
  version: number,
  changes: { field: string; from: unknown; to: unknown }[] = [],
  details: Record<string, unknown> | null = null,
) {
  await tx.insert(runEvents).values({ runId, kind, actorId: actor.id, actorName: actor.name, version, changes, details });
}

export const totalMetresOf = (r: Pick<RunRow, "metres" | "pieces" | "pieceLengthMm">) => r.metres ?? ((r.pieces ?? 0) * (r.pieceLengthMm ?? 0)) / 1000;

/** Stamps flagged by the findings rule today, with the kind (one stamp may be flagged for several kinds). */
export async function flaggedNow(tx: Db) {
  const since = new Date(Date.now() - 2 * FLAG_WINDOW_DAYS * 86_400_000).toISOString().slice(0, 10);
  const rows = await tx.select({ stampId: runFindings.stampId, kind: runFindings.kind, foundOn: runFindings.foundOn }).from(runFindings).where(gte(runFindings.foundOn, since));
  return flaggedStamps(rows, todayIso());
}

interface StageFiguresRow {
  stage: RunStageRow;
  metres: number;
  pieces: number;
  impressions: number;
  waxUsedG: number;
  recoveredG: number;
}

function stageFigures(stages: RunStageRow[], progress: (typeof runProgress.$inferSelect)[]): StageFiguresRow[] {
  return stages.map((stage) => {
    const mine = progress.filter((p) => p.stageId === stage.id);
    const sum = (f: (p: (typeof mine)[number]) => number | null) => mine.reduce((a, p) => a + (f(p) ?? 0), 0);
    return { stage, metres: sum((p) => p.metres), pieces: sum((p) => p.pieces), impressions: sum((p) => p.impressions), waxUsedG: sum((p) => p.waxUsedG), recoveredG: sum((p) => p.recoveredG) };
  });
}

const totalsOf = (figures: StageFiguresRow[]) =>
  runTotals(
    figures.map((f) => ({
      kgEstimated: f.stage.kgEstimated,
      impressionsEstimated: f.stage.impressionsEstimated,
      hoursEstimated: f.stage.hoursEstimated,
      gramsUsed: f.waxUsedG,
      gramsRecovered: f.recoveredG,
      impressionsDone: f.impressions,
    })),
  );

/** The list rows for these runs, in the order given. */
export async function runSummaries(tx: Db, rows: RunRow[]): Promise<RunSummaryDto[]> {
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.id);
  const [motifRows, colourwayRows, stageRows] = await Promise.all([
    tx.select({ id: motifs.id, name: motifs.name }).from(motifs).where(inArray(motifs.id, [...new Set(rows.map((r) => r.motifId))])),
    tx.select({ id: motifColourways.id, name: motifColourways.name }).from(motifColourways).where(inArray(motifColourways.id, [...new Set(rows.map((r) => r.colourwayId))])),
    tx.select().from(runStages).where(inArray(runStages.runId, ids)).orderBy(asc(runStages.position)),
  ]);
  const progress = stageRows.length ? await tx.select().from(runProgress).where(inArray(runProgress.stageId, stageRows.map((s) => s.id))) : [];
  const motifName = new Map(motifRows.map((m) => [m.id, m.name]));
  const colourwayName = new Map(colourwayRows.map((c) => [c.id, c.name]));
  return rows.map((r) => {
    const stages = stageRows.filter((s) => s.runId === r.id);
    const current = currentStage(stages);
    return {
      id: r.id,
      name: r.name,
      motif: { id: r.motifId, name: motifName.get(r.motifId) ?? "" },
      colourway: { id: r.colourwayId, name: colourwayName.get(r.colourwayId) ?? "" },
      cloth: r.cloth,
      size: { metres: r.metres, pieces: r.pieces, pieceLengthMm: r.pieceLengthMm, totalMetres: totalMetresOf(r) },
      dueOn: r.dueOn,
      state: r.state,
      currentStage: current ? { id: current.id, position: current.position, kind: current.kind } : null,
      stageCount: stages.length,
      waitingForPlan: stages.some((s) => s.kind === "wax" && s.waxMethod === "stamp" && !s.planId),
      totals: totalsOf(stageFigures(stages, progress)),
      version: r.version,
      updatedAt: r.updatedAt.toISOString(),
    };
  });
}

/** The whole run: its summary, plans, stages with their stamps, records and estimates, findings and history. */
export async function runDto(tx: Db, id: string): Promise<RunDto> {
  const run = await findRun(tx, id);
  const [summary] = await runSummaries(tx, [run]);
  const stageRows = await tx.select().from(runStages).where(eq(runStages.runId, id)).orderBy(asc(runStages.position));
  const stageIds = stageRows.map((s) => s.id);
  const [planRows, stageStampRows, progress, readings, findings, history, flags] = await Promise.all([
    tx.select({ id: plans.id, name: plans.name, position: runPlans.position }).from(runPlans).innerJoin(plans, eq(plans.id, runPlans.planId)).where(eq(runPlans.runId, id)).orderBy(asc(runPlans.position)),
    stageIds.length
      ? tx
          .select({ stageId: runStageStamps.stageId, face: runStageStamps.face, id: stamps.id, code: stamps.code, name: stamps.name, condition: stamps.condition })
          .from(runStageStamps)
          .innerJoin(stamps, eq(stamps.id, runStageStamps.stampId))
          .where(inArray(runStageStamps.stageId, stageIds))
          .orderBy(asc(stamps.code))
      : Promise.resolve([]),
    stageIds.length ? tx.select().from(runProgress).where(inArray(runProgress.stageId, stageIds)).orderBy(asc(runProgress.doneOn), asc(runProgress.recordedAt)) : Promise.resolve([]),
    stageIds.length ? tx.select().from(runReadings).where(inArray(runReadings.stageId, stageIds)).orderBy(asc(runReadings.at)) : Promise.resolve([]),
    tx.select().from(runFindings).where(eq(runFindings.runId, id)).orderBy(asc(runFindings.foundOn), asc(runFindings.recordedAt)),
    tx.select().from(runEvents).where(eq(runEvents.runId, id)).orderBy(asc(runEvents.at)),
    flaggedNow(tx),
  ]);
  const planIds = [...new Set(stageRows.flatMap((s) => (s.planId ? [s.planId] : [])))];
  const recipeIds = [...new Set(stageRows.flatMap((s) => (s.recipeId ? [s.recipeId] : [])))];
  const [stagePlans, recipes] = await Promise.all([
    planIds.length ? tx.select({ id: plans.id, name: plans.name }).from(plans).where(inArray(plans.id, planIds)) : Promise.resolve([]),
    recipeIds.length ? tx.select({ id: waxRecipes.id, name: waxRecipes.name, workingMinC: waxRecipes.workingMinC, workingMaxC: waxRecipes.workingMaxC }).from(waxRecipes).where(inArray(waxRecipes.id, recipeIds)) : Promise.resolve([]),
  ]);
  const today = await workshopToday();
  const [onDays, sent] = await Promise.all([
    stampAvailability(
      tx,
      stageRows.map((s) => ({ id: s.id, plannedStartOn: s.plannedStartOn, plannedEndOn: s.plannedEndOn, stampIds: stageStampRows.filter((x) => x.stageId === s.id).map((x) => x.id) })),
      today,
    ),
    stageStampRequests(tx, stageIds),
  ]);
  const stampIds = [...new Set(stageStampRows.map((s) => s.id))];
  const out = stampIds.length ? new Set((await tx.select({ stampId: checkouts.stampId }).from(checkouts).where(and(inArray(checkouts.stampId, stampIds), isNull(checkouts.returnedAt)))).map((c) => c.stampId)) : new Set<string>();
  const flagged = new Set(flags.map((f) => f.stampId));
  const planById = new Map(stagePlans.map((p) => [p.id, p]));
  const recipeById = new Map(recipes.map((r) => [r.id, r]));
  const figures = stageFigures(stageRows, progress);

  const stages: RunStageDto[] = figures.map(({ stage: s, ...done }) => {
    const recipe = s.recipeId ? (recipeById.get(s.recipeId) ?? null) : null;
    const estimate = (s.estimate ?? {}) as { gramsPerMetre?: number; rateGPerM2?: number; byMaterial?: { material: string; kg: number }[] };
    return {
      id: s.id,
      position: s.position,
      kind: s.kind,
      state: s.state,
      colourPosition: s.colourPosition,
      colourName: s.colourName,
      swatch: s.swatch,
      plannedStartOn: s.plannedStartOn,
      plannedEndOn: s.plannedEndOn,
      waxMethod: s.waxMethod,
      plan: s.planId ? (planById.get(s.planId) ?? null) : null,
      recipe,
      faces: s.faces,
      passes: s.passes,
      dyeMethod: s.dyeMethod,
      notes: s.notes,
      stamps: stageStampRows
        .filter((x) => x.stageId === s.id)
        .map((x) => {
          const days = onDays.get(s.id)?.get(x.id) ?? { freeOnDays: true, busy: [] };
          return { id: x.id, code: x.code, name: x.name, face: x.face, available: !out.has(x.id) && !["needs_repair", "in_repair", "retired"].includes(x.condition), ...days, flagged: flagged.has(x.id) };
        }),
      stampRequests: sent.get(s.id) ?? [],
      estimate: { kg: s.kgEstimated, impressions: s.impressionsEstimated, hours: s.hoursEstimated, gramsPerMetre: estimate.gramsPerMetre ?? null, rateGPerM2: estimate.rateGPerM2 ?? null, byMaterial: estimate.byMaterial ?? [] },
      done,
      progress: progress
        .filter((p) => p.stageId === s.id)
        .map((p) => ({
          id: p.id,
          doneOn: p.doneOn,
          metres: p.metres,
          pieces: p.pieces,
          impressions: p.impressions,
          potBeforeG: p.potBeforeG,
          potAfterG: p.potAfterG,
          potAddedG: p.potAddedG,
          waxUsedG: p.waxUsedG,
          recoveredG: p.recoveredG,
          waxUseId: p.waxUseId,
          note: p.note,
          recordedByName: p.recordedByName,
          recordedAt: p.recordedAt.toISOString(),
        })),
      readings: readings
        .filter((r) => r.stageId === s.id)
        .map((r) => ({ id: r.id, stageId: r.stageId, at: r.at.toISOString(), tempC: r.tempC, warnings: readingWarnings(r.tempC, recipe ? { minC: recipe.workingMinC, maxC: recipe.workingMaxC } : null), note: r.note, recordedByName: r.recordedByName })),
    };
  });

  return {
    ...summary,
    plans: planRows.map((p) => ({ id: p.id, name: p.name })),
    notes: run.notes,
    stateNote: run.stateNote,
    stages,
    findings: findings.map(toFindingDto),
    history: history.map((h) => ({ kind: h.kind, actorName: h.actorName, at: h.at.toISOString(), version: h.version, changes: h.changes })),
    createdByName: run.createdByName,
    createdAt: run.createdAt.toISOString(),
    updatedByName: run.updatedByName,
  };
}

export function toFindingDto(f: typeof runFindings.$inferSelect): RunFindingDto {
  return {
    id: f.id,
    stageId: f.stageId,
    foundOn: f.foundOn,
    kind: f.kind as FindingKind,
    location: f.location,
    count: f.count,
    stamp: f.stampCode ? { id: f.stampId, code: f.stampCode } : null,
    photoKey: f.photoKey,
    repair: f.repair,
    repairNote: f.repairNote,
    recordedByName: f.recordedByName,
    recordedAt: f.recordedAt.toISOString(),
  };
}
