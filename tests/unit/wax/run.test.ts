import { describe, expect, it } from "vitest";
import { KODI_PIECES, WaxInputError, metresFromKodi, metresFromPieces, piecesFromKodi, runMetres } from "@/lib/wax";

describe("run length", () => {
  it("counts a kodi as 20 pieces (Indonesian trade unit, common practice)", () => {
    expect(KODI_PIECES).toBe(20);
    expect(piecesFromKodi(3)).toBe(60);
  });

  it("turns pieces and kodi of a length (mm) into metres", () => {
    // Sarongs about 2 m long (batik references): 1 kodi = 40 m; long cloths 2.65 m: 12 pieces = 31.8 m.
    expect(metresFromKodi(1, 2000)).toBe(40);
    expect(metresFromPieces(12, 2650)).toBeCloseTo(31.8, 12);
    expect(runMetres({ kodi: 2, pieceLengthMm: 2500 })).toBe(100);
    expect(runMetres({ pieces: 5, pieceLengthMm: 2000 })).toBe(10);
    expect(runMetres({ metres: 12.5 })).toBe(12.5);
  });

  it("refuses a run given two ways, a piece count without its length, and runs over 2 km", () => {
    const codeOf = (input: unknown) => {
      try {
        runMetres(input);
      } catch (e) {
        if (e instanceof WaxInputError) return [e.field, e.code];
        throw e;
      }
      return null;
    };
    expect(codeOf({ metres: 10, pieces: 2 })).toEqual(["", "wax.runLength"]);
    expect(codeOf({ metres: 10, pieceLengthMm: 2000 })).toEqual(["", "wax.runLength"]);
    expect(codeOf({})).toEqual(["", "wax.runLength"]);
    expect(codeOf({ pieces: 4 })).toEqual(["pieceLengthMm", "validation.required"]);
    expect(codeOf({ kodi: 1.5, pieceLengthMm: 2000 })).toEqual(["kodi", "validation.notAnInteger"]);
    expect(codeOf({ kodi: 100, pieceLengthMm: 2500 })).toEqual(["", "wax.runTooLong"]);
    expect(codeOf({ pieces: 800, pieceLengthMm: 2500 })).toBeNull();
  });
});
