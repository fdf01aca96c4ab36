import type { Pattern } from "./arrangements";
import { EPS_MM, GAP_MAX_MM, MIN_STEP_MM, STAMP_SIDE_MAX_MM, STAMP_SIDE_MIN_MM } from "./limits";
import type { FitRow } from "./types";

/**
 * Fit table for N = n − 1, n, n + 1 units across a band of width B (mm), n = ⌊(B + g) / (U + g)⌋ for unit width U
 * (the stamp, or the rosette for rotation) and gap g. N units fill the band exactly with gap (B − N·U) / (N − 1),
 * or at the current gap with unit width (B − (N − 1)·g) / N. Feasible: the gap leaves a step of at least
 * MIN_STEP_MM and stays ≤ GAP_MAX_MM; the stamp width lies within the allowed stamp sizes.
 */
export function fitTable(pattern: Pattern, bandWidthMm: number, gapXMm: number, stampWidthMm: number): FitRow[] {
  const U = pattern.unit.widthMm;
  const B = bandWidthMm;
  const n = Math.floor((B + gapXMm + EPS_MM) / (U + gapXMm));
  const rows: FitRow[] = [];
  for (const N of [n - 1, n, n + 1]) {
    if (N < 1) continue;
    const gap = N >= 2 ? (B - N * U) / (N - 1) : null;
    const unitWidthMm = (B - (N - 1) * gapXMm) / N;
    const isStamp = pattern.unit.kind === "stamp";
    const minGap = -(stampWidthMm - MIN_STEP_MM);
    rows.push({
      across: N,
      gapXMm: gap,
      gapFeasible: gap !== null && gap >= minGap - EPS_MM && gap <= GAP_MAX_MM + EPS_MM,
      unitWidthMm,
      stampWidthMm: isStamp ? unitWidthMm : null,
      stampWidthFeasible:
        isStamp &&
        unitWidthMm >= STAMP_SIDE_MIN_MM - EPS_MM &&
        unitWidthMm <= STAMP_SIDE_MAX_MM + EPS_MM &&
        gapXMm >= -(unitWidthMm - MIN_STEP_MM) - EPS_MM,
      current: N === n,
    });
  }
  return rows;
}
