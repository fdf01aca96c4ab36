import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { checkouts, stampRequests } from "@/db/schema";
import { can, roles, type Role } from "@/lib/permissions";
import { seedWax } from "@/scripts/seed/wax";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn, type Session } from "../helpers/http";
import { createStampRow, uniquePrefix } from "../helpers/stamps";

// A run's planned days and its stamps on those days: a new run's stages get days one after the other from its
// first day; each stage's stamps say whether they are free on its days (out past its first day, in repair, or
// asked for by someone else for days that meet its own); one request per waxing stage asks the keepers for them.

const prefix = uniquePrefix("RS");
const sessions = {} as Record<Role, Session>;
const MAIN = `${prefix}-M`;
const FILL = `${prefix}-F`;
let motifId: string;
let colourwayId: string;
let planId: string;
let recipeId: string;

interface Stage {
  id: string;
  kind: string;
  plannedStartOn: string | null;
  plannedEndOn: string | null;
  estimate: { hours: number };
  stamps: { code: string; freeOnDays: boolean; busy: { reason: string; who: string | null }[] }[];
  stampRequests: { state: string; codes: string[]; fromOn: string; untilOn: string }[];
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
      name: `${prefix} Reed`,
      stamps: [
        { code: MAIN, role: "main" },
        { code: FILL, role: "filler" },
      ],
      colourways: [{ name: "Cream and soga", colours: [{ name: "Cream", swatch: "#f4efe6", waxStamps: [MAIN, FILL], face: "front" }, { name: "Soga", swatch: "#6b4423" }] }],
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
  const recipes = (await api("GET", "/api/v1/wax/recipes", { session: sessions.waxmaster })).body.recipes as { id: string }[];
  recipeId = recipes[0].id;
});

async function startRun(name: string, startOn: string) {
  const res = await api("POST", "/api/v1/runs", {
    session: sessions.planner,
    body: { name: `${prefix} ${name}`, motifId, colourwayId, cloth: "mori 115 cm", metres: 30, planIds: [planId], recipeId, startOn },
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.run as { id: string; stages: Stage[] };
}
const waxingOf = (run: { stages: Stage[] }) => run.stages.find((s) => s.kind === "wax")!;
const getRun = async (id: string) => (await api("GET", `/api/v1/runs/${id}`, { session: sessions.planner })).body.run as { id: string; stages: Stage[] };

describe("a new run's planned days", () => {
  it("puts the stages one after the other from the first day: a dye bath two days, the waxing by its hours, the boil-off one", async () => {
    const run = await startRun("Days", "2031-03-02");
    const [dye, wax, soga, boil] = run.stages;
    expect(run.stages.map((s) => s.kind)).toEqual(["dye", "wax", "dye", "boil_off"]);
    expect(dye).toMatchObject({ plannedStartOn: "2031-03-02", plannedEndOn: "2031-03-03" });
    // 30 m, 200 mm stamp straight on 1150 mm mori: 25 impressions a metre (worked by hand in plans.test.ts) → 750;
    // the waxing takes ceil(hours / 7) days of seven stamper hours (common practice).
    const days = Math.max(1, Math.ceil(wax.estimate.hours / 7 - 1e-9));
    expect(wax.plannedStartOn).toBe("2031-03-04");
    const end = new Date(Date.UTC(2031, 2, 4 + days - 1)).toISOString().slice(0, 10);
    expect(wax.plannedEndOn).toBe(end);
    expect(soga.plannedStartOn! > wax.plannedEndOn!).toBe(true);
    expect(boil.plannedStartOn).toBe(boil.plannedEndOn);
  });
});

describe("stamps on a stage's days", () => {
  it("says a stamp out past the stage's first day, or asked for by someone else on those days, is not free", async () => {
    const run = await startRun("Busy", "2031-06-01");
    const waxing = waxingOf(run);
    expect(waxing.stamps.every((s) => s.freeOnDays)).toBe(true);
    // Someone else asks for FILL on days that meet the stage's; MAIN goes out until after the stage starts.
    const other = await api("POST", "/api/v1/stamp-requests", {
      session: sessions.designer,
      body: { stampCodes: [FILL], forWhom: "Another table", workstation: "Table 3", fromOn: waxing.plannedStartOn, untilOn: waxing.plannedStartOn },
    });
    expect(other.status, JSON.stringify(other.body)).toBe(201);
    const out = await api("POST", `/api/v1/stamps/${MAIN}/checkout`, { session: sessions.keeper, body: { borrowerName: "Test borrower", workstation: "Table 1", dueOn: "2031-06-10" } });
    expect(out.status, JSON.stringify(out.body)).toBe(201);
    const after = waxingOf(await getRun(run.id));
    const main = after.stamps.find((s) => s.code === MAIN)!;
    const fill = after.stamps.find((s) => s.code === FILL)!;
    expect(main).toMatchObject({ freeOnDays: false, busy: [expect.objectContaining({ reason: "out" })] });
    expect(fill).toMatchObject({ freeOnDays: false, busy: [expect.objectContaining({ reason: "requested", who: "Another table" })] });
    // Returned, MAIN is free again on the stage's days.
    await db().update(checkouts).set({ returnedAt: new Date() }).where(eq(checkouts.id, out.body.checkout.id));
    expect(waxingOf(await getRun(run.id)).stamps.find((s) => s.code === MAIN)!.freeOnDays).toBe(true);
  });
});

describe("POST /api/v1/runs/{id}/stages/{stageId}/stamp-request", () => {
  it("asks the keepers for the stage's stamps for its days, once; the stage lists the request and does not count it against itself", async () => {
    const run = await startRun("Request", "2031-09-01");
    const waxing = waxingOf(run);
    const url = `/api/v1/runs/${run.id}/stages/${waxing.id}/stamp-request`;
    const res = await api("POST", url, { session: sessions.planner, body: { workstation: "Waxing tables" } });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.request).toMatchObject({ forWhom: `${prefix} Request`, fromOn: waxing.plannedStartOn, untilOn: waxing.plannedEndOn, state: "open" });
    expect(res.body.request.stamps.map((s: { code: string }) => s.code).sort()).toEqual([FILL, MAIN].sort());
    const [row] = await db().select().from(stampRequests).where(eq(stampRequests.id, res.body.request.id));
    expect(row.runStageId).toBe(waxing.id);
    const after = waxingOf(await getRun(run.id));
    expect(after.stampRequests).toEqual([expect.objectContaining({ state: "open", codes: [FILL, MAIN].sort() })]);
    expect(after.stamps.every((s) => s.freeOnDays)).toBe(true);
    // Asked already: 409, nothing more stored.
    const again = await api("POST", url, { session: sessions.planner, body: { workstation: "Waxing tables" } });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("stageStampsRequested");
    expect((await db().select().from(stampRequests).where(eq(stampRequests.runStageId, waxing.id))).length).toBe(1);
  });

  it("refuses a stage that is not a waxing (422), a missing workstation (400) and an unknown stage (404)", async () => {
    const run = await startRun("Refusals", "2031-10-01");
    const dye = run.stages.find((s) => s.kind === "dye")!;
    const onDye = await api("POST", `/api/v1/runs/${run.id}/stages/${dye.id}/stamp-request`, { session: sessions.planner, body: { workstation: "Table" } });
    expect(onDye.status).toBe(422);
    const blank = await api("POST", `/api/v1/runs/${run.id}/stages/${waxingOf(run).id}/stamp-request`, { session: sessions.planner, body: { workstation: "" } });
    expect(blank.status).toBe(400);
    expect(blank.body.error.fields.workstation).toBeDefined();
    const missing = await api("POST", `/api/v1/runs/${run.id}/stages/00000000-0000-4000-8000-000000000000/stamp-request`, { session: sessions.planner, body: { workstation: "Table" } });
    expect(missing.status).toBe(404);
  });

  it.each(roles)("lets %s ask as the permission table says (stamps:request), storing nothing when refused", async (role) => {
    const run = await startRun(`Role ${role}`, "2031-11-01");
    const res = await api("POST", `/api/v1/runs/${run.id}/stages/${waxingOf(run).id}/stamp-request`, { session: sessions[role], body: { workstation: "Table" } });
    expect(res.status).toBe(can(role, "stamps:request") ? 201 : 403);
    const stored = await db().select().from(stampRequests).where(eq(stampRequests.runStageId, waxingOf(run).id));
    expect(stored.length).toBe(can(role, "stamps:request") ? 1 : 0);
  });

  it("answers 401 signed out", async () => {
    const run = await startRun("Signed out", "2031-12-01");
    const res = await api("POST", `/api/v1/runs/${run.id}/stages/${waxingOf(run).id}/stamp-request`, { body: { workstation: "Table" } });
    expect(res.status).toBe(401);
  });
});
