import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createUser } from "../helpers/db";
import { launchBrowser, navLabels, signInThroughPage } from "../helpers/browser";
import { testEnv } from "../helpers/env";
import { api, signIn } from "../helpers/http";
import { createLocation, createStampRow, uniquePrefix } from "../helpers/stamps";

// The planner's main flow (the cloth plans area): build a plan from a library stamp, watch the numbers and the
// picture follow the arrangement and the width, apply a fit suggestion, add a border, save, reopen, compare two
// plans, ask the keepers for the stamps (a keeper checks them out) and open the stamping sheet. A designer reads.

let browser: Browser;
const prefix = uniquePrefix("PE");
const FIELD = `${prefix}-F`;
const BORDER = `${prefix}-B`;

beforeAll(async () => {
  browser = await launchBrowser();
  const shelf = await createLocation(`Plan room ${prefix}`, "R1-S1");
  await createStampRow({ code: FIELD, name: "Kawung open", widthMm: 200, heightMm: 200, locationId: shelf.id, coverageRatio: 0.45 });
  await createStampRow({ code: BORDER, name: "Lereng border", widthMm: 60, heightMm: 100, locationId: shelf.id });
});
afterAll(async () => {
  await browser?.close();
});

async function signedIn(role: "planner" | "keeper" | "designer"): Promise<Page> {
  const user = await createUser(role);
  const page = await (await browser.newContext()).newPage();
  await signInThroughPage(page, user.email, user.password);
  return page;
}

const live = (page: Page) => page.getByTestId("plan-live");
/** Waits for the numbers to be computed again after a change (the live block's sequence number moves on). */
async function nextNumbers(page: Page, before: string | null) {
  await expect.poll(async () => ((await live(page).getAttribute("data-state")) === "ready" ? await live(page).getAttribute("data-seq") : before), { timeout: 15_000 }).not.toBe(before);
}
const figure = (page: Page, key: string) => page.getByTestId(`number-${key}`).locator("dd").textContent();

describe("a layout planner", () => {
  it("builds, saves, reopens, compares, requests the stamps and prints the sheet", async () => {
    const { appUrl } = testEnv();
    const page = await signedIn("planner");
    expect(await navLabels(page)).toContain("Cloth plans");
    await page.goto(`${appUrl}/plans/new?stamp=${FIELD}`);
    const form = page.getByRole("form", { name: "New cloth plan" });
    await expect.poll(() => live(page).getAttribute("data-state"), { timeout: 15_000 }).toBe("ready");
    expect(await page.getByTestId("plan-stampCode-chosen").textContent()).toContain("Kawung open");

    // Mori 106 cm, 200 mm stamp straight (tubruk): 5 across, 5 rows a metre, 25 impressions a metre.
    expect(await figure(page, "impressionsPerMetre")).toBe("25");
    expect(await figure(page, "group")).toContain("tubruk");
    const firstPicture = await page.getByTestId("plan-picture").innerHTML();

    let seq = await live(page).getAttribute("data-seq");
    await form.getByLabel("Arrangement").selectOption("brick");
    await nextNumbers(page, seq);
    expect(await figure(page, "group")).toContain("ondo-ende");
    expect(await page.getByTestId("plan-picture").innerHTML()).not.toBe(firstPicture);

    seq = await live(page).getAttribute("data-seq");
    const acrossBefore = await figure(page, "across");
    const perMetreBefore = await figure(page, "impressionsPerMetre");
    await form.getByLabel("Cloth width (mm)").fill("1250");
    await nextNumbers(page, seq);
    expect(await figure(page, "across")).not.toBe(acrossBefore);
    expect(await figure(page, "impressionsPerMetre")).not.toBe(perMetreBefore);

    // The fit helper: one click puts its gap into the form.
    seq = await live(page).getAttribute("data-seq");
    await page.getByTestId("fit-helper").getByRole("button", { name: /^Use this gap \(/ }).first().click();
    await nextNumbers(page, seq);
    expect(await form.getByLabel("Gap across (mm)").inputValue()).not.toBe("0");

    // A border down both selvedges from a library stamp.
    seq = await live(page).getAttribute("data-seq");
    await form.getByLabel("Border", { exact: true }).selectOption("both");
    await form.getByLabel("Border stamp", { exact: true }).fill(BORDER);
    await nextNumbers(page, seq);
    await expect.poll(() => page.getByTestId("plan-layers").locator("tr[data-layer]").evaluateAll((rows) => rows.map((r) => r.getAttribute("data-layer"))), { timeout: 15_000 }).toEqual(["field", "border-left", "border-right"]);

    const name = `${prefix} market run`;
    await form.getByLabel("Plan name").fill(name);
    await form.getByRole("button", { name: "Save the plan" }).click();
    await page.waitForURL(/\/plans\/[0-9a-f-]{36}\?saved=created$/, { timeout: 20_000 });
    const planUrl = page.url().replace(/\?.*$/, "");
    expect(await page.getByText("The plan was saved.").isVisible()).toBe(true);

    // Reopened, the planner holds what was saved.
    await page.goto(planUrl);
    const edit = page.getByRole("form", { name: "Change the cloth plan" });
    expect(await edit.getByLabel("Plan name").inputValue()).toBe(name);
    expect(await edit.getByLabel("Cloth width (mm)").inputValue()).toBe("1250");
    expect(await edit.getByLabel("Border", { exact: true }).inputValue()).toBe("both");
    await expect.poll(() => live(page).getAttribute("data-state"), { timeout: 15_000 }).toBe("ready");

    // A copy to compare with.
    await page.getByRole("button", { name: "Duplicate" }).click();
    await page.waitForURL(/\?saved=duplicated$/, { timeout: 20_000 });
    await page.goto(`${appUrl}/plans?q=${encodeURIComponent(prefix)}`);
    await expect.poll(() => page.getByTestId("plan-count").textContent(), { timeout: 15_000 }).toBe("2 plans");
    await page.getByRole("checkbox", { name: `Choose ${name} to compare` }).check();
    await page.getByRole("checkbox", { name: `Choose Copy of ${name} to compare` }).check();
    await page.getByRole("button", { name: "Compare", exact: true }).click();
    await page.waitForURL(/\/plans\/compare\?ids=/);
    expect(await page.getByTestId("compare").locator("[data-testid^=compare-]").count()).toBe(2);

    // Ask the keepers for the stamps.
    await page.goto(planUrl);
    await page.getByRole("link", { name: "Request these stamps" }).click();
    await page.waitForURL(`${planUrl}/request`);
    const request = page.getByRole("form", { name: "Request stamps" });
    expect(await request.getByRole("checkbox", { name: new RegExp(FIELD) }).isChecked()).toBe(true);
    await request.getByLabel("Workstation").fill("Stamping table 7");
    await request.getByRole("button", { name: "Send the request" }).click();
    await page.waitForURL(`${planUrl}?saved=requested`);
    expect(await page.getByTestId("plan-requests").locator("li").first().getAttribute("data-state")).toBe("open");

    // A keeper accepts it on the shelf: both stamps go out at once.
    const keeper = await signedIn("keeper");
    await keeper.goto(`${appUrl}/stamps/requests`);
    const item = keeper.getByTestId("request-queue").locator("li[data-state]", { hasText: name });
    await item.getByRole("button", { name: "Accept" }).click();
    // Answered, it leaves the queue for the list of answered requests.
    await keeper.getByTestId("answered-requests").locator("li[data-state=checked_out]", { hasText: FIELD }).waitFor({ timeout: 15_000 });
    expect(await keeper.getByTestId("request-queue").locator("li[data-state]", { hasText: name }).count()).toBe(0);
    await page.reload();
    expect(await page.getByTestId("plan-requests").locator("li").first().getAttribute("data-state")).toBe("checked_out");

    // The stamping sheet for the table.
    await page.getByRole("link", { name: "Stamping sheet" }).click();
    await page.waitForURL(`${planUrl}/sheet`);
    const sheet = page.getByTestId("stamping-sheet");
    expect(await sheet.getAttribute("data-paper")).toBe("a4");
    const stamps = await page.getByTestId("sheet-stamps").textContent();
    expect(stamps).toContain(FIELD);
    expect(stamps).toContain(BORDER);
    expect(await page.locator("svg[data-face=front] text").count()).toBeGreaterThan(10);
    await page.getByRole("link", { name: "Letter" }).click();
    await expect.poll(() => sheet.getAttribute("data-paper")).toBe("letter");
  });
});

describe("a designer", () => {
  it("reads plans but sees no edit actions", async () => {
    const { appUrl } = testEnv();
    const planner = await createUser("planner");
    const session = (await signIn(planner.email, planner.password))!;
    const saved = await api("POST", "/api/v1/plans", {
      session,
      body: { name: `${prefix} for reading`, layout: { cloth: { widthMm: 1150, lengthMm: 20_000 }, stamp: { code: FIELD }, arrangement: "half-drop" } },
    });
    expect(saved.status).toBe(201);
    const page = await signedIn("designer");
    await page.goto(`${appUrl}/plans?q=${encodeURIComponent(`${prefix} for reading`)}`);
    await expect.poll(() => page.getByTestId("plan-count").textContent(), { timeout: 15_000 }).toBe("1 plan");
    expect(await page.getByRole("link", { name: "New plan" }).count()).toBe(0);
    await page.getByRole("link", { name: `${prefix} for reading` }).click();
    await page.waitForURL(`${appUrl}/plans/${saved.body.plan.id}`);
    expect(await page.getByText("You can read this plan").isVisible()).toBe(true);
    await expect.poll(() => live(page).getAttribute("data-state"), { timeout: 15_000 }).toBe("ready");
    for (const button of ["Save changes", "Duplicate", "Delete", "Use this gap"]) expect(await page.getByRole("button", { name: button }).count(), button).toBe(0);
    expect(await page.getByLabel("Arrangement").isDisabled()).toBe(true);
    // Reading is allowed: the sheet and asking for the stamps.
    expect(await page.getByRole("link", { name: "Stamping sheet" }).count()).toBe(1);
    await page.goto(`${appUrl}/plans/new`);
    expect(await page.getByText("Not for your role").isVisible()).toBe(true);
  });
});
