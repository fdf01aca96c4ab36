import { describe, expect, it } from "vitest";
import { findingFormInput, progressFormInput, readingFormInput, runFormInput, runPages, runUrls, stageNumber } from "@/lib/contracts/runs";

const form = (fields: Record<string, string>) => {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.set(k, v);
  return f;
};

describe("run form adapters", () => {
  // °C = (°F − 32) × 5/9 (NIST SP 811): 212 °F is water's boiling point, 100 °C.
  it("reads a pot reading in °F as °C, and in °C as it is", () => {
    expect(readingFormInput(form({ tempF: "212" }), "en").tempC).toBeCloseTo(100, 12);
    expect(readingFormInput(form({ tempC: "72,5" }), "id").tempC).toBe(72.5);
  });

  it("reads the run in the person's number writing, the piece length in cm as mm", () => {
    const input = runFormInput(form({ name: "Run", motifId: "m", colourwayId: "c", cloth: "mori", pieces: "40", pieceLengthCm: "265", planId: "p" }), "en");
    expect(input).toMatchObject({ pieces: 40, pieceLengthMm: 2650, planIds: ["p"], dueOn: null, metres: undefined });
    expect(runFormInput(form({ metres: "1.200,5" }), "id").metres).toBe(1200.5);
    // "120.5" in Indonesian is refused (NaN for the schema to name), never read as 1205.
    expect(Number.isNaN(runFormInput(form({ metres: "120.5" }), "id").metres)).toBe(true);
  });

  it("reads progress and findings, leaving blank fields out", () => {
    expect(progressFormInput(form({ doneOn: "2026-12-01", metres: "20", potBeforeG: "6000", potAfterG: "3800", finished: "on" }), "en")).toMatchObject({
      doneOn: "2026-12-01",
      metres: 20,
      potBeforeG: 6000,
      potAfterG: 3800,
      gramsUsed: undefined,
      finished: true,
    });
    expect(findingFormInput(form({ foundOn: "2026-12-01", kind: "pooled", stampCode: "cp-0001", count: "2" }), "en")).toMatchObject({ stampCode: "CP-0001", count: 2, repair: undefined });
  });

  it("builds the run addresses", () => {
    expect(runUrls.list({ state: ["setup", "underway"], page: 2 })).toBe("/api/v1/runs?state=setup%2Cunderway&page=2");
    expect(runUrls.progress("r", "s")).toBe("/api/v1/runs/r/stages/s/progress");
    expect(runPages.new({ motif: "m", colourway: "c" })).toBe("/runs/new?motif=m&colourway=c");
    expect(stageNumber({ position: 0 })).toBe(1);
  });
});
