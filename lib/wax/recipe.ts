import { z } from "@/lib/zod";
import { WaxInputError, keyed, parseWax, type WaxIssue } from "./errors";
import { NAME_MAX_CHARS, NOTES_MAX_CHARS, WORKING_MAX_C, WORKING_MIN_C } from "./limits";
import { materialKey, resolveMaterial, type WaxMaterial } from "./materials";
import { componentShape, massFractions, mixDensity, mixMeltingRange, mixSchema } from "./mix";
import { assertTemperatureAllowed, checkTemperature, workingRangeF, type TemperatureCheck } from "./temperature";

export const SEASONS = ["dry", "humid", "rainy", "any"] as const;
export type Season = (typeof SEASONS)[number];
/** What a recipe is for: stamping, hand-drawn lines, paste pushed through a screen, blocking large areas. */
export const RECIPE_USES = ["stamping", "hand-drawn", "screen-paste", "blocking"] as const;
export type RecipeUse = (typeof RECIPE_USES)[number];

const tempC = z.number(keyed).min(WORKING_MIN_C, keyed).max(WORKING_MAX_C, keyed);

/** Working range of the pot in °C (the form converts °F first); min ≤ max. */
export const workingRangeSchema = z.object({ minC: tempC, maxC: tempC }, keyed).superRefine((r, ctx) => {
  if (r.minC > r.maxC) ctx.addIssue({ code: "custom", path: ["maxC"], message: "validation.rangeOrder" });
});

/** Components by mass %: each in (0, 100], no material twice, 100 % in all. */
export const recipeComponentsSchema = mixSchema(componentShape);

/** A recipe as people enter it; the API's create schema extends it, its update schema derives from it (no defaults). */
export const recipeSchema = z.object(
  {
    name: z.string(keyed).trim().min(1, keyed).max(NAME_MAX_CHARS, keyed),
    season: z.enum(SEASONS, keyed),
    use: z.enum(RECIPE_USES, keyed),
    components: recipeComponentsSchema,
    workingRangeC: workingRangeSchema,
    notes: z.string(keyed).trim().max(NOTES_MAX_CHARS, keyed).optional(),
  },
  keyed,
);

export type Recipe = z.output<typeof recipeSchema>;
export type RecipeInput = z.input<typeof recipeSchema>;
/** What the computations need of a recipe. */
export type RecipeMix = Pick<Recipe, "components" | "workingRangeC">;

export interface ResolvedComponent {
  materialId: string;
  name: string;
  pct: number;
  /** Mass fraction, pct / Σ pct. */
  fraction: number;
  material: WaxMaterial;
}

export interface RecipeAnalysis {
  components: ResolvedComponent[];
  densityGPerCm3: number;
  meltingRangeC: { fromC: number; toC: number };
  workingRangeC: { minC: number; maxC: number };
  workingRangeF: { minF: number; maxF: number };
  temperature: TemperatureCheck;
}

/** Parses a recipe with recipeSchema; throws WaxInputError listing every field. */
export function parseRecipe(input: unknown): Recipe {
  return parseWax(recipeSchema, input);
}

/**
 * Resolves each component's material (id, else name or id case-insensitively) among `materials`.
 * Throws WaxInputError "wax.unknownMaterial" on components.<i>.material for each it cannot find.
 */
export function resolveComponents(
  components: readonly { material: string; pct: number }[],
  materials: readonly WaxMaterial[],
): ResolvedComponent[] {
  const missing: WaxIssue[] = [];
  const fractions = massFractions(components);
  const resolved = components.flatMap((c, i) => {
    const material = resolveMaterial(c.material, materials);
    if (!material) {
      missing.push({ field: `components.${i}.material`, code: "wax.unknownMaterial", params: { material: c.material } });
      return [];
    }
    return [{ materialId: material.id, name: material.name, pct: c.pct, fraction: fractions[i], material }];
  });
  if (missing.length > 0) throw new WaxInputError(missing);
  return resolved;
}

/**
 * A recipe's computed figures: density 1 / Σ (wᵢ/ρᵢ) in g/cm³, melting range (lowest start to highest end of
 * the components, °C), working range also in °F, and the temperature rules against the components' flash
 * points. Does not refuse a range too near a flash point (see validateRecipe); throws for unknown materials.
 */
export function analyseRecipe(recipe: RecipeMix, materials: readonly WaxMaterial[]): RecipeAnalysis {
  const components = resolveComponents(recipe.components, materials);
  const figures = components.map((c) => c.material);
  return {
    components,
    densityGPerCm3: mixDensity(components.map((c) => ({ pct: c.pct, densityGPerCm3: c.material.densityGPerCm3 }))),
    meltingRangeC: mixMeltingRange(figures),
    workingRangeC: { ...recipe.workingRangeC },
    workingRangeF: workingRangeF(recipe.workingRangeC),
    temperature: checkTemperature(recipe.workingRangeC, figures),
  };
}

/**
 * What saving a recipe needs: parse (schema), resolve materials, analyse, and refuse a working range within
 * 50 °C of the lowest flash point (WaxInputError "wax.tooNearFlashPoint" on workingRangeC.maxC). An unknown
 * flash point does not refuse; the analysis reports it (temperature.status "unknown").
 */
export function validateRecipe(input: unknown, materials: readonly WaxMaterial[]): { recipe: Recipe; analysis: RecipeAnalysis } {
  const recipe = parseRecipe(input);
  const analysis = analyseRecipe(recipe, materials);
  assertTemperatureAllowed(analysis.temperature);
  return { recipe, analysis };
}

export interface RecipeRuleBreak {
  recipeId: string;
  recipeName: string;
  /** tooNear: breaks the flash-point rule; unknown: cannot be checked; missingMaterial: names a material not found. */
  status: "tooNear" | "unknown" | "missingMaterial";
  problem: WaxIssue;
}

/**
 * Saved recipes that break the flash-point rule or cannot be checked against it with these material figures
 * (run after a material's flash point changes or is cleared). `usingMaterial` limits it to recipes with that
 * material (id or name). Recipes in the order given.
 */
export function recipesBreakingTemperatureRule(
  materials: readonly WaxMaterial[],
  recipes: readonly (RecipeMix & { id: string; name: string })[],
  options: { usingMaterial?: string } = {},
): RecipeRuleBreak[] {
  const ref = options.usingMaterial;
  const target = ref !== undefined ? resolveMaterial(ref, materials) : undefined;
  const names = (c: { material: string }) => {
    const m = resolveMaterial(c.material, materials);
    return m && target ? m.id === target.id : materialKey(c.material) === materialKey(ref ?? "");
  };
  const breaks: RecipeRuleBreak[] = [];
  for (const recipe of recipes) {
    if (ref !== undefined && !recipe.components.some(names)) continue;
    let analysis: RecipeAnalysis;
    try {
      analysis = analyseRecipe(recipe, materials);
    } catch (e) {
      if (!(e instanceof WaxInputError)) throw e;
      breaks.push({ recipeId: recipe.id, recipeName: recipe.name, status: "missingMaterial", problem: e.issues[0] });
      continue;
    }
    const { status, problem } = analysis.temperature;
    if (status !== "ok" && problem) breaks.push({ recipeId: recipe.id, recipeName: recipe.name, status, problem });
  }
  return breaks;
}
