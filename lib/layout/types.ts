import type { Affine } from "./geometry";
import type { Arrangement } from "./schema";

export type { Arrangement, LayoutInput, LayoutSpec, StampSize } from "./schema";

/** Plane symmetry group (International Tables for Crystallography, Vol. A) of a layout of an asymmetric motif. */
export type PlaneGroup = "p1" | "p2" | "p3" | "p4" | "p6" | "pm" | "pg";

/** Javanese name of the stamping path where one fits the arrangement. */
export type PathName = "tubruk" | "ondo-ende" | "parang" | "mubeng";

export interface Leftover {
  leftMm: number;
  rightMm: number;
}

/** One row type of the layout (rows of the same type repeat down the length). */
export interface RowDetail {
  /** Row type, 0-based, in stamping order within one period. */
  row: number;
  /** Offset of the row's cell below the period start, mm. */
  offsetYMm: number;
  /** Across shift of the row relative to row type 0, mm. */
  shiftXMm: number;
  /** Whole impressions across the band. */
  whole: number;
  /** Impressions cut at a band edge (clip mode only; 0 in whole mode). */
  clipped: number;
  leftover: Leftover;
}

/** For N repeats across: the gap, or the unit width at the current gap, that makes N fill the band exactly. */
export interface FitRow {
  across: number;
  /** Gap between units for N units of the current width; null when N = 1. */
  gapXMm: number | null;
  /** Whether that gap stays within the allowed gaps. */
  gapFeasible: boolean;
  /** Unit width (stamp, or rosette for rotation) that fills the band at the current gap. */
  unitWidthMm: number;
  /** The stamp width to make; null for rotation, where the unit is a rosette. */
  stampWidthMm: number | null;
  stampWidthFeasible: boolean;
  /** True for the current N. */
  current: boolean;
}

/** The layers of a layout: the field, and a border along each edge of the band when asked for. */
export type LayerName = "field" | "border-left" | "border-right";

/**
 * One layer's own figures, all faces. Each layer's areas are the union of that layer's impressions alone, cut to
 * its own band; where two layers overlap, the shared wax counts in both layers' figures and once in the layout's
 * totals (see `LayoutResult.overlaps`), so Σ layers − Σ overlaps = the totals.
 */
export interface LayerResult {
  layer: LayerName;
  /** A border's index in the input's `borders`. */
  border?: number;
  /** A border's stamp as laid: turned clockwise by rotationDeg after being mirrored when `mirrored`. */
  rotationDeg?: number;
  mirrored?: boolean;
  /** The layer's band on the cloth, mm from the left selvedge: the field band, or the strip a border takes. */
  bandMm: { x0: number; x1: number };
  /** Whole impressions across (the largest row); 1 for a border. */
  across: number;
  /** Length after which the layer repeats down the cloth, mm. */
  periodMm: number;
  impressionsPerMetre: number;
  impressionsTotal: number;
  impressionsWholeTotal: number;
  impressionsClippedTotal: number;
  waxedAreaPerMetreM2: number;
  waxedAreaTotalM2: number;
  /** Long-run waxed fraction of the layer's own band on one face, 0–1. */
  coverageOfBand: number;
  /** Waxed area of one impression, mm² (coverage applied). */
  impressionAreaMm2: number;
  /** Band left between the layer's band edges and its nearest impressions, mm. */
  leftover: Leftover;
}

/**
 * Wax two layers share (the field reaching under a border with a negative gap to the field), all faces.
 * Exact over the two layers' common period when they have one of at most OVERLAP_PERIOD_MAX_MM; otherwise
 * `exact` is false and the per-metre figure is the average over `windowMm` of cloth.
 */
export interface LayerOverlap {
  layers: [LayerName, LayerName];
  /** Where the two bands meet, mm from the left selvedge. */
  acrossMm: { x0: number; x1: number };
  perMetreM2: number;
  pieceM2: number;
  periodMm: number | null;
  windowMm: number;
  exact: boolean;
}

/** One impression in the requested window, with the map from stamp to cloth coordinates. */
export interface Impression {
  layer: LayerName;
  face: "front" | "back";
  /** Row type and the running row number from the start of the piece (0-based; negative for rows cut at the head); a border's row is its impression's number down the strip. */
  row: number;
  rowIndex: number;
  /** Footprint box on the cloth, mm (x from the left selvedge of this face, y from the start of the piece). */
  xMm: number;
  yMm: number;
  widthMm: number;
  heightMm: number;
  /** Stamp coordinates (mm, outline origin) → cloth coordinates, SVG matrix order [a, b, c, d, e, f]. */
  matrix: Affine;
  rotationDeg: number;
  mirrored: boolean;
  /** False when the impression is cut at a band edge or at an end of the piece (clip mode). */
  whole: boolean;
}

/**
 * Result of `computeLayout`. The first block is the answer of POST /api/v1/layout (SPEC section 6). The totals
 * (impressions, whole and cut impressions, waxed areas, coverage of the band) take every layer, the field and its
 * borders, with wax the layers share counted once; `leftover` is the band between each margin line and the nearest
 * impression of any layer. `across`, `rowsPerMetre`, `rows`, `cell`, `periodMm`, `group`, `fitTable`,
 * `impressionAreaMm2` and `partialAreaPerMetreM2` describe the field, laid on the field band.
 */
export interface LayoutResult {
  across: number;
  rowsPerMetre: number;
  impressionsPerMetre: number;
  impressionsTotal: number;
  leftover: Leftover;
  waxedAreaPerMetreM2: number;
  waxedAreaTotalM2: number;
  group: PlaneGroup;
  /** SVG markup of the window, when asked for. */
  preview?: string;
  /** Per-layer figures: the field first, then the left and the right border. */
  layers: LayerResult[];
  /** Wax shared between layers (empty unless the field reaches under a border). */
  overlaps: LayerOverlap[];

  arrangement: Arrangement;
  pathName: PathName | null;
  edges: "whole" | "clip";
  sides: 1 | 2;
  /** Band between the margins, and the field band left between the borders (the whole band without borders). */
  bandWidthMm: number;
  fieldBandMm: { x0: number; x1: number };
  /** Run length (pieces × piece length when given by pieces), and the length the layout restarts on. */
  runLengthMm: number;
  pieces: number;
  pieceLengthMm: number;
  /** Repeat cell (stamp + gap, or rosette + gap), mm. */
  cell: { widthMm: number; heightMm: number };
  /** Length after which the layout repeats and the row types in it. */
  periodMm: number;
  rows: RowDetail[];
  /** Long-run whole and cut impressions per metre, all faces. */
  wholeImpressionsPerMetre: number;
  clippedImpressionsPerMetre: number;
  impressionsWholeTotal: number;
  impressionsClippedTotal: number;
  /** Waxed area of one impression, mm² (coverage applied). */
  impressionAreaMm2: number;
  /** Wax laid by impressions cut at the band's side edges (inside the band, overlaps once), m² per metre, all faces. */
  partialAreaPerMetreM2: number;
  /** Long-run waxed fraction of the band on one face, 0–1. */
  coverageOfBand: number;
  fitTable: FitRow[];
  window: { startMm: number; endMm: number };
  impressions?: Impression[];
}
