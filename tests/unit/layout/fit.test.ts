import { describe, expect, it } from "vitest";
import { computeLayout } from "@/lib/layout";

describe("fit table", () => {
  // Band 1100 (cloth 1150, margins 25 + 25), stamp 200, gap 10 → 5 across. Worked by hand:
  //   N = 4: gap (1100 − 4·200)/3 = 100;  stamp at gap 10: (1100 − 3·10)/4 = 267.5
  //   N = 5: gap (1100 − 5·200)/4 = 25;   stamp (1100 − 4·10)/5 = 212
  //   N = 6: gap (1100 − 6·200)/5 = −20;  stamp (1100 − 5·10)/6 = 175
  const r = computeLayout({
    cloth: { widthMm: 1150, lengthMm: 2000, margins: { leftMm: 25, rightMm: 25 } },
    stamp: { widthMm: 200, heightMm: 200 },
    gap: { xMm: 10, yMm: 10 },
    arrangement: "straight",
  });

  it("gives the gap or the stamp width that fills the band for N − 1, N, N + 1", () => {
    expect(r.fitTable.map((f) => f.across)).toEqual([4, 5, 6]);
    expect(r.fitTable.map((f) => f.gapXMm)).toEqual([100, 25, -20]);
    expect(r.fitTable.map((f) => f.stampWidthMm)).toEqual([267.5, 212, 175]);
    expect(r.fitTable.map((f) => f.current)).toEqual([false, true, false]);
    expect(r.fitTable.every((f) => f.gapFeasible && f.stampWidthFeasible)).toBe(true);
  });

  it("fills the band exactly when the suggested gap is used", () => {
    for (const f of r.fitTable) {
      const refit = computeLayout({
        cloth: { widthMm: 1150, lengthMm: 2000, margins: { leftMm: 25, rightMm: 25 } },
        stamp: { widthMm: 200, heightMm: 200 },
        gap: { xMm: f.gapXMm!, yMm: 10 },
        arrangement: "straight",
      });
      expect(refit.across).toBe(f.across);
      expect(refit.leftover.leftMm + refit.leftover.rightMm).toBeCloseTo(0, 9);
    }
  });

  it("marks a gap that would swallow the stamp as not feasible", () => {
    // Band 410, stamp 400: 1 across. N = 1 has no gap to set; the stamp to make is the band, 410.
    const narrow = computeLayout({
      cloth: { widthMm: 410, lengthMm: 1000 },
      stamp: { widthMm: 400, heightMm: 400 },
      arrangement: "straight",
    });
    expect(narrow.fitTable.map((f) => f.across)).toEqual([1, 2]);
    expect(narrow.fitTable[0]).toMatchObject({ gapXMm: null, gapFeasible: false, stampWidthMm: 410, stampWidthFeasible: true });
    // N = 2: gap 410 − 800 = −390 ≥ −399: feasible; stamp (410 − 0)/2 = 205.
    expect(narrow.fitTable[1]).toMatchObject({ gapXMm: -390, gapFeasible: true, stampWidthMm: 205 });
  });

  it("fits rosettes, not stamps, for rotation", () => {
    const rot = computeLayout({
      cloth: { widthMm: 1000, lengthMm: 1000 },
      stamp: { widthMm: 100, heightMm: 100 },
      arrangement: "rotation",
      rotationOrder: 4,
    });
    expect(rot.fitTable.find((f) => f.current)).toMatchObject({ across: 5, gapXMm: 0, unitWidthMm: 200, stampWidthMm: null });
  });
});
