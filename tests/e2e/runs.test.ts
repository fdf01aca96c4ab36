import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, signInThroughPage } from "../helpers/browser";
import { createUser } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { expectMessageBeside } from "../helpers/forms";
import { api, signIn, type Session } from "../helpers/http";
import { createStampRow, uniquePrefix } from "../helpers/stamps";

// Production runs in the browser: a planner starts a run from a motif's colourway, sees each stage's wax, stamper
// hours and stamps, sends the stamp requests in one click and prints the ticket; the run forms (new run, a stage,
// the run's own fields, the stamp request) with valid and invalid input.
let browser: Browser;
let planner: { email: string; password: string };
let plannerSession: Session;
const prefix = uniquePrefix("E2R");
const codes = { main: `${prefix}-MAIN`, border: `${prefix}-BORD` };
let motifId: string;
let colourwayId: string;
let recipeName: string;

beforeAll(async () => {
  browser = await launchBrowser();
  const [p, w, d] = await Promise.all([createUser("planner"), createUser("waxmaster"), createUser("designer")]);
  planner = p;
  plannerSession = (await signIn(p.email, p.password))!;
  const wax = (await signIn(w.email, w.password))!;
  const designer = (await signIn(d.email, d.password))!;
  await createStampRow({ code: codes.main, name: "Run main", widthMm: 200, heightMm: 200 });
  await createStampRow({ code: codes.border, name: "Run border", widthMm: 300, heightMm: 80 });
  const motif = await api("POST", "/api/v1/motifs", {
    session: designer,
    body: {
      name: `${prefix} Tide flowers`,
      stamps: [
        { code: codes.main, role: "main" },
        { code: codes.border, role: "border" },
      ],
      colourways: [
        {
          name: "Cream and indigo",
          colours: [
            { name: "Cream", swatch: "#f4efe6", waxStamps: [codes.main], face: "front" },
            { name: "Indigo", swatch: "#1f3a5f" },
          ],
        },
      ],
    },
  });
  expect(motif.status, JSON.stringify(motif.body)).toBe(201);
  motifId = motif.body.motif.id;
  colourwayId = motif.body.motif.colourways[0].id;
  const layout = { cloth: { widthMm: 1150, lengthMm: 12_000, margins: { leftMm: 25, rightMm: 25 } }, stamp: { code: codes.main }, gap: { xMm: 0, yMm: 0 }, arrangement: "straight" };
  const plan = await api("POST", "/api/v1/plans", { session: plannerSession, body: { name: `${prefix} Tide plan`, layout, motifId } });
  expect(plan.status, JSON.stringify(plan.body)).toBe(201);
  const material = await api("POST", "/api/v1/wax/materials", {
    session: wax,
    body: { name: `${prefix} wax`, densityGPerCm3: 0.9, meltingRangeC: { fromC: 50, toC: 60 }, flashPointC: 180, pricePerKg: 10_000, reorderLevelKg: 2, sources: { density: "test figure", melting: "test figure", flashPoint: "test figure" } },
  });
  expect(material.status, JSON.stringify(material.body)).toBe(201);
  recipeName = `${prefix} recipe`;
  const recipe = await api("POST", "/api/v1/wax/recipes", { session: wax, body: { name: recipeName, season: "dry", use: "stamping", components: [{ material: material.body.material.code, pct: 100 }], workingRangeC: { minC: 60, maxC: 72 } } });
  expect(recipe.status, JSON.stringify(recipe.body)).toBe(201);
});
afterAll(async () => {
  await browser?.close();
});

async function plannerPage(): Promise<Page> {
  const page = await browser.newPage();
  await signInThroughPage(page, planner.email, planner.password);
  return page;
}

async function startRun(page: Page, name: string) {
  const { appUrl } = testEnv();
  await page.goto(`${appUrl}/motifs/${motifId}`);
  await page.getByTestId("start-run").first().click();
  await page.waitForURL(/\/runs\/new\?/);
  const form = page.getByRole("form", { name: "Start a run" });
  await form.getByLabel("Name of the run").fill(name);
  await form.getByLabel("Metres of cloth").fill("12");
  await form.getByLabel("Wax recipe").selectOption({ label: recipeName });
  await form.getByRole("button", { name: "Start the run" }).click();
  await page.waitForURL(/\/runs\/[0-9a-f-]{36}\?saved=created/);
}

describe("a planner and production runs", () => {
  it("starts a run from a motif's colourway, sees wax, hours and stamps per stage, sends the stamp requests and prints the ticket", async () => {
    const page = await plannerPage();
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Production runs" }).click();
    await page.waitForURL(/\/runs$/);
    await startRun(page, `${prefix} First tide run`);
    await expect.poll(() => page.getByRole("status").first().textContent()).toMatch(/Run started/);
    expect(new URL(page.url()).searchParams.get("saved")).toBe("created");
    // Stages from the colourway: Cream dyed (ground), waxed over with the main stamp, Indigo dyed, boil-off.
    const stages = page.getByTestId("run-stage");
    expect(await stages.evaluateAll((els) => els.map((e) => e.getAttribute("data-kind")))).toEqual(["dye", "wax", "dye", "boil_off"]);
    const waxing = page.locator('[data-testid="run-stage"][data-kind="wax"]');
    // 12 m of 1150 mm mori, 200 mm stamp straight: 5 across, 5 rows a metre → 25 impressions a metre, 300 in all
    // (worked by hand, as in tests/integration/plans.test.ts).
    expect(await waxing.getByTestId("stage-need").textContent()).toMatch(/300/);
    expect(await waxing.getByTestId("stage-wax").textContent()).toMatch(/\d.*(kg|g)/);
    expect(await waxing.getByTestId("stage-hours").textContent()).toMatch(/\d.* h/);
    expect(await page.getByTestId("total-hours").textContent()).toMatch(/\d.* h/);
    const stamp = waxing.getByTestId("stage-stamp");
    expect(await stamp.textContent()).toContain(codes.main);
    expect(await stamp.getAttribute("data-free")).toBe("yes");
    expect(await stamp.textContent()).toMatch(/free on these days/);
    // A run with hot work shows the wax cautions to everyone who opens it (SPEC 5.3).
    expect(await page.locator('[data-testid="wax-safety"][data-variant="page"]').getByTestId("wax-safety-decides").textContent()).toMatch(/safety data sheet/);
    // The time line draws every stage on its days.
    expect(await page.getByTestId("timeline-stage").count()).toBe(4);

    await waxing.getByTestId("request-stage-stamps").click();
    await page.waitForURL(/saved=requested/);
    expect(await page.getByRole("status").first().textContent()).toMatch(/Stamp request sent to the keepers/);
    await expect.poll(() => waxing.getByTestId("stage-requests").textContent().catch(() => "")).toMatch(new RegExp(`Asked for ${codes.main}.*Waiting`));
    // Asked once: the button is gone, and the keepers' queue holds the request for the run's days.
    expect(await waxing.getByTestId("request-stage-stamps").count()).toBe(0);
    const requests = await api("GET", "/api/v1/stamp-requests?state=pending", { session: plannerSession });
    const mine = requests.body.requests.find((r: { forWhom: string }) => r.forWhom === `${prefix} First tide run`);
    expect(mine).toMatchObject({ workstation: "Waxing tables", stamps: [expect.objectContaining({ code: codes.main })] });

    await page.getByTestId("run-ticket-link").click();
    await page.waitForURL(/\/ticket$/);
    const ticket = page.getByTestId("run-ticket");
    expect(await ticket.getByTestId("ticket-stages").locator("tbody tr").count()).toBe(4);
    expect(await ticket.textContent()).toContain(codes.main);
    expect(await ticket.getByTestId("wax-safety-decides").textContent()).toMatch(/safety data sheet/);
    await page.close();
  });

  it("refuses a new run without its size, the message beside the metres", async () => {
    const { appUrl } = testEnv();
    const page = await plannerPage();
    await page.goto(`${appUrl}/runs/new?motif=${motifId}&colourway=${colourwayId}`);
    const form = page.getByRole("form", { name: "Start a run" });
    await form.getByLabel("Name of the run").fill(`${prefix} Sizeless`);
    await form.getByRole("button", { name: "Start the run" }).click();
    await expectMessageBeside(form.getByLabel("Metres of cloth"), /metres, or as pieces/);
    // What was typed stays.
    expect(await form.getByLabel("Name of the run").inputValue()).toBe(`${prefix} Sizeless`);
    await page.close();
  });

  it("edits a stage's days (valid and invalid) and refuses a stamp request without a workstation", async () => {
    const page = await plannerPage();
    await startRun(page, `${prefix} Stage edit run`);
    const waxing = page.locator('[data-testid="run-stage"][data-kind="wax"]');
    await waxing.getByText("Change this stage's plan, days or stamps").click();
    const stageForm = waxing.getByRole("form", { name: /^Stage 2$/ });
    await stageForm.getByLabel("First day").fill("2031-05-10");
    await stageForm.getByLabel("Last day").fill("2031-05-08");
    await stageForm.getByRole("button", { name: "Save the stage" }).click();
    await expectMessageBeside(stageForm.getByLabel("Last day"), /end comes before the start/);
    await stageForm.getByLabel("Last day").fill("2031-05-12");
    await stageForm.getByRole("button", { name: "Save the stage" }).click();
    await page.waitForURL(/saved=stage/);
    expect(await page.locator('[data-testid="run-stage"][data-kind="wax"]').textContent()).toMatch(/2031/);

    const request = page.locator('[data-testid="run-stage"][data-kind="wax"]').getByRole("form", { name: "Ask the keepers for these stamps" });
    await request.getByLabel("To which workstation").fill("");
    await request.getByRole("button", { name: /Ask the keepers for/ }).click();
    await expectMessageBeside(request.getByLabel("To which workstation"), /required|Enter/i);
    await page.close();
  });

  it("stops a run with a reason from its edit form, and refuses an empty name beside the field", async () => {
    const page = await plannerPage();
    await startRun(page, `${prefix} Stopped run`);
    await page.getByRole("link", { name: "Edit run" }).click();
    const form = page.getByRole("form", { name: "Edit run" });
    await form.getByLabel("Name of the run").fill("");
    await form.getByRole("button", { name: "Save the run" }).click();
    await expectMessageBeside(form.getByLabel("Name of the run"), /required|Enter/i);
    await form.getByLabel("Name of the run").fill(`${prefix} Stopped run`);
    await form.getByLabel("State").selectOption("halted");
    await form.getByLabel("Why (when stopped)").fill("Dye supplier late");
    await form.getByRole("button", { name: "Save the run" }).click();
    await page.waitForURL(/saved=saved/);
    expect(await page.locator("main").textContent()).toMatch(/This run is stopped: Dye supplier late/);
    await page.close();
  });
});
