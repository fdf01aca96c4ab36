import { and, eq, inArray, isNull, sql } from "drizzle-orm";
import type { Database } from "@/db";
import { users, waxEstimates, waxMaterialChanges, waxMaterials, waxRecipeChanges, waxRecipeComponents, waxRecipes, waxStockMovements, waxUses } from "@/db/schema";
import { DEFAULT_MATERIALS, estimateComponents, estimateWax, massFractions, type WaxMaterial } from "@/lib/wax";

/**
 * The demo wax room: the seven default materials (figures and sources from lib/wax, SOURCES.md) with invented
 * prices, stock and reorder levels; three invented recipes for the dry, humid and rainy season; a dozen recorded
 * wax uses whose grams follow an application rate of about 86–95 g/m² with a few per cent of scatter (invented,
 * deterministic), so the calibration has something believable to fit; and one planned estimate for the purchase
 * list. Idempotent: what exists (by material code, recipe name, the uses' demo notes) is left alone.
 */

/** Invented demo figures per material: price per kg (IDR), reorder level and stock received, kg. */
const demoStock: Record<string, { pricePerKg: number; reorderLevelKg: number; receivedKg: number }> = {
  beeswax: { pricePerKg: 185_000, reorderLevelKg: 20, receivedKg: 45 },
  paraffin: { pricePerKg: 32_000, reorderLevelKg: 15, receivedKg: 40 },
  microcrystalline: { pricePerKg: 58_000, reorderLevelKg: 4, receivedKg: 9 },
  rosin: { pricePerKg: 41_000, reorderLevelKg: 5, receivedKg: 6 },
  damar: { pricePerKg: 72_000, reorderLevelKg: 3, receivedKg: 5 },
  "animal-fat": { pricePerKg: 28_000, reorderLevelKg: 1, receivedKg: 2 },
  reclaimed: { pricePerKg: 0, reorderLevelKg: 0, receivedKg: 18 },
};

const DEMO_PRICE_SOURCE = "demo price, invented";
const RECLAIMED_PRICE_SOURCE = "demo: reclaimed from the workshop's own boil-offs, no purchase price (invented)";

export interface DemoRecipe {
  name: string;
  season: "dry" | "humid" | "rainy";
  use: "stamping";
  components: { material: string; pct: number }[];
  workingRangeC: { minC: number; maxC: number };
  notes: string;
}

export const demoRecipes: DemoRecipe[] = [
  {
    name: "Dry-season stamp wax",
    season: "dry",
    use: "stamping",
    // 60/40 beeswax/paraffin: common practice (SPEC section 1).
    components: [
      { material: "beeswax", pct: 60 },
      { material: "paraffin", pct: 40 },
    ],
    workingRangeC: { minC: 62, maxC: 72 },
    notes: "The house mix for the dry months. Holds a crisp line on mori primissima.",
  },
  {
    name: "Humid-season stamp wax",
    season: "humid",
    use: "stamping",
    components: [
      { material: "beeswax", pct: 52 },
      { material: "paraffin", pct: 33 },
      { material: "microcrystalline", pct: 15 },
    ],
    workingRangeC: { minC: 65, maxC: 75 },
    notes: "A little microcrystalline wax keeps the film from cracking when the air is damp.",
  },
  {
    name: "Rainy-season stamp wax",
    season: "rainy",
    use: "stamping",
    components: [
      { material: "beeswax", pct: 45 },
      { material: "paraffin", pct: 30 },
      { material: "rosin", pct: 15 },
      { material: "reclaimed", pct: 10 },
    ],
    workingRangeC: { minC: 66, maxC: 78 },
    notes: "Rosin for grip on cloth that never quite dries; reclaimed wax from the last boil-off.",
  },
];

/** A use as seeded: recipe by index, cloth, the plan's waxed area per metre both faces, metres, passes, grams. */
interface DemoUse {
  daysAgo: number;
  recipe: number;
  cloth: string;
  waxedAreaPerMetreM2: number;
  metres: number;
  passes: number;
  grams: number;
}

const PRIMISSIMA = "Mori primissima 106 cm";
const PRIMA = "Mori prima 115 cm";

/**
 * Twelve invented uses. A 20 × 20 cm stamp at about 40 % coverage, 5 across, both faces waxes about 0.8 m² per
 * metre (0.87 on the 115 cm cloth, 6 across at the edges cut); grams = area × passes × metres × a rate of 86–95
 * g/m² with ±2–6 % scatter written out by hand, so the fit lands near 88 (dry), 91 (humid) and 94 (rainy) g/m².
 */
const demoUses: DemoUse[] = [
  { daysAgo: 58, recipe: 0, cloth: PRIMISSIMA, waxedAreaPerMetreM2: 0.8, metres: 26.5, passes: 2, grams: 3790 },
  { daysAgo: 51, recipe: 0, cloth: PRIMISSIMA, waxedAreaPerMetreM2: 0.8, metres: 53, passes: 2, grams: 7310 },
  { daysAgo: 44, recipe: 0, cloth: PRIMISSIMA, waxedAreaPerMetreM2: 0.76, metres: 39.75, passes: 3, grams: 8160 },
  { daysAgo: 37, recipe: 0, cloth: PRIMA, waxedAreaPerMetreM2: 0.87, metres: 26.5, passes: 2, grams: 4150 },
  { daysAgo: 33, recipe: 1, cloth: PRIMISSIMA, waxedAreaPerMetreM2: 0.8, metres: 26.5, passes: 2, grams: 3960 },
  { daysAgo: 29, recipe: 1, cloth: PRIMA, waxedAreaPerMetreM2: 0.87, metres: 53, passes: 2, grams: 8190 },
  { daysAgo: 25, recipe: 1, cloth: PRIMA, waxedAreaPerMetreM2: 0.87, metres: 26.5, passes: 3, grams: 6090 },
  { daysAgo: 21, recipe: 1, cloth: PRIMA, waxedAreaPerMetreM2: 0.84, metres: 39.75, passes: 2, grams: 6230 },
  { daysAgo: 16, recipe: 2, cloth: PRIMISSIMA, waxedAreaPerMetreM2: 0.8, metres: 26.5, passes: 2, grams: 4080 },
  { daysAgo: 11, recipe: 2, cloth: PRIMISSIMA, waxedAreaPerMetreM2: 0.8, metres: 53, passes: 3, grams: 11650 },
  { daysAgo: 7, recipe: 2, cloth: PRIMISSIMA, waxedAreaPerMetreM2: 0.78, metres: 26.5, passes: 2, grams: 3780 },
  { daysAgo: 3, recipe: 2, cloth: PRIMA, waxedAreaPerMetreM2: 0.87, metres: 26.5, passes: 2, grams: 4420 },
];

export const demoWaxUses = demoUses.map((u) => ({ ...u, recipeName: demoRecipes[u.recipe].name }));

const DEMO_USE_NOTE = "Demo data: recorded after the waxing.";

const isoDaysAgo = (days: number) => new Date(Date.now() - days * 86_400_000).toISOString().slice(0, 10);

export async function seedWax(db: Database, options: { waxmasterEmail?: string } = {}) {
  const [waxmaster] = await db.select().from(users).where(eq(users.email, options.waxmasterEmail ?? "tirta@capgrid.test")).limit(1);
  const actor = waxmaster ? { id: waxmaster.id, name: waxmaster.name } : { id: null, name: "Demo data" };

  // Materials with their sourced figures; invented prices and reorder levels; a first receipt of stock.
  for (const m of DEFAULT_MATERIALS) {
    const demo = demoStock[m.id];
    const [row] = await db
      .insert(waxMaterials)
      .values({
        code: m.id,
        name: m.name,
        densityGPerCm3: m.densityGPerCm3,
        meltFromC: m.meltingRangeC.fromC,
        meltToC: m.meltingRangeC.toC,
        flashPointC: m.flashPointC,
        discoloursAboveC: m.discoloursAboveC ?? null,
        pricePerKg: demo.pricePerKg,
        reorderLevelKg: demo.reorderLevelKg,
        sources: { ...m.sources, price: m.id === "reclaimed" ? RECLAIMED_PRICE_SOURCE : DEMO_PRICE_SOURCE },
      })
      .onConflictDoNothing()
      .returning();
    if (!row) continue;
    await db.insert(waxMaterialChanges).values({ materialId: row.id, version: 1, kind: "created", actorId: actor.id, actorName: actor.name, note: "demo data" });
    await db.insert(waxStockMovements).values({ materialId: row.id, kind: "receipt", kg: demo.receivedKg, note: "Demo data: opening stock", actorId: actor.id, actorName: actor.name, at: new Date(Date.now() - 70 * 86_400_000) });
  }
  const materials = await db.select().from(waxMaterials).where(inArray(waxMaterials.code, DEFAULT_MATERIALS.map((m) => m.id)));
  const byCode = new Map(materials.map((m) => [m.code, m]));

  // Recipes.
  const recipeIds: string[] = [];
  for (const r of demoRecipes) {
    const [existing] = await db.select({ id: waxRecipes.id }).from(waxRecipes).where(sql`lower(${waxRecipes.name}) = lower(${r.name})`);
    if (existing) {
      recipeIds.push(existing.id);
      continue;
    }
    const [row] = await db
      .insert(waxRecipes)
      .values({ name: r.name, season: r.season, use: r.use, workingMinC: r.workingRangeC.minC, workingMaxC: r.workingRangeC.maxC, notes: r.notes, createdBy: actor.id })
      .returning();
    await db.insert(waxRecipeComponents).values(r.components.map((c, i) => ({ recipeId: row.id, line: i + 1, materialId: byCode.get(c.material)!.id, pct: c.pct })));
    await db.insert(waxRecipeChanges).values({ recipeId: row.id, version: 1, kind: "created", actorId: actor.id, actorName: actor.name, note: "demo data" });
    recipeIds.push(row.id);
  }

  // Wax uses, each taking its wax out of stock by the recipe's mass shares.
  const [seeded] = await db.select({ n: sql<number>`count(*)::int` }).from(waxUses).where(and(eq(waxUses.note, DEMO_USE_NOTE), isNull(waxUses.withdrawnAt)));
  if (seeded.n === 0) {
    for (const u of demoUses) {
      const recipe = demoRecipes[u.recipe];
      const [use] = await db
        .insert(waxUses)
        .values({
          usedOn: isoDaysAgo(u.daysAgo),
          recipeId: recipeIds[u.recipe],
          cloth: u.cloth,
          waxedAreaPerMetreM2: u.waxedAreaPerMetreM2,
          metres: u.metres,
          passes: u.passes,
          gramsUsed: u.grams,
          grams: u.grams,
          note: DEMO_USE_NOTE,
          recordedBy: actor.id,
          recordedByName: actor.name,
        })
        .returning();
      const fractions = massFractions(recipe.components);
      await db.insert(waxStockMovements).values(
        recipe.components.map((c, i) => ({ materialId: byCode.get(c.material)!.id, kind: "use" as const, kg: -(u.grams * fractions[i]) / 1000, waxUseId: use.id, actorId: actor.id, actorName: actor.name, at: new Date(Date.now() - u.daysAgo * 86_400_000) })),
      );
    }
  }

  // One planned estimate, so the purchase list has work to buy for: 2 kodi of long cloths in the dry-season mix.
  const estimateName = "Demo: 2 kodi of long cloths, dry-season mix";
  const [hasEstimate] = await db.select({ id: waxEstimates.id }).from(waxEstimates).where(eq(waxEstimates.name, estimateName));
  if (!hasEstimate) {
    const domain: WaxMaterial[] = materials.map((m) => ({
      id: m.id,
      name: m.name,
      densityGPerCm3: m.densityGPerCm3,
      meltingRangeC: { fromC: m.meltFromC, toC: m.meltToC },
      flashPointC: m.flashPointC,
      discoloursAboveC: m.discoloursAboveC,
      pricePerKg: m.pricePerKg,
      sources: m.sources,
    }));
    const components = demoRecipes[0].components.map((c) => ({ material: byCode.get(c.material)!.id, pct: c.pct }));
    // 2 kodi × 20 pieces × 2.65 m = 106 m; rate 88 g/m² (about what the demo uses calibrate to).
    const inputs = { planId: null, waxedAreaPerMetreM2: 0.8, metres: 106, run: { kodi: 2, pieceLengthMm: 2650 }, passes: 2, lossPct: 5, recoveryPct: 60, recipeId: recipeIds[0], cloth: PRIMISSIMA };
    const e = estimateWax({ waxedAreaPerMetreM2: 0.8, metres: 106, passes: 2, rateGPerM2: 88, lossPct: 5, recoveryPct: 60, components: estimateComponents(components, domain) });
    const byId = new Map(materials.map((m) => [m.id, m]));
    const results = {
      ...e,
      byMaterial: e.byMaterial.map((m) => ({ ...m, code: byId.get(m.material)!.code, name: byId.get(m.material)!.name })),
      warnings: e.warnings.map((w) => ({ code: w.code, params: w.params })),
      currency: "IDR",
      rate: { gPerM2: 88, basis: "given", uses: null, standardErrorGPerM2: null },
    };
    await db.insert(waxEstimates).values({
      name: estimateName,
      recipeId: recipeIds[0],
      inputs,
      results,
      gramsPerMetre: e.gramsPerMetre,
      kgNew: e.kgNew,
      planned: true,
      createdBy: actor.id,
      createdByName: actor.name,
    });
  }
}
