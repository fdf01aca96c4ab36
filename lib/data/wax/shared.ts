import "server-only";
import { asc, eq, inArray, sql } from "drizzle-orm";
import type { Database, Transaction } from "@/db";
import { waxMaterialChanges, waxMaterials, waxRecipeChanges, waxRecipeComponents, waxRecipes, waxStockMovements, type WaxChangeKind, type WaxMaterialRow, type WaxRecipeRow } from "@/db/schema";
import type { Actor } from "@/lib/authz";
import type { MaterialRef, WaxNote } from "@/lib/contracts/wax";
import { WaxInputError, materialKey, type WaxIssue, type WaxMaterial, type WaxWarning } from "@/lib/wax";

// What the wax room's data modules share: rows → the pure domain's shapes, material references by id, code or
// name, stock on hand as the sum of movements, and the history rows of materials and recipes.

export type Db = Transaction | Database;

/** A material row as lib/wax reads it; the domain's id is the row's uuid. */
export function toDomainMaterial(row: WaxMaterialRow): WaxMaterial {
  return {
    id: row.id,
    name: row.name,
    densityGPerCm3: row.densityGPerCm3,
    meltingRangeC: { fromC: row.meltFromC, toC: row.meltToC },
    flashPointC: row.flashPointC,
    discoloursAboveC: row.discoloursAboveC,
    pricePerKg: row.pricePerKg,
    sources: row.sources,
  };
}

export const toMaterialRef = (row: Pick<WaxMaterialRow, "id" | "code" | "name">): MaterialRef => ({ id: row.id, code: row.code, name: row.name });

export async function loadMaterials(tx: Db): Promise<WaxMaterialRow[]> {
  return tx.select().from(waxMaterials).orderBy(asc(waxMaterials.name));
}

/** The material a reference names: its id, else its name or code compared trimmed and case-insensitively. */
export function findMaterial(ref: string, rows: readonly WaxMaterialRow[]): WaxMaterialRow | undefined {
  const exact = rows.find((m) => m.id === ref);
  if (exact) return exact;
  const key = materialKey(ref);
  return rows.find((m) => materialKey(m.name) === key) ?? rows.find((m) => materialKey(m.code) === key);
}

/**
 * Components naming materials by id, code or name → the same components naming them by id. Unknown names are
 * refused like the domain refuses them ("wax.unknownMaterial" on components.<i>.material, 422).
 */
export function componentsById<C extends { material: string }>(components: readonly C[], rows: readonly WaxMaterialRow[], field = "components"): (C & { material: string })[] {
  const missing: WaxIssue[] = [];
  const resolved = components.map((c, i) => {
    const row = findMaterial(c.material, rows);
    if (!row) missing.push({ field: `${field}.${i}.material`, code: "wax.unknownMaterial", params: { material: c.material } });
    return { ...c, material: row?.id ?? c.material };
  });
  if (missing.length) throw new WaxInputError(missing);
  return resolved;
}

/** Stock on hand per material id, kg: the sum of its movements. */
export async function onHandByMaterial(tx: Db): Promise<Map<string, number>> {
  const rows = await tx
    .select({ materialId: waxStockMovements.materialId, kg: sql<number>`coalesce(sum(${waxStockMovements.kg}), 0)::float8` })
    .from(waxStockMovements)
    .groupBy(waxStockMovements.materialId);
  return new Map(rows.map((r) => [r.materialId, Number(r.kg)]));
}

export interface StoredRecipe {
  row: WaxRecipeRow;
  components: { line: number; materialId: string; pct: number }[];
}

/** Recipes with their components in line order (all, or the ids given), by name. */
export async function loadRecipes(tx: Db, ids?: readonly string[]): Promise<StoredRecipe[]> {
  if (ids && ids.length === 0) return [];
  const rows = await tx
    .select()
    .from(waxRecipes)
    .where(ids ? inArray(waxRecipes.id, [...ids]) : undefined)
    .orderBy(asc(waxRecipes.name));
  if (rows.length === 0) return [];
  const lines = await tx
    .select()
    .from(waxRecipeComponents)
    .where(inArray(waxRecipeComponents.recipeId, rows.map((r) => r.id)))
    .orderBy(asc(waxRecipeComponents.recipeId), asc(waxRecipeComponents.line));
  const byRecipe = new Map<string, StoredRecipe["components"]>();
  for (const l of lines) {
    const list = byRecipe.get(l.recipeId) ?? [];
    list.push({ line: l.line, materialId: l.materialId, pct: l.pct });
    byRecipe.set(l.recipeId, list);
  }
  return rows.map((row) => ({ row, components: byRecipe.get(row.id) ?? [] }));
}

/** A stored recipe as lib/wax's computations read it. */
export const toRecipeMix = (r: StoredRecipe) => ({
  id: r.row.id,
  name: r.row.name,
  components: r.components.map((c) => ({ material: c.materialId, pct: c.pct })),
  workingRangeC: { minC: r.row.workingMinC, maxC: r.row.workingMaxC },
});

export const toNote = (issue: WaxIssue | WaxWarning): WaxNote => ({ code: issue.code, params: issue.params, ...(issue.field ? { field: issue.field } : {}) });

const same = (a: unknown, b: unknown) => JSON.stringify(a ?? null) === JSON.stringify(b ?? null);

/** The fields that differ between two records, with their before and after. */
export function changesBetween<T extends Record<string, unknown>>(before: T, after: Partial<T>, fields: readonly (keyof T & string)[]) {
  return fields.filter((f) => f in after && after[f] !== undefined && !same(before[f], after[f])).map((f) => ({ field: f, from: before[f] ?? null, to: after[f] ?? null }));
}

interface ChangeInput {
  version: number;
  kind: WaxChangeKind;
  changes?: { field: string; from: unknown; to: unknown }[];
  note?: string | null;
}

export async function recordMaterialChange(tx: Db, materialId: string, actor: Pick<Actor, "id" | "name">, change: ChangeInput) {
  await tx.insert(waxMaterialChanges).values({ materialId, actorId: actor.id, actorName: actor.name, version: change.version, kind: change.kind, changes: change.changes ?? [], note: change.note ?? null });
}

export async function recordRecipeChange(tx: Db, recipeId: string, actor: Pick<Actor, "id" | "name">, change: ChangeInput) {
  await tx.insert(waxRecipeChanges).values({ recipeId, actorId: actor.id, actorName: actor.name, version: change.version, kind: change.kind, changes: change.changes ?? [], note: change.note ?? null });
}

export const bumpRecipe = { version: sql`${waxRecipes.version} + 1`, updatedAt: sql`now()` };
export const bumpMaterial = { version: sql`${waxMaterials.version} + 1`, updatedAt: sql`now()` };

export async function materialRow(tx: Db, id: string, lock = false): Promise<WaxMaterialRow | undefined> {
  const query = tx.select().from(waxMaterials).where(eq(waxMaterials.id, id)).limit(1);
  const [row] = lock ? await query.for("update") : await query;
  return row;
}
