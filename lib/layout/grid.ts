import type { Pattern, Placement } from "./arrangements";
import { EPS_MM } from "./limits";
import type { Leftover, RowDetail } from "./types";

export type EdgeMode = "whole" | "clip";
export type Alignment = "centre" | "left";

/** Inclusive range of lattice indices; empty when last < first. */
export interface IndexRange {
  first: number;
  last: number;
}

/** Number of indices in a range (0 when empty). */
export function countOf(r: IndexRange): number {
  return Math.max(0, r.last - r.first + 1);
}

/** Indices in both ranges. */
export function intersectRanges(a: IndexRange, b: IndexRange): IndexRange {
  return { first: Math.max(a.first, b.first), last: Math.min(a.last, b.last) };
}

/** Indices i for which [a + i·p, b + i·p] lies inside [lo, hi] (mm, EPS_MM slack). */
export function insideRange(lo: number, hi: number, a: number, b: number, p: number): IndexRange {
  return { first: Math.ceil((lo - EPS_MM - a) / p), last: Math.floor((hi + EPS_MM - b) / p) };
}

/** Indices i for which [a + i·p, b + i·p] overlaps [lo, hi] by more than EPS_MM. */
export function overlapRange(lo: number, hi: number, a: number, b: number, p: number): IndexRange {
  return { first: Math.floor((lo + EPS_MM - b) / p) + 1, last: Math.ceil((hi - EPS_MM - a) / p) - 1 };
}

/** One placement of the pattern laid on the band: which columns and rows of it are stamped. */
export interface PlacedSet {
  placement: Placement;
  /** Columns whose footprint lies inside the band / touches it / is stamped under the edge mode. */
  insideX: IndexRange;
  overlapX: IndexRange;
  memberX: IndexRange;
  /** The same for rows along one piece [0, pieceLength]. */
  insideY: IndexRange;
  overlapY: IndexRange;
  memberY: IndexRange;
}

/** A pattern laid on the band of one piece. x in mm from the left selvedge, y in mm from the start of the piece. */
export interface Grid {
  pattern: Pattern;
  edges: EdgeMode;
  bandX0Mm: number;
  bandX1Mm: number;
  pieceLengthMm: number;
  /** x of the pattern origin on the cloth. */
  originXMm: number;
  sets: PlacedSet[];
}

/**
 * Lays a pattern on the band [bandX0, bandX1] of a piece of the given length (mm). Row 0 starts at y = 0.
 * Alignment: `left` puts row 0's leftmost footprint on the left margin line; `centre` then shifts the
 * layout so row 0's whole impressions leave equal leftovers. `whole` stamps only impressions whose
 * footprint lies inside the band and the piece; `clip` also those that overlap it (cut at its edges).
 */
export function buildGrid(
  pattern: Pattern,
  bandX0Mm: number,
  bandX1Mm: number,
  pieceLengthMm: number,
  align: Alignment,
  edges: EdgeMode,
): Grid {
  const p = pattern.pitchXMm;
  const row0 = pattern.placements.filter((pl) => pl.row === 0);
  const leftOrigin = bandX0Mm - Math.min(...row0.map((pl) => pl.footprint.x0));
  let maxRight = -Infinity;
  for (const pl of row0) {
    const r = insideRange(bandX0Mm, bandX1Mm, leftOrigin + pl.footprint.x0, leftOrigin + pl.footprint.x1, p);
    if (countOf(r) > 0) maxRight = Math.max(maxRight, leftOrigin + pl.footprint.x1 + r.last * p);
  }
  const originXMm = align === "centre" && Number.isFinite(maxRight) ? leftOrigin + (bandX1Mm - maxRight) / 2 : leftOrigin;

  const sets = pattern.placements.map((placement): PlacedSet => {
    const fp = placement.footprint;
    const insideX = insideRange(bandX0Mm, bandX1Mm, originXMm + fp.x0, originXMm + fp.x1, p);
    const overlapX = overlapRange(bandX0Mm, bandX1Mm, originXMm + fp.x0, originXMm + fp.x1, p);
    const insideY = insideRange(0, pieceLengthMm, fp.y0, fp.y1, pattern.periodYMm);
    const overlapY = overlapRange(0, pieceLengthMm, fp.y0, fp.y1, pattern.periodYMm);
    return {
      placement,
      insideX,
      overlapX,
      memberX: edges === "whole" ? insideX : overlapX,
      insideY,
      overlapY,
      memberY: edges === "whole" ? insideY : overlapY,
    };
  });
  return { pattern, edges, bandX0Mm, bandX1Mm, pieceLengthMm, originXMm, sets };
}

/** Footprint x-extent on the cloth of column i of a placed set, mm. */
export function columnExtent(grid: Grid, set: PlacedSet, i: number): [number, number] {
  const x = grid.originXMm + i * grid.pattern.pitchXMm;
  return [x + set.placement.footprint.x0, x + set.placement.footprint.x1];
}

/**
 * Per row type: whole and cut impressions across, and the leftover (band between each margin line and the
 * nearest stamped footprint, cut footprints counting from the band edge; the whole band when the row is empty).
 */
export function rowDetails(grid: Grid): RowDetail[] {
  const { pattern } = grid;
  const band = grid.bandX1Mm - grid.bandX0Mm;
  return pattern.rowShiftXMm.map((shiftXMm, row) => {
    let whole = 0;
    let clipped = 0;
    let minLeft = Infinity;
    let maxRight = -Infinity;
    for (const set of grid.sets) {
      if (set.placement.row !== row) continue;
      whole += countOf(set.insideX);
      if (grid.edges === "clip") clipped += countOf(set.overlapX) - countOf(set.insideX);
      if (countOf(set.memberX) === 0) continue;
      minLeft = Math.min(minLeft, columnExtent(grid, set, set.memberX.first)[0]);
      maxRight = Math.max(maxRight, columnExtent(grid, set, set.memberX.last)[1]);
    }
    const leftover: Leftover = Number.isFinite(minLeft)
      ? { leftMm: clean(Math.max(0, minLeft - grid.bandX0Mm)), rightMm: clean(Math.max(0, grid.bandX1Mm - maxRight)) }
      : { leftMm: band, rightMm: band };
    return { row, offsetYMm: row * pattern.rowPitchMm, shiftXMm, whole, clipped, leftover };
  });
}

/** Impressions of one face on one piece: whole, and cut at a band edge or a piece end (clip mode). */
export function pieceCounts(grid: Grid): { whole: number; clipped: number } {
  let whole = 0;
  let all = 0;
  for (const set of grid.sets) {
    whole += countOf(set.insideX) * countOf(set.insideY);
    all += countOf(set.memberX) * countOf(set.memberY);
  }
  return { whole, clipped: all - whole };
}

/** Long-run impressions of one face per metre of length: stamped columns per period × 1000 / period (mm). */
export function perMetreCounts(grid: Grid): { whole: number; clipped: number } {
  let whole = 0;
  let all = 0;
  for (const set of grid.sets) {
    whole += countOf(set.insideX);
    all += countOf(set.memberX);
  }
  const perMetre = 1000 / grid.pattern.periodYMm;
  return { whole: whole * perMetre, clipped: (all - whole) * perMetre };
}

/** Rounds away floating-point dust below 1 nm so hand-worked leftovers compare exactly. */
function clean(v: number): number {
  const r = Math.round(v * 1e6) / 1e6;
  return r === 0 ? 0 : r;
}
