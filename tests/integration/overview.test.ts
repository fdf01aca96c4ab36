import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { runFindings, runs, type User } from "@/db/schema";
import { toActor } from "@/lib/authz";
import { OVERVIEW_ITEMS, overviewSections, type OverviewDto, type OverviewSection } from "@/lib/contracts/overview";
import { overviewFor, overviewSectionsFor } from "@/lib/data/overview";
import { can, roles, type Role } from "@/lib/permissions";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn, type Session } from "../helpers/http";
import { createStampRow, uniquePrefix } from "../helpers/stamps";
import { seedDemoRuns } from "../helpers/seed";

// The overview per role against the real database with the demo data (scripts/seed): each role gets only the
// sections of its work (keepers: the shelf, with the stamp the demo findings flag; planners: runs waiting for a
// plan and stale plans; wax masters: runs at a waxing stage, the week's wax against stock, hot pot readings;
// designers: colourways in work and new-stamp requests), and each section says what is waiting there now.

const prefix = uniquePrefix("OV");
const users = {} as Record<Role, User & { password: string }>;
const sessions = {} as Record<Role, Session>;
const MAIN = `${prefix}-M`;
const MARKET_RUN = "Market cream and soga, 30 m";
let motifId: string;
let colourwayId: string;
let planId: string;
let recipeId: string;

const keeperSections: OverviewSection[] = ["stampRequests", "newStampRequests", "overdueCheckouts", "repairQueue", "flaggedStamps"];
const plannerSections: OverviewSection[] = ["runsWaitingForPlan", "stalePlans"];
const waxSections: OverviewSection[] = ["waxNeed", "waxingRuns", "potWarnings"];
// Every line of each section (the page shows the first OVERVIEW_ITEMS), so other tests' records cannot push ours out.
const overviewOf = (role: Role): Promise<OverviewDto> => overviewFor(toActor(users[role]), { items: 10_000 });
const present = (o: OverviewDto) => (Object.keys(o) as OverviewSection[]).filter((k) => o[k] !== undefined).sort();

async function startRun(name: string, extra: Record<string, unknown> = {}) {
  const res = await api("POST", "/api/v1/runs", {
    session: sessions.planner,
    body: { name: `${prefix} ${name}`, motifId, colourwayId, cloth: "mori primissima 115 cm", metres: 20, planIds: [planId], recipeId, ...extra },
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.run as { id: string; version: number; stages: { id: string; kind: string; position: number; plan: { id: string } | null }[] };
}

beforeAll(async () => {
  testEnv();
  await seedDemoRuns();
  for (const role of roles) {
    users[role] = await createUser(role);
    sessions[role] = (await signIn(users[role].email, users[role].password))!;
  }
  await createStampRow({ code: MAIN, name: `Main ${prefix}`, widthMm: 200, heightMm: 200 });
  const motif = await api("POST", "/api/v1/motifs", {
    session: sessions.designer,
    body: {
      name: `${prefix} Terrace`,
      stamps: [{ code: MAIN, role: "main" }],
      colourways: [{ name: `${prefix} cream and indigo`, colours: [{ name: "Cream", swatch: "#f4efe6", waxStamps: [MAIN], face: "front" }, { name: "Indigo", swatch: "#1f3a5f" }] }],
    },
  });
  expect(motif.status, JSON.stringify(motif.body)).toBe(201);
  motifId = motif.body.motif.id;
  colourwayId = motif.body.motif.colourways[0].id;
  const plan = await api("POST", "/api/v1/plans", {
    session: sessions.planner,
    body: { name: `${prefix} plan`, motifId, layout: { cloth: { widthMm: 1150, lengthMm: 20_000, margins: { leftMm: 25, rightMm: 25 } }, stamp: { code: MAIN }, gap: { xMm: 0, yMm: 0 }, arrangement: "straight" } },
  });
  expect(plan.status, JSON.stringify(plan.body)).toBe(201);
  planId = plan.body.plan.id;
  const recipes = (await api("GET", "/api/v1/wax/recipes", { session: sessions.waxmaster })).body.recipes as { id: string; archivedAt?: string | null }[];
  recipeId = recipes.find((r) => !r.archivedAt)!.id;
});

describe("the overview's sections", () => {
  it("follow the permission of each section's work: keepers the shelf, planners the plans, wax masters the wax, admins all", async () => {
    for (const role of roles) {
      const expected = (Object.keys(overviewSections) as OverviewSection[]).filter((s) => overviewSections[s].some((p) => can(role, p))).sort();
      expect(overviewSectionsFor({ role }).sort(), role).toEqual(expected);
      expect(present(await overviewOf(role)), role).toEqual(expected);
    }
    // Written out by hand, so a slip in the table shows here.
    expect(overviewSectionsFor({ role: "keeper" }).sort()).toEqual([...keeperSections, "colourwaysInWork"].sort());
    expect(overviewSectionsFor({ role: "planner" }).sort()).toEqual([...plannerSections].sort());
    expect(overviewSectionsFor({ role: "waxmaster" }).sort()).toEqual([...waxSections].sort());
    expect(overviewSectionsFor({ role: "designer" }).sort()).toEqual(["colourwaysInWork", "newStampRequests"]);
    expect(overviewSectionsFor({ role: "admin" }).length).toBe(Object.keys(overviewSections).length);
  });
});

describe("a keeper's overview", () => {
  it("shows the stamp the demo run's findings flag, and no planner's or wax master's section", async () => {
    const [run] = await db().select({ id: runs.id }).from(runs).where(eq(runs.name, MARKET_RUN));
    const [finding] = await db().select({ code: runFindings.stampCode }).from(runFindings).where(and(eq(runFindings.runId, run.id), eq(runFindings.kind, "pooled"))).limit(1);
    expect(finding?.code).toBeTruthy();
    const keeper = await overviewOf("keeper");
    const flagged = keeper.flaggedStamps!.items.find((f) => f.code === finding.code);
    expect(flagged).toMatchObject({ code: finding.code, kind: "pooled" });
    expect(flagged!.findings).toBeGreaterThanOrEqual(3);
    expect(keeper.flaggedStamps!.total).toBeGreaterThanOrEqual(1);
    for (const s of [...plannerSections, ...waxSections]) expect(keeper[s], s).toBeUndefined();
    // The demo shelf has an overdue check-out and stamps waiting for repair.
    expect(keeper.overdueCheckouts!.total).toBeGreaterThanOrEqual(1);
    expect(keeper.repairQueue!.items.every((s) => s.condition === "needs_repair" || s.condition === "in_repair")).toBe(true);
  });

  it("lists a stamp request to fulfil and a new stamp asked for, and drops them once answered", async () => {
    const from = new Date(Date.now() + 20 * 86_400_000).toISOString().slice(0, 10);
    const until = new Date(Date.now() + 22 * 86_400_000).toISOString().slice(0, 10);
    const asked = await api("POST", "/api/v1/stamp-requests", { session: sessions.planner, body: { planId, stampCodes: [MAIN], forWhom: `${prefix} stamper`, workstation: "Table 3", fromOn: from, untilOn: until } });
    expect(asked.status, JSON.stringify(asked.body)).toBe(201);
    const newStamp = await api("POST", "/api/v1/new-stamp-requests", { session: sessions.designer, body: { widthMm: 120, heightMm: 90, motifId, role: "filler", note: `${prefix} a filler` } });
    expect(newStamp.status, JSON.stringify(newStamp.body)).toBe(201);
    const keeper = await overviewOf("keeper");
    expect(keeper.stampRequests!.items.map((r) => r.id)).toContain(asked.body.request.id);
    const mine = keeper.stampRequests!.items.find((r) => r.id === asked.body.request.id)!;
    expect(mine).toMatchObject({ state: "open", forWhom: `${prefix} stamper`, stampCodes: [MAIN] });
    const request = await overviewOf("designer");
    expect(request.newStampRequests!.items.find((n) => n.id === newStamp.body.request.id)).toMatchObject({ widthMm: 120, heightMm: 90, motif: { id: motifId } });

    const declined = await api("POST", `/api/v1/stamp-requests/${asked.body.request.id}/decline`, { session: sessions.keeper, body: { version: asked.body.request.version, reason: "Not this week." } });
    expect(declined.status, JSON.stringify(declined.body)).toBe(200);
    const after = await overviewOf("keeper");
    expect(after.stampRequests!.items.map((r) => r.id)).not.toContain(asked.body.request.id);
  });
});

describe("a planner's overview", () => {
  it("shows a run whose waxing has no plan, and a plan whose stamp changed since it was computed", async () => {
    const waiting = await startRun("no plan yet", { planIds: [] });
    expect(waiting.stages.some((s) => s.kind === "wax" && s.plan === null)).toBe(true);
    const before = await overviewOf("planner");
    expect(before.runsWaitingForPlan!.items.map((r) => r.id)).toContain(waiting.id);
    expect(before.stalePlans!.items.map((p) => p.id)).not.toContain(planId);
    expect(before.flaggedStamps).toBeUndefined();
    expect(before.stampRequests).toBeUndefined();

    const stamp = await api("GET", `/api/v1/stamps/${MAIN}`, { session: sessions.keeper });
    const changed = await api("PATCH", `/api/v1/stamps/${MAIN}`, { session: sessions.keeper, body: { version: stamp.body.stamp.version, widthMm: 210 } });
    expect(changed.status, JSON.stringify(changed.body)).toBe(200);
    const after = await overviewOf("planner");
    expect(after.stalePlans!.items.find((p) => p.id === planId)).toMatchObject({ name: `${prefix} plan`, codes: [MAIN] });
    // Computing again takes it off.
    const plan = await api("GET", `/api/v1/plans/${planId}`, { session: sessions.planner });
    expect((await api("POST", `/api/v1/plans/${planId}/recompute`, { session: sessions.planner, body: { version: plan.body.plan.version } })).status).toBe(200);
    expect((await overviewOf("planner")).stalePlans!.items.map((p) => p.id)).not.toContain(planId);
  });
});

describe("a wax master's overview", () => {
  it("shows a run at its waxing stage, that waxing's wax against stock, and a pot reading above 100 °C", async () => {
    const run = await startRun("at the wax");
    const [dye, wax] = run.stages;
    expect([dye.kind, wax.kind]).toEqual(["dye", "wax"]);
    const today = new Date().toISOString().slice(0, 10);
    const dyed = await api("POST", `/api/v1/runs/${run.id}/stages/${dye.id}/progress`, { session: sessions.planner, body: { doneOn: today, metres: 20, finished: true } });
    expect(dyed.status, JSON.stringify(dyed.body)).toBe(201);
    const stageKg = (dyed.body.run.stages as { id: string; estimate: { kg: number } }[]).find((s) => s.id === wax.id)!.estimate.kg;
    expect(stageKg).toBeGreaterThan(0);

    const before = await overviewOf("waxmaster");
    expect(before.waxingRuns!.items.find((r) => r.id === run.id)?.stage).toMatchObject({ position: 1, kind: "wax", colourName: "Cream" });
    // The waxing the run is at counts in the week's need, whatever its dates: at least its own estimate.
    expect(before.waxNeed!.totalKg).toBeGreaterThanOrEqual(stageKg - 1e-9);
    for (const line of before.waxNeed!.lines) expect(line.shortKg).toBeCloseTo(Math.max(0, line.neededKg - line.onHandKg), 9);
    expect(before.flaggedStamps).toBeUndefined();
    expect(before.runsWaitingForPlan).toBeUndefined();

    const hot = await api("POST", `/api/v1/runs/${run.id}/stages/${wax.id}/readings`, { session: sessions.waxmaster, body: { tempC: 106 } });
    expect(hot.status, JSON.stringify(hot.body)).toBe(201);
    const after = await overviewOf("waxmaster");
    const warning = after.potWarnings!.items.find((w) => w.runId === run.id)!;
    expect(warning).toMatchObject({ tempC: 106, stagePosition: 1, stageKind: "wax" });
    expect(warning.warnings).toContain("fumes");
    // A keeper does not get the wax master's sections.
    const keeper = await overviewOf("keeper");
    expect(keeper.potWarnings).toBeUndefined();
    expect(keeper.waxNeed).toBeUndefined();
  });
});

describe("a designer's overview", () => {
  it("shows the demo colourway in work with its open runs, not the finished or stopped ones", async () => {
    const designer = await overviewOf("designer");
    const open = await db().select({ id: runs.id, name: runs.name, state: runs.state, colourwayId: runs.colourwayId }).from(runs).where(eq(runs.name, MARKET_RUN));
    const way = designer.colourwaysInWork!.items.find((c) => c.colourway.id === open[0].colourwayId);
    expect(way).toBeDefined();
    expect(way!.runs.map((r) => r.name)).toContain(MARKET_RUN);
    expect(way!.runs.map((r) => r.name)).toContain("Harbour blues, two kodi of long cloths");
    expect(way!.runs.every((r) => r.state === "setup" || r.state === "underway")).toBe(true);
    expect(way!.runs.map((r) => r.name)).not.toContain("Dry season sarongs, 20 m");
    expect(way!.runs.map((r) => r.name)).not.toContain("Trial on export cotton, 12 m");
    expect(designer.colourwaysInWork!.total).toBe(designer.colourwaysInWork!.items.length);
    for (const s of [...plannerSections, ...waxSections, "flaggedStamps", "stampRequests", "overdueCheckouts", "repairQueue"] as OverviewSection[]) expect(designer[s], s).toBeUndefined();
  });

  it("shows the page's first lines only, and says how many there are in all", async () => {
    const all = await overviewOf("admin");
    const page = await overviewFor(toActor(users.admin));
    for (const s of Object.keys(overviewSections) as OverviewSection[]) {
      const list = page[s];
      if (!list || !("items" in list)) continue;
      const full = all[s] as { items: unknown[]; total: number };
      expect(list.total, s).toBe(full.total);
      expect(list.items, s).toEqual(full.items.slice(0, OVERVIEW_ITEMS));
    }
  });
});
