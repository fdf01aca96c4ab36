import paper from "paper";
import { afterEach, describe, expect, it, vi } from "vitest";
import { computeLayout, LayoutInputError, type LayoutInput } from "@/lib/layout";
import { OUTLINE_MAX_BYTES, OUTLINE_MAX_SEGMENTS, OUTLINE_MAX_VERTICES } from "@/lib/layout/limits";
import { buildStampShape, flattenedVertexCount, scanPathData } from "@/lib/layout/outline";

const plan = (outline: string): LayoutInput => ({ cloth: { widthMm: 1150, lengthMm: 2000 }, stamp: { widthMm: 200, heightMm: 200, outline }, arrangement: "straight" });

function refusal(run: () => unknown): LayoutInputError {
  try {
    run();
  } catch (error) {
    if (error instanceof LayoutInputError) return error;
    throw error;
  }
  throw new Error("expected a LayoutInputError");
}

const zigzag = (n: number) => `M0 0${Array.from({ length: n }, (_, i) => ` L${i % 200} ${(i * 7) % 200}`).join("")} Z`;
const arcs = (n: number) => `M100 100${Array.from({ length: n }, (_, i) => ` A90 90 0 1 1 ${i % 2 ? 101 : 99} 100`).join("")} Z`;

afterEach(() => vi.restoreAllMocks());

describe("path segments", () => {
  it("count each command and each implicit repeat of its arguments", () => {
    // M, L, the repeated L, Z
    expect(scanPathData("M0 0 L10 0 10 10 Z")).toEqual({ errorAt: -1, segments: 4 });
    // M with three pairs: the move and two implicit lines; C with two curves
    expect(scanPathData("M0 0 5 5 10 0 C1 1 2 2 3 3 4 4 5 5 6 6 z").segments).toBe(6);
  });

  it("stop being read once the limit is passed", () => {
    const scan = scanPathData(`${zigzag(50)} junk`, 10);
    expect(scan.segments).toBe(11);
    expect(scan.errorAt).toBe(-1);
  });

  it(`over ${OUTLINE_MAX_SEGMENTS} are refused before paper.js parses the outline`, () => {
    const parse = vi.spyOn(paper.CompoundPath.prototype, "pathData", "set");
    const error = refusal(() => buildStampShape({ widthMm: 200, heightMm: 200, outline: zigzag(OUTLINE_MAX_SEGMENTS) }));
    expect(error.code).toBe("outlineTooManySegments");
    expect(error.params).toEqual({ max: OUTLINE_MAX_SEGMENTS });
    expect(parse).not.toHaveBeenCalled();
    // The spy does see a parse when there is one (a curve: straight lines alone are read without paper.js).
    buildStampShape({ widthMm: 200, heightMm: 200, outline: "M0 0 H100 V100 Q50 150 0 100 Z" });
    expect(parse).toHaveBeenCalled();
  });

  it("up to the limit are laid out", () => {
    expect(buildStampShape({ widthMm: 200, heightMm: 200, outline: zigzag(OUTLINE_MAX_SEGMENTS - 2) }).source).toBe("outline");
  });
});

describe("flattened points", () => {
  it("are counted from the curves, before flattening, as many as paper.js then makes", () => {
    const ps = new paper.PaperScope();
    ps.setup(new ps.Size(1, 1));
    for (const d of [arcs(20), "M0 0 C200 0 0 200 100 100 S 50 50 10 190 Z", "M10 10 Q100 190 190 10 T 10 10 Z", "M100 20 A80 80 0 1 1 99.9 20 Z", zigzag(30)]) {
      const item = new ps.CompoundPath({ pathData: d, insert: false });
      const counted = flattenedVertexCount(item, 0.01);
      item.flatten(0.01);
      const made = (item.children as paper.Path[]).reduce((n, c) => n + c.segments.length, 0);
      // Never fewer; paper.js drops chords of zero length (the zigzag's first line goes nowhere).
      expect(counted).toBeGreaterThanOrEqual(made);
      expect(counted - made).toBeLessThanOrEqual(Math.max(1, made * 0.01));
    }
  });

  it(`over ${OUTLINE_MAX_VERTICES} refuse the outline before it is flattened`, () => {
    const flatten = vi.spyOn(paper.Path.prototype, "flatten");
    // 2000 large arcs: about 500,000 points at 0.01 mm, seconds of work if flattened.
    const error = refusal(() => buildStampShape({ widthMm: 200, heightMm: 200, outline: arcs(2000) }));
    expect(error.code).toBe("outlineTooComplex");
    expect(error.params).toEqual({ max: OUTLINE_MAX_VERTICES });
    expect(flatten).not.toHaveBeenCalled();
    buildStampShape({ widthMm: 200, heightMm: 200, outline: "M100 20 A80 80 0 1 1 99.9 20 Z" });
    expect(flatten).toHaveBeenCalled();
  });
});

describe("outline bytes", () => {
  it(`over ${OUTLINE_MAX_BYTES} are refused by the input schema, naming the limit`, () => {
    const error = refusal(() => computeLayout(plan(zigzag(10).padEnd(OUTLINE_MAX_BYTES + 1, " "))));
    expect(error.field).toBe("stamp.outline");
    expect(error.code).toBe("outlineTooLarge");
    expect(error.params).toEqual({ max: OUTLINE_MAX_BYTES });
  });

  it("count UTF-8 bytes, not characters", () => {
    const error = refusal(() => computeLayout(plan(`${zigzag(3)}${"é".repeat(OUTLINE_MAX_BYTES / 2)}`)));
    expect(error.code).toBe("outlineTooLarge");
  });
});
