import { afterEach } from "vitest";
import { finishAccessibilityChecks } from "./accessibility";

// Every browser test ends with the accessibility check of what it saw (tests/helpers/accessibility.ts).
afterEach(async () => {
  await finishAccessibilityChecks();
}, 60_000);
