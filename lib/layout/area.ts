import type { Grid } from "./grid";
import type { StampShape } from "./outline";
import type { PolygonBackend } from "./polygon";
import { prepareSets, windowArea, type AreaSource } from "./window-area";

export { prepareSets } from "./window-area";

export interface WaxAreas {
  /** Waxed area of one face of one piece, mm² (coverage factor applied). */
  pieceMm2: number;
  /** Waxed area of one face in one period of the infinite layout, mm². */
  periodMm2: number;
  /** Part of periodMm2 laid by impressions cut at the band's side edges (overlaps among them once), mm². */
  partialPeriodMm2: number;
}

/** A layer's grid and wax shape as the area windows take them; `denseField`/`complexField` name its refusals. */
export function areaSource(grid: Grid, shape: StampShape, fields: { dense: string; complex: string }): AreaSource {
  return { grid, prepared: prepareSets(grid, shape), denseField: fields.dense, complexField: fields.complex };
}

/** The gap a too dense field layout is blamed on: the direction in which neighbours overlap most. */
export function fieldDenseField(grid: Grid): string {
  const { pattern } = grid;
  return pattern.unit.widthMm / pattern.pitchXMm >= pattern.unit.heightMm / pattern.rowPitchMm ? "gap.xMm" : "gap.yMm";
}

/**
 * Waxed area of one face of one layer, using that the layer repeats every period P down the length (cost
 * independent of L). The wax shape lies inside its footprint, so an impression the piece ends leave out or cut
 * reaches at most `reach` (the tallest footprint) into the piece. Whole edges: the head [0, reach], one full period
 * strip [reach, reach + P] and the tail [reach + n·P, L], n = ⌊(L − 2·reach) / P⌋, each one window;
 * area = head + n × period + tail. Clip edges: the stamped impressions cut to the piece are exactly the infinite
 * layout cut to [0, L], so area = n × period + (the period strip's part below L − n·P), n = ⌊L / P⌋. Pieces too
 * short for this are computed in one window. A window's union cut to a sub-range equals the union of the rings cut
 * to it, so every figure is one backend call on the rings reaching into its own window.
 */
export function waxAreas(backend: PolygonBackend, source: AreaSource, shape: StampShape): WaxAreas {
  const { grid } = source;
  const P = grid.pattern.periodYMm;
  const L = grid.pieceLengthMm;
  const factor = shape.areaFactor;
  const area = (y0: number, y1: number, periodic: boolean) => windowArea(backend, [source], y0, y1, { periodic }) * factor;
  const reach = Math.max(...grid.sets.map(({ placement: p }) => p.footprint.y1 - p.footprint.y0)) + 1e-3;
  const partialPeriodMm2 =
    grid.edges === "clip" ? windowArea(backend, [source], 0, P, { periodic: true, partialOnly: true }) * factor : 0;

  if (grid.edges === "clip") {
    const periodMm2 = area(0, P, true);
    const periods = Math.floor(L / P);
    const rest = area(0, L - periods * P, true);
    return { pieceMm2: periods * periodMm2 + rest, periodMm2, partialPeriodMm2 };
  }

  const periods = Math.floor((L - 2 * reach) / P);
  if (periods < 1) {
    return { pieceMm2: area(0, L, false), periodMm2: area(0, P, true), partialPeriodMm2 };
  }
  const head = area(0, reach, false);
  const periodMm2 = area(reach, reach + P, false);
  const tail = area(reach + periods * P, L, false);
  return { pieceMm2: head + periods * periodMm2 + tail, periodMm2, partialPeriodMm2 };
}
