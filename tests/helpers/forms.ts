import type { Locator } from "playwright-core";
import { expect } from "vitest";

// The house rule for forms: a refused field points at its message through aria-describedby (components/ui/field.tsx).

/** The text of the error slot(s) a field points at through aria-describedby ("" when it points at none). */
export async function messageBeside(field: Locator): Promise<string> {
  const ids = ((await field.getAttribute("aria-describedby")) ?? "").split(/\s+/).filter((id) => id.endsWith("-error"));
  const texts = await Promise.all(ids.map((id) => field.page().locator(`[id="${id}"]`).textContent()));
  return texts.join(" ").trim();
}

/** Waits until the message beside `field` matches, and checks the field is marked invalid. */
export async function expectMessageBeside(field: Locator, pattern: RegExp) {
  await expect.poll(() => messageBeside(field), { timeout: 15_000 }).toMatch(pattern);
  expect(await field.getAttribute("aria-invalid")).toBe("true");
}

/** Waits until nothing stands beside `field` any more. */
export async function expectNoMessageBeside(field: Locator) {
  await expect.poll(() => messageBeside(field), { timeout: 15_000 }).toBe("");
}
