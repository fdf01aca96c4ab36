import "server-only";
import { and, eq, inArray, isNull, sql } from "drizzle-orm";
import { db } from "@/db";
import { runPlans, runs, runStages, waxUses } from "@/db/schema";

// The wax room's purchase list reads the open runs here: the wax their waxing stages still need (estimate − wax
// already used, by material), and the plans those runs stamp, whose own planned estimates the runs replace.

export async function openRunWaxNeeds(): Promise<{
  planIds: Set<string>;
  stages: { runId: string; runName: string; stageId: string; position: number; plannedStartOn: string | null; kg: number; byMaterial: { material: string; kg: number }[] }[];
}> {
  const open = await db.select({ id: runs.id, name: runs.name }).from(runs).where(inArray(runs.state, ["setup", "underway"]));
  if (!open.length) return { planIds: new Set(), stages: [] };
  const ids = open.map((r) => r.id);
  const [plansOfRuns, stages, used] = await Promise.all([
    db.select({ planId: runPlans.planId }).from(runPlans).where(inArray(runPlans.runId, ids)),
    db.select().from(runStages).where(and(inArray(runStages.runId, ids), eq(runStages.kind, "wax"))),
    db
      .select({ stageId: waxUses.runStageId, grams: sql<number>`sum(${waxUses.grams})`.mapWith(Number) })
      .from(waxUses)
      .innerJoin(runStages, eq(runStages.id, waxUses.runStageId))
      .where(and(inArray(runStages.runId, ids), isNull(waxUses.withdrawnAt)))
      .groupBy(waxUses.runStageId),
  ]);
  const usedKg = new Map(used.map((u) => [u.stageId, u.grams / 1000]));
  const name = new Map(open.map((r) => [r.id, r.name]));
  const stageNeeds = stages
    .filter((s) => s.state !== "done" && s.kgEstimated > 0)
    .map((s) => {
      const left = Math.max(0, s.kgEstimated - (usedKg.get(s.id) ?? 0));
      const share = left / s.kgEstimated;
      const byMaterial = ((s.estimate?.byMaterial ?? []) as { material: string; kg: number }[]).map((m) => ({ material: m.material, kg: m.kg * share }));
      return { runId: s.runId, runName: name.get(s.runId) ?? "", stageId: s.id, position: s.position, plannedStartOn: s.plannedStartOn, kg: left, byMaterial };
    })
    .filter((s) => s.kg > 0);
  const planIds = new Set([...plansOfRuns.map((p) => p.planId), ...stages.flatMap((s) => (s.planId ? [s.planId] : []))]);
  return { planIds, stages: stageNeeds };
}
