import { describe, expect, it } from "vitest";
import { computeLayout, type LayoutInput } from "@/lib/layout";

// Hand-worked layouts. Every expected number below was worked out on paper from the definitions in
// SPEC section 5.1 (band = cloth − margins, cell = stamp + gap, rows start at y = 0), not by running the engine.

const square200 = { widthMm: 200, heightMm: 200 };

function layout(overrides: Partial<LayoutInput>): ReturnType<typeof computeLayout> {
  return computeLayout({
    cloth: { widthMm: 1000, lengthMm: 1000 },
    stamp: square200,
    arrangement: "straight",
    ...overrides,
  } as LayoutInput);
}

describe("straight (tubruk)", () => {
  // Cloth 1150, margins 25 + 25 → band 1100. Stamp 200, gap 10 → cell 210.
  // Across: N·200 + (N−1)·10 ≤ 1100 → N = 5, span 1040, 60 mm spare.
  const base: Partial<LayoutInput> = {
    cloth: { widthMm: 1150, lengthMm: 2000, margins: { leftMm: 25, rightMm: 25 } },
    gap: { xMm: 10, yMm: 10 },
  };

  it("counts across, rows, per metre and the run in whole mode", () => {
    const r = layout(base);
    expect(r.across).toBe(5);
    expect(r.bandWidthMm).toBe(1100);
    expect(r.rowsPerMetre).toBeCloseTo(1000 / 210, 10);
    expect(r.impressionsPerMetre).toBeCloseTo((5 * 1000) / 210, 10);
    // Rows fit while j·210 + 200 ≤ 2000 → j = 0…8, 9 rows × 5.
    expect(r.impressionsTotal).toBe(45);
    expect(r.impressionsClippedTotal).toBe(0);
    expect(r.leftover).toEqual({ leftMm: 30, rightMm: 30 });
    expect(r.pathName).toBe("tubruk");
    // Per period of 210 mm: 5 × 200 × 200 mm² → 200 000 × 1000/210 mm² per metre.
    expect(r.waxedAreaPerMetreM2).toBeCloseTo(200_000 / 210 / 1000, 12);
    expect(r.waxedAreaTotalM2).toBeCloseTo(45 * 0.04, 12);
    expect(r.coverageOfBand).toBeCloseTo(200_000 / (210 * 1100), 12);
  });

  it("puts the whole spare at the right when aligned left", () => {
    const r = layout({ ...base, align: "left" });
    expect(r.leftover).toEqual({ leftMm: 0, rightMm: 60 });
    expect(r.across).toBe(5);
  });

  it("adds cut impressions at both edges and at the run's end in clip mode", () => {
    // Centred origin at x = 55: columns 55 + 210·i. i = −1 spans [−155, 45] → 20 mm inside the band [25, 1125];
    // i = 5 spans [1105, 1305] → 20 mm inside. Rows: j·210 < 2000 → j = 0…9; row 9 spans 1890…2090 → 110 mm inside.
    const r = layout({ ...base, edges: "clip" });
    expect(r.rows[0]).toMatchObject({ whole: 5, clipped: 2, leftover: { leftMm: 0, rightMm: 0 } });
    expect(r.impressionsTotal).toBe(70);
    expect(r.impressionsWholeTotal).toBe(45);
    expect(r.impressionsClippedTotal).toBe(25);
    expect(r.impressionsPerMetre).toBeCloseTo((7 * 1000) / 210, 10);
    // Wax per period: 5 × 40 000 + 2 × 20 × 200 = 208 000 mm²; the two edge cuts 8 000 mm².
    expect(r.waxedAreaPerMetreM2).toBeCloseTo(208_000 / 210 / 1000, 12);
    expect(r.partialAreaPerMetreM2).toBeCloseTo(8_000 / 210 / 1000, 12);
    // Run: 9 full rows × 208 000 + last row 110 mm tall: 5 × 200 × 110 + 2 × 20 × 110 = 114 400 mm².
    expect(r.waxedAreaTotalM2).toBeCloseTo((9 * 208_000 + 114_400) / 1e6, 12);
  });
});

describe("half-drop (ondo-ende)", () => {
  // Band 1000, stamp 200, gap 0: 5 columns; odd columns (x = 200, 600) drop 100 mm.
  it("drops every other column by half a cell", () => {
    const r = layout({ arrangement: "half-drop" });
    expect(r.across).toBe(5);
    expect(r.rows).toHaveLength(1);
    expect(r.rowsPerMetre).toBe(5);
    expect(r.impressionsPerMetre).toBe(25);
    // Even columns: rows at 0…800 → 5 each; odd columns: 100 + 200·j + 200 ≤ 1000 → j = 0…3 → 4 each. 3·5 + 2·4.
    expect(r.impressionsTotal).toBe(23);
    expect(r.waxedAreaTotalM2).toBeCloseTo(23 * 0.04, 12);
    expect(r.waxedAreaPerMetreM2).toBeCloseTo(1, 12);
    expect(r.group).toBe("p1");
    expect(r.pathName).toBe("ondo-ende");
  });

  it("cuts the dropped columns at the head and tail in clip mode", () => {
    // Odd columns gain j = −1 (−100…100) and j = 4 (900…1100): 6 each → 3·5 + 2·6 = 27, of which 4 cut.
    const r = layout({ arrangement: "half-drop", edges: "clip" });
    expect(r.impressionsTotal).toBe(27);
    expect(r.impressionsClippedTotal).toBe(4);
    expect(r.waxedAreaTotalM2).toBeCloseTo(1, 12);
  });
});

describe("brick (ondo-ende)", () => {
  it("holds one impression fewer in the shifted rows", () => {
    // Row 0: 0, 200, …, 800 → 5. Row 1 shifted 100: 100…700 → 4 (900 would end at 1100), 100 mm each side.
    const r = layout({ arrangement: "brick" });
    expect(r.rows.map((row) => row.whole)).toEqual([5, 4]);
    expect(r.rows[1]).toMatchObject({ shiftXMm: 100, offsetYMm: 200, leftover: { leftMm: 100, rightMm: 100 } });
    expect(r.across).toBe(5);
    expect(r.leftover).toEqual({ leftMm: 0, rightMm: 0 });
    expect(r.rowsPerMetre).toBe(5);
    expect(r.impressionsPerMetre).toBe(22.5);
    // Rows at 0…800: types 0,1,0,1,0 → 5 + 4 + 5 + 4 + 5.
    expect(r.impressionsTotal).toBe(23);
    expect(r.waxedAreaPerMetreM2).toBeCloseTo(0.9, 12);
    expect(r.coverageOfBand).toBeCloseTo(0.9, 12);
  });

  it("fills the shifted rows with two cut halves in clip mode", () => {
    const r = layout({ arrangement: "brick", edges: "clip" });
    expect(r.rows.map((row) => [row.whole, row.clipped])).toEqual([
      [5, 0],
      [4, 2],
    ]);
    expect(r.coverageOfBand).toBeCloseTo(1, 12);
  });
});

describe("mirror, turnover, half-drop-mirror", () => {
  it("mirrors every other column", () => {
    const r = layout({ arrangement: "mirror", impressions: true });
    expect(r.across).toBe(5);
    expect(r.impressionsTotal).toBe(25);
    const firstRow = r.impressions!.filter((i) => i.rowIndex === 0).sort((a, b) => a.xMm - b.xMm);
    expect(firstRow.map((i) => i.mirrored)).toEqual([false, true, false, true, false]);
    expect(firstRow.map((i) => i.xMm)).toEqual([0, 200, 400, 600, 800]);
    expect(r.pathName).toBeNull();
  });

  it("turns every other row by 180°", () => {
    const r = layout({ arrangement: "turnover", impressions: true });
    expect(r.rows.map((row) => row.whole)).toEqual([5, 5]);
    expect(r.impressionsTotal).toBe(25);
    const turns = [0, 1, 2, 3, 4].map((k) => r.impressions!.find((i) => i.rowIndex === k)!.rotationDeg);
    expect(turns).toEqual([0, 180, 0, 180, 0]);
    // The turned copy stays on its footprint: matrix (−1, 0, 0, −1, x + 200, y + 200).
    const turned = r.impressions!.find((i) => i.rowIndex === 1 && i.xMm === 0)!;
    expect(turned.matrix).toEqual([-1, 0, 0, -1, 200, 400]);
  });

  it("drops and mirrors every other column", () => {
    const r = layout({ arrangement: "half-drop-mirror", impressions: true });
    expect(r.impressionsTotal).toBe(23);
    const dropped = r.impressions!.filter((i) => i.xMm === 200);
    expect(dropped.every((i) => i.mirrored && (i.yMm - 100) % 200 === 0)).toBe(true);
  });
});

describe("diagonal (parang)", () => {
  it("shifts each row by a quarter cell", () => {
    // Shifts 0, 50, 100, 150 mm: row 0 holds 5; the others 4 (leftover 50/150, 100/100, 150/50). Period 800 mm.
    const r = layout({ arrangement: "diagonal", diagonalStep: 0.25 });
    expect(r.rows.map((row) => row.whole)).toEqual([5, 4, 4, 4]);
    expect(r.rows.map((row) => row.shiftXMm)).toEqual([0, 50, 100, 150]);
    expect(r.rows.map((row) => row.leftover)).toEqual([
      { leftMm: 0, rightMm: 0 },
      { leftMm: 50, rightMm: 150 },
      { leftMm: 100, rightMm: 100 },
      { leftMm: 150, rightMm: 50 },
    ]);
    expect(r.periodMm).toBe(800);
    expect(r.impressionsPerMetre).toBeCloseTo(17 * (1000 / 800), 12);
    // Rows 0…4 in the first metre: types 0,1,2,3,0 → 5 + 4 + 4 + 4 + 5.
    expect(r.impressionsTotal).toBe(22);
    expect(r.pathName).toBe("parang");
  });

  it("snaps a rounded third to 1/3", () => {
    const r = layout({ arrangement: "diagonal", diagonalStep: 0.3333 });
    expect(r.rows).toHaveLength(3);
    expect(r.rows[1].shiftXMm).toBeCloseTo(200 / 3, 10);
  });
});

describe("rotation (mubeng)", () => {
  it("lays a pinwheel of four 100 mm stamps as a 200 mm rosette", () => {
    // Turned about the top-left corner, the four copies fill [−100, 100]²: rosette 200 × 200, 5 across a 1000 band.
    const r = layout({ arrangement: "rotation", rotationOrder: 4, stamp: { widthMm: 100, heightMm: 100 } });
    expect(r.cell).toEqual({ widthMm: 200, heightMm: 200 });
    expect(r.across).toBe(20);
    expect(r.rowsPerMetre).toBe(5);
    expect(r.impressionsPerMetre).toBe(100);
    expect(r.impressionsTotal).toBe(100);
    expect(r.waxedAreaTotalM2).toBeCloseTo(1, 12);
    expect(r.group).toBe("p4");
    expect(r.pathName).toBe("mubeng");
  });

  it("counts the whole wedges of a rosette cut by the band", () => {
    // Band 1100, left aligned: 5 rosettes (1000 mm) and the left half of a sixth (two wedges at 1000…1100).
    const r = layout({
      arrangement: "rotation",
      rotationOrder: 4,
      align: "left",
      cloth: { widthMm: 1100, lengthMm: 1000 },
      stamp: { widthMm: 100, heightMm: 100 },
    });
    expect(r.across).toBe(22);
    expect(r.leftover).toEqual({ leftMm: 0, rightMm: 0 });
  });
});

describe("runs, pieces and faces", () => {
  it("restarts the layout on each of a kodi of 20 pieces", () => {
    // One kain panjang of 2500 mm, straight 200 mm on a 1000 band: 12 rows (j·200 + 200 ≤ 2500 → j ≤ 11.5) × 5 = 60.
    const r = layout({ cloth: { widthMm: 1000, pieces: 20, pieceLengthMm: 2500 } });
    expect(r.pieces).toBe(20);
    expect(r.runLengthMm).toBe(50_000);
    expect(r.impressionsTotal).toBe(20 * 60);
    expect(r.waxedAreaTotalM2).toBeCloseTo(20 * 60 * 0.04, 10);
  });

  it("doubles impressions and wax for two faces, the back mirrored through the cloth", () => {
    const one = layout({ cloth: { widthMm: 1100, lengthMm: 1000, margins: { leftMm: 30, rightMm: 70 } } });
    const two = layout({
      cloth: { widthMm: 1100, lengthMm: 1000, margins: { leftMm: 30, rightMm: 70 } },
      sides: 2,
      impressions: true,
    });
    expect(two.impressionsTotal).toBe(2 * one.impressionsTotal);
    expect(two.impressionsPerMetre).toBe(2 * one.impressionsPerMetre);
    expect(two.waxedAreaTotalM2).toBeCloseTo(2 * one.waxedAreaTotalM2, 12);
    const front = two.impressions!.find((i) => i.face === "front" && i.rowIndex === 0 && i.xMm === 30)!;
    const back = two.impressions!.find((i) => i.face === "back" && i.rowIndex === 0 && i.xMm === 1100 - 30 - 200)!;
    expect(back.mirrored).toBe(!front.mirrored);
    // x → 1100 − x: the front's stamp origin at x = 30 lands at 1070 on the back, facing the other way.
    expect(back.matrix).toEqual([-1, 0, 0, 1, 1070, 0]);
  });

  it("grows the waxed area exactly with whole periods of length", () => {
    // Clip mode: the run is the infinite layout cut to [0, L], so adding 100 periods adds 100 periods' wax.
    const input = {
      arrangement: "half-drop" as const,
      edges: "clip" as const,
      gap: { xMm: -15, yMm: -15 },
      stamp: { widthMm: 210, heightMm: 210, outline: "M0 105 C0 0 210 0 210 105 C210 210 0 210 0 105 Z" },
    };
    const short = layout({ ...input, cloth: { widthMm: 1150, lengthMm: 1000 } });
    const long = layout({ ...input, cloth: { widthMm: 1150, lengthMm: 1000 + 100 * 195 } });
    expect(long.waxedAreaTotalM2 - short.waxedAreaTotalM2).toBeCloseTo(100 * 0.195 * long.waxedAreaPerMetreM2, 9);
  });
});
