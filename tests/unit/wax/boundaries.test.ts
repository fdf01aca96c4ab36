import { readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { translator } from "@/lib/i18n/translator";
import { issueFields } from "@/lib/error-body";
import { z } from "zod";
import { DEFAULT_MATERIALS, WaxInputError, checkTemperature, estimateWax, keyed, recipeSchema, toWaxIssues } from "@/lib/wax";

const t = translator("en");
const sources = readdirSync("lib/wax")
  .filter((f) => f.endsWith(".ts"))
  .map((f) => ({ file: f, text: readFileSync(join("lib/wax", f), "utf8") }));

describe("lib/wax stays pure", () => {
  it("imports only zod (through lib/zod), lib/units, the shared error codes and its own files", () => {
    for (const { file, text } of sources) {
      for (const m of text.matchAll(/^\s*(?:import|export)[^"']*?from\s+["']([^"']+)["']/gm)) {
        expect(["zod", "@/lib/zod", "@/lib/units", "@/lib/errors"].includes(m[1]) || m[1].startsWith("./"), `${file} imports ${m[1]}`).toBe(true);
      }
    }
  });
});

describe("wax messages", () => {
  it("exist in the catalogue for every key lib/wax names", () => {
    const keys = new Set<string>();
    for (const { text } of sources) for (const m of text.matchAll(/"((?:wax|validation)\.[A-Za-z0-9]+)"/g)) keys.add(m[1]);
    expect(keys.size).toBeGreaterThan(20);
    for (const key of keys) expect(t.has(key), key).toBe(true);
  });

  it("reach people through the shared zod translation, wax keys included", () => {
    const parsed = recipeSchema.safeParse({
      name: "Rainy",
      season: "rainy",
      use: "stamping",
      components: [{ material: "beeswax", pct: 70 }, { material: "paraffin", pct: 20 }, { material: "Beeswax", pct: 5 }],
      workingRangeC: { minC: 60, maxC: 70 },
    });
    expect(parsed.success).toBe(false);
    const fields = issueFields(parsed.error!.issues, t);
    expect(fields.components).toEqual(["The shares add up to 95 %; they must add up to 100 %."]);
    expect(fields["components.2.material"]).toEqual(["Beeswax is already on line 1. Put its whole share on one line."]);
  });

  it("translate domain refusals and warnings with their params", () => {
    const near = checkTemperature({ minC: 60, maxC: 160 }, DEFAULT_MATERIALS.slice(0, 2)).problem!;
    expect(t(near.code, near.params as Record<string, number | string>)).toBe(
      "The working range reaches 160 °C, only 40 °C below the flash point of Paraffin wax (200 °C). Keep at least 50 °C away: stay below 150 °C.",
    );
    const hot = checkTemperature({ minC: 60, maxC: 110 }, DEFAULT_MATERIALS.slice(0, 1)).warnings[0];
    expect(t(hot.code, hot.params as Record<string, number | string>)).toMatch(/^Above 100 °C \(212 °F\) wax gives off fumes/);
    try {
      estimateWax({ waxedAreaPerMetreM2: 1, metres: 1, rateGPerM2: 90, components: [{ material: "beeswax", pct: 99.5, densityGPerCm3: 0.96 }] });
      throw new Error("expected a refusal");
    } catch (e) {
      if (!(e instanceof WaxInputError)) throw e;
      expect(t(e.code, e.params as Record<string, number>)).toBe("The shares add up to 99.5 %; they must add up to 100 %.");
    }
  });
});

describe("toWaxIssues", () => {
  it("keeps catalogue keys and turns any other message into validation.invalid", () => {
    const parsed = z.object({ a: z.number(keyed), b: z.string().refine(() => false, "not a key") }).safeParse({ a: "x", b: "y" });
    expect(toWaxIssues(parsed.error!.issues)).toEqual([
      { field: "a", code: "validation.invalidType", params: { expected: "number" } },
      { field: "b", code: "validation.invalid", params: {} },
    ]);
  });
});
