import { describe, expect, it } from "vitest";
import { computeLayout } from "@/lib/layout";
import {
  DEFAULT_MATERIALS,
  DEFAULT_RATE_G_PER_M2,
  PUBLISHED_BAND,
  WaxInputError,
  bandPosition,
  estimateComponents,
  estimateWax,
  mixDensity,
  rateFromFilmThickness,
  type EstimateInput,
} from "@/lib/wax";

// 60/40 beeswax/paraffin: common practice mix; densities 0.96 / 0.90 g/cm³ (SOURCES.md). Prices are test inputs.
const mix6040 = [
  { material: "beeswax", pct: 60, densityGPerCm3: 0.96, pricePerKg: 150_000 },
  { material: "paraffin", pct: 40, densityGPerCm3: 0.9, pricePerKg: 40_000 },
];

function refusal(input: unknown): WaxInputError {
  try {
    estimateWax(input as EstimateInput);
  } catch (e) {
    if (e instanceof WaxInputError) return e;
    throw e;
  }
  throw new Error("expected the estimate to be refused");
}

describe("estimateWax on hand-worked cases", () => {
  it("0.8 m²/m × 2 passes × 90 g/m² × 1.10 loss = 158.4 g/m; 50 m → 7.92 kg gross, 60 % recovered → 3.168 kg new", () => {
    const e = estimateWax({ waxedAreaPerMetreM2: 0.8, metres: 50, passes: 2, rateGPerM2: 90, lossPct: 10, recoveryPct: 60, components: mix6040 });
    expect(e.gramsPerMetre).toBeCloseTo(158.4, 10);
    expect(e.kgGross).toBeCloseTo(7.92, 10);
    expect(e.kgRecovered).toBeCloseTo(4.752, 10);
    expect(e.kgNew).toBeCloseTo(3.168, 10);
    expect(e.byMaterial.map((m) => m.material)).toEqual(["beeswax", "paraffin"]);
    expect(e.byMaterial[0].kg).toBeCloseTo(1.9008, 10);
    expect(e.byMaterial[1].kg).toBeCloseTo(1.2672, 10);
    // 1.9008 kg × 150 000 + 1.2672 kg × 40 000 = 285 120 + 50 688.
    expect(e.cost).toBeCloseTo(335_808, 6);
    expect(e.pricesMissing).toEqual([]);
    expect(e.densityGPerCm3).toBeCloseTo(72 / 77, 12);
    // 7.92 kg / (72/77 g/cm³) = 8.47 L of solid wax.
    expect(e.volumeLitres).toBeCloseTo(8.47, 10);
    expect(e.band.position).toBe("measured");
    expect(e.warnings).toEqual([]);
  });

  it("uses the defaults: one pass, no loss, no recovery", () => {
    const e = estimateWax({ waxedAreaPerMetreM2: 1.5, metres: 10, rateGPerM2: 100, components: mix6040 });
    expect(e.gramsPerMetre).toBe(150);
    expect(e.kgGross).toBe(1.5);
    expect(e.kgRecovered).toBe(0);
    expect(e.kgNew).toBe(1.5);
    expect(e.byMaterial.map((m) => m.kg)).toEqual([expect.closeTo(0.9, 12), expect.closeTo(0.6, 12)]);
    expect(e.band.position).toBe("benchmark");
  });

  it("needs no new wax when all of it is recovered", () => {
    const e = estimateWax({ waxedAreaPerMetreM2: 1, metres: 20, passes: 2, rateGPerM2: 80, recoveryPct: 100, components: mix6040 });
    expect(e.kgGross).toBe(3.2);
    expect(e.kgRecovered).toBe(3.2);
    expect(e.kgNew).toBe(0);
    expect(e.cost).toBe(0);
  });

  it("splits kg of new wax by mass %, summing back to kgNew, for three materials", () => {
    const e = estimateWax({
      waxedAreaPerMetreM2: 0.6,
      metres: 100,
      passes: 3,
      rateGPerM2: 85,
      recoveryPct: 50,
      components: [
        { material: "beeswax", pct: 50, densityGPerCm3: 0.96 },
        { material: "paraffin", pct: 30, densityGPerCm3: 0.9 },
        { material: "rosin", pct: 20, densityGPerCm3: 1.07 },
      ],
    });
    // 0.6 × 3 × 85 = 153 g/m; × 100 m = 15.3 kg; half recovered → 7.65 kg: 3.825 / 2.295 / 1.53 kg.
    expect(e.kgNew).toBeCloseTo(7.65, 10);
    expect(e.byMaterial.map((m) => m.kg)).toEqual([expect.closeTo(3.825, 10), expect.closeTo(2.295, 10), expect.closeTo(1.53, 10)]);
    expect(e.byMaterial.reduce((s, m) => s + m.kg, 0)).toBeCloseTo(e.kgNew, 12);
  });

  it("has no cost when a price is missing, and says which", () => {
    const e = estimateWax({ waxedAreaPerMetreM2: 0.8, metres: 10, passes: 2, rateGPerM2: 90, components: [mix6040[0], { ...mix6040[1], pricePerKg: null }] });
    expect(e.cost).toBeNull();
    expect(e.pricesMissing).toEqual(["paraffin"]);
    expect(e.byMaterial[0].cost).toBeCloseTo(e.byMaterial[0].kg * 150_000, 10);
    expect(e.warnings).toEqual([{ code: "wax.priceMissing", params: { materials: "paraffin" } }]);
  });

  it("refuses bad input with the field and a catalogue key", () => {
    expect(refusal({ waxedAreaPerMetreM2: 0.8, metres: 10, rateGPerM2: 90, components: [{ ...mix6040[0], pct: 60 }, { ...mix6040[1], pct: 30 }] }).issues).toEqual([
      { field: "components", code: "wax.mixNot100", params: { totalPct: 90 } },
    ]);
    const e = refusal({ waxedAreaPerMetreM2: 0, metres: -1, passes: 0, rateGPerM2: 90, lossPct: 101, components: mix6040 });
    expect(e.issues.map((i) => [i.field, i.code])).toEqual([
      ["waxedAreaPerMetreM2", "wax.mustBePositive"],
      ["metres", "wax.mustBePositive"],
      ["passes", "validation.tooSmall"],
      ["lossPct", "validation.tooBig"],
    ]);
    expect(refusal({ waxedAreaPerMetreM2: 0.8, metres: 10, passes: 1.5, rateGPerM2: 90, components: mix6040 }).code).toBe("validation.notAnInteger");
    expect(refusal({ waxedAreaPerMetreM2: 0.8, metres: 10, rateGPerM2: 90, components: [...mix6040, { ...mix6040[0], pct: 0.001 }] }).field).toBe("components.2.material");
  });
});

describe("where a result sits against the published band (benchmark 100–150 g/m, measured 152–242 g/m, Nurdalia 2006)", () => {
  it("places the boundaries: <100 below, 100–150 benchmark, up to 250 measured, beyond above", () => {
    expect(PUBLISHED_BAND.measuredGPerM).toEqual([152, 191, 242]);
    expect([99.99, 100, 150, 150.01, 191, 250, 250.01].map((g) => bandPosition(g).position)).toEqual([
      "below",
      "benchmark",
      "benchmark",
      "measured",
      "measured",
      "measured",
      "above",
    ]);
  });

  it("warns outside the band", () => {
    const low = estimateWax({ waxedAreaPerMetreM2: 0.5, metres: 10, rateGPerM2: 90, components: mix6040 });
    expect(low.warnings).toEqual([
      { code: "wax.belowPublishedBand", params: { gramsPerMetre: 45, min: 100, max: 250, source: "I. Nurdalia, Universitas Diponegoro, 2006" } },
    ]);
    const high = estimateWax({ waxedAreaPerMetreM2: 1, metres: 10, passes: 4, rateGPerM2: 90, components: mix6040 });
    expect(high.band.position).toBe("above");
    expect(high.warnings.map((w) => w.code)).toEqual(["wax.abovePublishedBand"]);
  });
});

describe("a realistic plan lands in the published 100–250 g/m band (Nurdalia 2006)", () => {
  it("derives the default rate from a 0.1 mm film of the 60/40 mix (film depth from memory; derived figure)", () => {
    const rho = mixDensity(mix6040);
    expect(rateFromFilmThickness(0.1, rho)).toBeCloseTo(93.5, 1);
    expect(DEFAULT_RATE_G_PER_M2).toBe(90);
  });

  // A 20 × 20 cm stamp (common practice), 40 % of its face carrying wax (from memory), laid straight on mori
  // 106 or 115 cm wide (trade sources), both faces, a long cloth 2.65 m long (about 2.5 × its width, Veldhuisen 1972).
  for (const widthMm of [1060, 1150]) {
    for (const passes of [2, 3]) {
      for (const lossPct of [0, 5]) {
        it(`${widthMm / 10} cm cloth, ${passes} passes, ${lossPct} % loss, default rate`, () => {
          const plan = computeLayout({
            cloth: { widthMm, lengthMm: 2650 },
            stamp: { widthMm: 200, heightMm: 200, coverage: 0.4 },
            arrangement: "straight",
            sides: 2,
          });
          expect(plan.across).toBe(5);
          const components = estimateComponents([{ material: "beeswax", pct: 60 }, { material: "paraffin", pct: 40 }], DEFAULT_MATERIALS);
          const e = estimateWax({ waxedAreaPerMetreM2: plan.waxedAreaPerMetreM2, metres: 2.65, passes, rateGPerM2: DEFAULT_RATE_G_PER_M2, lossPct, components });
          expect(e.gramsPerMetre).toBeGreaterThanOrEqual(100);
          expect(e.gramsPerMetre).toBeLessThanOrEqual(250);
          expect(["benchmark", "measured"]).toContain(e.band.position);
          expect(e.warnings.map((w) => w.code)).toEqual(["wax.priceMissing"]);
        });
      }
    }
  }
});

describe("estimateComponents", () => {
  it("resolves a recipe's materials by id or name into ids with density and price", () => {
    const materials = DEFAULT_MATERIALS.map((m) => (m.id === "beeswax" ? { ...m, pricePerKg: 150_000 } : m));
    expect(estimateComponents([{ material: "BEESWAX", pct: 70 }, { material: "Pine rosin (gondorukem)", pct: 30 }], materials)).toEqual([
      { material: "beeswax", pct: 70, densityGPerCm3: 0.96, pricePerKg: 150_000 },
      { material: "rosin", pct: 30, densityGPerCm3: 1.07, pricePerKg: null },
    ]);
  });
});
