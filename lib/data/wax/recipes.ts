import "server-only";
import { count, desc, eq, isNotNull, isNull, sql } from "drizzle-orm";
import { db } from "@/db";
import { waxEstimates, waxRecipeChanges, waxRecipeComponents, waxRecipes, waxUses, type WaxMaterialRow } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import type { ChangeDto, RecipeDto } from "@/lib/contracts/wax";
import { AppError } from "@/lib/errors";
import type { CreateRecipeInput, DuplicateRecipeInput, RecipeListQuery, UpdateRecipeInput } from "@/lib/validation/wax";
import { WaxInputError, analyseRecipe, validateRecipe, type RecipeAnalysis, type RecipeInput } from "@/lib/wax";
import { isUniqueViolation } from "../stamps/events";
import { bumpRecipe, componentsById, loadMaterials, loadRecipes, recordRecipeChange, toDomainMaterial, toMaterialRef, toNote, toRecipeMix, type Db, type StoredRecipe } from "./shared";
import { audit } from "@/lib/log";

// Recipes: a mix by mass % with its working range, versioned, with a history; duplicated into a season's
// variant; compared side by side; refused when their range reaches within 50 °C of a flash point.

async function usageOf(tx: Db): Promise<Map<string, { estimates: number; uses: number }>> {
  const [estimates, uses] = await Promise.all([
    tx.select({ id: waxEstimates.recipeId, n: count() }).from(waxEstimates).groupBy(waxEstimates.recipeId),
    tx.select({ id: waxUses.recipeId, n: count() }).from(waxUses).where(isNull(waxUses.withdrawnAt)).groupBy(waxUses.recipeId),
  ]);
  const usage = new Map<string, { estimates: number; uses: number }>();
  for (const e of estimates) usage.set(e.id, { estimates: e.n, uses: 0 });
  for (const u of uses) usage.set(u.id, { estimates: usage.get(u.id)?.estimates ?? 0, uses: u.n });
  return usage;
}

/** A stored recipe with its computed figures (density, melting range, temperature rules) as the materials stand now. */
function toRecipeDto(r: StoredRecipe, materials: readonly WaxMaterialRow[], names: Map<string, string>, usage: { estimates: number; uses: number }): RecipeDto {
  const byId = new Map(materials.map((m) => [m.id, m]));
  const analysis: RecipeAnalysis = analyseRecipe(toRecipeMix(r), materials.map(toDomainMaterial));
  return {
    id: r.row.id,
    name: r.row.name,
    season: r.row.season,
    use: r.row.use,
    components: r.components.map((c, i) => ({ line: c.line, material: toMaterialRef(byId.get(c.materialId)!), pct: c.pct, fraction: analysis.components[i].fraction })),
    workingRangeC: analysis.workingRangeC,
    workingRangeF: analysis.workingRangeF,
    notes: r.row.notes,
    densityGPerCm3: analysis.densityGPerCm3,
    meltingRangeC: analysis.meltingRangeC,
    temperature: {
      status: analysis.temperature.status,
      fumeWarning: analysis.temperature.fumeWarning,
      lowestFlashPoint: analysis.temperature.lowestFlashPoint,
      marginC: analysis.temperature.marginC,
      limitC: analysis.temperature.limitC,
      problem: analysis.temperature.problem ? toNote(analysis.temperature.problem) : null,
      warnings: analysis.temperature.warnings.map(toNote),
    },
    duplicatedFrom: r.row.duplicatedFromId ? { id: r.row.duplicatedFromId, name: names.get(r.row.duplicatedFromId) ?? "" } : null,
    archived: r.row.archivedAt !== null,
    usage,
    version: r.row.version,
    createdAt: r.row.createdAt.toISOString(),
    updatedAt: r.row.updatedAt.toISOString(),
  };
}

async function recipeDtos(tx: Db, ids?: string[]): Promise<RecipeDto[]> {
  const [recipes, materials, usage, names] = await Promise.all([
    loadRecipes(tx, ids),
    loadMaterials(tx),
    usageOf(tx),
    tx.select({ id: waxRecipes.id, name: waxRecipes.name }).from(waxRecipes),
  ]);
  const nameOf = new Map(names.map((n) => [n.id, n.name]));
  return recipes.map((r) => toRecipeDto(r, materials, nameOf, usage.get(r.row.id) ?? { estimates: 0, uses: 0 }));
}

/** Recipes by name; archived ones only when asked (archived=true lists only those). */
export async function listRecipes(actor: Actor, query: RecipeListQuery = {}): Promise<RecipeDto[]> {
  assertCan(actor, "data:read");
  const all = await recipeDtos(db);
  return all.filter((r) => (query.archived ? r.archived : !r.archived) && (!query.season || r.season === query.season) && (!query.use || r.use === query.use));
}

export async function getRecipe(actor: Actor, id: string): Promise<RecipeDto> {
  assertCan(actor, "data:read");
  const [recipe] = await recipeDtos(db, [id]);
  if (!recipe) throw new AppError("notFound");
  return recipe;
}

/** Two recipes side by side (the page lines up their materials). */
export async function compareRecipes(actor: Actor, a: string, b: string): Promise<{ a: RecipeDto; b: RecipeDto }> {
  assertCan(actor, "data:read");
  const found = await recipeDtos(db, [a, b]);
  const left = found.find((r) => r.id === a);
  const right = found.find((r) => r.id === b);
  if (!left || !right) throw new AppError("notFound");
  return { a: left, b: right };
}

function nameTaken(error: unknown): void {
  if (isUniqueViolation(error, "wax_recipes_name_key")) throw new AppError("recipeNameTaken", {}, { name: ["errors.recipeNameTaken"] });
}

/**
 * The domain's checks of a recipe (mix, materials, the flash-point rule) with materials named by id, code or name;
 * answers the recipe with its components by material id.
 */
function checked(input: RecipeInput, materials: readonly WaxMaterialRow[]) {
  const components = componentsById(input.components, materials);
  const { recipe } = validateRecipe({ ...input, components }, materials.map(toDomainMaterial));
  return recipe;
}

async function writeComponents(tx: Db, recipeId: string, components: readonly { material: string; pct: number }[]) {
  await tx.delete(waxRecipeComponents).where(eq(waxRecipeComponents.recipeId, recipeId));
  await tx.insert(waxRecipeComponents).values(components.map((c, i) => ({ recipeId, line: i + 1, materialId: c.material, pct: c.pct })));
}

export async function createRecipe(actor: Actor, input: CreateRecipeInput, options: { duplicatedFromId?: string; note?: string } = {}): Promise<RecipeDto> {
  assertCan(actor, "wax:write");
  let id = "";
  try {
    id = await db.transaction(async (tx) => {
      const recipe = checked(input, await loadMaterials(tx));
      const [row] = await tx
        .insert(waxRecipes)
        .values({
          name: recipe.name,
          season: recipe.season,
          use: recipe.use,
          workingMinC: recipe.workingRangeC.minC,
          workingMaxC: recipe.workingRangeC.maxC,
          notes: recipe.notes || null,
          duplicatedFromId: options.duplicatedFromId ?? null,
          createdBy: actor.id,
        })
        .returning();
      await writeComponents(tx, row.id, recipe.components);
      await recordRecipeChange(tx, row.id, actor, { version: row.version, kind: options.duplicatedFromId ? "duplicated" : "created", note: options.note ?? null });
      return row.id;
    });
  } catch (error) {
    nameTaken(error);
    throw error;
  }
  return getRecipe(actor, id);
}

/** A recipe as its form and PATCH see it: components by material id, range in °C. */
const asInput = (r: StoredRecipe): RecipeInput => ({
  name: r.row.name,
  season: r.row.season,
  use: r.row.use,
  components: r.components.map((c) => ({ material: c.materialId, pct: c.pct })),
  workingRangeC: { minC: r.row.workingMinC, maxC: r.row.workingMaxC },
  notes: r.row.notes ?? undefined,
});

/**
 * Changes a recipe made from `input.version` (409 on a stale one). The merged recipe passes the domain's checks
 * again: its mix adds up to 100 %, its materials exist and its range keeps 50 °C from the lowest flash point.
 * `archived` archives it (it stays for what names it, out of the pickers) or restores it. One history entry.
 */
export async function updateRecipe(actor: Actor, id: string, input: UpdateRecipeInput): Promise<RecipeDto> {
  assertCan(actor, "wax:write");
  try {
    await db.transaction(async (tx) => {
      const [locked] = await tx.select().from(waxRecipes).where(eq(waxRecipes.id, id)).for("update");
      if (!locked) throw new AppError("notFound");
      if (locked.version !== input.version) throw new AppError("versionConflict");
      const [current] = await loadRecipes(tx, [id]);
      const { version: _version, archived, ...patch } = input;
      void _version;
      const before = asInput(current);
      const edited = Object.keys(patch).some((k) => patch[k as keyof typeof patch] !== undefined);
      const materials = await loadMaterials(tx);
      const after = edited ? checked({ ...before, ...Object.fromEntries(Object.entries(patch).filter(([, v]) => v !== undefined)) } as RecipeInput, materials) : before;
      const flat = (r: RecipeInput) => ({ name: r.name, season: r.season, use: r.use, components: r.components, workingRangeC: r.workingRangeC, notes: r.notes || null });
      const b = flat(before);
      const a = flat(after);
      const changes = (Object.keys(b) as (keyof typeof b)[])
        .filter((k) => JSON.stringify(b[k]) !== JSON.stringify(a[k]))
        .map((field) => ({ field, from: b[field] ?? null, to: a[field] ?? null }));
      const archiveChange = archived !== undefined && archived !== (locked.archivedAt !== null);
      if (changes.length === 0 && !archiveChange) return;
      const [updated] = await tx
        .update(waxRecipes)
        .set({
          name: a.name,
          season: a.season,
          use: a.use,
          workingMinC: a.workingRangeC.minC,
          workingMaxC: a.workingRangeC.maxC,
          notes: a.notes,
          ...(archiveChange ? { archivedAt: archived ? sql`now()` : null } : {}),
          ...bumpRecipe,
        })
        .where(eq(waxRecipes.id, id))
        .returning({ version: waxRecipes.version });
      if (changes.some((c) => c.field === "components")) await writeComponents(tx, id, after.components);
      if (changes.length) await recordRecipeChange(tx, id, actor, { version: updated.version, kind: "edited", changes });
      if (archiveChange) await recordRecipeChange(tx, id, actor, { version: updated.version, kind: archived ? "archived" : "restored" });
    });
  } catch (error) {
    nameTaken(error);
    throw error;
  }
  return getRecipe(actor, id);
}

/**
 * Deletes a recipe nothing points at. One that saved estimates or recorded wax uses name is refused with 409
 * recipeInUse and how many (archive it instead); another recipe duplicated from it only loses the link.
 */
export async function deleteRecipe(actor: Actor, id: string, version?: number): Promise<void> {
  assertCan(actor, "wax:write");
  await db.transaction(async (tx) => {
    const [row] = await tx.select().from(waxRecipes).where(eq(waxRecipes.id, id)).for("update");
    if (!row) throw new AppError("notFound");
    if (version !== undefined && row.version !== version) throw new AppError("versionConflict");
    const [[estimates], [uses]] = await Promise.all([
      tx.select({ n: count() }).from(waxEstimates).where(eq(waxEstimates.recipeId, id)),
      tx.select({ n: count() }).from(waxUses).where(eq(waxUses.recipeId, id)),
    ]);
    if (estimates.n + uses.n > 0) throw new AppError("recipeInUse", { name: row.name, estimates: estimates.n, uses: uses.n }, undefined, { estimates: estimates.n, uses: uses.n });
    await tx.delete(waxRecipes).where(eq(waxRecipes.id, id));
  });
  audit("record.deleted", actor, { kind: "recipe", id });
}

/**
 * A copy of a recipe under a new name (the season's variant, e.g. the dry-season mix for the rainy season), with
 * its components, range and notes; the copy names where it came from and starts its own history.
 */
export async function duplicateRecipe(actor: Actor, id: string, input: DuplicateRecipeInput): Promise<RecipeDto> {
  assertCan(actor, "wax:write");
  const [source] = await loadRecipes(db, [id]);
  if (!source) throw new AppError("notFound");
  const copy = { ...asInput(source), name: input.name, season: input.season ?? source.row.season };
  try {
    return await createRecipe(actor, copy, { duplicatedFromId: id, note: source.row.name });
  } catch (error) {
    // A source whose range a changed flash point now refuses cannot be copied as it is: say so on the name.
    if (error instanceof WaxInputError && error.field === "workingRangeC.maxC") throw new AppError("unprocessable", {}, { name: [{ key: error.code, values: Object.fromEntries(Object.entries(error.params).map(([k, v]) => [k, typeof v === "boolean" ? String(v) : v])) }] });
    throw error;
  }
}

export async function recipeHistory(actor: Actor, id: string): Promise<ChangeDto[]> {
  assertCan(actor, "data:read");
  const [row] = await db.select({ id: waxRecipes.id }).from(waxRecipes).where(eq(waxRecipes.id, id));
  if (!row) throw new AppError("notFound");
  const rows = await db.select().from(waxRecipeChanges).where(eq(waxRecipeChanges.recipeId, id)).orderBy(desc(waxRecipeChanges.at), desc(waxRecipeChanges.version));
  return rows.map((r) => ({ id: r.id, version: r.version, kind: r.kind, actorName: r.actorName, at: r.at.toISOString(), changes: r.changes, note: r.note }));
}

/** Recipes that may be picked for new estimates and uses (not archived), by name. */
export async function recipeChoices(actor: Actor): Promise<{ id: string; name: string; season: RecipeDto["season"] }[]> {
  assertCan(actor, "data:read");
  return db.select({ id: waxRecipes.id, name: waxRecipes.name, season: waxRecipes.season }).from(waxRecipes).where(isNull(waxRecipes.archivedAt)).orderBy(waxRecipes.name);
}

export const archivedRecipeCount = async (actor: Actor) => {
  assertCan(actor, "data:read");
  const [{ n }] = await db.select({ n: count() }).from(waxRecipes).where(isNotNull(waxRecipes.archivedAt));
  return n;
};
