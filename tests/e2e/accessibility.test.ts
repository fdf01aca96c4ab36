import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { objectStore } from "@/lib/s3";
import { seedScans } from "@/scripts/seed/scans";
import { seedStamps } from "@/scripts/seed/stamps";
import { checkAccessibility, finishAccessibilityChecks } from "../helpers/accessibility";
import { launchBrowser, signInThroughPage } from "../helpers/browser";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn } from "../helpers/http";
import { createLocation, createStampRow, uniquePrefix } from "../helpers/stamps";

// Every page of the app once, so axe-core (tests/helpers/accessibility.ts, run after each test) also sees the
// pages no flow test walks through. Each visit waits for the page's own content, so the check sees it filled.

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
  await seedStamps(db());
});
afterAll(async () => {
  await browser?.close();
});

async function visit(page: Page, path: string, ready: (page: Page) => Promise<unknown>) {
  const { appUrl } = testEnv();
  await page.goto(`${appUrl}${path}`);
  await ready(page);
  await checkAccessibility(page, `visiting ${path}`);
}

const heading = (name: string | RegExp) => (page: Page) => page.getByRole("heading", { name }).first().waitFor();

describe("every page", () => {
  it("signed out: sign-in, forgotten password, setting a password", async () => {
    const page = await browser.newPage();
    await visit(page, "/signin", (p) => p.getByLabel("E-mail").waitFor());
    await visit(page, "/forgot-password", (p) => p.getByLabel("E-mail").waitFor());
    await visit(page, "/set-password?token=not-a-real-token", (p) => p.getByText(/This link is not valid/).waitFor());
    await page.context().close();
  });

  it("signed in as an administrator: overview, account, people and the whole stamp shelf", async () => {
    const admin = await createUser("admin");
    const site = `Sweep room ${uniquePrefix("A11Y")}`;
    await createLocation(site, "R1-S1");
    const session = (await signIn(admin.email, admin.password))!;
    const started = await api("POST", "/api/v1/stock-takes", { session, body: { site } });
    expect(started.status, JSON.stringify(started.body)).toBe(201);

    const page = await browser.newPage();
    await signInThroughPage(page, admin.email, admin.password);
    await visit(page, "/", (p) => p.getByTestId("role-permissions").waitFor());
    await visit(page, "/account", heading("My account"));
    await visit(page, "/api-reference", heading("API reference"));
    await visit(page, "/admin", (p) => p.getByRole("form", { name: "Invite someone" }).waitFor());
    await visit(page, "/stamps", (p) => p.locator("tbody tr[data-testid]").first().waitFor());
    await visit(page, "/stamps/new", (p) => p.getByRole("form", { name: "Add a stamp" }).waitFor());
    await visit(page, "/stamps/CP-0058", heading(/CP-0058/));
    await visit(page, "/stamps/CP-0058/edit", heading(/Edit/));
    await visit(page, "/stamps/out", heading("Out & overdue"));
    await visit(page, "/stamps/locations", heading("Locations"));
    await visit(page, "/stamps/labels?codes=CP-0001,CP-0002", (p) => p.locator("[data-code] svg").first().waitFor());
    await visit(page, "/stamps/labels?kind=shelf", (p) => p.locator("svg").first().waitFor());
    await visit(page, "/stamps/import", heading("Import stamps from CSV"));
    await visit(page, "/stamps/stock-takes", heading("Stock-takes"));
    await visit(page, `/stamps/stock-takes/${started.body.stockTake.id}`, heading("Mark stamps as seen"));
    await visit(page, "/stamps/NO-SUCH-STAMP", heading("No such stamp"));
    await page.context().close();
  });
});

describe("every page in its open and failed states", () => {
  it("menus, disclosures, dialogs, the coverage review and forms showing their errors", async () => {
    const { appUrl } = testEnv();
    const keeper = await createUser("keeper");
    const code = `${uniquePrefix("A11Y")}-1`;
    await createStampRow({ code, name: "Sweep stamp", widthMm: 120, heightMm: 120 });
    expect(await seedScans(db(), objectStore(), { codes: [code], dpi: 60 })).toBeGreaterThan(0);

    const page = await browser.newPage();
    await page.goto(`${appUrl}/signin`);
    await page.getByLabel("E-mail").fill(keeper.email);
    await page.getByLabel("Password").fill("not the password");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByText("do not match an active account").waitFor();
    await checkAccessibility(page, "after a failed sign-in");
    await signInThroughPage(page, keeper.email, keeper.password);

    await visit(page, "/stamps", (p) => p.locator("tbody tr[data-testid]").first().waitFor());
    await page.getByText("Condition ▾").click();
    await page.getByText("Columns ▾").click();
    await checkAccessibility(page, "with the condition and column menus open");

    await visit(page, "/stamps/new", (p) => p.getByRole("form", { name: "Add a stamp" }).waitFor());
    await page.getByRole("button", { name: "Add the stamp" }).click();
    await page.locator("#stamp-width-error").filter({ hasText: /\S/ }).waitFor();
    await checkAccessibility(page, "with the form's errors shown");

    await visit(page, `/stamps/${code}`, (p) => p.getByTestId("scan-thumb").first().waitFor());
    await page.getByText("Report damage", { exact: true }).first().click();
    await page.getByRole("form", { name: "Report damage" }).waitFor();
    await checkAccessibility(page, "with the damage report open");
    await page.getByTestId("scan-card").first().getByRole("button").first().click();
    await page.getByTestId("scan-viewer").locator("img").waitFor();
    await checkAccessibility(page, "with the scan viewer open");
    await page.keyboard.press("Escape");
    await page.getByTestId("review-coverage").first().click();
    await page.getByTestId("coverage-ratio").filter({ hasText: "%" }).waitFor();
    await checkAccessibility(page, "with the coverage review open");
    await page.context().close();
  });
});

describe("the accessibility check itself", () => {
  // Pages served by the test itself (never reaching the network), so the check has something known to find.
  const origin = "http://a11y-check.test";
  const pages: Record<string, string> = {
    "/broken": `<!doctype html><html><body><img src="/x.png"><button></button><label>Name <input></label></body></html>`,
    "/plain": `<!doctype html><html lang="en"><head><title>Plain</title></head><body><h1>One</h1><h3>Three</h3><p>No landmarks, only moderate findings.</p></body></html>`,
    "/hop": `<!doctype html><html lang="en"><head><title>Hop</title></head><body><main><h1>Hop</h1><script>let n = Number(location.hash.slice(1) || 0); if (n < 6) setTimeout(() => { location.href = "/hop#" + (n + 1); location.reload(); }, 40);</script></main></body></html>`,
  };

  async function servedPage() {
    const page = await browser.newPage();
    await page.route(`${origin}/**`, (route) => {
      const path = new URL(route.request().url()).pathname;
      return pages[path] ? route.fulfill({ contentType: "text/html", body: pages[path] }) : route.fulfill({ status: 404, body: "" });
    });
    return page;
  }

  // Each closes its page before asking for the report: closing checks the page once more.
  it("fails on serious and critical violations, naming the rule, its impact, the element and the page", async () => {
    const page = await servedPage();
    await page.goto(`${origin}/broken`);
    await page.context().close();
    const report = await finishAccessibilityChecks().then(
      () => "",
      (error: Error) => error.message,
    );
    expect(report).toMatch(/image-alt \(critical\) at http:\/\/a11y-check\.test\/broken/);
    expect(report).toMatch(/button-name \(critical\)/);
    expect(report).toMatch(/html-has-lang \(serious\)/);
    expect(report).toMatch(/document-title \(serious\)/);
    expect(report).toContain("  - img");
  });

  it("lets moderate and minor findings pass", async () => {
    const page = await servedPage();
    await page.goto(`${origin}/plain`);
    await checkAccessibility(page);
    await page.context().close();
    await expect(finishAccessibilityChecks()).resolves.toBeUndefined();
  });

  it("does not stumble when the page navigates while it is being checked", async () => {
    const page = await servedPage();
    await page.goto(`${origin}/hop`);
    await page.waitForFunction(() => location.hash === "#6");
    await checkAccessibility(page);
    await page.context().close();
    await expect(finishAccessibilityChecks()).resolves.toBeUndefined();
  });
});
