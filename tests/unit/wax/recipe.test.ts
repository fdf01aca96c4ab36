import { describe, expect, it } from "vitest";
import {
  DEFAULT_MATERIALS,
  WaxInputError,
  analyseRecipe,
  massFractions,
  mixDensity,
  parseRecipe,
  type RecipeInput,
} from "@/lib/wax";

// 60 % beeswax / 40 % paraffin by weight: a common-practice stamp-wax mix (SPEC section 1; no published source).
const dryMix: RecipeInput = {
  name: "Dry-season stamp wax",
  season: "dry",
  use: "stamping",
  components: [
    { material: "beeswax", pct: 60 },
    { material: "paraffin", pct: 40 },
  ],
  workingRangeC: { minC: 60, maxC: 70 },
};

function refusal(input: unknown): WaxInputError {
  try {
    parseRecipe(input);
  } catch (e) {
    if (e instanceof WaxInputError) return e;
    throw e;
  }
  throw new Error("expected the recipe to be refused");
}

describe("mixture density 1 / Σ (wᵢ/ρᵢ)", () => {
  it("gives 72/77 ≈ 0.9351 g/cm³ for 60/40 beeswax 0.96 / paraffin 0.90 (densities: SOURCES.md, encyclopedic entries / GESTIS)", () => {
    // Hand-worked: 0.6/0.96 + 0.4/0.90 = 5/8 + 4/9 = 77/72 cm³ per g, so ρ = 72/77 g/cm³.
    const rho = mixDensity([
      { pct: 60, densityGPerCm3: 0.96 },
      { pct: 40, densityGPerCm3: 0.9 },
    ]);
    expect(rho).toBeCloseTo(72 / 77, 12);
    expect(rho).toBeCloseTo(0.93506, 5);
  });

  it("agrees with a weighed batch: 600 g beeswax fill 625 cm³, 400 g paraffin 444.4 cm³, 1000 g in 1069.4 cm³", () => {
    const volumeCm3 = 600 / 0.96 + 400 / 0.9;
    expect(volumeCm3).toBeCloseTo(1069.444, 3);
    expect(1000 / volumeCm3).toBeCloseTo(mixDensity([
      { pct: 60, densityGPerCm3: 0.96 },
      { pct: 40, densityGPerCm3: 0.9 },
    ]), 12);
  });

  it("equals the volume-weighted mean Σ φᵢρᵢ with φᵢ = (wᵢ/ρᵢ)·ρ (a second formula, three components)", () => {
    const parts = [
      { pct: 50, densityGPerCm3: 0.96 },
      { pct: 30, densityGPerCm3: 0.9 },
      { pct: 20, densityGPerCm3: 1.07 },
    ];
    const rho = mixDensity(parts);
    const w = massFractions(parts);
    const phi = parts.map((p, i) => (w[i] / p.densityGPerCm3) * rho);
    expect(phi.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
    expect(parts.reduce((s, p, i) => s + phi[i] * p.densityGPerCm3, 0)).toBeCloseTo(rho, 12);
    // Lies between the lightest and the heaviest component.
    expect(rho).toBeGreaterThan(0.9);
    expect(rho).toBeLessThan(1.07);
  });

  it("with the SDS specific gravity of paraffin (0.92) instead of 0.90 gives 0.9436 g/cm³ (SOURCES.md: SDS value)", () => {
    expect(mixDensity([
      { pct: 60, densityGPerCm3: 0.96 },
      { pct: 40, densityGPerCm3: 0.92 },
    ])).toBeCloseTo(0.94359, 5);
  });
});

describe("a recipe's mix", () => {
  it("accepts shares that add up to 100 % within 0.01 % (33.33 + 33.33 + 33.34)", () => {
    const recipe = parseRecipe({
      ...dryMix,
      components: [
        { material: "beeswax", pct: 33.33 },
        { material: "paraffin", pct: 33.33 },
        { material: "rosin", pct: 33.34 },
      ],
    });
    expect(recipe.components).toHaveLength(3);
    expect(recipe.notes).toBeUndefined();
    expect(parseRecipe({ ...dryMix, components: [{ material: "beeswax", pct: 60.005 }, { material: "paraffin", pct: 40 }] }).components).toHaveLength(2);
  });

  it("refuses a mix that does not add up to 100 %, with the running total", () => {
    const e = refusal({ ...dryMix, components: [{ material: "beeswax", pct: 60 }, { material: "paraffin", pct: 30 }] });
    expect(e.field).toBe("components");
    expect(e.code).toBe("wax.mixNot100");
    expect(e.params).toEqual({ totalPct: 90 });
    expect(refusal({ ...dryMix, components: [{ material: "beeswax", pct: 60.02 }, { material: "paraffin", pct: 40 }] }).params.totalPct).toBe(100.02);
    expect(refusal({ ...dryMix, components: [{ material: "beeswax", pct: 70 }, { material: "paraffin", pct: 40 }] }).params).toEqual({ totalPct: 110 });
  });

  it("refuses a material listed twice, case and spaces aside, on the repeat's line", () => {
    const e = refusal({
      ...dryMix,
      components: [
        { material: "beeswax", pct: 30 },
        { material: "paraffin", pct: 40 },
        { material: " Beeswax", pct: 30 },
      ],
    });
    expect(e.issues).toEqual([{ field: "components.2.material", code: "wax.duplicateMaterial", params: { material: "Beeswax", line: 1 } }]);
  });

  it("refuses shares of 0, below 0 or above 100 %, and an empty mix", () => {
    const zero = refusal({ ...dryMix, components: [{ material: "beeswax", pct: 100 }, { material: "paraffin", pct: 0 }] });
    expect(zero.issues.map((i) => [i.field, i.code])).toEqual([["components.1.pct", "wax.pctRange"]]);
    const over = refusal({ ...dryMix, components: [{ material: "beeswax", pct: 120 }, { material: "paraffin", pct: -20 }] });
    expect(over.issues.map((i) => [i.field, i.code])).toEqual([
      ["components.0.pct", "wax.pctRange"],
      ["components.1.pct", "wax.pctRange"],
    ]);
    expect(refusal({ ...dryMix, components: [] }).issues).toContainEqual({ field: "components", code: "validation.tooFew", params: { min: 1 } });
  });

  it("names every bad field at once, each with a catalogue key", () => {
    const e = refusal({ name: " ", season: "monsoon", use: "stamping", components: [{ material: "beeswax" }], workingRangeC: { minC: 80, maxC: 60 } });
    expect(e.issues.map((i) => [i.field, i.code])).toEqual(
      expect.arrayContaining([
        ["name", "validation.required"],
        ["season", "validation.invalidOption"],
        ["components.0.pct", "validation.required"],
        ["workingRangeC.maxC", "validation.rangeOrder"],
      ]),
    );
    expect(e.issues.every((i) => /^(validation|wax)\.[A-Za-z0-9]+$/.test(i.code))).toBe(true);
  });
});

describe("analyseRecipe", () => {
  it("resolves materials by id or name, and gives density, melting range and the range in °F", () => {
    const a = analyseRecipe(parseRecipe({ ...dryMix, components: [{ material: "Beeswax", pct: 60 }, { material: "paraffin wax", pct: 40 }] }), DEFAULT_MATERIALS);
    expect(a.components.map((c) => [c.materialId, c.fraction])).toEqual([
      ["beeswax", 0.6],
      ["paraffin", 0.4],
    ]);
    expect(a.densityGPerCm3).toBeCloseTo(72 / 77, 12);
    // Envelope: paraffin starts at 46 °C, paraffin ends at 68 °C (beeswax 62–64 lies inside).
    expect(a.meltingRangeC).toEqual({ fromC: 46, toC: 68 });
    // 60 °C = 140 °F, 70 °C = 158 °F (°F = °C × 9/5 + 32, NIST SP 811).
    expect(a.workingRangeF).toEqual({ minF: 140, maxF: 158 });
  });

  it("takes the melting range from the lowest start to the highest end of the components", () => {
    const a = analyseRecipe(
      { components: [{ material: "paraffin", pct: 50 }, { material: "damar", pct: 50 }], workingRangeC: { minC: 70, maxC: 90 } },
      DEFAULT_MATERIALS,
    );
    expect(a.meltingRangeC).toEqual({ fromC: 46, toC: 85 });
  });

  it("refuses a material it does not know, on its line", () => {
    expect(() => analyseRecipe({ ...parseRecipe(dryMix), components: [{ material: "candle ends", pct: 100 }] }, DEFAULT_MATERIALS)).toThrow(
      expect.objectContaining({ field: "components.0.material", code: "wax.unknownMaterial", params: { material: "candle ends" } }),
    );
  });
});
