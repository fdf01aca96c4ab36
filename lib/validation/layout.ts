import { z } from "@/lib/zod";
import { issueKey } from "@/lib/errors";
import {
  borderShape,
  checkArrangement,
  checkBorderRepeat,
  checkBorderSides,
  checkGap,
  checkRightCopy,
  FILL_RULES,
  layoutShape,
  stampSizeSchema,
  type BorderSpec,
  type StampSize,
} from "@/lib/layout/schema";

// The body of POST /api/v1/layout: the engine's own input schema (lib/layout/schema.ts), with one
// addition — the field stamp and each border's stamp may be named by the code of a stamp in the library.

const keyed = { error: (issue: z.core.$ZodRawIssue) => issueKey(issue) };
const stampShape = stampSizeSchema.shape;

export const stampRequestSchema = z
  .object(
    {
      code: z.string(keyed).trim().min(1, keyed).max(64, keyed).optional(),
      widthMm: stampShape.widthMm.optional(),
      heightMm: stampShape.heightMm.optional(),
      coverage: stampShape.coverage,
      outline: stampShape.outline,
      fillRule: z.enum(FILL_RULES, keyed).optional(),
    },
    keyed,
  )
  .superRefine((s, ctx) => {
    if (s.code !== undefined) {
      const sized = [s.widthMm, s.heightMm, s.coverage, s.outline, s.fillRule].some((v) => v !== undefined);
      if (sized) ctx.addIssue({ code: "custom", path: ["code"], message: "validation.codeOrSize" });
      return;
    }
    if (s.widthMm === undefined) ctx.addIssue({ code: "custom", path: ["widthMm"], message: "validation.required" });
    if (s.heightMm === undefined) ctx.addIssue({ code: "custom", path: ["heightMm"], message: "validation.required" });
  })
  .transform((s): StampRef =>
    s.code !== undefined
      ? { code: s.code }
      : {
          widthMm: s.widthMm ?? 0,
          heightMm: s.heightMm ?? 0,
          coverage: s.coverage,
          outline: s.outline,
          fillRule: s.fillRule ?? "nonzero",
        },
  );

/** A stamp given by its sizes, or by the code of a stamp in the library (resolved by the data layer). */
export type StampRef = StampSize | { code: string };

/** A border as the engine takes it, but its stamp may be `{ code }`; the repeat checks that need the size wait for it. */
export const borderRequestSchema = z.object({ ...borderShape, stamp: stampRequestSchema }, keyed).superRefine((b, ctx) => {
  if (!("code" in b.stamp)) checkBorderRepeat({ ...b, stamp: b.stamp }, ctx);
  checkRightCopy(b, ctx);
});

export type BorderRequest = Omit<BorderSpec, "stamp"> & { stamp: StampRef };

/** Up to one border on each edge (as the engine's bordersSchema), stamps by size or by code. */
export const bordersListRequestSchema = z.array(borderRequestSchema, keyed).max(2, keyed).superRefine(checkBorderSides);
export const bordersRequestSchema = bordersListRequestSchema.default([]);

/**
 * Body of POST /api/v1/layout: as the engine input, but the stamp may be `{ code }` of a library stamp.
 * The handler resolves the code to sizes and outline, then lays it out.
 */
export const layoutRequestSchema = z
  .object({ ...layoutShape, stamp: stampRequestSchema, borders: bordersRequestSchema }, keyed)
  .superRefine((v, ctx) => {
    checkArrangement(v, ctx);
    if (!("code" in v.stamp)) checkGap({ stamp: v.stamp, gap: v.gap }, ctx);
  });

export type LayoutRequest = z.output<typeof layoutRequestSchema>;
