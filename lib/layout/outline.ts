import ClipperLib, { type Paths } from "clipper-lib";
import paper from "paper";
import { layoutError } from "./errors";
import { boxOfPoints, ringArea, type Box, type Ring } from "./geometry";
import {
  CLIPPER_UNITS_PER_MM,
  FLATTEN_TOLERANCE_MM,
  OUTLINE_FOOTPRINT_SLACK_MM,
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

/**
 * Checks SVG path data syntax (SVG 1.1 path grammar, except arc flags must be separated numbers).
 * paper.js skips characters it does not understand, so bad data must be caught before it.
 * Returns the offending character offset, or -1 when the data is well formed.
 */
export function pathDataErrorAt(d: string): number {
  let i = 0;
  let command = "";
  let args: number[] = [];
  let commandAt = 0;
  let first = true;
  const finish = (): boolean => {
    if (command === "") return true;
    const arity = ARITY[command.toLowerCase()];
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
  while (true) {
    SEPARATOR.lastIndex = i;
    SEPARATOR.exec(d);
    i = SEPARATOR.lastIndex;
    if (i >= d.length) break;
    const ch = d[i];
    if (/[a-z]/i.test(ch)) {
      if (!(ch.toLowerCase() in ARITY)) return i;
      if (!finish()) return commandAt;
      if (first && ch.toLowerCase() !== "m") return i;
      first = false;
      command = ch;
      commandAt = i;
      args = [];
      i++;
      continue;
    }
    NUMBER.lastIndex = i;
    const match = NUMBER.exec(d);
    if (!match || command === "") return i;
    const value = Number(match[0]);
    if (!Number.isFinite(value)) return i;
    args.push(value);
    i = NUMBER.lastIndex;
  }
  if (first) return 0;
  return finish() ? -1 : commandAt;
}

let scope: paper.PaperScope | null = null;

function paperScope(): paper.PaperScope {
  if (!scope) {
    scope = new paper.PaperScope();
    scope.setup(new scope.Size(1, 1));
  }
  return scope;
}

/** Flattens path data with paper.js into rings (mm); curves and arcs become chords within `toleranceMm`. */
export function flattenPathData(d: string, toleranceMm = FLATTEN_TOLERANCE_MM): Ring[] {
  const ps = paperScope();
  const item = new ps.CompoundPath({ pathData: d, insert: false });
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
  const errorAt = pathDataErrorAt(d);
  if (errorAt >= 0) throw layoutError(field, "outlineInvalid", { position: errorAt });

  let flat: Ring[];
  try {
    flat = polylineRings(d) ?? flattenPathData(d);
  } catch {
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
