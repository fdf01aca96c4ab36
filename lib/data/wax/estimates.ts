import "server-only";
import { desc, eq, sql } from "drizzle-orm";
import { db } from "@/db";
import { waxEstimates, waxRecipes, type WaxEstimateRow } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import type { EstimateDto, EstimateResultDto, RateBasis } from "@/lib/contracts/wax";
import { AppError } from "@/lib/errors";
import { runFieldsOf, type EstimateRequest, type SaveEstimateInput, type UpdateEstimateInput } from "@/lib/validation/wax";
import { estimateComponents, estimateWax, parseWax, runLengthSchema, runMetres, type RunLength } from "@/lib/wax";
import { measuredRecovery } from "../runs/records";
import { currentSettings } from "../settings";
import { calibratedRateFor } from "./calibration";
import { planForWax } from "./plans";
import { componentsById, loadMaterials, loadRecipes, toDomainMaterial, toNote, type Db } from "./shared";
import { audit } from "@/lib/log";

// Estimates: the wax a run takes (lib/wax estimateWax) for a saved plan or a waxed area per metre, a saved recipe
// or an inline mix, at the given rate or the calibrated one (else the wax master's default); saved ones count
// toward the purchase list when planned.

const unknownPlan = () => new AppError("unprocessable", {}, { planId: ["wax.planUnknown"] });
const unknownRecipe = () => new AppError("unprocessable", {}, { recipeId: ["wax.recipeUnknown"] });

/** Computes an estimate without saving it (POST /api/v1/wax/estimate). */
export async function computeEstimate(actor: Actor, request: EstimateRequest, tx: Db = db): Promise<EstimateResultDto> {
  assertCan(actor, "data:read");
  const { settings } = await currentSettings();

  let waxedAreaPerMetreM2 = request.waxedAreaPerMetreM2;
  let run: RunLength;
  const runFields = runFieldsOf(request);
  if (request.planId !== undefined) {
    const plan = await planForWax(actor, request.planId);
    if (!plan) throw unknownPlan();
    waxedAreaPerMetreM2 = plan.waxedAreaPerMetreM2;
    run = Object.keys(runFields).length ? parseWax(runLengthSchema, runFields) : { metres: plan.runLengthMm / 1000 };
  } else {
    run = parseWax(runLengthSchema, runFields);
  }
  const metres = runMetres(run);

  const materials = await loadMaterials(tx);
  let components: { material: string; pct: number }[];
  if (request.recipeId !== undefined) {
    const [recipe] = await loadRecipes(tx, [request.recipeId]);
    if (!recipe) throw unknownRecipe();
    components = recipe.components.map((c) => ({ material: c.materialId, pct: c.pct }));
  } else {
    components = componentsById(request.recipe!.components, materials, "recipe.components");
  }

  let rate: EstimateResultDto["rate"];
  if (request.rateGPerM2 !== undefined) rate = { gPerM2: request.rateGPerM2, basis: "given", uses: null, standardErrorGPerM2: null };
  else {
    const calibrated = request.recipeId ? await calibratedRateFor(tx, request.recipeId, request.cloth) : null;
    rate = calibrated
      ? { gPerM2: calibrated.rateGPerM2, basis: calibrated.basis as RateBasis, uses: calibrated.fit.uses, standardErrorGPerM2: calibrated.fit.standardErrorGPerM2 }
      : { gPerM2: settings.waxRateGPerM2, basis: "default", uses: null, standardErrorGPerM2: null };
  }
  const lossPct = request.lossPct ?? settings.waxLossPct;
  // The boil-offs' measured recovery, once runs have recorded one, replaces the wax master's setting as the default.
  const recoveryPct = request.recoveryPct ?? (await measuredRecovery(tx)) ?? settings.waxRecoveryPct;

  const e = estimateWax({
    waxedAreaPerMetreM2: waxedAreaPerMetreM2!,
    metres,
    passes: request.passes,
    rateGPerM2: rate.gPerM2,
    lossPct,
    recoveryPct,
    components: estimateComponents(components, materials.map(toDomainMaterial)),
  });
  const byId = new Map(materials.map((m) => [m.id, m]));
  return {
    gramsPerMetre: e.gramsPerMetre,
    kgGross: e.kgGross,
    kgRecovered: e.kgRecovered,
    kgNew: e.kgNew,
    byMaterial: e.byMaterial.map((m) => ({ material: m.material, code: byId.get(m.material)?.code ?? m.material, name: byId.get(m.material)?.name ?? m.material, pct: m.pct, kg: m.kg, pricePerKg: m.pricePerKg, cost: m.cost })),
    densityGPerCm3: e.densityGPerCm3,
    volumeLitres: e.volumeLitres,
    cost: e.cost,
    currency: settings.currency,
    pricesMissing: e.pricesMissing.map((id) => byId.get(id)?.name ?? id),
    band: e.band,
    rate,
    inputs: {
      planId: request.planId ?? null,
      waxedAreaPerMetreM2: waxedAreaPerMetreM2!,
      metres,
      run,
      passes: request.passes,
      lossPct,
      recoveryPct,
      recipeId: request.recipeId ?? null,
      cloth: request.cloth ?? null,
    },
    // Material ids in the domain's warnings read as names.
    warnings: e.warnings.map((w) => toNote(w.code === "wax.priceMissing" ? { ...w, params: { materials: e.pricesMissing.map((id) => byId.get(id)?.name ?? id).join(", ") } } : w)),
  };
}

function toEstimateDto(row: WaxEstimateRow, recipeName: string): EstimateDto {
  const { inputs, ...results } = row.results as unknown as EstimateResultDto;
  return {
    id: row.id,
    name: row.name,
    planId: row.planId,
    recipe: { id: row.recipeId, name: recipeName },
    inputs: (row.inputs as unknown as EstimateResultDto["inputs"]) ?? inputs,
    results,
    planned: row.planned,
    version: row.version,
    createdByName: row.createdByName,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

async function estimateRows(tx: Db, where?: ReturnType<typeof eq>) {
  return tx
    .select({ estimate: waxEstimates, recipeName: waxRecipes.name })
    .from(waxEstimates)
    .innerJoin(waxRecipes, eq(waxRecipes.id, waxEstimates.recipeId))
    .where(where)
    .orderBy(desc(waxEstimates.createdAt));
}

/** Saves an estimate as computed now, with a name; planned ones count toward the purchase list. */
export async function saveEstimate(actor: Actor, input: SaveEstimateInput): Promise<EstimateDto> {
  assertCan(actor, "wax:write");
  const { name, planned, ...request } = input;
  return db.transaction(async (tx) => {
    const result = await computeEstimate(actor, request, tx);
    const { inputs, ...results } = result;
    const [row] = await tx
      .insert(waxEstimates)
      .values({
        name,
        planId: request.planId ?? null,
        recipeId: request.recipeId!,
        inputs,
        results: results as unknown as Record<string, unknown>,
        gramsPerMetre: result.gramsPerMetre,
        kgNew: result.kgNew,
        planned,
        createdBy: actor.id,
        createdByName: actor.name,
      })
      .returning();
    const [{ recipeName }] = await estimateRows(tx, eq(waxEstimates.id, row.id));
    return toEstimateDto(row, recipeName);
  });
}

export async function listEstimates(actor: Actor, query: { planned?: boolean } = {}): Promise<EstimateDto[]> {
  assertCan(actor, "data:read");
  const rows = await estimateRows(db, query.planned === undefined ? undefined : eq(waxEstimates.planned, query.planned));
  return rows.map((r) => toEstimateDto(r.estimate, r.recipeName));
}

export async function getEstimate(actor: Actor, id: string): Promise<EstimateDto> {
  assertCan(actor, "data:read");
  const [row] = await estimateRows(db, eq(waxEstimates.id, id));
  if (!row) throw new AppError("notFound");
  return toEstimateDto(row.estimate, row.recipeName);
}

/** Renames an estimate or marks it planned (or not), from its version. */
export async function updateEstimate(actor: Actor, id: string, input: UpdateEstimateInput): Promise<EstimateDto> {
  assertCan(actor, "wax:write");
  await db.transaction(async (tx) => {
    const [row] = await tx.select().from(waxEstimates).where(eq(waxEstimates.id, id)).for("update");
    if (!row) throw new AppError("notFound");
    if (row.version !== input.version) throw new AppError("versionConflict");
    const set = { ...(input.name !== undefined ? { name: input.name } : {}), ...(input.planned !== undefined ? { planned: input.planned } : {}) };
    if (Object.entries(set).every(([k, v]) => row[k as keyof typeof row] === v)) return;
    await tx
      .update(waxEstimates)
      .set({ ...set, version: sql`${waxEstimates.version} + 1`, updatedAt: sql`now()` })
      .where(eq(waxEstimates.id, id));
  });
  return getEstimate(actor, id);
}

/** Deletes a saved estimate (nothing points at estimates). */
export async function deleteEstimate(actor: Actor, id: string, version?: number): Promise<void> {
  assertCan(actor, "wax:write");
  await db.transaction(async (tx) => {
    const [row] = await tx.select().from(waxEstimates).where(eq(waxEstimates.id, id)).for("update");
    if (!row) throw new AppError("notFound");
    if (version !== undefined && row.version !== version) throw new AppError("versionConflict");
    await tx.delete(waxEstimates).where(eq(waxEstimates.id, id));
  });
  audit("record.deleted", actor, { kind: "estimate", id });
}
