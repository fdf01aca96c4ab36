import { afterEach, expect } from "vitest";
import { takeCspViolations } from "./browser";

// Every browser test runs with the app's Content-Security-Policy on; a page that trips it fails the test.
afterEach(() => {
  expect(takeCspViolations(), "Content-Security-Policy violations").toEqual([]);
});
