import { readFileSync, readdirSync, statSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { translator } from "@/lib/i18n/translator";
import { damageKinds, stampConditions } from "@/lib/validation/stamps";

const t = translator("en");

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? files(path) : /\.(ts|tsx)$/.test(name) ? [path] : [];
  });
}

// The stamp shelf names its texts with whole keys (t("stamps.table.count")); each must exist.
describe("stamp shelf texts", () => {
  const sources = [...files("app/(app)/stamps"), ...files("components/stamps"), ...files("lib/data/stamps"), "lib/emails/templates.ts"];

  it("has every key the pages, forms and e-mails name", () => {
    const keys = new Set<string>();
    for (const file of sources) {
      for (const match of readFileSync(file, "utf8").matchAll(/\bt\(\s*"((?:stamps|locations|overdue|labels|stockTake|stampImport|stampEmails|common)\.[\w.]+)"/g)) keys.add(match[1]);
    }
    expect(keys.size).toBeGreaterThan(150);
    const missing = [...keys].filter((key) => !t.has(key));
    expect(missing).toEqual([]);
  });

  it("names every condition, damage kind and condition step", () => {
    for (const c of stampConditions) {
      expect(t.has(`stamps.conditions.${c}`) && t.has(`stamps.conditionHelp.${c}`) && t.has(`stamps.condition.to.${c}`), c).toBe(true);
    }
    for (const k of damageKinds) expect(t.has(`stamps.damageKinds.${k}`), k).toBe(true);
  });

  it("fills plural counts", () => {
    expect(t("stamps.table.count", { first: 1, last: 50, total: 150 })).toBe("Stamps 1–50 of 150");
    expect(t("stamps.table.count", { first: 0, last: 0, total: 0 })).toBe("No stamps");
    expect(t("overdue.intro", { out: 5, overdue: 1 })).toBe("5 stamps are out, 1 overdue.");
    expect(t("errors.importInvalid", { count: 1 })).toMatch(/^The file was not imported: 1 row has errors/);
  });
});
