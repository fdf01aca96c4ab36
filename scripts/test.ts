// npm test — unit tests, then a throwaway stack (PostgreSQL cluster in .test-data, mail catcher,
// object store, a production build of the app on port 3100) for the integration and browser tests.
// Everything it starts is stopped at the end, also when a test fails or on Ctrl-C.
// CAPGRID_TEST_SLOT=n runs on ports shifted by 10·n, beside another run (scripts/lib/test-stack.ts).
// File filters after `--` run only those test files: `npm run test:e2e -- tests/e2e/people.test.ts`.
import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { ensureChromium } from "./lib/chromium";
import { projectRoot } from "./lib/config";
import { startTestApp, testEnvironment, type TestApp } from "./lib/test-stack";

const { env, dataDir } = testEnvironment(Number(process.env.CAPGRID_TEST_SLOT ?? 0));

const argv = process.argv.slice(2);
const only = argv.includes("--only") ? argv[argv.indexOf("--only") + 1] : undefined;
// Anything else on the command line (`npm run test:integration -- tests/integration/sessions.test.ts`)
// narrows vitest to those files or name filters.
const filters = argv.filter((arg, i) => arg !== "--only" && argv[i - 1] !== "--only");
const wants = (suite: string) => !only || only === suite;
const totals = { passed: 0, failed: 0, skipped: 0 };
const reportDir = mkdtempSync(join(tmpdir(), "capgrid-test-"));

function vitest(project: string): number {
  const report = join(reportDir, `${project}.json`);
  const args = ["run", "--project", project, "--reporter=default", "--reporter=json", `--outputFile.json=${report}`, ...(filters.length ? ["--passWithNoTests", ...filters] : [])];
  const status = spawnSync(join(projectRoot, "node_modules", ".bin", "vitest"), args, { stdio: "inherit", env: process.env, cwd: projectRoot }).status ?? 1;
  if (existsSync(report)) {
    const r = JSON.parse(readFileSync(report, "utf8"));
    totals.passed += r.numPassedTests;
    totals.failed += r.numFailedTests;
    totals.skipped += r.numPendingTests + r.numTodoTests;
  } else if (status !== 0) totals.failed += 1;
  return status;
}

let app: TestApp | undefined;
process.on("SIGINT", () => {
  app?.stop();
  process.exit(130);
});

let failed = 0;
try {
  if (wants("unit")) failed += vitest("unit") === 0 ? 0 : 1;
  if (wants("integration") || wants("e2e")) {
    ensureChromium();
    app = await startTestApp(dataDir);
    console.log(`[test] app on ${env.APP_URL}`);
    if (wants("integration")) failed += vitest("integration") === 0 ? 0 : 1;
    if (wants("e2e")) failed += vitest("e2e") === 0 ? 0 : 1;
  }
} catch (error) {
  console.error(`\n${(error as Error).message}\n`);
  failed += 1;
} finally {
  app?.stop();
  rmSync(reportDir, { recursive: true, force: true });
}
console.log(`\nTests: ${totals.passed} passed, ${totals.failed} failed, ${totals.skipped} skipped`);
process.exit(failed || totals.failed ? 1 : 0);
