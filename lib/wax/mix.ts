import { z } from "@/lib/zod";
import { keyed } from "./errors";
import { materialKey } from "./materials";
import { MATERIAL_REF_MAX_CHARS, MIX_MAX_COMPONENTS, MIX_SUM_TOLERANCE_PCT } from "./limits";

/** A material named by its id or its name (case-insensitive), as recipes and the API give it. */
export const materialRefSchema = z.string(keyed).trim().min(1, keyed).max(MATERIAL_REF_MAX_CHARS, keyed);

/** A share of the mix by mass, in (0, 100] %. */
export const pctSchema = z.number(keyed).gt(0, { error: "wax.pctRange" }).max(100, { error: "wax.pctRange" });

export const componentShape = { material: materialRefSchema, pct: pctSchema };

/** Sum of the components' mass %, ignoring entries that are not numbers (their own issue is already raised). */
export function totalPct(components: readonly { pct?: unknown }[]): number {
  return components.reduce((sum, c) => sum + (typeof c.pct === "number" && Number.isFinite(c.pct) ? c.pct : 0), 0);
}

/**
 * Zod check of a mix: no material twice (compared trimmed, case-insensitive; issue on the repeat's `material`,
 * params { material, line } with the 1-based line of the first) and shares adding up to 100 % within
 * MIX_SUM_TOLERANCE_PCT (issue "wax.mixNot100" on the list, params { totalPct } = the running total).
 */
export function checkMix(entries: readonly object[], ctx: z.RefinementCtx): void {
  const components = entries as readonly { material?: unknown; pct?: unknown }[];
  const first = new Map<string, number>();
  components.forEach((c, i) => {
    if (typeof c.material !== "string") return;
    const key = materialKey(c.material);
    const seen = first.get(key);
    if (seen === undefined) first.set(key, i);
    else {
      ctx.addIssue({
        code: "custom",
        path: [i, "material"],
        message: "wax.duplicateMaterial",
        params: { material: c.material.trim(), line: seen + 1 },
      });
    }
  });
  const total = totalPct(components);
  if (Math.abs(total - 100) > MIX_SUM_TOLERANCE_PCT) {
    ctx.addIssue({ code: "custom", path: [], message: "wax.mixNot100", params: { totalPct: Number(total.toFixed(6)) } });
  }
}

/** A list of components with the mix checks: 1 to MIX_MAX_COMPONENTS entries, no duplicates, 100 % in all. */
export function mixSchema<T extends z.ZodRawShape & typeof componentShape>(shape: T) {
  return z
    .array(z.object(shape, keyed), keyed)
    .min(1, keyed)
    .max(MIX_MAX_COMPONENTS, keyed)
    .superRefine((components, ctx) => checkMix(components as readonly object[], ctx));
}

/** Mass fractions wᵢ = pctᵢ / Σ pct (so a mix inside the tolerance still splits to exactly 1). */
export function massFractions(components: readonly { pct: number }[]): number[] {
  const total = components.reduce((sum, c) => sum + c.pct, 0);
  return components.map((c) => c.pct / total);
}

/**
 * Density of a mix in g/cm³: ρ = 1 / Σ (wᵢ / ρᵢ), wᵢ mass fractions (from mass %), ρᵢ in g/cm³. Assumes volumes
 * add (no shrinkage on mixing) and solid densities; mass % normalised to their sum.
 */
export function mixDensity(components: readonly { pct: number; densityGPerCm3: number }[]): number {
  const w = massFractions(components);
  return 1 / components.reduce((sum, c, i) => sum + w[i] / c.densityGPerCm3, 0);
}

/**
 * Melting range of a mix in °C, taken as the envelope of its components: the lowest start to the highest end.
 * A blend may in fact melt lower (resins dissolve in molten wax), so this bounds the range, it does not predict it.
 */
export function mixMeltingRange(components: readonly { meltingRangeC: { fromC: number; toC: number } }[]): {
  fromC: number;
  toC: number;
} {
  return {
    fromC: Math.min(...components.map((c) => c.meltingRangeC.fromC)),
    toC: Math.max(...components.map((c) => c.meltingRangeC.toC)),
  };
}
