import type { Browser } from "playwright-core";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, signInThroughPage } from "../helpers/browser";
import { createUser } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { expectMessageBeside } from "../helpers/forms";
import { api, signIn, type Session } from "../helpers/http";
import { createStampRow, uniquePrefix } from "../helpers/stamps";

// A designer asks for a new stamp from a motif; a keeper sees it in the queue and records the stamp that arrived,
// which then stands in the motif's set. Both forms with valid and invalid input.
let browser: Browser;
let keeperSession: Session;
let keeper: { email: string; password: string };
const prefix = uniquePrefix("E2N");
let motifId: string;

beforeAll(async () => {
  browser = await launchBrowser();
  keeper = await createUser("keeper");
  keeperSession = (await signIn(keeper.email, keeper.password))!;
  await createStampRow({ code: `${prefix}-MAIN`, name: "Leaf main", widthMm: 160, heightMm: 160 });
  const made = await api("POST", "/api/v1/motifs", { session: keeperSession, body: { name: `${prefix} Falling leaves`, stamps: [{ code: `${prefix}-MAIN`, role: "main" }] } });
  expect(made.status).toBe(201);
  motifId = made.body.motif.id;
});

afterAll(async () => {
  await browser?.close();
});

describe("new-stamp requests in the browser", () => {
  it("a designer asks for a border stamp from the motif; a keeper records it and the motif's set shows it", async () => {
    const { appUrl } = testEnv();
    const designer = await createUser("designer");
    const note = `${prefix} leaf border, please`;
    const page = await browser.newPage();
    await signInThroughPage(page, designer.email, designer.password);
    await page.goto(`${appUrl}/motifs/${motifId}`);
    await page.getByTestId("request-stamp").click();
    await page.waitForURL(/\/request-stamp$/);
    await page.getByLabel("Width (mm)").fill("300.5");
    await page.getByLabel("Height (mm)").fill("80");
    await page.getByLabel("Role in the set").selectOption("border");
    await page.getByLabel("Note for the maker").fill(note);
    await page.getByRole("button", { name: "Send the request" }).click();
    await page.getByText("Request sent").waitFor();
    await page.close();

    const keeperPage = await browser.newPage();
    await signInThroughPage(keeperPage, keeper.email, keeper.password);
    await keeperPage.goto(`${appUrl}/stamps/requests`);
    const item = keeperPage.locator('li[data-testid^="new-stamp-"]', { hasText: note });
    expect(await item.textContent()).toContain(`${prefix} Falling leaves`);
    await item.getByTestId("make-stamp").click();
    await keeperPage.waitForURL(/\/stamps\/requests\/[0-9a-f-]{36}\/stamp$/);
    await keeperPage.getByLabel("Code", { exact: true }).fill(`${prefix}-BORD`);
    await keeperPage.getByRole("button", { name: "Add the stamp" }).click();
    await keeperPage.waitForURL(new RegExp(`/motifs/${motifId}\\?saved=stampMade`));
    await keeperPage.getByText("recorded and in the set").waitFor();
    expect(await keeperPage.getByTestId("motif-stamps").textContent()).toContain(`${prefix}-BORD`);
    await keeperPage.close();
  });

  it("a request filed with a sketch shows the sketch's thumbnail in the keepers' queue", async () => {
    const { appUrl } = testEnv();
    const designer = await createUser("designer");
    const note = `${prefix} corner with a sketch`;
    const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="300" height="200"><rect width="300" height="200" fill="#f6f1e7"/><circle cx="150" cy="100" r="70" fill="none" stroke="#3b2a1a" stroke-width="12"/></svg>`;
    const png = await sharp(Buffer.from(svg)).png().toBuffer();
    const page = await browser.newPage();
    await signInThroughPage(page, designer.email, designer.password);
    await page.goto(`${appUrl}/motifs/${motifId}/request-stamp`);
    await page.getByLabel("Width (mm)").fill("90");
    await page.getByLabel("Height (mm)").fill("90");
    await page.getByLabel("Role in the set").selectOption("corner");
    await page.getByLabel("Note for the maker").fill(note);
    await page.getByLabel("Sketch (optional)").setInputFiles({ name: "corner-sketch.png", mimeType: "image/png", buffer: png });
    await page.getByRole("button", { name: "Send the request" }).click();
    await page.getByText("Request sent").waitFor();
    await page.close();

    const keeperPage = await browser.newPage();
    await signInThroughPage(keeperPage, keeper.email, keeper.password);
    await keeperPage.goto(`${appUrl}/stamps/requests`);
    const item = keeperPage.locator('li[data-testid^="new-stamp-"]', { hasText: note });
    const thumb = item.getByRole("img", { name: "Sketch of the stamp asked for" });
    await thumb.waitFor();
    // Thumbnails load lazily: with a long queue this one may start below the fold.
    await thumb.scrollIntoViewIfNeeded();
    // The thumbnail really loaded from the API (a WebP of the 300 × 200 sketch, long side at most 512 px).
    await expect.poll(() => thumb.evaluate((img: HTMLImageElement) => (img.complete ? img.naturalWidth : 0)), { timeout: 15_000 }).toBe(300);
    await keeperPage.close();
  });

  it("refuses a file that is not a picture beside the sketch field, and files nothing", async () => {
    const { appUrl } = testEnv();
    const designer = await createUser("designer");
    const note = `${prefix} sketch that is no picture`;
    const page = await browser.newPage();
    await signInThroughPage(page, designer.email, designer.password);
    await page.goto(`${appUrl}/motifs/${motifId}/request-stamp`);
    await page.getByLabel("Width (mm)").fill("90");
    await page.getByLabel("Height (mm)").fill("90");
    await page.getByLabel("Note for the maker").fill(note);
    await page.getByLabel("Sketch (optional)").setInputFiles({ name: "sketch.png", mimeType: "image/png", buffer: Buffer.from("these are words, not a picture\n") });
    await page.getByRole("button", { name: "Send the request" }).click();
    await expectMessageBeside(page.getByLabel("Sketch (optional)"), /not a picture|image/i);
    expect(await page.getByLabel("Note for the maker").inputValue()).toBe(note);
    await page.close();
    const listed = await api("GET", "/api/v1/new-stamp-requests", { session: keeperSession });
    expect(listed.body.requests.some((r: { note: string | null }) => r.note === note)).toBe(false);
  });

  it("a designer who works in inches asks in inches; the request is kept in mm and the queue shows inches to an imperial keeper", async () => {
    const { appUrl } = testEnv();
    const designer = await createUser("designer", undefined, { unitSystem: "imperial" });
    const note = `${prefix} inch-sized corner`;
    const page = await browser.newPage();
    await signInThroughPage(page, designer.email, designer.password);
    await page.goto(`${appUrl}/motifs/${motifId}/request-stamp`);
    await page.getByLabel("Width (in)").fill("4");
    await page.getByLabel("Height (in)").fill("2.5");
    await page.getByLabel("Role in the set").selectOption("corner");
    await page.getByLabel("Note for the maker").fill(note);
    await page.getByRole("button", { name: "Send the request" }).click();
    await page.getByText("Request sent").waitFor();
    await page.close();

    const listed = await api("GET", "/api/v1/new-stamp-requests", { session: keeperSession });
    const made = listed.body.requests.find((r: { note: string | null }) => r.note === note);
    // 1 in = 25.4 mm exactly (NIST SP 811, appendix B): 4 in = 101.6 mm, 2.5 in = 63.5 mm
    expect(made.widthMm).toBeCloseTo(101.6, 6);
    expect(made.heightMm).toBeCloseTo(63.5, 6);

    const imperialKeeper = await createUser("keeper", undefined, { unitSystem: "imperial" });
    const keeperPage = await browser.newPage();
    await signInThroughPage(keeperPage, imperialKeeper.email, imperialKeeper.password);
    await keeperPage.goto(`${appUrl}/stamps/requests`);
    const item = keeperPage.locator('li[data-testid^="new-stamp-"]', { hasText: note });
    expect(await item.textContent()).toMatch(/4\s*×\s*2\.5\s*in/);
    await keeperPage.close();
  });

  it("refuses an inch size written wrongly beside the field, keeping what was typed", async () => {
    const { appUrl } = testEnv();
    const designer = await createUser("designer", undefined, { unitSystem: "imperial" });
    const page = await browser.newPage();
    await signInThroughPage(page, designer.email, designer.password);
    await page.goto(`${appUrl}/motifs/${motifId}/request-stamp`);
    await page.getByLabel("Width (in)").fill("four");
    await page.getByLabel("Height (in)").fill("2.5");
    await page.getByRole("button", { name: "Send the request" }).click();
    await expectMessageBeside(page.getByLabel("Width (in)"), /./);
    expect(await page.getByLabel("Width (in)").inputValue()).toBe("four");
    await page.close();
  });

  it("shows the message beside the size for a request without one, keeping the note; and beside the code of a stamp without one", async () => {
    const { appUrl } = testEnv();
    const designer = await createUser("designer");
    const page = await browser.newPage();
    await signInThroughPage(page, designer.email, designer.password);
    await page.goto(`${appUrl}/motifs/${motifId}/request-stamp`);
    await page.getByLabel("Height (mm)").fill("80");
    await page.getByLabel("Note for the maker").fill("kept note");
    await page.getByRole("button", { name: "Send the request" }).click();
    await expectMessageBeside(page.getByLabel("Width (mm)"), /./);
    expect(await page.getByLabel("Note for the maker").inputValue()).toBe("kept note");
    await page.close();

    const request = await api("POST", "/api/v1/new-stamp-requests", { session: keeperSession, body: { widthMm: 90, heightMm: 90, motifId, role: "corner" } });
    const keeperPage = await browser.newPage();
    await signInThroughPage(keeperPage, keeper.email, keeper.password);
    await keeperPage.goto(`${appUrl}/stamps/requests/${request.body.request.id}/stamp`);
    await keeperPage.getByLabel("Code", { exact: true }).fill("not a code!");
    await keeperPage.getByRole("button", { name: "Add the stamp" }).click();
    await expectMessageBeside(keeperPage.getByLabel("Code", { exact: true }), /letters, digits/);
    await keeperPage.close();
  });
});
