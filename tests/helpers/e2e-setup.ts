import { afterEach, expect } from "vitest";
import { finishAccessibilityChecks } from "./accessibility";
import { takeCspViolations } from "./browser";

// Every browser test ends with the accessibility check of what it saw (tests/helpers/accessibility.ts), and
// runs with the app's Content-Security-Policy on: a page that trips it fails the test.
afterEach(async () => {
  await finishAccessibilityChecks();
  expect(takeCspViolations(), "Content-Security-Policy violations").toEqual([]);
}, 60_000);
