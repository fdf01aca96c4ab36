import ClipperLib, { type Paths } from "clipper-lib";
import paper from "paper";
import { LayoutInputError, layoutError } from "./errors";
import { boxOfPoints, ringArea, type Box, type Ring } from "./geometry";
import {
  CLIPPER_UNITS_PER_MM,
  FLATTEN_TOLERANCE_MM,
  OUTLINE_FOOTPRINT_SLACK_MM,
  OUTLINE_MAX_SEGMENTS,
  OUTLINE_MAX_VERTICES,
  OUTLINE_MIN_AREA_MM2,
} from "./limits";
import { polylineRings } from "./polyline";

export type FillRule = "nonzero" | "evenodd";

/** The wax-bearing shape of one impression, in stamp coordinates (mm, origin at the footprint's top-left). */
export interface StampShape {
  widthMm: number;
  heightMm: number;
  /** Simple rings after flattening and resolving the fill rule: outer rings have positive shoelace area, holes negative. */
  rings: Ring[];
  /** Multiplier applied to every union area: the coverage ratio when the shape is the bare footprint, else 1. */
  areaFactor: number;
  /** Waxed area of a single impression, mm² (areaFactor applied). */
  areaMm2: number;
  box: Box;
  vertexCount: number;
  /** Path data of the shape for the preview (the outline as given, or the footprint rectangle). */
  pathData: string;
  fillRule: FillRule;
  source: "outline" | "coverage" | "footprint";
}

const ARITY: Record<string, number> = { m: 2, l: 2, h: 1, v: 1, c: 6, s: 4, q: 4, t: 2, a: 7, z: 0 };
const NUMBER = /[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?/y;
const SEPARATOR = /[\s,]*/y;

export interface PathDataScan {
  /** Offset of the first offending character, or -1 when the data is well formed (as far as it was read). */
  errorAt: number;
  /** Path segments read: each command and each implicit repeat of its arguments. */
  segments: number;
}

/**
 * Checks SVG path data syntax (SVG 1.1 path grammar, except arc flags must be separated numbers) and
 * counts its segments, in one linear pass that stops once `maxSegments` is passed.
 * paper.js skips characters it does not understand, so bad data must be caught before it.
 */
export function scanPathData(d: string, maxSegments = Number.POSITIVE_INFINITY): PathDataScan {
  let i = 0;
  let command = "";
  let arity = 0;
  let args: number[] = [];
  let commandAt = 0;
  let first = true;
  let segments = 0;
  const finish = (): boolean => {
    if (command === "") return true;
    if (arity === 0) return args.length === 0;
    if (args.length === 0 || args.length % arity !== 0) return false;
    if (command.toLowerCase() === "a") {
      for (let k = 0; k < args.length; k += 7) {
        if (args[k] < 0 || args[k + 1] < 0) return false;
        if (![0, 1].includes(args[k + 3]) || ![0, 1].includes(args[k + 4])) return false;
      }
    }
    return true;
  };
  while (segments <= maxSegments) {
    SEPARATOR.lastIndex = i;
    SEPARATOR.exec(d);
    i = SEPARATOR.lastIndex;
    if (i >= d.length) break;
    const ch = d[i];
    if (/[a-z]/i.test(ch)) {
      if (!(ch.toLowerCase() in ARITY)) return { errorAt: i, segments };
      if (!finish()) return { errorAt: commandAt, segments };
      if (first && ch.toLowerCase() !== "m") return { errorAt: i, segments };
      first = false;
      command = ch;
      arity = ARITY[ch.toLowerCase()];
      commandAt = i;
      args = [];
      if (arity === 0) segments++;
      i++;
      continue;
    }
    NUMBER.lastIndex = i;
    const match = NUMBER.exec(d);
    if (!match || command === "") return { errorAt: i, segments };
    const value = Number(match[0]);
    if (!Number.isFinite(value)) return { errorAt: i, segments };
    args.push(value);
    if (arity > 0 && args.length % arity === 0) segments++;
    i = NUMBER.lastIndex;
  }
  if (segments > maxSegments) return { errorAt: -1, segments };
  if (first) return { errorAt: 0, segments };
  return { errorAt: finish() ? -1 : commandAt, segments };
}

/** The offending character offset of malformed path data, or -1 when it is well formed. */
export function pathDataErrorAt(d: string): number {
  return scanPathData(d).errorAt;
}

let scope: paper.PaperScope | null = null;

function paperScope(): paper.PaperScope {
  if (!scope) {
    scope = new paper.PaperScope();
    scope.setup(new scope.Size(1, 1));
  }
  return scope;
}

/**
 * How many chords paper.js's flatten makes of one cubic curve (its 8 control values) at `toleranceMm`,
 * counted the way it works — halve until Curve.isFlatEnough holds, never below 1/256 of the curve —
 * without building any of them; stops counting past `budget`, so the cost stays bounded by the limit.
 */
function chordsOfCurve(curve: number[], toleranceMm: number, budget: number): number {
  const flat = 16 * toleranceMm * toleranceMm;
  const stack: [number[], number][] = [[curve, 1]];
  let chords = 0;
  while (stack.length && chords <= budget) {
    const [v, span] = stack.pop()!;
    const ux = 3 * v[2] - 2 * v[0] - v[6];
    const uy = 3 * v[3] - 2 * v[1] - v[7];
    const vx = 3 * v[4] - 2 * v[6] - v[0];
    const vy = 3 * v[5] - 2 * v[7] - v[1];
    if (span <= 1 / 256 || Math.max(ux * ux, vx * vx) + Math.max(uy * uy, vy * vy) <= flat) {
      chords++;
      continue;
    }
    // de Casteljau at t = 0.5
    const [x0, y0, x1, y1, x2, y2, x3, y3] = v;
    const ax = (x0 + x1) / 2, ay = (y0 + y1) / 2, bx = (x1 + x2) / 2, by = (y1 + y2) / 2, cx = (x2 + x3) / 2, cy = (y2 + y3) / 2;
    const dx = (ax + bx) / 2, dy = (ay + by) / 2, ex = (bx + cx) / 2, ey = (by + cy) / 2, fx = (dx + ex) / 2, fy = (dy + ey) / 2;
    stack.push([[fx, fy, ex, ey, cx, cy, x3, y3], span / 2], [[x0, y0, ax, ay, dx, dy, fx, fy], span / 2]);
  }
  return chords;
}

/** The vertices paper.js's flatten makes of a compound path at `toleranceMm`, counted without making them; stops past `max`. */
export function flattenedVertexCount(item: paper.CompoundPath, toleranceMm: number, max = Number.POSITIVE_INFINITY): number {
  let vertices = 0;
  for (const child of item.children as paper.Path[]) {
    for (const curve of child.curves) {
      if (vertices > max) return vertices;
      vertices += curve.isStraight() ? 1 : chordsOfCurve(curve.values, toleranceMm, max - vertices);
    }
  }
  return vertices;
}

/**
 * Flattens path data with paper.js into rings (mm); curves and arcs become chords within `toleranceMm`.
 * Refuses (outlineTooComplex) before flattening when that would make more than `maxVertices`.
 */
export function flattenPathData(d: string, toleranceMm = FLATTEN_TOLERANCE_MM, maxVertices = Number.POSITIVE_INFINITY): Ring[] {
  const ps = paperScope();
  const item = new ps.CompoundPath({ pathData: d, insert: false });
  if (flattenedVertexCount(item, toleranceMm, maxVertices) > maxVertices) {
    item.remove();
    throw layoutError("stamp.outline", "outlineTooComplex", { max: maxVertices });
  }
  item.flatten(toleranceMm);
  const rings: Ring[] = [];
  for (const child of item.children as paper.Path[]) {
    const ring: Ring = child.segments.map((s) => [s.point.x, s.point.y] as const);
    if (ring.length >= 3) rings.push(ring);
  }
  item.remove();
  return rings;
}

/** Rings on the polygon grid, less a whole-unit offset (the footprint's middle) that keeps clipper-lib in its fast range. */
function toClipper(rings: Ring[], cx: number, cy: number): Paths {
  return rings.map((r) => r.map(([x, y]) => ({ X: Math.round(x * CLIPPER_UNITS_PER_MM) - cx, Y: Math.round(y * CLIPPER_UNITS_PER_MM) - cy })));
}

/**
 * Resolves overlaps and the fill rule into simple rings (outer positive, holes negative by the shoelace formula)
 * cut to the footprint [0, w] × [0, h], mm: the copper cannot print outside its frame. clipper-lib on the polygon
 * grid (CLIPPER_UNITS_PER_MM).
 */
export function simplifyRings(rings: Ring[], fillRule: FillRule, widthMm: number, heightMm: number): Ring[] {
  const fill = fillRule === "evenodd" ? ClipperLib.PolyFillType.pftEvenOdd : ClipperLib.PolyFillType.pftNonZero;
  const cx = Math.round((widthMm / 2) * CLIPPER_UNITS_PER_MM);
  const cy = Math.round((heightMm / 2) * CLIPPER_UNITS_PER_MM);
  const footprint: Ring = [
    [0, 0],
    [widthMm, 0],
    [widthMm, heightMm],
    [0, heightMm],
  ];
  const frame = toClipper([footprint], cx, cy);
  const clipper = new ClipperLib.Clipper();
  clipper.AddPaths(toClipper(rings, cx, cy), ClipperLib.PolyType.ptSubject, true);
  clipper.AddPaths(frame, ClipperLib.PolyType.ptClip, true);
  const simple: Paths = [];
  clipper.Execute(ClipperLib.ClipType.ctIntersection, simple, fill, ClipperLib.PolyFillType.pftNonZero);
  const out: Ring[] = simple.map((path) => path.map((p) => [(p.X + cx) / CLIPPER_UNITS_PER_MM, (p.Y + cy) / CLIPPER_UNITS_PER_MM] as const));
  // Clipper gives holes the opposite turn of their outer ring; flip all so that outer rings come out positive.
  if (netArea(out) < 0) for (const ring of out) ring.reverse();
  return out;
}

/** Net shoelace area of rings, mm² (holes negative). */
export function netArea(rings: Ring[]): number {
  return rings.reduce((sum, ring) => sum + ringArea(ring), 0);
}

export interface StampInput {
  widthMm: number;
  heightMm: number;
  coverage?: number;
  outline?: string;
  fillRule?: FillRule;
}

/**
 * Builds the wax shape of a stamp: its outline (SVG path data in mm, flattened to FLATTEN_TOLERANCE_MM,
 * fill rule applied, cut to the footprint), else its footprint w × h with area factor = coverage ratio (1 when
 * absent). Throws LayoutInputError on path data that is malformed, has no area, is too complex, or strays more than
 * OUTLINE_FOOTPRINT_SLACK_MM outside the footprint, naming `field` (the outline's path in the input).
 */
export function buildStampShape(stamp: StampInput, field = "stamp.outline"): StampShape {
  const { widthMm, heightMm } = stamp;
  const fillRule = stamp.fillRule ?? "nonzero";
  if (stamp.outline === undefined) {
    const rect: Ring = [
      [0, 0],
      [widthMm, 0],
      [widthMm, heightMm],
      [0, heightMm],
    ];
    const areaFactor = stamp.coverage ?? 1;
    return {
      widthMm,
      heightMm,
      rings: [rect],
      areaFactor,
      areaMm2: widthMm * heightMm * areaFactor,
      box: { x0: 0, y0: 0, x1: widthMm, y1: heightMm },
      vertexCount: 4,
      pathData: `M0 0H${widthMm}V${heightMm}H0Z`,
      fillRule: "nonzero",
      source: stamp.coverage === undefined ? "footprint" : "coverage",
    };
  }

  const d = stamp.outline.trim();
  // The request schema caps the bytes (OUTLINE_MAX_BYTES); the segments are counted here, before paper.js parses anything.
  const scan = scanPathData(d, OUTLINE_MAX_SEGMENTS);
  if (scan.segments > OUTLINE_MAX_SEGMENTS) throw layoutError(field, "outlineTooManySegments", { max: OUTLINE_MAX_SEGMENTS });
  if (scan.errorAt >= 0) throw layoutError(field, "outlineInvalid", { position: scan.errorAt });

  let flat: Ring[];
  try {
    // Straight lines only: read directly (as many points as segments); curves go through paper.js's flatten.
    flat = polylineRings(d) ?? flattenPathData(d, FLATTEN_TOLERANCE_MM, OUTLINE_MAX_VERTICES);
  } catch (error) {
    if (error instanceof LayoutInputError) throw error;
    throw layoutError(field, "outlineInvalid", { position: 0 });
  }
  const vertexCount = flat.reduce((n, r) => n + r.length, 0);
  if (vertexCount > OUTLINE_MAX_VERTICES) {
    throw layoutError(field, "outlineTooComplex", { vertices: vertexCount, max: OUTLINE_MAX_VERTICES });
  }
  if (flat.length > 0) {
    const raw = boxOfPoints(flat.flat());
    const s = OUTLINE_FOOTPRINT_SLACK_MM;
    if (raw.x0 < -s || raw.y0 < -s || raw.x1 > widthMm + s || raw.y1 > heightMm + s) {
      throw layoutError(field, "outlineOutsideFootprint", {
        widthMm,
        heightMm,
        outlineX0Mm: raw.x0,
        outlineY0Mm: raw.y0,
        outlineX1Mm: raw.x1,
        outlineY1Mm: raw.y1,
      });
    }
  }
  const rings = flat.length > 0 ? simplifyRings(flat, fillRule, widthMm, heightMm) : [];
  const areaMm2 = netArea(rings);
  if (rings.length === 0 || areaMm2 < OUTLINE_MIN_AREA_MM2) {
    throw layoutError(field, "outlineNoArea", { minMm2: OUTLINE_MIN_AREA_MM2 });
  }
  const box = boxOfPoints(rings.flat());
  return {
    widthMm,
    heightMm,
    rings,
    areaFactor: 1,
    areaMm2,
    box,
    vertexCount: rings.reduce((n, r) => n + r.length, 0),
    pathData: d,
    fillRule,
    source: "outline",
  };
}
