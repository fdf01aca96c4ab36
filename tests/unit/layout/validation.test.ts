import { describe, expect, it } from "vitest";
import { layoutInputSchema } from "@/lib/layout/schema";
import { layoutRequestSchema } from "@/lib/validation/layout";

const body = {
  cloth: { widthMm: 1150, lengthMm: 2500, margins: { leftMm: 20, rightMm: 20 } },
  stamp: { widthMm: 200, heightMm: 200 },
  arrangement: "half-drop",
};

function issues(schema: typeof layoutRequestSchema | typeof layoutInputSchema, value: unknown) {
  const r = schema.safeParse(value);
  if (r.success) return [];
  return r.error.issues.map((i) => ({ path: i.path.join("."), message: i.message }));
}

describe("POST /api/v1/layout body", () => {
  it("fills the defaults of SPEC section 6", () => {
    const r = layoutRequestSchema.parse({ cloth: { widthMm: 1150, lengthMm: 2500 }, stamp: { code: "CP-0142" }, arrangement: "straight" });
    expect(r).toMatchObject({
      cloth: { margins: { leftMm: 0, rightMm: 0 } },
      gap: { xMm: 0, yMm: 0 },
      align: "centre",
      edges: "whole",
      sides: 1,
      stamp: { code: "CP-0142" },
      impressions: false,
      preview: false,
      window: { startMm: 0, lengthMm: 1000 },
    });
  });

  it("takes a stamp by its sizes, with an outline and coverage", () => {
    const r = layoutRequestSchema.parse({ ...body, stamp: { widthMm: 180, heightMm: 240, coverage: 0.4, outline: " M0 0 H10 V10 Z " } });
    expect(r.stamp).toEqual({ widthMm: 180, heightMm: 240, coverage: 0.4, outline: "M0 0 H10 V10 Z", fillRule: "nonzero" });
  });

  it("takes pieces × piece length instead of a length (a kodi of 20)", () => {
    const r = layoutRequestSchema.parse({ ...body, cloth: { widthMm: 1060, pieces: 20, pieceLengthMm: 2650 } });
    expect(r.cloth).toMatchObject({ pieces: 20, pieceLengthMm: 2650 });
  });

  it("answers with message keys, never prose", () => {
    const found = issues(layoutRequestSchema, {
      cloth: { widthMm: "wide", lengthMm: -5, margins: { leftMm: -1 } },
      stamp: { widthMm: 1, heightMm: 5000, coverage: 2, fillRule: "odd" },
      gap: { xMm: "a" },
      arrangement: "zigzag",
      align: "right",
      edges: 3,
      sides: 4,
    });
    expect(found.length).toBeGreaterThanOrEqual(10);
    for (const issue of found) expect(issue.message).toMatch(/^validation\.[a-zA-Z]+$/);
  });

  it.each([
    ["cloth.lengthMm", { ...body, cloth: { widthMm: 1150, lengthMm: 10_000_000 } }, "validation.tooBig"],
    ["stamp.widthMm", { ...body, stamp: { widthMm: 0.01, heightMm: 200 } }, "validation.tooSmall"],
    ["stamp.heightMm", { ...body, stamp: { widthMm: 200, heightMm: 1200 } }, "validation.tooBig"],
    ["cloth.widthMm", { ...body, cloth: { widthMm: 6000, lengthMm: 1000 } }, "validation.tooBig"],
    ["cloth.margins", { ...body, cloth: { widthMm: 1000, lengthMm: 1000, margins: { leftMm: 500, rightMm: 500 } } }, "validation.marginsWiderThanCloth"],
    ["cloth.lengthMm", { ...body, cloth: { widthMm: 1000 } }, "validation.required"],
    ["cloth.lengthMm", { ...body, cloth: { widthMm: 1000, lengthMm: 1000, pieces: 2, pieceLengthMm: 500 } }, "validation.lengthOrPieces"],
    ["cloth.pieceLengthMm", { ...body, cloth: { widthMm: 1000, pieces: 20 } }, "validation.required"],
    ["cloth.pieces", { ...body, cloth: { widthMm: 1000, pieces: 2.5, pieceLengthMm: 2000 } }, "validation.notAnInteger"],
    ["cloth.pieces", { ...body, cloth: { widthMm: 1000, pieces: 1000, pieceLengthMm: 2500 } }, "validation.runTooLong"],
    ["gap.xMm", { ...body, gap: { xMm: -199.5, yMm: 0 } }, "validation.gapTooNegative"],
    ["gap.yMm", { ...body, gap: { xMm: 0, yMm: -250 } }, "validation.gapTooNegative"],
    ["diagonalStep", { ...body, arrangement: "diagonal" }, "validation.required"],
    ["diagonalStep", { ...body, arrangement: "diagonal", diagonalStep: 1 }, "validation.tooBig"],
    ["diagonalStep", { ...body, arrangement: "diagonal", diagonalStep: 0.123 }, "validation.notSimpleFraction"],
    ["rotationOrder", { ...body, arrangement: "rotation", rotationOrder: 8 }, "validation.invalidOption"],
    ["stamp.coverage", { ...body, stamp: { widthMm: 200, heightMm: 200, coverage: 0 } }, "validation.tooSmall"],
    ["stamp.outline", { ...body, stamp: { widthMm: 200, heightMm: 200, outline: "   " } }, "validation.required"],
    ["stamp.code", { ...body, stamp: { code: "CP-1", widthMm: 200 } }, "validation.codeOrSize"],
    ["stamp.heightMm", { ...body, stamp: { widthMm: 200 } }, "validation.required"],
    ["window.lengthMm", { ...body, window: { lengthMm: 50_000 } }, "validation.tooBig"],
  ])("refuses a bad %s", (path, value, message) => {
    expect(issues(layoutRequestSchema, value)).toContainEqual({ path, message });
  });

  it("allows a gap down to 1 mm short of the stamp size (overlapping repeats)", () => {
    expect(issues(layoutRequestSchema, { ...body, gap: { xMm: -199, yMm: -199 } })).toEqual([]);
  });

  it("accepts thirds written to four places as a simple fraction", () => {
    expect(issues(layoutRequestSchema, { ...body, arrangement: "diagonal", diagonalStep: 0.6667 })).toEqual([]);
  });

  it("needs the stamp's sizes for the engine (no code)", () => {
    expect(issues(layoutInputSchema, { ...body, stamp: { code: "CP-1" } })).toContainEqual({
      path: "stamp.widthMm",
      message: "validation.required",
    });
  });
});
