import { describe, expect, it } from "vitest";
import {
  currentStage,
  defaultStages,
  findingInputSchema,
  flaggedStamps,
  measuredRecoveryOf,
  measuredRecoveryPct,
  parseRun,
  progressGrams,
  progressInputSchema,
  progressIssuesForKind,
  readingWarnings,
  RunInputError,
  runTotals,
  stageInputSchema,
  stageNeed,
} from "@/lib/runs";

const colour = (position: number, name: string, waxStamps: string[], extra: Partial<{ bleach: boolean; face: "front" | "back" | "both" }> = {}) => ({
  position,
  name,
  swatch: "#112233",
  waxStamps,
  face: extra.face ?? ("front" as const),
  bleach: extra.bleach,
});

describe("default stages from a colourway", () => {
  // The order of work as SPEC section 1 describes it: each colour put on, wax over what must keep it, the next
  // colour, and the boil-off (lorod) last.
  it("puts each colour's stage before the waxing over it and the boil-off last", () => {
    const stages = defaultStages([colour(1, "Indigo", ["CP-0002"]), colour(0, "Soga", ["CP-0001"], { face: "both" }), colour(2, "Brown", [])]);
    expect(stages.map((s) => `${s.kind}:${s.colourName ?? ""}`)).toEqual(["dye:Soga", "wax:Soga", "dye:Indigo", "wax:Indigo", "dye:Brown", "boil_off:"]);
    expect(stages[1]).toMatchObject({ waxMethod: "stamp", faces: "both", stamps: [{ code: "CP-0001", face: "both" }] });
    expect(stages[0]).toMatchObject({ dyeMethod: "bath", waxMethod: null });
  });

  it("bleaches where the colourway says, and a colourway without colours is the boil-off alone", () => {
    expect(defaultStages([colour(0, "Ground", ["CP-1"]), colour(1, "White", [], { bleach: true })]).map((s) => s.kind)).toEqual(["dye", "wax", "bleach", "boil_off"]);
    expect(defaultStages([]).map((s) => s.kind)).toEqual(["boil_off"]);
  });

  it("is at the first stage not done", () => {
    const stages = [
      { position: 1, state: "underway" },
      { position: 0, state: "done" },
      { position: 2, state: "planned" },
    ];
    expect(currentStage(stages)?.position).toBe(1);
    expect(currentStage([{ position: 0, state: "done" }])).toBeNull();
  });
});

describe("a waxing stage's need", () => {
  const components = [
    { material: "beeswax", pct: 60, densityGPerCm3: 0.96, pricePerKg: null },
    { material: "paraffin", pct: 40, densityGPerCm3: 0.9, pricePerKg: null },
  ];
  // Worked by hand: 0.35 m²/m × 1 pass × 120 g/m² × 1.10 = 46.2 g/m; × 50 m = 2.31 kg (SPEC 5.3's formula).
  // Impressions: a long cloth of 2.65 m with 65 impressions (lib/plans/run.ts's worked example) → 65 / 2.65 per
  // metre × 50 m = 1226.4… → 1226; at 26 an hour (common practice: 2–3 h a face for a long cloth) = 47.15 h.
  it("takes the wax from the estimator and the hours from the stamping rate", () => {
    const need = stageNeed({
      plan: { waxedAreaPerMetreM2: 0.35, impressionsTotal: 65, runLengthMm: 2650, sides: 1 },
      metres: 50,
      pieces: 19,
      passes: 1,
      rateGPerM2: 120,
      lossPct: 10,
      components,
      impressionsPerHour: 26,
    });
    expect(need.gramsPerMetre).toBeCloseTo(46.2, 9);
    expect(need.kgEstimated).toBeCloseTo(2.31, 9);
    expect(need.byMaterial.map((m) => m.material)).toEqual(["beeswax", "paraffin"]);
    expect(need.byMaterial.reduce((a, m) => a + m.kg, 0)).toBeCloseTo(2.31, 9);
    expect(need.impressions).toBe(1226);
    expect(need.hours).toBeCloseTo(1226 / 26, 9);
  });

  // A whole long cloth at the default rate: 65 impressions ÷ 26 an hour = 2.5 h, inside the 2–3 h a face of
  // common practice (SPEC section 1).
  it("gives a long cloth the hours of common practice", () => {
    const need = stageNeed({ plan: { waxedAreaPerMetreM2: 0.3, impressionsTotal: 65, runLengthMm: 2650, sides: 1 }, metres: 2.65, pieces: 1, passes: 1, rateGPerM2: 100, lossPct: 0, components, impressionsPerHour: 26 });
    expect(need.hours).toBeGreaterThanOrEqual(2);
    expect(need.hours).toBeLessThanOrEqual(3);
  });
});

describe("run totals", () => {
  it("are the sums of the stages", () => {
    const stages = [
      { kgEstimated: 2.31, impressionsEstimated: 1226, hoursEstimated: 47.15, gramsUsed: 2400, gramsRecovered: 0, impressionsDone: 1200 },
      { kgEstimated: 0, impressionsEstimated: 0, hoursEstimated: 0, gramsUsed: 0, gramsRecovered: 0, impressionsDone: 0 },
      { kgEstimated: 1.5, impressionsEstimated: 800, hoursEstimated: 30, gramsUsed: 1650.5, gramsRecovered: 0, impressionsDone: 810 },
      { kgEstimated: 0, impressionsEstimated: 0, hoursEstimated: 0, gramsUsed: 0, gramsRecovered: 2900, impressionsDone: 0 },
    ];
    const t = runTotals(stages);
    expect(t.wax.kgEstimated).toBeCloseTo(3.81, 9);
    expect(t.wax.kgUsed).toBeCloseTo(4.0505, 9);
    expect(t.wax.kgRecovered).toBeCloseTo(2.9, 9);
    expect(t.hours).toBeCloseTo(77.15, 9);
    expect(t.impressions).toEqual({ estimated: 2026, done: 2010 });
    expect(runTotals([])).toEqual({ wax: { kgEstimated: 0, kgUsed: 0, kgRecovered: 0 }, hours: 0, impressions: { estimated: 0, done: 0 } });
  });

  it("measure the recovery over the boil-offs recorded", () => {
    // (2900 + 1000) / (4000 + 2000) = 65 %, by hand.
    expect(measuredRecoveryPct([{ gramsUsed: 4000, gramsRecovered: 2900 }, { gramsUsed: 2000, gramsRecovered: 1000 }, { gramsUsed: 3000, gramsRecovered: 0 }])).toBeCloseTo(65, 9);
    expect(measuredRecoveryPct([])).toBeNull();
    expect(measuredRecoveryPct([{ gramsUsed: 100, gramsRecovered: 150 }])).toBe(100);
    // The estimate form says how many boil-offs the figure comes from: the runs with both wax used and recovered.
    expect(measuredRecoveryOf([{ gramsUsed: 4000, gramsRecovered: 2900 }, { gramsUsed: 2000, gramsRecovered: 1000 }, { gramsUsed: 3000, gramsRecovered: 0 }])).toEqual({ pct: 65, boilOffs: 2 });
    expect(measuredRecoveryOf([{ gramsUsed: 0, gramsRecovered: 500 }])).toBeNull();
  });
});

describe("the flag rule (common practice: three findings of one kind from one stamp within 30 days)", () => {
  const f = (stampId: string | null, kind: "seeped" | "pooled", foundOn: string) => ({ stampId, kind, foundOn });
  // January has 31 days (Gregorian calendar): 1 Jan … 30 Jan is 30 days counted both ends, 1 Jan … 31 Jan is 31.
  it("flags three of one kind within 30 days, counting both ends", () => {
    expect(flaggedStamps([f("a", "seeped", "2026-01-01"), f("a", "seeped", "2026-01-15"), f("a", "seeped", "2026-01-30")])).toEqual([
      { stampId: "a", kind: "seeped", findings: 3, firstOn: "2026-01-01", lastOn: "2026-01-30" },
    ]);
    expect(flaggedStamps([f("a", "seeped", "2026-01-01"), f("a", "seeped", "2026-01-15"), f("a", "seeped", "2026-01-31")])).toEqual([]);
  });

  it("does not add up different kinds, different stamps or findings without a stamp", () => {
    expect(flaggedStamps([f("a", "seeped", "2026-01-01"), f("a", "pooled", "2026-01-02"), f("a", "seeped", "2026-01-03")])).toEqual([]);
    expect(flaggedStamps([f("a", "seeped", "2026-01-01"), f("b", "seeped", "2026-01-02"), f(null, "seeped", "2026-01-03")])).toEqual([]);
  });

  it("stops flagging once the last finding is more than 30 days before today", () => {
    const three = [f("a", "pooled", "2026-03-01"), f("a", "pooled", "2026-03-02"), f("a", "pooled", "2026-03-03")];
    expect(flaggedStamps(three, "2026-04-01")).toHaveLength(1);
    expect(flaggedStamps(three, "2026-04-02")).toEqual([]);
  });
});

describe("pot reading cautions", () => {
  // Water boils at 100 °C under standard atmospheric pressure (IUPAC); SPEC 5.3 warns of fumes above it.
  it("warns above the recipe's range and above 100 °C", () => {
    expect(readingWarnings(72, { minC: 60, maxC: 75 })).toEqual([]);
    expect(readingWarnings(80, { minC: 60, maxC: 75 })).toEqual(["aboveRange"]);
    expect(readingWarnings(100, { minC: 60, maxC: 110 })).toEqual([]);
    expect(readingWarnings(100.5, { minC: 60, maxC: 110 })).toEqual(["fumes"]);
    expect(readingWarnings(120, { minC: 60, maxC: 75 })).toEqual(["aboveRange", "fumes"]);
    expect(readingWarnings(120, null)).toEqual(["fumes"]);
  });
});

describe("input schemas", () => {
  const issues = (schema: Parameters<typeof parseRun>[0], input: unknown) => {
    try {
      parseRun(schema, input);
      return [];
    } catch (error) {
      expect(error).toBeInstanceOf(RunInputError);
      return (error as RunInputError).issues.map((i) => `${i.field}:${i.code}`);
    }
  };

  it("asks a waxing stage for its method (its plan and recipe may follow), a dye stage for its method, and dates in order", () => {
    expect(issues(stageInputSchema, { kind: "wax" })).toEqual(["waxMethod:validation.required"]);
    expect(issues(stageInputSchema, { kind: "wax", waxMethod: "stamp" })).toEqual([]);
    expect(issues(stageInputSchema, { kind: "wax", waxMethod: "screen", recipeId: "r" })).toEqual([]);
    expect(issues(stageInputSchema, { kind: "dye" })).toEqual(["dyeMethod:validation.required"]);
    expect(issues(stageInputSchema, { kind: "bleach", planId: "p" })).toEqual(["planId:runs.onlyWaxing"]);
    expect(issues(stageInputSchema, { kind: "boil_off", plannedStartOn: "2026-02-02", plannedEndOn: "2026-02-01" })).toEqual(["plannedEndOn:runs.datesOrder"]);
  });

  it("reads the wax used from the pot and refuses a pot that gained", () => {
    expect(progressGrams({ potBeforeG: 5000, potAfterG: 3200, potAddedG: 500 })).toBe(2300);
    expect(progressGrams({ gramsUsed: 10 })).toBe(10);
    expect(progressGrams({})).toBeNull();
    expect(issues(progressInputSchema, { doneOn: "2026-01-01", metres: 10, potBeforeG: 100, potAfterG: 200 })).toEqual(["potAfterG:wax.potGained"]);
    expect(issues(progressInputSchema, { doneOn: "2026-01-01" })).toEqual(["metres:runs.progressNeedsAmount"]);
  });

  it("keeps wax and recovery to the stages they belong to", () => {
    const p = parseRun(progressInputSchema, { doneOn: "2026-01-01", metres: 10, gramsUsed: 300, recoveredG: 20 });
    expect(progressIssuesForKind("dye", p)).toEqual([
      { field: "gramsUsed", code: "runs.onlyWaxing" },
      { field: "recoveredG", code: "runs.onlyBoilOff" },
    ]);
    expect(progressIssuesForKind("wax", parseRun(progressInputSchema, { doneOn: "2026-01-01", pieces: 3 }))).toEqual([
      { field: "gramsUsed", code: "validation.required" },
      { field: "metres", code: "runs.waxingNeedsMetres" },
    ]);
  });

  it("takes a finding of the five kinds with a count of at least one", () => {
    expect(parseRun(findingInputSchema, { foundOn: "2026-01-01", kind: "pooled" })).toMatchObject({ count: 1, repair: "none" });
    expect(issues(findingInputSchema, { foundOn: "2026-01-01", kind: "burnt", count: 0 })).toEqual(["kind:validation.invalidOption", "count:validation.tooSmall"]);
  });
});
