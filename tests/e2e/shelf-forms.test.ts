import { eq } from "drizzle-orm";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { checkouts, locations } from "@/db/schema";
import { seedStamps } from "@/scripts/seed/stamps";
import { createUser, db } from "../helpers/db";
import { launchBrowser, signInThroughPage } from "../helpers/browser";
import { testEnv } from "../helpers/env";
import { expectMessageBeside, messageBeside } from "../helpers/forms";
import { latestMailTo } from "../helpers/mail";
import { createStampRow, daysFromToday, reloadStamp, uniquePrefix } from "../helpers/stamps";

// Every form of the stamp shelf, each with valid input (the result shows) and invalid input (the message
// stands beside the field it concerns). See "Forms" in DEVELOPERS.md.

let browser: Browser;
let page: Page;
const prefix = uniquePrefix("SF");
const site = `Form room ${prefix}`;

beforeAll(async () => {
  browser = await launchBrowser();
  await seedStamps(db());
  const keeper = await createUser("keeper");
  page = await (await browser.newContext()).newPage();
  await signInThroughPage(page, keeper.email, keeper.password);
});
afterAll(async () => {
  await browser?.close();
});

const go = (path: string) => page.goto(`${testEnv().appUrl}${path}`);

describe("locations", () => {
  it("adds a location: a bad code gets its message beside the field and keeps the site; a good one is saved and listed", async () => {
    await go("/stamps/locations");
    const form = page.getByRole("form", { name: "Add a location" });
    await form.getByLabel("Site").fill(site);
    await form.getByLabel("Code", { exact: true }).fill("shelf nine!");
    await form.getByRole("button", { name: "Add" }).click();
    await expectMessageBeside(form.getByLabel("Code", { exact: true }), /letters, digits/);
    expect(await form.getByLabel("Site").inputValue()).toBe(site);

    await form.getByLabel("Code", { exact: true }).fill("r9-s1");
    await form.getByLabel("Description").fill("by the dye vats");
    await form.getByRole("button", { name: "Add" }).click();
    await page.getByText(`Location ${site} · R9-S1 added.`).waitFor();
    await page.getByTestId(`site-${site}`).getByTestId("location-R9-S1").waitFor();
    const [row] = await db().select().from(locations).where(eq(locations.site, site));
    expect(row).toMatchObject({ code: "R9-S1", description: "by the dye vats" });
  });

  it("describes a location: too long a text gets its message beside the box; a short one is saved", async () => {
    await go("/stamps/locations");
    const row = page.getByTestId(`site-${site}`).getByTestId("location-R9-S1");
    const box = row.getByLabel("Description of R9-S1");
    await box.fill("x".repeat(301));
    await row.getByRole("button", { name: "Save" }).click();
    await expectMessageBeside(box, /Too long/);
    await box.fill("left of the window");
    await row.getByRole("button", { name: "Save" }).click();
    await row.getByText("Saved.").waitFor();
    const [saved] = await db().select().from(locations).where(eq(locations.site, site));
    expect(saved.description).toBe("left of the window");
  });

  it("deletes an empty location after asking", async () => {
    await go("/stamps/locations");
    page.once("dialog", (dialog) => void dialog.accept());
    await page.getByTestId(`site-${site}`).getByTestId("location-R9-S1").getByRole("button", { name: "Delete" }).click();
    await page.getByText(`Location ${site} · R9-S1 was deleted.`).waitFor();
    expect(await db().select().from(locations).where(eq(locations.site, site))).toEqual([]);
  });
});

describe("the stamp form", () => {
  it("takes coverage in percent, asks before saving under 1 %, and shows the outline message once", async () => {
    const code = `${prefix}-COV`;
    await createStampRow({ code, widthMm: 200, heightMm: 200 });
    await go(`/stamps/${code}/edit`);
    const form = page.getByRole("form", { name: "Edit the stamp" });
    const coverage = form.getByLabel("Coverage (%)");
    const outline = form.getByLabel("Outline (SVG path in mm)");

    await outline.fill("circle r=40");
    await form.getByRole("button", { name: "Save changes" }).click();
    await expectMessageBeside(outline, /SVG path data/);
    expect((await messageBeside(outline)).match(/Use SVG path data/g)).toHaveLength(1);
    await outline.fill("");

    await coverage.fill("150");
    await form.getByRole("button", { name: "Save changes" }).click();
    await expectMessageBeside(coverage, /percentage between 0 and 100/);

    // A ratio typed into the percent field: the form says what it means and what was likely meant.
    await coverage.fill("0.35");
    await form.getByRole("button", { name: "Save changes" }).click();
    await expectMessageBeside(coverage, /0\.35 % is very little wax.*35 %/);
    expect((await reloadStamp(code))!.coverageRatio).toBeNull();

    await coverage.fill("35");
    await form.getByRole("button", { name: "Save changes" }).click();
    await page.waitForURL(/\?saved=updated$/);
    expect((await reloadStamp(code))!.coverageRatio).toBeCloseTo(0.35, 6);
    expect(await page.getByTestId("facts").textContent()).toContain("35%");
  });

  it("keeps a coverage under 1 % once confirmed, marks it on the record and lists it for the keepers", async () => {
    const code = `${prefix}-LOW`;
    await createStampRow({ code, widthMm: 200, heightMm: 200 });
    await go(`/stamps/${code}/edit`);
    const form = page.getByRole("form", { name: "Edit the stamp" });
    await form.getByLabel("Coverage (%)").fill("0.5");
    await form.getByRole("button", { name: "Save changes" }).click();
    await form.getByLabel("Yes, keep 0.5 %: this stamp really carries that little wax.").check();
    await form.getByRole("button", { name: "Save changes" }).click();
    await page.waitForURL(/\?saved=updated$/);
    expect((await reloadStamp(code))!.coverageRatio).toBeCloseTo(0.005, 6);
    await page.getByTestId("coverage-low").waitFor();

    await go("/stamps");
    await page.getByRole("link", { name: /with coverage under 1 % to check/ }).click();
    await page.waitForURL(/lowCoverage=true/);
    const row = page.getByTestId(`stamp-row-${code}`);
    await row.waitFor();
    expect(await row.textContent()).toContain("0.5%");
    await page.getByRole("columnheader", { name: "Coverage" }).waitFor();
  });
});

describe("check-out and return", () => {
  it("refuses a check-out without a workstation beside that field, then says who has the stamp; a return refuses negative impressions", async () => {
    const code = `${prefix}-OUT`;
    await createStampRow({ code });
    await go(`/stamps/${code}`);
    const out = page.getByRole("form", { name: "Check out" });
    await out.getByLabel("Who takes it").selectOption("other");
    await out.getByLabel("Name", { exact: true }).fill("Sekar Arum");
    await out.getByRole("button", { name: "Check out", exact: true }).click();
    await expectMessageBeside(out.getByLabel("Workstation"), /Required/);
    expect(await out.getByLabel("Name", { exact: true }).inputValue()).toBe("Sekar Arum");

    await out.getByLabel("Workstation").fill("Stamping table 3");
    await out.getByRole("button", { name: "Check out", exact: true }).click();
    await page.getByText(/Checked out: Sekar Arum has it now, at Stamping table 3, due back on/).waitFor();

    const back = page.getByRole("form", { name: "Return" });
    await back.getByLabel("Impressions made").fill("-4");
    await back.getByRole("button", { name: "Take it back" }).click();
    await expectMessageBeside(back.getByLabel("Impressions made"), /whole number of impressions/);
    await back.getByLabel("Impressions made").fill("12");
    await back.getByRole("button", { name: "Take it back" }).click();
    await page.getByText(/Taken back: the stamp is on the shelf again/).waitFor();
    expect((await reloadStamp(code))!.impressionsCount).toBe(12);
  });
});

describe("damage and condition", () => {
  it("a damage report of kind Other needs details beside that field; a condition note may not be too long", async () => {
    const code = `${prefix}-DMG`;
    await createStampRow({ code });
    await go(`/stamps/${code}`);
    await page.getByText("Report damage", { exact: true }).first().click();
    const damage = page.getByRole("form", { name: "Report damage" });
    await damage.getByLabel("What is wrong").selectOption({ label: "Other" });
    await damage.getByRole("button", { name: "Report damage" }).click();
    await expectMessageBeside(damage.getByLabel("Details"), /Required/);
    // The refused form keeps the choice (a select, which React's form reset would otherwise clear).
    expect(await damage.getByLabel("What is wrong").inputValue()).toBe("other");
    await damage.getByLabel("Details").fill("Handle wobbles");
    await damage.getByRole("button", { name: "Report damage" }).click();
    await page.getByTestId("open-damage").waitFor();

    const condition = page.getByRole("form", { name: "Change the condition" });
    await condition.getByLabel("Note for the history").fill("y".repeat(1001));
    await condition.getByRole("button", { name: "Mark as needing repair" }).click();
    await expectMessageBeside(condition.getByLabel("Note for the history"), /Too long/);
    await condition.getByLabel("Note for the history").fill("handle to re-solder");
    await condition.getByRole("button", { name: "Mark as needing repair" }).click();
    await page.locator('[data-condition="needs_repair"]').first().waitFor();
    expect((await reloadStamp(code))!.condition).toBe("needs_repair");
  });
});

describe("deleting a stamp", () => {
  it("asks, deletes, and the shelf says which stamp went", async () => {
    const code = `${prefix}-DEL`;
    await createStampRow({ code });
    await go(`/stamps/${code}`);
    page.once("dialog", (dialog) => void dialog.accept());
    await page.getByRole("button", { name: "Delete" }).click();
    await page.waitForURL(`${testEnv().appUrl}/stamps?deleted=${code}`);
    await page.getByText(`Stamp ${code} was deleted, with its history and scans.`).waitFor();
    expect(await reloadStamp(code)).toBeUndefined();
  });
});

describe("labels", () => {
  it("prints labels for typed codes; a code that is not one, or unknown, is named beside the field", async () => {
    const code = `${prefix}-LBL`;
    await createStampRow({ code });
    await go("/stamps/labels?codes=");
    const form = page.getByRole("form", { name: "Labels for chosen stamps" });
    const codes = form.getByLabel("Stamp codes");
    await codes.fill(`${code}, no!code, ${prefix}-NONE`);
    await form.getByRole("button", { name: "Show these labels" }).click();
    await expectMessageBeside(page.getByLabel("Stamp codes"), /Not a stamp code: no!code/);
    expect(await messageBeside(page.getByLabel("Stamp codes"))).toContain(`No stamp has the code ${prefix}-NONE`);
    expect(await page.locator("[data-code]").count()).toBe(1);

    await page.getByLabel("Stamp codes").fill(code.toLowerCase());
    await page.getByRole("button", { name: "Show these labels" }).click();
    await page.locator(`[data-code="${code}"] svg`).waitFor();
    expect(await messageBeside(page.getByLabel("Stamp codes"))).toBe("");
  });
});

describe("the CSV import", () => {
  const header = "code,name,width_mm,height_mm";
  it("without a file says so beside the file box; a bad row is listed and nothing stored; a good file imports", async () => {
    await go("/stamps/import");
    await page.getByRole("button", { name: "Check the file" }).click();
    const file = page.getByLabel("CSV file (UTF-8, comma-separated, first line = column names)");
    await expectMessageBeside(file, /Choose a CSV file first/);

    const bad = `${header}\r\n${prefix}-CSV1,Lereng small,wide,180\r\n`;
    await file.setInputFiles({ name: "bad.csv", mimeType: "text/csv", buffer: Buffer.from(bad) });
    await page.getByRole("button", { name: "Import" }).click();
    const problems = page.getByRole("table", { name: "Problems in the file" });
    await problems.waitFor();
    expect(await problems.textContent()).toContain("width_mm");
    expect(await reloadStamp(`${prefix}-CSV1`)).toBeUndefined();

    const good = `${header}\r\n${prefix}-CSV1,Lereng small,180,180\r\n`;
    await file.setInputFiles({ name: "good.csv", mimeType: "text/csv", buffer: Buffer.from(good) });
    await page.getByRole("button", { name: "Import" }).click();
    await page.getByText("Imported: 1 new stamp, 0 updated.").waitFor();
    expect((await reloadStamp(`${prefix}-CSV1`))!.widthMm).toBe(180);
  });
});

describe("reminders", () => {
  it("sends each overdue borrower one reminder; right after, the button says they were reminded and sends nothing", async () => {
    const stamp = await createStampRow({ code: `${prefix}-LATE` });
    const email = `late-${prefix.toLowerCase()}@capgrid.test`;
    await db().insert(checkouts).values({ stampId: stamp.id, borrowerName: "Lintang", borrowerEmail: email, workstation: "Table 8", dueOn: daysFromToday(-4) });
    await go("/stamps/out");
    await page.getByRole("button", { name: /^Send \d+ reminders? now$/ }).click();
    await page.getByText(/reminders? sent\./).waitFor();
    expect((await latestMailTo(email, /overdue/i)).text).toContain(`${prefix}-LATE`);
    const [row] = await db().select().from(checkouts).where(eq(checkouts.stampId, stamp.id));
    expect(row.lastRemindedAt).not.toBeNull();

    await go("/stamps/out");
    const button = page.getByRole("button", { name: "Nothing to send now" });
    await button.waitFor();
    expect(await button.isDisabled()).toBe(true);
    await page.getByText(/reminded in the last 24 hours and (is|are) skipped/).waitFor();
  });
});

describe("the stamp table's filters", () => {
  it("a width whose minimum is above its maximum is named beside the boxes, and no stale rows stay", async () => {
    await go("/stamps");
    const count = page.getByTestId("stamp-count");
    await expect.poll(() => count.textContent()).toMatch(/^Stamps 1–50 of \d+/);
    await page.getByLabel("Width from (mm)").fill("300");
    await page.getByLabel("Width from (mm)").press("Enter");
    await page.getByLabel("Width up to (mm)").fill("100");
    await page.getByLabel("Width up to (mm)").press("Enter");
    await expect.poll(() => count.textContent()).toBe("No stamps shown: a filter is not valid.");
    await expectMessageBeside(page.getByLabel("Width up to (mm)"), /lower bound \(from\) is above the upper bound/);
    await page.getByRole("alert").filter({ hasText: "Width (mm): The lower bound" }).waitFor();
    expect(await page.locator("tbody tr[data-testid^='stamp-row-']").count()).toBe(0);

    await page.getByLabel("Width up to (mm)").fill("400");
    await page.getByLabel("Width up to (mm)").press("Enter");
    await expect.poll(() => count.textContent()).toMatch(/^(No stamps|Stamps? 1–\d+ of \d+)$/);
    expect(await messageBeside(page.getByLabel("Width up to (mm)"))).toBe("");
  });
});

describe("pages that are not there", () => {
  it("an unknown stamp code or count answers 404 with the header and navigation; the site has a favicon", async () => {
    const stampPage = await go(`/stamps/${prefix}-NOPE`);
    expect(stampPage?.status()).toBe(404);
    await page.getByRole("heading", { name: "No such stamp" }).waitFor();
    await page.getByRole("navigation", { name: "Main" }).waitFor();

    const countPage = await go("/stamps/stock-takes/00000000-0000-4000-8000-000000000000");
    expect(countPage?.status()).toBe(404);
    await page.getByRole("heading", { name: "Not found" }).waitFor();
    await page.getByRole("navigation", { name: "Main" }).waitFor();

    const nowhere = await go("/no/such/page");
    expect(nowhere?.status()).toBe(404);
    await page.getByRole("navigation", { name: "Main" }).waitFor();

    const icon = await page.request.get(`${testEnv().appUrl}/favicon.ico`);
    expect(icon.status()).toBe(200);
    expect(icon.headers()["content-type"]).toMatch(/icon/);
    expect(await page.locator('head link[rel="icon"]').count()).toBeGreaterThan(0);
  });
});
