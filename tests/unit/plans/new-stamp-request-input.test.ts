import { describe, expect, it } from "vitest";
import { newStampRequestFormInput } from "@/lib/contracts/plans";

const form = (fields: Record<string, string>) => {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.set(k, v);
  return f;
};

describe("the new-stamp request form's adapter", () => {
  it("reads inches for imperial people into mm", () => {
    // 1 in = 25.4 mm exactly (NIST SP 811, appendix B)
    const input = newStampRequestFormInput(form({ unit: "in", width: "4", height: "2,5", motifId: "m", role: "corner", note: "x" }), "id");
    expect(input.widthMm).toBeCloseTo(101.6, 9);
    expect(input.heightMm).toBeCloseTo(63.5, 9);
    expect(input).toMatchObject({ motifId: "m", role: "corner", planId: null, note: "x" });
  });

  it("keeps mm as typed in the person's number writing", () => {
    expect(newStampRequestFormInput(form({ unit: "mm", width: "1.200,5", height: "80" }), "id")).toMatchObject({ widthMm: 1200.5, heightMm: 80, motifId: null, role: null });
  });

  it("passes an empty size on as missing and an unreadable one as typed, for the schema's message", () => {
    const input = newStampRequestFormInput(form({ unit: "in", width: "", height: "four" }), "en");
    expect(input.widthMm).toBeUndefined();
    expect(input.heightMm).toBe("four");
  });
});
