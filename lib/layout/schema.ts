import { z } from "@/lib/zod";
import { issueKey } from "@/lib/errors";
import {
  BORDER_GAP_TO_FIELD_MIN_MM,
  CLOTH_WIDTH_MAX_MM,
  CLOTH_WIDTH_MIN_MM,
  DIAGONAL_MAX_DENOMINATOR,
  GAP_MAX_MM,
  MIN_STEP_MM,
  OUTLINE_MAX_BYTES,
  PIECES_MAX,
  ROTATION_ORDERS,
  RUN_LENGTH_MAX_MM,
  RUN_LENGTH_MIN_MM,
  STAMP_SIDE_MAX_MM,
  STAMP_SIDE_MIN_MM,
  WINDOW_DEFAULT_LENGTH_MM,
  WINDOW_MAX_LENGTH_MM,
} from "./limits";
import { simpleFraction } from "./fraction";

// The engine owns its input: this schema, its limits (limits.ts) and its defaults. The API body
// (lib/validation/layout.ts) extends it. Issue messages are catalogue keys, never prose, given by
// the app's one issue → key map (lib/errors.ts); zod keeps minimum, maximum, … beside them.

export const ARRANGEMENTS = [
  "straight",
  "half-drop",
  "brick",
  "mirror",
  "turnover",
  "half-drop-mirror",
  "diagonal",
  "rotation",
] as const;
export type Arrangement = (typeof ARRANGEMENTS)[number];
export const ALIGNMENTS = ["centre", "left"] as const;
export const EDGE_MODES = ["whole", "clip"] as const;
export const FILL_RULES = ["nonzero", "evenodd"] as const;
export const BORDER_SIDES = ["left", "right", "both"] as const;
export type BorderSide = (typeof BORDER_SIDES)[number];
export const BORDER_TURNS = [0, 90, 180, 270] as const;
/** How the right border of a `both` pair relates to the left one. */
export const RIGHT_COPIES = ["mirror", "turn", "same"] as const;

const keyed = { error: (issue: z.core.$ZodRawIssue) => issueKey(issue) };

function mm(min: number, max: number) {
  return z.number(keyed).min(min, keyed).max(max, keyed);
}

const clothSchema = z
  .object(
    {
      widthMm: mm(CLOTH_WIDTH_MIN_MM, CLOTH_WIDTH_MAX_MM),
      lengthMm: mm(RUN_LENGTH_MIN_MM, RUN_LENGTH_MAX_MM).optional(),
      pieces: z.number(keyed).int(keyed).min(1, keyed).max(PIECES_MAX, keyed).optional(),
      pieceLengthMm: mm(RUN_LENGTH_MIN_MM, RUN_LENGTH_MAX_MM).optional(),
      margins: z
        .object({ leftMm: mm(0, CLOTH_WIDTH_MAX_MM).default(0), rightMm: mm(0, CLOTH_WIDTH_MAX_MM).default(0) }, keyed)
        .default({ leftMm: 0, rightMm: 0 }),
    },
    keyed,
  )
  .superRefine((cloth, ctx) => {
    const byPieces = cloth.pieces !== undefined || cloth.pieceLengthMm !== undefined;
    if (cloth.lengthMm !== undefined && byPieces) {
      ctx.addIssue({ code: "custom", path: ["lengthMm"], message: "validation.lengthOrPieces" });
    } else if (cloth.lengthMm === undefined && !byPieces) {
      ctx.addIssue({ code: "custom", path: ["lengthMm"], message: "validation.required" });
    } else if (byPieces) {
      if (cloth.pieces === undefined) ctx.addIssue({ code: "custom", path: ["pieces"], message: "validation.required" });
      if (cloth.pieceLengthMm === undefined) {
        ctx.addIssue({ code: "custom", path: ["pieceLengthMm"], message: "validation.required" });
      }
      if (cloth.pieces !== undefined && cloth.pieceLengthMm !== undefined) {
        if (Number.isInteger(cloth.pieces) && cloth.pieces * cloth.pieceLengthMm > RUN_LENGTH_MAX_MM) {
          ctx.addIssue({
            code: "custom",
            path: ["pieces"],
            message: "validation.runTooLong",
            params: { max: RUN_LENGTH_MAX_MM },
          });
        }
      }
    }
    // Zod runs this even when a field above failed; compare margins only with a width that passed its own check.
    const widthValid = cloth.widthMm >= CLOTH_WIDTH_MIN_MM && cloth.widthMm <= CLOTH_WIDTH_MAX_MM;
    if (widthValid && cloth.margins.leftMm + cloth.margins.rightMm >= cloth.widthMm) {
      ctx.addIssue({
        code: "custom",
        path: ["margins"],
        message: "validation.marginsWiderThanCloth",
        params: { widthMm: cloth.widthMm },
      });
    }
  });

const stampShape = {
  widthMm: mm(STAMP_SIDE_MIN_MM, STAMP_SIDE_MAX_MM),
  heightMm: mm(STAMP_SIDE_MIN_MM, STAMP_SIDE_MAX_MM),
  /** Fraction of the footprint that carries wax, used when there is no outline. */
  coverage: z.number(keyed).gt(0, keyed).max(1, keyed).optional(),
  /** SVG path data in mm, origin at the footprint's top-left corner; its size is capped before anything else reads it. */
  outline: z
    .string(keyed)
    .refine((v) => new TextEncoder().encode(v).length <= OUTLINE_MAX_BYTES, {
      message: "validation.outlineTooLarge",
      params: { max: OUTLINE_MAX_BYTES },
      abort: true,
    })
    .trim()
    .min(1, keyed)
    .optional(),
  fillRule: z.enum(FILL_RULES, keyed).default("nonzero"),
};

/** A stamp given by its sizes (and outline or coverage), as the engine lays it out. */
export const stampSizeSchema = z.object(stampShape, keyed);

export type StampSize = z.output<typeof stampSizeSchema>;

/**
 * A border: one stamp repeated down the length along the left and/or right edge of the band, inside it. It takes
 * a strip as wide as the laid stamp (its width, or its height when turned a quarter) at `offsetMm` from the band
 * edge; the field band then starts `gapToFieldMm` beyond the strip (negative: the field reaches under the
 * border). Down the strip the impressions sit at startMm + k·(laid height + gapYMm). The stamp is mirrored first
 * (when `mirror`), then turned clockwise as seen on the cloth by `turn` degrees. For `side: "both"` the right
 * border is the left one's mirror image across the cloth (`rightCopy: "mirror"`, the default, so the pair reads
 * symmetrically), the left one turned 180° (`"turn"`), or the same (`"same"`).
 */
/** The fields of a border; the API body swaps the stamp for one that may name a library stamp by code. */
export const borderShape = {
  side: z.enum(BORDER_SIDES, keyed),
  stamp: stampSizeSchema,
  turn: z.literal(BORDER_TURNS, keyed).default(0),
  mirror: z.boolean(keyed).default(false),
  rightCopy: z.enum(RIGHT_COPIES, keyed).optional(),
  gapYMm: mm(-(STAMP_SIDE_MAX_MM - MIN_STEP_MM), GAP_MAX_MM).default(0),
  gapToFieldMm: mm(BORDER_GAP_TO_FIELD_MIN_MM, GAP_MAX_MM).default(0),
  offsetMm: mm(0, CLOTH_WIDTH_MAX_MM).default(0),
  startMm: mm(0, STAMP_SIDE_MAX_MM + GAP_MAX_MM).default(0),
};

/** The repeat down the strip: it must advance, and the first impression must start within one repeat. Needs the stamp's size. */
export function checkBorderRepeat(b: { turn: number; stamp: { widthMm: number; heightMm: number }; gapYMm: number; startMm: number }, ctx: z.RefinementCtx) {
  const laidHeight = b.turn === 90 || b.turn === 270 ? b.stamp.widthMm : b.stamp.heightMm;
  const minGap = -(laidHeight - MIN_STEP_MM);
  if (b.gapYMm < minGap) {
    ctx.addIssue({ code: "custom", path: ["gapYMm"], message: "validation.gapTooNegative", params: { min: minGap } });
  } else if (b.startMm >= laidHeight + b.gapYMm) {
    const repeatMm = laidHeight + b.gapYMm;
    ctx.addIssue({ code: "custom", path: ["startMm"], message: "layout.borderStartBeyondRepeat", params: { repeatMm } });
  }
}

/** `rightCopy` says how the right border copies the left one, so it belongs to a border on both sides. */
export function checkRightCopy(b: { side: BorderSide; rightCopy?: string }, ctx: z.RefinementCtx) {
  if (b.rightCopy !== undefined && b.side !== "both") {
    ctx.addIssue({ code: "custom", path: ["rightCopy"], message: "layout.rightCopyNeedsBoth" });
  }
}

export const borderSchema = z.object(borderShape, keyed).superRefine((b, ctx) => {
  checkBorderRepeat(b, ctx);
  checkRightCopy(b, ctx);
});

export type BorderInput = z.input<typeof borderSchema>;
export type BorderSpec = z.output<typeof borderSchema>;

/** No edge twice: `both`, or one `left` and one `right` border. */
export function checkBorderSides(borders: readonly { side: BorderSide }[], ctx: z.RefinementCtx) {
  const taken = new Set<string>();
  borders.forEach((b, k) => {
    const edges = b.side === "both" ? ["left", "right"] : [b.side];
    if (edges.some((e) => taken.has(e))) {
      ctx.addIssue({ code: "custom", path: [k, "side"], message: "layout.borderSideTwice" });
    }
    for (const e of edges) taken.add(e);
  });
}

/** Up to one border on each edge: `both`, or `left` and `right` (with stamps of their own). */
export const bordersSchema = z.array(borderSchema, keyed).max(2, keyed).superRefine(checkBorderSides).default([]);

/** The fields of a layout other than the stamp; the API body adds a library stamp by code. */
export const layoutShape = {
  cloth: clothSchema,
  gap: z
    .object(
      {
        xMm: mm(-(STAMP_SIDE_MAX_MM - MIN_STEP_MM), GAP_MAX_MM).default(0),
        yMm: mm(-(STAMP_SIDE_MAX_MM - MIN_STEP_MM), GAP_MAX_MM).default(0),
      },
      keyed,
    )
    .default({ xMm: 0, yMm: 0 }),
  arrangement: z.enum(ARRANGEMENTS, keyed),
  /** Diagonal only: each row is shifted across by this fraction of the repeat width (p/q, q ≤ 12). */
  diagonalStep: z.number(keyed).gt(0, keyed).lt(1, keyed).optional(),
  /** Rotation only: copies turned about the stamp's top-left corner (default 4). */
  rotationOrder: z.literal(ROTATION_ORDERS, keyed).optional(),
  align: z.enum(ALIGNMENTS, keyed).default("centre"),
  edges: z.enum(EDGE_MODES, keyed).default("whole"),
  sides: z.literal([1, 2], keyed).default(1),
  /** Window of the run (within one piece) for the impression list and the preview; default the first metre. */
  window: z
    .object(
      {
        startMm: mm(0, RUN_LENGTH_MAX_MM).default(0),
        lengthMm: z.number(keyed).gt(0, keyed).max(WINDOW_MAX_LENGTH_MM, keyed).default(WINDOW_DEFAULT_LENGTH_MM),
      },
      keyed,
    )
    .default({ startMm: 0, lengthMm: WINDOW_DEFAULT_LENGTH_MM }),
  /** Ask for the impression list of the window. */
  impressions: z.boolean(keyed).default(false),
  /** Ask for an SVG preview of the window. */
  preview: z.boolean(keyed).default(false),
  /** Border layers along the band's edges (see borderSchema); they narrow the field band. */
  borders: bordersSchema,
};

type ArrangementFields = {
  arrangement: Arrangement;
  diagonalStep?: number;
};

export function checkArrangement(v: ArrangementFields, ctx: z.RefinementCtx) {
  if (v.arrangement === "diagonal" && v.diagonalStep === undefined) {
    ctx.addIssue({ code: "custom", path: ["diagonalStep"], message: "validation.required" });
  }
  if (v.diagonalStep !== undefined && simpleFraction(v.diagonalStep) === null) {
    ctx.addIssue({
      code: "custom",
      path: ["diagonalStep"],
      message: "validation.notSimpleFraction",
      params: { maxDenominator: DIAGONAL_MAX_DENOMINATOR },
    });
  }
}

export function checkGap(v: { stamp: { widthMm: number; heightMm: number }; gap: { xMm: number; yMm: number } }, ctx: z.RefinementCtx) {
  const minX = -(v.stamp.widthMm - MIN_STEP_MM);
  const minY = -(v.stamp.heightMm - MIN_STEP_MM);
  if (v.gap.xMm < minX) {
    ctx.addIssue({ code: "custom", path: ["gap", "xMm"], message: "validation.gapTooNegative", params: { min: minX } });
  }
  if (v.gap.yMm < minY) {
    ctx.addIssue({ code: "custom", path: ["gap", "yMm"], message: "validation.gapTooNegative", params: { min: minY } });
  }
}

/**
 * The engine's input: a stamp given by its sizes. Lengths in mm. `computeLayout` parses with it, so
 * direct callers get the same defaults and checks as the API.
 */
export const layoutInputSchema = z.object({ ...layoutShape, stamp: stampSizeSchema }, keyed).superRefine((v, ctx) => {
  checkArrangement(v, ctx);
  checkGap(v, ctx);
});

/** What callers may pass to `computeLayout` (defaults optional). */
export type LayoutInput = z.input<typeof layoutInputSchema>;
/** The engine input after parsing, with defaults filled in. */
export type LayoutSpec = z.output<typeof layoutInputSchema>;
