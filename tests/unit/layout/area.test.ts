import polygonClipping, { type MultiPolygon, type Polygon } from "polygon-clipping";
import { describe, expect, it } from "vitest";
import { computeLayout, type Impression, type LayoutInput } from "@/lib/layout";
import { FLATTEN_TOLERANCE_MM } from "@/lib/layout/limits";
import { buildStampShape } from "@/lib/layout/outline";

/** Shoelace formula (Gauss's area formula), written out here independently of the engine. */
function shoelace(ring: Array<[number, number]>): number {
  let s = 0;
  for (let i = 0; i < ring.length; i++) {
    const [x0, y0] = ring[i];
    const [x1, y1] = ring[(i + 1) % ring.length];
    s += x0 * y1 - x1 * y0;
  }
  return s / 2;
}

function multiPolygonArea(mp: MultiPolygon): number {
  // polygon-clipping returns outer rings first, then holes; their shoelace signs are opposite.
  return mp.reduce((sum, poly) => {
    const [outer, ...holes] = poly.map((r) => Math.abs(shoelace(r as Array<[number, number]>)));
    return sum + outer - holes.reduce((a, b) => a + b, 0);
  }, 0);
}

function stampOnly(outline: string, fillRule?: "nonzero" | "evenodd") {
  return buildStampShape({ widthMm: 200, heightMm: 200, outline, fillRule });
}

describe("area of one impression against analytic values", () => {
  it("rectangle: 180 × 160 mm = 28 800 mm²", () => {
    expect(stampOnly("M10 20 H190 V180 H10 Z").areaMm2).toBeCloseTo(28_800, 6);
  });

  it("irregular pentagon: 21 650 mm² by the shoelace formula (worked by hand)", () => {
    // (20,10) (180,40) (150,190) (60,170) (10,90): cross terms −1000 + 28 200 + 14 100 + 3 700 − 1 700 = 43 300 → /2.
    expect(stampOnly("M20 10 L180 40 L150 190 L60 170 L10 90 Z").areaMm2).toBeCloseTo(21_650, 6);
  });

  it("circle of radius 100 from two arcs: πr² within the curve approximation's error", () => {
    // Arcs become cubic Béziers (4 per circle, radial error ≤ 2.7e-4 r, outward — A. Riškus, Information
    // Technology and Control 35(4), 2006) and are then
    // flattened to chords no farther than FLATTEN_TOLERANCE_MM from the curve (inward, area error ≤ 2·tol/r).
    const r = 100;
    const area = stampOnly("M200 100 A100 100 0 1 0 0 100 A100 100 0 1 0 200 100 Z").areaMm2;
    const relative = Math.abs(area / (Math.PI * r * r) - 1);
    expect(relative).toBeLessThan(2 * 2.7e-4 + (2 * FLATTEN_TOLERANCE_MM) / r);
  });

  it("holes follow the fill rule", () => {
    const sameTurn = "M0 0 H200 V200 H0 Z M50 50 H150 V150 H50 Z";
    const reversed = "M0 0 H200 V200 H0 Z M50 50 V150 H150 V50 Z";
    expect(stampOnly(sameTurn, "nonzero").areaMm2).toBeCloseTo(40_000, 6);
    expect(stampOnly(sameTurn, "evenodd").areaMm2).toBeCloseTo(30_000, 6);
    expect(stampOnly(reversed, "nonzero").areaMm2).toBeCloseTo(30_000, 6);
  });

  it("uses the footprint × coverage ratio when there is no outline", () => {
    const r = computeLayout({
      cloth: { widthMm: 1000, lengthMm: 1000 },
      stamp: { widthMm: 200, heightMm: 200, coverage: 0.35 },
      arrangement: "straight",
    });
    expect(r.impressionAreaMm2).toBeCloseTo(0.35 * 40_000, 9);
    expect(r.waxedAreaTotalM2).toBeCloseTo(0.35, 12);
  });
});

describe("overlaps are counted once", () => {
  it("a 220 mm square on a 200 mm repeat covers the band once, not 1.21 times", () => {
    // Stamp 220 with gap −20: cell 200. Band 1020: 5 across spanning 5·200 + 20 = 1020. Rows j·200 + 220 ≤ 1020 → 5.
    const r = computeLayout({
      cloth: { widthMm: 1020, lengthMm: 1020 },
      stamp: { widthMm: 220, heightMm: 220, outline: "M0 0 H220 V220 H0 Z" },
      gap: { xMm: -20, yMm: -20 },
      arrangement: "straight",
    });
    expect(r.across).toBe(5);
    expect(r.impressionsTotal).toBe(25);
    expect(r.coverageOfBand).toBeCloseTo(1, 9);
    expect(r.waxedAreaPerMetreM2).toBeCloseTo(1.02, 9);
    expect(r.waxedAreaTotalM2).toBeCloseTo(1.02 * 1.02, 9);
    expect(25 * 0.22 * 0.22).toBeCloseTo(1.21, 9);
  });
});

// A lopsided four-lobed 64-gon inside a 180 mm footprint, lobes towards the neighbours so that they overlap;
// asymmetric, so mirrored and turned copies differ.
const BLOB: Array<[number, number]> = Array.from({ length: 64 }, (_, k) => {
  const t = (2 * Math.PI * k) / 64;
  const r = 88 * (0.78 + 0.18 * Math.cos(4 * t) + 0.04 * Math.sin(3 * t + 0.7));
  return [Math.round((90 + r * Math.cos(t)) * 1000) / 1000, Math.round((90 + r * Math.sin(t)) * 1000) / 1000];
});
const BLOB_PATH = `M${BLOB.map(([x, y]) => `${x} ${y}`).join(" L")} Z`;

/**
 * Full union of every impression with polygon-clipping, cut to the band and the run, area by the shoelace formula;
 * and, for comparison, the sum of the impressions' areas each cut on its own (overlaps counted many times).
 */
function reference(impressions: Impression[], band: [number, number], lengthMm: number): { union: number; sum: number } {
  const polygons: Polygon[] = impressions.map((imp) => {
    const [a, b, c, d, e, f] = imp.matrix;
    return [BLOB.map(([u, v]) => [a * u + c * v + e, b * u + d * v + f] as [number, number])];
  });
  const frame: Polygon = [
    [
      [band[0], 0],
      [band[1], 0],
      [band[1], lengthMm],
      [band[0], lengthMm],
    ],
  ];
  const united = polygonClipping.union(polygons[0], ...polygons.slice(1));
  const union = multiPolygonArea(polygonClipping.intersection(united, frame));
  const sum = polygons.reduce((s, p) => s + multiPolygonArea(polygonClipping.intersection(p, frame)), 0);
  return { union, sum };
}

describe("waxed area against a full union by polygon-clipping (independent npm library)", () => {
  const cases: Array<[string, Partial<LayoutInput>]> = [
    ["half-drop, overlapping, clip", { arrangement: "half-drop", edges: "clip" }],
    ["half-drop, overlapping, whole", { arrangement: "half-drop", edges: "whole" }],
    ["mirror, clip, left aligned", { arrangement: "mirror", edges: "clip", align: "left" }],
    ["turnover, whole", { arrangement: "turnover" }],
    ["half-drop-mirror, clip", { arrangement: "half-drop-mirror", edges: "clip" }],
    ["brick, clip", { arrangement: "brick", edges: "clip" }],
    ["diagonal 1/3, clip", { arrangement: "diagonal", diagonalStep: 1 / 3, edges: "clip" }],
    ["rotation 4, clip", { arrangement: "rotation", rotationOrder: 4, edges: "clip", gap: { xMm: -70, yMm: -60 } }],
    ["rotation 3, whole", { arrangement: "rotation", rotationOrder: 3, gap: { xMm: -90, yMm: -60 } }],
    ["rotation 6, clip", { arrangement: "rotation", rotationOrder: 6, edges: "clip", gap: { xMm: -40, yMm: 0 } }],
  ];
  for (const [name, extra] of cases) {
    it(name, () => {
      const lengthMm = 2400;
      const r = computeLayout({
        cloth: { widthMm: 1150, lengthMm, margins: { leftMm: 20, rightMm: 35 } },
        stamp: { widthMm: 180, heightMm: 180, outline: BLOB_PATH },
        gap: { xMm: -40, yMm: -36 },
        window: { startMm: 0, lengthMm },
        impressions: true,
        ...extra,
      } as LayoutInput);
      expect(r.impressions!.length).toBe(r.impressionsTotal);
      const ref = reference(r.impressions!, [20, 1115], lengthMm);
      expect(Math.abs(r.waxedAreaTotalM2 - ref.union / 1e6) / (ref.union / 1e6)).toBeLessThan(1e-6);
      // The overlaps are real, so counting them once matters: the union is well below the plain sum.
      expect(ref.union).toBeLessThan(0.99 * ref.sum);
    });
  }
});
