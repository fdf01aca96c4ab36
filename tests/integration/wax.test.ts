import { and, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { stampEvents, stamps, waxStockMovements } from "@/db/schema";
import { addImpressions } from "@/lib/data/stamps/impressions";
import { seedWax } from "@/scripts/seed/wax";
import { createUser, db } from "../helpers/db";
import { api, signIn, type Session } from "../helpers/http";
import { createStampRow, reloadStamp, uniquePrefix } from "../helpers/stamps";

// The wax room over HTTP against the real database: materials and their stock, recipes with their rules, the
// estimator in the SPEC section 6 shape, wax uses feeding the calibration and the stamps' impression counts,
// the purchase list and the wax master's defaults.

let wax: Session;
let admin: Session;
let planner: Session;
const prefix = uniquePrefix("WX");
const name = (label: string) => `${prefix} ${label}`;
const today = () => new Date().toISOString().slice(0, 10);

interface Material {
  id: string;
  code: string;
  name: string;
  pricePerKg: number | null;
  onHandKg: number;
  flashPointC: number | null;
}

const materials = async (): Promise<Material[]> => (await api("GET", "/api/v1/wax/materials", { session: planner })).body.materials;
const material = async (code: string) => (await materials()).find((m) => m.code === code)!;

async function newMaterial(label: string, extra: Record<string, unknown> = {}) {
  const res = await api("POST", "/api/v1/wax/materials", {
    session: wax,
    body: {
      name: name(label),
      densityGPerCm3: 0.9,
      meltingRangeC: { fromC: 50, toC: 60 },
      flashPointC: 180,
      pricePerKg: 10_000,
      reorderLevelKg: 2,
      sources: { density: "test figure", melting: "test figure", flashPoint: "test figure" },
      ...extra,
    },
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.material as Material & { version: number };
}

async function newRecipe(label: string, components: { material: string; pct: number }[], workingRangeC = { minC: 60, maxC: 72 }) {
  const res = await api("POST", "/api/v1/wax/recipes", { session: wax, body: { name: name(label), season: "dry", use: "stamping", components, workingRangeC } });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.recipe;
}

beforeAll(async () => {
  await seedWax(db());
  const w = await createUser("waxmaster");
  wax = (await signIn(w.email, w.password))!;
  const a = await createUser("admin");
  admin = (await signIn(a.email, a.password))!;
  const p = await createUser("planner");
  planner = (await signIn(p.email, p.password))!;
});

describe("materials", () => {
  it("list the seeded materials with their sourced figures and stock on hand as the sum of movements", async () => {
    const list = await materials();
    const beeswax = list.find((m) => m.code === "beeswax")!;
    // SOURCES.md: beeswax 0.958–0.970 g/cm³ (0.96 taken), flash point 204 °C; paraffin flash point from 200 °C (GESTIS).
    expect(beeswax).toMatchObject({ name: "Beeswax", densityGPerCm3: 0.96, flashPointC: 204, meltingRangeC: { fromC: 62, toC: 64 } });
    expect(list.find((m) => m.code === "paraffin")!.flashPointC).toBe(200);
    expect(list.find((m) => m.code === "rosin")!.flashPointC).toBeNull();
    const [{ kg }] = await db().select({ kg: sql<number>`sum(${waxStockMovements.kg})::float8` }).from(waxStockMovements).where(eq(waxStockMovements.materialId, beeswax.id));
    expect(beeswax.onHandKg).toBeCloseTo(Number(kg), 9);
  });

  it("record receipts and corrections as movements, refuse a receipt of 0 kg, and warn below the reorder level", async () => {
    const m = await newMaterial("Receipt wax");
    expect(m.onHandKg).toBe(0);
    const receipt = await api("POST", `/api/v1/wax/materials/${m.id}/movements`, { session: wax, body: { kind: "receipt", kg: 5, note: "first sack" } });
    expect(receipt.status).toBe(201);
    expect(receipt.body.onHandKg).toBe(5);
    const correction = await api("POST", `/api/v1/wax/materials/${m.id}/movements`, { session: wax, body: { kind: "correction", kg: -3.5 } });
    expect(correction.body.onHandKg).toBeCloseTo(1.5, 12);
    const bad = await api("POST", `/api/v1/wax/materials/${m.id}/movements`, { session: wax, body: { kind: "receipt", kg: 0 } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.kg[0]).toMatch(/above 0/);
    const one = (await api("GET", `/api/v1/wax/materials/${m.id}`, { session: planner })).body.material;
    expect(one).toMatchObject({ onHandKg: 1.5, reorderLevelKg: 2, belowReorder: true });
    const moves = (await api("GET", `/api/v1/wax/materials/${m.id}/movements`, { session: planner })).body.movements;
    expect(moves.map((x: { kind: string; kg: number }) => [x.kind, x.kg])).toEqual([
      ["correction", -3.5],
      ["receipt", 5],
    ]);
  });

  it("refuse a second material with the same name in another case (409 on the field), and a stale edit (409)", async () => {
    const m = await newMaterial("Twice wax");
    const again = await api("POST", "/api/v1/wax/materials", {
      session: wax,
      body: { name: name("TWICE WAX"), code: `${prefix.toLowerCase()}-other`, densityGPerCm3: 0.9, meltingRangeC: { fromC: 50, toC: 60 }, sources: { density: "", melting: "", flashPoint: "" } },
    });
    expect(again.status).toBe(409);
    expect(again.body.error.fields.name[0]).toMatch(/already has this name/);
    const edit = await api("PATCH", `/api/v1/wax/materials/${m.id}`, { session: wax, body: { version: m.version, pricePerKg: 12_000, sources: { price: "supplier quote" } } });
    expect(edit.status).toBe(200);
    expect(edit.body.material).toMatchObject({ pricePerKg: 12_000, version: m.version + 1, sources: { density: "test figure", price: "supplier quote" } });
    const stale = await api("PATCH", `/api/v1/wax/materials/${m.id}`, { session: wax, body: { version: m.version, pricePerKg: 1 } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("versionConflict");
    const history = (await api("GET", `/api/v1/wax/materials/${m.id}/history`, { session: planner })).body.history;
    expect(history[0]).toMatchObject({ kind: "edited", version: m.version + 1, changes: expect.arrayContaining([{ field: "pricePerKg", from: 10_000, to: 12_000 }]) });
    expect(history.at(-1).kind).toBe("created");
  });

  it("re-check the recipes using a material whose flash point changes or becomes unknown, and say which now break the rule", async () => {
    const m = await newMaterial("Flash wax", { flashPointC: 180 });
    // 180 − 120 = 60 °C of margin: allowed (SPEC 5.3: refuse within 50 °C of the lowest flash point).
    const recipe = await newRecipe("Flash mix", [{ material: m.name.toLowerCase(), pct: 100 }], { minC: 60, maxC: 120 });
    expect(recipe.temperature).toMatchObject({ status: "ok", fumeWarning: true, limitC: 130 });
    const lower = await api("PATCH", `/api/v1/wax/materials/${m.id}`, { session: wax, body: { version: m.version, flashPointC: 160 } });
    expect(lower.status).toBe(200);
    expect(lower.body.recheck.recipesChecked).toBe(1);
    expect(lower.body.recheck.breaking).toEqual([
      expect.objectContaining({ recipeId: recipe.id, status: "tooNear", problem: expect.objectContaining({ code: "wax.tooNearFlashPoint", message: expect.stringMatching(/only 40 °C below the flash point/) }) }),
    ]);
    const unknown = await api("PATCH", `/api/v1/wax/materials/${m.id}`, { session: wax, body: { version: m.version + 1, flashPointC: null } });
    expect(unknown.body.recheck.breaking).toEqual([expect.objectContaining({ recipeId: recipe.id, status: "unknown", problem: expect.objectContaining({ message: expect.stringMatching(/not known/) }) })]);
    expect((await api("GET", `/api/v1/wax/recipes/${recipe.id}`, { session: planner })).body.recipe.temperature.status).toBe("unknown");
    expect((await api("GET", `/api/v1/wax/materials/${m.id}`, { session: planner })).body.material.recipeChecks).toHaveLength(1);
  });
});

describe("recipes", () => {
  it("name materials by id, code or name in any case, and compute density 1 / Σ wᵢ/ρᵢ", async () => {
    const beeswax = await material("beeswax");
    const recipe = await newRecipe("Named three ways", [
      { material: beeswax.id, pct: 50 },
      { material: "PARAFFIN", pct: 30 },
      { material: "pine rosin (GONDORUKEM)", pct: 20 },
    ]);
    expect(recipe.components.map((c: { material: { code: string } }) => c.material.code)).toEqual(["beeswax", "paraffin", "rosin"]);
    // Hand-worked with the SOURCES.md densities 0.96, 0.90 and 1.07 (rosin: from memory): 1 / (0.5/0.96 + 0.3/0.9 + 0.2/1.07).
    expect(recipe.densityGPerCm3).toBeCloseTo(1 / (0.5 / 0.96 + 0.3 / 0.9 + 0.2 / 1.07), 12);
    // NIST SP 811: °F = °C × 9/5 + 32, so 60 °C = 140 °F and 72 °C = 161.6 °F.
    expect(recipe.workingRangeF.minF).toBeCloseTo(140, 10);
    expect(recipe.workingRangeF.maxF).toBeCloseTo(161.6, 10);
    expect(recipe.temperature.status).toBe("unknown"); // rosin has no flash point in our sources
    expect(recipe.meltingRangeC).toEqual({ fromC: 46, toC: 82 });
  });

  it("refuse a mix that does not add up to 100 % with the running total beside the components, and an unknown material", async () => {
    const res = await api("POST", "/api/v1/wax/recipes", {
      session: wax,
      body: { name: name("Ninety"), season: "dry", use: "stamping", components: [{ material: "beeswax", pct: 60 }, { material: "paraffin", pct: 30 }], workingRangeC: { minC: 60, maxC: 70 } },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.components).toEqual(["The shares add up to 90 %; they must add up to 100 %."]);
    const unknown = await api("POST", "/api/v1/wax/recipes", {
      session: wax,
      body: { name: name("Unknown"), season: "dry", use: "stamping", components: [{ material: "unobtainium", pct: 100 }], workingRangeC: { minC: 60, maxC: 70 } },
    });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.fields["components.0.material"][0]).toMatch(/no material called unobtainium/);
  });

  it("refuse a working range within 50 °C of the lowest flash point (paraffin 200 °C, GESTIS), with the reason; warn of fumes above 100 °C (Rossol)", async () => {
    const near = await api("POST", "/api/v1/wax/recipes", {
      session: wax,
      body: { name: name("Too hot"), season: "any", use: "blocking", components: [{ material: "beeswax", pct: 60 }, { material: "paraffin", pct: 40 }], workingRangeC: { minC: 90, maxC: 150 } },
    });
    expect(near.status).toBe(422);
    expect(near.body.error.fields["workingRangeC.maxC"][0]).toBe(
      "The working range reaches 150 °C, only 50 °C below the flash point of Paraffin wax (200 °C). Keep at least 50 °C away: stay below 150 °C.",
    );
    const hot = await newRecipe("Hot blocking", [{ material: "beeswax", pct: 60 }, { material: "paraffin", pct: 40 }], { minC: 90, maxC: 110 });
    expect(hot.temperature.fumeWarning).toBe(true);
    expect(hot.temperature.warnings.map((w: { code: string }) => w.code)).toEqual(["wax.fumes", "wax.discolours"]);
    expect(hot.temperature.warnings[0].message).toMatch(/Above 100 °C \(212 °F\)/);
    const cool = await newRecipe("Cool line", [{ material: "beeswax", pct: 60 }, { material: "paraffin", pct: 40 }], { minC: 60, maxC: 75 });
    expect(cool.temperature).toMatchObject({ status: "ok", fumeWarning: false, warnings: [] });
  });

  it("change from a version (409 when stale) with a history, duplicate into a variant, compare, and refuse to delete one in use", async () => {
    const dry = await newRecipe("Dry base", [{ material: "beeswax", pct: 60 }, { material: "paraffin", pct: 40 }]);
    const edit = await api("PATCH", `/api/v1/wax/recipes/${dry.id}`, { session: wax, body: { version: dry.version, notes: "crisp lines", components: [{ material: "beeswax", pct: 65 }, { material: "paraffin", pct: 35 }] } });
    expect(edit.status).toBe(200);
    expect(edit.body.recipe).toMatchObject({ version: dry.version + 1, notes: "crisp lines" });
    expect(edit.body.recipe.components.map((c: { pct: number }) => c.pct)).toEqual([65, 35]);
    const stale = await api("PATCH", `/api/v1/wax/recipes/${dry.id}`, { session: wax, body: { version: dry.version, notes: "lost" } });
    expect(stale.status).toBe(409);
    const badMix = await api("PATCH", `/api/v1/wax/recipes/${dry.id}`, { session: wax, body: { version: dry.version + 1, components: [{ material: "beeswax", pct: 65 }] } });
    expect(badMix.status).toBe(400);
    expect(badMix.body.error.fields.components[0]).toMatch(/65 %/);

    const copy = await api("POST", `/api/v1/wax/recipes/${dry.id}/duplicate`, { session: wax, body: { name: name("Rainy variant"), season: "rainy" } });
    expect(copy.status).toBe(201);
    expect(copy.body.recipe).toMatchObject({ season: "rainy", duplicatedFrom: { id: dry.id, name: dry.name }, notes: "crisp lines", version: 1 });
    expect(copy.body.recipe.components.map((c: { pct: number }) => c.pct)).toEqual([65, 35]);
    const taken = await api("POST", `/api/v1/wax/recipes/${dry.id}/duplicate`, { session: wax, body: { name: name("RAINY VARIANT") } });
    expect(taken.status).toBe(409);
    expect(taken.body.error.code).toBe("recipeNameTaken");

    const compared = await api("GET", `/api/v1/wax/recipes/compare?a=${dry.id}&b=${copy.body.recipe.id}`, { session: planner });
    expect(compared.status).toBe(200);
    expect([compared.body.a.season, compared.body.b.season]).toEqual(["dry", "rainy"]);

    const history = (await api("GET", `/api/v1/wax/recipes/${dry.id}/history`, { session: planner })).body.history;
    expect(history.map((h: { kind: string }) => h.kind)).toEqual(["edited", "created"]);
    expect(history[0].changes.map((c: { field: string }) => c.field).sort()).toEqual(["components", "notes"]);

    await api("POST", "/api/v1/wax/estimates", { session: wax, body: { name: name("uses dry base"), recipeId: dry.id, waxedAreaPerMetreM2: 0.8, metres: 10 } });
    const refused = await api("DELETE", `/api/v1/wax/recipes/${dry.id}`, { session: wax });
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatchObject({ code: "recipeInUse", estimates: 1, uses: 0 });
    expect(refused.body.error.message).toMatch(/Archive it instead/);
    const archived = await api("PATCH", `/api/v1/wax/recipes/${dry.id}`, { session: wax, body: { version: dry.version + 1, archived: true } });
    expect(archived.body.recipe.archived).toBe(true);
    const listed = (await api("GET", "/api/v1/wax/recipes", { session: planner })).body.recipes.map((r: { id: string }) => r.id);
    expect(listed).not.toContain(dry.id);
    expect((await api("GET", "/api/v1/wax/recipes?archived=true", { session: planner })).body.recipes.map((r: { id: string }) => r.id)).toContain(dry.id);
    const unused = await newRecipe("Unused", [{ material: "beeswax", pct: 100 }]);
    expect((await api("DELETE", `/api/v1/wax/recipes/${unused.id}`, { session: wax })).status).toBe(204);
    expect((await api("GET", `/api/v1/wax/recipes/${unused.id}`, { session: planner })).status).toBe(404);
  });
});

describe("POST /api/v1/wax/estimate", () => {
  it("answers the SPEC section 6 shape on a hand-worked case, materials named in any case, with cost from the prices", async () => {
    const [beeswax, paraffin] = [await material("beeswax"), await material("paraffin")];
    const res = await api("POST", "/api/v1/wax/estimate", {
      session: planner,
      body: { waxedAreaPerMetreM2: 0.8, metres: 50, passes: 2, rateGPerM2: 90, lossPct: 10, recoveryPct: 60, recipe: { components: [{ material: "BEESWAX", pct: 60 }, { material: "paraffin wax", pct: 40 }] } },
    });
    expect(res.status).toBe(200);
    // Worked by hand: 0.8 m²/m × 2 × 90 g/m² × 1.10 = 158.4 g/m; × 50 m = 7.92 kg; 60 % back = 4.752 kg; new 3.168 kg
    // split 60/40 = 1.9008 / 1.2672 kg; density 1 / (0.6/0.96 + 0.4/0.90) = 72/77 g/cm³.
    expect(res.body.gramsPerMetre).toBeCloseTo(158.4, 10);
    expect(res.body.kgGross).toBeCloseTo(7.92, 10);
    expect(res.body.kgRecovered).toBeCloseTo(4.752, 10);
    expect(res.body.kgNew).toBeCloseTo(3.168, 10);
    expect(res.body.byMaterial.map((m: { material: string; kg: number }) => [m.material, m.kg])).toEqual([
      [beeswax.id, expect.closeTo(1.9008, 10)],
      [paraffin.id, expect.closeTo(1.2672, 10)],
    ]);
    expect(res.body.densityGPerCm3).toBeCloseTo(72 / 77, 12);
    expect(res.body.cost).toBeCloseTo(1.9008 * beeswax.pricePerKg! + 1.2672 * paraffin.pricePerKg!, 6);
    expect(res.body.warnings).toEqual([]);
    expect(res.body.band.position).toBe("measured");
    expect(res.body.rate).toMatchObject({ gPerM2: 90, basis: "given" });
  });

  it("takes the run in kodi of pieces (1 kodi = 20 pieces, common practice) and warns below the published band (Nurdalia 2006)", async () => {
    const res = await api("POST", "/api/v1/wax/estimate", { session: planner, body: { waxedAreaPerMetreM2: 0.3, kodi: 2, pieceLengthMm: 2650, rateGPerM2: 90, recipe: { components: [{ material: "beeswax", pct: 100 }] } } });
    expect(res.status).toBe(200);
    expect(res.body.inputs.metres).toBeCloseTo(106, 12);
    expect(res.body.gramsPerMetre).toBeCloseTo(27, 12);
    expect(res.body.warnings).toEqual([expect.objectContaining({ code: "wax.belowPublishedBand", message: expect.stringMatching(/below the published range for stamped batik \(100–250 g\/m/) })]);
  });

  it("refuses bad input with JSON errors on the fields: both area and plan, no recipe, a run given two ways, an unknown plan", async () => {
    const both = await api("POST", "/api/v1/wax/estimate", { session: planner, body: { waxedAreaPerMetreM2: 0.8, planId: "00000000-0000-4000-8000-000000000000", metres: 10, recipe: { components: [{ material: "beeswax", pct: 100 }] } } });
    expect(both.status).toBe(400);
    expect(both.body.error.fields.waxedAreaPerMetreM2[0]).toMatch(/not both/);
    const noRecipe = await api("POST", "/api/v1/wax/estimate", { session: planner, body: { waxedAreaPerMetreM2: 0.8, metres: 10 } });
    expect(noRecipe.body.error.fields.recipeId).toEqual(["Required."]);
    const twoWays = await api("POST", "/api/v1/wax/estimate", { session: planner, body: { waxedAreaPerMetreM2: 0.8, metres: 10, pieces: 3, pieceLengthMm: 2000, recipe: { components: [{ material: "beeswax", pct: 100 }] } } });
    expect(twoWays.status).toBe(400);
    expect(JSON.stringify(twoWays.body.error.fields)).toMatch(/one way only/);
    const plan = await api("POST", "/api/v1/wax/estimate", { session: planner, body: { planId: "00000000-0000-4000-8000-000000000000", recipe: { components: [{ material: "beeswax", pct: 100 }] } } });
    expect(plan.status).toBe(422);
    expect(plan.body.error.fields.planId).toEqual(["There is no saved plan with this id."]);
    const broken = await api("POST", "/api/v1/wax/estimate", { session: planner, rawBody: "{", headers: { "content-type": "application/json" } });
    expect(broken.status).toBe(400);
  });
});

describe("wax uses, calibration and impressions", () => {
  it("a use takes its wax out of stock by the recipe's shares, the fit follows the uses, and new estimates take the calibrated rate", async () => {
    const [a, b] = [await newMaterial("Cal A"), await newMaterial("Cal B")];
    await api("POST", `/api/v1/wax/materials/${a.id}/movements`, { session: wax, body: { kind: "receipt", kg: 20 } });
    const recipe = await newRecipe("Calibrated", [{ material: a.id, pct: 75 }, { material: b.id, pct: 25 }]);
    const estimateRate = async () => (await api("POST", "/api/v1/wax/estimate", { session: planner, body: { recipeId: recipe.id, waxedAreaPerMetreM2: 0.8, metres: 10 } })).body.rate;
    const defaults = (await api("GET", "/api/v1/wax/defaults", { session: planner })).body.defaults;
    expect(await estimateRate()).toMatchObject({ basis: "default", gPerM2: defaults.waxRateGPerM2 });

    // Three uses; x = area/m × metres × passes, y = grams. By hand: Σxy/Σx² for (16, 1500), (32, 2900), (20, 1900).
    const uses = [
      { waxedAreaPerMetreM2: 0.8, metres: 10, passes: 2, gramsUsed: 1500 },
      { waxedAreaPerMetreM2: 0.8, metres: 20, passes: 2, potBeforeG: 5000, potAddedG: 400, potAfterG: 2500 },
      { waxedAreaPerMetreM2: 1, metres: 10, passes: 2, gramsUsed: 1900 },
    ];
    for (const u of uses) {
      const res = await api("POST", "/api/v1/wax/uses", { session: wax, body: { recipeId: recipe.id, usedOn: today(), cloth: "Test mori", ...u } });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
    }
    const slope = (16 * 1500 + 32 * 2900 + 20 * 1900) / (16 ** 2 + 32 ** 2 + 20 ** 2);
    const cal = (await api("GET", "/api/v1/wax/calibration", { session: planner })).body.recipes.find((r: { recipeId: string }) => r.recipeId === recipe.id);
    expect(cal).toMatchObject({ enoughUses: true, fit: { uses: 3 } });
    expect(cal.fit.rateGPerM2).toBeCloseTo(slope, 10);
    expect(cal.points.map((p: { areaM2: number; grams: number }) => [p.areaM2, p.grams])).toEqual([
      [16, 1500],
      [32, 2900],
      [20, 1900],
    ]);
    expect(cal.cloths).toEqual([expect.objectContaining({ cloth: "Test mori", fit: expect.objectContaining({ uses: 3 }) })]);
    expect(await estimateRate()).toMatchObject({ basis: "recipe", uses: 3, gPerM2: expect.closeTo(slope, 10) });
    const forCloth = await api("POST", "/api/v1/wax/estimate", { session: planner, body: { recipeId: recipe.id, cloth: "TEST MORI", waxedAreaPerMetreM2: 0.8, metres: 10 } });
    expect(forCloth.body.rate.basis).toBe("recipeCloth");

    // 6300 g in all: 75 % of A, 25 % of B left stock as "use" movements.
    const [after] = [await api("GET", `/api/v1/wax/materials/${a.id}`, { session: planner })];
    expect(after.body.material.onHandKg).toBeCloseTo(20 - 6.3 * 0.75, 10);
    expect((await api("GET", `/api/v1/wax/materials/${b.id}`, { session: planner })).body.material.onHandKg).toBeCloseTo(-6.3 * 0.25, 10);

    // Withdrawing one puts its wax back and leaves it out of the fit.
    const listed = (await api("GET", `/api/v1/wax/uses?recipeId=${recipe.id}`, { session: planner })).body.uses;
    const first = listed.find((u: { grams: number }) => u.grams === 1500);
    const withdrawn = await api("POST", `/api/v1/wax/uses/${first.id}/withdraw`, { session: wax, body: { reason: "weighed the wrong pot" } });
    expect(withdrawn.status).toBe(200);
    expect(withdrawn.body.use.withdrawn.reason).toBe("weighed the wrong pot");
    expect((await api("POST", `/api/v1/wax/uses/${first.id}/withdraw`, { session: wax, body: { reason: "again" } })).status).toBe(409);
    expect((await api("GET", `/api/v1/wax/materials/${a.id}`, { session: planner })).body.material.onHandKg).toBeCloseTo(20 - 4.8 * 0.75, 10);
    const refit = (await api("GET", "/api/v1/wax/calibration", { session: planner })).body.recipes.find((r: { recipeId: string }) => r.recipeId === recipe.id);
    expect(refit.fit.uses).toBe(2);
    expect(refit.enoughUses).toBe(false);
  });

  it("refuse a pot that gained weight, grams given twice, a future day and an unknown recipe, each beside its field", async () => {
    const recipe = await newRecipe("Use checks", [{ material: "beeswax", pct: 100 }]);
    const base = { recipeId: recipe.id, usedOn: today(), waxedAreaPerMetreM2: 0.8, metres: 10 };
    const gained = await api("POST", "/api/v1/wax/uses", { session: wax, body: { ...base, potBeforeG: 1000, potAfterG: 1200 } });
    expect(gained.status).toBe(400);
    expect(gained.body.error.fields.potAfterG[0]).toMatch(/cannot weigh more after waxing/);
    const twice = await api("POST", "/api/v1/wax/uses", { session: wax, body: { ...base, gramsUsed: 10, potBeforeG: 1000, potAfterG: 900 } });
    expect(twice.body.error.fields.gramsUsed[0]).toMatch(/not both/);
    const future = await api("POST", "/api/v1/wax/uses", { session: wax, body: { ...base, gramsUsed: 10, usedOn: "2999-01-01" } });
    expect(future.body.error.fields.usedOn[0]).toMatch(/future/);
    const unknown = await api("POST", "/api/v1/wax/uses", { session: wax, body: { ...base, gramsUsed: 10, recipeId: "00000000-0000-4000-8000-000000000000" } });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.fields.recipeId[0]).toMatch(/no recipe/);
  });

  it("a use adds its impressions to the stamp without bumping its version; a withdrawal takes them back; the stamp form cannot set the count", async () => {
    const stamp = await createStampRow({ code: `${prefix}-CAP`, impressionsCount: 100 });
    const recipe = await newRecipe("Impressions", [{ material: "beeswax", pct: 100 }]);
    const res = await api("POST", "/api/v1/wax/uses", { session: wax, body: { recipeId: recipe.id, usedOn: today(), waxedAreaPerMetreM2: 0.8, metres: 5, gramsUsed: 700, stampCode: stamp.code.toLowerCase(), impressions: 125 } });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.use.impressions).toEqual([{ stampCode: stamp.code, impressions: 125 }]);
    const after = (await reloadStamp(stamp.code))!;
    expect(after.impressionsCount).toBe(225);
    expect(after.version).toBe(stamp.version);
    // A keeper's edit begun before the use still saves: no false conflict.
    const keeperUser = await createUser("keeper");
    const keeper = (await signIn(keeperUser.email, keeperUser.password))!;
    const edit = await api("PATCH", `/api/v1/stamps/${stamp.code}`, { session: keeper, body: { version: stamp.version, name: "Renamed after the waxing" } });
    expect(edit.status).toBe(200);
    const setCount = await api("PATCH", `/api/v1/stamps/${stamp.code}`, { session: keeper, body: { version: stamp.version + 1, impressionsCount: 5 } });
    expect(setCount.status).toBe(400);
    expect(setCount.body.error.fields.impressionsCount[0]).toMatch(/cannot be set by an edit/);
    const events = await db().select().from(stampEvents).where(and(eq(stampEvents.stampId, stamp.id), eq(stampEvents.kind, "impressions_added")));
    expect(events).toHaveLength(1);

    await api("POST", `/api/v1/wax/uses/${res.body.use.id}/withdraw`, { session: wax, body: { reason: "wrong stamp" } });
    expect((await reloadStamp(stamp.code))!.impressionsCount).toBe(100);
    const unknownStamp = await api("POST", "/api/v1/wax/uses", { session: wax, body: { recipeId: recipe.id, usedOn: today(), waxedAreaPerMetreM2: 0.8, metres: 5, gramsUsed: 700, stampCode: `${prefix}-NONE`, impressions: 3 } });
    expect(unknownStamp.status).toBe(422);
    expect(unknownStamp.body.error.fields.stampCode[0]).toMatch(/no stamp with this code/);
  });

  it("the one writer puts a pair's back-face impressions on its mirror twin; a stamp serving both faces counts them itself", async () => {
    const front = await createStampRow({ code: `${prefix}-FR`, face: "pair" });
    const back = await createStampRow({ code: `${prefix}-BK`, face: "pair", mirrored: true, twinId: front.id });
    await db().update(stamps).set({ twinId: back.id }).where(eq(stamps.id, front.id));
    const single = await createStampRow({ code: `${prefix}-SG` });
    await db().transaction((tx) =>
      addImpressions(tx, [{ stampId: front.id, impressions: 60, backFace: 60 }, { stampId: single.id, impressions: 40, backFace: 40 }], { kind: "runStage", id: "00000000-0000-4000-8000-000000000001" }),
    );
    expect((await reloadStamp(front.code))!.impressionsCount).toBe(60);
    expect((await reloadStamp(back.code))!.impressionsCount).toBe(60);
    expect((await reloadStamp(single.code))!).toMatchObject({ impressionsCount: 80, version: single.version });
  });
});

describe("the purchase list", () => {
  it("sums the planned estimates by material against stock and the reorder level: to buy = needed + reorder − on hand", async () => {
    const m = await newMaterial("Buy wax", { pricePerKg: 20_000, reorderLevelKg: 3 });
    await api("POST", `/api/v1/wax/materials/${m.id}/movements`, { session: wax, body: { kind: "receipt", kg: 4 } });
    const recipe = await newRecipe("Buy mix", [{ material: m.id, pct: 100 }]);
    // 1 m²/m × 1 pass × 100 g/m² = 100 g/m; 50 m → 5 kg, none recovered.
    const body = { recipeId: recipe.id, waxedAreaPerMetreM2: 1, metres: 50, rateGPerM2: 100, lossPct: 0, recoveryPct: 0 };
    const planned = await api("POST", "/api/v1/wax/estimates", { session: wax, body: { ...body, name: name("planned run"), planned: true } });
    expect(planned.status).toBe(201);
    await api("POST", "/api/v1/wax/estimates", { session: wax, body: { ...body, name: name("just looking") } });
    const list = (await api("GET", "/api/v1/wax/purchase-list", { session: planner })).body;
    const line = list.lines.find((l: { material: { id: string } }) => l.material.id === m.id);
    // Hand-worked: needed 5 kg, on hand 4 kg, reorder level 3 kg → buy 4 kg at 20 000 = 80 000; after the work −1 kg.
    expect(line).toMatchObject({ neededKg: 5, onHandKg: 4, afterKg: -1, toBuyKg: 4, cost: 80_000, belowReorderAfter: true });
    expect(list.estimates.map((e: { name: string }) => e.name)).toContain(name("planned run"));
    expect(list.estimates.map((e: { name: string }) => e.name)).not.toContain(name("just looking"));

    const unplan = await api("PATCH", `/api/v1/wax/estimates/${planned.body.estimate.id}`, { session: wax, body: { version: 1, planned: false } });
    expect(unplan.body.estimate).toMatchObject({ planned: false, version: 2 });
    const again = (await api("GET", "/api/v1/wax/purchase-list", { session: planner })).body.lines.find((l: { material: { id: string } }) => l.material.id === m.id);
    expect(again).toMatchObject({ neededKg: 0, toBuyKg: 0 });
    expect((await api("PATCH", `/api/v1/wax/estimates/${planned.body.estimate.id}`, { session: wax, body: { version: 1, planned: true } })).status).toBe(409);
  });
});

describe("defaults and currency", () => {
  afterAll(async () => {
    const settings = (await api("GET", "/api/v1/settings", { session: admin })).body;
    if (settings.settings.currency !== "IDR") await api("PATCH", "/api/v1/settings", { session: admin, body: { version: settings.version, currency: "IDR" } });
  });

  it("wax masters set the default rate, losses and recovery from the settings' version; estimates then use them", async () => {
    const current = (await api("GET", "/api/v1/wax/defaults", { session: wax })).body.defaults;
    const saved = await api("PATCH", "/api/v1/wax/defaults", { session: wax, body: { version: current.version, waxLossPct: 4 } });
    expect(saved.status).toBe(200);
    expect(saved.body.defaults).toMatchObject({ waxLossPct: 4, version: current.version + 1 });
    const est = await api("POST", "/api/v1/wax/estimate", { session: planner, body: { waxedAreaPerMetreM2: 1, metres: 1, rateGPerM2: 100, recipe: { components: [{ material: "beeswax", pct: 100 }] } } });
    expect(est.body.gramsPerMetre).toBeCloseTo(104, 10);
    expect((await api("PATCH", "/api/v1/wax/defaults", { session: wax, body: { version: current.version, waxLossPct: 0 } })).status).toBe(409);
    const back = await api("PATCH", "/api/v1/wax/defaults", { session: wax, body: { version: current.version + 1, waxLossPct: current.waxLossPct } });
    expect(back.body.defaults.waxLossPct).toBe(current.waxLossPct);
    const bad = await api("PATCH", "/api/v1/wax/defaults", { session: wax, body: { version: current.version + 2, waxRecoveryPct: 120 } });
    expect(bad.status).toBe(400);
  });

  it("costs are in the workshop's currency, an admin setting (IDR or USD)", async () => {
    const settings = (await api("GET", "/api/v1/settings", { session: admin })).body;
    expect(settings.settings.currency).toBe("IDR");
    expect((await api("PATCH", "/api/v1/settings", { session: admin, body: { version: settings.version, currency: "EUR" } })).status).toBe(400);
    await api("PATCH", "/api/v1/settings", { session: admin, body: { version: settings.version, currency: "USD" } });
    const est = await api("POST", "/api/v1/wax/estimate", { session: planner, body: { waxedAreaPerMetreM2: 1, metres: 1, rateGPerM2: 100, recipe: { components: [{ material: "beeswax", pct: 100 }] } } });
    expect(est.body.currency).toBe("USD");
    expect((await api("GET", "/api/v1/wax/purchase-list", { session: planner })).body.currency).toBe("USD");
  });
});
