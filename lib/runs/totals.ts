import { stampingTime } from "@/lib/plans/run";
import { estimateWax, impressionsOfWaxing, type PlanImpressions } from "@/lib/wax";

/** What a waxing stage's estimate needs of its plan (the wax room's plan seam gives these). */
export interface StagePlan extends PlanImpressions {
  waxedAreaPerMetreM2: number;
}

export interface StageNeedInput {
  plan: StagePlan;
  /** The run's length, m (metres, or pieces × piece length). */
  metres: number;
  /** Pieces, for hours per piece; the metres when the run is a length. */
  pieces: number;
  passes: number;
  /** The calibrated rate for this recipe (and cloth) or the workshop's default, g/m² per pass. */
  rateGPerM2: number;
  lossPct: number;
  components: { material: string; pct: number; densityGPerCm3: number; pricePerKg: number | null }[];
  /** The workshop's stamping rate, impressions per hour per face. */
  impressionsPerHour: number;
}

export interface StageNeed {
  /** Gross wax the stage puts on, kg (recovery counts at the boil-off, not per stage). */
  kgEstimated: number;
  gramsPerMetre: number;
  byMaterial: { material: string; kg: number }[];
  impressions: number;
  hours: number;
}

/**
 * A stamped waxing stage's need: wax from the wax room's estimator (area per metre × passes × rate × (1 + loss),
 * no recovery: that belongs to the boil-off), impressions as a wax use would count them for the run's metres
 * (lib/wax impressionsOfWaxing), and stamper hours at the workshop's rate (lib/plans stampingTime).
 */
export function stageNeed(input: StageNeedInput): StageNeed {
  const wax = estimateWax({
    waxedAreaPerMetreM2: input.plan.waxedAreaPerMetreM2,
    metres: input.metres,
    passes: input.passes,
    rateGPerM2: input.rateGPerM2,
    lossPct: input.lossPct,
    recoveryPct: 0,
    components: input.components,
  });
  const made = impressionsOfWaxing(input.plan, input.metres, input.passes);
  const hours = made.total > 0 ? stampingTime({ impressionsTotal: made.total, pieces: Math.max(1, input.pieces) }, input.impressionsPerHour).hoursTotal : 0;
  return {
    kgEstimated: wax.kgGross,
    gramsPerMetre: wax.gramsPerMetre,
    byMaterial: wax.byMaterial.map((m) => ({ material: m.material, kg: m.kg })),
    impressions: made.total,
    hours,
  };
}

/** What the totals read of a stage: its estimates and what its records say was done. */
export interface StageFigures {
  kgEstimated: number;
  impressionsEstimated: number;
  hoursEstimated: number;
  /** Wax used (g) from its progress records; the boil-off's recovered wax (g). */
  gramsUsed: number;
  gramsRecovered: number;
  impressionsDone: number;
}

export interface RunTotals {
  wax: { kgEstimated: number; kgUsed: number; kgRecovered: number };
  hours: number;
  impressions: { estimated: number; done: number };
}

/** A run's totals are the sums of its stages' figures (every stage, whatever its kind). */
export function runTotals(stages: readonly StageFigures[]): RunTotals {
  const sum = (f: (s: StageFigures) => number) => stages.reduce((acc, s) => acc + f(s), 0);
  return {
    wax: { kgEstimated: sum((s) => s.kgEstimated), kgUsed: sum((s) => s.gramsUsed) / 1000, kgRecovered: sum((s) => s.gramsRecovered) / 1000 },
    hours: sum((s) => s.hoursEstimated),
    impressions: { estimated: sum((s) => s.impressionsEstimated), done: sum((s) => s.impressionsDone) },
  };
}

/**
 * The recovery % measured at boil-offs: Σ recovered ÷ Σ wax used of the runs whose boil-off is recorded, × 100,
 * capped at 100; null when none is recorded. The estimator offers it as the default recovery.
 */
export function measuredRecoveryPct(runs: readonly { gramsUsed: number; gramsRecovered: number }[]): number | null {
  return measuredRecoveryOf(runs)?.pct ?? null;
}

/** The measured recovery % (as measuredRecoveryPct) with the number of runs' boil-offs it comes from; null before the first. */
export function measuredRecoveryOf(runs: readonly { gramsUsed: number; gramsRecovered: number }[]): { pct: number; boilOffs: number } | null {
  const measured = runs.filter((r) => r.gramsUsed > 0 && r.gramsRecovered > 0);
  if (measured.length === 0) return null;
  const used = measured.reduce((a, r) => a + r.gramsUsed, 0);
  const recovered = measured.reduce((a, r) => a + r.gramsRecovered, 0);
  return { pct: Math.min(100, (recovered / used) * 100), boilOffs: measured.length };
}
