/** What the impression count of a waxing needs of its plan: the whole run's impressions, its length and faces. */
export interface PlanImpressions {
  /** Impressions of the plan's whole run, every face it stamps (one face × sides). */
  impressionsTotal: number;
  runLengthMm: number;
  sides: 1 | 2;
}

/**
 * Impressions one waxing of a plan made: the plan's impressions per metre (impressionsTotal / run length in m)
 * × metres waxed × passes (each pass stamps the plan again), rounded to whole impressions. With two sides the
 * back face made half of them (the layout mirrors the front through the cloth, so both faces carry as many);
 * `back` = total − front, so the two always add up. Zero when the plan has no length or impressions.
 */
export function impressionsOfWaxing(plan: PlanImpressions, metres: number, passes: number): { total: number; front: number; back: number } {
  if (!(plan.runLengthMm > 0) || !(plan.impressionsTotal > 0) || !(metres > 0) || !(passes > 0)) return { total: 0, front: 0, back: 0 };
  const total = Math.round((plan.impressionsTotal / (plan.runLengthMm / 1000)) * metres * passes);
  const front = plan.sides === 2 ? Math.ceil(total / 2) : total;
  return { total, front, back: total - front };
}
