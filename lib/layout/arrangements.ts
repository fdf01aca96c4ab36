import { layoutError } from "./errors";
import { simpleFraction } from "./fraction";
import { compose, mappedRectBox, rotation, translation, unionBox, type Affine, type Box } from "./geometry";
import { MIN_STEP_MM } from "./limits";
import type { Arrangement } from "./types";

/** One stamp placement of the repeating unit: it recurs at (i·pitchX, j·periodY) for all integers i, j. */
export interface Placement {
  /** Row type within one period along the length, 0-based. */
  row: number;
  /** Stamp coordinates → pattern coordinates (mm; x from the alignment origin, y from the start of the period). */
  matrix: Affine;
  /** Box of the footprint rectangle under `matrix`. */
  footprint: Box;
  /** Box of the wax shape under `matrix`. */
  wax: Box;
  rotationDeg: number;
  mirrored: boolean;
}

/** The repeating unit of an arrangement: a rectangular period holding one or more placements. */
export interface Pattern {
  arrangement: Arrangement;
  pitchXMm: number;
  periodYMm: number;
  rowsPerPeriod: number;
  rowPitchMm: number;
  /** Across shift of each row type relative to row 0, mm. */
  rowShiftXMm: number[];
  placements: Placement[];
  /** The unit repeated across, for the fit table: one stamp, or one rosette of turned copies. */
  unit: { kind: "stamp" | "rosette"; widthMm: number; heightMm: number };
  /** Unit + gap: the repeat cell, mm. */
  cell: { widthMm: number; heightMm: number };
  /** Rotation only: copies per rosette and whether the rosettes sit on a hexagonal lattice. */
  rotationOrder?: number;
  hexagonal: boolean;
  /** Diagonal only: the step as p/q of the repeat width. */
  diagonalStep?: { p: number; q: number };
}

export interface PatternSpec {
  arrangement: Arrangement;
  widthMm: number;
  heightMm: number;
  gapXMm: number;
  gapYMm: number;
  diagonalStep?: number;
  rotationOrder?: number;
}

/** Mirror left–right within a width w, and turn 180° within a w × h box (mm). */
export const MIRROR_X = (w: number): Affine => [-1, 0, 0, 1, w, 0];
export const TURN_180 = (w: number, h: number): Affine => [-1, 0, 0, -1, w, h];

/**
 * Builds the repeating unit of an arrangement (all mm). Repeat cell cw = w + gap x, ch = h + gap y.
 * straight: (cw, 0), (0, ch); half-drop: odd columns down ch/2; brick: odd rows across cw/2;
 * mirror: odd columns mirrored left–right; turnover: odd rows turned 180°; half-drop-mirror: odd columns
 * mirrored and down ch/2; diagonal: row k across by k·f·cw (f = p/q, period q rows); rotation: n copies
 * turned by 360°/n about the stamp's top-left corner form a rosette, laid on a rectangular lattice
 * (rosette box + gaps) for n = 2, 4 and on a hexagonal one (rows √3/2 pitch apart, plus gap y, odd rows
 * across half a pitch) for n = 3, 6. `waxBox` is the wax shape's box in stamp coordinates.
 */
export function buildPattern(spec: PatternSpec, waxBox: Box): Pattern {
  const { arrangement, widthMm: w, heightMm: h, gapXMm: gx, gapYMm: gy } = spec;
  const cw = w + gx;
  const ch = h + gy;
  const place = (row: number, m: Affine, rotationDeg = 0, mirrored = false): Placement => ({
    row,
    matrix: m,
    footprint: mappedRectBox(m, w, h),
    wax: mappedBox(m, waxBox),
    rotationDeg,
    mirrored,
  });
  const base = {
    arrangement,
    unit: { kind: "stamp" as const, widthMm: w, heightMm: h },
    cell: { widthMm: cw, heightMm: ch },
    hexagonal: false,
  };
  const identity = (dx: number, dy: number) => translation(dx, dy);

  switch (arrangement) {
    case "straight":
      return { ...base, pitchXMm: cw, periodYMm: ch, rowsPerPeriod: 1, rowPitchMm: ch, rowShiftXMm: [0], placements: [place(0, identity(0, 0))] };
    case "half-drop":
      return {
        ...base,
        pitchXMm: 2 * cw,
        periodYMm: ch,
        rowsPerPeriod: 1,
        rowPitchMm: ch,
        rowShiftXMm: [0],
        placements: [place(0, identity(0, 0)), place(0, identity(cw, ch / 2))],
      };
    case "brick":
      return {
        ...base,
        pitchXMm: cw,
        periodYMm: 2 * ch,
        rowsPerPeriod: 2,
        rowPitchMm: ch,
        rowShiftXMm: [0, cw / 2],
        placements: [place(0, identity(0, 0)), place(1, identity(cw / 2, ch))],
      };
    case "mirror":
      return {
        ...base,
        pitchXMm: 2 * cw,
        periodYMm: ch,
        rowsPerPeriod: 1,
        rowPitchMm: ch,
        rowShiftXMm: [0],
        placements: [place(0, identity(0, 0)), place(0, compose(identity(cw, 0), MIRROR_X(w)), 0, true)],
      };
    case "turnover":
      return {
        ...base,
        pitchXMm: cw,
        periodYMm: 2 * ch,
        rowsPerPeriod: 2,
        rowPitchMm: ch,
        rowShiftXMm: [0, 0],
        placements: [place(0, identity(0, 0)), place(1, compose(identity(0, ch), TURN_180(w, h)), 180)],
      };
    case "half-drop-mirror":
      return {
        ...base,
        pitchXMm: 2 * cw,
        periodYMm: ch,
        rowsPerPeriod: 1,
        rowPitchMm: ch,
        rowShiftXMm: [0],
        placements: [place(0, identity(0, 0)), place(0, compose(identity(cw, ch / 2), MIRROR_X(w)), 0, true)],
      };
    case "diagonal": {
      const step = simpleFraction(spec.diagonalStep ?? Number.NaN);
      if (!step || step.p <= 0 || step.p >= step.q) throw layoutError("diagonalStep", "notSimpleFraction");
      const shifts = Array.from({ length: step.q }, (_, k) => (((k * step.p) % step.q) / step.q) * cw);
      return {
        ...base,
        pitchXMm: cw,
        periodYMm: step.q * ch,
        rowsPerPeriod: step.q,
        rowPitchMm: ch,
        rowShiftXMm: shifts,
        placements: shifts.map((dx, k) => place(k, identity(dx, k * ch))),
        diagonalStep: step,
      };
    }
    case "rotation": {
      const n = spec.rotationOrder ?? 4;
      const turns = Array.from({ length: n }, (_, k) => rotation((360 * k) / n));
      const rosette = turns.map((m) => mappedRectBox(m, w, h)).reduce(unionBox);
      const toCell = translation(-rosette.x0, -rosette.y0);
      const rw = rosette.x1 - rosette.x0;
      const rh = rosette.y1 - rosette.y0;
      const pitchX = rw + gx;
      const hexagonal = n === 3 || n === 6;
      const rowPitch = hexagonal ? (pitchX * Math.sqrt(3)) / 2 + gy : rh + gy;
      if (rowPitch < MIN_STEP_MM) throw layoutError("gap.yMm", "gapTooNegative", { minStepMm: MIN_STEP_MM });
      const rosettePlacements = (row: number, dx: number, dy: number) =>
        turns.map((m, k) => place(row, compose(translation(dx, dy), compose(toCell, m)), (360 * k) / n));
      const common = {
        ...base,
        unit: { kind: "rosette" as const, widthMm: rw, heightMm: rh },
        cell: { widthMm: pitchX, heightMm: rowPitch },
        pitchXMm: pitchX,
        rowPitchMm: rowPitch,
        rotationOrder: n,
        hexagonal,
      };
      return hexagonal
        ? {
            ...common,
            periodYMm: 2 * rowPitch,
            rowsPerPeriod: 2,
            rowShiftXMm: [0, pitchX / 2],
            placements: [...rosettePlacements(0, 0, 0), ...rosettePlacements(1, pitchX / 2, rowPitch)],
          }
        : { ...common, periodYMm: rowPitch, rowsPerPeriod: 1, rowShiftXMm: [0], placements: rosettePlacements(0, 0, 0) };
    }
  }
}

/** Box of the box b after the map m. */
export function mappedBox(m: Affine, b: Box): Box {
  const w = b.x1 - b.x0;
  const h = b.y1 - b.y0;
  return mappedRectBox(compose(m, translation(b.x0, b.y0)), w, h);
}
