import { z } from "@/lib/zod";
import { keyed } from "./errors";
import {
  DENSITY_MAX_G_PER_CM3,
  DENSITY_MIN_G_PER_CM3,
  FLASH_POINT_MAX_C,
  FLASH_POINT_MIN_C,
  MATERIAL_REF_MAX_CHARS,
  MELT_MAX_C,
  MELT_MIN_C,
  NAME_MAX_CHARS,
  PRICE_MAX_PER_KG,
  SOURCE_MAX_CHARS,
} from "./limits";

const sourceText = z.string(keyed).trim().max(SOURCE_MAX_CHARS, keyed);

const meltingRangeSchema = z
  .object(
    {
      fromC: z.number(keyed).min(MELT_MIN_C, keyed).max(MELT_MAX_C, keyed),
      toC: z.number(keyed).min(MELT_MIN_C, keyed).max(MELT_MAX_C, keyed),
    },
    keyed,
  )
  .superRefine((r, ctx) => {
    if (r.fromC > r.toC) ctx.addIssue({ code: "custom", path: ["toC"], message: "validation.rangeOrder" });
  });

/**
 * A material's figures, each editable with its source text. Density g/cm³ (solid), temperatures °C, price per kg.
 * No defaults, so an update schema derived with .partial() changes only what it names (absent = null).
 */
export const materialSchema = z.object(
  {
    id: z.string(keyed).trim().min(1, keyed).max(MATERIAL_REF_MAX_CHARS, keyed),
    name: z.string(keyed).trim().min(1, keyed).max(NAME_MAX_CHARS, keyed),
    densityGPerCm3: z.number(keyed).min(DENSITY_MIN_G_PER_CM3, keyed).max(DENSITY_MAX_G_PER_CM3, keyed),
    meltingRangeC: meltingRangeSchema,
    /** null: not known; recipes using the material cannot be checked against the flash-point rule. */
    flashPointC: z.number(keyed).min(FLASH_POINT_MIN_C, keyed).max(FLASH_POINT_MAX_C, keyed).nullable(),
    /** Above this the material discolours (beeswax about 85 °C); null or absent when no figure is known. */
    discoloursAboveC: z.number(keyed).min(MELT_MIN_C, keyed).max(MELT_MAX_C, keyed).nullable().optional(),
    /** Workshop's currency per kg; a setting with no default source. */
    pricePerKg: z.number(keyed).min(0, keyed).max(PRICE_MAX_PER_KG, keyed).nullable().optional(),
    sources: z.object(
      { density: sourceText, melting: sourceText, flashPoint: sourceText, price: sourceText.optional() },
      keyed,
    ),
  },
  keyed,
);

export type WaxMaterial = z.output<typeof materialSchema>;
export type WaxMaterialInput = z.input<typeof materialSchema>;

const PRICE_SOURCE = "a workshop setting; no default source";
const FROM_MEMORY = "from memory; no figure in our sources";
const NO_FLASH = "not in our sources: enter the figure from the supplier's safety data sheet";

/**
 * Default materials, figures from SOURCES.md (source named beside each) or marked "from memory"/"derived".
 * Where sources disagree the lowest flash point is taken (the safe side); every figure stays editable.
 */
export const DEFAULT_MATERIALS: readonly WaxMaterial[] = [
  {
    id: "beeswax",
    name: "Beeswax",
    densityGPerCm3: 0.96,
    meltingRangeC: { fromC: 62, toC: 64 },
    flashPointC: 204,
    discoloursAboveC: 85,
    pricePerKg: null,
    sources: {
      density: "0.958–0.970 g/cm³ at 15 °C, encyclopedic entries; 0.96 taken",
      melting: "62–64 °C, encyclopedic entries; beekeeping references",
      flashPoint: "204 °C, encyclopedic entries (other sources 254–274 °C; the lowest taken)",
      price: PRICE_SOURCE,
    },
  },
  {
    id: "paraffin",
    name: "Paraffin wax",
    densityGPerCm3: 0.9,
    meltingRangeC: { fromC: 46, toC: 68 },
    flashPointC: 200,
    discoloursAboveC: null,
    pricePerKg: null,
    sources: {
      density: "about 0.90 g/cm³ solid, encyclopedic entries citing GESTIS (SDS specific gravity 0.92)",
      melting: "about 46–68 °C, encyclopedic entries citing GESTIS",
      flashPoint: "about 200–240 °C, GESTIS via encyclopedic entries (one SDS: 220 °C closed cup; the lowest taken)",
      price: PRICE_SOURCE,
    },
  },
  {
    id: "microcrystalline",
    name: "Microcrystalline wax",
    densityGPerCm3: 0.92,
    meltingRangeC: { fromC: 60, toC: 93 },
    flashPointC: null,
    discoloursAboveC: null,
    pricePerKg: null,
    sources: {
      density: `about 0.92 g/cm³, ${FROM_MEMORY}`,
      melting: "about 60–93 °C (sources differ), ASTM D127 typical ranges; trade sources",
      flashPoint: NO_FLASH,
      price: PRICE_SOURCE,
    },
  },
  {
    id: "rosin",
    name: "Pine rosin (gondorukem)",
    densityGPerCm3: 1.07,
    meltingRangeC: { fromC: 80, toC: 82 },
    flashPointC: null,
    discoloursAboveC: null,
    pricePerKg: null,
    sources: {
      density: `about 1.07 g/cm³, ${FROM_MEMORY}`,
      melting: "about 80–82 °C, Indonesian batik-wax sources",
      flashPoint: NO_FLASH,
      price: PRICE_SOURCE,
    },
  },
  {
    id: "damar",
    name: "Damar resin",
    densityGPerCm3: 1.04,
    meltingRangeC: { fromC: 82, toC: 85 },
    flashPointC: null,
    discoloursAboveC: null,
    pricePerKg: null,
    sources: {
      density: `about 1.04 g/cm³, ${FROM_MEMORY}`,
      melting: "about 82–85 °C, Indonesian batik-wax sources",
      flashPoint: NO_FLASH,
      price: PRICE_SOURCE,
    },
  },
  {
    id: "animal-fat",
    name: "Animal fat",
    densityGPerCm3: 0.9,
    meltingRangeC: { fromC: 35, toC: 50 },
    flashPointC: null,
    discoloursAboveC: null,
    pricePerKg: null,
    sources: {
      density: `no published figure in our sources; about 0.90 g/cm³ for tallow, from memory`,
      melting: `no published figure in our sources; about 35–50 °C for tallow, from memory`,
      flashPoint: `no published figure in our sources; ${NO_FLASH}`,
      price: PRICE_SOURCE,
    },
  },
  {
    id: "reclaimed",
    name: "Reclaimed wax",
    densityGPerCm3: 0.935,
    meltingRangeC: { fromC: 46, toC: 68 },
    flashPointC: null,
    discoloursAboveC: null,
    pricePerKg: null,
    sources: {
      density:
        "no published figure in our sources; derived: 0.935 g/cm³ is a 60/40 beeswax/paraffin mix (common practice), 1 / (0.6/0.96 + 0.4/0.90)",
      melting: "no published figure in our sources; derived: the span of paraffin (46–68 °C) and beeswax (62–64 °C)",
      flashPoint: `no published figure in our sources; it depends on what was reclaimed: ${NO_FLASH}`,
      price: PRICE_SOURCE,
    },
  },
];

/** Normal form of a material reference for comparison: trimmed, lower case. */
export function materialKey(ref: string): string {
  return ref.trim().toLocaleLowerCase("en");
}

/** The material a component names: its id exactly, else its name or id case-insensitively; undefined when none. */
export function resolveMaterial(ref: string, materials: readonly WaxMaterial[]): WaxMaterial | undefined {
  const exact = materials.find((m) => m.id === ref);
  if (exact) return exact;
  const key = materialKey(ref);
  return materials.find((m) => materialKey(m.name) === key) ?? materials.find((m) => materialKey(m.id) === key);
}
