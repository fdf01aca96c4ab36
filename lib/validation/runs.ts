import { findingInputSchema, progressInputSchema, readingInputSchema, RUN_NAME_MAX_CHARS, RUN_PLANS_MAX, RUN_STAGES_MAX, runStates, stageInputSchema } from "@/lib/runs";
import { z } from "@/lib/zod";
import { isoDate, optionalText, requiredText } from "./common";

// Production runs: one schema per input, extending the run domain's own (lib/runs/schema.ts).

const uuid = z.uuid("validation.notFound");
const positiveMetres = z.number("validation.number").gt(0, "validation.tooSmall").max(2000, "validation.tooBig");
const pieces = z.number("validation.number").int("validation.wholeNumber").min(1, "validation.tooSmall").max(5000, "validation.tooBig");
const pieceLengthMm = z.number("validation.number").gt(0, "validation.tooSmall").max(20_000, "validation.tooBig");

/** A stage in a create or update: the domain's stage, with `id` to keep an existing stage in an update. */
export const runStageSchema = stageInputSchema.and(z.object({ id: uuid.optional() }));

const sizeRule = (r: { metres?: number | null; pieces?: number | null; pieceLengthMm?: number | null }, ctx: z.RefinementCtx) => {
  const byMetres = r.metres != null;
  const byPieces = r.pieces != null || r.pieceLengthMm != null;
  if (byMetres === byPieces) ctx.addIssue({ code: "custom", path: ["metres"], message: "runs.oneSize" });
  else if (byPieces && r.pieces == null) ctx.addIssue({ code: "custom", path: ["pieces"], message: "validation.required" });
  else if (byPieces && r.pieceLengthMm == null) ctx.addIssue({ code: "custom", path: ["pieceLengthMm"], message: "validation.required" });
};

/**
 * POST /api/v1/runs: a motif's colourway on a cloth, metres or pieces of a length, the plans it stamps. Without
 * `stages` the run gets the colourway's default stages, waxing with the first plan and `recipeId`.
 */
export const createRunSchema = z
  .strictObject({
    name: requiredText(RUN_NAME_MAX_CHARS),
    motifId: uuid,
    colourwayId: uuid,
    cloth: requiredText(120),
    metres: positiveMetres.optional(),
    pieces: pieces.optional(),
    pieceLengthMm: pieceLengthMm.optional(),
    dueOn: isoDate.nullable().optional(),
    /** The first day of work: stages without planned days get them one after the other from here. */
    startOn: isoDate.nullable().optional(),
    planIds: z.array(uuid).max(RUN_PLANS_MAX, "validation.tooBig").optional(),
    recipeId: uuid.optional(),
    notes: optionalText(2000),
    stages: z.array(runStageSchema).min(1, "validation.required").max(RUN_STAGES_MAX, "validation.tooBig").optional(),
  })
  .superRefine(sizeRule);
export type CreateRunInput = z.output<typeof createRunSchema>;

/**
 * PATCH /api/v1/runs/{id}: the fields named, from `version`. `stages` replaces the list (an existing stage kept by
 * its `id`; one with records may not be left out or change kind). A size given replaces the whole size.
 */
export const updateRunSchema = z
  .strictObject({
    version: z.number("validation.number").int("validation.wholeNumber").min(1, "validation.tooSmall"),
    name: requiredText(RUN_NAME_MAX_CHARS).optional(),
    cloth: requiredText(120).optional(),
    metres: positiveMetres.nullable().optional(),
    pieces: pieces.nullable().optional(),
    pieceLengthMm: pieceLengthMm.nullable().optional(),
    dueOn: isoDate.nullable().optional(),
    state: z.enum(runStates, "validation.invalidOption").optional(),
    stateNote: optionalText(2000),
    notes: optionalText(2000),
    planIds: z.array(uuid).max(RUN_PLANS_MAX, "validation.tooBig").optional(),
    stages: z.array(runStageSchema).min(1, "validation.required").max(RUN_STAGES_MAX, "validation.tooBig").optional(),
  })
  .superRefine((r, ctx) => {
    if (r.metres !== undefined || r.pieces !== undefined || r.pieceLengthMm !== undefined) sizeRule(r, ctx);
  });
export type UpdateRunInput = z.output<typeof updateRunSchema>;

export const deleteRunQuerySchema = z.object({ version: z.coerce.number("validation.number").int("validation.wholeNumber").min(1, "validation.tooSmall").optional() });

export const runListQuerySchema = z.object({
  q: z.string().trim().max(120, "validation.tooLong").optional(),
  state: z
    .string()
    .transform((v) => v.split(","))
    .pipe(z.array(z.enum(runStates, "validation.invalidOption")))
    .optional(),
  motif: uuid.optional(),
  sort: z.enum(["due", "-due", "name", "-name", "updated", "-updated"], "validation.invalidOption").default("-updated"),
  page: z.coerce.number("validation.number").int("validation.wholeNumber").min(1, "validation.tooSmall").default(1),
  pageSize: z.coerce.number("validation.number").int("validation.wholeNumber").min(1, "validation.tooSmall").max(100, "validation.tooBig").default(25),
});
export type RunListQuery = z.output<typeof runListQuerySchema>;

export const runStageParamsSchema = z.object({ id: uuid, stageId: uuid });

/** POST …/stages/{stageId}/progress: the domain's record, the impressions per stamp, a screen's waxed area. */
export const recordProgressSchema = progressInputSchema.and(
  z.object({
    stampImpressions: z
      .array(z.object({ code: z.string().trim().min(1, "validation.required").max(40, "validation.tooLong"), impressions: z.number("validation.number").int("validation.wholeNumber").min(0, "validation.tooSmall").max(200_000, "validation.tooBig") }))
      .max(20, "validation.tooBig")
      .optional(),
    waxedAreaPerMetreM2: z.number("validation.number").gt(0, "validation.tooSmall").max(10, "validation.tooBig").optional(),
  }),
);
export type RecordProgressInput = z.output<typeof recordProgressSchema>;

export const recordReadingSchema = readingInputSchema;
export type RecordReadingInput = z.output<typeof recordReadingSchema>;

export const recordFindingSchema = findingInputSchema.and(z.object({ stageId: uuid.optional() }));
export type RecordFindingInput = z.output<typeof recordFindingSchema>;

/** POST …/stages/{stageId}/stamp-request: where the stamps go; the stamps and days come from the stage. */
export const stageStampRequestSchema = z.strictObject({ workstation: requiredText(80), note: optionalText(1000) });
export type StageStampRequestInput = z.output<typeof stageStampRequestSchema>;
