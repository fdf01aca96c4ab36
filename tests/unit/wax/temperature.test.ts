import { describe, expect, it } from "vitest";
import { celsiusToFahrenheit, fahrenheitToCelsius } from "@/lib/units";
import {
  DEFAULT_MATERIALS,
  WaxInputError,
  checkTemperature,
  recipesBreakingTemperatureRule,
  validateRecipe,
  workingRangeF,
  type WaxMaterial,
} from "@/lib/wax";

const material = (id: string, changes: Partial<WaxMaterial> = {}): WaxMaterial => {
  const m = DEFAULT_MATERIALS.find((x) => x.id === id);
  if (!m) throw new Error(id);
  return { ...m, ...changes };
};
const beeswax = material("beeswax"); // flash point 204 °C, discolours above 85 °C
const paraffin = material("paraffin"); // flash point 200 °C (GESTIS, lowest of 200–240)
const rosin = material("rosin"); // flash point not in our sources (null)

const range = (minC: number, maxC: number) => ({ minC, maxC });

describe("°C ↔ °F for working ranges (NIST SP 811: °F = °C × 9/5 + 32)", () => {
  it("converts the fixed points and the published working figures", () => {
    expect(workingRangeF(range(0, 100))).toEqual({ minF: 32, maxF: 212 });
    expect(workingRangeF(range(60, 80))).toEqual({ minF: 140, maxF: 176 });
    // Common practice elsewhere: 180–240 °F, quoted as 82–116 °C (SOURCES.md); hobby guides: never above 250 °F ≈ 121 °C.
    expect(Math.round(fahrenheitToCelsius(180))).toBe(82);
    expect(Math.round(fahrenheitToCelsius(240))).toBe(116);
    expect(Math.round(fahrenheitToCelsius(250))).toBe(121);
    expect(celsiusToFahrenheit(-40)).toBe(-40);
  });
});

describe("fume warning above 100 °C / 212 °F (M. Rossol, Arts, Crafts & Theater Safety)", () => {
  it("is silent at 100 °C and warns just above it", () => {
    expect(checkTemperature(range(60, 100), [paraffin]).fumeWarning).toBe(false);
    const hot = checkTemperature(range(60, 100.5), [paraffin]);
    expect(hot.fumeWarning).toBe(true);
    expect(hot.warnings).toContainEqual({ field: "workingRangeC.maxC", code: "wax.fumes", params: { maxC: 100.5, aboveC: 100, aboveF: 212 } });
    expect(hot.status).toBe("ok");
  });

  it("warns when beeswax goes above about 85 °C, where it discolours (SOURCES.md)", () => {
    expect(checkTemperature(range(60, 85), [beeswax]).warnings).toEqual([]);
    expect(checkTemperature(range(60, 86), [beeswax]).warnings.map((w) => w.code)).toEqual(["wax.discolours"]);
  });

  it("warns when the range never reaches a melting start", () => {
    expect(checkTemperature(range(30, 40), [beeswax, paraffin]).warnings).toContainEqual(
      expect.objectContaining({ code: "wax.belowMelting", params: { maxC: 40, fromC: 46 } }),
    );
  });
});

describe("refusal within 50 °C of the lowest flash point (SPEC 5.3)", () => {
  it("takes the lowest flash point of the mix: paraffin 200 °C beside beeswax 204 °C", () => {
    const ok = checkTemperature(range(60, 80), [beeswax, paraffin]);
    expect(ok.lowestFlashPoint).toEqual({ materialId: "paraffin", name: "Paraffin wax", flashPointC: 200 });
    expect(ok.marginC).toBe(120);
    expect(ok.limitC).toBe(150);
    expect(ok.status).toBe("ok");
    expect(ok.problem).toBeNull();
  });

  it("refuses at exactly 50 °C below (the boundary counts as within) and above it; allows just under", () => {
    expect(checkTemperature(range(60, 149.9), [beeswax, paraffin]).status).toBe("ok");
    const edge = checkTemperature(range(60, 150), [beeswax, paraffin]);
    expect(edge.status).toBe("tooNear");
    expect(edge.problem).toEqual({
      field: "workingRangeC.maxC",
      code: "wax.tooNearFlashPoint",
      params: { material: "Paraffin wax", flashPointC: 200, maxC: 150, marginC: 50, minMarginC: 50, limitC: 150 },
    });
    expect(checkTemperature(range(60, 160), [beeswax, paraffin]).problem?.params.marginC).toBe(40);
    expect(checkTemperature(range(60, 154), [beeswax]).status).toBe("tooNear");
    expect(checkTemperature(range(60, 153.9), [beeswax]).status).toBe("ok");
  });

  it("cannot check a mix with an unknown flash point, and says which material", () => {
    const c = checkTemperature(range(60, 70), [beeswax, rosin]);
    expect(c.status).toBe("unknown");
    expect(c.unknownFlashPoint).toEqual([{ materialId: "rosin", name: "Pine rosin (gondorukem)" }]);
    expect(c.problem).toEqual({ field: "workingRangeC.maxC", code: "wax.flashPointUnknown", params: { materials: "Pine rosin (gondorukem)" } });
    // A known flash point that is already too near still refuses.
    expect(checkTemperature(range(60, 160), [beeswax, rosin]).status).toBe("tooNear");
    expect(checkTemperature(range(60, 70), [rosin]).lowestFlashPoint).toBeNull();
  });

  it("validateRecipe refuses to save such a range, and saves one with an unknown flash point, reporting it", () => {
    const recipe = {
      name: "Hot blocking wax",
      season: "any",
      use: "blocking",
      components: [{ material: "paraffin", pct: 70 }, { material: "beeswax", pct: 30 }],
      workingRangeC: { minC: 120, maxC: 155 },
    };
    expect(() => validateRecipe(recipe, DEFAULT_MATERIALS)).toThrow(WaxInputError);
    expect(() => validateRecipe(recipe, DEFAULT_MATERIALS)).toThrow(expect.objectContaining({ field: "workingRangeC.maxC", code: "wax.tooNearFlashPoint" }));
    const safe = validateRecipe({ ...recipe, workingRangeC: { minC: 70, maxC: 80 } }, DEFAULT_MATERIALS);
    expect(safe.analysis.temperature.status).toBe("ok");
    const rosinMix = validateRecipe({ ...recipe, components: [{ material: "paraffin", pct: 80 }, { material: "rosin", pct: 20 }], workingRangeC: { minC: 70, maxC: 80 } }, DEFAULT_MATERIALS);
    expect(rosinMix.analysis.temperature.status).toBe("unknown");
  });
});

describe("recipes that break the rule when a material's flash point changes", () => {
  const recipes = [
    { id: "r-dry", name: "Dry", components: [{ material: "beeswax", pct: 60 }, { material: "paraffin", pct: 40 }], workingRangeC: range(60, 70) },
    { id: "r-hot", name: "Hot", components: [{ material: "paraffin", pct: 100 }], workingRangeC: range(100, 140) },
    { id: "r-bees", name: "Bees", components: [{ material: "beeswax", pct: 100 }], workingRangeC: range(65, 140) },
    { id: "r-rosin", name: "Rosin", components: [{ material: "beeswax", pct: 80 }, { material: "rosin", pct: 20 }], workingRangeC: range(70, 80) },
    { id: "r-gone", name: "Gone", components: [{ material: "kemiri oil", pct: 100 }], workingRangeC: range(60, 70) },
  ];

  it("lists with today's figures only those that cannot be checked or name a missing material", () => {
    expect(recipesBreakingTemperatureRule(DEFAULT_MATERIALS, recipes).map((b) => [b.recipeId, b.status])).toEqual([
      ["r-rosin", "unknown"],
      ["r-gone", "missingMaterial"],
    ]);
  });

  it("lists the paraffin recipes that now break when its flash point is lowered to 180 °C", () => {
    const materials = DEFAULT_MATERIALS.map((m) => (m.id === "paraffin" ? { ...m, flashPointC: 180 } : m));
    const breaks = recipesBreakingTemperatureRule(materials, recipes, { usingMaterial: "paraffin" });
    expect(breaks.map((b) => [b.recipeId, b.status])).toEqual([["r-hot", "tooNear"]]);
    expect(breaks[0].problem.params).toMatchObject({ material: "Paraffin wax", flashPointC: 180, marginC: 40 });
  });

  it("lists every paraffin recipe as unchecked when its flash point is cleared", () => {
    const materials = DEFAULT_MATERIALS.map((m) => (m.id === "paraffin" ? { ...m, flashPointC: null } : m));
    const breaks = recipesBreakingTemperatureRule(materials, recipes, { usingMaterial: "Paraffin wax" });
    expect(breaks.map((b) => [b.recipeId, b.status])).toEqual([
      ["r-dry", "unknown"],
      ["r-hot", "unknown"],
    ]);
  });

  it("finds recipes naming a material that no longer exists by that name", () => {
    expect(recipesBreakingTemperatureRule(DEFAULT_MATERIALS, recipes, { usingMaterial: "Kemiri Oil" }).map((b) => b.recipeId)).toEqual(["r-gone"]);
  });
});
