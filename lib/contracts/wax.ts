// The wax room's contract with its clients: the shapes its API and pages answer with, the URLs of its routes,
// and its forms' input adapters (°F → °C, lb → kg, oz → g for people who work in imperial units). Neither
// server-only nor React: server code, client components, SWR hooks and tests all import it.
import type { WaxChangeKind, WaxMovementKind } from "@/db/schema";
import { fahrenheitToCelsius, ouncesToGrams, poundsToKilograms } from "@/lib/units";
import type { BandPlacement, FlashPointStatus, RateFit, RecipeUse, Season, WaxParams } from "@/lib/wax";
import { formChecked, formNumber, formOptional, formText, readNumber } from "./form-input";

export type UnitSystem = "metric" | "imperial";
export type Currency = "IDR" | "USD";

/** A caution or refusal before translation: its catalogue key and the values for it (the API adds `message`). */
export interface WaxNote {
  code: string;
  params: WaxParams;
  field?: string;
}

export interface MaterialRef {
  id: string;
  code: string;
  name: string;
}

export interface MaterialDto extends MaterialRef {
  densityGPerCm3: number;
  meltingRangeC: { fromC: number; toC: number };
  flashPointC: number | null;
  discoloursAboveC: number | null;
  pricePerKg: number | null;
  sources: { density: string; melting: string; flashPoint: string; price?: string };
  reorderLevelKg: number;
  /** Σ of the material's stock movements. */
  onHandKg: number;
  belowReorder: boolean;
  /** Recipes (not archived) that use it. */
  usedByRecipes: number;
  version: number;
  updatedAt: string;
}

/** A recipe the temperature rule refuses or cannot check with the current material figures. */
export interface RecipeRuleBreakDto {
  recipeId: string;
  recipeName: string;
  status: "tooNear" | "unknown" | "missingMaterial";
  problem: WaxNote;
}

export interface MaterialDetailDto extends MaterialDto {
  /** Recipes using it that now break the flash-point rule or cannot be checked. */
  recipeChecks: RecipeRuleBreakDto[];
}

export interface ChangeDto {
  id: string;
  version: number;
  kind: WaxChangeKind;
  actorName: string;
  at: string;
  changes: { field: string; from: unknown; to: unknown }[];
  note: string | null;
}

export interface MovementDto {
  id: string;
  kind: WaxMovementKind;
  kg: number;
  note: string | null;
  waxUseId: string | null;
  actorName: string;
  at: string;
}

export interface RecipeComponentDto {
  line: number;
  material: MaterialRef;
  pct: number;
  fraction: number;
}

export interface TemperatureDto {
  status: FlashPointStatus;
  fumeWarning: boolean;
  lowestFlashPoint: { materialId: string; name: string; flashPointC: number } | null;
  marginC: number | null;
  limitC: number | null;
  problem: WaxNote | null;
  warnings: WaxNote[];
}

export interface RecipeDto {
  id: string;
  name: string;
  season: Season;
  use: RecipeUse;
  components: RecipeComponentDto[];
  workingRangeC: { minC: number; maxC: number };
  workingRangeF: { minF: number; maxF: number };
  notes: string | null;
  densityGPerCm3: number;
  meltingRangeC: { fromC: number; toC: number };
  temperature: TemperatureDto;
  duplicatedFrom: { id: string; name: string } | null;
  archived: boolean;
  usage: { estimates: number; uses: number };
  version: number;
  createdAt: string;
  updatedAt: string;
}

export type RateBasis = "given" | "recipeCloth" | "recipe" | "default";

export interface EstimateResultDto {
  gramsPerMetre: number;
  kgGross: number;
  kgRecovered: number;
  kgNew: number;
  byMaterial: { material: string; code: string; name: string; pct: number; kg: number; pricePerKg: number | null; cost: number | null }[];
  densityGPerCm3: number;
  volumeLitres: number;
  cost: number | null;
  currency: Currency;
  pricesMissing: string[];
  band: BandPlacement;
  rate: { gPerM2: number; basis: RateBasis; uses: number | null; standardErrorGPerM2: number | null };
  inputs: {
    planId: string | null;
    waxedAreaPerMetreM2: number;
    metres: number;
    run: { metres: number } | { pieces: number; pieceLengthMm: number } | { kodi: number; pieceLengthMm: number };
    passes: number;
    lossPct: number;
    recoveryPct: number;
    recipeId: string | null;
    cloth: string | null;
  };
  warnings: WaxNote[];
}

export interface EstimateDto {
  id: string;
  name: string;
  planId: string | null;
  recipe: { id: string; name: string };
  inputs: EstimateResultDto["inputs"];
  results: Omit<EstimateResultDto, "inputs">;
  planned: boolean;
  version: number;
  createdByName: string;
  createdAt: string;
  updatedAt: string;
}

export interface WaxUseDto {
  id: string;
  usedOn: string;
  planId: string | null;
  runStageId: string | null;
  recipe: { id: string; name: string };
  cloth: string | null;
  waxedAreaPerMetreM2: number;
  metres: number;
  passes: number;
  /** The waxed area of the use: area per metre × metres × passes, m². */
  areaM2: number;
  grams: number;
  gramsUsed: number | null;
  potBeforeG: number | null;
  potAfterG: number | null;
  potAddedG: number | null;
  /** grams / areaM2. */
  rateGPerM2: number;
  impressions: { stampCode: string; impressions: number }[];
  note: string | null;
  recordedByName: string;
  recordedAt: string;
  withdrawn: { at: string; reason: string | null } | null;
}

export interface CalibrationPoint {
  useId: string;
  usedOn: string;
  cloth: string | null;
  areaM2: number;
  grams: number;
}

export interface RecipeCalibrationDto {
  recipeId: string;
  recipeName: string;
  enoughUses: boolean;
  fit: RateFit;
  cloths: { cloth: string; fit: RateFit }[];
  points: CalibrationPoint[];
}

export interface CalibrationDto {
  minUses: number;
  defaultRateGPerM2: number;
  recipes: RecipeCalibrationDto[];
  flagged: { useId: string | null; code: string; params: WaxParams }[];
}

export interface PurchaseLineDto {
  material: MaterialRef;
  neededKg: number;
  onHandKg: number;
  afterKg: number;
  reorderLevelKg: number;
  toBuyKg: number;
  pricePerKg: number | null;
  cost: number | null;
  belowReorderNow: boolean;
  belowReorderAfter: boolean;
}

export interface PurchaseListDto {
  lines: PurchaseLineDto[];
  totalToBuyKg: number;
  cost: number | null;
  currency: Currency;
  pricesMissing: string[];
  belowReorder: string[];
  /** Saved planned estimates that count (an estimate for a plan that an open run stamps is replaced by the run's stages). */
  estimates: { id: string; name: string; kgNew: number; recipeName: string }[];
  /** The waxing stages of runs being prepared or in work, with the wax still to put on (estimate − used, kg gross). */
  runStages: { runId: string; runName: string; stageId: string; position: number; kg: number }[];
}

export interface WaxDefaultsDto {
  waxRateGPerM2: number;
  waxLossPct: number;
  waxRecoveryPct: number;
  /** The recovery % measured at the runs' boil-offs; estimates take it as their default recovery when there is one. */
  measuredRecoveryPct: number | null;
  /** How many runs' boil-offs the measured recovery comes from (0 before the first). */
  measuredRecoveryBoilOffs: number;
  currency: Currency;
  /** The workshop settings' version a change starts from. */
  version: number;
}

const enc = encodeURIComponent;
const withQuery = (path: string, query: string | URLSearchParams = "") => {
  const q = String(query);
  return q ? `${path}?${q}` : path;
};

export const waxUrls = {
  estimate: () => "/api/v1/wax/estimate",
  estimates: (query: string | URLSearchParams = "") => withQuery("/api/v1/wax/estimates", query),
  savedEstimate: (id: string) => `/api/v1/wax/estimates/${enc(id)}`,
  recipes: (query: string | URLSearchParams = "") => withQuery("/api/v1/wax/recipes", query),
  recipe: (id: string) => `/api/v1/wax/recipes/${enc(id)}`,
  duplicate: (id: string) => `/api/v1/wax/recipes/${enc(id)}/duplicate`,
  recipeHistory: (id: string) => `/api/v1/wax/recipes/${enc(id)}/history`,
  compare: (a: string, b: string) => withQuery("/api/v1/wax/recipes/compare", new URLSearchParams({ a, b })),
  materials: () => "/api/v1/wax/materials",
  material: (id: string) => `/api/v1/wax/materials/${enc(id)}`,
  materialHistory: (id: string) => `/api/v1/wax/materials/${enc(id)}/history`,
  movements: (id: string) => `/api/v1/wax/materials/${enc(id)}/movements`,
  uses: (query: string | URLSearchParams = "") => withQuery("/api/v1/wax/uses", query),
  use: (id: string) => `/api/v1/wax/uses/${enc(id)}`,
  withdraw: (id: string) => `/api/v1/wax/uses/${enc(id)}/withdraw`,
  calibration: () => "/api/v1/wax/calibration",
  purchaseList: () => "/api/v1/wax/purchase-list",
  defaults: () => "/api/v1/wax/defaults",
};

/** The wax room's pages. */
export const waxPages = {
  overview: "/wax",
  recipes: "/wax/recipes",
  newRecipe: "/wax/recipes/new",
  recipe: (id: string) => `/wax/recipes/${enc(id)}`,
  editRecipe: (id: string) => `/wax/recipes/${enc(id)}/edit`,
  compareBase: "/wax/recipes/compare",
  compare: (a: string, b?: string) => withQuery("/wax/recipes/compare", new URLSearchParams(b ? { a, b } : { a })),
  materials: "/wax/materials",
  material: (id: string) => `/wax/materials/${enc(id)}`,
  estimates: "/wax/estimates",
  /** The estimate form with a saved plan chosen: `/wax/estimates?plan=<id>`. */
  estimatesForPlan: (planId: string) => withQuery("/wax/estimates", new URLSearchParams({ plan: planId })),
  uses: "/wax/uses",
  purchase: "/wax/purchase",
};

// --- form input: the wax room's forms → their schemas' input (°C, kg, g) ---------------------------------------

const imperialOf = (form: FormData) => formText(form, "unitSystem") === "imperial";
/** A number field as given (undefined when empty, NaN when not a number, so the schema names the field). */
const num = (form: FormData, name: string, locale: string) => formNumber(form, name, locale) ?? undefined;
const converted = (value: number | undefined, imperial: boolean, toMetric: (v: number) => number) => (value === undefined || Number.isNaN(value) || !imperial ? value : toMetric(value));
const temp = (form: FormData, name: string, locale: string) => converted(num(form, name, locale), imperialOf(form), fahrenheitToCelsius);

/** The recipe form's component rows in order (named components.<i>.material / .pct); an empty row is kept, so its message stands beside it. */
function componentRows(form: FormData, locale: string): { material: string; pct: number | undefined }[] {
  const indices = new Set<number>();
  for (const key of form.keys()) {
    const m = /^components\.(\d+)\.(material|pct)$/.exec(key);
    if (m) indices.add(Number(m[1]));
  }
  return [...indices]
    .sort((a, b) => a - b)
    .map((i) => ({ material: formText(form, `components.${i}.material`).trim(), pct: num(form, `components.${i}.pct`, locale) }));
}

/** The recipe form (working range in the person's unit; a hidden unitSystem) → createRecipeSchema / updateRecipeSchema. */
export function recipeFormInput(form: FormData, mode: "create" | "update", locale: string): Record<string, unknown> {
  const input: Record<string, unknown> = {
    name: formText(form, "name"),
    season: formOptional(form, "season"),
    use: formOptional(form, "use"),
    components: componentRows(form, locale),
    workingRangeC: { minC: temp(form, "workingMin", locale), maxC: temp(form, "workingMax", locale) },
    notes: formText(form, "notes"),
  };
  if (mode === "update") input.version = formText(form, "version");
  return input;
}

/** The duplicate form → duplicateRecipeSchema. */
export const duplicateFormInput = (form: FormData) => ({ name: formText(form, "name"), season: formOptional(form, "season") });

/** The material form (temperatures in the person's unit, reorder level kg or lb) → create/updateMaterialSchema. */
export function materialFormInput(form: FormData, mode: "create" | "update", locale: string): Record<string, unknown> {
  const imperial = imperialOf(form);
  const flash = formText(form, "flashPoint").trim();
  const discolours = formText(form, "discoloursAbove").trim();
  const price = formText(form, "pricePerKg").trim();
  const priceValue = price === "" ? null : (readNumber(price, locale) ?? Number.NaN);
  const input: Record<string, unknown> = {
    name: formText(form, "name"),
    densityGPerCm3: num(form, "densityGPerCm3", locale),
    meltingRangeC: { fromC: temp(form, "meltFrom", locale), toC: temp(form, "meltTo", locale) },
    flashPointC: flash === "" ? null : temp(form, "flashPoint", locale),
    discoloursAboveC: discolours === "" ? null : temp(form, "discoloursAbove", locale),
    // A price per lb in imperial is a price per kg × 0.4536: per kg = per lb / 0.45359237.
    pricePerKg: priceValue === null || Number.isNaN(priceValue) || !imperial ? priceValue : priceValue / poundsToKilograms(1),
    reorderLevelKg: converted(num(form, "reorderLevel", locale), imperial, poundsToKilograms) ?? 0,
    sources: { density: formText(form, "sourceDensity"), melting: formText(form, "sourceMelting"), flashPoint: formText(form, "sourceFlashPoint"), price: formText(form, "sourcePrice") },
  };
  const code = formOptional(form, "code");
  if (code !== undefined) input.code = code;
  if (mode === "update") input.version = formText(form, "version");
  return input;
}

/** The stock movement form (kg or lb; a correction may be negative) → stockMovementSchema. */
export function movementFormInput(form: FormData, locale: string) {
  return { kind: formOptional(form, "kind"), kg: converted(num(form, "amount", locale), imperialOf(form), poundsToKilograms), note: formText(form, "note") };
}

/** The estimate form → estimateRequestSchema / saveEstimateSchema (area or plan, run in one way, optional rate). */
export function estimateFormInput(form: FormData, locale: string): Record<string, unknown> {
  const runKind = formText(form, "runKind") || "metres";
  const planId = formOptional(form, "planId");
  const input: Record<string, unknown> = {
    planId,
    waxedAreaPerMetreM2: planId ? undefined : num(form, "waxedAreaPerMetreM2", locale),
    passes: num(form, "passes", locale),
    rateGPerM2: num(form, "rateGPerM2", locale),
    lossPct: num(form, "lossPct", locale),
    recoveryPct: num(form, "recoveryPct", locale),
    recipeId: formOptional(form, "recipeId"),
    cloth: formOptional(form, "cloth"),
    name: formOptional(form, "name"),
    planned: formChecked(form, "planned"),
  };
  if (runKind === "metres") input.metres = num(form, "metres", locale);
  else {
    input[runKind === "kodi" ? "kodi" : "pieces"] = num(form, "runCount", locale);
    input.pieceLengthMm = num(form, "pieceLengthMm", locale);
  }
  return Object.fromEntries(Object.entries(input).filter(([, v]) => v !== undefined));
}

/** The wax use form (grams in g or oz) → recordWaxUseSchema; the way of weighing picks grams or the pot's weights. */
export function waxUseFormInput(form: FormData, locale: string): Record<string, unknown> {
  const imperial = imperialOf(form);
  const grams = (name: string) => converted(num(form, name, locale), imperial, ouncesToGrams);
  const weighed = formText(form, "weighing") === "pot";
  const planId = formOptional(form, "planId");
  const input: Record<string, unknown> = {
    usedOn: formText(form, "usedOn"),
    recipeId: formOptional(form, "recipeId"),
    planId,
    waxedAreaPerMetreM2: planId ? undefined : num(form, "waxedAreaPerMetreM2", locale),
    metres: num(form, "metres", locale),
    passes: num(form, "passes", locale),
    cloth: formOptional(form, "cloth"),
    gramsUsed: weighed ? undefined : grams("gramsUsed"),
    potBeforeG: weighed ? grams("potBeforeG") : undefined,
    potAfterG: weighed ? grams("potAfterG") : undefined,
    potAddedG: weighed ? grams("potAddedG") : undefined,
    stampCode: formOptional(form, "stampCode"),
    impressions: num(form, "impressions", locale),
    note: formText(form, "note"),
  };
  return Object.fromEntries(Object.entries(input).filter(([, v]) => v !== undefined));
}

/** The wax defaults form → updateWaxDefaultsSchema. */
export function waxDefaultsFormInput(form: FormData, locale: string) {
  return { version: formText(form, "version"), waxRateGPerM2: num(form, "waxRateGPerM2", locale), waxLossPct: num(form, "waxLossPct", locale), waxRecoveryPct: num(form, "waxRecoveryPct", locale) };
}
