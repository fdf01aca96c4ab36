import { readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { translator } from "@/lib/i18n/translator";

const t = translator("en");

describe("layout messages", () => {
  it("round the engine's numbers for people", () => {
    expect(t("layout.stampWiderThanBand", { stampWidthMm: 200, bandWidthMm: 1066.6666 })).toContain("(1,066.7 mm)");
  });
  it("exist for every refusal the engine can raise", () => {
    const codes = new Set<string>();
    for (const file of readdirSync("lib/layout").filter((f) => f.endsWith(".ts"))) {
      for (const m of readFileSync(join("lib/layout", file), "utf8").matchAll(/layoutError\([^,]+,\s*"(\w+)"/g)) codes.add(m[1]);
    }
    expect(codes.size).toBeGreaterThan(8);
    for (const code of codes) expect(t.has(`layout.${code}`), code).toBe(true);
  });
});
