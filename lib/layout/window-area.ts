import { layoutError } from "./errors";
import { applyAffine, determinant } from "./geometry";
import { countOf, intersectRanges, overlapRange, type Grid, type IndexRange, type PlacedSet } from "./grid";
import { AREA_TILE_MAX_MM, AREA_WINDOW_MAX_IMPRESSIONS, AREA_WINDOW_MAX_VERTICES, CLIPPER_UNITS_PER_MM } from "./limits";
import type { StampShape } from "./outline";
import type { PolygonBackend } from "./polygon";

/** A placed set with its wax rings already mapped into pattern coordinates (flat x, y arrays, outer rings positive). */
export interface PreparedSet {
  set: PlacedSet;
  rings: Float64Array[];
  vertexCount: number;
}

/** Maps the stamp's wax rings through each placement; mirrored placements get their rings reversed to keep one turn. */
export function prepareSets(grid: Grid, shape: StampShape): PreparedSet[] {
  return grid.sets.map((set) => {
    const m = set.placement.matrix;
    const flip = determinant(m) < 0;
    const rings = shape.rings.map((ring) => {
      const out = new Float64Array(ring.length * 2);
      ring.forEach(([u, v], k) => {
        const [x, y] = applyAffine(m, u, v);
        const at = flip ? ring.length - 1 - k : k;
        out[2 * at] = x;
        out[2 * at + 1] = y;
      });
      return out;
    });
    return { set, rings, vertexCount: shape.vertexCount };
  });
}

/** One layer of impressions as the area windows see it: its grid, its prepared wax rings and the fields its refusals name. */
export interface AreaSource {
  grid: Grid;
  prepared: PreparedSet[];
  /** Field named when a window holds too many impressions of this layer (a gap) or too many vertices (an outline). */
  denseField: string;
  complexField: string;
}

export interface WindowOptions {
  /** Take every row of the infinite layout (a period strip) instead of the rows stamped on the piece. */
  periodic: boolean;
  /** Only impressions cut at a band side edge. */
  partialOnly?: boolean;
}

/** An across range (mm, cloth coordinates) that a window is cut to besides each layer's own band. */
export interface AcrossRange {
  x0Mm: number;
  x1Mm: number;
}

const S = CLIPPER_UNITS_PER_MM;

/** Impressions and vertices gathered for one window so far, to refuse a window too big to unite. */
interface Budget {
  impressions: number;
  vertices: number;
}

/** A rectangle of the cloth (mm) whose rings go to the polygon backend in one call. */
interface Tile {
  x0Mm: number;
  x1Mm: number;
  y0Mm: number;
  y1Mm: number;
}

/**
 * Counts into `budget` (refusing a window too big to unite), or appends to `out`, the wax rings of one layer's
 * impressions reaching into `tile` (the window, or a part of it), each cut to the layer's band and to the tile, as
 * integers on the polygon grid (CLIPPER_UNITS_PER_MM) in coordinates from the tile's middle.
 */
function gatherRings(source: AreaSource, tile: Tile, options: WindowOptions, out: Float64Array[] | null, budget: Budget | null) {
  const { grid, prepared } = source;
  const { pattern, originXMm } = grid;
  const xc = (tile.x0Mm + tile.x1Mm) / 2;
  const yc = (tile.y0Mm + tile.y1Mm) / 2;
  const cutX0 = Math.max(grid.bandX0Mm, tile.x0Mm);
  const cutX1 = Math.min(grid.bandX1Mm, tile.x1Mm);
  if (cutX1 <= cutX0) return;
  const left = cutX0 - xc;
  const right = cutX1 - xc;
  const top = tile.y0Mm - yc;
  const bottom = tile.y1Mm - yc;

  for (const { set, rings, vertexCount } of prepared) {
    const wax = set.placement.wax;
    let rows: IndexRange = overlapRange(tile.y0Mm, tile.y1Mm, wax.y0, wax.y1, pattern.periodYMm);
    if (!options.periodic) rows = intersectRanges(rows, set.memberY);
    const columns = intersectRanges(set.memberX, overlapRange(cutX0, cutX1, originXMm + wax.x0, originXMm + wax.x1, pattern.pitchXMm));
    const perRow = options.partialOnly ? countOf(columns) - countOf(intersectRanges(columns, set.insideX)) : countOf(columns);
    const added = countOf(rows) * perRow;
    if (added === 0) continue;
    if (budget) {
      budget.impressions += added;
      budget.vertices += added * vertexCount;
      guard(source, budget);
    }
    if (!out) continue;

    for (let j = rows.first; j <= rows.last; j++) {
      const dy = j * pattern.periodYMm - yc;
      for (let i = columns.first; i <= columns.last; i++) {
        if (options.partialOnly && i >= set.insideX.first && i <= set.insideX.last) continue;
        const dx = originXMm + i * pattern.pitchXMm - xc;
        const inside = wax.x0 + dx >= left && wax.x1 + dx <= right && wax.y0 + dy >= top && wax.y1 + dy <= bottom;
        for (const ring of rings) {
          const points = inside ? shifted(ring, dx, dy) : clipToRect(ring, dx, dy, left, right, top, bottom);
          if (points.length < 6) continue;
          for (let k = 0; k < points.length; k++) points[k] = Math.round(points[k] * S);
          out.push(points);
        }
      }
    }
  }
}

function shifted(ring: Float64Array, dx: number, dy: number): Float64Array {
  const out = new Float64Array(ring.length);
  for (let k = 0; k < ring.length; k += 2) {
    out[k] = ring[k] + dx;
    out[k + 1] = ring[k + 1] + dy;
  }
  return out;
}

/**
 * Cuts a shifted ring to a rectangle, one side at a time (Sutherland–Hodgman). Inside the rectangle the winding
 * number of the result equals the ring's, so the non-zero union cut to the window is unchanged, while the vertices
 * outside the window never reach the polygon engine. Zero-width runs along the sides are harmless to it.
 */
function clipToRect(ring: Float64Array, dx: number, dy: number, x0: number, x1: number, y0: number, y1: number): Float64Array {
  let pts = shifted(ring, dx, dy);
  for (let side = 0; side < 4 && pts.length >= 6; side++) {
    const axis = side < 2 ? 0 : 1;
    const limit = side === 0 ? x0 : side === 1 ? x1 : side === 2 ? y0 : y1;
    const keepAbove = side === 0 || side === 2;
    const isIn = (v: number) => (keepAbove ? v >= limit : v <= limit);
    const out: number[] = [];
    const n = pts.length / 2;
    for (let k = 0; k < n; k++) {
      const cx = pts[2 * k];
      const cy = pts[2 * k + 1];
      const p = (k + n - 1) % n;
      const px = pts[2 * p];
      const py = pts[2 * p + 1];
      const cIn = isIn(axis === 0 ? cx : cy);
      const pIn = isIn(axis === 0 ? px : py);
      if (cIn !== pIn) {
        const pv = axis === 0 ? px : py;
        const cv = axis === 0 ? cx : cy;
        const t = (limit - pv) / (cv - pv);
        if (axis === 0) out.push(limit, py + t * (cy - py));
        else out.push(px + t * (cx - px), limit);
      }
      if (cIn) out.push(cx, cy);
    }
    pts = Float64Array.from(out);
  }
  return pts;
}

function guard(source: AreaSource, budget: Budget) {
  if (budget.impressions > AREA_WINDOW_MAX_IMPRESSIONS) {
    throw layoutError(source.denseField, "layoutTooDense", { impressions: budget.impressions, max: AREA_WINDOW_MAX_IMPRESSIONS });
  }
  if (budget.vertices > AREA_WINDOW_MAX_VERTICES) {
    throw layoutError(source.complexField, "layoutTooComplex", { vertices: budget.vertices, max: AREA_WINDOW_MAX_VERTICES });
  }
}

/**
 * Waxed area (mm², before any coverage factor) of the union of the impressions of all `sources` reaching into the
 * window y ∈ [yStart, yEnd], each cut to its own band and to `across` (default: the first source's band), overlaps
 * counted once; never every impression of a run. The window goes to the polygon backend in tiles of at most
 * AREA_TILE_MAX_MM a side (areas add up over a partition, and a union cut to a tile is the union of the rings cut
 * to it), so that grid coordinates stay in clipper-lib's fast integer range and each union stays small.
 */
export function windowArea(
  backend: PolygonBackend,
  sources: readonly AreaSource[],
  yStart: number,
  yEnd: number,
  options: WindowOptions,
  across?: AcrossRange,
): number {
  if (yEnd <= yStart || sources.length === 0) return 0;
  const range = across ?? { x0Mm: sources[0].grid.bandX0Mm, x1Mm: sources[0].grid.bandX1Mm };
  const whole: Tile = { x0Mm: range.x0Mm, x1Mm: range.x1Mm, y0Mm: yStart, y1Mm: yEnd };
  const budget: Budget = { impressions: 0, vertices: 0 };
  for (const source of sources) gatherRings(source, whole, options, null, budget);
  if (budget.impressions === 0) return 0;

  const nx = Math.max(1, Math.ceil((range.x1Mm - range.x0Mm) / AREA_TILE_MAX_MM));
  const ny = Math.max(1, Math.ceil((yEnd - yStart) / AREA_TILE_MAX_MM));
  const w = (range.x1Mm - range.x0Mm) / nx;
  const h = (yEnd - yStart) / ny;
  let area = 0;
  for (let a = 0; a < nx; a++) {
    for (let b = 0; b < ny; b++) {
      const tile: Tile = {
        x0Mm: range.x0Mm + a * w,
        x1Mm: a === nx - 1 ? range.x1Mm : range.x0Mm + (a + 1) * w,
        y0Mm: yStart + b * h,
        y1Mm: b === ny - 1 ? yEnd : yStart + (b + 1) * h,
      };
      const rings: Float64Array[] = [];
      for (const source of sources) gatherRings(source, tile, options, rings, null);
      area += backend.unionArea(rings);
    }
  }
  return area / (S * S);
}
