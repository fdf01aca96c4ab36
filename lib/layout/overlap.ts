import type { EdgeMode } from "./grid";
import { CLIPPER_UNITS_PER_MM, OVERLAP_CHUNK_MM, OVERLAP_PERIOD_MAX_MM } from "./limits";
import type { PolygonBackend } from "./polygon";
import { windowArea, type AcrossRange, type AreaSource } from "./window-area";

/** One layer as the overlap sees it: its area source, its period down the length, its tallest footprint, its coverage factor. */
export interface OverlapLayer {
  source: AreaSource;
  periodMm: number;
  reachMm: number;
  areaFactor: number;
}

/** Waxed area two layers share (counted in both layers' own figures, once in the total). One face, mm². */
export interface OverlapArea {
  /** Long-run average per metre of length, mm². */
  perMetreMm2: number;
  /** Over one piece, mm². */
  pieceMm2: number;
  /** The common period of the two layers (mm) when there is one of at most OVERLAP_PERIOD_MAX_MM, else null. */
  periodMm: number | null;
  /** Length of cloth united to find the per-metre figure, mm. */
  windowMm: number;
  /** False when there is no such common period: the per-metre figure is then the average over `windowMm`. */
  exact: boolean;
}

function gcd(a: number, b: number): number {
  while (b) [a, b] = [b, a % b];
  return a;
}

/**
 * The least common multiple of two periods (mm), taken on the engine's polygon grid (10 nm), or null when it is longer
 * than `maxMm`. Periods that are not whole numbers of grid steps (a hexagonal rosette row, √3/2 of a pitch)
 * are rounded to the grid, as every position the polygon engine sees is; they then have no short common multiple.
 */
export function commonPeriod(aMm: number, bMm: number, maxMm = OVERLAP_PERIOD_MAX_MM): number | null {
  const a = Math.round(aMm * CLIPPER_UNITS_PER_MM);
  const b = Math.round(bMm * CLIPPER_UNITS_PER_MM);
  if (a <= 0 || b <= 0) return null;
  const lcm = (a / gcd(a, b)) * b;
  return lcm <= maxMm * CLIPPER_UNITS_PER_MM ? lcm / CLIPPER_UNITS_PER_MM : null;
}

/**
 * Area where layers a and b overlap inside `across` (the strip where a's band and b's band meet), one face.
 *
 * Each layer repeats with its own period; together they repeat with the common period Λ = lcm(Pa, Pb). Whole
 * edges: the piece equals the endless layout on [reach, L − reach] (every impression reaching in there lies
 * wholly on the piece), so overlap = head [0, reach] + n·O(Λ) + O([reach, reach + r]) + tail [L − reach, L],
 * n = ⌊(L − 2·reach) / Λ⌋, r the rest; clip edges: the piece is the endless layout cut to [0, L], so
 * overlap = n·O(Λ) + O([0, r]). O(Λ) is united in chunks of OVERLAP_CHUNK_MM, whose running sums give
 * O([start, start + r]) with one extra chunk at most, so the cost is about Λ + 2·reach, whatever the run length.
 * Without a common period of at most OVERLAP_PERIOD_MAX_MM the per-metre figure is the average over a window
 * of that length (a whole number of the longer period), and so is the middle of a piece longer than it.
 *
 * In each window |A ∩ B| = |A| + |B| − |A ∪ B|, three unions of the rings cut to the strip. With coverage
 * factors ca, cb (stamps given by footprint × coverage) the two wax patterns are taken as unrelated, so the
 * shared wax is ca·cb·|A ∩ B|; with outlines both are 1 and this is plain inclusion–exclusion.
 */
export function layerOverlap(
  backend: PolygonBackend,
  a: OverlapLayer,
  b: OverlapLayer,
  across: AcrossRange,
  pieceLengthMm: number,
  edges: EdgeMode,
): OverlapArea {
  const factor = a.areaFactor * b.areaFactor;
  const shared = (y0: number, y1: number, periodic: boolean): number => {
    if (y1 <= y0) return 0;
    const options = { periodic };
    const ua = windowArea(backend, [a.source], y0, y1, options, across);
    if (ua === 0) return 0;
    const ub = windowArea(backend, [b.source], y0, y1, options, across);
    if (ub === 0) return 0;
    const both = windowArea(backend, [a.source, b.source], y0, y1, options, across);
    return Math.max(0, ua + ub - both) * factor;
  };
  /** Chunked overlap of the endless layout over [from, from + length], with the chunks' running sums. */
  const chunked = (from: number, length: number) => {
    const sums = [0];
    for (let s = 0; s < length; s += OVERLAP_CHUNK_MM) {
      sums.push(sums[sums.length - 1] + shared(from + s, from + Math.min(length, s + OVERLAP_CHUNK_MM), true));
    }
    /** Overlap over [from, from + r] for 0 ≤ r ≤ length. */
    const upTo = (r: number): number => {
      const k = Math.min(sums.length - 1, Math.floor(r / OVERLAP_CHUNK_MM));
      return sums[k] + shared(from + k * OVERLAP_CHUNK_MM, from + r, true);
    };
    return { total: sums[sums.length - 1], upTo };
  };

  const L = pieceLengthMm;
  const reach = Math.max(a.reachMm, b.reachMm) + 1e-3;
  const start = edges === "clip" ? 0 : reach;
  const span = edges === "clip" ? L : L - 2 * reach;
  const ends = edges === "clip" || span <= 0 ? 0 : shared(0, reach, false) + shared(L - reach, L, false);
  const period = commonPeriod(a.periodMm, b.periodMm);

  if (period !== null) {
    const strip = chunked(start, period);
    const perMetreMm2 = (strip.total * 1000) / period;
    if (span <= 0) return { perMetreMm2, pieceMm2: shared(0, L, false), periodMm: period, windowMm: period, exact: true };
    const n = Math.floor(span / period);
    const pieceMm2 = ends + n * strip.total + strip.upTo(span - n * period);
    return { perMetreMm2, pieceMm2, periodMm: period, windowMm: period, exact: true };
  }

  const longer = Math.max(a.periodMm, b.periodMm);
  const windowMm = Math.max(1, Math.floor(OVERLAP_PERIOD_MAX_MM / longer)) * longer;
  const sample = chunked(start, windowMm);
  const perMetreMm2 = (sample.total * 1000) / windowMm;
  let pieceMm2: number;
  if (span <= 0) pieceMm2 = shared(0, L, false);
  else if (span <= windowMm) pieceMm2 = ends + sample.upTo(span);
  else pieceMm2 = ends + (sample.total * span) / windowMm;
  return { perMetreMm2, pieceMm2, periodMm: null, windowMm, exact: false };
}
