import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoLocations, demoStamps, seedStamps } from "@/scripts/seed/stamps";
import { createUser, db } from "../helpers/db";
import { launchBrowser, navLabels, signInThroughPage } from "../helpers/browser";
import { testEnv } from "../helpers/env";
import { createLocation, uniquePrefix } from "../helpers/stamps";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
  // The test database starts empty: the table tests page through the demo library.
  await seedStamps(db());
});
afterAll(async () => {
  await browser?.close();
});

async function signedIn(role: "keeper" | "planner"): Promise<Page> {
  const user = await createUser(role);
  const context = await browser.newContext();
  const page = await context.newPage();
  await signInThroughPage(page, user.email, user.password);
  return page;
}

const kindsInHistory = (page: Page) => page.getByTestId("history").locator("li[data-kind]").evaluateAll((items) => items.map((li) => li.getAttribute("data-kind")));

describe("a stamp keeper", () => {
  it("adds a stamp, checks it out, takes it back, reports and repairs damage, and sees each step in the history", async () => {
    const { appUrl } = testEnv();
    const prefix = uniquePrefix("E2E");
    const site = `Shelf room ${prefix}`;
    await createLocation(site, "R1-S1");
    const page = await signedIn("keeper");
    expect(await navLabels(page)).toContain("Stamp shelf");

    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Stamp shelf" }).click();
    await page.waitForURL(`${appUrl}/stamps`);
    await page.getByRole("link", { name: "Add a stamp" }).first().click();
    await page.waitForURL(`${appUrl}/stamps/new`);

    // A bad width first: a clear message, and what was typed stays.
    const form = page.getByRole("form", { name: "Add a stamp" });
    const code = `${prefix}-1`;
    await form.getByLabel("Code", { exact: true }).fill(code.toLowerCase());
    await form.getByLabel("Name", { exact: true }).fill("Kawung with birds");
    await form.getByLabel("Width (mm)").fill("wide");
    await form.getByLabel("Height (mm)").fill("205");
    await form.getByLabel("Location").selectOption({ label: `${site} · R1-S1` });
    await form.getByRole("button", { name: "Add the stamp" }).click();
    await expect.poll(() => form.locator("#stamp-width-error").textContent()).toMatch(/number/i);
    expect(await form.getByLabel("Name", { exact: true }).inputValue()).toBe("Kawung with birds");
    expect(await form.getByLabel("Height (mm)").inputValue()).toBe("205");

    // The chosen location survived the refusal too.
    expect(await form.getByLabel("Location").locator("option:checked").textContent()).toBe(`${site} · R1-S1`);
    await form.getByLabel("Width (mm)").fill("210");
    await form.getByRole("button", { name: "Add the stamp" }).click();
    await page.waitForURL(`${appUrl}/stamps/${code}?saved=created`);
    await page.getByText("The stamp was added.").waitFor();
    expect(await page.getByTestId("facts").textContent()).toContain("210 × 205 mm");

    // Check out to someone without an account.
    const out = page.getByRole("form", { name: "Check out" });
    await out.getByLabel("Who takes it").selectOption("other");
    await out.getByLabel("Name", { exact: true }).fill("Ratri Handayani");
    await out.getByLabel("E-mail").fill("ratri@capgrid.test");
    await out.getByLabel("Workstation").fill("Stamping table 9");
    await out.getByRole("button", { name: "Check out", exact: true }).click();
    await expect.poll(() => page.getByTestId("checkout").textContent()).toContain("Stamping table 9");

    // Take it back with the impressions made.
    const back = page.getByRole("form", { name: "Return" });
    await back.getByLabel("Impressions made").fill("120");
    await back.getByRole("button", { name: "Take it back" }).click();
    await page.getByRole("form", { name: "Check out" }).waitFor();
    await expect.poll(() => page.getByTestId("facts").textContent()).toContain("120");

    // Report damage, then repair it step by step.
    await page.getByText("Report damage", { exact: true }).first().click();
    const damage = page.getByRole("form", { name: "Report damage" });
    await damage.getByLabel("What is wrong").selectOption({ label: "Bent strip" });
    await damage.getByLabel("Details").fill("Top left strip bent inwards");
    await damage.getByRole("button", { name: "Report damage" }).click();
    await page.getByTestId("open-damage").waitFor();

    for (const [button, condition] of [
      ["Mark as needing repair", "needs_repair"],
      ["Send to repair", "in_repair"],
      ["Mark as sound", "sound"],
    ] as const) {
      await page.getByRole("button", { name: button }).click();
      await page.locator(`[data-condition="${condition}"]`).first().waitFor();
    }
    await expect.poll(() => page.getByTestId("open-damage").count()).toBe(0);

    await expect.poll(() => kindsInHistory(page)).toEqual(["repaired", "condition_changed", "condition_changed", "damage_reported", "returned", "checked_out", "created"]);
    const history = await page.getByTestId("history").textContent();
    expect(history).toContain("checked it out to Ratri Handayani at Stamping table 9");
    expect(history).toContain("reported damage: Bent strip");
    expect(history).toContain("120 impressions made");

    // Its label: a QR code that opens this record, on a sheet meant for printing.
    await page.getByRole("link", { name: "Print label" }).click();
    await page.waitForURL(`${appUrl}/stamps/labels?codes=${code}`);
    const label = page.locator(`[data-code="${code}"]`);
    await label.locator("svg").waitFor();
    expect(await label.textContent()).toContain(`${site} · R1-S1`);
    expect(await page.locator("[data-code]").count()).toBe(1);
    await page.getByRole("button", { name: "Print" }).waitFor();
    await page.context().close();
  });
});

describe("a layout planner", () => {
  it("reads a stamp but sees no edit actions, and the API refuses their changes with 403", async () => {
    const { appUrl } = testEnv();
    const page = await signedIn("planner");
    expect(await navLabels(page)).toContain("Stamp shelf");
    await page.goto(`${appUrl}/stamps/CP-0058`);
    await page.getByRole("heading", { name: /CP-0058/ }).waitFor();
    expect(await page.getByRole("link", { name: "Edit" }).count()).toBe(0);
    expect(await page.getByRole("button", { name: "Delete" }).count()).toBe(0);
    expect(await page.getByRole("button", { name: "Take it back" }).count()).toBe(0);
    expect(await page.getByRole("button", { name: "Send to repair" }).count()).toBe(0);
    const shelfTabs = page.getByRole("navigation", { name: "Stamp shelf" });
    expect(await shelfTabs.getByRole("link", { name: "Locations" }).count()).toBe(1);
    expect(await shelfTabs.getByRole("link", { name: "Import CSV" }).count()).toBe(0);
    // Reporting damage is for everyone.
    expect(await page.getByRole("form", { name: "Report damage" }).count()).toBe(1);

    await page.goto(`${appUrl}/stamps`);
    await page.getByTestId("stamp-count").waitFor();
    expect(await page.getByRole("link", { name: "Add a stamp" }).count()).toBe(0);
    await page.goto(`${appUrl}/stamps/new`);
    await page.getByText("Not for your role").waitFor();

    const create = await page.request.post(`${appUrl}/api/v1/stamps`, { data: { code: "PLANNER-1", name: "x", widthMm: 200, heightMm: 200 } });
    expect(create.status()).toBe(403);
    const edit = await page.request.patch(`${appUrl}/api/v1/stamps/CP-0058`, { data: { name: "changed", version: 1 } });
    expect(edit.status()).toBe(403);
    const checkout = await page.request.post(`${appUrl}/api/v1/stamps/CP-0001/return`, { data: {} });
    expect(checkout.status()).toBe(403);
    expect((await page.request.get(`${appUrl}/api/v1/stamps/CP-0058`)).status()).toBe(200);
    await page.context().close();
  });
});

describe("the stamp table", () => {
  const site = "Griya Kidul";
  const atSite = demoStamps().filter((s) => s.locationIndex !== null && demoLocations()[s.locationIndex].site === site);

  it("filters, sorts, chooses columns and pages through the demo library", async () => {
    const { appUrl } = testEnv();
    const page = await signedIn("planner");
    await page.goto(`${appUrl}/stamps`);
    const count = page.getByTestId("stamp-count");
    await count.waitFor();

    await page.getByLabel("Site").selectOption(site);
    await expect.poll(() => count.textContent()).toBe(`Stamps 1–50 of ${atSite.length}`);

    await page.getByText("Condition ▾").click();
    await page.getByRole("checkbox", { name: "Worn" }).click();
    const worn = atSite.filter((s) => s.condition === "worn");
    await expect.poll(() => count.textContent()).toBe(`Stamps 1–${worn.length} of ${worn.length}`);
    const badges = await page.locator("tbody [data-condition]").evaluateAll((els) => els.map((e) => e.getAttribute("data-condition")));
    expect(new Set(badges)).toEqual(new Set(["worn"]));
    await page.getByRole("checkbox", { name: "Worn" }).click();
    await expect.poll(() => count.textContent()).toBe(`Stamps 1–50 of ${atSite.length}`);
    await page.getByText("Condition ▾").click();

    // Sort by code, highest first; then page with 25 rows.
    await page.getByRole("button", { name: /^Code/ }).click();
    const highest = [...atSite].sort((a, b) => b.code.localeCompare(a.code))[0].code;
    await expect.poll(() => page.locator("tbody tr").first().getAttribute("data-testid")).toBe(`stamp-row-${highest}`);
    await page.getByLabel("Rows per page").selectOption("25");
    const pages = Math.ceil(atSite.length / 25);
    await expect.poll(() => page.getByTestId("page-of").textContent()).toBe(`Page 1 of ${pages}`);
    await page.getByRole("button", { name: "Next" }).click();
    await expect.poll(() => page.getByTestId("page-of").textContent()).toBe(`Page 2 of ${pages}`);
    await expect.poll(() => count.textContent()).toBe(`Stamps 26–50 of ${atSite.length}`);
    expect(page.url()).toContain("page=2");

    // Search narrows further; a search that matches nothing shows the empty state.
    await page.getByLabel("Search").fill("kawung");
    const kawung = atSite.filter((s) => /kawung/i.test(s.name) || (s.tags ?? []).includes("kawung") || /kawung/i.test(s.maker ?? ""));
    // The search waits for typing to pause before it asks the server: more than poll's default second on a busy machine.
    await expect.poll(() => count.textContent(), { timeout: 10_000 }).toBe(`Stamps 1–${Math.min(25, kawung.length)} of ${kawung.length}`);
    await page.getByLabel("Search").fill("no such motif at all");
    await page.getByText("No stamp matches these filters.").waitFor();
    await page.getByRole("button", { name: "Clear all filters" }).first().click();
    await expect.poll(() => page.getByLabel("Site").inputValue()).toBe("");

    // Column choice: the maker column appears on demand.
    expect(await page.getByRole("columnheader", { name: "Maker" }).count()).toBe(0);
    await page.getByText("Columns ▾").click();
    await page.getByRole("checkbox", { name: "Maker" }).click();
    await page.getByRole("columnheader", { name: "Maker" }).waitFor();

    // The overdue filter finds the one overdue stamp of the demo at its site.
    const late = demoStamps().find((s) => s.code === "CP-0058")!;
    await page.getByLabel("Site").selectOption(demoLocations()[late.locationIndex!].site);
    await page.getByLabel("Out or in").selectOption("overdue");
    await expect.poll(() => page.locator("tbody tr").evaluateAll((rows) => rows.map((r) => r.getAttribute("data-testid")))).toEqual(["stamp-row-CP-0058"]);

    // Codes are links to the record.
    await page.getByRole("link", { name: "CP-0058" }).click();
    await page.waitForURL(`${appUrl}/stamps/CP-0058`);
    await page.context().close();
  });
});
