import type { Browser } from "playwright-core";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mirrorSvg, motifSvg, renderScan } from "@/scripts/seed/scan-art";
import { launchBrowser, signInThroughPage } from "../helpers/browser";
import { createUser } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { expectMessageBeside } from "../helpers/forms";
import { api, signIn, type Session } from "../helpers/http";
import { uploadScan } from "../helpers/scan-upload";
import { createStampRow, uniquePrefix } from "../helpers/stamps";

// The motif archive in the browser: a designer finds a motif by tag, opens it, sees its stamps, colourways and
// past plans, follows "start a plan" with the right address, and finds the back-face twin by dropping a
// mirrored copy of a scan; the motif form with valid and invalid input.
let browser: Browser;
let keeper: Session;
const prefix = uniquePrefix("E2M");
const tag = `e2e${prefix.toLowerCase().replace(/[^a-z0-9]/g, "")}`;
const size = { widthMm: 200, heightMm: 200 };
const art = motifSvg({ seed: 424_242, ...size, style: "print", family: "vine" });
const codes = { main: `${prefix}-MAIN`, twin: `${prefix}-BACK`, border: `${prefix}-BORD` };
let motifId: string;

beforeAll(async () => {
  browser = await launchBrowser();
  const k = await createUser("keeper");
  keeper = (await signIn(k.email, k.password))!;
  await createStampRow({ code: codes.main, name: "Vine main", ...size, face: "pair" });
  await createStampRow({ code: codes.twin, name: "Vine back", ...size, face: "pair", mirrored: true });
  await createStampRow({ code: codes.border, name: "Vine border", widthMm: 300, heightMm: 80 });
  await uploadScan(keeper, codes.main, await renderScan(art, 100));
  await uploadScan(keeper, codes.twin, await renderScan(mirrorSvg(art, size.widthMm), 100));
  const made = await api("POST", "/api/v1/motifs", {
    session: keeper,
    body: {
      name: `${prefix} Climbing vine`,
      tags: [tag, "floral"],
      designer: "Invented Designer",
      stamps: [
        { code: codes.main, role: "main" },
        { code: codes.twin, role: "reverse_twin" },
        { code: codes.border, role: "border" },
      ],
      colourways: [{ name: "Brown and indigo", colours: [{ name: "Undyed", swatch: "#f4efe6", waxStamps: [codes.main], face: "both" }, { name: "Indigo", swatch: "#1f3a5f" }] }],
    },
  });
  expect(made.status).toBe(201);
  motifId = made.body.motif.id;
});
afterAll(async () => {
  await browser?.close();
});

describe("a designer in the motif archive", () => {
  it("searches by tag, opens the motif, sees stamps, colourways and past plans, and starts a plan from it", async () => {
    const { appUrl } = testEnv();
    const designer = await createUser("designer");
    const page = await browser.newPage();
    await signInThroughPage(page, designer.email, designer.password);
    await page.goto(`${appUrl}/motifs`);
    await page.getByLabel("Tag", { exact: true }).fill(tag);
    await page.getByRole("button", { name: "Search", exact: true }).click();
    await page.waitForURL(/tag=/);
    const cards = page.getByTestId("motif-card");
    await expect(cards.count()).resolves.toBe(1);
    await cards.first().click();
    await page.waitForURL(new RegExp(`/motifs/${motifId}$`));
    const stampsText = await page.getByTestId("motif-stamps").textContent();
    for (const code of Object.values(codes)) expect(stampsText).toContain(code);
    expect(stampsText).toContain("reverse twin");
    expect(await page.getByTestId("motif-colourways").textContent()).toContain("Brown and indigo");
    expect(await page.getByTestId("motif-plans").textContent()).toContain("No plan has used this motif yet.");
    const href = await page.getByTestId("start-plan").getAttribute("href");
    const url = new URL(href!, appUrl);
    expect(url.pathname).toBe("/plans/new");
    expect(Object.fromEntries(url.searchParams)).toEqual({ stamp: codes.main, borderStamp: codes.border, motif: motifId });
    await page.close();
  });

  it("drops a mirrored copy of a scan on the picture search and sees the twin first", async () => {
    const { appUrl } = testEnv();
    const designer = await createUser("designer");
    const page = await browser.newPage();
    await signInThroughPage(page, designer.email, designer.password);
    await page.goto(`${appUrl}/motifs/search`);
    await page.locator('input[type="file"]').waitFor({ state: "attached" });
    await page.waitForFunction(() => !!document.querySelector('[data-testid="picture-drop"]'));
    const mirrored = await sharp(await renderScan(art, 90, { format: "jpeg" })).flop().jpeg().toBuffer();
    const dataTransfer = await page.evaluateHandle((base64) => {
      const bytes = Uint8Array.from(atob(base64), (c) => c.charCodeAt(0));
      const transfer = new DataTransfer();
      transfer.items.add(new File([bytes], "old-cloth.jpg", { type: "image/jpeg" }));
      return transfer;
    }, mirrored.toString("base64"));
    await page.dispatchEvent('[data-testid="picture-drop"]', "drop", { dataTransfer });
    await page.getByTestId("picture-matches").waitFor({ timeout: 30_000 });
    const first = page.getByTestId("match-code").first();
    expect(await first.textContent()).toBe(codes.twin);
    const all = await page.getByTestId("match-code").allTextContents();
    expect(all).toContain(codes.main);
    await page.close();
  });
});

describe("the stamp shelf in pictures", () => {
  it("shows the table's filtered stamps as cards with their scans", async () => {
    const { appUrl } = testEnv();
    const designer = await createUser("designer");
    const page = await browser.newPage();
    await signInThroughPage(page, designer.email, designer.password);
    await page.goto(`${appUrl}/stamps/pictures?q=${encodeURIComponent(prefix)}`);
    const cards = page.getByTestId("stamp-pictures").locator("li");
    await expect(cards.count()).resolves.toBe(3);
    const text = await page.getByTestId("stamp-pictures").textContent();
    for (const code of Object.values(codes)) expect(text).toContain(code);
    await expect(page.getByTestId("stamp-pictures").locator("img").count()).resolves.toBe(2);
    await page.close();
  });

  it("has the table's filters: typing a search and choosing a condition change the cards shown, and the address keeps them", async () => {
    const { appUrl } = testEnv();
    const designer = await createUser("designer");
    const page = await browser.newPage();
    await signInThroughPage(page, designer.email, designer.password);
    await page.goto(`${appUrl}/stamps/pictures`);
    const cards = page.getByTestId("stamp-pictures").locator("li");
    const search = page.getByRole("search").getByLabel("Search", { exact: true });
    await search.fill(prefix);
    await page.waitForURL(new RegExp(`[?&]q=${encodeURIComponent(prefix)}`));
    await expect.poll(() => cards.count(), { timeout: 15_000 }).toBe(3);
    await search.fill(codes.border);
    await expect.poll(() => cards.count(), { timeout: 15_000 }).toBe(1);
    expect(await page.getByTestId("stamp-pictures").textContent()).toContain(codes.border);
    // Every test stamp is sound: asking for retired ones leaves no card, and says so.
    await page.getByRole("search").locator("summary", { hasText: "Condition" }).click();
    await page.getByRole("search").getByLabel("Retired", { exact: true }).check();
    await page.getByTestId("stamp-pictures-empty").waitFor();
    expect(page.url()).toMatch(/condition=retired/);
    await page.reload();
    await page.getByTestId("stamp-pictures-empty").waitFor();
    await page.close();
  });
});

describe("the motif form", () => {
  it("adds a motif from valid input and shows it", async () => {
    const { appUrl } = testEnv();
    const designer = await createUser("designer");
    const page = await browser.newPage();
    await signInThroughPage(page, designer.email, designer.password);
    await page.goto(`${appUrl}/motifs/new`);
    await page.getByLabel("Name", { exact: true }).fill(`${prefix} Form motif`);
    await page.getByLabel("Tags").fill("geometric, stars");
    await page.getByLabel("Stamp set").fill(`${codes.border} border`);
    // One colour a line under its colourway's name; the word bleach marks a colour reached by bleaching.
    await page.getByLabel("Colourways").fill("Night:\nUndyed #f4efe6 [both]\nIndigo #1f3a5f\nPale blue #9fb8d0 [bleach]");
    await page.getByRole("button", { name: "Add motif" }).click();
    await page.waitForURL(/\/motifs\/[0-9a-f-]{36}\?saved=created/);
    await page.getByText("Motif added.").waitFor();
    const colourways = await page.getByTestId("motif-colourways").textContent();
    for (const word of ["Night", "Undyed", "Indigo"]) expect(colourways).toContain(word);
    expect(colourways).toMatch(/Pale blue.*reached by bleaching: the run bleaches, no dye bath/);
    expect(colourways?.match(/reached by bleaching/g)).toHaveLength(1);
    // The edit form writes the flag back.
    await page.goto(`${page.url().replace(/\?.*$/, "")}/edit`);
    expect(await page.getByLabel("Colourways").inputValue()).toBe("Night:\nUndyed #f4efe6 [both]\nIndigo #1f3a5f\nPale blue #9fb8d0 [front bleach]");
    await page.close();
  });

  it("shows the message beside the field for a missing name and an unknown stamp, keeping what was typed", async () => {
    const { appUrl } = testEnv();
    const designer = await createUser("designer");
    const page = await browser.newPage();
    await signInThroughPage(page, designer.email, designer.password);
    await page.goto(`${appUrl}/motifs/new`);
    await page.getByLabel("Tags").fill("kept, typed");
    await page.getByRole("button", { name: "Add motif" }).click();
    await expectMessageBeside(page.getByLabel("Name", { exact: true }), /Required/);
    expect(await page.getByLabel("Tags").inputValue()).toBe("kept, typed");
    await page.getByLabel("Name", { exact: true }).fill(`${prefix} Unknown stamp`);
    await page.getByLabel("Stamp set").fill(`${prefix}-NOPE main`);
    await page.getByRole("button", { name: "Add motif" }).click();
    await expectMessageBeside(page.getByLabel("Stamp set"), /stamp/i);
    await page.close();
  });
});
