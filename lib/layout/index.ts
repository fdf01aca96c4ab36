import { z } from "zod";
import { issueMessage, issuePath } from "@/lib/errors";
import { buildPattern } from "./arrangements";
import { areaSource, fieldDenseField, waxAreas } from "./area";
import { LayoutInputError, layoutError, type LayoutIssue } from "./errors";
import { fitTable } from "./fit";
import { buildGrid, perMetreCounts, pieceCounts, rowDetails } from "./grid";
import { listImpressions } from "./impressions";
import { EPS_MM } from "./limits";
import { buildStampShape } from "./outline";
import { polygonBackend, type PolygonBackend } from "./polygon";
import { previewSvg } from "./preview";
import { checkGap, layoutInputSchema, stampSizeSchema } from "./schema";
import { pathNameOf, planeGroupOf } from "./symmetry";
import type { LayoutInput, LayoutResult, LayoutSpec, StampSize } from "./types";

export { LayoutInputError } from "./errors";
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

/** As computeLayout, for input already parsed with the engine's schema (the API parses its body once). */
export function layoutOf(spec: LayoutSpec, options: LayoutOptions = {}): LayoutResult {
  const { cloth, stamp, gap, sides } = spec;
  const bandX0 = cloth.margins.leftMm;
  const bandX1 = cloth.widthMm - cloth.margins.rightMm;
  const band = bandX1 - bandX0;
  const pieces = cloth.lengthMm !== undefined ? 1 : (cloth.pieces ?? 1);
  const pieceLength = cloth.lengthMm ?? cloth.pieceLengthMm ?? 0;
  const lengthField = cloth.lengthMm !== undefined ? "cloth.lengthMm" : "cloth.pieceLengthMm";

  const shape = buildStampShape(stamp);
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
  const windowStart = spec.window.startMm;
  if (windowStart >= pieceLength) {
    throw layoutError("window.startMm", "windowOutsideRun", { lengthMm: pieceLength });
  }
  const windowEnd = Math.min(pieceLength, windowStart + spec.window.lengthMm);

  const grid = buildGrid(pattern, bandX0, bandX1, pieceLength, spec.align, spec.edges);
  const rows = rowDetails(grid);
  const stamped = rows.filter((r) => r.whole + r.clipped > 0);
  const perMetre = perMetreCounts(grid);
  const counts = pieceCounts(grid);
  const backend = options.polygons ?? polygonBackend();
  const areas = waxAreas(backend, areaSource(grid, shape, { dense: fieldDenseField(grid), complex: "stamp.outline" }), shape);
  const perMetreFactor = 1000 / pattern.periodYMm;

  const result: LayoutResult = {
    across: Math.max(...rows.map((r) => r.whole)),
    rowsPerMetre: 1000 / pattern.rowPitchMm,
    impressionsPerMetre: (perMetre.whole + perMetre.clipped) * sides,
    impressionsTotal: (counts.whole + counts.clipped) * pieces * sides,
    leftover: {
      leftMm: Math.min(...stamped.map((r) => r.leftover.leftMm)),
      rightMm: Math.min(...stamped.map((r) => r.leftover.rightMm)),
    },
    waxedAreaPerMetreM2: (areas.periodMm2 * perMetreFactor * sides) / 1e6,
    waxedAreaTotalM2: (areas.pieceMm2 * pieces * sides) / 1e6,
    group: planeGroupOf(pattern),
    arrangement: spec.arrangement,
    pathName: pathNameOf(spec.arrangement),
    edges: spec.edges,
    sides,
    bandWidthMm: band,
    runLengthMm: pieceLength * pieces,
    pieces,
    pieceLengthMm: pieceLength,
    cell: pattern.cell,
    periodMm: pattern.periodYMm,
    rows,
    wholeImpressionsPerMetre: perMetre.whole * sides,
    clippedImpressionsPerMetre: perMetre.clipped * sides,
    impressionsWholeTotal: counts.whole * pieces * sides,
    impressionsClippedTotal: counts.clipped * pieces * sides,
    impressionAreaMm2: shape.areaMm2,
    partialAreaPerMetreM2: (areas.partialPeriodMm2 * perMetreFactor * sides) / 1e6,
    coverageOfBand: areas.periodMm2 / (pattern.periodYMm * band),
    fitTable: fitTable(pattern, band, gap.xMm, stamp.widthMm),
    window: { startMm: windowStart, endMm: windowEnd },
  };

  if (spec.impressions || spec.preview) {
    const list = listImpressions(grid, windowStart, windowEnd, sides, cloth.widthMm);
    if (spec.impressions) result.impressions = list;
    if (spec.preview) {
      result.preview = previewSvg(shape, list, {
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
