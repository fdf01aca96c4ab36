import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import type { AxeResults, NodeResult, Result } from "axe-core";
import type { BrowserContext, Page, Request } from "playwright-core";

// axe-core on every page the browser tests see. Each page of a watched context is checked once it has loaded
// and settled after every navigation (full loads and client-side route changes alike), and once more when its
// context closes or the test ends, so the state a test leaves behind is checked too. Serious and critical
// violations fail the test (tests/helpers/e2e-setup.ts); the report names the rule, its impact, the elements
// and the page.
//
// axe is evaluated into the page through the DevTools protocol rather than a <script> tag, so a
// Content-Security-Policy that refuses inline and foreign scripts does not stop it.

const require = createRequire(import.meta.url);
const axeSource = readFileSync(require.resolve("axe-core/axe.min.js"), "utf8");
const axeVersion: string = require("axe-core/package.json").version;

const failingImpacts = new Set(["serious", "critical"]);
/** A page counts as settled after this long with no request in flight, no DOM change and no running transition. */
const settleQuietMs = 250;
/** The longest wait for that; a page that never settles (a spinner) is checked as it is. */
const settleMaxMs = 4_000;
/** Elements listed per finding; the rest are counted. */
const nodesShown = 5;

interface Finding {
  url: string;
  when: string;
  rule: string;
  impact: string;
  help: string;
  helpUrl: string;
  nodes: { target: string; summary: string }[];
}

const findings: Finding[] = [];
const seen = new Set<string>();
const checkErrors: string[] = [];
/** Contexts of the running test; at its end they are checked a last time and then left alone. */
const openContexts = new Set<BrowserContext>();
const retired = new WeakSet<BrowserContext>();
const queues = new WeakMap<Page, Promise<void>>();
const inFlight = new WeakMap<Page, Set<Request>>();

/** Errors that only mean the page moved on or went away while it was being checked: its next page is checked. */
const goneAway = /Execution context was destroyed|Target (page, context or browser )?(has been )?closed|frame (was|got) detached|navigat|Cannot find context|has been closed/i;

function describeNode(node: NodeResult): { target: string; summary: string } {
  const target = node.target.map((t) => (Array.isArray(t) ? t.join(" >>> ") : String(t))).join(" ");
  const checks = [...node.any, ...node.all, ...node.none].map((c) => c.message).filter(Boolean);
  return { target, summary: checks[0] ?? node.failureSummary ?? "" };
}

const failing = (violations: Result[]) => violations.filter((v) => v.impact && failingImpacts.has(v.impact));
const nodeKeys = (violations: Result[]) => new Set(violations.flatMap((v) => v.nodes.map((n) => `${v.id} ${describeNode(n).target}`)));

function record(url: string, when: string, violations: Result[]) {
  const path = url.replace(/[?#].*$/, "");
  for (const v of violations) {
    const nodes = v.nodes.map(describeNode).filter((n) => !seen.has(`${path} ${v.id} ${n.target}`));
    if (!nodes.length) continue;
    for (const n of nodes) seen.add(`${path} ${v.id} ${n.target}`);
    findings.push({ url, when, rule: v.id, impact: v.impact!, help: v.help, helpUrl: v.helpUrl, nodes });
  }
}

async function settle(page: Page) {
  const until = Date.now() + settleMaxMs;
  await page.waitForLoadState("load", { timeout: settleMaxMs }).catch(() => undefined);
  // Requests the page is waiting for (a server action, a route change, an SWR fetch) come first.
  while ((inFlight.get(page)?.size ?? 0) > 0 && Date.now() < until) await new Promise((r) => setTimeout(r, 50));
  await page.evaluate(
    ({ quietMs, maxMs }) =>
      new Promise<void>((resolve) => {
        const running = () => document.getAnimations().some((a) => a.playState === "running");
        let quiet: ReturnType<typeof setTimeout>;
        const finish = () => {
          observer.disconnect();
          clearTimeout(quiet);
          clearTimeout(cap);
          resolve();
        };
        const wait = () => {
          clearTimeout(quiet);
          quiet = setTimeout(() => (running() ? wait() : finish()), quietMs);
        };
        const observer = new MutationObserver(wait);
        observer.observe(document, { subtree: true, childList: true, attributes: true, characterData: true });
        wait();
        const cap = setTimeout(finish, maxMs);
      }),
    { quietMs: settleQuietMs, maxMs: Math.max(0, until - Date.now()) },
  );
}

/** One axe run on the page as it is now; the address is read in the same step, so it matches the DOM checked. */
async function axeRun(page: Page): Promise<{ url: string; violations: Result[] }> {
  if (!(await page.evaluate(() => typeof (window as { axe?: unknown }).axe === "object"))) await page.evaluate(axeSource);
  return page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, o: object) => Promise<AxeResults> } }).axe;
    const url = location.href;
    const results = await axe.run(document, { resultTypes: ["violations"] });
    return { url: location.href === url ? url : "", violations: results.violations };
  });
}

async function runAxe(page: Page, when: string) {
  if (page.isClosed() || retired.has(page.context()) || !/^https?:/.test(page.url())) return;
  try {
    await settle(page);
    const first = await axeRun(page);
    const found = failing(first.violations);
    if (!found.length || !first.url) return;
    // Confirm on a settled page: what a click or a route change showed for a moment during the run does not
    // count, only what is still there (same address, same rule, same element).
    await settle(page);
    const again = await axeRun(page);
    if (again.url !== first.url) return;
    const still = nodeKeys(failing(again.violations));
    const confirmed = found
      .map((v) => ({ ...v, nodes: v.nodes.filter((n) => still.has(`${v.id} ${describeNode(n).target}`)) }))
      .filter((v) => v.nodes.length);
    record(first.url, when, confirmed);
  } catch (error) {
    const message = (error as Error).message ?? String(error);
    if (page.isClosed() || goneAway.test(message)) return;
    checkErrors.push(`${page.url()} (${when}): ${message.split("\n")[0]}`);
  }
}

/** Checks the page now (after it settles), after any check already running on it. */
export function checkAccessibility(page: Page, when = "on request"): Promise<void> {
  const next = (queues.get(page) ?? Promise.resolve()).then(() => runAxe(page, when));
  queues.set(page, next);
  return next;
}

/** Pages with an automatic check waiting to start: one waiting check covers any number of navigations. */
const waiting = new WeakSet<Page>();

function checkSoon(page: Page, when: string) {
  if (waiting.has(page)) return;
  waiting.add(page);
  const next = (queues.get(page) ?? Promise.resolve()).then(() => {
    waiting.delete(page);
    return runAxe(page, when);
  });
  queues.set(page, next);
}

const pathOf = (url: string) => url.replace(/[?#].*$/, "");

function watchPage(page: Page) {
  const requests = new Set<Request>();
  inFlight.set(page, requests);
  page.on("request", (r) => requests.add(r));
  page.on("requestfinished", (r) => requests.delete(r));
  page.on("requestfailed", (r) => requests.delete(r));
  // A new document is checked once loaded; a client-side route change when it reaches another path. Changes
  // of the query alone (a table's filters in the address) are the same page: the final check sees the last.
  page.on("load", () => checkSoon(page, "after load"));
  let path = pathOf(page.url());
  page.on("framenavigated", (frame) => {
    if (frame !== page.mainFrame()) return;
    const next = pathOf(frame.url());
    if (next !== path) checkSoon(page, "after navigation");
    path = next;
  });
}

/** Every page of this context, now and later, is checked after each navigation and before the context closes. */
export function watchAccessibility(context: BrowserContext): BrowserContext {
  openContexts.add(context);
  context.pages().forEach(watchPage);
  context.on("page", watchPage);
  context.on("close", () => openContexts.delete(context));
  const close = context.close.bind(context);
  context.close = async (options) => {
    if (openContexts.has(context)) await Promise.all(context.pages().map((p) => checkAccessibility(p, "at the end")));
    openContexts.delete(context);
    return close(options);
  };
  return context;
}

/**
 * Checks the pages still open, then throws a readable report of everything found since the last call. Contexts
 * left open (a test that failed half-way) are not checked again, so they cannot fail the tests after it.
 */
export async function finishAccessibilityChecks(): Promise<void> {
  const contexts = [...openContexts];
  await Promise.all(contexts.flatMap((c) => c.pages().map((p) => checkAccessibility(p, "at the end"))));
  for (const c of contexts) {
    retired.add(c);
    openContexts.delete(c);
  }
  const found = findings.splice(0);
  const errors = checkErrors.splice(0);
  seen.clear();
  if (!found.length && !errors.length) return;
  const lines = [`Accessibility (axe-core ${axeVersion}): ${found.length} serious or critical violation(s)`];
  for (const f of found) {
    lines.push(``, `${f.rule} (${f.impact}) at ${f.url}, ${f.when}: ${f.help}`, `  ${f.helpUrl}`);
    for (const n of f.nodes.slice(0, nodesShown)) lines.push(`  - ${n.target}${n.summary ? `\n      ${n.summary}` : ""}`);
    if (f.nodes.length > nodesShown) lines.push(`  … and ${f.nodes.length - nodesShown} more like these`);
  }
  if (errors.length) lines.push(``, `The check itself failed:`, ...errors.map((e) => `  - ${e}`));
  throw new Error(lines.join("\n"));
}
