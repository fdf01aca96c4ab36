import { Matrix, inverse, solve } from "ml-matrix";
import { describe, expect, it } from "vitest";
import { seededNormal, seededUniform } from "@/scripts/lib/seeded-random";
import {
  WaxInputError,
  calibrateRates,
  calibratedRate,
  fitThroughOrigin,
  parseWax,
  useAreaM2,
  useGrams,
  waxUseSchema,
  type WaxUseRecord,
} from "@/lib/wax";

/** Synthetic uses of one recipe with a known rate (g/m²) and Gaussian noise of `sigmaG` grams, from a seed. */
function syntheticUses(count: number, rate: number, sigmaG: number, seed: number, extra: Partial<WaxUseRecord> = {}): WaxUseRecord[] {
  const uniform = seededUniform(seed);
  const normal = seededNormal(seed + 1);
  return Array.from({ length: count }, (_, i) => {
    const use = { recipeId: "r-dry", waxedAreaPerMetreM2: 0.5 + 2 * uniform(), metres: 10 + 50 * uniform(), passes: 1 + Math.floor(3 * uniform()) };
    return { id: `u${i}`, ...use, ...extra, gramsUsed: rate * useAreaM2(use) + sigmaG * normal() };
  });
}

/** Least squares through the origin by ml-matrix (QR solve, (XᵀX)⁻¹ s²): an independent general-purpose library. */
function matrixFit(xs: number[], ys: number[]) {
  const X = Matrix.columnVector(xs);
  const y = Matrix.columnVector(ys);
  const beta = solve(X, y);
  const residual = y.clone().sub(X.mmul(beta));
  const s2 = residual.transpose().mmul(residual).get(0, 0) / (xs.length - 1);
  const cov = inverse(X.transpose().mmul(X)).mul(s2);
  return { slope: beta.get(0, 0), standardError: Math.sqrt(cov.get(0, 0)), residualSd: Math.sqrt(s2) };
}

describe("fitThroughOrigin", () => {
  it("recovers an exact rate with no spread", () => {
    const fit = fitThroughOrigin([1, 2, 5, 10].map((x) => ({ x, y: 90 * x })));
    expect(fit.slope).toBeCloseTo(90, 12);
    expect(fit.residualSd).toBeCloseTo(0, 9);
    expect(fit.standardError).toBeCloseTo(0, 9);
  });

  it("works a small case by hand: x = 1, 2, 3; y = 2, 4.5, 5.5 → Σxy/Σx² = 27.5/14", () => {
    const fit = fitThroughOrigin([{ x: 1, y: 2 }, { x: 2, y: 4.5 }, { x: 3, y: 5.5 }]);
    const slope = 27.5 / 14;
    const sse = (2 - slope) ** 2 + (4.5 - 2 * slope) ** 2 + (5.5 - 3 * slope) ** 2;
    expect(fit.slope).toBeCloseTo(slope, 12);
    expect(fit.residualSd).toBeCloseTo(Math.sqrt(sse / 2), 12);
    expect(fit.standardError).toBeCloseTo(Math.sqrt(sse / 2 / 14), 12);
    expect(fitThroughOrigin([{ x: 2, y: 180 }])).toMatchObject({ slope: 90, n: 1, residualSd: null, standardError: null });
  });

  it("matches ml-matrix (npm, general-purpose matrix library) on noisy synthetic uses", () => {
    const uses = syntheticUses(25, 90, 150, 7);
    const xs = uses.map(useAreaM2);
    const ys = uses.map(useGrams);
    const ours = fitThroughOrigin(xs.map((x, i) => ({ x, y: ys[i] })));
    const theirs = matrixFit(xs, ys);
    expect(ours.slope).toBeCloseTo(theirs.slope, 9);
    expect(ours.standardError).toBeCloseTo(theirs.standardError, 9);
    expect(ours.residualSd).toBeCloseTo(theirs.residualSd, 6);
  });
});

describe("calibrateRates from synthetic uses with a known rate of 90 g/m² (seeded noise)", () => {
  it("comes back within three standard errors, with a spread near the noise put in", () => {
    const sigma = 100;
    const uses = syntheticUses(30, 90, sigma, 2026);
    const cal = calibrateRates(uses);
    expect(cal.flagged).toEqual([]);
    const fit = cal.byRecipe[0].fit;
    const expectedSe = sigma / Math.sqrt(uses.reduce((s, u) => s + useAreaM2(u) ** 2, 0));
    expect(fit.uses).toBe(30);
    expect(Math.abs(fit.rateGPerM2 - 90)).toBeLessThan(3 * expectedSe);
    expect(fit.standardErrorGPerM2! / expectedSe).toBeGreaterThan(0.6);
    expect(fit.standardErrorGPerM2! / expectedSe).toBeLessThan(1.4);
    expect(fit.residualSdG! / sigma).toBeGreaterThan(0.6);
    expect(fit.residualSdG! / sigma).toBeLessThan(1.4);
    expect(fit.totalAreaM2).toBeCloseTo(uses.reduce((s, u) => s + useAreaM2(u), 0), 9);
  });

  it("its standard error is honest: over 400 seeded runs of 12 uses, ±t(0.975, 11)·SE holds the true rate about 95 % of the time", () => {
    let covered = 0;
    for (let trial = 0; trial < 400; trial++) {
      const fit = calibrateRates(syntheticUses(12, 90, 400, 10_000 + trial * 7)).byRecipe[0].fit;
      if (Math.abs(fit.rateGPerM2 - 90) <= 2.201 * fit.standardErrorGPerM2!) covered++;
    }
    expect(covered / 400).toBeGreaterThan(0.92);
    expect(covered / 400).toBeLessThan(0.98);
  });
});

describe("calibrateRates per recipe and cloth", () => {
  const uses: WaxUseRecord[] = [
    ...[10, 20, 30, 40].map((x) => ({ recipeId: "r-dry", clothId: "prima", waxedAreaPerMetreM2: x / 10, metres: 10, gramsUsed: 80 * x })),
    ...[10, 30].map((x) => ({ recipeId: "r-dry", clothId: "primissima", waxedAreaPerMetreM2: x / 10, metres: 10, gramsUsed: 100 * x })),
    { recipeId: "r-dry", clothId: null, waxedAreaPerMetreM2: 1, metres: 20, gramsUsed: 1800 },
    ...[5, 15].map((x) => ({ recipeId: "r-rainy", clothId: "prima", waxedAreaPerMetreM2: 1, metres: x, gramsUsed: 95 * x })),
  ];

  it("fits each recipe, and each (recipe, cloth) with at least 3 uses", () => {
    const cal = calibrateRates(uses);
    expect(cal.minUses).toBe(3);
    expect(cal.byRecipe.map((r) => [r.recipeId, r.fit.uses, r.enoughUses])).toEqual([
      ["r-dry", 7, true],
      ["r-rainy", 2, false],
    ]);
    expect(cal.byRecipeCloth.map((p) => [p.recipeId, p.clothId, p.fit.uses])).toEqual([["r-dry", "prima", 4]]);
    expect(cal.byRecipeCloth[0].fit.rateGPerM2).toBeCloseTo(80, 12);
    // Recipe fit by hand: Σxy / Σx² over all seven uses.
    const xs = [10, 20, 30, 40, 10, 30, 20];
    const ys = [800, 1600, 2400, 3200, 1000, 3000, 1800];
    const expected = xs.reduce((s, x, i) => s + x * ys[i], 0) / xs.reduce((s, x) => s + x * x, 0);
    expect(cal.byRecipe[0].fit.rateGPerM2).toBeCloseTo(expected, 12);
  });

  it("offers the cloth's rate, else falls back to the recipe's, else none", () => {
    const cal = calibrateRates(uses);
    expect(calibratedRate(cal, "r-dry", "prima")).toMatchObject({ basis: "recipeCloth", rateGPerM2: expect.closeTo(80, 12) });
    expect(calibratedRate(cal, "r-dry", "primissima")).toMatchObject({ basis: "recipe", rateGPerM2: cal.byRecipe[0].fit.rateGPerM2 });
    expect(calibratedRate(cal, "r-dry")?.basis).toBe("recipe");
    expect(calibratedRate(cal, "r-rainy", "prima")).toBeNull();
    expect(calibratedRate(calibrateRates(uses, { minUses: 2 }), "r-rainy", "prima")).toMatchObject({ basis: "recipeCloth", rateGPerM2: expect.closeTo(95, 12) });
  });

  it("flags and leaves out uses with no waxed area or negative grams", () => {
    const cal = calibrateRates([
      ...uses.slice(0, 4),
      { id: "empty", recipeId: "r-dry", waxedAreaPerMetreM2: 0, metres: 10, gramsUsed: 500 },
      { id: "gained", recipeId: "r-dry", waxedAreaPerMetreM2: 1, metres: 10, potBeforeG: 3000, potAfterG: 3500 },
      { id: "unweighed", recipeId: "r-dry", waxedAreaPerMetreM2: 1, metres: 10 },
    ]);
    expect(cal.flagged).toEqual([
      { index: 4, id: "empty", code: "wax.useZeroArea", params: { areaM2: 0 } },
      { index: 5, id: "gained", code: "wax.useNegativeGrams", params: { grams: -500 } },
      { index: 6, id: "unweighed", code: "wax.useNegativeGrams", params: { grams: 0 } },
    ]);
    expect(cal.byRecipe[0].fit).toMatchObject({ uses: 4, rateGPerM2: expect.closeTo(80, 12) });
  });
});

describe("a recorded wax use", () => {
  it("counts area × metres × passes and grams from the pot weighed before and after (plus wax added)", () => {
    const use = parseWax(waxUseSchema, { recipeId: "r-dry", waxedAreaPerMetreM2: 0.8, metres: 25, passes: 2, potBeforeG: 5000, potAddedG: 500, potAfterG: 3200 });
    expect(use.clothId).toBeUndefined();
    expect(useAreaM2(use)).toBeCloseTo(40, 12);
    expect(useGrams(use)).toBe(2300);
    expect(useGrams({ ...use, gramsUsed: 1234 })).toBe(1234);
  });

  it("is refused with zero area, grams and pot both, or a pot that gained weight", () => {
    const issues = (input: unknown) => {
      try {
        parseWax(waxUseSchema, input);
      } catch (e) {
        if (e instanceof WaxInputError) return e.issues.map((i) => [i.field, i.code]);
        throw e;
      }
      return [];
    };
    const base = { recipeId: "r-dry", waxedAreaPerMetreM2: 0.8, metres: 10 };
    expect(issues({ ...base, waxedAreaPerMetreM2: 0, gramsUsed: 100 })).toEqual([["waxedAreaPerMetreM2", "wax.mustBePositive"]]);
    expect(issues({ ...base, gramsUsed: -5 })).toEqual([["gramsUsed", "validation.tooSmall"]]);
    expect(issues({ ...base, gramsUsed: 100, potBeforeG: 900 })).toEqual([["gramsUsed", "wax.gramsOrPot"]]);
    expect(issues(base)).toEqual([["gramsUsed", "validation.required"]]);
    expect(issues({ ...base, potBeforeG: 900 })).toEqual([["potAfterG", "validation.required"]]);
    expect(issues({ ...base, potBeforeG: 900, potAfterG: 1000 })).toEqual([["potAfterG", "wax.potGained"]]);
    expect(issues({ ...base, potBeforeG: 900, potAddedG: 200, potAfterG: 1000 })).toEqual([]);
  });
});
