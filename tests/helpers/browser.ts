import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";
import { watchAccessibility } from "./accessibility";
import { testEnv } from "./env";

/** What the browser said about the Content-Security-Policy since the last look: each refusal is a defect. */
const cspViolations: string[] = [];

/** The CSP violations seen since the last call (tests/helpers/e2e-setup.ts fails every test that caused one). */
export function takeCspViolations(): string[] {
  return cspViolations.splice(0);
}

async function watchForCsp(context: BrowserContext) {
  context.on("console", (message) => {
    if (/Content Security Policy|Content-Security-Policy/i.test(message.text())) cspViolations.push(`${message.page()?.url() ?? "?"}: ${message.text()}`);
  });
  // Reports what the console may not, e.g. a refused style attribute.
  await context.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) => console.error(`Content Security Policy: ${e.violatedDirective} refused ${e.blockedURI || "inline"}`));
  });
}

/**
 * Chromium for the browser tests. Every context it makes (`browser.newContext()`, and `browser.newPage()`,
 * which makes one) has its pages checked by axe-core (tests/helpers/accessibility.ts) and watched for
 * Content-Security-Policy refusals.
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
  browser.newContext = async (...args) => {
    const context = await newContext(...args);
    await watchForCsp(context);
    return watchAccessibility(context);
  };
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
