import { describe, expect, it } from "vitest";
import { fractionInput, fractionText, layerPictures, newPlannerValues, planFieldErrors, planFormInput, plannerValues } from "@/lib/contracts/plans";
import { computeLayout, layoutOf } from "@/lib/layout";
import { engineStampOf, geometryRecord, resolveLayoutRequest, runSize, staleReasons, stampingTime, type LayoutRequestLike, type StampGeometryRecord } from "@/lib/plans";
import { planLayoutSchema } from "@/lib/validation/plans";

describe("run size and stamping time", () => {
  it("gives the run in metres, yards (NIST SP 811: 1 yd = 0.9144 m), pieces and kodi (20 pieces, common practice)", () => {
    const run = runSize({ runLengthMm: 106_000, pieces: 40, pieceLengthMm: 2650 }, true);
    expect(run.metres).toBe(106);
    expect(run.yards).toBeCloseTo(106 / 0.9144, 9);
    expect(run.kodi).toBe(2);
  });

  it("turns impressions into hours at the workshop's rate per face (common practice, not a published figure)", () => {
    // 1300 impressions over 20 pieces at 26 an hour: 50 h, 2.5 h and 65 impressions a piece (worked by hand).
    expect(stampingTime({ impressionsTotal: 1300, pieces: 20 }, 26)).toEqual({ impressionsPerHour: 26, hoursTotal: 50, hoursPerPiece: 2.5, impressionsPerPiece: 65 });
  });
});

describe("library stamps → engine input", () => {
  it("uses the outline when there is one, else the measured coverage, else the footprint", () => {
    expect(engineStampOf({ widthMm: 200, heightMm: 180, coverageRatio: 0.4, outlinePath: "M0 0 L200 0 L200 180 Z" })).toMatchObject({ outline: "M0 0 L200 0 L200 180 Z" });
    expect(engineStampOf({ widthMm: 200, heightMm: 180, coverageRatio: 0.4, outlinePath: null })).toMatchObject({ coverage: 0.4 });
    expect(engineStampOf({ widthMm: 200, heightMm: 180, coverageRatio: null, outlinePath: null })).not.toHaveProperty("coverage");
  });

  it("lays a saved layout out as the engine does the same input by size", () => {
    const layout = planLayoutSchema.parse({ cloth: { widthMm: 1150, lengthMm: 10_000, margins: { leftMm: 25, rightMm: 25 } }, stamp: { code: "cp-7" }, arrangement: "half-drop" });
    const spec = resolveLayoutRequest({ ...layout, borders: [] } as unknown as LayoutRequestLike, new Map([["CP-7", { widthMm: 200, heightMm: 200, fillRule: "nonzero" as const }]]));
    const direct = computeLayout({ cloth: { widthMm: 1150, lengthMm: 10_000, margins: { leftMm: 25, rightMm: 25 } }, stamp: { widthMm: 200, heightMm: 200 }, arrangement: "half-drop" });
    expect(spec.stamp).toMatchObject({ widthMm: 200, heightMm: 200 });
    expect(spec.window).toEqual({ startMm: 0, lengthMm: 1000 });
    const viaPlan = layoutOf(spec);
    expect(viaPlan.impressionsTotal).toBe(direct.impressionsTotal);
    expect(viaPlan.waxedAreaTotalM2).toBe(direct.waxedAreaTotalM2);
    // Half-drop of 5 columns on 10 m, worked by hand: 3 straight columns of 50 and 2 dropped ones of 49.
    expect(direct.impressionsTotal).toBe(248);
  });

  it("refuses an unknown code at the field that named it", () => {
    const layout = planLayoutSchema.parse({ cloth: { widthMm: 1150, lengthMm: 10_000 }, stamp: { code: "CP-1" }, arrangement: "straight" });
    expect(() => resolveLayoutRequest({ ...layout, borders: [{ side: "left", stamp: { code: "CP-2" } }] } as unknown as LayoutRequestLike, new Map([["CP-1", { widthMm: 200, heightMm: 200, fillRule: "nonzero" as const }]]))).toThrow(/stampNotFound at borders.0.stamp.code/);
  });
});

describe("the stale check", () => {
  const digest = (s: string) => `d${s.length}`;
  const saved: StampGeometryRecord[] = [geometryRecord("field", "CP-1", { widthMm: 200, heightMm: 200, coverage: 0.4, fillRule: "nonzero" }, digest), geometryRecord("border:0", "CP-2", { widthMm: 60, heightMm: 100, outline: "M0 0 L60 0 L60 100 Z", fillRule: "nonzero" }, digest)];
  it("is clean when nothing changed, and a new code alone is the same stamp", () => {
    const now = new Map(saved.map((r) => [r.role, { ...r, code: r.code + "X" }]));
    expect(staleReasons(saved, now)).toEqual([]);
  });
  it("names the size, outline, coverage or a missing stamp, role by role", () => {
    const now = new Map<string, StampGeometryRecord>([
      ["field", geometryRecord("field", "CP-1", { widthMm: 210, heightMm: 200, coverage: 0.5, fillRule: "nonzero" }, digest)],
      ["border:0", geometryRecord("border:0", "CP-2", { widthMm: 60, heightMm: 100, outline: "M0 0 L60 0 L60 100 L0 100 Z", fillRule: "nonzero" }, digest)],
    ]);
    expect(staleReasons(saved, now)).toEqual([
      { role: "field", code: "CP-1", changes: ["size", "coverage"] },
      { role: "border:0", code: "CP-2", changes: ["outline"] },
    ]);
    expect(staleReasons(saved, new Map())).toEqual([
      { role: "field", code: "CP-1", changes: ["missing"] },
      { role: "border:0", code: "CP-2", changes: ["missing"] },
    ]);
  });
});

describe("the planner form adapter", () => {
  const form = (values: Record<string, string>) => {
    const f = new FormData();
    for (const [k, v] of Object.entries(values)) f.set(k, v);
    return f;
  };
  it("converts inches and yards to mm, kodi to pieces, % to a ratio, and a border's fields", () => {
    const input = planFormInput(
      form({ unit: "in", runUnit: "yd", stampMode: "free", stampWidth: "8", stampHeight: "8", coveragePct: "40", clothWidth: "44", marginLeft: "1", marginRight: "1", runBy: "kodi", kodi: "2", pieceLength: "3", arrangement: "diagonal", diagonalStep: "1/3", sides: "2", borderSide: "both", borderStampCode: "cp-9", borderTurn: "90", borderGapToField: "0.5", name: "A plan" }),
      "en",
    );
    expect(input.layout.cloth).toEqual({ widthMm: 1117.6, margins: { leftMm: 25.4, rightMm: 25.4 }, pieces: 40, pieceLengthMm: 2743.2 });
    expect(input.layout.stamp).toEqual({ widthMm: 203.2, heightMm: 203.2, coverage: 0.4 });
    expect(input.layout.diagonalStep).toBeCloseTo(1 / 3, 12);
    expect(input.layout.sides).toBe(2);
    expect(input.borders[0]).toMatchObject({ side: "both", stamp: { code: "cp-9" }, turn: 90, rightCopy: "mirror", gapToFieldMm: 12.7 });
  });
  it("gives a saved plan's values back in the person's units", () => {
    const layout = planLayoutSchema.parse({ cloth: { widthMm: 1117.6, pieces: 40, pieceLengthMm: 2743.2, margins: { leftMm: 25.4, rightMm: 25.4 } }, stamp: { code: "CP-1" }, arrangement: "diagonal", diagonalStep: 1 / 3 });
    const values = plannerValues(layout, undefined, { unit: "in", runUnit: "yd" }, "en");
    expect(values).toMatchObject({ clothWidth: "44", marginLeft: "1", runBy: "kodi", kodi: "2", pieceLength: "3", diagonalStep: "1/3", stampMode: "library", stampCode: "CP-1", borderSide: "none" });
    expect(newPlannerValues({ unitSystem: "metric", stampCode: "CP-3", arrangement: "brick" }, "en")).toMatchObject({ clothWidth: "1060", stampCode: "CP-3", arrangement: "brick", runLength: "30" });
  });
  it("reads fractions and puts each refusal beside its field", () => {
    expect(fractionInput("1/4", "en")).toBe(0.25);
    expect(fractionInput("0.5", "en")).toBe(0.5);
    // Indonesian writes the decimal comma (CLDR).
    expect(fractionInput("0,5", "id")).toBe(0.5);
    expect(fractionText(0.5, "en")).toBe("1/2");
    expect(fractionText(0.123, "id")).toBe("0,123");
    expect(planFieldErrors({ "layout.cloth.widthMm": ["a"], "borders.0.gapYMm": ["b"], "layout.somethingElse": ["c"] })).toEqual({ clothWidth: ["a"], borderGapY: ["b"], _form: ["c"] });
  });
  it("draws each border's picture on its own edges", () => {
    const pic = { href: "/x", widthMm: 60, heightMm: 100 };
    const stamps = [{ role: "field", picture: null }, { role: "border:0", picture: pic }] as never;
    expect(layerPictures({ stamps, borders: [{ side: "left" }] as never })).toEqual({ field: null, "border-left": pic });
    expect(layerPictures({ stamps, borders: [{ side: "both" }] as never })).toEqual({ field: null, "border-left": pic, "border-right": pic });
  });
});
