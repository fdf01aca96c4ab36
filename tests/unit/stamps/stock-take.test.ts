import { describe, expect, it } from "vitest";
import { relocations, stockTakeReport, type ExpectedStamp } from "@/lib/stamps/stock-take";

const stamp = (code: string, over: Partial<ExpectedStamp> = {}): ExpectedStamp => ({
  id: `id-${code}`,
  code,
  locationId: "R1",
  site: "North",
  checkedOut: false,
  retired: false,
  ...over,
});

describe("stock-take report", () => {
  const stamps = [
    stamp("A"),
    stamp("B"),
    stamp("C", { locationId: "R2" }),
    stamp("D", { checkedOut: true }),
    stamp("E", { retired: true }),
    stamp("F", { site: "South", locationId: "S1" }),
    stamp("G", { site: null, locationId: null }),
  ];

  it("sorts what was seen into found, misplaced and unexpected, and names what is missing", () => {
    const report = stockTakeReport("North", stamps, [
      { code: "A", stampId: "id-A", locationId: "R1" },
      { code: "C", stampId: "id-C", locationId: "R1" },
      { code: "F", stampId: "id-F", locationId: "R2" },
      { code: "G", stampId: "id-G", locationId: "R1" },
      { code: "ZZ-9", stampId: null, locationId: "R1" },
    ]);
    expect(report.expected).toBe(3); // A, B, C: D is out, E retired
    expect(report.seenExpected).toBe(2);
    expect(report.missing).toEqual(["B"]);
    expect(report.checkedOut).toEqual(["D"]);
    expect(report.misplaced).toEqual([{ code: "C", recordedLocationId: "R2", seenLocationId: "R1" }]);
    expect(report.unexpected.map((u) => [u.code, u.reason])).toEqual([
      ["F", "otherSite"],
      ["G", "noLocation"],
      ["ZZ-9", "unknown"],
    ]);
  });

  it("counts a checked-out or retired stamp that turns up as unexpected, not as missing", () => {
    const report = stockTakeReport("North", stamps, [
      { code: "D", stampId: "id-D", locationId: "R1" },
      { code: "E", stampId: "id-E", locationId: "R1" },
    ]);
    expect(report.unexpected.map((u) => u.reason)).toEqual(["checkedOut", "retired"]);
    expect(report.checkedOut).toEqual([]);
    expect(report.missing).toEqual(["A", "B", "C"]);
  });

  it("moves misplaced stamps and known strays to where they were seen, never unknown, out or retired ones", () => {
    const report = stockTakeReport("North", stamps, [
      { code: "C", stampId: "id-C", locationId: "R1" },
      { code: "F", stampId: "id-F", locationId: "R2" },
      { code: "D", stampId: "id-D", locationId: "R1" },
      { code: "ZZ-9", stampId: null, locationId: "R1" },
    ]);
    expect(relocations(report)).toEqual([
      { code: "C", toLocationId: "R1" },
      { code: "F", toLocationId: "R2" },
    ]);
  });

  it("an empty site gives an empty report", () => {
    expect(stockTakeReport("East", stamps, [])).toMatchObject({ expected: 0, seenExpected: 0, missing: [], misplaced: [], unexpected: [] });
  });
});
