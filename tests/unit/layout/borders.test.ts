import polygonClipping, { type MultiPolygon, type Polygon } from "polygon-clipping";
import { describe, expect, it } from "vitest";
import { computeLayout, LayoutInputError, type Impression, type LayoutInput } from "@/lib/layout";
import { clipperLibBackend } from "@/lib/layout/polygon";
import { commonPeriod } from "@/lib/layout/overlap";
import { layoutRequestSchema } from "@/lib/validation/layout";

// 1150 mm cloth, 20 mm margins: the band is x ∈ [20, 1130], 1110 mm. A 60 × 100 mm border stamp on both sides,
// 10 mm between impressions down the length and 10 mm to the field; a 200 mm field stamp laid straight.
const base: LayoutInput = {
  cloth: { widthMm: 1150, lengthMm: 10_000, margins: { leftMm: 20, rightMm: 20 } },
  stamp: { widthMm: 200, heightMm: 200 },
  arrangement: "straight",
  borders: [{ side: "both", stamp: { widthMm: 60, heightMm: 100 }, gapYMm: 10, gapToFieldMm: 10 }],
};

const layout = (extra: Partial<LayoutInput> = {}) => computeLayout({ ...base, ...extra } as LayoutInput);
const border = (extra: Record<string, unknown>) => ({ borders: [{ ...base.borders![0], ...extra }] }) as Partial<LayoutInput>;

describe("a border on both sides, worked by hand", () => {
  const r = layout({ impressions: true, window: { startMm: 0, lengthMm: 10_000 } });

  it("narrows the field band by each border and its gap", () => {
    // Left strip [20, 80], right strip [1070, 1130]; field band [80 + 10, 1070 − 10] = [90, 1060], 970 mm.
    expect(r.layers.map((l) => [l.layer, l.bandMm])).toEqual([
      ["field", { x0: 90, x1: 1060 }],
      ["border-left", { x0: 20, x1: 80 }],
      ["border-right", { x0: 1070, x1: 1130 }],
    ]);
    expect(r.fieldBandMm).toEqual({ x0: 90, x1: 1060 });
    expect(r.bandWidthMm).toBe(1110);
  });

  it("counts across, per metre and per run", () => {
    // Field: ⌊970 / 200⌋ = 4 across (800 mm), 85 mm left on each side of the field band, 5 rows a metre → 20 a metre;
    // 10 m: 50 rows → 200. Border: one column every 110 mm → 1000 / 110 a metre on each side; the k-th impression
    // (k = 0, 1, …) ends at 110k + 100 ≤ 10 000 → k ≤ 90, so 91 on each side. Together 200 + 182 = 382.
    const [field, left, right] = r.layers;
    expect(r.across).toBe(4);
    expect(field.leftover).toEqual({ leftMm: 85, rightMm: 85 });
    expect(field.impressionsPerMetre).toBe(20);
    expect(field.impressionsTotal).toBe(200);
    for (const b of [left, right]) {
      expect(b.across).toBe(1);
      expect(b.periodMm).toBe(110);
      expect(b.impressionsPerMetre).toBeCloseTo(1000 / 110, 12);
      expect(b.impressionsTotal).toBe(91);
    }
    expect(r.impressionsPerMetre).toBeCloseTo(20 + 2000 / 110, 12);
    expect(r.impressionsTotal).toBe(382);
    expect(r.impressions).toHaveLength(382);
    // Borders start on the margin line (offset 0), so nothing is left between the margins and the nearest impression.
    expect(r.leftover).toEqual({ leftMm: 0, rightMm: 0 });
  });

  it("adds the layers' wax when they do not meet", () => {
    // Solid footprints: field 20 × 0.04 m² = 0.8 m² a metre; each border 6000 mm² × 1000/110 a metre = 0.0545… m².
    // 10 m: 200 × 0.04 + 2 × 91 × 0.006 = 9.092 m².
    expect(r.overlaps).toEqual([]);
    expect(r.waxedAreaPerMetreM2).toBeCloseTo(0.8 + (2 * 0.006 * 1000) / 110, 12);
    expect(r.waxedAreaTotalM2).toBeCloseTo(9.092, 12);
    expect(r.coverageOfBand).toBeCloseTo((0.8 + 12 / 110) / 1.11, 12);
    expect(r.layers[0].coverageOfBand).toBeCloseTo(0.8 / 0.97, 12);
  });

  it("keeps the fit table for the field band", () => {
    // N = 3, 4, 5 across 970 mm: gaps (970 − 200N) / (N − 1) = 185, 56.67, −7.5.
    expect(r.fitTable.map((f) => f.across)).toEqual([3, 4, 5]);
    expect(r.fitTable.map((f) => f.gapXMm)).toEqual([185, 170 / 3, -7.5]);
  });

  it("lists border impressions with their layer; the right one mirrored", () => {
    const left = r.impressions!.filter((i) => i.layer === "border-left");
    const right = r.impressions!.filter((i) => i.layer === "border-right");
    expect(left.slice(0, 3).map((i) => [i.xMm, i.yMm])).toEqual([
      [20, 0],
      [20, 110],
      [20, 220],
    ]);
    expect(right[0]).toMatchObject({ xMm: 1070, yMm: 0, widthMm: 60, heightMm: 100, mirrored: true, rotationDeg: 0 });
    // Mirrored within its strip: stamp (0, 0) lands on the strip's right edge.
    expect(right[0].matrix).toEqual([-1, 0, 0, 1, 1130, 0]);
  });
});

describe("border options", () => {
  it("turns the stamp a quarter: the strip takes its height, the repeat its width", () => {
    const r = layout({ ...border({ side: "left", turn: 90 }), impressions: true });
    const left = r.layers[1];
    expect(left.bandMm).toEqual({ x0: 20, x1: 120 });
    expect(left.periodMm).toBe(70);
    expect(r.fieldBandMm).toEqual({ x0: 130, x1: 1130 });
    const first = r.impressions!.find((i) => i.layer === "border-left")!;
    expect(first).toMatchObject({ xMm: 20, yMm: 0, widthMm: 100, heightMm: 60, rotationDeg: 90 });
    // 90° clockwise as seen (y down): stamp (0, 0) → top right of the laid box; (60, 0) → its bottom right.
    const [a, b, c, d, e, f] = first.matrix;
    expect([a * 0 + c * 0 + e, b * 0 + d * 0 + f]).toEqual([120, 0]);
    expect([a * 60 + e, b * 60 + f]).toEqual([120, 60]);
  });

  it("copies the left border to the right side mirrored, turned or the same", () => {
    const right = (rightCopy: string) => layout(border({ rightCopy, turn: 90, mirror: true })).layers[2];
    expect(right("mirror")).toMatchObject({ rotationDeg: 270, mirrored: false });
    expect(right("turn")).toMatchObject({ rotationDeg: 270, mirrored: true });
    expect(right("same")).toMatchObject({ rotationDeg: 90, mirrored: true });
  });

  it("starts the border down the piece and keeps its offset from the band edge", () => {
    const r = layout({ ...border({ startMm: 50, offsetMm: 15 }), impressions: true });
    expect(r.layers[1].bandMm).toEqual({ x0: 35, x1: 95 });
    expect(r.fieldBandMm).toEqual({ x0: 105, x1: 1045 });
    expect(r.leftover).toEqual({ leftMm: 15, rightMm: 15 });
    expect(r.impressions!.find((i) => i.layer === "border-left")!.yMm).toBe(50);
    // 50 + 110k + 100 ≤ 10 000 → k ≤ 89: one fewer, 90 on each side.
    expect(r.layers[1].impressionsTotal).toBe(90);
  });

  it("cuts border impressions at the piece end in clip mode, and leaves them out in whole mode", () => {
    // 1050 mm piece: whole impressions end at 110k + 100 ≤ 1050 → 9; clip adds the one at 990, cut to 60 mm.
    const cloth = { widthMm: 1150, lengthMm: 1050, margins: { leftMm: 20, rightMm: 20 } };
    const whole = layout({ cloth, ...border({ side: "left" }) }).layers[1];
    const clip = layout({ cloth, edges: "clip", ...border({ side: "left" }) }).layers[1];
    expect([whole.impressionsTotal, whole.impressionsClippedTotal]).toEqual([9, 0]);
    expect([clip.impressionsTotal, clip.impressionsClippedTotal]).toEqual([10, 1]);
    expect(whole.waxedAreaTotalM2).toBeCloseTo((9 * 6000) / 1e6, 12);
    expect(clip.waxedAreaTotalM2).toBeCloseTo((9 * 6000 + 60 * 60) / 1e6, 12);
  });

  it("doubles every layer on both faces, the back of the left border on the right", () => {
    const one = layout();
    const two = layout({ sides: 2, impressions: true, window: { startMm: 0, lengthMm: 200 } });
    expect(two.impressionsTotal).toBe(2 * one.impressionsTotal);
    expect(two.waxedAreaTotalM2).toBeCloseTo(2 * one.waxedAreaTotalM2, 12);
    expect(two.layers[1].waxedAreaPerMetreM2).toBeCloseTo(2 * one.layers[1].waxedAreaPerMetreM2, 12);
    const back = two.impressions!.find((i) => i.layer === "border-left" && i.face === "back")!;
    expect(back).toMatchObject({ xMm: 1150 - 20 - 60, mirrored: true });
  });

  it("without borders has one field layer equal to the totals", () => {
    const r = computeLayout({ ...base, borders: undefined });
    expect(r.layers).toHaveLength(1);
    expect(r.layers[0]).toMatchObject({
      layer: "field",
      bandMm: { x0: 20, x1: 1130 },
      impressionsTotal: r.impressionsTotal,
      waxedAreaTotalM2: r.waxedAreaTotalM2,
      waxedAreaPerMetreM2: r.waxedAreaPerMetreM2,
      leftover: r.leftover,
    });
    expect(r.overlaps).toEqual([]);
  });

  it("draws border layers in the preview", () => {
    const r = layout({ preview: true, impressions: true, window: { startMm: 0, lengthMm: 500 } });
    const svg = r.preview!;
    expect(svg).toContain('<g data-layer="border-left"');
    expect(svg).toContain('<path id="cg-wax-border-right" d="M0 0H60V100H0Z"');
    expect(svg.match(/<use /g)).toHaveLength(r.impressions!.filter((i) => i.face === "front").length);
  });

  it("is accepted by the API body schema beside the other fields", () => {
    const parsed = layoutRequestSchema.parse({ ...base, stamp: { code: "CP-001" } });
    expect(parsed.borders[0]).toMatchObject({ side: "both", turn: 0, mirror: false, offsetMm: 0, startMm: 0 });
  });
});

describe("overlap between the field and a border is counted once", () => {
  // Field left-aligned on a band starting 30 mm under the left border: the field covers x ∈ [50, 250] …, the border
  // x ∈ [20, 80]; they share the 30 mm strip x ∈ [50, 80].
  const under = (extra: Partial<LayoutInput> = {}) =>
    layout({ align: "left", ...border({ side: "left", gapToFieldMm: -30 }), ...extra });

  it("solid field rows: every border impression shares 30 × 100 mm²", () => {
    const r = under();
    // 91 border impressions × 3000 mm² = 0.273 m² over 10 m; 3000 × 1000 / 110 mm² a metre.
    expect(r.overlaps).toHaveLength(1);
    expect(r.overlaps[0]).toMatchObject({ layers: ["field", "border-left"], acrossMm: { x0: 50, x1: 80 }, periodMm: 2200, exact: true });
    expect(r.overlaps[0].pieceM2).toBeCloseTo(0.273, 9);
    expect(r.overlaps[0].perMetreM2).toBeCloseTo(3 / 110, 9);
    const [field, left] = r.layers;
    expect(field.waxedAreaTotalM2).toBeCloseTo(10, 9);
    expect(left.waxedAreaTotalM2).toBeCloseTo(0.546, 9);
    expect(r.waxedAreaTotalM2).toBeCloseTo(10 + 0.546 - 0.273, 9);
    expect(r.waxedAreaPerMetreM2).toBeCloseTo(1 + 6 / 110 - 3 / 110, 9);
  });

  it("gapped field rows: the shared area follows the two periods (common period 220 mm)", () => {
    // Field rows 200 mm tall every 220 mm; border impressions 100 mm every 110 mm. In one 220 mm period the border
    // at y = 0 lies in the row [0, 200] (30 × 100), the one at 110 reaches [110, 210] (30 × 90): 5700 mm².
    const r = under({ gap: { xMm: 0, yMm: 20 } });
    expect(commonPeriod(220, 110)).toBe(220);
    expect(r.overlaps[0].periodMm).toBe(220);
    expect(r.overlaps[0].perMetreM2).toBeCloseTo((5700 * 1000) / 220 / 1e6, 9);
  });

  it("with coverage ratios the two unrelated wax patterns share ca × cb of the common area", () => {
    const solid = under();
    const r = under({ stamp: { widthMm: 200, heightMm: 200, coverage: 0.5 }, ...border({ side: "left", gapToFieldMm: -30, stamp: { widthMm: 60, heightMm: 100, coverage: 0.4 } }) });
    expect(r.overlaps[0].pieceM2).toBeCloseTo(0.2 * solid.overlaps[0].pieceM2, 9);
    expect(r.waxedAreaTotalM2).toBeCloseTo(0.5 * 10 + 0.4 * 0.546 - 0.2 * 0.273, 9);
  });

  it("finds common periods on the polygon grid, and none past the bound", () => {
    expect(commonPeriod(195, 110)).toBe(4290);
    expect(commonPeriod(202.5, 110)).toBe(8910);
    expect(commonPeriod(197.3, 113.7)).toBeNull();
    expect(commonPeriod((200 * Math.sqrt(3)) / 2, 110)).toBeNull();
  });
});

describe("border refusals name the field", () => {
  const refused = (extra: Partial<LayoutInput>): LayoutInputError => {
    try {
      layout(extra);
    } catch (e) {
      if (e instanceof LayoutInputError) return e;
      throw e;
    }
    throw new Error("expected a refusal");
  };
  const narrow = { widthMm: 600, lengthMm: 10_000, margins: { leftMm: 20, rightMm: 20 } };
  const cases: Array<[string, Partial<LayoutInput>, string, string]> = [
    ["a border wider than the band", { cloth: narrow, ...border({ side: "left", stamp: { widthMm: 600, heightMm: 100 } }) }, "borders.0.stamp.widthMm", "borderWiderThanBand"],
    ["a turned border taller than the band is wide", { cloth: narrow, ...border({ side: "left", turn: 270, stamp: { widthMm: 60, heightMm: 700 } }) }, "borders.0.stamp.heightMm", "borderWiderThanBand"],
    ["an offset that pushes the border out", { cloth: narrow, ...border({ side: "left", offsetMm: 520 }) }, "borders.0.offsetMm", "borderWiderThanBand"],
    ["borders that overlap each other", { cloth: narrow, ...border({ offsetMm: 230 }) }, "borders.0.offsetMm", "bordersOverlap"],
    ["borders that leave no field", { cloth: narrow, ...border({ stamp: { widthMm: 250, heightMm: 100 }, gapToFieldMm: 30 }) }, "borders", "noRoomForField"],
    ["a field stamp wider than the field band", { cloth: narrow, ...border({ stamp: { widthMm: 180, heightMm: 100 } }) }, "stamp.widthMm", "stampWiderThanFieldBand"],
    ["a field reaching past the band edge", border({ side: "left", gapToFieldMm: -70 }), "borders.0.gapToFieldMm", "borderGapTooNegative"],
    ["a border longer than the run", { cloth: { ...narrow, lengthMm: 250 }, ...border({ stamp: { widthMm: 60, heightMm: 300 } }) }, "cloth.lengthMm", "borderLongerThanRun"],
    ["two borders on the left", { borders: [{ side: "left", stamp: { widthMm: 60, heightMm: 100 } }, { side: "both", stamp: { widthMm: 60, heightMm: 100 } }] }, "borders.1.side", "borderSideTwice"],
    ["three borders", { borders: Array.from({ length: 3 }, () => ({ side: "left" as const, stamp: { widthMm: 60, heightMm: 100 } })) }, "borders", "tooMany"],
    ["a right copy for one side", border({ side: "left", rightCopy: "mirror" }), "borders.0.rightCopy", "rightCopyNeedsBoth"],
    ["a start beyond one repeat", border({ startMm: 110 }), "borders.0.startMm", "borderStartBeyondRepeat"],
    ["a gap down the length that swallows the stamp", border({ gapYMm: -100 }), "borders.0.gapYMm", "gapTooNegative"],
    ["a turn that is not a quarter", border({ turn: 45 }), "borders.0.turn", "invalidOption"],
    ["a border outline that is not path data", border({ stamp: { widthMm: 60, heightMm: 100, outline: "hello" } }), "borders.0.stamp.outline", "outlineInvalid"],
  ];
  for (const [name, extra, field, code] of cases) {
    it(name, () => {
      const e = refused(extra);
      expect(e.field).toBe(field);
      expect(e.code).toBe(code);
    });
  }
});

// A lopsided 64-gon inside a 180 mm footprint (as in area.test.ts) and a lopsided 40-gon inside a 60 × 100 mm border
// footprint, both asymmetric so that mirrored and turned copies differ.
const FIELD: Array<[number, number]> = Array.from({ length: 64 }, (_, k) => {
  const t = (2 * Math.PI * k) / 64;
  const r = 88 * (0.78 + 0.18 * Math.cos(4 * t) + 0.04 * Math.sin(3 * t + 0.7));
  return [Math.round((90 + r * Math.cos(t)) * 1000) / 1000, Math.round((90 + r * Math.sin(t)) * 1000) / 1000];
});
const BORDER: Array<[number, number]> = Array.from({ length: 40 }, (_, k) => {
  const t = (2 * Math.PI * k) / 40;
  const s = 0.86 + 0.12 * Math.cos(3 * t + 0.4);
  return [Math.round((30 + 29.5 * s * Math.cos(t)) * 1000) / 1000, Math.round((50 + 49.5 * s * Math.sin(t) + 3 * Math.cos(t)) * 1000) / 1000];
});
const path = (ring: Array<[number, number]>) => `M${ring.map(([x, y]) => `${x} ${y}`).join(" L")} Z`;

function shoelace(ring: Array<[number, number]>): number {
  let s = 0;
  for (let i = 0; i < ring.length; i++) {
    const [x0, y0] = ring[i];
    const [x1, y1] = ring[(i + 1) % ring.length];
    s += x0 * y1 - x1 * y0;
  }
  return Math.abs(s) / 2;
}
const areaOf = (mp: MultiPolygon) => mp.reduce((sum, poly) => sum + shoelace(poly[0] as Array<[number, number]>) - poly.slice(1).reduce((h, r) => h + shoelace(r as Array<[number, number]>), 0), 0);
const box = (x0: number, x1: number, y1: number): Polygon => [
  [
    [x0, 0],
    [x1, 0],
    [x1, y1],
    [x0, y1],
  ],
];

/** Every impression of every layer placed with polygon-clipping, each layer cut to its own band, all united. */
function fullUnion(r: ReturnType<typeof computeLayout>, lengthMm: number): number {
  const placed = (imp: Impression): Polygon => {
    const [a, b, c, d, e, f] = imp.matrix;
    const ring = imp.layer === "field" ? FIELD : BORDER;
    return [ring.map(([u, v]) => [a * u + c * v + e, b * u + d * v + f] as [number, number])];
  };
  const layers = r.layers.map((l) => {
    const polys = r.impressions!.filter((i) => i.layer === l.layer && i.face === "front").map(placed);
    return polygonClipping.intersection(polygonClipping.union(polys[0], ...polys.slice(1)), box(l.bandMm.x0, l.bandMm.x1, lengthMm));
  });
  return areaOf(polygonClipping.union(layers[0], ...layers.slice(1))) / 1e6;
}

describe("total waxed area against a full union by polygon-clipping (independent npm library)", () => {
  const lengthMm = 2600;
  const blobLayout = (extra: Partial<LayoutInput>): LayoutInput =>
    ({
      cloth: { widthMm: 1150, lengthMm, margins: { leftMm: 20, rightMm: 35 } },
      stamp: { widthMm: 180, heightMm: 180, outline: path(FIELD) },
      gap: { xMm: -40, yMm: -36 },
      arrangement: "half-drop",
      window: { startMm: 0, lengthMm },
      impressions: true,
      ...extra,
    }) as LayoutInput;
  const blobBorder = { stamp: { widthMm: 60, heightMm: 100, outline: path(BORDER) } };
  const cases: Array<[string, Partial<LayoutInput>]> = [
    ["both sides under the field, clip edges", { edges: "clip", borders: [{ side: "both", ...blobBorder, gapYMm: -12, gapToFieldMm: -25 }] }],
    [
      "turned and mirrored left border, right copy turned, whole edges",
      { align: "left", borders: [{ side: "both", ...blobBorder, turn: 90, mirror: true, rightCopy: "turn", gapYMm: -8, gapToFieldMm: -20, startMm: 15 }] },
    ],
    [
      "left and right borders of their own, periods with no short common multiple",
      {
        align: "left",
        gap: { xMm: -40, yMm: -36.7 },
        borders: [
          { side: "left", ...blobBorder, gapYMm: 3.7, gapToFieldMm: -18, offsetMm: 6 },
          { side: "right", ...blobBorder, turn: 180, gapYMm: -9.3, gapToFieldMm: -30 },
        ],
      },
    ],
  ];
  for (const [name, extra] of cases) {
    it(name, () => {
      const r = computeLayout(blobLayout(extra));
      expect(r.overlaps.length).toBeGreaterThan(0);
      const reference = fullUnion(r, lengthMm);
      expect(Math.abs(r.waxedAreaTotalM2 / reference - 1)).toBeLessThan(1e-6);
      // The layers do overlap, so counting the shared wax once matters.
      const layerSum = r.layers.reduce((s, l) => s + l.waxedAreaTotalM2, 0);
      expect(layerSum - reference).toBeGreaterThan(1e-4);
      // clipper-lib gives the same figure as the default backend.
      const byLib = computeLayout(blobLayout(extra), { polygons: clipperLibBackend });
      expect(Math.abs(byLib.waxedAreaTotalM2 / r.waxedAreaTotalM2 - 1)).toBeLessThan(1e-9);
    });
  }

  it("marks an overlap without a short common period as averaged over its window", () => {
    const r = computeLayout(blobLayout(cases[2][1]));
    expect(r.overlaps.some((o) => !o.exact && o.periodMm === null && o.windowMm > 0)).toBe(true);
  });
});
