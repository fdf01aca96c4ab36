import { z } from "@/lib/zod";
import { latestTodayIso } from "@/lib/dates";
import { issueKey } from "@/lib/errors";
import {
  NAME_MAX_CHARS,
  NOTES_MAX_CHARS,
  RECIPE_USES,
  SEASONS,
  STOCK_MAX_KG,
  USE_MAX_G,
  checkWaxUse,
  estimateInputSchema,
  materialSchema,
  recipeComponentsSchema,
  recipeSchema,
  runLengthSchema,
  waxUseShape,
} from "@/lib/wax";
import { boolParam, isoDate, optionalText } from "./common";

// The wax room's inputs: lib/wax's own schemas (materials, recipes, the estimator, wax uses, run lengths)
// extended with what storage and the API add — ids, versions, a plan instead of an area, names for saved
// estimates. Nothing here re-states a rule the domain already has.

const keyed = { error: (issue: z.core.$ZodRawIssue) => issueKey(issue) };
const version = z.coerce.number("validation.required").int("validation.required").positive("validation.required");
const uuid = (message = "validation.notFound") => z.uuid(message);

function nothingToChange(value: Record<string, unknown>, ctx: z.RefinementCtx) {
  if (Object.keys(value).filter((k) => k !== "version" && value[k] !== undefined).length === 0) {
    ctx.addIssue({ code: "custom", path: [], message: "validation.nothingToChange" });
  }
}

// --- materials ------------------------------------------------------------------------------

/** A material's short key: lower-case letters, digits and dashes ("paraffin", "damar-2"). */
export const materialCodeSchema = z
  .string(keyed)
  .trim()
  .toLowerCase()
  .regex(/^[a-z0-9][a-z0-9-]{0,39}$/, "validation.materialCode");

const reorderLevelKg = z.number("validation.number").min(0, "validation.tooSmall").max(STOCK_MAX_KG, "validation.tooBig");
const materialShape = materialSchema.omit({ id: true }).shape;

/** A new material: the domain's figures and sources, a code (else made from the name) and a reorder level. */
export const createMaterialSchema = z
  .object({
    ...materialShape,
    code: materialCodeSchema.optional(),
    flashPointC: materialShape.flashPointC.default(null),
    reorderLevelKg: reorderLevelKg.default(0),
  })
  .strict();

/** A change of a material: any of its figures or sources (sources merge with the stored ones), from a version. */
export const updateMaterialSchema = z
  .object({
    ...materialShape,
    code: materialCodeSchema,
    sources: materialShape.sources.partial(),
    reorderLevelKg,
  })
  .partial()
  .extend({ version })
  .strict()
  .superRefine(nothingToChange);

export type CreateMaterialInput = z.output<typeof createMaterialSchema>;
export type UpdateMaterialInput = z.output<typeof updateMaterialSchema>;

export const movementKinds = ["receipt", "recovery", "correction"] as const;
export type RecordableMovementKind = (typeof movementKinds)[number];

/**
 * A stock movement people record: a receipt or recovered wax (kg > 0), or a correction after counting (kg ≠ 0,
 * signed). Use is recorded by wax uses, never by hand.
 */
export const stockMovementSchema = z
  .object({
    kind: z.enum(movementKinds, "validation.invalidOption"),
    kg: z.number("validation.number").min(-STOCK_MAX_KG, "validation.tooSmall").max(STOCK_MAX_KG, "validation.tooBig"),
    note: optionalText(500),
  })
  .strict()
  .superRefine((m, ctx) => {
    if (m.kind !== "correction" && !(m.kg > 0)) ctx.addIssue({ code: "custom", path: ["kg"], message: "wax.mustBePositive" });
    if (m.kind === "correction" && m.kg === 0) ctx.addIssue({ code: "custom", path: ["kg"], message: "validation.stockCorrectionZero" });
  });

export type StockMovementInput = z.output<typeof stockMovementSchema>;

// --- recipes --------------------------------------------------------------------------------

/** A new recipe: exactly the domain's recipe (components name materials by id, code or name). */
export const createRecipeSchema = recipeSchema.strict();

/** A change of a recipe from a version; `archived` archives or restores it. Components, when given, replace all. */
export const updateRecipeSchema = recipeSchema
  .partial()
  .extend({ version, archived: z.boolean("validation.yesNo").optional() })
  .strict()
  .superRefine(nothingToChange);

/** Duplicating a recipe into a variant: a new name, optionally another season. */
export const duplicateRecipeSchema = z
  .object({ name: recipeSchema.shape.name, season: recipeSchema.shape.season.optional() })
  .strict();

export const recipeListQuerySchema = z
  .object({
    season: z.enum(SEASONS, "validation.invalidOption").optional(),
    use: z.enum(RECIPE_USES, "validation.invalidOption").optional(),
    archived: boolParam.optional(),
  })
  .strict();

export const recipeCompareQuerySchema = z.object({ a: uuid(), b: uuid() }).strict();
export const deleteQuerySchema = z.object({ version: version.optional() }).strict();

export type CreateRecipeInput = z.output<typeof createRecipeSchema>;
export type UpdateRecipeInput = z.output<typeof updateRecipeSchema>;
export type DuplicateRecipeInput = z.output<typeof duplicateRecipeSchema>;
export type RecipeListQuery = z.output<typeof recipeListQuerySchema>;

// --- estimates ------------------------------------------------------------------------------

const est = estimateInputSchema.shape;
const clothText = z.string(keyed).trim().max(NAME_MAX_CHARS, keyed);

/**
 * POST /api/v1/wax/estimate (SPEC section 6): the estimator's input with a plan instead of the area, a saved
 * recipe (or an inline mix) instead of resolved components, the run in metres, pieces or kodi (runLengthSchema),
 * and the rate, losses and recovery optional (the calibrated rate and the wax master's defaults stand in).
 */
const estimateRequestShape = {
  planId: uuid("wax.planUnknown").optional(),
  waxedAreaPerMetreM2: est.waxedAreaPerMetreM2.optional(),
  metres: est.metres.optional(),
  pieces: z.number(keyed).optional(),
  kodi: z.number(keyed).optional(),
  pieceLengthMm: z.number(keyed).optional(),
  passes: est.passes,
  rateGPerM2: est.rateGPerM2.optional(),
  lossPct: est.lossPct.unwrap().optional(),
  recoveryPct: est.recoveryPct.unwrap().optional(),
  recipeId: uuid("wax.recipeUnknown").optional(),
  recipe: z.object({ components: recipeComponentsSchema }, keyed).strict().optional(),
  /** Which cloth's calibration to use when the rate is not given. */
  cloth: clothText.optional(),
};

type RunFields = { metres?: number; pieces?: number; kodi?: number; pieceLengthMm?: number };
type EstimateFields = RunFields & { planId?: string; waxedAreaPerMetreM2?: number; recipeId?: string; recipe?: unknown };

/** The run's own fields, as runLengthSchema reads them (absent keys stay absent). */
export const runFieldsOf = (r: RunFields) =>
  Object.fromEntries(Object.entries({ metres: r.metres, pieces: r.pieces, kodi: r.kodi, pieceLengthMm: r.pieceLengthMm }).filter(([, v]) => v !== undefined)) as RunFields;

function checkEstimateRequest(r: EstimateFields, ctx: z.RefinementCtx, options: { savedRecipe: boolean }) {
  if ((r.planId === undefined) === (r.waxedAreaPerMetreM2 === undefined)) {
    ctx.addIssue({ code: "custom", path: ["waxedAreaPerMetreM2"], message: r.planId === undefined ? "validation.required" : "wax.planOrArea" });
  }
  if (options.savedRecipe) {
    if (r.recipe !== undefined) ctx.addIssue({ code: "custom", path: ["recipe"], message: "wax.savedRecipeOnly" });
    if (r.recipeId === undefined) ctx.addIssue({ code: "custom", path: ["recipeId"], message: "validation.required" });
  } else if ((r.recipeId === undefined) === (r.recipe === undefined)) {
    ctx.addIssue({ code: "custom", path: ["recipeId"], message: r.recipeId === undefined ? "validation.required" : "wax.recipeOrMix" });
  }
  // With a plan the run may be left out: the plan's own run length stands in.
  const run = runFieldsOf(r);
  if (Object.keys(run).length === 0 && r.planId !== undefined) return;
  const parsed = runLengthSchema.safeParse(run);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const path = issue.path.length ? issue.path : ["metres"];
      ctx.addIssue({ code: "custom", path, message: issue.message, params: "params" in issue ? (issue.params as Record<string, unknown>) : undefined });
    }
  }
}

export const estimateRequestSchema = z
  .object(estimateRequestShape, keyed)
  .strict()
  .superRefine((r, ctx) => checkEstimateRequest(r, ctx, { savedRecipe: false }));

/** Saving an estimate: the same request with a saved recipe, a name, and whether it counts as planned work. */
export const saveEstimateSchema = z
  .object({ ...estimateRequestShape, name: recipeSchema.shape.name, planned: z.boolean("validation.yesNo").default(false) }, keyed)
  .strict()
  .superRefine((r, ctx) => checkEstimateRequest(r, ctx, { savedRecipe: true }));

export const updateEstimateSchema = z
  .object({ name: recipeSchema.shape.name, planned: z.boolean("validation.yesNo") })
  .partial()
  .extend({ version })
  .strict()
  .superRefine(nothingToChange);

export const estimateListQuerySchema = z.object({ planned: boolParam.optional() }).strict();

export type EstimateRequest = z.output<typeof estimateRequestSchema>;
export type SaveEstimateInput = z.output<typeof saveEstimateSchema>;
export type UpdateEstimateInput = z.output<typeof updateEstimateSchema>;

// --- wax uses -------------------------------------------------------------------------------

const { clothId: _clothId, ...useShape } = waxUseShape;
void _clothId;

/**
 * A wax use to record: the domain's wax use (grams, or the pot weighed before and after) for a saved recipe, on a
 * day, for a plan (its waxed area and impressions) or a waxed area per metre given directly, with the cloth by name,
 * and without a plan optionally the stamp used and the impressions made.
 */
export const recordWaxUseSchema = z
  .object(
    {
      ...useShape,
      recipeId: uuid("wax.recipeUnknown"),
      waxedAreaPerMetreM2: useShape.waxedAreaPerMetreM2.optional(),
      planId: uuid("wax.planUnknown").optional(),
      usedOn: isoDate.refine((v) => v <= latestTodayIso(), "validation.dateInFuture"),
      cloth: clothText.optional(),
      stampCode: z.string(keyed).trim().toUpperCase().min(1, keyed).max(64, keyed).optional(),
      impressions: z.number("validation.impressions").int("validation.impressions").min(1, "validation.impressions").max(1_000_000, "validation.impressions").optional(),
      note: optionalText(NOTES_MAX_CHARS),
    },
    keyed,
  )
  .strict()
  .superRefine((u, ctx) => {
    checkWaxUse(u, ctx);
    if ((u.planId === undefined) === (u.waxedAreaPerMetreM2 === undefined)) {
      ctx.addIssue({ code: "custom", path: ["waxedAreaPerMetreM2"], message: u.planId === undefined ? "validation.required" : "wax.planOrArea" });
    }
    if (u.planId !== undefined && (u.stampCode !== undefined || u.impressions !== undefined)) {
      ctx.addIssue({ code: "custom", path: ["impressions"], message: "wax.impressionsFromPlan" });
    } else if ((u.stampCode === undefined) !== (u.impressions === undefined)) {
      ctx.addIssue({ code: "custom", path: u.stampCode === undefined ? ["stampCode"] : ["impressions"], message: "validation.required" });
    }
  });

export const withdrawWaxUseSchema = z.object({ reason: z.string(keyed).trim().min(1, "validation.required").max(500, "validation.tooLong") }).strict();

export const waxUseListQuerySchema = z.object({ recipeId: uuid().optional(), withdrawn: boolParam.optional() }).strict();

export type RecordWaxUseInput = z.output<typeof recordWaxUseSchema>;
export type WithdrawWaxUseInput = z.output<typeof withdrawWaxUseSchema>;
export type WaxUseListQuery = z.output<typeof waxUseListQuerySchema>;

/** Grams a use may record at most (the domain's own bound), for the forms' hints. */
export const WAX_USE_MAX_G = USE_MAX_G;
