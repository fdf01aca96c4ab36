import { and, count, eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { runs, waxStockMovements, waxUses } from "@/db/schema";
import { can, roles, type Role } from "@/lib/permissions";
import { seedWax } from "@/scripts/seed/wax";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn, type Session } from "../helpers/http";
import { createStampRow, reloadStamp, uniquePrefix } from "../helpers/stamps";

// Production runs over HTTP against the real database: a run started from a colourway gets its default stages
// with estimates whose sums are the run's totals; recording a waxing writes the wax room's wax use (calibration),
// the stamps' impressions and the stock movements in one transaction (a failure leaves none); the boil-off
// returns wax to stock and sets the measured recovery; readings warn; findings flag a stamp; every role; 409.

const prefix = uniquePrefix("RU");
const sessions = {} as Record<Role, Session>;
const MAIN = `${prefix}-M`;
const FILL = `${prefix}-F`;
let motifId: string;
let colourwayId: string;
let planId: string;
let recipe: { id: string; workingRangeC?: { maxC: number }; workingMaxC?: number };
const today = new Date().toISOString().slice(0, 10);

interface Stage {
  id: string;
  kind: string;
  position: number;
  estimate: { kg: number; impressions: number; hours: number };
  stamps: { code: string }[];
  recipe: { workingMaxC: number } | null;
}

beforeAll(async () => {
  testEnv();
  await seedWax(db());
  for (const role of roles) {
    const u = await createUser(role);
    sessions[role] = (await signIn(u.email, u.password))!;
  }
  await createStampRow({ code: MAIN, name: `Main ${prefix}`, widthMm: 200, heightMm: 200 });
  await createStampRow({ code: FILL, name: `Filler ${prefix}`, widthMm: 100, heightMm: 100 });
  const motif = await api("POST", "/api/v1/motifs", {
    session: sessions.designer,
    body: {
      name: `${prefix} Lotus`,
      stamps: [
        { code: MAIN, role: "main" },
        { code: FILL, role: "filler" },
      ],
      colourways: [
        {
          name: "Soga and indigo",
          colours: [
            { name: "Cream", swatch: "#f4efe6", waxStamps: [MAIN], face: "front" },
            { name: "Indigo", swatch: "#1f3a5f", waxStamps: [MAIN, FILL], face: "front" },
            { name: "Soga", swatch: "#6b4423" },
          ],
        },
      ],
    },
  });
  expect(motif.status, JSON.stringify(motif.body)).toBe(201);
  motifId = motif.body.motif.id;
  colourwayId = motif.body.motif.colourways[0].id;
  const plan = await api("POST", "/api/v1/plans", {
    session: sessions.planner,
    body: { name: `${prefix} plan`, motifId, layout: { cloth: { widthMm: 1150, lengthMm: 30_000, margins: { leftMm: 25, rightMm: 25 } }, stamp: { code: MAIN }, gap: { xMm: 0, yMm: 0 }, arrangement: "straight" } },
  });
  expect(plan.status, JSON.stringify(plan.body)).toBe(201);
  planId = plan.body.plan.id;
  const recipes = (await api("GET", "/api/v1/wax/recipes", { session: sessions.waxmaster })).body.recipes as (typeof recipe & { archivedAt?: string | null })[];
  recipe = recipes.find((r) => !r.archivedAt)!;
});

const runBody = (name: string, extra: Record<string, unknown> = {}) => ({ name: `${prefix} ${name}`, motifId, colourwayId, cloth: "mori primissima 115 cm", metres: 20, planIds: [planId], recipeId: recipe.id, ...extra });

async function startRun(name: string, extra: Record<string, unknown> = {}) {
  const res = await api("POST", "/api/v1/runs", { session: sessions.planner, body: runBody(name, extra) });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.run as { id: string; version: number; state: string; stages: Stage[]; totals: { wax: { kgEstimated: number; kgUsed: number; kgRecovered: number }; hours: number; impressions: { estimated: number; done: number } } };
}

const runCount = async () => (await db().select({ n: count() }).from(runs))[0].n;

describe("a run from a colourway", () => {
  it("gets the colourway's stages in order with estimates, and its totals are the sums of its stages", async () => {
    const run = await startRun("defaults");
    expect(run.state).toBe("setup");
    // Cream: dye, wax over it; Indigo: dye, wax over it; Soga: dye (nothing waxed after the last); boil-off last.
    expect(run.stages.map((s) => s.kind)).toEqual(["dye", "wax", "dye", "wax", "dye", "boil_off"]);
    expect(run.stages[3].stamps.map((s) => s.code).sort()).toEqual([FILL, MAIN].sort());
    const waxing = run.stages.filter((s) => s.kind === "wax");
    for (const s of waxing) expect(s.estimate.kg).toBeGreaterThan(0);
    // The plan lays 25 impressions a metre (1100 mm band, 200 mm stamp: 5 across × 5 rows, worked by hand):
    // 20 m → 500 impressions per waxing stage.
    expect(waxing.map((s) => s.estimate.impressions)).toEqual([500, 500]);
    const sum = (f: (s: Stage) => number) => run.stages.reduce((a, s) => a + f(s), 0);
    expect(run.totals.wax.kgEstimated).toBeCloseTo(sum((s) => s.estimate.kg), 9);
    expect(run.totals.hours).toBeCloseTo(sum((s) => s.estimate.hours), 9);
    expect(run.totals.impressions.estimated).toBe(sum((s) => s.estimate.impressions));
    expect(run.totals.wax).toMatchObject({ kgUsed: 0, kgRecovered: 0 });

    const list = await api("GET", `/api/v1/runs?q=${encodeURIComponent(`${prefix} defaults`)}`, { session: sessions.designer });
    expect(list.status).toBe(200);
    expect(list.body).toMatchObject({ total: 1, page: 1, pageSize: 25 });
    expect(list.body.runs[0]).toMatchObject({ id: run.id, currentStage: { position: 0, kind: "dye" } });
  });

  it("refuses bad input beside the field: no size, both sizes, an unknown colourway", async () => {
    const before = await runCount();
    const none = await api("POST", "/api/v1/runs", { session: sessions.planner, body: runBody("none", { metres: undefined }) });
    expect(none.status).toBe(400);
    expect(none.body.error.fields.metres).toBeDefined();
    const both = await api("POST", "/api/v1/runs", { session: sessions.planner, body: runBody("both", { pieces: 10, pieceLengthMm: 2500 }) });
    expect(both.status).toBe(400);
    expect(both.body.error.fields.metres).toEqual(["Give the run as metres, or as pieces of a length — one of the two."]);
    const blank = await api("POST", "/api/v1/runs", { session: sessions.planner, body: runBody("", { name: " " }) });
    expect(blank.status).toBe(400);
    expect(blank.body.error.fields.name).toBeDefined();
    const unknown = await api("POST", "/api/v1/runs", { session: sessions.planner, body: runBody("unknown", { colourwayId: "7a1e0c52-3b9d-4f61-8c2a-0d4e5f6a7b8c" }) });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.fields.colourwayId).toEqual(["This motif has no such colourway."]);
    expect(await runCount()).toBe(before);
  });

  it("answers 409 to an edit from an old version and keeps the newer one", async () => {
    const run = await startRun("versions");
    const first = await api("PATCH", `/api/v1/runs/${run.id}`, { session: sessions.planner, body: { version: run.version, dueOn: "2027-01-15" } });
    expect(first.status, JSON.stringify(first.body)).toBe(200);
    expect(first.body.run.version).toBe(run.version + 1);
    const stale = await api("PATCH", `/api/v1/runs/${run.id}`, { session: sessions.planner, body: { version: run.version, dueOn: "2027-02-01" } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("versionConflict");
    expect((await api("GET", `/api/v1/runs/${run.id}`, { session: sessions.keeper })).body.run.dueOn).toBe("2027-01-15");

    // A stopped run takes no more records.
    const halted = await api("PATCH", `/api/v1/runs/${run.id}`, { session: sessions.planner, body: { version: first.body.run.version, state: "halted", stateNote: "cloth ran out" } });
    expect(halted.status).toBe(200);
    expect(halted.body.run).toMatchObject({ state: "halted", stateNote: "cloth ran out" });
    expect(halted.body.run.history.map((h: { kind: string }) => h.kind)).toEqual(["created", "edited", "state"]);
    const dye = halted.body.run.stages.find((s: Stage) => s.kind === "dye");
    const late = await api("POST", `/api/v1/runs/${run.id}/stages/${dye.id}/progress`, { session: sessions.planner, body: { doneOn: today, metres: 3 } });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe("runClosed");
  });
});

const stockOf = async () => (await db().select({ n: count(), kg: sql<number>`coalesce(sum(${waxStockMovements.kg}), 0)`.mapWith(Number) }).from(waxStockMovements))[0];
const usesOfStage = async (stageId: string) => (await db().select({ n: count() }).from(waxUses).where(eq(waxUses.runStageId, stageId)))[0].n;

describe("recording a waxing stage", () => {
  it("writes the wax use the calibration reads, the stamps' impressions and the stock, in one go", async () => {
    const run = await startRun("waxing");
    const stage = run.stages.find((s) => s.kind === "wax")!;
    const stampBefore = (await reloadStamp(MAIN))!.impressionsCount;
    const stockBefore = await stockOf();
    const res = await api("POST", `/api/v1/runs/${run.id}/stages/${stage.id}/progress`, { session: sessions.waxmaster, body: { doneOn: today, metres: 20, potBeforeG: 6000, potAfterG: 3800, potAddedG: 500 } });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const after = res.body.run;
    expect(after.state).toBe("underway");
    // 6000 + 500 − 3800 = 2700 g used, by hand.
    expect(after.totals.wax.kgUsed).toBeCloseTo(2.7, 9);
    const progress = after.stages.find((s: Stage) => s.id === stage.id).progress[0];
    expect(progress.waxUsedG).toBe(2700);
    expect(progress.impressions).toBe(500);

    // The wax room's record: the same wax use, naming its stage, with the stamp's impressions.
    const use = await api("GET", `/api/v1/wax/uses/${progress.waxUseId}`, { session: sessions.keeper });
    expect(use.status).toBe(200);
    expect(use.body.use).toMatchObject({ runStageId: stage.id, grams: 2700, metres: 20, planId, impressions: [{ stampCode: MAIN, impressions: 500 }] });
    const calibration = await api("GET", "/api/v1/wax/calibration", { session: sessions.keeper });
    expect(JSON.stringify(calibration.body)).toContain(progress.waxUseId);
    expect((await reloadStamp(MAIN))!.impressionsCount).toBe(stampBefore + 500);
    const stockAfter = await stockOf();
    expect(stockAfter.kg).toBeCloseTo(stockBefore.kg - 2.7, 6);
  });

  it("a failure at the last step leaves the wax use, the impressions and the stock as they were", async () => {
    const run = await startRun("failure");
    const stage = run.stages.find((s) => s.kind === "wax")!;
    const stampBefore = (await reloadStamp(MAIN))!.impressionsCount;
    const stockBefore = await stockOf();
    // A trigger refuses the progress row — the last write of the transaction — for this one note only.
    await db().execute(sql`CREATE OR REPLACE FUNCTION capgrid_test_refuse_progress() RETURNS trigger AS $$ BEGIN IF NEW.note = 'refuse this one' THEN RAISE EXCEPTION 'refused for the test'; END IF; RETURN NEW; END $$ LANGUAGE plpgsql`);
    await db().execute(sql`CREATE TRIGGER capgrid_test_refuse_progress BEFORE INSERT ON run_progress FOR EACH ROW EXECUTE FUNCTION capgrid_test_refuse_progress()`);
    try {
      const res = await api("POST", `/api/v1/runs/${run.id}/stages/${stage.id}/progress`, { session: sessions.waxmaster, body: { doneOn: today, metres: 20, gramsUsed: 2500, note: "refuse this one" } });
      expect(res.status).toBe(500);
    } finally {
      await db().execute(sql`DROP TRIGGER IF EXISTS capgrid_test_refuse_progress ON run_progress`);
      await db().execute(sql`DROP FUNCTION IF EXISTS capgrid_test_refuse_progress()`);
    }
    expect(await usesOfStage(stage.id)).toBe(0);
    expect((await reloadStamp(MAIN))!.impressionsCount).toBe(stampBefore);
    const stockAfter = await stockOf();
    expect(stockAfter.kg).toBeCloseTo(stockBefore.kg, 9);
    expect((await api("GET", `/api/v1/runs/${run.id}`, { session: sessions.planner })).body.run.state).toBe("setup");
  });

  it("refuses a waxing without its wax, and wax on a dye stage, beside the fields", async () => {
    const run = await startRun("refusals");
    const wax = run.stages.find((s) => s.kind === "wax")!;
    const dye = run.stages.find((s) => s.kind === "dye")!;
    const noWax = await api("POST", `/api/v1/runs/${run.id}/stages/${wax.id}/progress`, { session: sessions.waxmaster, body: { doneOn: today, metres: 5 } });
    expect(noWax.status).toBe(422);
    expect(noWax.body.error.fields.gramsUsed).toBeDefined();
    const gained = await api("POST", `/api/v1/runs/${run.id}/stages/${wax.id}/progress`, { session: sessions.waxmaster, body: { doneOn: today, metres: 5, potBeforeG: 100, potAfterG: 300 } });
    expect(gained.status).toBe(400);
    expect(gained.body.error.fields.potAfterG).toBeDefined();
    const onDye = await api("POST", `/api/v1/runs/${run.id}/stages/${dye.id}/progress`, { session: sessions.planner, body: { doneOn: today, metres: 5, gramsUsed: 100 } });
    expect(onDye.status).toBe(422);
    expect(onDye.body.error.fields.gramsUsed).toEqual(["Only a waxing stage takes this."]);
    expect(await usesOfStage(wax.id)).toBe(0);
  });

  it("warns of a pot above the recipe's range and above 100 °C", async () => {
    const run = await startRun("readings");
    const wax = run.stages.find((s) => s.kind === "wax")!;
    const maxC = wax.recipe!.workingMaxC;
    const ok = await api("POST", `/api/v1/runs/${run.id}/stages/${wax.id}/readings`, { session: sessions.waxmaster, body: { tempC: maxC - 1 } });
    expect(ok.status, JSON.stringify(ok.body)).toBe(201);
    expect(ok.body.reading.warnings).toEqual([]);
    const hot = await api("POST", `/api/v1/runs/${run.id}/stages/${wax.id}/readings`, { session: sessions.waxmaster, body: { tempC: Math.max(maxC + 5, 105) } });
    expect(hot.body.reading.warnings).toEqual(["aboveRange", "fumes"]);
    const dye = run.stages.find((s) => s.kind === "dye")!;
    expect((await api("POST", `/api/v1/runs/${run.id}/stages/${dye.id}/readings`, { session: sessions.waxmaster, body: { tempC: 60 } })).status).toBe(422);
  });

  it("the boil-off returns the recovered wax to stock and becomes the estimator's default recovery", async () => {
    const run = await startRun("boil-off");
    const wax = run.stages.find((s) => s.kind === "wax")!;
    const boil = run.stages.find((s) => s.kind === "boil_off")!;
    const early = await api("POST", `/api/v1/runs/${run.id}/stages/${boil.id}/progress`, { session: sessions.waxmaster, body: { doneOn: today, recoveredG: 100 } });
    expect(early.status).toBe(422);
    expect(early.body.error.fields.recoveredG).toBeDefined();
    expect((await api("POST", `/api/v1/runs/${run.id}/stages/${wax.id}/progress`, { session: sessions.waxmaster, body: { doneOn: today, metres: 20, gramsUsed: 2000, finished: true } })).status).toBe(201);
    const stockBefore = await stockOf();
    const res = await api("POST", `/api/v1/runs/${run.id}/stages/${boil.id}/progress`, { session: sessions.waxmaster, body: { doneOn: today, metres: 20, recoveredG: 1500 } });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.run.totals.wax.kgRecovered).toBeCloseTo(1.5, 9);
    expect((await stockOf()).kg).toBeCloseTo(stockBefore.kg + 1.5, 6);
    const recovery = await db().select({ n: count() }).from(waxStockMovements).where(and(eq(waxStockMovements.kind, "recovery"), eq(waxStockMovements.note, `${prefix} boil-off`)));
    expect(recovery[0].n).toBeGreaterThan(0);
    const defaults = (await api("GET", "/api/v1/wax/defaults", { session: sessions.keeper })).body.defaults;
    expect(defaults.measuredRecoveryPct).toBeGreaterThan(0);
    expect(defaults.measuredRecoveryPct).toBeLessThanOrEqual(100);
    // An estimate that names no recovery takes the measured one: kgRecovered = kgGross × measured % / 100.
    const est = await api("POST", "/api/v1/wax/estimate", { session: sessions.keeper, body: { waxedAreaPerMetreM2: 0.5, metres: 10, rateGPerM2: 100, lossPct: 0, recipeId: recipe.id } });
    expect(est.status, JSON.stringify(est.body)).toBe(200);
    expect(est.body.inputs.recoveryPct).toBeCloseTo(defaults.measuredRecoveryPct, 9);
    expect(est.body.kgRecovered).toBeCloseTo((est.body.kgGross * defaults.measuredRecoveryPct) / 100, 9);
  });
});

describe("findings", () => {
  it("three of one kind from one stamp within 30 days flag it", async () => {
    const run = await startRun("findings");
    for (let i = 0; i < 3; i++) {
      const res = await api("POST", `/api/v1/runs/${run.id}/findings`, { session: sessions.keeper, body: { foundOn: today, kind: "pooled", stampCode: FILL, location: `piece ${i + 1}`, repair: "lifted" } });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      expect(res.body.flagged).toBe(i === 2);
    }
    const flagged = await api("GET", "/api/v1/runs/flagged-stamps", { session: sessions.designer });
    expect(flagged.body.stamps.some((f: { stamp: { code: string }; kind: string }) => f.stamp.code === FILL && f.kind === "pooled")).toBe(true);
    const unknown = await api("POST", `/api/v1/runs/${run.id}/findings`, { session: sessions.keeper, body: { foundOn: today, kind: "pooled", stampCode: `${prefix}-NOPE` } });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.fields.stampCode).toEqual([`There is no stamp with the code ${prefix}-NOPE.`]);
    // A run with findings is not deleted.
    const del = await api("DELETE", `/api/v1/runs/${run.id}`, { session: sessions.planner });
    expect(del.status).toBe(409);
    expect(del.body.error.code).toBe("runHasRecords");
  });
});

describe("every role", () => {
  it("reads runs; only planners and admins start, edit and delete them", async () => {
    const run = await startRun("read");
    for (const role of roles) {
      expect((await api("GET", `/api/v1/runs/${run.id}`, { session: sessions[role] })).status).toBe(200);
      expect((await api("GET", "/api/v1/runs", { session: sessions[role] })).status).toBe(200);
      const before = await runCount();
      const res = await api("POST", "/api/v1/runs", { session: sessions[role], body: runBody(`by ${role}`) });
      expect(res.status, role).toBe(can(role, "runs:write") ? 201 : 403);
      expect(await runCount()).toBe(before + (can(role, "runs:write") ? 1 : 0));
      if (res.status === 201) {
        expect((await api("DELETE", `/api/v1/runs/${res.body.run.id}?version=${res.body.run.version}`, { session: sessions[role] })).status).toBe(204);
      } else {
        expect((await api("PATCH", `/api/v1/runs/${run.id}`, { session: sessions[role], body: { version: run.version, name: "taken over" } })).status).toBe(403);
        expect((await api("DELETE", `/api/v1/runs/${run.id}`, { session: sessions[role] })).status).toBe(403);
      }
    }
    expect((await api("GET", `/api/v1/runs/${run.id}`, { session: sessions.admin })).body.run.name).toBe(`${prefix} read`);
  });

  it("wax masters and admins record waxing and readings; planners and admins dye progress; keepers, planners, wax masters and admins findings", async () => {
    const run = await startRun("roles");
    const wax = run.stages.find((s) => s.kind === "wax")!;
    const dye = run.stages.find((s) => s.kind === "dye")!;
    for (const role of roles) {
      const before = await usesOfStage(wax.id);
      const w = await api("POST", `/api/v1/runs/${run.id}/stages/${wax.id}/progress`, { session: sessions[role], body: { doneOn: today, metres: 1, gramsUsed: 100 } });
      expect(w.status, `${role} waxing`).toBe(can(role, "runs:recordWaxing") ? 201 : 403);
      expect(await usesOfStage(wax.id)).toBe(before + (w.status === 201 ? 1 : 0));
      const r = await api("POST", `/api/v1/runs/${run.id}/stages/${wax.id}/readings`, { session: sessions[role], body: { tempC: 70 } });
      expect(r.status, `${role} reading`).toBe(can(role, "runs:recordWaxing") ? 201 : 403);
      const d = await api("POST", `/api/v1/runs/${run.id}/stages/${dye.id}/progress`, { session: sessions[role], body: { doneOn: today, metres: 1 } });
      expect(d.status, `${role} dye`).toBe(can(role, "runs:write") ? 201 : 403);
      const f = await api("POST", `/api/v1/runs/${run.id}/findings`, { session: sessions[role], body: { foundOn: today, kind: "smudged" } });
      expect(f.status, `${role} finding`).toBe(can(role, "runs:recordFindings") ? 201 : 403);
    }
    const after = (await api("GET", `/api/v1/runs/${run.id}`, { session: sessions.admin })).body.run;
    expect(after.findings).toHaveLength(roles.filter((r) => can(r, "runs:recordFindings")).length);
  });
});

describe("what a run points at", () => {
  it("keeps a plan that runs stamp: deleting it is refused naming them", async () => {
    const made = await api("POST", "/api/v1/plans", {
      session: sessions.planner,
      body: { name: `${prefix} second plan`, layout: { cloth: { widthMm: 1150, lengthMm: 10_000, margins: { leftMm: 25, rightMm: 25 } }, stamp: { code: FILL }, gap: { xMm: 0, yMm: 0 }, arrangement: "straight" } },
    });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    const plan = made.body.plan;
    await startRun("keeps its plan", { planIds: [plan.id] });
    const del = await api("DELETE", `/api/v1/plans/${plan.id}?version=${plan.version}`, { session: sessions.planner });
    expect(del.status).toBe(409);
    expect(del.body.error.code).toBe("planInRuns");
    expect(del.body.error.message).toContain(`${prefix} keeps its plan`);
    expect((await api("GET", `/api/v1/plans/${plan.id}`, { session: sessions.planner })).status).toBe(200);
  });
});

describe("a stamp a run needs", () => {
  it("is not deleted: refused naming the run; a stage that waits for its plan says so", async () => {
    const code = `${prefix}-X`;
    await createStampRow({ code, name: `Extra ${prefix}` });
    const run = await startRun("needs a stamp", {
      planIds: [],
      stages: [
        { kind: "dye", dyeMethod: "brush", colourName: "Red", swatch: "#aa2200" },
        { kind: "wax", waxMethod: "stamp", stamps: [{ code, face: "front" }] },
        { kind: "boil_off" },
      ],
    });
    expect(run.stages.map((s) => s.kind)).toEqual(["dye", "wax", "boil_off"]);
    expect(run.stages[1].estimate.kg).toBe(0);
    const summary = (await api("GET", `/api/v1/runs?q=${encodeURIComponent(`${prefix} needs a stamp`)}`, { session: sessions.planner })).body.runs[0];
    expect(summary.waitingForPlan).toBe(true);
    const stamp = (await api("GET", `/api/v1/stamps/${code}`, { session: sessions.keeper })).body.stamp;
    const del = await api("DELETE", `/api/v1/stamps/${code}?version=${stamp.version}`, { session: sessions.keeper });
    expect(del.status).toBe(409);
    expect(del.body.error.code).toBe("stampInRuns");
    expect(del.body.error.message).toContain(`${prefix} needs a stamp`);
    const unknown = await api("POST", "/api/v1/runs", { session: sessions.planner, body: runBody("unknown stamp", { stages: [{ kind: "wax", waxMethod: "stamp", stamps: [{ code: `${prefix}-NONE` }] }] }) });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.fields["stages.0.stamps.0.code"]).toEqual([`There is no stamp with the code ${prefix}-NONE.`]);
  });
});

describe("the purchase list", () => {
  it("counts an open run's waxing stages instead of its plan's planned estimate", async () => {
    const est = await api("POST", "/api/v1/wax/estimates", { session: sessions.waxmaster, body: { name: `${prefix} planned`, planId, recipeId: recipe.id, rateGPerM2: 90, planned: true } });
    expect(est.status, JSON.stringify(est.body)).toBe(201);
    const list = await api("GET", "/api/v1/wax/purchase-list", { session: sessions.keeper });
    expect(list.status).toBe(200);
    // The plan is stamped by this file's open runs, so its planned estimate gives way to their stages.
    expect(list.body.estimates.some((e: { id: string }) => e.id === est.body.estimate.id)).toBe(false);
    expect(list.body.runStages.some((s: { runName: string }) => s.runName.startsWith(prefix))).toBe(true);
  });
});
