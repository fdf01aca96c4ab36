import sharp from "sharp";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createUser } from "../helpers/db";
import { launchBrowser, signInThroughPage } from "../helpers/browser";
import { testEnv } from "../helpers/env";
import { expectMessageBeside } from "../helpers/forms";
import { api, signIn, type Session } from "../helpers/http";
import { createStampRow, uniquePrefix } from "../helpers/stamps";

// Every form of the cloth plans: valid input shows the result, invalid input the message beside the field.

let browser: Browser;
let plannerSession: Session;
let planId: string;
const prefix = uniquePrefix("PF");
const FIELD = `${prefix}-F`;

beforeAll(async () => {
  browser = await launchBrowser();
  await createStampRow({ code: FIELD, name: "Truntum star", widthMm: 200, heightMm: 200 });
  const planner = await createUser("planner");
  plannerSession = (await signIn(planner.email, planner.password))!;
  const saved = await api("POST", "/api/v1/plans", {
    session: plannerSession,
    body: { name: `${prefix} forms`, layout: { cloth: { widthMm: 1060, lengthMm: 10_000 }, stamp: { code: FIELD }, arrangement: "straight", gap: { xMm: 3, yMm: 0 } } },
  });
  planId = saved.body.plan.id;
});
afterAll(async () => {
  await browser?.close();
});

async function signedIn(role: "planner" | "keeper" | "admin"): Promise<Page> {
  const user = await createUser(role);
  const page = await (await browser.newContext()).newPage();
  await signInThroughPage(page, user.email, user.password);
  return page;
}

describe("the planner form", () => {
  it("refuses a plan without a name and a width that is not a number, beside each field, keeping what was typed", async () => {
    const page = await signedIn("planner");
    await page.goto(`${testEnv().appUrl}/plans/new?stamp=${FIELD}`);
    const form = page.getByRole("form", { name: "New cloth plan" });
    await expect.poll(() => page.getByTestId("plan-live").getAttribute("data-state"), { timeout: 15_000 }).toBe("ready");
    await form.getByLabel("Cloth width (mm)").fill("wide");
    await form.getByLabel("Notes").fill("kept after the refusal");
    await form.getByRole("button", { name: "Save the plan" }).click();
    await expectMessageBeside(form.getByLabel("Plan name"), /Required/);
    await expectMessageBeside(form.getByLabel("Cloth width (mm)"), /number/i);
    expect(await form.getByLabel("Notes").inputValue()).toBe("kept after the refusal");
  });

  it("a stale version is refused with a clear message", async () => {
    const page = await signedIn("planner");
    await page.goto(`${testEnv().appUrl}/plans/${planId}`);
    const form = page.getByRole("form", { name: "Change the cloth plan" });
    const current = (await api("GET", `/api/v1/plans/${planId}`, { session: plannerSession })).body.plan;
    await api("PATCH", `/api/v1/plans/${planId}`, { session: plannerSession, body: { version: current.version, notes: "changed elsewhere" } });
    await form.getByLabel("Plan name").fill(`${prefix} forms renamed`);
    await form.getByRole("button", { name: "Save changes" }).click();
    await expect.poll(() => form.getByText(/Someone else saved a change/).isVisible().catch(() => false), { timeout: 15_000 }).toBe(true);
    expect(await form.getByLabel("Plan name").inputValue()).toBe(`${prefix} forms renamed`);
  });
});

describe("the new-stamp request from the fit helper", () => {
  it("sends a valid size and refuses a width of 0 beside the field", async () => {
    const page = await signedIn("planner");
    await page.goto(`${testEnv().appUrl}/plans/${planId}`);
    await expect.poll(() => page.getByTestId("plan-live").getAttribute("data-state"), { timeout: 15_000 }).toBe("ready");
    await page.getByTestId("fit-helper").getByRole("button", { name: /^Ask for this stamp \(/ }).first().click();
    const dialog = page.getByRole("dialog");
    await dialog.getByLabel("Width (mm)").fill("0");
    await dialog.getByRole("button", { name: "Send the request" }).click();
    await expectMessageBeside(dialog.getByLabel("Width (mm)"), /at least|small/i);
    await dialog.getByLabel("Width (mm)").fill("212");
    await dialog.getByLabel("Note for the keepers").fill("For the wider mori");
    // A sketch that is no picture stands beside the file field; a real one goes with the request.
    await dialog.getByLabel("Sketch (optional)").setInputFiles({ name: "sketch.png", mimeType: "image/png", buffer: Buffer.from("words, not a picture\n") });
    await dialog.getByRole("button", { name: "Send the request" }).click();
    await expectMessageBeside(dialog.getByLabel("Sketch (optional)"), /not an image/);
    const png = await sharp({ create: { width: 160, height: 120, channels: 3, background: "#3b2a1a" } }).png().toBuffer();
    await dialog.getByLabel("Sketch (optional)").setInputFiles({ name: "sketch.png", mimeType: "image/png", buffer: png });
    await dialog.getByRole("button", { name: "Send the request" }).click();
    await expect.poll(() => dialog.getByText("The request went to the stamp keepers.").isVisible().catch(() => false), { timeout: 15_000 }).toBe(true);
    const listed = (await api("GET", "/api/v1/new-stamp-requests", { session: plannerSession })).body.requests as { note: string | null; sketch: { contentType: string } | null }[];
    expect(listed.find((r) => r.note === "For the wider mori")?.sketch?.contentType).toBe("image/png");
  });
});

describe("the stamp request form", () => {
  it("refuses a last day before the first beside the field, then sends", async () => {
    const page = await signedIn("planner");
    const { appUrl } = testEnv();
    await page.goto(`${appUrl}/plans/${planId}/request`);
    const form = page.getByRole("form", { name: "Request stamps" });
    await form.getByLabel("Workstation").fill("Table 2");
    const from = await form.getByLabel("From").inputValue();
    const dayBefore = new Date(Date.parse(`${from}T12:00:00Z`) - 86_400_000).toISOString().slice(0, 10);
    await form.getByLabel("Until").fill(dayBefore);
    await form.getByRole("button", { name: "Send the request" }).click();
    await expectMessageBeside(form.getByLabel("Until"), /cannot be before/);
    expect(await form.getByLabel("Workstation").inputValue()).toBe("Table 2");
    await form.getByLabel("Until").fill(from);
    await form.getByRole("button", { name: "Send the request" }).click();
    await page.waitForURL(`${appUrl}/plans/${planId}?saved=requested`);
  });
});

describe("the keepers' decline form", () => {
  it("needs a reason beside the field, then declines", async () => {
    const ask = await api("POST", "/api/v1/stamp-requests", {
      session: plannerSession,
      body: { stampCodes: [FIELD], forWhom: `${prefix} stamper`, workstation: "Table 9", fromOn: new Intl.DateTimeFormat("en-CA", { timeZone: "Asia/Jakarta" }).format(new Date()), untilOn: "2099-01-01" },
    });
    expect(ask.status).toBe(201);
    const page = await signedIn("keeper");
    await page.goto(`${testEnv().appUrl}/stamps/requests`);
    const item = page.getByTestId(`request-${ask.body.request.id}`);
    await item.getByRole("button", { name: "Decline…" }).click();
    const form = item.getByRole("form", { name: "Decline the request" });
    await form.getByRole("button", { name: "Decline", exact: true }).click();
    await expectMessageBeside(form.getByLabel("Reason"), /Required/);
    await form.getByLabel("Reason").fill("Out for repair this week");
    await form.getByRole("button", { name: "Decline", exact: true }).click();
    await page.getByTestId("answered-requests").locator("li[data-state=declined]", { hasText: "Out for repair this week" }).waitFor({ timeout: 15_000 });
  });
});

describe("the planning settings", () => {
  it("refuses a stamping rate of 0 beside the field, then saves a new cloth and rate", async () => {
    const page = await signedIn("admin");
    await page.goto(`${testEnv().appUrl}/admin/settings`);
    const form = page.getByRole("form", { name: "Workshop settings" });
    await form.getByLabel("Stamping rate (impressions per hour, one face)").fill("0");
    await form.getByRole("button", { name: "Save settings" }).click();
    await expectMessageBeside(form.getByLabel("Stamping rate (impressions per hour, one face)"), /at least|small/i);
    const rows = form.getByRole("group", { name: /^Cloth \d+$/ });
    const last = rows.last();
    await last.getByLabel("Name").fill(`${prefix} cotton`);
    await last.getByLabel("Width (mm)").fill("1120");
    await form.getByLabel("Stamping rate (impressions per hour, one face)").fill("26");
    await form.getByRole("button", { name: "Save settings" }).click();
    await expect.poll(() => form.getByText(/Saved\./).isVisible().catch(() => false), { timeout: 15_000 }).toBe(true);
    const admin = (await signIn((await createUser("admin")).email, "correct horse battery"))!;
    const settings = await api("GET", "/api/v1/settings", { session: admin });
    expect(settings.body.settings.clothPresets.map((p: { name: string }) => p.name)).toContain(`${prefix} cotton`);
    // Put the presets back as they were.
    const presets = settings.body.settings.clothPresets.filter((p: { name: string }) => p.name !== `${prefix} cotton`);
    expect((await api("PATCH", "/api/v1/settings", { session: admin, body: { version: settings.body.version, clothPresets: presets } })).status).toBe(200);
  });
});
