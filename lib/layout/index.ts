import { z } from "@/lib/zod";
import { issueMessage, issuePath } from "@/lib/errors";
import { buildPattern } from "./arrangements";
import { areaSource, fieldDenseField, waxAreas } from "./area";
import { LayoutInputError, layoutError, type LayoutIssue } from "./errors";
import { fitTable } from "./fit";
import { planBorders } from "./borders";
import { buildGrid, perMetreCounts, rowDetails } from "./grid";
import { listImpressions } from "./impressions";
import { bandLeftover, layerResult, measureBorder, measureOverlaps, type MeasuredLayer } from "./layers";
import { EPS_MM } from "./limits";
import { buildStampShape, type StampShape } from "./outline";
import { polygonBackend, type PolygonBackend } from "./polygon";
import { previewSvg } from "./preview";
import { bordersSchema, checkGap, layoutInputSchema, stampSizeSchema } from "./schema";
import { pathNameOf, planeGroupOf } from "./symmetry";
import type { Impression, LayerName, LayerOverlap, LayerResult, LayoutInput, LayoutResult, LayoutSpec, StampSize } from "./types";

export { LayoutInputError } from "./errors";
export { pathNameOf } from "./symmetry";
export { ARRANGEMENTS } from "./schema";
export { initLayoutEngine, polygonBackend, polygonBackendFailure, type PolygonBackend } from "./polygon";
export type { LayoutIssue } from "./errors";
export type * from "./types";

/** The gap rule alone, for a stamp that was not part of the parsed input. */
const gapCheckSchema = z.custom<{ stamp: StampSize; gap: { xMm: number; yMm: number } }>().superRefine(checkGap);

function toLayoutIssues(issues: readonly z.core.$ZodIssue[], prefix = ""): LayoutIssue[] {
  return issues.map((issue) => {
    const { key, values } = issueMessage(issue);
    return { field: prefix + issuePath(issue), code: key.replace(/^(validation|layout)\./, ""), messageKey: key, params: values };
  });
}

/** Parses engine input with the engine's own schema; any problem becomes a LayoutInputError listing every field. */
export function parseLayoutInput(input: unknown): LayoutSpec {
  const parsed = layoutInputSchema.safeParse(input);
  if (parsed.success) return parsed.data;
  throw new LayoutInputError(toLayoutIssues(parsed.error.issues));
}

/**
 * A parsed layout whose stamp comes from elsewhere (a library stamp's sizes and outline): checks that
 * stamp and the gaps it allows, as parsing the whole input would, and returns the engine input.
 */
export function withStamp(layout: Omit<LayoutSpec, "stamp">, stamp: unknown): LayoutSpec {
  const parsed = stampSizeSchema.safeParse(stamp);
  if (!parsed.success) throw new LayoutInputError(toLayoutIssues(parsed.error.issues, "stamp."));
  const checked = gapCheckSchema.safeParse({ stamp: parsed.data, gap: layout.gap });
  if (!checked.success) throw new LayoutInputError(toLayoutIssues(checked.error.issues));
  return { ...layout, stamp: parsed.data as StampSize };
}

/**
 * A parsed layout whose borders' stamps came from elsewhere (library stamps by code): checks the borders as
 * parsing the whole input would (each repeat needs its stamp's size) and returns the engine input.
 */
export function withBorders(layout: LayoutSpec, borders: unknown): LayoutSpec {
  const parsed = bordersSchema.safeParse(borders);
  if (!parsed.success) throw new LayoutInputError(toLayoutIssues(parsed.error.issues, "borders."));
  return { ...layout, borders: parsed.data };
}

/**
 * Computes the stamping layout of a stamp on a cloth (all lengths mm, areas m²). Band = cloth width − margins;
 * repeat cell = stamp + gap. Counts are exact for the run (pieces restart the layout); per-metre figures are
 * long-run averages of one period; waxed area = union of the wax shapes of all impressions clipped to the band,
 * overlaps counted once, found on one period strip plus the head and tail and multiplied (cost independent of
 * length). Faces: sides = 2 doubles impressions and wax (the back registered through the cloth).
 * Throws LayoutInputError (field, code, params) for input it cannot lay out; never any other error for bad input.
 */
export function computeLayout(input: LayoutInput, options: LayoutOptions = {}): LayoutResult {
  return layoutOf(parseLayoutInput(input), options);
}

export interface LayoutOptions {
  /** The polygon backend for the waxed areas; default the fastest one loaded (see `initLayoutEngine`). */
  polygons?: PolygonBackend;
}

/** What every use of a parsed layout starts from: the checks, the stamp's shape, the field and border grids. */
function prepare(spec: LayoutSpec) {
  const { cloth, stamp, gap } = spec;
  const bandX0 = cloth.margins.leftMm;
  const bandX1 = cloth.widthMm - cloth.margins.rightMm;
  const band = bandX1 - bandX0;
  const pieces = cloth.lengthMm !== undefined ? 1 : (cloth.pieces ?? 1);
  const pieceLength = cloth.lengthMm ?? cloth.pieceLengthMm ?? 0;
  const lengthField = cloth.lengthMm !== undefined ? "cloth.lengthMm" : "cloth.pieceLengthMm";

  const shape = stampShape(stamp);
  const pattern = buildPattern(
    {
      arrangement: spec.arrangement,
      widthMm: stamp.widthMm,
      heightMm: stamp.heightMm,
      gapXMm: gap.xMm,
      gapYMm: gap.yMm,
      diagonalStep: spec.diagonalStep,
      rotationOrder: spec.rotationOrder,
    },
    shape.box,
  );
  const widest = Math.max(...pattern.placements.map((p) => p.footprint.x1 - p.footprint.x0));
  if (widest > band + EPS_MM) {
    throw layoutError("stamp.widthMm", "stampWiderThanBand", { stampWidthMm: widest, bandWidthMm: band });
  }
  const tallest = Math.max(...pattern.placements.map((p) => p.footprint.y1 - p.footprint.y0));
  if (tallest > pieceLength + EPS_MM) {
    throw layoutError(lengthField, "stampLongerThanRun", { stampHeightMm: tallest, lengthMm: pieceLength });
  }
  const plan = planBorders(spec.borders, bandX0, bandX1, pieceLength, spec.edges, lengthField, stampShape);
  const fieldX0 = plan.fieldX0Mm;
  const fieldX1 = plan.fieldX1Mm;
  if (widest > fieldX1 - fieldX0 + EPS_MM) {
    throw layoutError("stamp.widthMm", "stampWiderThanFieldBand", { stampWidthMm: widest, fieldBandWidthMm: fieldX1 - fieldX0 });
  }
  const grid = buildGrid(pattern, fieldX0, fieldX1, pieceLength, spec.align, spec.edges);
  return { bandX0, bandX1, band, pieces, pieceLength, shape, pattern, plan, fieldX0, fieldX1, grid };
}

/** The window [startMm, startMm + lengthMm) of one piece, cut to the piece; refused when it starts past the end. */
function windowOf(window: { startMm: number; lengthMm: number }, pieceLength: number) {
  if (window.startMm >= pieceLength) {
    throw layoutError("window.startMm", "windowOutsideRun", { lengthMm: pieceLength });
  }
  return { startMm: window.startMm, endMm: Math.min(pieceLength, window.startMm + window.lengthMm) };
}

// A planner's picture asks for a new window at every pan and zoom: the stamp's shape (an outline parsed and
// flattened) is kept for the last few stamps, so only the cheap impression list is made again.
const shapeCache = new Map<string, StampShape>();
const SHAPE_CACHE_SIZE = 8;

function stampShape(stamp: StampSize, field?: string): StampShape {
  const key = JSON.stringify([stamp.widthMm, stamp.heightMm, stamp.coverage ?? null, stamp.fillRule ?? "nonzero", field ?? "", stamp.outline ?? null]);
  const known = shapeCache.get(key);
  if (known) return known;
  const shape = buildStampShape(stamp, field);
  if (shapeCache.size >= SHAPE_CACHE_SIZE) shapeCache.delete(shapeCache.keys().next().value!);
  shapeCache.set(key, shape);
  return shape;
}

/** One layer of a picture: the strip its impressions are cut to and its stamp's wax shape (mm, stamp coordinates). */
export interface PictureLayer {
  layer: LayerName;
  x0Mm: number;
  x1Mm: number;
  stampWidthMm: number;
  stampHeightMm: number;
  /** Path data of the wax shape (the outline, or the footprint rectangle) and its fill rule. */
  pathData: string;
  fillRule: "nonzero" | "evenodd";
  /** The coverage ratio when the shape is the bare footprint, else 1. */
  areaFactor: number;
  source: StampShape["source"];
}

/** What a picture of one window of the first piece needs: the cloth, band and layers, and the impressions in it. */
export interface LayoutPicture {
  clothWidthMm: number;
  bandMm: { x0: number; x1: number };
  fieldBandMm: { x0: number; x1: number };
  pieceLengthMm: number;
  sides: 1 | 2;
  window: { startMm: number; endMm: number };
  layers: PictureLayer[];
  impressions: Impression[];
}

/**
 * The impressions of a window of the first piece (both faces when sides = 2) and the layers to draw them with,
 * without measuring any area: cheap enough for every pan and zoom of a picture. Same checks as layoutOf.
 */
export function layoutPicture(spec: LayoutSpec, window: { startMm: number; lengthMm: number } = spec.window): LayoutPicture {
  const p = prepare(spec);
  const w = windowOf(window, p.pieceLength);
  const listed = [{ layer: "field" as const, grid: p.grid, shape: p.shape }, ...p.plan.borders.map((b) => ({ layer: b.layer, grid: b.grid, shape: b.shape }))];
  return {
    clothWidthMm: spec.cloth.widthMm,
    bandMm: { x0: p.bandX0, x1: p.bandX1 },
    fieldBandMm: { x0: p.fieldX0, x1: p.fieldX1 },
    pieceLengthMm: p.pieceLength,
    sides: spec.sides,
    window: w,
    layers: listed.map((l) => ({
      layer: l.layer,
      x0Mm: l.grid.bandX0Mm,
      x1Mm: l.grid.bandX1Mm,
      stampWidthMm: l.shape.widthMm,
      stampHeightMm: l.shape.heightMm,
      pathData: l.shape.pathData,
      fillRule: l.shape.fillRule,
      areaFactor: l.shape.areaFactor,
      source: l.shape.source,
    })),
    impressions: listImpressions(listed, w.startMm, w.endMm, spec.sides, spec.cloth.widthMm),
  };
}

/** As computeLayout, for input already parsed with the engine's schema (the API parses its body once). */
export function layoutOf(spec: LayoutSpec, options: LayoutOptions = {}): LayoutResult {
  const { cloth, stamp, gap, sides } = spec;
  const { bandX0, bandX1, band, pieces, pieceLength, shape, pattern, plan, fieldX0, fieldX1, grid } = prepare(spec);
  const { startMm: windowStart, endMm: windowEnd } = windowOf(spec.window, pieceLength);

  const backend = options.polygons ?? polygonBackend();
  const rows = rowDetails(grid);
  const perMetre = perMetreCounts(grid);
  const source = areaSource(grid, shape, { dense: fieldDenseField(grid), complex: "stamp.outline" });
  const field: MeasuredLayer = { layer: "field", grid, shape, source, areas: waxAreas(backend, source, shape) };
  const borders = plan.borders.map((b) => measureBorder(backend, b));
  const overlaps = measureOverlaps(backend, field, borders, sides);
  const layers = [field, ...borders].map((m) => layerResult(m, pieces, sides));
  const sum = (pick: (l: LayerResult) => number) => layers.reduce((t, l) => t + pick(l), 0);
  const shared = (pick: (o: LayerOverlap) => number) => overlaps.reduce((t, o) => t + pick(o), 0);
  const waxedAreaPerMetreM2 = sum((l) => l.waxedAreaPerMetreM2) - shared((o) => o.perMetreM2);
  const impressionsWholeTotal = sum((l) => l.impressionsWholeTotal);
  const impressionsClippedTotal = sum((l) => l.impressionsClippedTotal);
  const wholePerMetre = perMetre.whole * sides + sum((l) => (l.layer === "field" ? 0 : l.impressionsPerMetre));

  const result: LayoutResult = {
    across: Math.max(...rows.map((r) => r.whole)),
    rowsPerMetre: 1000 / pattern.rowPitchMm,
    impressionsPerMetre: sum((l) => l.impressionsPerMetre),
    impressionsTotal: impressionsWholeTotal + impressionsClippedTotal,
    leftover: bandLeftover(layers, bandX0, bandX1),
    waxedAreaPerMetreM2,
    waxedAreaTotalM2: sum((l) => l.waxedAreaTotalM2) - shared((o) => o.pieceM2) * pieces,
    group: planeGroupOf(pattern),
    layers,
    overlaps,
    arrangement: spec.arrangement,
    pathName: pathNameOf(spec.arrangement),
    edges: spec.edges,
    sides,
    bandWidthMm: band,
    fieldBandMm: { x0: fieldX0, x1: fieldX1 },
    runLengthMm: pieceLength * pieces,
    pieces,
    pieceLengthMm: pieceLength,
    cell: pattern.cell,
    periodMm: pattern.periodYMm,
    rows,
    wholeImpressionsPerMetre: wholePerMetre,
    clippedImpressionsPerMetre: sum((l) => l.impressionsPerMetre) - wholePerMetre,
    impressionsWholeTotal,
    impressionsClippedTotal,
    impressionAreaMm2: shape.areaMm2,
    partialAreaPerMetreM2: (field.areas.partialPeriodMm2 * (1000 / pattern.periodYMm) * sides) / 1e6,
    coverageOfBand: (waxedAreaPerMetreM2 * 1e6) / sides / (1000 * band),
    fitTable: fitTable(pattern, fieldX1 - fieldX0, gap.xMm, stamp.widthMm),
    window: { startMm: windowStart, endMm: windowEnd },
  };

  if (spec.impressions || spec.preview) {
    const listed = [field, ...borders].map((m) => ({ layer: m.layer, grid: m.grid }));
    const list = listImpressions(listed, windowStart, windowEnd, sides, cloth.widthMm);
    if (spec.impressions) result.impressions = list;
    if (spec.preview) {
      const drawn = [field, ...borders].map((m) => ({ layer: m.layer, shape: m.shape, x0Mm: m.grid.bandX0Mm, x1Mm: m.grid.bandX1Mm }));
      result.preview = previewSvg(drawn, list, {
        clothWidthMm: cloth.widthMm,
        bandX0Mm: bandX0,
        bandX1Mm: bandX1,
        startMm: windowStart,
        endMm: windowEnd,
      });
    }
  }
  return result;
}
