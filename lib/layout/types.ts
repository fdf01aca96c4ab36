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

/** One impression in the requested window, with the map from stamp to cloth coordinates. */
export interface Impression {
  face: "front" | "back";
  /** Row type and the running row number from the start of the piece (0-based; negative for rows cut at the head). */
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

/** Result of `computeLayout`. The first block is the answer of POST /api/v1/layout (SPEC section 6). */
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

  arrangement: Arrangement;
  pathName: PathName | null;
  edges: "whole" | "clip";
  sides: 1 | 2;
  bandWidthMm: number;
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
