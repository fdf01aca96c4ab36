import { eq } from "drizzle-orm";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { waxMaterials, waxRecipes, waxUses } from "@/db/schema";
import { seedWax } from "@/scripts/seed/wax";
import { launchBrowser, signInThroughPage } from "../helpers/browser";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { checkAccessibility } from "../helpers/accessibility";
import { expectMessageBeside } from "../helpers/forms";
import { api, signIn } from "../helpers/http";
import { uniquePrefix } from "../helpers/stamps";

// Every form of the wax room, each with valid input (the result shows) and invalid input (the message stands
// beside the field it concerns, and what was typed stays). See "Forms" in DEVELOPERS.md.

let browser: Browser;
let page: Page;
const prefix = uniquePrefix("WF");
const dryName = "Dry-season stamp wax";
const go = (path: string) => page.goto(`${testEnv().appUrl}${path}`);
const recipeRow = async (name: string) => (await db().select().from(waxRecipes).where(eq(waxRecipes.name, name)))[0];

let waxmaster: Awaited<ReturnType<typeof createUser>>;

beforeAll(async () => {
  browser = await launchBrowser();
  await seedWax(db());
  waxmaster = await createUser("waxmaster");
  page = await (await browser.newContext()).newPage();
  await signInThroughPage(page, waxmaster.email, waxmaster.password);
});
afterAll(async () => {
  await browser?.close();
});

describe("the recipe form", () => {
  it("shows the running total and refuses a mix that is not 100 % with the message beside the mix; a whole mix is saved", async () => {
    const name = `${prefix} stamp mix`;
    await go("/wax/recipes/new");
    const form = page.getByRole("form", { name: "Add a recipe" });
    await form.getByLabel("Material, line 1").selectOption({ label: "Beeswax" });
    await form.getByLabel("Share (%), line 1").fill("60");
    await form.getByRole("button", { name: "Add a line" }).click();
    await form.getByLabel("Material, line 2").selectOption({ label: "Paraffin wax" });
    await form.getByLabel("Share (%), line 2").fill("30");
    expect(await page.getByTestId("recipe-total").textContent()).toMatch(/Total 90 %: 10 % still to place/);
    await form.getByLabel("Lowest working temperature (°C)").fill("65");
    await form.getByLabel("Highest working temperature (°C)").fill("80");
    await form.getByRole("button", { name: "Add recipe" }).click();
    await expectMessageBeside(form.getByLabel("Name"), /Required/);
    await expect.poll(() => page.locator("#recipe-components-error").textContent()).toMatch(/add up to 90 %; they must add up to 100 %/);
    expect(await form.getByLabel("Share (%), line 2").inputValue()).toBe("30");
    await checkAccessibility(page, "with the recipe form showing its errors");
    expect(await recipeRow(name)).toBeUndefined();

    await form.getByLabel("Name").fill(name);
    await form.getByLabel("Share (%), line 2").fill("40");
    expect(await page.getByTestId("recipe-total").textContent()).toMatch(/^Total 100 %$/);
    await form.getByRole("button", { name: "Add recipe" }).click();
    await page.getByText("Recipe added.").waitFor();
    await page.getByRole("heading", { name }).waitFor();
    expect(await page.getByTestId("recipe-working-range").textContent()).toMatch(/65–80 °C · 149–176 °F/);
    expect((await recipeRow(name))?.season).toBe("any");
  });

  it("warns of fumes above 100 °C as typed, refuses a range too near the flash point beside the field, and saves a change", async () => {
    const recipe = await recipeRow(dryName);
    await go(`/wax/recipes/${recipe.id}/edit`);
    const form = page.getByRole("form", { name: "Change the recipe" });
    const max = form.getByLabel("Highest working temperature (°C)");
    await max.fill("185");
    await page.getByTestId("recipe-temperature-hints").getByText(/wax fumes quickly/).waitFor();
    await form.getByRole("button", { name: "Save" }).click();
    await expectMessageBeside(max, /below the flash point of/);
    expect(await max.inputValue()).toBe("185");
    expect((await recipeRow(dryName)).version).toBe(recipe.version);

    await max.fill(String(recipe.workingMaxC));
    await form.getByLabel("Notes").fill(`Checked by ${prefix}.`);
    await form.getByRole("button", { name: "Save" }).click();
    await page.getByText("Recipe saved.").waitFor();
    await page.getByText(`Checked by ${prefix}.`, { exact: true }).waitFor();
    expect((await recipeRow(dryName)).version).toBe(recipe.version + 1);
  });
});

describe("duplicating, archiving and deleting a recipe", () => {
  it("duplicate: an empty name gets its message beside the field; a name makes the copy", async () => {
    const recipe = await recipeRow(dryName);
    await go(`/wax/recipes/${recipe.id}`);
    const form = page.getByRole("form", { name: "Duplicate the recipe" });
    await form.getByLabel("Name of the copy").fill("");
    await form.getByRole("button", { name: "Duplicate" }).click();
    await expectMessageBeside(form.getByLabel("Name of the copy"), /Required/);
    await form.getByLabel("Name of the copy").fill(`${prefix} humid copy`);
    await form.getByLabel("Season of the copy").selectOption({ label: "Humid season" });
    await form.getByRole("button", { name: "Duplicate" }).click();
    await page.getByText("Copy made. Change what the new season needs.").waitFor();
    expect((await recipeRow(`${prefix} humid copy`))?.season).toBe("humid");
  });

  it("delete asks first and is refused for a recipe in use, naming what uses it; archive and restore work", async () => {
    const recipe = await recipeRow(dryName);
    await go(`/wax/recipes/${recipe.id}`);
    page.once("dialog", (dialog) => void dialog.accept());
    await page.getByRole("button", { name: "Delete" }).click();
    await page.getByText(/cannot be deleted\. Archive it instead/).waitFor();
    expect(await recipeRow(dryName)).toBeDefined();

    const copy = await recipeRow(`${prefix} humid copy`);
    await go(`/wax/recipes/${copy.id}`);
    await page.getByRole("button", { name: "Archive" }).click();
    await page.getByText("Recipe archived: new estimates and uses no longer offer it.").waitFor();
    await page.getByRole("button", { name: "Restore" }).click();
    await page.getByText("Recipe restored.").waitFor();
    page.once("dialog", (dialog) => void dialog.accept());
    await page.getByRole("button", { name: "Delete" }).click();
    await page.getByText(`Recipe “${prefix} humid copy” deleted.`).waitFor();
    expect(await recipeRow(`${prefix} humid copy`)).toBeUndefined();
  });
});

describe("materials and stock", () => {
  it("add a material: a density that is not a number gets its message beside the field; a whole one is added with its sources", async () => {
    const name = `${prefix} test resin`;
    await go("/wax/materials");
    const form = page.getByRole("form", { name: "Add a material" });
    await form.getByLabel("Name").fill(name);
    await form.getByLabel("Density (g/cm³)").fill("heavy");
    await form.getByLabel("Melts from (°C)").fill("70");
    await form.getByLabel("Melts until (°C)").fill("85");
    await form.getByLabel("Flash point (°C)").fill("210");
    await form.getByLabel("Source of the density").fill("supplier sheet, from memory");
    await form.getByRole("button", { name: "Add material" }).click();
    await expectMessageBeside(form.getByLabel("Density (g/cm³)"), /number/i);
    expect(await form.getByLabel("Name").inputValue()).toBe(name);

    await form.getByLabel("Density (g/cm³)").fill("1.05");
    await form.getByRole("button", { name: "Add material" }).click();
    await page.getByText("Material added.").waitFor();
    await page.getByTestId("material-facts").getByText("supplier sheet, from memory").waitFor();
    const [row] = await db().select().from(waxMaterials).where(eq(waxMaterials.name, name));
    expect(row.densityGPerCm3).toBe(1.05);
  });

  it("change a material: a melting range that ends before it starts is refused beside the field; a change is saved", async () => {
    const [beeswax] = await db().select().from(waxMaterials).where(eq(waxMaterials.code, "beeswax"));
    await go(`/wax/materials/${beeswax.id}`);
    const form = page.getByRole("form", { name: "Change the material" });
    await form.getByLabel("Melts until (°C)").fill("10");
    await form.getByRole("button", { name: "Save" }).click();
    await expectMessageBeside(form.getByLabel("Melts until (°C)"), /.+/);
    await form.getByLabel("Melts until (°C)").fill(String(beeswax.meltToC));
    await form.getByLabel("Reorder level (kg)").fill(String(beeswax.reorderLevelKg + 2));
    await form.getByRole("button", { name: "Save" }).click();
    await form.getByText(/^Saved\./).waitFor();
    const [after] = await db().select().from(waxMaterials).where(eq(waxMaterials.id, beeswax.id));
    expect(after.reorderLevelKg).toBe(beeswax.reorderLevelKg + 2);
    expect(after.version).toBe(beeswax.version + 1);
  });

  it("record stock: an empty amount gets its message beside the field; a receipt adds to the stock as a movement", async () => {
    const [paraffin] = await db().select().from(waxMaterials).where(eq(waxMaterials.code, "paraffin"));
    await go(`/wax/materials/${paraffin.id}`);
    const before = await page.getByTestId("material-on-hand").textContent();
    const form = page.getByRole("form", { name: "Record a stock movement" });
    await form.getByLabel("Note").fill(`${prefix} delivery`);
    await form.getByRole("button", { name: "Record" }).click();
    await expectMessageBeside(form.getByLabel("Amount (kg)"), /Required|number/);
    expect(await form.getByLabel("Note").inputValue()).toBe(`${prefix} delivery`);
    await form.getByLabel("Amount (kg)").fill("12.5");
    await form.getByRole("button", { name: "Record" }).click();
    await form.getByText("Recorded.").waitFor();
    await page.getByTestId("material-movements").getByText(`${prefix} delivery`).waitFor();
    expect(await page.getByTestId("material-on-hand").textContent()).not.toBe(before);
  });
});

describe("estimates and wax uses", () => {
  it("estimate: a missing waxed area gets its message beside the field; a whole one shows the result", async () => {
    await go("/wax/estimates");
    const form = page.getByRole("form", { name: "Estimate the wax" });
    await form.getByLabel("Recipe").selectOption({ label: dryName });
    await form.getByRole("textbox", { name: "Metres", exact: true }).fill("50");
    await form.getByRole("button", { name: "Estimate", exact: true }).click();
    await expectMessageBeside(form.getByLabel("Waxed area per metre (m²/m)"), /Required|number/);
    expect(await form.getByRole("textbox", { name: "Metres", exact: true }).inputValue()).toBe("50");
    await form.getByLabel("Waxed area per metre (m²/m)").fill("0.6");
    await form.getByRole("button", { name: "Estimate", exact: true }).click();
    await page.getByTestId("estimate-result").waitFor();
    await page.getByTestId("band-picture").waitFor();
    await checkAccessibility(page, "with an estimate's result and band picture");
    expect(await page.getByTestId("kg-new").textContent()).toMatch(/kg$/);
  });

  it("wax use: a missing length gets its message beside the field and keeps the grams; a whole one is recorded", async () => {
    await go("/wax/uses");
    const form = page.getByRole("form", { name: "Record a wax use" });
    await form.getByLabel("Recipe").selectOption({ label: dryName });
    await form.getByLabel("Waxed area per metre (m²/m)").fill("0.5");
    await form.getByLabel("Wax used (g)").fill("1200");
    await form.getByRole("button", { name: "Record the use" }).click();
    await expectMessageBeside(form.getByLabel("Metres waxed"), /Required|number/);
    expect(await form.getByLabel("Wax used (g)").inputValue()).toBe("1200");
    await checkAccessibility(page, "with the wax use form showing its errors and the calibration chart drawn");
    await form.getByLabel("Metres waxed").fill("12");
    await form.getByRole("button", { name: "Record the use" }).click();
    await page.getByText(`Recorded: 1,200 g of ${dryName}.`).waitFor();
  });
});

describe("withdrawing a wax use", () => {
  it("asks first; without a reason the message stands beside the box; with one the use leaves the list and the calibration", async () => {
    const session = (await signIn(waxmaster.email, waxmaster.password))!;
    const recipe = await recipeRow(dryName);
    const note = `${prefix} mistaken use`;
    const recorded = await api("POST", "/api/v1/wax/uses", { session, body: { recipeId: recipe.id, usedOn: new Date().toISOString().slice(0, 10), waxedAreaPerMetreM2: 0.5, metres: 4, gramsUsed: 300, note } });
    expect(recorded.status, JSON.stringify(recorded.body)).toBe(201);
    const id: string = recorded.body.use.id;
    await go("/wax/uses");
    const row = page.getByTestId(`wax-use-${id}`);
    const reason = row.getByRole("textbox");
    await reason.waitFor();
    page.once("dialog", (dialog) => void dialog.accept());
    await row.getByRole("button", { name: "Withdraw" }).click();
    await expectMessageBeside(reason, /Required/);
    expect((await db().select().from(waxUses).where(eq(waxUses.id, id)))[0].withdrawnAt).toBeNull();

    await reason.fill("weighed the wrong pot");
    page.once("dialog", (dialog) => void dialog.accept());
    await row.getByRole("button", { name: "Withdraw" }).click();
    await expect.poll(() => row.count()).toBe(0);
    const [after] = await db().select().from(waxUses).where(eq(waxUses.id, id));
    expect(after.withdrawnAt).not.toBeNull();
    expect(after.withdrawnReason).toBe("weighed the wrong pot");
  });
});

describe("the defaults of new estimates", () => {
  it("a rate of 0 gets its message beside the field and keeps what was typed; a change is saved (and put back)", async () => {
    const session = (await signIn(waxmaster.email, waxmaster.password))!;
    const before = (await api("GET", "/api/v1/wax/defaults", { session })).body.defaults;
    try {
      await go("/wax/estimates");
      const form = page.getByRole("form", { name: "Defaults for new estimates" });
      await form.getByLabel("Rate before calibration (g/m²)").fill("0");
      await form.getByLabel("Losses (%)").fill("4");
      await form.getByRole("button", { name: "Save defaults" }).click();
      await expectMessageBeside(form.getByLabel("Rate before calibration (g/m²)"), /above 0/);
      expect(await form.getByLabel("Losses (%)").inputValue()).toBe("4");
      await form.getByLabel("Rate before calibration (g/m²)").fill(String(before.waxRateGPerM2));
      await form.getByRole("button", { name: "Save defaults" }).click();
      await form.getByText("Defaults saved.").waitFor();
      expect((await api("GET", "/api/v1/wax/defaults", { session })).body.defaults.waxLossPct).toBe(4);
    } finally {
      const now = (await api("GET", "/api/v1/wax/defaults", { session })).body.defaults;
      await api("PATCH", "/api/v1/wax/defaults", { session, body: { version: now.version, waxRateGPerM2: before.waxRateGPerM2, waxLossPct: before.waxLossPct, waxRecoveryPct: before.waxRecoveryPct } });
    }
  });
});
