import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { shelfUrl } from "@/lib/stamps/codes";
import { createUser } from "../helpers/db";
import { launchBrowser, signInThroughPage } from "../helpers/browser";
import { testEnv } from "../helpers/env";
import { expectMessageBeside } from "../helpers/forms";
import { createLocation, createStampRow, reloadStamp, uniquePrefix } from "../helpers/stamps";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("a stock-take on a phone", () => {
  it("starts with no shelf chosen, switches shelf from a scanned shelf label, and Start counting opens the running count", async () => {
    const { appUrl } = testEnv();
    const prefix = uniquePrefix("STE");
    const site = `Count room ${prefix}`;
    const a = await createLocation(site, "A");
    const b = await createLocation(site, "B");
    const elsewhere = await createLocation(`Other room ${prefix}`, "Z");
    await createStampRow({ code: `${prefix}-1`, locationId: a.id });
    await createStampRow({ code: `${prefix}-2`, locationId: b.id });
    const keeper = await createUser("keeper");
    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    await signInThroughPage(page, keeper.email, keeper.password);

    await page.goto(`${appUrl}/stamps/stock-takes`);
    const start = page.getByRole("form", { name: "Start a count" });
    await start.getByLabel("Site").selectOption(site);
    await start.getByRole("button", { name: "Start counting" }).click();
    await page.waitForURL(/\/stamps\/stock-takes\/[0-9a-f-]{36}$/);
    const countUrl = page.url();

    const counting = page.getByLabel("Counting at");
    expect(await counting.inputValue()).toBe("");
    const code = page.getByLabel("Stamp code or scanned label");
    // Marking before a shelf is chosen: the shelf field says what is missing, nothing is recorded.
    await code.fill(`${prefix}-2`);
    await code.press("Enter");
    await expectMessageBeside(counting, /Choose the location you are counting first/);
    expect(await page.getByTestId("progress").textContent()).toBe("0 / 2 seen");

    // A shelf label of another site is refused; one of this site switches the shelf (a scanner gun types it).
    await code.fill(shelfUrl(appUrl, elsewhere.id));
    await code.press("Enter");
    await page.getByText(`This shelf label belongs to another site, not to ${site}.`, { exact: false }).waitFor();
    expect(await counting.inputValue()).toBe("");
    await code.fill(shelfUrl(appUrl, b.id));
    await code.press("Enter");
    await page.getByText("Now counting at B.").waitFor();
    expect(await counting.inputValue()).toBe(b.id);
    expect(await code.inputValue()).toBe("");

    await code.fill(`${prefix}-2`);
    await code.press("Enter");
    await page.getByText(`${prefix}-2 Test stamp ${prefix}-2 — seen at ${site} · B.`).waitFor();
    await expect.poll(() => page.getByTestId("progress").textContent()).toBe("1 / 2 seen");
    expect(await page.getByTestId("recent").textContent()).toContain("in place");

    await code.fill("not a code!");
    await code.press("Enter");
    await expectMessageBeside(code, /Scan a label or type a stamp code/);

    // The stamp recorded at A lies on B: the count moves it where it was seen, after asking.
    await code.fill(`${prefix}-1`);
    await code.press("Enter");
    await expect.poll(() => page.getByTestId("report").textContent()).toContain(`recorded at ${site} · A, seen at ${site} · B`);
    page.once("dialog", (dialog) => void dialog.accept());
    await page.getByRole("button", { name: "Move 1 stamp to where it was seen" }).click();
    await page.getByText("1 stamp moved.").waitFor();
    expect((await reloadStamp(`${prefix}-1`))!.locationId).toBe(b.id);

    // Starting again at a site whose count is running opens that count.
    await page.goto(`${appUrl}/stamps/stock-takes`);
    await start.getByLabel("Site").selectOption({ label: `${site} (a count is running: continue it)` });
    await start.getByRole("button", { name: "Start counting" }).click();
    await page.waitForURL(countUrl);
    await expect.poll(() => page.getByTestId("progress").textContent()).toBe("2 / 2 seen");

    page.once("dialog", (dialog) => void dialog.accept());
    await page.getByRole("button", { name: "End the count" }).click();
    await page.getByText("The count has ended.").waitFor();
    await page.getByText(/This count ended/).waitFor();
    await context.close();
  });
});
