import { describe, expect, it } from "vitest";
import { colourwaysText, parseColourways, type ColourwayDto } from "@/lib/contracts/motifs";
import { defaultStages } from "@/lib/runs";

// A colourway's colour carries its own bleach flag (motif_colours.bleach); the motif form writes it as the word
// `bleach` in a colour's brackets, and a run's default stages bleach for such a colour instead of a dye bath.
// The order of work (colour, wax over it, next colour, boil-off last) is SPEC section 1's.

describe("the bleach flag in the colourway lines", () => {
  it("is read from the word bleach in a colour's brackets, in any case, beside stamps and the face", () => {
    expect(parseColourways("Pale ground:\nIndigo #1f3a5f\nPale blue #9fb8d0 [bleach]")[0].colours.map((c) => c.bleach)).toEqual([false, true]);
    const [way] = parseColourways("Pale ground: Indigo #1f3a5f [CP-0001 front]; Pale blue #9fb8d0 [CP-0002 both BLEACH]; Soga #6b4423 [bleach]");
    expect(way.colours).toEqual([
      { name: "Indigo", swatch: "#1f3a5f", waxStamps: ["CP-0001"], face: "front", bleach: false },
      { name: "Pale blue", swatch: "#9fb8d0", waxStamps: ["CP-0002"], face: "both", bleach: true },
      { name: "Soga", swatch: "#6b4423", waxStamps: [], face: "front", bleach: true },
    ]);
    expect(parseColourways("Plain: Cream #f4efe6")[0].colours[0].bleach).toBe(false);
  });

  it("is written back so the form reads the same colourway again", () => {
    const ways: ColourwayDto[] = [
      {
        id: "w",
        name: "Pale ground",
        notes: null,
        colours: [
          { name: "Indigo", swatch: "#1f3a5f", dyeNotes: null, waxStamps: ["CP-0001"], face: "front", bleach: false },
          { name: "Pale blue", swatch: "#9fb8d0", dyeNotes: null, waxStamps: [], face: "front", bleach: true },
        ],
      },
    ];
    const text = colourwaysText(ways);
    expect(text).toBe(["Pale ground:", "Indigo #1f3a5f [CP-0001 front]", "Pale blue #9fb8d0 [front bleach]"].join("\n"));
    expect(parseColourways(text)[0].colours.map((c) => c.bleach)).toEqual([false, true]);
  });
});

describe("default stages of a bleached colour", () => {
  it("bleach instead of dyeing (no dye bath), then wax over it when it names stamps", () => {
    const stages = defaultStages([
      { position: 0, name: "Indigo", swatch: "#1f3a5f", waxStamps: ["CP-1"], face: "front", bleach: false },
      { position: 1, name: "Pale blue", swatch: "#9fb8d0", waxStamps: ["CP-2"], face: "both", bleach: true },
      { position: 2, name: "Soga", swatch: "#6b4423", waxStamps: [], face: "front" },
    ]);
    expect(stages.map((s) => [s.kind, s.colourName, s.dyeMethod])).toEqual([
      ["dye", "Indigo", "bath"],
      ["wax", "Indigo", null],
      ["bleach", "Pale blue", null],
      ["wax", "Pale blue", null],
      ["dye", "Soga", "bath"],
      ["boil_off", null, null],
    ]);
    expect(stages[3].stamps).toEqual([{ code: "CP-2", face: "both" }]);
  });
});
