import { and, eq } from "drizzle-orm";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { runFindings, runs } from "@/db/schema";
import { launchBrowser, signInThroughPage } from "../helpers/browser";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn, type Session } from "../helpers/http";
import { createStampRow, uniquePrefix } from "../helpers/stamps";
import { seedDemoRuns } from "../helpers/seed";

// The overview in the browser, per role, on the demo data: a keeper sees the stamp the demo run's findings flag
// and follows its line to the stamp's record (issue 15's done-when); a wax master sees a run at its waxing stage
// and the week's wax against stock; a designer sees the colourways in work. The permissions are folded away.

let browser: Browser;
const prefix = uniquePrefix("E2O");
const MAIN = `${prefix}-M`;
const MARKET_RUN = "Market cream and soga, 30 m";
let flaggedCode: string;
let waxingRun: { id: string; name: string };
let ourColourway: string;

beforeAll(async () => {
  browser = await launchBrowser();
  await seedDemoRuns();
  const [market] = await db().select({ id: runs.id }).from(runs).where(eq(runs.name, MARKET_RUN));
  const [finding] = await db().select({ code: runFindings.stampCode }).from(runFindings).where(and(eq(runFindings.runId, market.id), eq(runFindings.kind, "pooled"))).limit(1);
  flaggedCode = finding.code!;

  // A run of our own, dyed and now at its first waxing.
  const sessionOf = async (role: "planner" | "designer" | "waxmaster"): Promise<Session> => {
    const u = await createUser(role);
    return (await signIn(u.email, u.password))!;
  };
  const [planner, designer, waxmaster] = [await sessionOf("planner"), await sessionOf("designer"), await sessionOf("waxmaster")];
  await createStampRow({ code: MAIN, name: `Main ${prefix}`, widthMm: 200, heightMm: 200 });
  ourColourway = `${prefix} cream and indigo`;
  const motif = await api("POST", "/api/v1/motifs", {
    session: designer,
    body: { name: `${prefix} Terrace`, stamps: [{ code: MAIN, role: "main" }], colourways: [{ name: ourColourway, colours: [{ name: "Cream", swatch: "#f4efe6", waxStamps: [MAIN], face: "front" }, { name: "Indigo", swatch: "#1f3a5f" }] }] },
  });
  expect(motif.status, JSON.stringify(motif.body)).toBe(201);
  const plan = await api("POST", "/api/v1/plans", {
    session: planner,
    body: { name: `${prefix} plan`, motifId: motif.body.motif.id, layout: { cloth: { widthMm: 1150, lengthMm: 20_000, margins: { leftMm: 25, rightMm: 25 } }, stamp: { code: MAIN }, gap: { xMm: 0, yMm: 0 }, arrangement: "straight" } },
  });
  expect(plan.status, JSON.stringify(plan.body)).toBe(201);
  const recipes = (await api("GET", "/api/v1/wax/recipes", { session: waxmaster })).body.recipes as { id: string; archivedAt?: string | null }[];
  const run = await api("POST", "/api/v1/runs", {
    session: planner,
    body: { name: `${prefix} at the wax`, motifId: motif.body.motif.id, colourwayId: motif.body.motif.colourways[0].id, cloth: "mori primissima 115 cm", metres: 20, planIds: [plan.body.plan.id], recipeId: recipes.find((r) => !r.archivedAt)!.id },
  });
  expect(run.status, JSON.stringify(run.body)).toBe(201);
  waxingRun = { id: run.body.run.id, name: run.body.run.name };
  const dye = run.body.run.stages[0];
  const dyed = await api("POST", `/api/v1/runs/${waxingRun.id}/stages/${dye.id}/progress`, { session: planner, body: { doneOn: new Date().toISOString().slice(0, 10), metres: 20, finished: true } });
  expect(dyed.status, JSON.stringify(dyed.body)).toBe(201);
});

afterAll(async () => {
  await browser?.close();
});

async function signedIn(role: "keeper" | "waxmaster" | "designer") {
  const user = await createUser(role);
  const page = await browser.newPage();
  await signInThroughPage(page, user.email, user.password);
  await page.goto(`${testEnv().appUrl}/`);
  return page;
}

describe("the overview", () => {
  it("shows a keeper the stamp flagged by the demo findings, and its line opens the stamp's record", async () => {
    const page = await signedIn("keeper");
    const flagged = page.getByTestId("overview-flaggedStamps");
    await flagged.getByRole("heading", { name: "Stamps flagged by quality findings" }).waitFor();
    const line = flagged.getByTestId(`flagged-${flaggedCode}`);
    expect(await line.textContent()).toMatch(/Wax pooled: stamp left down too long: \d+ findings?, the last on/);
    expect(Number(await flagged.getAttribute("data-count"))).toBeGreaterThanOrEqual(1);
    // Not the planners' or the wax masters' work.
    expect(await page.getByTestId("overview-runsWaitingForPlan").count()).toBe(0);
    expect(await page.getByTestId("overview-waxNeed").count()).toBe(0);
    // The permissions are there, folded away.
    expect(await page.getByTestId("permissions").isVisible()).toBe(false);
    await page.getByTestId("role-permissions").locator("summary").click();
    expect(await page.getByTestId("permissions").textContent()).toContain("check stamps out");

    await line.getByRole("link").click();
    await page.waitForURL(new RegExp(`/stamps/${flaggedCode}$`));
    await page.getByRole("heading", { name: new RegExp(flaggedCode) }).waitFor();
    await page.context().close();
  });

  it("shows a wax master the run at its waxing stage and the week's wax against stock", async () => {
    const page = await signedIn("waxmaster");
    const waxing = page.getByTestId("overview-waxingRuns");
    await waxing.getByRole("heading", { name: "Runs at a waxing stage" }).waitFor();
    const line = waxing.getByTestId(`waxing-${waxingRun.id}`);
    expect(await line.getByRole("link").textContent()).toBe(waxingRun.name);
    expect(await line.getByRole("link").getAttribute("href")).toBe(`/runs/${waxingRun.id}`);
    expect(await line.textContent()).toContain("stage 2: Waxing, Cream");

    const need = page.getByTestId("overview-waxNeed");
    await need.getByRole("heading", { name: "This week's wax" }).waitFor();
    expect(await need.getByTestId("wax-need-summary").textContent()).toMatch(/waxing stages? · [\d.,]+ kg · (Stock lacks [\d.,]+ kg for this week\.|Stock covers this week's waxings\.)/);
    expect(await need.locator("tbody tr").count()).toBeGreaterThan(0);
    expect(await need.getByRole("link", { name: "Open the purchase list" }).getAttribute("href")).toBe("/wax/purchase");
    expect(await page.getByTestId("overview-flaggedStamps").count()).toBe(0);
    await page.context().close();
  });

  it("shows a designer the colourways in work with their runs", async () => {
    const page = await signedIn("designer");
    const ways = page.getByTestId("overview-colourwaysInWork");
    await ways.getByRole("heading", { name: "Colourways in work" }).waitFor();
    expect(await ways.textContent()).toContain(MARKET_RUN);
    expect(await ways.textContent()).toContain(ourColourway);
    expect(await ways.textContent()).not.toContain("Dry season sarongs, 20 m");
    expect(await page.getByTestId("overview-newStampRequests").count()).toBe(1);
    expect(await page.getByTestId("overview-waxingRuns").count()).toBe(0);
    await page.context().close();
  });
});
