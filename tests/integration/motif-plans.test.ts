import { beforeAll, describe, expect, it } from "vitest";
import { waxEstimates } from "@/db/schema";
import { createUser, db } from "../helpers/db";
import { api, signIn, type Session } from "../helpers/http";
import { createStampRow, uniquePrefix } from "../helpers/stamps";

// A plan started from a motif is one of the motif's past plans (with its saved wax estimates), and the motif
// cannot be deleted while the plan points at it.
const prefix = uniquePrefix("MP");
let designer: Session;
let planner: Session;
let wax: Session;

beforeAll(async () => {
  const [d, p, w] = await Promise.all([createUser("designer"), createUser("planner"), createUser("waxmaster")]);
  designer = (await signIn(d.email, d.password))!;
  planner = (await signIn(p.email, p.password))!;
  wax = (await signIn(w.email, w.password))!;
});

describe("a motif's past plans", () => {
  it("lists a plan started from the motif with its wax estimates, and refuses to delete the motif, naming the plan", async () => {
    const main = await createStampRow({ code: `${prefix}-M`, widthMm: 200, heightMm: 200 });
    const motif = (await api("POST", "/api/v1/motifs", { session: designer, body: { name: `${prefix} Lotus`, stamps: [{ code: main.code, role: "main" }] } })).body.motif;
    const before = await api("GET", `/api/v1/motifs/${motif.id}`, { session: designer });
    expect(before.body.plans).toEqual([]);

    const layout = { cloth: { widthMm: 1150, lengthMm: 10_000, margins: { leftMm: 25, rightMm: 25 } }, stamp: { code: main.code }, gap: { xMm: 0, yMm: 0 }, arrangement: "half-drop" };
    const saved = await api("POST", "/api/v1/plans", { session: planner, body: { name: `${prefix} Lotus run`, layout, motifId: motif.id } });
    expect(saved.status, JSON.stringify(saved.body)).toBe(201);
    const plan = saved.body.plan;

    const material = await api("POST", "/api/v1/wax/materials", {
      session: wax,
      body: { name: `${prefix} wax`, densityGPerCm3: 0.9, meltingRangeC: { fromC: 50, toC: 60 }, flashPointC: 180, pricePerKg: 10_000, reorderLevelKg: 2, sources: { density: "test figure", melting: "test figure", flashPoint: "test figure" } },
    });
    expect(material.status, JSON.stringify(material.body)).toBe(201);
    const recipe = await api("POST", "/api/v1/wax/recipes", { session: wax, body: { name: `${prefix} recipe`, season: "dry", use: "stamping", components: [{ material: material.body.material.code, pct: 100 }], workingRangeC: { minC: 60, maxC: 72 } } });
    expect(recipe.status, JSON.stringify(recipe.body)).toBe(201);
    // The wax room's plan seam (planForWax) does not read saved plans yet, so the estimate is stored as the wax room stores one.
    await db().insert(waxEstimates).values({ name: `${prefix} estimate`, planId: plan.id, recipeId: recipe.body.recipe.id, inputs: {}, results: {}, gramsPerMetre: 12.5, kgNew: 1.2, createdByName: "Wax master" });

    const after = await api("GET", `/api/v1/motifs/${motif.id}`, { session: designer });
    expect(after.body.plans).toEqual([
      expect.objectContaining({ id: plan.id, name: `${prefix} Lotus run`, arrangement: "half-drop", clothWidthMm: 1150, estimates: [expect.objectContaining({ name: `${prefix} estimate`, kgNew: 1.2, gramsPerMetre: 12.5 })] }),
    ]);

    const refused = await api("DELETE", `/api/v1/motifs/${motif.id}`, { session: designer });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe("motifInUse");
    expect(refused.body.error.message).toContain(`${prefix} Lotus run`);
    expect(refused.body.error.plans).toEqual([{ id: plan.id, name: `${prefix} Lotus run` }]);
    expect((await api("GET", `/api/v1/motifs/${motif.id}`, { session: designer })).status).toBe(200);
  });
});
