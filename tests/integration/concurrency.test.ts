import { and, eq, inArray, isNull } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { checkouts, waxUses } from "@/db/schema";
import { seedWax } from "@/scripts/seed/wax";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn, type Session } from "../helpers/http";
import { createStampRow, reloadStamp, uniquePrefix } from "../helpers/stamps";

// Races that must never be won twice: many keepers checking out the same stamps at once (one winner per stamp per
// round, every round), two people saving the same version of a plan, recipe, motif or run (one 200, one 409,
// every time), and two wax masters recording the same waxing stage at once (both records count once each).
const prefix = uniquePrefix("CC");
let keeper: Session;
let planner: Session;
let waxmaster: Session;
let waxmaster2: Session;
let designer: Session;
const today = new Date().toISOString().slice(0, 10);
const due = new Date(Date.now() + 3 * 86_400_000).toISOString().slice(0, 10);

beforeAll(async () => {
  testEnv();
  await seedWax(db());
  const [k, p, w, w2, d] = await Promise.all([createUser("keeper"), createUser("planner"), createUser("waxmaster"), createUser("waxmaster"), createUser("designer")]);
  [keeper, planner, waxmaster, waxmaster2, designer] = await Promise.all([k, p, w, w2, d].map(async (u) => (await signIn(u.email, u.password))!));
});

describe("check-outs under a rush", () => {
  it("100 concurrent check-outs over 20 stamps for 50 rounds: one winner per stamp per round", async () => {
    const stamps = await Promise.all(Array.from({ length: 20 }, (_, i) => createStampRow({ code: `${prefix}-R${i}` })));
    const rounds = 50;
    const problems: string[] = [];
    for (let round = 0; round < rounds; round++) {
      const answers = await Promise.all(
        Array.from({ length: 100 }, (_, i) => {
          const stamp = stamps[i % 20];
          return api("POST", `/api/v1/stamps/${stamp.code}/checkout`, { session: keeper, body: { borrowerName: `Stamper ${i}`, workstation: `Table ${i}`, dueOn: due } }).then((r) => ({ code: stamp.code, status: r.status }));
        }),
      );
      for (const s of stamps) {
        const mine = answers.filter((a) => a.code === s.code);
        const won = mine.filter((a) => a.status === 201).length;
        const lost = mine.filter((a) => a.status === 409).length;
        if (won !== 1 || lost !== 4) problems.push(`round ${round}, ${s.code}: ${won} won, ${lost} refused, others ${mine.filter((a) => a.status !== 201 && a.status !== 409).map((a) => a.status)}`);
      }
      const returns = await Promise.all(stamps.map((s) => api("POST", `/api/v1/stamps/${s.code}/return`, { session: keeper, body: {} })));
      if (returns.some((r) => r.status !== 200)) problems.push(`round ${round}: returns ${returns.map((r) => r.status)}`);
    }
    expect(problems).toEqual([]);
    const ids = stamps.map((s) => s.id);
    expect(await db().select().from(checkouts).where(inArray(checkouts.stampId, ids))).toHaveLength(20 * rounds);
    expect(await db().select().from(checkouts).where(and(inArray(checkouts.stampId, ids), isNull(checkouts.returnedAt)))).toHaveLength(0);
  }, 600_000);
});

describe("two saves of the same version", () => {
  const ROUNDS = 10;
  async function race(path: string, session: Session, version: () => Promise<number>, patch: (i: number) => Record<string, unknown>) {
    const outcomes: string[] = [];
    for (let round = 0; round < ROUNDS; round++) {
      const v = await version();
      const [a, b] = await Promise.all([0, 1].map((i) => api("PATCH", path, { session, body: { version: v, ...patch(round * 2 + i) } })));
      outcomes.push([a.status, b.status].sort().join("+"));
    }
    expect(outcomes).toEqual(Array(ROUNDS).fill("200+409"));
  }

  it("a plan, a recipe, a motif and a run: one 200 and one 409, every time", async () => {
    await createStampRow({ code: `${prefix}-M`, widthMm: 200, heightMm: 200 });
    const motif = (await api("POST", "/api/v1/motifs", { session: designer, body: { name: `${prefix} Wave`, stamps: [{ code: `${prefix}-M`, role: "main" }], colourways: [{ name: "Cream", colours: [{ name: "Cream", swatch: "#f4efe6", waxStamps: [`${prefix}-M`], face: "front" }, { name: "Indigo", swatch: "#1f3a5f" }] }] } })).body.motif;
    const layout = { cloth: { widthMm: 1150, lengthMm: 10_000, margins: { leftMm: 25, rightMm: 25 } }, stamp: { code: `${prefix}-M` }, gap: { xMm: 0, yMm: 0 }, arrangement: "straight" };
    const plan = (await api("POST", "/api/v1/plans", { session: planner, body: { name: `${prefix} plan`, layout, motifId: motif.id } })).body.plan;
    const recipes = (await api("GET", "/api/v1/wax/recipes", { session: waxmaster })).body.recipes as { id: string }[];
    const run = (await api("POST", "/api/v1/runs", { session: planner, body: { name: `${prefix} run`, motifId: motif.id, colourwayId: motif.colourways[0].id, cloth: "mori 115 cm", metres: 10, planIds: [plan.id], recipeId: recipes[0].id } })).body.run;

    await race(`/api/v1/plans/${plan.id}`, planner, async () => (await api("GET", `/api/v1/plans/${plan.id}`, { session: planner })).body.plan.version, (i) => ({ name: `${prefix} plan ${i}` }));
    await race(`/api/v1/wax/recipes/${recipes[0].id}`, waxmaster, async () => (await api("GET", `/api/v1/wax/recipes/${recipes[0].id}`, { session: waxmaster })).body.recipe.version, (i) => ({ notes: `${prefix} note ${i}` }));
    await race(`/api/v1/motifs/${motif.id}`, designer, async () => (await api("GET", `/api/v1/motifs/${motif.id}`, { session: designer })).body.motif.version, (i) => ({ name: `${prefix} Wave ${i}` }));
    await race(`/api/v1/runs/${run.id}`, planner, async () => (await api("GET", `/api/v1/runs/${run.id}`, { session: planner })).body.run.version, (i) => ({ name: `${prefix} run ${i}` }));
  }, 300_000);
});

describe("two wax masters recording one stage at once", () => {
  it("counts each record's wax and impressions once: two wax uses, the stage's total is their sum", async () => {
    const code = `${prefix}-W`;
    await createStampRow({ code, widthMm: 200, heightMm: 200 });
    const motif = (await api("POST", "/api/v1/motifs", { session: designer, body: { name: `${prefix} Reed`, stamps: [{ code, role: "main" }], colourways: [{ name: "Cream", colours: [{ name: "Cream", swatch: "#f4efe6", waxStamps: [code], face: "front" }, { name: "Soga", swatch: "#6b4423" }] }] } })).body.motif;
    const layout = { cloth: { widthMm: 1150, lengthMm: 30_000, margins: { leftMm: 25, rightMm: 25 } }, stamp: { code }, gap: { xMm: 0, yMm: 0 }, arrangement: "straight" };
    const plan = (await api("POST", "/api/v1/plans", { session: planner, body: { name: `${prefix} reed plan`, layout, motifId: motif.id } })).body.plan;
    const recipes = (await api("GET", "/api/v1/wax/recipes", { session: waxmaster })).body.recipes as { id: string }[];
    const run = (await api("POST", "/api/v1/runs", { session: planner, body: { name: `${prefix} reed run`, motifId: motif.id, colourwayId: motif.colourways[0].id, cloth: "mori 115 cm", metres: 30, planIds: [plan.id], recipeId: recipes[0].id } })).body.run;
    const stage = run.stages.find((s: { kind: string }) => s.kind === "wax");
    const before = (await reloadStamp(code))!.impressionsCount;
    const [a, b] = await Promise.all([
      api("POST", `/api/v1/runs/${run.id}/stages/${stage.id}/progress`, { session: waxmaster, body: { doneOn: today, metres: 10, gramsUsed: 1200, impressions: 250 } }),
      api("POST", `/api/v1/runs/${run.id}/stages/${stage.id}/progress`, { session: waxmaster2, body: { doneOn: today, metres: 8, gramsUsed: 900, impressions: 200 } }),
    ]);
    expect([a.status, b.status], JSON.stringify([a.body, b.body])).toEqual([201, 201]);
    const after = (await api("GET", `/api/v1/runs/${run.id}`, { session: planner })).body.run;
    const done = after.stages.find((s: { id: string }) => s.id === stage.id).done;
    // 1200 + 900 g and 250 + 200 impressions, added by hand.
    expect(done).toMatchObject({ metres: 18, waxUsedG: 2100, impressions: 450 });
    expect(await db().select().from(waxUses).where(eq(waxUses.runStageId, stage.id))).toHaveLength(2);
    expect((await reloadStamp(code))!.impressionsCount).toBe(before + 450);
  }, 120_000);
});
