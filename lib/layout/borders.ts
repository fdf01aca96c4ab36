import { MIRROR_X, TURN_180, mappedBox, type Pattern, type Placement } from "./arrangements";
import { layoutError } from "./errors";
import { compose, mappedRectBox, rotation, translation, type Affine } from "./geometry";
import { buildGrid, type EdgeMode, type Grid } from "./grid";
import { EPS_MM } from "./limits";
import { buildStampShape, type StampShape } from "./outline";
import type { BorderSpec } from "./schema";

/** A border laid along one edge of the band: its stamp, its strip and its one-dimensional repeat down the length. */
export interface BorderLayer {
  layer: "border-left" | "border-right";
  /** Index of the border in the input's `borders` (refusals name its fields). */
  index: number;
  spec: BorderSpec;
  shape: StampShape;
  grid: Grid;
  /** The strip the border takes on the cloth, mm from the left selvedge. */
  x0Mm: number;
  x1Mm: number;
  /** The stamp as laid (after mirror and turn): across and along the length, mm; its repeat down the length, mm. */
  widthMm: number;
  heightMm: number;
  repeatMm: number;
  rotationDeg: number;
  mirrored: boolean;
}

export interface BorderPlan {
  borders: BorderLayer[];
  /** The field band left between the borders, mm from the left selvedge. */
  fieldX0Mm: number;
  fieldX1Mm: number;
}

/** Stamp → laid orientation: mirrored first, then turned clockwise as seen, moved back to a box at the origin. */
function laid(turn: number, mirror: boolean, w: number, h: number): { matrix: Affine; widthMm: number; heightMm: number } {
  const base = compose(rotation(turn), mirror ? MIRROR_X(w) : translation(0, 0));
  const box = mappedRectBox(base, w, h);
  return { matrix: compose(translation(-box.x0, -box.y0), base), widthMm: box.x1 - box.x0, heightMm: box.y1 - box.y0 };
}

/**
 * A border as a pattern of one placement: a single column (the pitch across is wider than the band, so only
 * column 0 ever touches the strip) repeating every `repeat` mm down the length, its first impression at startMm.
 */
function borderPattern(matrix: Affine, shape: StampShape, laidW: number, repeat: number, rotationDeg: number, mirrored: boolean, bandWidthMm: number): Pattern {
  const placement: Placement = {
    row: 0,
    matrix,
    footprint: mappedRectBox(matrix, shape.widthMm, shape.heightMm),
    wax: mappedBox(matrix, shape.box),
    rotationDeg,
    mirrored,
  };
  return {
    arrangement: "straight",
    pitchXMm: 2 * bandWidthMm + laidW + 1,
    periodYMm: repeat,
    rowsPerPeriod: 1,
    rowPitchMm: repeat,
    rowShiftXMm: [0],
    placements: [placement],
    unit: { kind: "stamp", widthMm: laidW, heightMm: repeat },
    cell: { widthMm: laidW, heightMm: repeat },
    hexagonal: false,
  };
}

/** How the right copy of a `both` border is laid relative to the left one: matrix (within the strip), turn and mirror. */
function rightCopy(spec: BorderSpec, m: Affine, w: number, h: number, turn: number, mirror: boolean) {
  switch (spec.rightCopy ?? "mirror") {
    case "mirror":
      return { matrix: compose(MIRROR_X(w), m), rotationDeg: (360 - turn) % 360, mirrored: !mirror };
    case "turn":
      return { matrix: compose(TURN_180(w, h), m), rotationDeg: (turn + 180) % 360, mirrored: mirror };
    case "same":
      return { matrix: m, rotationDeg: turn, mirrored: mirror };
  }
}

/**
 * Lays the borders on the band [bandX0, bandX1] of a piece (mm) and finds the field band between them: a left
 * border takes [bandX0 + offset, bandX0 + offset + w], a right one [bandX1 − offset − w, bandX1 − offset]
 * (w = the laid stamp's width), and the field band starts `gapToFieldMm` beyond each. Refuses, naming the field,
 * a border wider than the band, one longer than the piece, borders that overlap each other, a field band reaching
 * past the band's edge (a gap to the field more negative than the border and its offset), or no field band left.
 */
export function planBorders(
  borders: readonly BorderSpec[],
  bandX0Mm: number,
  bandX1Mm: number,
  pieceLengthMm: number,
  edges: EdgeMode,
  lengthField: string,
  shapeOf: (stamp: BorderSpec["stamp"], field: string) => StampShape = buildStampShape,
): BorderPlan {
  const band = bandX1Mm - bandX0Mm;
  const layers: BorderLayer[] = [];
  borders.forEach((spec, index) => {
    const field = (name: string) => `borders.${index}.${name}`;
    const shape = shapeOf(spec.stamp, field("stamp.outline"));
    const turned = spec.turn === 90 || spec.turn === 270;
    const base = laid(spec.turn, spec.mirror, spec.stamp.widthMm, spec.stamp.heightMm);
    const { widthMm: w, heightMm: h } = base;
    if (spec.offsetMm + w > band + EPS_MM) {
      const blame = w > band + EPS_MM ? field(turned ? "stamp.heightMm" : "stamp.widthMm") : field("offsetMm");
      throw layoutError(blame, "borderWiderThanBand", { borderWidthMm: w, offsetMm: spec.offsetMm, bandWidthMm: band });
    }
    if (h > pieceLengthMm + EPS_MM) {
      throw layoutError(lengthField, "borderLongerThanRun", { borderHeightMm: h, lengthMm: pieceLengthMm });
    }
    const repeat = h + spec.gapYMm;
    const start = translation(0, spec.startMm);
    const sides = spec.side === "both" ? (["left", "right"] as const) : [spec.side];
    for (const side of sides) {
      const copy =
        side === "right" && spec.side === "both"
          ? rightCopy(spec, base.matrix, w, h, spec.turn, spec.mirror)
          : { matrix: base.matrix, rotationDeg: spec.turn, mirrored: spec.mirror };
      const x0 = side === "left" ? bandX0Mm + spec.offsetMm : bandX1Mm - spec.offsetMm - w;
      const pattern = borderPattern(compose(start, copy.matrix), shape, w, repeat, copy.rotationDeg, copy.mirrored, band);
      layers.push({
        layer: side === "left" ? "border-left" : "border-right",
        index,
        spec,
        shape,
        grid: buildGrid(pattern, x0, x0 + w, pieceLengthMm, "left", edges),
        x0Mm: x0,
        x1Mm: x0 + w,
        widthMm: w,
        heightMm: h,
        repeatMm: repeat,
        rotationDeg: copy.rotationDeg,
        mirrored: copy.mirrored,
      });
    }
  });
  layers.sort((a, b) => (a.layer === b.layer ? 0 : a.layer === "border-left" ? -1 : 1));

  const left = layers.find((l) => l.layer === "border-left");
  const right = layers.find((l) => l.layer === "border-right");
  if (left && right && left.x1Mm > right.x0Mm + EPS_MM) {
    throw layoutError(`borders.${right.index}.offsetMm`, "bordersOverlap", {
      leftWidthMm: left.x1Mm - bandX0Mm,
      rightWidthMm: bandX1Mm - right.x0Mm,
      bandWidthMm: band,
    });
  }
  const fieldX0Mm = left ? left.x1Mm + left.spec.gapToFieldMm : bandX0Mm;
  const fieldX1Mm = right ? right.x0Mm - right.spec.gapToFieldMm : bandX1Mm;
  for (const [border, past] of [
    [left, fieldX0Mm < bandX0Mm - EPS_MM],
    [right, fieldX1Mm > bandX1Mm + EPS_MM],
  ] as const) {
    if (border && past) {
      throw layoutError(`borders.${border.index}.gapToFieldMm`, "borderGapTooNegative", {
        min: -(border.spec.offsetMm + border.widthMm),
      });
    }
  }
  if (fieldX1Mm - fieldX0Mm <= EPS_MM) {
    throw layoutError("borders", "noRoomForField", { bandWidthMm: band, fieldBandWidthMm: Math.max(0, fieldX1Mm - fieldX0Mm) });
  }
  return { borders: layers, fieldX0Mm, fieldX1Mm };
}
