import { describe, expect, it } from "vitest";
import { computeLayout, LayoutInputError, type LayoutInput } from "@/lib/layout";
import { pathDataErrorAt } from "@/lib/layout/outline";

const good: LayoutInput = {
  cloth: { widthMm: 1150, lengthMm: 2500 },
  stamp: { widthMm: 200, heightMm: 200 },
  arrangement: "straight",
};

function failure(input: unknown): LayoutInputError {
  try {
    computeLayout(input as LayoutInput);
  } catch (e) {
    if (e instanceof LayoutInputError) return e;
    throw new Error(`expected a LayoutInputError, got ${String(e)}`);
  }
  throw new Error("expected computeLayout to refuse the input");
}

function withStamp(stamp: Record<string, unknown>): unknown {
  return { ...good, stamp: { ...good.stamp, ...stamp } };
}

describe("bad input gets a LayoutInputError naming the field", () => {
  const cases: Array<[string, unknown, string, string]> = [
    ["zero stamp width", withStamp({ widthMm: 0 }), "stamp.widthMm", "tooSmall"],
    ["negative stamp height", withStamp({ heightMm: -20 }), "stamp.heightMm", "tooSmall"],
    ["a 0.01 mm stamp", withStamp({ widthMm: 0.01 }), "stamp.widthMm", "tooSmall"],
    ["negative cloth width", { ...good, cloth: { widthMm: -1, lengthMm: 1000 } }, "cloth.widthMm", "tooSmall"],
    ["a 10 km run", { ...good, cloth: { widthMm: 1150, lengthMm: 10_000_000 } }, "cloth.lengthMm", "tooBig"],
    [
      "20 000 pieces of 2.5 m",
      { ...good, cloth: { widthMm: 1150, pieces: 10_000, pieceLengthMm: 2500 } },
      "cloth.pieces",
      "runTooLong",
    ],
    [
      "margins wider than the cloth",
      { ...good, cloth: { widthMm: 1000, lengthMm: 1000, margins: { leftMm: 600, rightMm: 400 } } },
      "cloth.margins",
      "marginsWiderThanCloth",
    ],
    [
      "a stamp wider than the band",
      { ...good, cloth: { widthMm: 1000, lengthMm: 1000, margins: { leftMm: 450, rightMm: 400 } } },
      "stamp.widthMm",
      "stampWiderThanBand",
    ],
    ["a stamp longer than the run", { ...good, cloth: { widthMm: 1000, lengthMm: 150 } }, "cloth.lengthMm", "stampLongerThanRun"],
    ["a gap that swallows the stamp", { ...good, gap: { xMm: -200, yMm: 0 } }, "gap.xMm", "gapTooNegative"],
    ["an unknown arrangement", { ...good, arrangement: "spiral" }, "arrangement", "invalidOption"],
    ["a diagonal without its step", { ...good, arrangement: "diagonal" }, "diagonalStep", "required"],
    ["a diagonal step that never repeats", { ...good, arrangement: "diagonal", diagonalStep: 0.377 }, "diagonalStep", "notSimpleFraction"],
    ["rotation order 5", { ...good, arrangement: "rotation", rotationOrder: 5 }, "rotationOrder", "invalidOption"],
    ["three sides", { ...good, sides: 3 }, "sides", "invalidOption"],
    ["a width given as text", withStamp({ widthMm: "200" }), "stamp.widthMm", "invalidType"],
    ["an outline that is not path data", withStamp({ outline: "hello" }), "stamp.outline", "outlineInvalid"],
    ["path data with junk inside", withStamp({ outline: "M0 0 L 10 x 20 Z" }), "stamp.outline", "outlineInvalid"],
    ["path data not starting with a move", withStamp({ outline: "L10 10 L20 20 Z" }), "stamp.outline", "outlineInvalid"],
    ["an arc with a bad flag", withStamp({ outline: "M0 0 A10 10 0 2 0 5 5 Z" }), "stamp.outline", "outlineInvalid"],
    ["a line with no area", withStamp({ outline: "M0 0 L100 100" }), "stamp.outline", "outlineNoArea"],
    ["a flat triangle", withStamp({ outline: "M0 0 L100 0 L200 0 Z" }), "stamp.outline", "outlineNoArea"],
    ["an outline beyond the footprint", withStamp({ outline: "M0 0 H300 V100 H0 Z" }), "stamp.outline", "outlineOutsideFootprint"],
    ["markup in the outline", withStamp({ outline: 'M0 0 H10"/><script>' }), "stamp.outline", "outlineInvalid"],
    ["a window past the run", { ...good, window: { startMm: 3000, lengthMm: 500 } }, "window.startMm", "windowOutsideRun"],
  ];
  for (const [name, input, field, code] of cases) {
    it(name, () => {
      const e = failure(input);
      expect(e.field).toBe(field);
      expect(e.code).toBe(code);
      expect(e.messageKey).toMatch(/^(validation|layout)\.[A-Za-z]+$/);
    });
  }

  it("lists every problem, not only the first", () => {
    const e = failure({ cloth: { widthMm: -1, lengthMm: 0 }, stamp: { widthMm: 0, heightMm: 0 }, arrangement: "x" });
    expect(e.issues.map((i) => i.field).sort()).toEqual(
      ["arrangement", "cloth.lengthMm", "cloth.widthMm", "stamp.heightMm", "stamp.widthMm"].sort(),
    );
  });

  it("carries the bound for the message", () => {
    const e = failure(withStamp({ widthMm: 0.01 }));
    expect(e.params).toMatchObject({ min: 5 });
  });

  it("refuses a layout too dense to compute rather than running for minutes", () => {
    // 5 mm stamps stepped 1 mm across a 5 m cloth: tens of thousands of impressions overlap any strip.
    const e = failure({
      cloth: { widthMm: 5000, lengthMm: 1000 },
      stamp: { widthMm: 5, heightMm: 5 },
      gap: { xMm: -4, yMm: -4 },
      arrangement: "straight",
    });
    expect(e.code).toBe("layoutTooDense");
    expect(e.field).toMatch(/^gap\./);
  });

  it("refuses an impression list too long to send", () => {
    const e = failure({
      cloth: { widthMm: 5000, lengthMm: 10_000 },
      stamp: { widthMm: 5, heightMm: 5 },
      arrangement: "straight",
      window: { startMm: 0, lengthMm: 10_000 },
      impressions: true,
    });
    expect(e).toMatchObject({ field: "window.lengthMm", code: "windowTooLarge" });
  });

  it("never throws anything but LayoutInputError for junk", () => {
    for (const junk of [null, undefined, 42, "layout", [], {}, { cloth: null }, { ...good, stamp: null }, { ...good, gap: "x" }]) {
      expect(() => computeLayout(junk as LayoutInput)).toThrow(LayoutInputError);
    }
  });
});

describe("path data syntax check", () => {
  it("accepts lines, curves, arcs, relative commands and implicit repeats", () => {
    for (const d of [
      "M0 0 L10 0 L10 10 Z",
      "m0,0 l10,0 0,10 z",
      "M0 0 C5 -5 15 -5 20 0 S35 5 40 0 Q45 5 50 0 T60 0 V20 H0 Z",
      "M10 10 A5 5 0 1 0 20 10 a5 5 0 0 1 -10 0 z M2 2 h3 v3 h-3 z",
      "M1e1 2.5e-1 L.5.5 L-3-4Z",
    ]) {
      expect(pathDataErrorAt(d)).toBe(-1);
    }
  });

  it("points at the first bad character", () => {
    expect(pathDataErrorAt("M0 0 L 10 x 20")).toBe(10);
    expect(pathDataErrorAt("M0 0 L 10")).toBe(5);
    expect(pathDataErrorAt("")).toBe(0);
  });
});
