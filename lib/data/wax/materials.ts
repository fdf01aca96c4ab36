import "server-only";
import { and, count, desc, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { waxMaterialChanges, waxMaterials, waxRecipeComponents, waxRecipes, waxStockMovements, type WaxMaterialRow } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import type { ChangeDto, MaterialDetailDto, MaterialDto, MovementDto, RecipeRuleBreakDto } from "@/lib/contracts/wax";
import { AppError } from "@/lib/errors";
import type { CreateMaterialInput, StockMovementInput, UpdateMaterialInput } from "@/lib/validation/wax";
import { recipesBreakingTemperatureRule } from "@/lib/wax";
import { isUniqueViolation } from "../stamps/events";
import { bumpMaterial, changesBetween, loadMaterials, loadRecipes, materialRow, onHandByMaterial, recordMaterialChange, toDomainMaterial, toNote, toRecipeMix, type Db } from "./shared";

// Wax materials: their figures with sources, stock as movements, reorder levels, and the re-check of every recipe
// using a material whose flash point changes or becomes unknown.

const trackedFields = ["code", "name", "densityGPerCm3", "meltFromC", "meltToC", "flashPointC", "discoloursAboveC", "pricePerKg", "reorderLevelKg", "sources"] as const;

function toMaterialDto(row: WaxMaterialRow, onHandKg: number, usedByRecipes: number): MaterialDto {
  return {
    id: row.id,
    code: row.code,
    name: row.name,
    densityGPerCm3: row.densityGPerCm3,
    meltingRangeC: { fromC: row.meltFromC, toC: row.meltToC },
    flashPointC: row.flashPointC,
    discoloursAboveC: row.discoloursAboveC,
    pricePerKg: row.pricePerKg,
    sources: row.sources,
    reorderLevelKg: row.reorderLevelKg,
    onHandKg,
    belowReorder: onHandKg < row.reorderLevelKg,
    usedByRecipes,
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
  };
}

async function recipeUseCounts(tx: Db): Promise<Map<string, number>> {
  const rows = await tx
    .select({ materialId: waxRecipeComponents.materialId, n: count() })
    .from(waxRecipeComponents)
    .innerJoin(waxRecipes, eq(waxRecipes.id, waxRecipeComponents.recipeId))
    .where(isNull(waxRecipes.archivedAt))
    .groupBy(waxRecipeComponents.materialId);
  return new Map(rows.map((r) => [r.materialId, r.n]));
}

/** Every material with its stock on hand, by name. */
export async function listMaterials(actor: Actor): Promise<MaterialDto[]> {
  assertCan(actor, "data:read");
  const [rows, onHand, uses] = await Promise.all([loadMaterials(db), onHandByMaterial(db), recipeUseCounts(db)]);
  return rows.map((r) => toMaterialDto(r, onHand.get(r.id) ?? 0, uses.get(r.id) ?? 0));
}

/**
 * Recipes (not archived) using the material that break the flash-point rule, or cannot be checked against it,
 * with the material figures as stored now (lib/wax recipesBreakingTemperatureRule).
 */
export async function recipeChecksFor(tx: Db, materialId: string): Promise<RecipeRuleBreakDto[]> {
  const [materials, recipes] = await Promise.all([loadMaterials(tx), loadRecipes(tx)]);
  const active = recipes.filter((r) => !r.row.archivedAt).map(toRecipeMix);
  return recipesBreakingTemperatureRule(materials.map(toDomainMaterial), active, { usingMaterial: materialId }).map((b) => ({
    recipeId: b.recipeId,
    recipeName: b.recipeName,
    status: b.status,
    problem: toNote(b.problem),
  }));
}

export async function getMaterial(actor: Actor, id: string): Promise<MaterialDetailDto> {
  assertCan(actor, "data:read");
  const row = await materialRow(db, id);
  if (!row) throw new AppError("notFound");
  const [onHand, uses, recipeChecks] = await Promise.all([onHandByMaterial(db), recipeUseCounts(db), recipeChecksFor(db, id)]);
  return { ...toMaterialDto(row, onHand.get(id) ?? 0, uses.get(id) ?? 0), recipeChecks };
}

/** A code from a name: lower case, letters and digits, dashes between ("Damar resin" → "damar-resin"). */
function codeFromName(name: string): string {
  const code = name
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 40)
    .replace(/-+$/, "");
  return code || "material";
}

function taken(error: unknown): never | void {
  if (isUniqueViolation(error, "wax_materials_code_key")) throw new AppError("materialTaken", {}, { code: ["errors.materialTaken"] });
  if (isUniqueViolation(error, "wax_materials_name_key")) throw new AppError("materialTaken", {}, { name: ["errors.materialTaken"] });
}

const columnsOf = (input: Omit<Partial<CreateMaterialInput>, "sources">) => ({
  ...(input.name !== undefined ? { name: input.name } : {}),
  ...(input.densityGPerCm3 !== undefined ? { densityGPerCm3: input.densityGPerCm3 } : {}),
  ...(input.meltingRangeC !== undefined ? { meltFromC: input.meltingRangeC.fromC, meltToC: input.meltingRangeC.toC } : {}),
  ...(input.flashPointC !== undefined ? { flashPointC: input.flashPointC } : {}),
  ...(input.discoloursAboveC !== undefined ? { discoloursAboveC: input.discoloursAboveC } : {}),
  ...(input.pricePerKg !== undefined ? { pricePerKg: input.pricePerKg } : {}),
  ...(input.reorderLevelKg !== undefined ? { reorderLevelKg: input.reorderLevelKg } : {}),
});

export async function createMaterial(actor: Actor, input: CreateMaterialInput): Promise<MaterialDetailDto> {
  assertCan(actor, "wax:write");
  let id = "";
  try {
    id = await db.transaction(async (tx) => {
      const [row] = await tx
        .insert(waxMaterials)
        .values({
          code: input.code ?? codeFromName(input.name),
          name: input.name,
          densityGPerCm3: input.densityGPerCm3,
          meltFromC: input.meltingRangeC.fromC,
          meltToC: input.meltingRangeC.toC,
          flashPointC: input.flashPointC,
          discoloursAboveC: input.discoloursAboveC ?? null,
          pricePerKg: input.pricePerKg ?? null,
          reorderLevelKg: input.reorderLevelKg,
          sources: input.sources,
        })
        .returning();
      await recordMaterialChange(tx, row.id, actor, { version: row.version, kind: "created" });
      return row.id;
    });
  } catch (error) {
    taken(error);
    throw error;
  }
  return getMaterial(actor, id);
}

export interface MaterialUpdateResult {
  material: MaterialDetailDto;
  /** Set when the change touched the temperature figures: the recipes re-checked and those that now break the rule. */
  recheck: { recipesChecked: number; breaking: RecipeRuleBreakDto[] } | null;
}

/**
 * Changes a material made from `input.version` (409 versionConflict on someone else's save in between), with one
 * history entry of what changed. When its flash point (or discolouring point) changes, or it has none, every
 * recipe using it is checked again and the answer says which now break the temperature rule.
 */
export async function updateMaterial(actor: Actor, id: string, input: UpdateMaterialInput): Promise<MaterialUpdateResult> {
  assertCan(actor, "wax:write");
  try {
    const recheck = await db.transaction(async (tx) => {
      const current = await materialRow(tx, id, true);
      if (!current) throw new AppError("notFound");
      if (current.version !== input.version) throw new AppError("versionConflict");
      const next = {
        ...columnsOf(input),
        ...(input.code !== undefined ? { code: input.code } : {}),
        ...(input.sources !== undefined ? { sources: { ...current.sources, ...Object.fromEntries(Object.entries(input.sources).filter(([, v]) => v !== undefined)) } } : {}),
      };
      const changes = changesBetween(current as unknown as Record<string, unknown>, next, trackedFields);
      if (changes.length === 0) return null;
      const [updated] = await tx
        .update(waxMaterials)
        .set({ ...next, ...bumpMaterial })
        .where(eq(waxMaterials.id, id))
        .returning({ version: waxMaterials.version, flashPointC: waxMaterials.flashPointC });
      await recordMaterialChange(tx, id, actor, { version: updated.version, kind: "edited", changes });
      const heat = changes.some((c) => c.field === "flashPointC" || c.field === "discoloursAboveC" || c.field === "meltFromC" || c.field === "meltToC");
      if (!heat && updated.flashPointC !== null) return null;
      const breaking = await recipeChecksFor(tx, id);
      const [{ n }] = await tx
        .select({ n: count() })
        .from(waxRecipeComponents)
        .innerJoin(waxRecipes, eq(waxRecipes.id, waxRecipeComponents.recipeId))
        .where(and(eq(waxRecipeComponents.materialId, id), isNull(waxRecipes.archivedAt)));
      return { recipesChecked: n, breaking };
    });
    return { material: await getMaterial(actor, id), recheck };
  } catch (error) {
    taken(error);
    throw error;
  }
}

export async function materialHistory(actor: Actor, id: string): Promise<ChangeDto[]> {
  assertCan(actor, "data:read");
  if (!(await materialRow(db, id))) throw new AppError("notFound");
  const rows = await db.select().from(waxMaterialChanges).where(eq(waxMaterialChanges.materialId, id)).orderBy(desc(waxMaterialChanges.at), desc(waxMaterialChanges.version));
  return rows.map((r) => ({ id: r.id, version: r.version, kind: r.kind, actorName: r.actorName, at: r.at.toISOString(), changes: r.changes, note: r.note }));
}

const toMovementDto = (m: typeof waxStockMovements.$inferSelect): MovementDto => ({
  id: m.id,
  kind: m.kind,
  kg: m.kg,
  note: m.note,
  waxUseId: m.waxUseId,
  actorName: m.actorName,
  at: m.at.toISOString(),
});

/** A material's stock movements, newest first. */
export async function listMovements(actor: Actor, materialId: string, limit = 200): Promise<MovementDto[]> {
  assertCan(actor, "data:read");
  if (!(await materialRow(db, materialId))) throw new AppError("notFound");
  const rows = await db.select().from(waxStockMovements).where(eq(waxStockMovements.materialId, materialId)).orderBy(desc(waxStockMovements.at)).limit(limit);
  return rows.map(toMovementDto);
}

/** Records a receipt, recovered wax or a correction; stock is never overwritten, only moved. */
export async function recordMovement(actor: Actor, materialId: string, input: StockMovementInput): Promise<{ movement: MovementDto; onHandKg: number }> {
  assertCan(actor, "wax:write");
  return db.transaction(async (tx) => {
    if (!(await materialRow(tx, materialId, true))) throw new AppError("notFound");
    const [row] = await tx
      .insert(waxStockMovements)
      .values({ materialId, kind: input.kind, kg: input.kg, note: input.note ?? null, actorId: actor.id, actorName: actor.name })
      .returning();
    const onHand = await onHandByMaterial(tx);
    return { movement: toMovementDto(row), onHandKg: onHand.get(materialId) ?? 0 };
  });
}
