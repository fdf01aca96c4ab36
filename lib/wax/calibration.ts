import { z } from "@/lib/zod";
import { keyed, type WaxParams } from "./errors";
import { AREA_PER_METRE_MAX_M2, CALIBRATION_MIN_USES_DEFAULT, MATERIAL_REF_MAX_CHARS, PASSES_MAX, RUN_MAX_METRES, USE_MAX_G } from "./limits";

const ref = z.string(keyed).trim().min(1, keyed).max(MATERIAL_REF_MAX_CHARS, keyed);
const positive = (max: number) => z.number(keyed).gt(0, { error: "wax.mustBePositive" }).max(max, keyed);
const grams = z.number(keyed).min(0, keyed).max(USE_MAX_G, keyed);

/**
 * A wax use as recorded: what one waxing used, for a recipe (and a cloth when known). Grams either directly or
 * from the pot weighed before and after (plus any wax added in between). Refuses a pot that gained weight.
 * Absent: cloth unknown, one pass, nothing added. No defaults: an update takes z.object(waxUseShape).partial()
 * and checks the merged record with waxUseSchema again.
 */
export const waxUseShape = {
  recipeId: ref,
  clothId: ref.nullable().optional(),
  waxedAreaPerMetreM2: positive(AREA_PER_METRE_MAX_M2),
  metres: positive(RUN_MAX_METRES),
  passes: z.number(keyed).int(keyed).min(1, keyed).max(PASSES_MAX, keyed).optional(),
  gramsUsed: grams.optional(),
  potBeforeG: grams.optional(),
  potAfterG: grams.optional(),
  potAddedG: grams.optional(),
};

/** Cross-field checks of a wax use: grams or pot weights (not both), both weights, a pot that did not gain. */
export function checkWaxUse(
  u: { gramsUsed?: number; potBeforeG?: number; potAfterG?: number; potAddedG?: number },
  ctx: z.RefinementCtx,
): void {
  const weighed = u.potBeforeG !== undefined || u.potAfterG !== undefined;
  if (u.gramsUsed !== undefined && weighed) {
    ctx.addIssue({ code: "custom", path: ["gramsUsed"], message: "wax.gramsOrPot" });
  } else if (u.gramsUsed === undefined && !weighed) {
    ctx.addIssue({ code: "custom", path: ["gramsUsed"], message: "validation.required" });
  } else if (weighed) {
    if (u.potBeforeG === undefined) ctx.addIssue({ code: "custom", path: ["potBeforeG"], message: "validation.required" });
    if (u.potAfterG === undefined) ctx.addIssue({ code: "custom", path: ["potAfterG"], message: "validation.required" });
    if (u.potBeforeG !== undefined && u.potAfterG !== undefined && u.potAfterG > u.potBeforeG + (u.potAddedG ?? 0)) {
      ctx.addIssue({ code: "custom", path: ["potAfterG"], message: "wax.potGained", params: { beforeG: u.potBeforeG } });
    }
  }
}

/** A wax use to record: the shape plus its cross-field checks. */
export const waxUseSchema = z.object(waxUseShape, keyed).superRefine(checkWaxUse);

export type WaxUseInput = z.input<typeof waxUseSchema>;

/** A recorded use as the fit reads it (stored rows may predate today's checks, so the fit flags, not throws). */
export interface WaxUseRecord {
  id?: string;
  recipeId: string;
  clothId?: string | null;
  waxedAreaPerMetreM2: number;
  metres: number;
  passes?: number;
  gramsUsed?: number | null;
  potBeforeG?: number | null;
  potAfterG?: number | null;
  potAddedG?: number | null;
}

/** Waxed area of a use, m²: area per metre × metres × passes (passes default 1). */
export function useAreaM2(use: WaxUseRecord): number {
  return use.waxedAreaPerMetreM2 * use.metres * (use.passes ?? 1);
}

/** Grams a use took: gramsUsed, else pot before + added − after; NaN when neither is recorded. */
export function useGrams(use: WaxUseRecord): number {
  if (use.gramsUsed != null) return use.gramsUsed;
  if (use.potBeforeG != null && use.potAfterG != null) return use.potBeforeG + (use.potAddedG ?? 0) - use.potAfterG;
  return Number.NaN;
}

export interface OriginFit {
  /** Slope through the origin, Σxy / Σx². */
  slope: number;
  n: number;
  sumX2: number;
  /** Residual standard deviation √(Σe² / (n − 1)), in y units; null for one point. */
  residualSd: number | null;
  /** Standard error of the slope, residualSd / √Σx²; null for one point. */
  standardError: number | null;
}

/**
 * Least squares through the origin: slope = Σxy / Σx², residual sd s = √(Σ(y − slope·x)² / (n − 1)) (one
 * parameter fitted), standard error of the slope s / √Σx². Needs at least one point with x ≠ 0.
 */
export function fitThroughOrigin(points: readonly { x: number; y: number }[]): OriginFit {
  const sumX2 = points.reduce((s, p) => s + p.x * p.x, 0);
  const slope = points.reduce((s, p) => s + p.x * p.y, 0) / sumX2;
  const n = points.length;
  if (n < 2) return { slope, n, sumX2, residualSd: null, standardError: null };
  const sse = points.reduce((s, p) => s + (p.y - slope * p.x) ** 2, 0);
  const residualSd = Math.sqrt(sse / (n - 1));
  return { slope, n, sumX2, residualSd, standardError: residualSd / Math.sqrt(sumX2) };
}

export interface RateFit {
  /** g per m² of waxed area per pass. */
  rateGPerM2: number;
  uses: number;
  standardErrorGPerM2: number | null;
  /** Residual standard deviation of the uses' grams about the fit. */
  residualSdG: number | null;
  totalAreaM2: number;
  totalGrams: number;
}

export interface Calibration {
  minUses: number;
  /** Every recipe with a usable use; `enoughUses` when it has at least minUses. Sorted by recipe id. */
  byRecipe: { recipeId: string; enoughUses: boolean; fit: RateFit }[];
  /** Only (recipe, cloth) pairs with at least minUses. Sorted by recipe id, then cloth id. */
  byRecipeCloth: { recipeId: string; clothId: string; fit: RateFit }[];
  /** Uses left out of every fit, with why: zero (or no) area, negative (or no) grams. */
  flagged: { index: number; id?: string; code: string; params: WaxParams }[];
}

function rateFit(points: { x: number; y: number }[]): RateFit {
  const fit = fitThroughOrigin(points);
  return {
    rateGPerM2: fit.slope,
    uses: fit.n,
    standardErrorGPerM2: fit.standardError,
    residualSdG: fit.residualSd,
    totalAreaM2: points.reduce((s, p) => s + p.x, 0),
    totalGrams: points.reduce((s, p) => s + p.y, 0),
  };
}

const byKey = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

/**
 * Fits the application rate (g per m² of waxed area) from recorded uses: x = area per metre × metres × passes,
 * y = grams; least squares through the origin per recipe, and per (recipe, cloth) where there are at least
 * `minUses` (default 3). Uses with area ≤ 0 or grams < 0 (or missing) are flagged and left out.
 */
export function calibrateRates(uses: readonly WaxUseRecord[], options: { minUses?: number } = {}): Calibration {
  const minUses = options.minUses ?? CALIBRATION_MIN_USES_DEFAULT;
  const flagged: Calibration["flagged"] = [];
  const recipes = new Map<string, { x: number; y: number }[]>();
  const pairs = new Map<string, { recipeId: string; clothId: string; points: { x: number; y: number }[] }>();
  uses.forEach((use, index) => {
    const x = useAreaM2(use);
    const y = useGrams(use);
    const id = use.id !== undefined ? { id: use.id } : {};
    if (!(x > 0 && Number.isFinite(x))) {
      flagged.push({ index, ...id, code: "wax.useZeroArea", params: { areaM2: Number.isFinite(x) ? x : 0 } });
      return;
    }
    if (!(y >= 0 && Number.isFinite(y))) {
      flagged.push({ index, ...id, code: "wax.useNegativeGrams", params: { grams: Number.isFinite(y) ? y : 0 } });
      return;
    }
    const point = { x, y };
    recipes.set(use.recipeId, [...(recipes.get(use.recipeId) ?? []), point]);
    if (use.clothId != null) {
      const key = JSON.stringify([use.recipeId, use.clothId]);
      const pair = pairs.get(key) ?? { recipeId: use.recipeId, clothId: use.clothId, points: [] };
      pair.points.push(point);
      pairs.set(key, pair);
    }
  });
  const byRecipe = [...recipes.entries()]
    .sort(([a], [b]) => byKey(a, b))
    .map(([recipeId, points]) => ({ recipeId, enoughUses: points.length >= minUses, fit: rateFit(points) }));
  const byRecipeCloth = [...pairs.values()]
    .filter((p) => p.points.length >= minUses)
    .sort((a, b) => byKey(a.recipeId, b.recipeId) || byKey(a.clothId, b.clothId))
    .map((p) => ({ recipeId: p.recipeId, clothId: p.clothId, fit: rateFit(p.points) }));
  return { minUses, byRecipe, byRecipeCloth, flagged };
}

/**
 * The calibrated rate to offer for a recipe on a cloth: the (recipe, cloth) fit when it has enough uses, else the
 * recipe's fit when that has enough, else null (the caller falls back to the wax master's default rate).
 */
export function calibratedRate(
  calibration: Calibration,
  recipeId: string,
  clothId?: string | null,
): { rateGPerM2: number; basis: "recipeCloth" | "recipe"; fit: RateFit } | null {
  const pair = clothId != null ? calibration.byRecipeCloth.find((p) => p.recipeId === recipeId && p.clothId === clothId) : undefined;
  if (pair) return { rateGPerM2: pair.fit.rateGPerM2, basis: "recipeCloth", fit: pair.fit };
  const recipe = calibration.byRecipe.find((r) => r.recipeId === recipeId && r.enoughUses);
  return recipe ? { rateGPerM2: recipe.fit.rateGPerM2, basis: "recipe", fit: recipe.fit } : null;
}
