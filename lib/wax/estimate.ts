import { z } from "@/lib/zod";
import { keyed, parseWax, type WaxWarning } from "./errors";
import {
  AREA_PER_METRE_MAX_M2,
  DENSITY_MAX_G_PER_CM3,
  DENSITY_MIN_G_PER_CM3,
  LOSS_MAX_PCT,
  PASSES_MAX,
  PRICE_MAX_PER_KG,
  PUBLISHED_BAND,
  RATE_MAX_G_PER_M2,
  RECOVERY_MAX_PCT,
  RUN_MAX_METRES,
} from "./limits";
import type { WaxMaterial } from "./materials";
import { componentShape, massFractions, mixDensity, mixSchema } from "./mix";
import { resolveComponents } from "./recipe";

const positive = (max: number) => z.number(keyed).gt(0, { error: "wax.mustBePositive" }).max(max, keyed);

/** A component of the mix being estimated, with its density and (when set) its price per kg. */
export const estimateComponentShape = {
  ...componentShape,
  densityGPerCm3: z.number(keyed).min(DENSITY_MIN_G_PER_CM3, keyed).max(DENSITY_MAX_G_PER_CM3, keyed),
  pricePerKg: z.number(keyed).min(0, keyed).max(PRICE_MAX_PER_KG, keyed).nullable().default(null),
};

/**
 * The estimator's input (SPEC 5.3 and section 6). The API body extends it: a plan id instead of the area,
 * a recipe id or a recipe instead of the resolved components.
 */
export const estimateInputSchema = z.object(
  {
    /** Waxed area per metre of cloth, m², both faces already counted when the plan waxes both. */
    waxedAreaPerMetreM2: positive(AREA_PER_METRE_MAX_M2),
    metres: positive(RUN_MAX_METRES),
    /** Waxing passes, one per colour stage. */
    passes: z.number(keyed).int(keyed).min(1, keyed).max(PASSES_MAX, keyed).default(1),
    /** Application rate, g per m² of waxed area per pass. */
    rateGPerM2: positive(RATE_MAX_G_PER_M2),
    lossPct: z.number(keyed).min(0, keyed).max(LOSS_MAX_PCT, keyed).default(0),
    /** Share of the gross wax recovered after boiling off and reused. */
    recoveryPct: z.number(keyed).min(0, keyed).max(RECOVERY_MAX_PCT, keyed).default(0),
    components: mixSchema(estimateComponentShape),
  },
  keyed,
);

export type EstimateInput = z.input<typeof estimateInputSchema>;
export type EstimateSpec = z.output<typeof estimateInputSchema>;

/** below < 100 g/m ≤ benchmark ≤ 150 g/m < measured ≤ 250 g/m < above (the SPEC's "about 100–250" band). */
export type BandPosition = "below" | "benchmark" | "measured" | "above";

export interface BandPlacement {
  position: BandPosition;
  gramsPerMetre: number;
  benchmarkGPerM: { min: number; max: number };
  measuredGPerM: readonly number[];
  sanityGPerM: { min: number; max: number };
  source: string;
}

export interface WaxEstimate {
  gramsPerMetre: number;
  kgGross: number;
  kgRecovered: number;
  kgNew: number;
  byMaterial: { material: string; pct: number; kg: number; pricePerKg: number | null; cost: number | null }[];
  densityGPerCm3: number;
  /** Solid volume of the gross wax, litres: kgGross / density. */
  volumeLitres: number;
  /** Cost of the new wax (recovered wax is reused at no cost); null unless every component has a price. */
  cost: number | null;
  pricesMissing: string[];
  band: BandPlacement;
  warnings: WaxWarning[];
}

/**
 * Where a whole-process figure (g per metre of cloth) sits against the published band for stamped batik:
 * benchmark 100–150 g/m, measured 152–242 g/m (Nurdalia 2006), the SPEC's sanity band about 100–250 g/m;
 * values between 150 and 250 count as "measured".
 */
export function bandPosition(gramsPerMetre: number): BandPlacement {
  const { benchmarkGPerM, measuredGPerM, sanityGPerM, source } = PUBLISHED_BAND;
  let position: BandPosition = "measured";
  if (gramsPerMetre < benchmarkGPerM.min) position = "below";
  else if (gramsPerMetre <= benchmarkGPerM.max) position = "benchmark";
  else if (gramsPerMetre > sanityGPerM.max) position = "above";
  return { position, gramsPerMetre, benchmarkGPerM, measuredGPerM, sanityGPerM, source };
}

/**
 * Wax for a run (SPEC 5.3): gramsPerMetre = area m²/m × passes × rate g/m² × (1 + loss/100);
 * kgGross = gramsPerMetre × metres / 1000; kgRecovered = kgGross × recovery/100; kgNew = kgGross − kgRecovered;
 * byMaterial splits kgNew by mass fraction; density 1 / Σ (wᵢ/ρᵢ) g/cm³; cost Σ kgᵢ × priceᵢ when every price is
 * known. Warns outside the published band and where prices are missing. Throws WaxInputError for bad input.
 */
export function estimateWax(input: EstimateInput): WaxEstimate {
  const spec = parseWax(estimateInputSchema, input);
  const gramsPerMetre = spec.waxedAreaPerMetreM2 * spec.passes * spec.rateGPerM2 * (1 + spec.lossPct / 100);
  const kgGross = (gramsPerMetre * spec.metres) / 1000;
  const kgRecovered = (kgGross * spec.recoveryPct) / 100;
  const kgNew = kgGross - kgRecovered;
  const fractions = massFractions(spec.components);
  const byMaterial = spec.components.map((c, i) => {
    const kg = kgNew * fractions[i];
    return { material: c.material, pct: c.pct, kg, pricePerKg: c.pricePerKg, cost: c.pricePerKg === null ? null : kg * c.pricePerKg };
  });
  const pricesMissing = byMaterial.filter((m) => m.pricePerKg === null).map((m) => m.material);
  const cost = pricesMissing.length === 0 ? byMaterial.reduce((sum, m) => sum + (m.cost ?? 0), 0) : null;
  const densityGPerCm3 = mixDensity(spec.components);
  const band = bandPosition(gramsPerMetre);

  const warnings: WaxWarning[] = [];
  const bandParams = { gramsPerMetre, min: band.sanityGPerM.min, max: band.sanityGPerM.max, source: band.source };
  if (band.position === "below") warnings.push({ code: "wax.belowPublishedBand", params: bandParams });
  if (band.position === "above") warnings.push({ code: "wax.abovePublishedBand", params: bandParams });
  if (pricesMissing.length > 0) warnings.push({ code: "wax.priceMissing", params: { materials: pricesMissing.join(", ") } });

  return {
    gramsPerMetre,
    kgGross,
    kgRecovered,
    kgNew,
    byMaterial,
    densityGPerCm3,
    volumeLitres: kgGross / densityGPerCm3,
    cost,
    pricesMissing,
    band,
    warnings,
  };
}

/**
 * A recipe's components as estimator input: each material resolved (id, or name case-insensitively) and given
 * its density and price; `material` becomes the material's id. Throws WaxInputError for unknown materials.
 */
export function estimateComponents(
  components: readonly { material: string; pct: number }[],
  materials: readonly WaxMaterial[],
): { material: string; pct: number; densityGPerCm3: number; pricePerKg: number | null }[] {
  return resolveComponents(components, materials).map((c) => ({
    material: c.materialId,
    pct: c.pct,
    densityGPerCm3: c.material.densityGPerCm3,
    pricePerKg: c.material.pricePerKg ?? null,
  }));
}

/**
 * Default application rate from a film thickness, g per m² of waxed area: thickness mm × 1000 × density g/cm³
 * (1 m² × 1 mm = 1000 cm³). Assumes the film is solid wax of the mix's density, one pass.
 */
export function rateFromFilmThickness(filmThicknessMm: number, densityGPerCm3: number): number {
  return filmThicknessMm * 1000 * densityGPerCm3;
}
