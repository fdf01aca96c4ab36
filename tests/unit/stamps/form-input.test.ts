import { describe, expect, it } from "vitest";
import { formNumber } from "@/lib/contracts/form-input";
import { checkoutFormInput, returnFormInput, stampFormInput } from "@/lib/contracts/stamps";
import { createStampSchema } from "@/lib/validation/stamps";

const form = (fields: Record<string, string>) => {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.append(k, v);
  return f;
};

describe("the stamp form's input", () => {
  it("takes sizes in inches for an imperial user: 8 in = 203.2 mm exactly (NIST SP 811, 1 in = 25.4 mm)", () => {
    const input = stampFormInput(form({ unitSystem: "imperial", code: "CP-1", name: "x", widthMm: "8", heightMm: "7,5", weightG: "16" }), "create", "id");
    expect(input.widthMm).toBe(203.2);
    expect(input.heightMm).toBe(190.5);
    // 16 oz = 1 lb = 453.592 37 g (NIST Handbook 44, Appendix C)
    expect(input.weightG).toBeCloseTo(453.59237, 9);
  });

  it("takes coverage in percent and hands the schema a ratio", () => {
    const parsed = createStampSchema.parse(stampFormInput(form({ code: "CP-1", name: "x", widthMm: "200", heightMm: "200", coveragePct: "35" }), "create", "en"));
    expect(parsed.coverageRatio).toBeCloseTo(0.35, 12);
  });

  it("leaves a coverage field that is not on the form out of the change", () => {
    expect(stampFormInput(form({ code: "CP-1", name: "x", version: "3" }), "update", "en")).not.toHaveProperty("coverageRatio", expect.anything());
  });

  it("reads numbers as the person's language writes them, and keeps junk for the schema to name", () => {
    expect(formNumber(form({ n: "120,5" }), "n", "id")).toBe(120.5);
    expect(formNumber(form({ n: "120.5" }), "n", "en")).toBe(120.5);
    expect(formNumber(form({ n: "1.200,5" }), "n", "id")).toBe(1200.5);
    expect(formNumber(form({ n: "" }), "n", "id")).toBeNull();
    expect(formNumber(form({ n: "wide" }), "n", "en")).toBeNaN();
  });

  it("reads a size typed in Indonesian with thousands and a decimal comma as the same millimetres", () => {
    const input = stampFormInput(form({ code: "CP-1", name: "x", widthMm: "1.200,5", heightMm: "205,5", coveragePct: "35,5" }), "create", "id");
    expect(input.widthMm).toBe(1200.5);
    expect(input.heightMm).toBe(205.5);
    expect(input.coverageRatio).toBeCloseTo(0.355, 12);
    // "120.5" is not how Indonesian writes 120,5, and not a thousands group either: refused, not guessed.
    expect(stampFormInput(form({ code: "CP-1", name: "x", widthMm: "120.5", heightMm: "200" }), "create", "id").widthMm).toBeNaN();
  });
});

describe("the check-out and return forms' input", () => {
  it("names a person with an account by id, anyone else by name and e-mail", () => {
    expect(checkoutFormInput(form({ borrowerId: "0b6f0e1e-6c1f-4b8e-9b9e-3a1f2e3d4c5b", borrowerName: "ignored", workstation: "T1", dueOn: "2030-01-01" }))).toMatchObject({ borrowerId: "0b6f0e1e-6c1f-4b8e-9b9e-3a1f2e3d4c5b", borrowerName: undefined });
    expect(checkoutFormInput(form({ borrowerId: "other", borrowerName: "Tamsi Wirog", borrowerEmail: "tamsi@example.test", workstation: "T1", dueOn: "2030-01-01" }))).toMatchObject({ borrowerId: undefined, borrowerName: "Tamsi Wirog", borrowerEmail: "tamsi@example.test" });
  });

  it("sends a stamp back to its recorded place when no location is chosen", () => {
    expect(returnFormInput(form({ note: "", locationId: "", impressions: "" }), "en")).toEqual({ note: "", locationId: null, impressions: undefined });
  });

  it("counts impressions written with a thousands sign in either language", () => {
    expect(returnFormInput(form({ impressions: "1.200" }), "id").impressions).toBe(1200);
    expect(returnFormInput(form({ impressions: "1,200" }), "en").impressions).toBe(1200);
  });
});
