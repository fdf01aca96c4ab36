import { count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { waxEstimates, waxMaterials, waxRecipes, waxStockMovements, waxUses, workshopSettings, type Role } from "@/db/schema";
import { can, roles } from "@/lib/permissions";
import { seedWax } from "@/scripts/seed/wax";
import { createUser, db } from "../helpers/db";
import { api, signIn, type Session } from "../helpers/http";
import { uniquePrefix } from "../helpers/stamps";

// SPEC section 2: wax masters and admins create and change materials, recipes, estimates, stock and wax uses;
// every role reads them. Each wax route, for each role: reads answer 200, a write the role may not make answers
// 403 and leaves the database as it was.
const sessions = {} as Record<Role, Session>;
const prefix = uniquePrefix("WP");
const today = () => new Date().toISOString().slice(0, 10);
let fixture: { materialId: string; recipeId: string; otherRecipeId: string; estimateId: string; useId: string };

const rows = async (table: typeof waxMaterials | typeof waxRecipes | typeof waxEstimates | typeof waxUses | typeof waxStockMovements) => (await db().select({ n: count() }).from(table))[0].n;
const versionOf = async (table: typeof waxMaterials | typeof waxRecipes | typeof waxEstimates, id: string) => (await db().select({ v: table.version }).from(table).where(eq(table.id, id)))[0]?.v;

beforeAll(async () => {
  await seedWax(db());
  for (const role of roles) {
    const user = await createUser(role);
    sessions[role] = (await signIn(user.email, user.password))!;
  }
  const wax = sessions.waxmaster;
  const [beeswax] = await db().select().from(waxMaterials).where(eq(waxMaterials.code, "beeswax"));
  const recipe = (await api("POST", "/api/v1/wax/recipes", { session: wax, body: { name: `${prefix} base`, season: "dry", use: "stamping", components: [{ material: "beeswax", pct: 100 }], workingRangeC: { minC: 60, maxC: 70 } } })).body.recipe;
  const other = (await api("POST", "/api/v1/wax/recipes", { session: wax, body: { name: `${prefix} other`, season: "rainy", use: "stamping", components: [{ material: "paraffin", pct: 100 }], workingRangeC: { minC: 60, maxC: 70 } } })).body.recipe;
  const estimate = (await api("POST", "/api/v1/wax/estimates", { session: wax, body: { name: `${prefix} estimate`, recipeId: recipe.id, waxedAreaPerMetreM2: 0.8, metres: 10 } })).body.estimate;
  const use = (await api("POST", "/api/v1/wax/uses", { session: wax, body: { recipeId: recipe.id, usedOn: today(), waxedAreaPerMetreM2: 0.8, metres: 10, gramsUsed: 1400 } })).body.use;
  fixture = { materialId: beeswax.id, recipeId: recipe.id, otherRecipeId: other.id, estimateId: estimate.id, useId: use.id };
});

// Other suites expect the default rate: leave it as found.
afterAll(async () => {
  const { defaults } = (await api("GET", "/api/v1/wax/defaults", { session: sessions.admin })).body;
  if (defaults.waxRateGPerM2 !== 90) await api("PATCH", "/api/v1/wax/defaults", { session: sessions.admin, body: { version: defaults.version, waxRateGPerM2: 90 } });
});

describe.each(roles)("as %s", (role) => {
  const writes = can(role, "wax:write");
  const session = () => sessions[role];

  it("reads every wax route and may estimate without saving", async () => {
    const { materialId, recipeId, otherRecipeId, estimateId, useId } = fixture;
    for (const path of [
      "/api/v1/wax/materials",
      `/api/v1/wax/materials/${materialId}`,
      `/api/v1/wax/materials/${materialId}/history`,
      `/api/v1/wax/materials/${materialId}/movements`,
      "/api/v1/wax/recipes",
      `/api/v1/wax/recipes/${recipeId}`,
      `/api/v1/wax/recipes/${recipeId}/history`,
      `/api/v1/wax/recipes/compare?a=${recipeId}&b=${otherRecipeId}`,
      "/api/v1/wax/estimates",
      `/api/v1/wax/estimates/${estimateId}`,
      "/api/v1/wax/uses",
      `/api/v1/wax/uses/${useId}`,
      "/api/v1/wax/calibration",
      "/api/v1/wax/purchase-list",
      "/api/v1/wax/defaults",
    ]) {
      expect((await api("GET", path, { session: session() })).status, path).toBe(200);
    }
    const estimate = await api("POST", "/api/v1/wax/estimate", { session: session(), body: { recipeId, waxedAreaPerMetreM2: 0.8, metres: 10 } });
    expect(estimate.status).toBe(200);
  });

  it(`adds materials and records stock ${writes ? "(allowed)" : "— 403, nothing stored"}`, async () => {
    const [materials, movements] = [await rows(waxMaterials), await rows(waxStockMovements)];
    const created = await api("POST", "/api/v1/wax/materials", {
      session: session(),
      body: { name: `${prefix} ${role} wax`, densityGPerCm3: 0.9, meltingRangeC: { fromC: 50, toC: 60 }, sources: { density: "t", melting: "t", flashPoint: "t" } },
    });
    expect(created.status).toBe(writes ? 201 : 403);
    const moved = await api("POST", `/api/v1/wax/materials/${fixture.materialId}/movements`, { session: session(), body: { kind: "receipt", kg: 1 } });
    expect(moved.status).toBe(writes ? 201 : 403);
    expect(await rows(waxMaterials)).toBe(materials + (writes ? 1 : 0));
    expect(await rows(waxStockMovements)).toBe(movements + (writes ? 1 : 0));
    if (!writes) expect(created.body.error.code).toBe("forbidden");
  });

  it(`changes a material ${writes ? "(allowed)" : "— 403, version unchanged"}`, async () => {
    const [material] = await db().select().from(waxMaterials).where(eq(waxMaterials.id, fixture.materialId));
    const version = material.version;
    // A value the material does not have yet: a save that changes nothing keeps the version.
    const res = await api("PATCH", `/api/v1/wax/materials/${fixture.materialId}`, { session: session(), body: { version, reorderLevelKg: material.reorderLevelKg + 1 } });
    expect(res.status).toBe(writes ? 200 : 403);
    expect(await versionOf(waxMaterials, fixture.materialId)).toBe(version! + (writes ? 1 : 0));
  });

  it(`creates, changes, duplicates and deletes recipes ${writes ? "(allowed)" : "— 403, nothing changed"}`, async () => {
    const before = await rows(waxRecipes);
    const created = await api("POST", "/api/v1/wax/recipes", { session: session(), body: { name: `${prefix} ${role} new`, season: "humid", use: "stamping", components: [{ material: "beeswax", pct: 100 }], workingRangeC: { minC: 60, maxC: 70 } } });
    expect(created.status).toBe(writes ? 201 : 403);
    const copy = await api("POST", `/api/v1/wax/recipes/${fixture.recipeId}/duplicate`, { session: session(), body: { name: `${prefix} ${role} copy` } });
    expect(copy.status).toBe(writes ? 201 : 403);
    expect(await rows(waxRecipes)).toBe(before + (writes ? 2 : 0));
    const version = await versionOf(waxRecipes, fixture.otherRecipeId);
    const patched = await api("PATCH", `/api/v1/wax/recipes/${fixture.otherRecipeId}`, { session: session(), body: { version, notes: `by ${role}` } });
    expect(patched.status).toBe(writes ? 200 : 403);
    expect(await versionOf(waxRecipes, fixture.otherRecipeId)).toBe(version! + (writes ? 1 : 0));
    const target = writes ? copy.body.recipe.id : fixture.otherRecipeId;
    const deleted = await api("DELETE", `/api/v1/wax/recipes/${target}`, { session: session() });
    expect(deleted.status).toBe(writes ? 204 : 403);
    expect(await versionOf(waxRecipes, target)).toBe(writes ? undefined : version);
  });

  it(`saves, marks and deletes estimates ${writes ? "(allowed)" : "— 403, nothing changed"}`, async () => {
    const before = await rows(waxEstimates);
    const saved = await api("POST", "/api/v1/wax/estimates", { session: session(), body: { name: `${prefix} ${role}`, recipeId: fixture.recipeId, waxedAreaPerMetreM2: 0.8, metres: 5 } });
    expect(saved.status).toBe(writes ? 201 : 403);
    expect(await rows(waxEstimates)).toBe(before + (writes ? 1 : 0));
    const version = await versionOf(waxEstimates, fixture.estimateId);
    const marked = await api("PATCH", `/api/v1/wax/estimates/${fixture.estimateId}`, { session: session(), body: { version, planned: version! % 2 === 1 } });
    expect(marked.status).toBe(writes ? 200 : 403);
    expect(await versionOf(waxEstimates, fixture.estimateId)).toBe(version! + (writes ? 1 : 0));
    const target = writes ? saved.body.estimate.id : fixture.estimateId;
    expect((await api("DELETE", `/api/v1/wax/estimates/${target}`, { session: session() })).status).toBe(writes ? 204 : 403);
    expect(await versionOf(waxEstimates, target)).toBe(writes ? undefined : version);
  });

  it(`records and withdraws wax uses ${writes ? "(allowed)" : "— 403, nothing recorded"}`, async () => {
    const [uses, movements] = [await rows(waxUses), await rows(waxStockMovements)];
    const recorded = await api("POST", "/api/v1/wax/uses", { session: session(), body: { recipeId: fixture.recipeId, usedOn: today(), waxedAreaPerMetreM2: 0.8, metres: 4, gramsUsed: 600 } });
    expect(recorded.status).toBe(writes ? 201 : 403);
    expect(await rows(waxUses)).toBe(uses + (writes ? 1 : 0));
    const target = writes ? recorded.body.use.id : fixture.useId;
    const withdrawn = await api("POST", `/api/v1/wax/uses/${target}/withdraw`, { session: session(), body: { reason: "test" } });
    expect(withdrawn.status).toBe(writes ? 200 : 403);
    // A recorded use moves one material out, its withdrawal moves it back.
    expect(await rows(waxStockMovements)).toBe(movements + (writes ? 2 : 0));
    const [fixtureUse] = await db().select().from(waxUses).where(eq(waxUses.id, fixture.useId));
    expect(fixtureUse.withdrawnAt).toBeNull();
  });

  it(`changes the wax defaults ${writes ? "(allowed)" : "— 403, settings unchanged"}`, async () => {
    const [before] = await db().select().from(workshopSettings);
    const version = before?.version ?? 1;
    const res = await api("PATCH", "/api/v1/wax/defaults", { session: session(), body: { version, waxRateGPerM2: 91 + roles.indexOf(role) } });
    expect(res.status).toBe(writes ? 200 : 403);
    const [after] = await db().select().from(workshopSettings);
    expect(after?.version ?? 1).toBe(version + (writes ? 1 : 0));
  });
});

describe("without a session", () => {
  it("wax routes answer 401 in JSON", async () => {
    for (const [method, path] of [
      ["GET", "/api/v1/wax/materials"],
      ["GET", "/api/v1/wax/recipes"],
      ["POST", "/api/v1/wax/estimate"],
      ["GET", "/api/v1/wax/purchase-list"],
      ["POST", "/api/v1/wax/uses"],
    ] as const) {
      const res = await api(method, path, method === "POST" ? { body: {} } : {});
      expect(res.status, `${method} ${path}`).toBe(401);
      expect(res.body.error.code).toBe("unauthenticated");
    }
  });
});
