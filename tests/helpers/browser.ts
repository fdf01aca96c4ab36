import { chromium, type Browser, type Page } from "playwright-core";
import { watchAccessibility } from "./accessibility";
import { testEnv } from "./env";

/**
 * Chromium for the browser tests. Every context it makes (`browser.newContext()`, and `browser.newPage()`,
 * which makes one) has its pages checked by axe-core (tests/helpers/accessibility.ts).
 */
export async function launchBrowser(): Promise<Browser> {
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-dev-shm-usage",
      "--disable-background-networking",
      "--disable-component-update",
      "--no-first-run",
      "--disable-sync",
    ],
  });
  const newContext = browser.newContext.bind(browser);
  browser.newContext = async (options) => watchAccessibility(await newContext(options));
  return browser;
}

export async function signInThroughPage(page: Page, email: string, password: string) {
  const { appUrl } = testEnv();
  await page.goto(`${appUrl}/signin`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`${appUrl}/`);
}

/** The labels of the main navigation, in order. */
export async function navLabels(page: Page): Promise<string[]> {
  return page.getByRole("navigation", { name: "Main" }).getByRole("link").allTextContents();
}
