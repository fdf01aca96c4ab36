import { describe, expect, it } from "vitest";
import { compareWithRecord, impliedDpi, MM_PER_INCH, physicalSizeMm } from "@/lib/scans";

// 1 in = 25.4 mm exactly (NIST SP 811, Appendix B; NIST Handbook 44, Appendix C).
describe("physical size from pixels and DPI", () => {
  it("uses the exact inch", () => {
    expect(MM_PER_INCH).toBe(25.4);
    expect(physicalSizeMm(600, 300, 600)).toEqual({ widthMm: 25.4, heightMm: 12.7 });
  });

  it("a 600 DPI scan of 4724 × 4724 px is 199.983 mm square (4724 / 600 × 25.4, worked by hand)", () => {
    const { widthMm, heightMm } = physicalSizeMm(4724, 4724, 600);
    expect(widthMm).toBeCloseTo(199.98267, 5);
    expect(heightMm).toBeCloseTo(199.98267, 5);
  });

  it("a 300 DPI scan of 2362 × 2126 px is 199.98 × 180.00 mm", () => {
    const { widthMm, heightMm } = physicalSizeMm(2362, 2126, 300);
    expect(widthMm).toBeCloseTo((2362 * 25.4) / 300, 10);
    expect(heightMm).toBeCloseTo(180.0013, 4);
  });

  it("gives the DPI a recorded size implies", () => {
    expect(impliedDpi(2362, 200)).toBeCloseTo(299.974, 3);
    expect(impliedDpi(600, 25.4)).toBe(600);
  });

  it("refuses a zero DPI", () => {
    expect(() => physicalSizeMm(100, 100, 0)).toThrow(RangeError);
  });
});

describe("comparison with the stamp's record (warn above 3 %)", () => {
  const record = { widthMm: 200, heightMm: 180 };

  it("within 3 % on both sides: no warning, signed deviations", () => {
    const c = compareWithRecord({ widthMm: 205.9, heightMm: 176 }, record);
    expect(c.widthDeviationPct).toBeCloseTo(2.95, 10);
    expect(c.heightDeviationPct).toBeCloseTo(-2.2222, 4);
    expect(c.maxDeviationPct).toBeCloseTo(2.95, 10);
    expect(c.warn).toBe(false);
    expect(c.turned).toBe(false);
  });

  it("just over 3 % on one side warns", () => {
    const c = compareWithRecord({ widthMm: 206.1, heightMm: 180 }, record);
    expect(c.maxDeviationPct).toBeCloseTo(3.05, 10);
    expect(c.warn).toBe(true);
  });

  it("exactly 3 % does not warn (the rule is 'more than')", () => {
    expect(compareWithRecord({ widthMm: 200, heightMm: 185.4 }, record).warn).toBe(false);
    expect(compareWithRecord({ widthMm: 200, heightMm: 174.6 }, record).warn).toBe(false);
  });

  it("a scan turned a quarter is compared turned", () => {
    const c = compareWithRecord({ widthMm: 180.5, heightMm: 199.5 }, record);
    expect(c.turned).toBe(true);
    expect(c.warn).toBe(false);
    expect(c.widthDeviationPct).toBeCloseTo(-0.25, 10);
  });

  it("a scan at the wrong DPI (300 taken as 600) is flagged", () => {
    const measured = physicalSizeMm(2362, 2126, 600);
    expect(compareWithRecord(measured, record).warn).toBe(true);
  });

  it("takes another tolerance", () => {
    expect(compareWithRecord({ widthMm: 202, heightMm: 180 }, record, 0.5).warn).toBe(true);
  });
});
