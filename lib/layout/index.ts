import type { z } from "zod";
import { layoutInputSchema } from "@/lib/validation/layout";
import { buildPattern } from "./arrangements";
import { waxAreas } from "./area";
import { LayoutInputError, layoutError, type LayoutIssue } from "./errors";
import { fitTable } from "./fit";
import { buildGrid, perMetreCounts, pieceCounts, rowDetails } from "./grid";
import { listImpressions } from "./impressions";
import { EPS_MM } from "./limits";
import { buildStampShape } from "./outline";
import { previewSvg } from "./preview";
import { pathNameOf, planeGroupOf } from "./symmetry";
import type { LayoutInput, LayoutResult, LayoutSpec } from "./types";

export { LayoutInputError } from "./errors";
export type { LayoutIssue } from "./errors";
export type * from "./types";

/** Interpolation values of a zod issue, named as the catalogue's placeholders ({min}, {max}, {options}, …). */
function issueParams(issue: z.core.$ZodIssue): Record<string, number | string | boolean> {
  const params: Record<string, number | string | boolean> = {};
  switch (issue.code) {
    case "too_small":
      params.min = Number(issue.minimum);
      break;
    case "too_big":
      params.max = Number(issue.maximum);
      break;
    case "invalid_type":
      params.expected = String(issue.expected);
      break;
    case "invalid_value":
      params.options = issue.values.map(String).join(", ");
      break;
    case "custom":
      for (const [key, v] of Object.entries(issue.params ?? {})) {
        if (typeof v === "number" || typeof v === "string" || typeof v === "boolean") params[key] = v;
      }
      break;
  }
  return params;
}

/** Parses engine input with the shared zod schema; any problem becomes a LayoutInputError listing every field. */
export function parseLayoutInput(input: unknown): LayoutSpec {
  const parsed = layoutInputSchema.safeParse(input);
  if (parsed.success) return parsed.data;
  const issues: LayoutIssue[] = parsed.error.issues.map((issue) => ({
    field: issue.path.map(String).join("."),
    code: issue.message.replace(/^validation\./, ""),
    messageKey: issue.message,
    params: issueParams(issue),
  }));
  throw new LayoutInputError(issues);
}

/**
 * Computes the stamping layout of a stamp on a cloth (all lengths mm, areas m²). Band = cloth width − margins;
 * repeat cell = stamp + gap. Counts are exact for the run (pieces restart the layout); per-metre figures are
 * long-run averages of one period; waxed area = union of the wax shapes of all impressions clipped to the band,
 * overlaps counted once, found on one period strip plus the head and tail and multiplied (cost independent of
 * length). Faces: sides = 2 doubles impressions and wax (the back registered through the cloth).
 * Throws LayoutInputError (field, code, params) for input it cannot lay out; never any other error for bad input.
 */
export function computeLayout(input: LayoutInput): LayoutResult {
  const spec = parseLayoutInput(input);
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
  const areas = waxAreas(grid, shape);
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
