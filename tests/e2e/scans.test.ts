import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, signInThroughPage } from "../helpers/browser";
import { createUser } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { expectMessageBeside } from "../helpers/forms";
import { api, signIn } from "../helpers/http";
import { shapeScan } from "../helpers/scan-images";
import { createStampRow, reloadStamp, uniquePrefix } from "../helpers/stamps";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("a stamp keeper with a scan", () => {
  it("uploads a wax print, sees the progress bar and the thumbnail, saves the coverage, and the layout engine uses it", async () => {
    const { appUrl } = testEnv();
    const code = `${uniquePrefix("E2S")}-1`;
    await createStampRow({ code, name: "Disc test stamp", widthMm: 100, heightMm: 100 });
    const keeper = await createUser("keeper");
    const context = await browser.newContext();
    const page = await context.newPage();
    await signInThroughPage(page, keeper.email, keeper.password);
    await page.goto(`${appUrl}/stamps/${code}`);
    await expect(page.getByTestId("scans-empty").textContent()).resolves.toContain("No scans yet");

    // A 100 mm wax print at 254 DPI: a dark disc of radius 30 mm, so about π·30²/100² = 28.3 % wax (πr²).
    const { png } = await shapeScan({ dpi: 254, sideMm: 100, body: `<circle cx="50" cy="50" r="30"/>`, ink: "#1c1917", ground: "#ffffff" });
    // The picker is enabled once the page has hydrated; a file set before that would be lost.
    await page.locator('[data-testid="scan-file-input"]:not([disabled])').waitFor({ state: "attached" });
    await page.getByTestId("scan-file-input").setInputFiles({ name: "disc-print.png", mimeType: "image/png", buffer: png });

    const bar = page.getByRole("progressbar", { name: "Upload of disc-print.png" });
    await bar.waitFor();
    await page.locator('[data-testid="upload-queue"] li[data-status="done"]').waitFor({ timeout: 30_000 });
    expect(await bar.getAttribute("aria-valuenow")).toBe("100");

    const thumb = page.getByTestId("scan-thumb").first();
    await thumb.waitFor();
    await page.waitForFunction(() => {
      const img = document.querySelector<HTMLImageElement>('[data-testid="scan-thumb"]');
      return !!img && img.complete && img.naturalWidth > 0;
    });
    expect(await page.getByTestId("size-check").first().textContent()).toContain("Matches the record");

    await page.getByTestId("review-coverage").first().click();
    const review = page.getByTestId("coverage-review");
    await review.waitFor();
    await page.waitForFunction(() => /%/.test(document.querySelector('[data-testid="coverage-ratio"]')?.textContent ?? ""));
    const shown = (await page.getByTestId("coverage-ratio").textContent())!;
    const shownPct = Number(shown.replace(/[^\d.]/g, ""));
    expect(shownPct).toBeGreaterThan(27.3);
    expect(shownPct).toBeLessThan(29.3);
    await page.waitForFunction(() => {
      const img = document.querySelector<HTMLImageElement>('[data-testid="coverage-overlay"]');
      return !!img && img.complete && img.naturalWidth > 0;
    });

    await page.getByTestId("save-coverage").click();
    await review.getByText("Saved: the stamp's coverage is now").waitFor();
    const stamp = (await reloadStamp(code))!;
    expect(stamp.coverageRatio).not.toBeNull();
    expect(stamp.coverageRatio! * 100).toBeCloseTo(shownPct, 0);

    // 1000 mm band, 100 mm stamp: 10 × 10 impressions per metre of 0.01 m² each, × coverage (hand-worked).
    const session = (await signIn(keeper.email, keeper.password))!;
    const layout = await api("POST", "/api/v1/layout", {
      session,
      body: { cloth: { widthMm: 1000, lengthMm: 10_000, margins: { leftMm: 0, rightMm: 0 } }, stamp: { code }, gap: { xMm: 0, yMm: 0 }, arrangement: "straight", align: "left", edges: "whole" },
    });
    expect(layout.status, JSON.stringify(layout.body)).toBe(200);
    expect(layout.body.waxedAreaPerMetreM2).toBeCloseTo(stamp.coverageRatio!, 4);
    await context.close();
  });
});

describe("a stamp with an outline", () => {
  it("the coverage review says the layout engine uses the outline, before and after saving", async () => {
    const { appUrl } = testEnv();
    const code = `${uniquePrefix("E2O")}-1`;
    await createStampRow({ code, name: "Outlined disc", widthMm: 100, heightMm: 100, outlinePath: "M20 50 A30 30 0 1 0 80 50 A30 30 0 1 0 20 50 Z" });
    const keeper = await createUser("keeper");
    const context = await browser.newContext();
    const page = await context.newPage();
    await signInThroughPage(page, keeper.email, keeper.password);
    await page.goto(`${appUrl}/stamps/${code}`);
    const { png } = await shapeScan({ dpi: 254, sideMm: 100, body: `<circle cx="50" cy="50" r="30"/>`, ink: "#1c1917", ground: "#ffffff" });
    await page.locator('[data-testid="scan-file-input"]:not([disabled])').waitFor({ state: "attached" });
    await page.getByTestId("scan-file-input").setInputFiles({ name: "outlined-print.png", mimeType: "image/png", buffer: png });
    await page.locator('[data-testid="upload-queue"] li[data-status="done"]').waitFor({ timeout: 30_000 });
    await page.getByTestId("review-coverage").first().click();
    expect(await page.getByTestId("engine-uses").textContent()).toContain("takes the waxed area from the outline");
    await page.waitForFunction(() => /%/.test(document.querySelector('[data-testid="coverage-ratio"]')?.textContent ?? ""));
    await page.getByTestId("save-coverage").click();
    await page.getByTestId("coverage-review").getByText("The layout engine still uses the stamp's outline, not this coverage").waitFor();
    expect(await page.getByTestId("coverage-review").textContent()).not.toContain("The layout engine uses it for this stamp");
    await context.close();
  });
});

describe("the scan uploader", () => {
  it("refuses a resolution out of range beside its field and a file that is no image; a stored scan is deleted after asking", async () => {
    const { appUrl } = testEnv();
    const code = `${uniquePrefix("E2U")}-1`;
    await createStampRow({ code, widthMm: 100, heightMm: 100 });
    const keeper = await createUser("keeper");
    const context = await browser.newContext();
    const page = await context.newPage();
    await signInThroughPage(page, keeper.email, keeper.password);
    await page.goto(`${appUrl}/stamps/${code}`);
    const dpi = page.getByLabel("Resolution (DPI)");
    await dpi.fill("5");
    await expectMessageBeside(dpi, /between 10 and 20000 DPI/);
    expect(await page.getByTestId("scan-file-input").isDisabled()).toBe(true);
    await dpi.fill("");

    await page.locator('[data-testid="scan-file-input"]:not([disabled])').waitFor({ state: "attached" });
    await page.getByTestId("scan-file-input").setInputFiles({ name: "notes.png", mimeType: "image/png", buffer: Buffer.from("these are notes, not a scan\n".repeat(20)) });
    await page.locator('[data-testid="upload-queue"] li[data-status="failed"]').waitFor({ timeout: 30_000 });
    expect(await page.getByTestId("upload-queue").textContent()).toMatch(/not an image/);

    const { png } = await shapeScan({ dpi: 254, sideMm: 100, body: `<rect x="20" y="20" width="60" height="40"/>`, ink: "#1c1917", ground: "#ffffff" });
    await page.getByTestId("scan-file-input").setInputFiles({ name: "bar-print.png", mimeType: "image/png", buffer: png });
    await page.getByTestId("scan-card").waitFor({ timeout: 30_000 });
    page.once("dialog", (dialog) => void dialog.accept());
    await page.getByTestId("delete-scan").click();
    await page.getByTestId("scans-empty").waitFor();
    await context.close();
  });
});

