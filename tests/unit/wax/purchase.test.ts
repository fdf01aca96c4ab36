import { describe, expect, it } from "vitest";
import { DEFAULT_MATERIALS, estimateComponents, estimateWax, purchaseList } from "@/lib/wax";

// Hand-worked cases; prices are test inputs in the workshop's currency.
const planned = [
  { byMaterial: [{ material: "beeswax", kg: 3 }, { material: "paraffin", kg: 2 }] },
  { byMaterial: [{ material: "beeswax", kg: 1.5 }, { material: "rosin", kg: 0.5 }] },
];

describe("purchaseList", () => {
  it("sums the planned estimates by material and buys what is short plus the reorder level", () => {
    const list = purchaseList(planned, [
      { material: "beeswax", name: "Beeswax", onHandKg: 2, reorderLevelKg: 1, pricePerKg: 150_000 },
      { material: "paraffin", name: "Paraffin wax", onHandKg: 10, reorderLevelKg: 2, pricePerKg: 40_000 },
    ]);
    expect(list.lines.map((l) => [l.material, l.neededKg, l.afterKg, l.toBuyKg])).toEqual([
      ["beeswax", 4.5, -2.5, 3.5], // 4.5 needed + 1 reorder − 2 on hand
      ["paraffin", 2, 8, 0], // 2 + 2 − 10 < 0 → nothing to buy, never negative
      ["rosin", 0.5, -0.5, 0.5], // needed but not stocked: on hand 0, no reorder level
    ]);
    expect(list.lines[0].cost).toBe(525_000);
    expect(list.lines[1].cost).toBe(0);
    expect(list.lines[2]).toMatchObject({ name: "rosin", pricePerKg: null, cost: null });
    expect(list.totalToBuyKg).toBe(4);
    expect(list.cost).toBeNull();
    expect(list.pricesMissing).toEqual(["rosin"]);
    expect(list.belowReorder).toEqual(["beeswax", "rosin"]);
  });

  it("costs the whole list when every material to buy has a price (an unpriced one with nothing to buy does not matter)", () => {
    const list = purchaseList(planned, [
      { material: "beeswax", onHandKg: 0, pricePerKg: 150_000 },
      { material: "paraffin", onHandKg: 5, reorderLevelKg: 1 },
      { material: "rosin", onHandKg: 0.2, pricePerKg: 30_000 },
    ]);
    // 4.5 kg × 150 000 + 0.3 kg × 30 000.
    expect(list.cost).toBeCloseTo(684_000, 6);
    expect(list.pricesMissing).toEqual([]);
    expect(list.lines.find((l) => l.material === "paraffin")).toMatchObject({ toBuyKg: 0, belowReorderAfter: false });
  });

  it("tops up a material below its reorder level even when no planned work needs it", () => {
    const list = purchaseList([], [{ material: "microcrystalline", onHandKg: 1, reorderLevelKg: 3, pricePerKg: 60_000 }]);
    expect(list.lines[0]).toMatchObject({ neededKg: 0, toBuyKg: 2, cost: 120_000, belowReorderNow: true, belowReorderAfter: true });
    expect(list.belowReorder).toEqual(["microcrystalline"]);
  });

  it("buys nothing with nothing planned and stock above every level", () => {
    const list = purchaseList([], [{ material: "beeswax", onHandKg: 20, reorderLevelKg: 5 }]);
    expect(list).toMatchObject({ totalToBuyKg: 0, cost: 0, pricesMissing: [], belowReorder: [] });
  });

  it("reads the byMaterial of real estimates", () => {
    const components = estimateComponents([{ material: "beeswax", pct: 60 }, { material: "paraffin", pct: 40 }], DEFAULT_MATERIALS);
    const e = estimateWax({ waxedAreaPerMetreM2: 0.8, metres: 100, passes: 2, rateGPerM2: 90, recoveryPct: 50, components });
    // 144 g/m × 100 m = 14.4 kg, half new: 4.32 kg beeswax, 2.88 kg paraffin.
    const list = purchaseList([e, e], [{ material: "beeswax", onHandKg: 5 }, { material: "paraffin", onHandKg: 10 }]);
    expect(list.lines.map((l) => l.toBuyKg)).toEqual([expect.closeTo(3.64, 10), 0]);
  });
});
