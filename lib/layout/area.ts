import ClipperLib, { type Path, type Paths } from "clipper-lib";
import { layoutError } from "./errors";
import { applyAffine, determinant } from "./geometry";
import { countOf, intersectRanges, overlapRange, type Grid, type IndexRange, type PlacedSet } from "./grid";
import { AREA_WINDOW_MAX_IMPRESSIONS, AREA_WINDOW_MAX_VERTICES, CLIPPER_UNITS_PER_MM } from "./limits";
import type { StampShape } from "./outline";

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

export interface WindowOptions {
  /** Take every row of the infinite layout (a period strip) instead of the rows stamped on the piece. */
  periodic: boolean;
  /** Only impressions cut at a band side edge. */
  partialOnly?: boolean;
}

/** Union of wax shapes inside one window of the band, in window-local integer coordinates (x from the band centre). */
export interface WindowUnion {
  paths: Paths;
  yStartMm: number;
  x0: number;
  x1: number;
}

const S = CLIPPER_UNITS_PER_MM;

function rect(x0: number, x1: number, y0: number, y1: number): Path {
  return [
    { X: x0, Y: y0 },
    { X: x1, Y: y0 },
    { X: x1, Y: y1 },
    { X: x0, Y: y1 },
  ];
}

function pathsArea(paths: Paths): number {
  let area = 0;
  for (const path of paths) area += ClipperLib.Clipper.Area(path);
  return Math.abs(area) / (S * S);
}

/**
 * The union of the wax shapes of all impressions reaching into the window y ∈ [yStart, yEnd] (mm), cut to the band
 * and the window, overlaps merged. One clipper-lib call (non-zero fill; every impression winds +1 inside its wax)
 * on a 0.1 µm grid, in coordinates local to the window so that integers stay in clipper's fast range.
 */
export function windowUnion(grid: Grid, prepared: PreparedSet[], yStart: number, yEnd: number, options: WindowOptions): WindowUnion {
  const { pattern, bandX0Mm, bandX1Mm, originXMm } = grid;
  const xc = (bandX0Mm + bandX1Mm) / 2;
  const x0 = Math.round((bandX0Mm - xc) * S);
  const x1 = Math.round((bandX1Mm - xc) * S);
  const bandLeft = bandX0Mm - xc;
  const bandRight = bandX1Mm - xc;
  const height = yEnd - yStart;
  const subject: Paths = [];
  let impressions = 0;
  let vertices = 0;

  for (const { set, rings, vertexCount } of prepared) {
    const wax = set.placement.wax;
    let rows: IndexRange = overlapRange(yStart, yEnd, wax.y0, wax.y1, pattern.periodYMm);
    if (!options.periodic) rows = intersectRanges(rows, set.memberY);
    const columns = intersectRanges(
      set.memberX,
      overlapRange(bandX0Mm, bandX1Mm, originXMm + wax.x0, originXMm + wax.x1, pattern.pitchXMm),
    );
    const perRow = options.partialOnly
      ? countOf(columns) - countOf(intersectRanges(columns, set.insideX))
      : countOf(columns);
    const added = countOf(rows) * perRow;
    if (added === 0) continue;
    impressions += added;
    vertices += added * vertexCount;
    guard(grid, impressions, vertices);

    for (let j = rows.first; j <= rows.last; j++) {
      const dy = j * pattern.periodYMm - yStart;
      for (let i = columns.first; i <= columns.last; i++) {
        if (options.partialOnly && i >= set.insideX.first && i <= set.insideX.last) continue;
        const dx = originXMm + i * pattern.pitchXMm - xc;
        const inside =
          wax.x0 + dx >= bandLeft && wax.x1 + dx <= bandRight && wax.y0 + dy >= 0 && wax.y1 + dy <= height;
        for (const ring of rings) {
          const points = inside ? shifted(ring, dx, dy) : clipToRect(ring, dx, dy, bandLeft, bandRight, 0, height);
          const n = points.length / 2;
          if (n < 3) continue;
          const path: Path = new Array(n);
          for (let k = 0; k < n; k++) path[k] = { X: Math.round(points[2 * k] * S), Y: Math.round(points[2 * k + 1] * S) };
          subject.push(path);
        }
      }
    }
  }
  const paths: Paths = [];
  if (subject.length > 0 && yEnd > yStart) {
    const clipper = new ClipperLib.Clipper();
    clipper.AddPaths(subject, ClipperLib.PolyType.ptSubject, true);
    clipper.AddPath(rect(x0, x1, 0, Math.round((yEnd - yStart) * S)), ClipperLib.PolyType.ptClip, true);
    clipper.Execute(ClipperLib.ClipType.ctIntersection, paths, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
  }
  return { paths, yStartMm: yStart, x0, x1 };
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

/** Area (mm²) of a window union, optionally only between y = fromMm and y = toMm (cloth coordinates). */
export function unionArea(u: WindowUnion, fromMm?: number, toMm?: number): number {
  if (fromMm === undefined || toMm === undefined) return pathsArea(u.paths);
  if (toMm <= fromMm || u.paths.length === 0) return 0;
  const clipper = new ClipperLib.Clipper();
  clipper.AddPaths(u.paths, ClipperLib.PolyType.ptSubject, true);
  const y0 = Math.round((fromMm - u.yStartMm) * S);
  const y1 = Math.round((toMm - u.yStartMm) * S);
  clipper.AddPath(rect(u.x0, u.x1, y0, y1), ClipperLib.PolyType.ptClip, true);
  const part: Paths = [];
  clipper.Execute(ClipperLib.ClipType.ctIntersection, part, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
  return pathsArea(part);
}

/** Waxed area (mm², before the coverage factor) inside the band between y = yStart and y = yEnd; see windowUnion. */
export function windowWaxArea(grid: Grid, prepared: PreparedSet[], yStart: number, yEnd: number, options: WindowOptions): number {
  return unionArea(windowUnion(grid, prepared, yStart, yEnd, options));
}

function guard(grid: Grid, impressions: number, vertices: number) {
  if (impressions > AREA_WINDOW_MAX_IMPRESSIONS) {
    const { pattern } = grid;
    const overlapX = pattern.unit.widthMm / pattern.pitchXMm;
    const overlapY = pattern.unit.heightMm / pattern.rowPitchMm;
    throw layoutError(overlapX >= overlapY ? "gap.xMm" : "gap.yMm", "layoutTooDense", {
      impressions,
      max: AREA_WINDOW_MAX_IMPRESSIONS,
    });
  }
  if (vertices > AREA_WINDOW_MAX_VERTICES) {
    throw layoutError("stamp.outline", "layoutTooComplex", { vertices, max: AREA_WINDOW_MAX_VERTICES });
  }
}

export interface WaxAreas {
  /** Waxed area of one face of one piece, mm² (coverage factor applied). */
  pieceMm2: number;
  /** Waxed area of one face in one period of the infinite layout, mm². */
  periodMm2: number;
  /** Part of periodMm2 laid by impressions cut at the band's side edges (overlaps among them once), mm². */
  partialPeriodMm2: number;
}

/**
 * Waxed area of one face, using that the layout repeats every period P down the length (cost independent of L).
 * The wax shape lies inside its footprint, so an impression the piece ends leave out or cut reaches at most
 * `reach` (the tallest footprint) into the piece. Whole edges: one union over [0, reach + P] gives the head
 * [0, reach] and one full period strip; a second union gives the tail [reach + n·P, L], n = ⌊(L − 2·reach) / P⌋;
 * area = head + n × period + tail. Clip edges: the stamped impressions cut to the piece are exactly the infinite
 * layout cut to [0, L], so one union over a period strip [0, P] gives area = n × period + (its part below L − n·P),
 * n = ⌊L / P⌋. Pieces too short for this are computed in one window.
 */
export function waxAreas(grid: Grid, shape: StampShape): WaxAreas {
  const prepared = prepareSets(grid, shape);
  const P = grid.pattern.periodYMm;
  const L = grid.pieceLengthMm;
  const factor = shape.areaFactor;
  const reach = Math.max(...grid.sets.map(({ placement: p }) => p.footprint.y1 - p.footprint.y0)) + 1e-3;
  const partialPeriodMm2 =
    grid.edges === "clip" ? windowWaxArea(grid, prepared, 0, P, { periodic: true, partialOnly: true }) * factor : 0;

  if (grid.edges === "clip") {
    const strip = windowUnion(grid, prepared, 0, P, { periodic: true });
    const periodMm2 = unionArea(strip) * factor;
    const periods = Math.floor(L / P);
    const rest = unionArea(strip, 0, L - periods * P) * factor;
    return { pieceMm2: periods * periodMm2 + rest, periodMm2, partialPeriodMm2 };
  }

  const periods = Math.floor((L - 2 * reach) / P);
  if (periods < 1) {
    const periodMm2 = windowWaxArea(grid, prepared, 0, P, { periodic: true }) * factor;
    const pieceMm2 = windowWaxArea(grid, prepared, 0, L, { periodic: false }) * factor;
    return { pieceMm2, periodMm2, partialPeriodMm2 };
  }
  const headAndStrip = windowUnion(grid, prepared, 0, reach + P, { periodic: false });
  const head = unionArea(headAndStrip, 0, reach) * factor;
  const periodMm2 = unionArea(headAndStrip, reach, reach + P) * factor;
  const tail = windowWaxArea(grid, prepared, reach + periods * P, L, { periodic: false }) * factor;
  return { pieceMm2: head + periods * periodMm2 + tail, periodMm2, partialPeriodMm2 };
}
