import { eq } from "drizzle-orm";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { waxMaterials, waxRecipes } from "@/db/schema";
import { seedWax } from "@/scripts/seed/wax";
import { launchBrowser, signInThroughPage } from "../helpers/browser";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn } from "../helpers/http";
import { uniquePrefix } from "../helpers/stamps";

// The wax master's main flow in the wax room, the safety cautions on every wax screen (SPEC 5.3), and what a
// role without wax:write sees. The forms one by one are in wax-forms.test.ts.

let browser: Browser;
let page: Page;
const prefix = uniquePrefix("WX");
const dryName = "Dry-season stamp wax";
const go = (path: string) => page.goto(`${testEnv().appUrl}${path}`);
const recipeId = async (name: string) => (await db().select({ id: waxRecipes.id }).from(waxRecipes).where(eq(waxRecipes.name, name)))[0].id;

beforeAll(async () => {
  browser = await launchBrowser();
  await seedWax(db());
  const waxmaster = await createUser("waxmaster");
  page = await (await browser.newContext()).newPage();
  await signInThroughPage(page, waxmaster.email, waxmaster.password);
});
afterAll(async () => {
  await browser?.close();
});

async function expectCautions(path: string) {
  await go(path);
  const cautions = page.getByTestId("wax-safety");
  await cautions.waitFor();
  for (const c of ["burns", "fire", "fumes", "clothing", "water", "floors"]) expect(await cautions.locator(`[data-caution="${c}"]`).count(), `${path}: ${c}`).toBe(1);
  const decides = await page.getByTestId("wax-safety-decides").textContent();
  expect(decides, path).toMatch(/local fire codes/);
  expect(decides, path).toMatch(/safety data sheet/);
  expect(decides, path).toMatch(/licensed practice/);
}

describe("the wax master's season", () => {
  it("duplicates the dry-season recipe into a rainy-season variant, estimates the wax, sees the purchase list, records a wax use and sees the calibrated rate and the chart change", async () => {
    const variant = `${prefix} rainy variant`;
    const planName = `${prefix} rainy run`;

    // The wax room is in the navigation.
    await go("/");
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Wax room" }).click();
    await page.waitForURL(`${testEnv().appUrl}/wax`);
    await page.getByRole("heading", { name: "Stock to reorder" }).waitFor();

    // Duplicate the dry-season recipe into the rainy season.
    await page.getByRole("navigation", { name: "Wax room" }).getByRole("link", { name: "Recipes" }).click();
    await page.getByRole("link", { name: dryName }).click();
    const duplicate = page.getByRole("form", { name: "Duplicate the recipe" });
    await duplicate.getByLabel("Name of the copy").fill(variant);
    await duplicate.getByLabel("Season of the copy").selectOption({ label: "Rainy season" });
    await duplicate.getByRole("button", { name: "Duplicate" }).click();
    await page.getByText("Copy made. Change what the new season needs.").waitFor();
    await page.getByRole("heading", { name: variant }).waitFor();
    await page.getByText(`Copied from ${dryName}.`).waitFor();
    const [copy] = await db().select().from(waxRecipes).where(eq(waxRecipes.name, variant));
    expect(copy.season).toBe("rainy");
    expect(await page.getByTestId("recipe-working-range").textContent()).toMatch(/°C · .*°F/);

    // The two side by side.
    await go(`/wax/recipes/compare?a=${await recipeId(dryName)}&b=${copy.id}`);
    const compare = page.getByTestId("recipe-compare");
    await compare.getByRole("columnheader", { name: dryName }).waitFor();
    await compare.getByRole("columnheader", { name: variant }).waitFor();

    // Estimate the wax for a waxed area per metre (saved plans are offered in the same form once they exist).
    await go("/wax/estimates");
    const estimate = page.getByRole("form", { name: "Estimate the wax" });
    await estimate.getByLabel("Recipe").selectOption({ label: variant });
    await estimate.getByLabel("Waxed area per metre (m²/m)").fill("0.55");
    await estimate.getByRole("textbox", { name: "Metres", exact: true }).fill("120");
    await estimate.getByLabel("Passes").fill("2");
    await estimate.getByRole("button", { name: "Estimate", exact: true }).click();
    const result = page.getByTestId("estimate-result");
    await result.waitFor();
    expect(await page.getByTestId("grams-per-metre").textContent()).toMatch(/g per metre/);
    expect(["below", "benchmark", "measured", "above"]).toContain(await page.getByTestId("band-picture").getAttribute("data-position"));
    await estimate.getByLabel("Name to save it under").fill(planName);
    await estimate.getByLabel("Planned work (counts toward what to buy)").check();
    await estimate.getByRole("button", { name: "Save estimate" }).click();
    await page.getByText(`Estimate “${planName}” saved.`).waitFor();
    await page.getByRole("table", { name: "Saved estimates" }).getByText(planName).waitFor();

    // The purchase list counts it.
    await go("/wax/purchase");
    await page.getByTestId("purchase-estimates").getByText(planName).waitFor();
    await page.getByTestId("purchase-line-beeswax").waitFor();
    await page.getByRole("button", { name: "Print" }).waitFor();

    // Record a wax use of the dry-season recipe and watch its calibrated rate and chart change.
    await go("/wax/uses");
    const chart = page.getByTestId("calibration-chart");
    // The chart draws once the page is live; choosing before that would not reach the page's state.
    await chart.locator("svg").first().waitFor();
    await page.getByTestId("calibration-recipe").selectOption({ label: dryName });
    await expect.poll(() => page.locator("caption").filter({ hasText: `Uses of ${dryName}` }).count()).toBe(1);
    const pointsBefore = Number(await chart.getAttribute("data-points"));
    const rateBefore = Number(await chart.getAttribute("data-rate"));
    const rateText = await page.getByTestId("calibrated-rate").textContent();
    // 0.55 m²/m × 20 m × 2 passes = 22 m² at 30 % above the fitted rate: the fit must move up.
    const grams = Math.round(rateBefore * 22 * 1.3);
    const use = page.getByRole("form", { name: "Record a wax use" });
    await use.getByLabel("Recipe").selectOption({ label: dryName });
    await use.getByLabel("Waxed area per metre (m²/m)").fill("0.55");
    await use.getByLabel("Metres waxed").fill("20");
    await use.getByLabel("Passes").fill("2");
    await use.getByLabel("Wax used (g)").fill(String(grams));
    await use.getByRole("button", { name: "Record the use" }).click();
    await page.getByText(`Recorded: ${grams.toLocaleString("en")} g of ${dryName}.`).waitFor();
    await expect.poll(async () => Number(await chart.getAttribute("data-points"))).toBe(pointsBefore + 1);
    expect(Number(await chart.getAttribute("data-rate"))).toBeGreaterThan(rateBefore);
    expect(await page.getByTestId("calibrated-rate").textContent()).not.toBe(rateText);

    // Its wax left the stock as movements.
    const [beeswax] = await db().select().from(waxMaterials).where(eq(waxMaterials.code, "beeswax"));
    await go(`/wax/materials/${beeswax.id}`);
    await page.getByTestId("material-movements").getByText("Used in a waxing").first().waitFor();
  });

  it("estimates the wax for a saved plan from the plan's page", async () => {
    // A planner saves the plan: 1150 mm mori, 25 mm margins, a 200 × 200 mm stamp with half its footprint waxed,
    // straight, 30 m. Worked by hand: 25 impressions a metre × 0.04 m² × 0.5 = 0.5 m² of wax a metre.
    const planner = await createUser("planner");
    const session = (await signIn(planner.email, planner.password))!;
    const saved = await api("POST", "/api/v1/plans", {
      session,
      body: { name: `${prefix} market run`, layout: { cloth: { widthMm: 1150, lengthMm: 30_000, margins: { leftMm: 25, rightMm: 25 } }, stamp: { widthMm: 200, heightMm: 200, coverage: 0.5 }, gap: { xMm: 0, yMm: 0 }, arrangement: "straight" } },
    });
    expect(saved.status, JSON.stringify(saved.body)).toBe(201);
    const plan = saved.body.plan as { id: string; name: string };

    await go(`/plans/${plan.id}`);
    await page.getByRole("link", { name: "Estimate the wax" }).click();
    await page.waitForURL((url) => url.pathname === "/wax/estimates" && url.searchParams.get("plan") === plan.id);
    const estimate = page.getByRole("form", { name: "Estimate the wax" });
    expect(await estimate.getByLabel("Saved plan").inputValue()).toBe(plan.id);
    // The plan gives the area: the form asks for none.
    expect(await estimate.getByLabel("Waxed area per metre (m²/m)").count()).toBe(0);
    await estimate.getByLabel("Recipe").selectOption({ label: dryName });
    await estimate.getByLabel("Passes").fill("1");
    await estimate.getByLabel("Rate (g/m²)").fill("100");
    await estimate.getByLabel("Losses (%)").fill("0");
    await estimate.getByLabel("Recovery (%)").fill("0");
    await estimate.getByRole("button", { name: "Estimate", exact: true }).click();
    await page.getByTestId("estimate-result").waitFor();
    // By hand: 0.5 m²/m × 1 pass × 100 g/m² = 50 g/m; over the plan's own 30 m, 1.5 kg.
    expect(await page.getByTestId("grams-per-metre").textContent()).toBe("50 g per metre");
    expect(await page.getByTestId("kg-gross").textContent()).toMatch(/^1\.5(00)? kg$/);
    expect(await estimate.getByLabel("Saved plan").inputValue()).toBe(plan.id);
    await estimate.getByLabel("Name to save it under").fill(`${prefix} wax for the market run`);
    await estimate.getByRole("button", { name: "Save estimate" }).click();
    await page.getByText(`Estimate “${prefix} wax for the market run” saved.`).waitFor();
    await page.getByRole("table", { name: "Saved estimates" }).getByText(`${prefix} wax for the market run`).waitFor();
  });

  it("shows the cautions and who decides on every wax screen", async () => {
    const dry = await recipeId(dryName);
    const [beeswax] = await db().select().from(waxMaterials).where(eq(waxMaterials.code, "beeswax"));
    for (const path of ["/wax", "/wax/recipes", "/wax/recipes/new", `/wax/recipes/${dry}`, `/wax/recipes/${dry}/edit`, `/wax/recipes/compare?a=${dry}`, "/wax/materials", `/wax/materials/${beeswax.id}`, "/wax/estimates", "/wax/uses", "/wax/purchase"]) {
      await expectCautions(path);
    }
  });
});

describe("a stamp keeper", () => {
  it("reads the wax room but is offered no changes", async () => {
    const keeper = await createUser("keeper");
    const other = await (await browser.newContext()).newPage();
    try {
      await signInThroughPage(other, keeper.email, keeper.password);
      const dry = await recipeId(dryName);
      await other.goto(`${testEnv().appUrl}/wax/recipes/${dry}`);
      await other.getByRole("heading", { name: dryName }).waitFor();
      expect(await other.getByRole("form", { name: "Duplicate the recipe" }).count()).toBe(0);
      expect(await other.getByRole("link", { name: "Change" }).count()).toBe(0);
      await other.goto(`${testEnv().appUrl}/wax/uses`);
      await other.getByTestId("calibration-chart").waitFor();
      expect(await other.getByRole("form", { name: "Record a wax use" }).count()).toBe(0);
      await other.goto(`${testEnv().appUrl}/wax/estimates`);
      await other.getByRole("form", { name: "Estimate the wax" }).waitFor();
      expect(await other.getByRole("button", { name: "Save estimate" }).count()).toBe(0);
    } finally {
      await other.context().close();
    }
  });
});
