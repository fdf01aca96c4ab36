import { describe, expect, it } from "vitest";
import { lengthFor, lengthInput, massFor, massInput } from "@/lib/stamps/format";
import { inchesToMm, ouncesToGrams } from "@/lib/units";

describe("stamp sizes in the user's units", () => {
  it("shows inches with 1 in = 25.4 mm exactly (NIST SP 811, Appendix B)", () => {
    expect(lengthFor(254, "imperial")).toMatchObject({ value: 10, unit: "in" });
    expect(lengthFor(210, "metric")).toMatchObject({ value: 210, unit: "mm" });
  });

  it("shows ounces with 1 oz = 28.349 523 125 g (NIST Handbook 44, Appendix C)", () => {
    expect(massFor(28.349523125, "imperial").value).toBeCloseTo(1, 12);
    expect(massFor(1250, "metric")).toMatchObject({ value: 1.25, unit: "kg" });
    expect(massFor(640, "metric")).toMatchObject({ value: 640, unit: "g" });
  });

  it("a length typed back from the form's inches rounds to the same 0.1 mm it came from", () => {
    for (const mm of [5, 180, 200.3, 209.9, 210, 305.5, 1499.9]) {
      const typed = Number(lengthInput(mm, "imperial"));
      expect(Math.round(inchesToMm(typed) * 10) / 10).toBe(mm);
    }
  });

  it("a weight typed back from the form's ounces rounds to the same gram", () => {
    for (const g of [1, 450, 999, 1234, 4321]) expect(Math.round(ouncesToGrams(Number(massInput(g, "imperial"))))).toBe(g);
  });

  it("leaves empty values empty", () => {
    expect(lengthInput(null, "metric")).toBeNull();
    expect(massInput(undefined, "imperial")).toBeNull();
  });
});
