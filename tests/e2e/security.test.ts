import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { seedStamps } from "@/scripts/seed/stamps";
import { createUser, db } from "../helpers/db";
import { launchBrowser, signInThroughPage, takeCspViolations } from "../helpers/browser";
import { testEnv } from "../helpers/env";
import { signIn } from "../helpers/http";
import { latestMailTo, linkIn } from "../helpers/mail";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
  await seedStamps(db());
});
afterAll(async () => {
  await browser?.close();
});

async function signedIn(role: "keeper" | "planner" | "designer", user?: { email: string; password: string }): Promise<Page> {
  const who = user ?? (await createUser(role));
  const page = await (await browser.newContext()).newPage();
  await signInThroughPage(page, who.email, who.password);
  return page;
}

describe("the Content-Security-Policy", () => {
  it("refuses injected markup's handlers and styles, and the browser tests notice", async () => {
    const { appUrl } = testEnv();
    const page = await (await browser.newContext()).newPage();
    await page.goto(`${appUrl}/signin`);
    // What an injection would try: an inline event handler and a style attribute in parsed markup.
    await page.evaluate(() => document.body.insertAdjacentHTML("beforeend", '<img alt="" src="/no-such-image.png" onerror="window.__injected = true"><p style="color: red">x</p>'));
    await expect.poll(() => takeCspViolations().length).toBeGreaterThanOrEqual(1);
    expect(await page.evaluate(() => (window as unknown as { __injected?: boolean }).__injected)).toBeUndefined();
    takeCspViolations();
    await page.context().close();
  });

  it("lets the label sheet's print page style apply", async () => {
    const { appUrl } = testEnv();
    const page = await signedIn("keeper");
    // (tests/e2e/stamps.test.ts reaches the sheet by a client-side navigation, where a nonce'd style element would fail.)
    await page.goto(`${appUrl}/stamps/labels?codes=CP-0001,CP-0002`);
    await page.locator("[data-code]").first().waitFor();
    const pageRules = await page.evaluate(() =>
      [...document.styleSheets].flatMap((sheet) => [...sheet.cssRules].filter((rule) => rule instanceof CSSPageRule).map((rule) => rule.cssText)),
    );
    expect(pageRules.join(" ")).toMatch(/@page stamp-labels \{ size: a4; margin: 8mm; \}/i);
    expect(await page.getByTestId("label-sheet").evaluate((el) => getComputedStyle(el).getPropertyValue("page"))).toBe("stamp-labels");
    // The app's own stylesheet applies too: labels are laid out three to a row.
    expect(await page.getByTestId("labels").evaluate((el) => getComputedStyle(el).display)).toBe("grid");
    await page.context().close();
  });
});

describe("My account", () => {
  it("signs out everywhere after asking, and every other browser of that person is signed out too", async () => {
    const { appUrl } = testEnv();
    const user = await createUser("designer");
    const laptop = await signedIn("designer", user);
    const workshop = await signedIn("designer", user);

    await laptop.goto(`${appUrl}/account`);
    expect(await laptop.getByTestId("session-count").textContent()).toBe("You have 2 active sessions, this one included.");
    // Declining the question changes nothing.
    laptop.once("dialog", (dialog) => void dialog.dismiss());
    await laptop.getByRole("button", { name: "Sign out everywhere" }).click();
    await workshop.goto(`${appUrl}/account`);
    await workshop.getByTestId("session-count").waitFor();

    laptop.once("dialog", (dialog) => {
      expect(dialog.message()).toMatch(/every device and browser/);
      void dialog.accept();
    });
    await laptop.getByRole("button", { name: "Sign out everywhere" }).click();
    await laptop.waitForURL(`${appUrl}/signin?notice=signed-out-everywhere`);
    await laptop.getByText("You are signed out everywhere").waitFor();

    await workshop.goto(`${appUrl}/account`);
    await workshop.waitForURL(/\/signin/);
    await laptop.context().close();
    await workshop.context().close();
  });
});

describe("a sign-in limited after wrong passwords", () => {
  it("says so and offers the reset link by e-mail, which works at once", async () => {
    const { appUrl } = testEnv();
    const user = await createUser("planner");
    for (let i = 0; i < 10; i++) expect(await signIn(user.email, `a wrong guess ${i}`)).toBeNull();

    const page = await (await browser.newContext()).newPage();
    await page.goto(`${appUrl}/signin`);
    await page.getByLabel("E-mail").fill(user.email);
    await page.getByLabel("Password").fill(user.password);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByText("Too many failed attempts for this account").waitFor();

    await page.getByRole("link", { name: "Forgot your password?" }).click();
    await page.waitForURL(`${appUrl}/forgot-password`);
    await page.getByLabel("E-mail").fill(user.email);
    await page.getByRole("button", { name: "Send the link" }).click();
    await page.getByText("a link is on its way").waitFor();

    await page.goto(linkIn(await latestMailTo(user.email, /reset/i)));
    await page.getByLabel("New password").fill("batik by the river 7");
    await page.getByLabel("Type it again").fill("batik by the river 7");
    await page.getByRole("button", { name: "Set password" }).click();
    await page.waitForURL(/\/signin\?notice=password-set/);
    await signInThroughPage(page, user.email, "batik by the river 7");
    await page.context().close();
  });
});
