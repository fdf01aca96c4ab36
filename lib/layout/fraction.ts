import { DIAGONAL_MAX_DENOMINATOR } from "./limits";

/**
 * The simple fraction p/q (q ≤ maxDenominator, smallest q first) equal to f within 1e-4, or null.
 * Used to snap a diagonal step such as 0.333 to 1/3 so the layout repeats after q rows.
 */
export function simpleFraction(f: number, maxDenominator = DIAGONAL_MAX_DENOMINATOR): { p: number; q: number } | null {
  if (!Number.isFinite(f)) return null;
  for (let q = 1; q <= maxDenominator; q++) {
    const p = Math.round(f * q);
    if (Math.abs(f * q - p) < 1e-4) return { p, q };
  }
  return null;
}
