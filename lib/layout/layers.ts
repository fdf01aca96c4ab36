import { areaSource, waxAreas, type WaxAreas } from "./area";
import type { BorderLayer } from "./borders";
import { perMetreCounts, pieceCounts, rowDetails, type Grid } from "./grid";
import { EPS_MM } from "./limits";
import type { StampShape } from "./outline";
import { layerOverlap } from "./overlap";
import type { PolygonBackend } from "./polygon";
import type { LayerName, LayerOverlap, LayerResult, Leftover } from "./types";
import type { AreaSource } from "./window-area";

/** A layer ready to be measured: its grid and wax shape, its area source and its waxed areas (one face). */
export interface MeasuredLayer {
  layer: LayerName;
  grid: Grid;
  shape: StampShape;
  source: AreaSource;
  areas: WaxAreas;
  border?: BorderLayer;
}

/** Measures a border layer's own waxed areas (its own union, cut to its strip). */
export function measureBorder(backend: PolygonBackend, border: BorderLayer): MeasuredLayer {
  const field = (name: string) => `borders.${border.index}.${name}`;
  const source = areaSource(border.grid, border.shape, { dense: field("gapYMm"), complex: field("stamp.outline") });
  return { layer: border.layer, grid: border.grid, shape: border.shape, source, areas: waxAreas(backend, source, border.shape), border };
}

function reachOf(grid: Grid): number {
  return Math.max(...grid.sets.map(({ placement: p }) => p.footprint.y1 - p.footprint.y0));
}

/**
 * Overlaps between the field and each border, where their bands meet (a negative gap to the field). Borders never
 * meet each other (planBorders refuses that), so no spot lies in three layers and the union of all layers is
 * Σ layer − Σ overlap, exactly.
 */
export function measureOverlaps(backend: PolygonBackend, field: MeasuredLayer, borders: readonly MeasuredLayer[], sides: number): LayerOverlap[] {
  const out: LayerOverlap[] = [];
  for (const border of borders) {
    const x0Mm = Math.max(field.grid.bandX0Mm, border.grid.bandX0Mm);
    const x1Mm = Math.min(field.grid.bandX1Mm, border.grid.bandX1Mm);
    if (x1Mm - x0Mm <= EPS_MM) continue;
    const layer = (m: MeasuredLayer) => ({
      source: m.source,
      periodMm: m.grid.pattern.periodYMm,
      reachMm: reachOf(m.grid),
      areaFactor: m.shape.areaFactor,
    });
    const o = layerOverlap(backend, layer(field), layer(border), { x0Mm, x1Mm }, field.grid.pieceLengthMm, field.grid.edges);
    out.push({
      layers: [field.layer, border.layer],
      acrossMm: { x0: x0Mm, x1: x1Mm },
      perMetreM2: (o.perMetreMm2 * sides) / 1e6,
      pieceM2: (o.pieceMm2 * sides) / 1e6,
      periodMm: o.periodMm,
      windowMm: o.windowMm,
      exact: o.exact,
    });
  }
  return out;
}

/** One layer's figures for the result (all faces), its band and its leftover within that band. */
export function layerResult(m: MeasuredLayer, pieces: number, sides: number): LayerResult {
  const { grid, areas, shape, border } = m;
  const P = grid.pattern.periodYMm;
  const perMetre = perMetreCounts(grid);
  const counts = pieceCounts(grid);
  const rows = rowDetails(grid).filter((r) => r.whole + r.clipped > 0);
  const band = grid.bandX1Mm - grid.bandX0Mm;
  return {
    layer: m.layer,
    ...(border ? { border: border.index, rotationDeg: border.rotationDeg, mirrored: border.mirrored } : {}),
    bandMm: { x0: grid.bandX0Mm, x1: grid.bandX1Mm },
    across: Math.max(0, ...rowDetails(grid).map((r) => r.whole)),
    periodMm: P,
    impressionsPerMetre: (perMetre.whole + perMetre.clipped) * sides,
    impressionsTotal: (counts.whole + counts.clipped) * pieces * sides,
    impressionsWholeTotal: counts.whole * pieces * sides,
    impressionsClippedTotal: counts.clipped * pieces * sides,
    waxedAreaPerMetreM2: ((areas.periodMm2 * 1000) / P / 1e6) * sides,
    waxedAreaTotalM2: (areas.pieceMm2 * pieces * sides) / 1e6,
    coverageOfBand: areas.periodMm2 / (P * band),
    impressionAreaMm2: shape.areaMm2,
    leftover: {
      leftMm: rows.length ? Math.min(...rows.map((r) => r.leftover.leftMm)) : band,
      rightMm: rows.length ? Math.min(...rows.map((r) => r.leftover.rightMm)) : band,
    },
  };
}

/** Unused band between each margin line and the nearest impression of any layer (SPEC §6 `leftover`). */
export function bandLeftover(layers: readonly LayerResult[], bandX0Mm: number, bandX1Mm: number): Leftover {
  const clean = (v: number) => Math.max(0, Math.round(v * 1e6) / 1e6) || 0;
  return {
    leftMm: clean(Math.min(...layers.map((l) => l.bandMm.x0 + l.leftover.leftMm - bandX0Mm))),
    rightMm: clean(Math.min(...layers.map((l) => bandX1Mm - (l.bandMm.x1 - l.leftover.rightMm)))),
  };
}
