import { beforeAll, describe, expect, it } from "vitest";
import { seedWax } from "@/scripts/seed/wax";
import { createUser, db } from "../helpers/db";
import { api, signIn, type Session } from "../helpers/http";
import { createStampRow, reloadStamp, uniquePrefix } from "../helpers/stamps";

// The wax room reading saved plans: an estimate takes the plan's waxed area per metre and run length, a wax use
// adds the plan's impressions to its stamp, the forms' choices list the plans, and a plan that estimates or wax
// uses name is not deleted.

let wax: Session;
let planner: Session;
const prefix = uniquePrefix("WP");
const FIELD = `${prefix}F`;
let recipeId: string;

beforeAll(async () => {
  await seedWax(db());
  const w = await createUser("waxmaster");
  wax = (await signIn(w.email, w.password))!;
  const p = await createUser("planner");
  planner = (await signIn(p.email, p.password))!;
  await createStampRow({ code: FIELD, name: `Field ${prefix}`, widthMm: 200, heightMm: 200 });
  const recipes = (await api("GET", "/api/v1/wax/recipes", { session: wax })).body.recipes as { id: string; archived?: boolean; archivedAt?: string | null }[];
  recipeId = recipes.find((r) => !r.archivedAt && !r.archived)!.id;
});


async function savePlan(name: string, stamp: Record<string, unknown>) {
  const res = await api("POST", "/api/v1/plans", {
    session: planner,
    body: { name, layout: { cloth: { widthMm: 1150, lengthMm: 30_000, margins: { leftMm: 25, rightMm: 25 } }, stamp, gap: { xMm: 0, yMm: 0 }, arrangement: "straight" } },
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.plan as { id: string; version: number; summary: { waxedAreaPerMetreM2: number; runLengthMm: number; impressionsTotal: number } };
}

describe("wax estimates for saved plans", () => {
  it("an estimate for a plan takes the plan's waxed area per metre × its run", async () => {
    // 1150 mm mori, 25 mm margins → 1100 mm band; a 200 × 200 mm stamp with half its footprint waxed, straight:
    // worked by hand, 5 across × 5 rows a metre = 25 impressions × 0.04 m² × 0.5 = 0.5 m² of wax a metre; 30 m run.
    const plan = await savePlan(`${prefix} half`, { widthMm: 200, heightMm: 200, coverage: 0.5 });
    expect(plan.summary.waxedAreaPerMetreM2).toBeCloseTo(0.5, 9);
    expect(plan.summary.runLengthMm).toBe(30_000);
    const res = await api("POST", "/api/v1/wax/estimate", { session: planner, body: { planId: plan.id, recipeId, passes: 1, rateGPerM2: 90, lossPct: 5, recoveryPct: 0 } });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    // By hand: 0.5 m²/m × 1 pass × 90 g/m² × 1.05 = 47.25 g/m; × 30 m (the plan's own run) = 1.4175 kg.
    expect(res.body.inputs).toMatchObject({ planId: plan.id, metres: 30, passes: 1 });
    expect(res.body.inputs.waxedAreaPerMetreM2).toBeCloseTo(0.5, 9);
    expect(res.body.gramsPerMetre).toBeCloseTo(47.25, 9);
    expect(res.body.kgGross).toBeCloseTo(1.4175, 9);
    expect(res.body.kgNew).toBeCloseTo(1.4175, 9);

    // A run given in the request replaces the plan's: 2 kodi of 2.5 m = 100 m → 4.725 kg.
    const kodi = await api("POST", "/api/v1/wax/estimate", { session: planner, body: { planId: plan.id, recipeId, kodi: 2, pieceLengthMm: 2500, rateGPerM2: 90, lossPct: 5, recoveryPct: 0 } });
    expect(kodi.status, JSON.stringify(kodi.body)).toBe(200);
    expect(kodi.body.kgGross).toBeCloseTo(4.725, 9);
  });

  it("an unknown plan is a 422 on planId", async () => {
    const res = await api("POST", "/api/v1/wax/estimate", { session: planner, body: { planId: "7a1e0c52-3b9d-4f61-8c2a-0d4e5f6a7b8c", recipeId, rateGPerM2: 90 } });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.planId).toEqual(["There is no saved plan with this id."]);
    const use = await api("POST", "/api/v1/wax/uses", { session: wax, body: { recipeId, usedOn: new Date().toISOString().slice(0, 10), planId: "7a1e0c52-3b9d-4f61-8c2a-0d4e5f6a7b8c", metres: 10, gramsUsed: 500 } });
    expect(use.status).toBe(422);
    expect(use.body.error.fields.planId).toEqual(["There is no saved plan with this id."]);
  });

  it("a wax use for a plan with a library stamp adds the plan's impressions for the metres waxed to that stamp", async () => {
    const plan = await savePlan(`${prefix} library`, { code: FIELD });
    expect(plan.summary.impressionsTotal).toBe(750); // 25 a metre × 30 m, worked by hand above
    const before = (await reloadStamp(FIELD))!.impressionsCount;
    const res = await api("POST", "/api/v1/wax/uses", { session: wax, body: { recipeId, usedOn: new Date().toISOString().slice(0, 10), planId: plan.id, metres: 10, gramsUsed: 900 } });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.use.waxedAreaPerMetreM2).toBeCloseTo(1, 9);
    // 750 / 30 m × 10 m × 1 pass = 250 impressions
    expect(res.body.use.impressions).toEqual([{ stampCode: FIELD, impressions: 250 }]);
    expect((await reloadStamp(FIELD))!.impressionsCount).toBe(before + 250);

    // A plan that has been waxed stays on record: deleting it is refused, naming the wax use.
    const del = await api("DELETE", `/api/v1/plans/${plan.id}?version=${plan.version}`, { session: planner });
    expect(del.status).toBe(409);
    expect(del.body.error).toMatchObject({ code: "planInWaxRecords", uses: 1, estimates: [] });
    expect((await api("GET", `/api/v1/plans/${plan.id}`, { session: planner })).status).toBe(200);
  });

  it("the forms offer saved plans; deleting a plan that a saved estimate names is refused until the estimate goes", async () => {
    const plan = await savePlan(`${prefix} estimated`, { widthMm: 200, heightMm: 200 });
    const saved = await api("POST", "/api/v1/wax/estimates", { session: wax, body: { name: `${prefix} for the market`, planId: plan.id, recipeId, rateGPerM2: 90 } });
    expect(saved.status, JSON.stringify(saved.body)).toBe(201);
    expect(saved.body.estimate.planId).toBe(plan.id);

    const refused = await api("DELETE", `/api/v1/plans/${plan.id}?version=${plan.version}`, { session: planner });
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatchObject({ code: "planInWaxRecords", uses: 0, estimates: [{ id: saved.body.estimate.id, name: `${prefix} for the market` }] });
    expect(refused.body.error.message).toContain(`“${prefix} for the market”`);
    expect(refused.body.error.message).toMatch(/1 saved wax estimate/);

    const gone = await api("DELETE", `/api/v1/wax/estimates/${saved.body.estimate.id}?version=${saved.body.estimate.version}`, { session: wax });
    expect(gone.status, JSON.stringify(gone.body)).toBe(204);
    const deleted = await api("DELETE", `/api/v1/plans/${plan.id}?version=${plan.version}`, { session: planner });
    expect(deleted.status, JSON.stringify(deleted.body)).toBe(204);
  });
});
