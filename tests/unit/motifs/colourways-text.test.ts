import { describe, expect, it } from "vitest";
import { colourwaysText, parseColourways } from "@/lib/contracts/motifs";
import type { ColourwayDto } from "@/lib/contracts/motifs";

// A motif's colourways edited as text lines: one colour a line under its colourway's name (and the older one-line
// form still read), and the form's text written back so that reading it again gives the same colourways. No
// `bleach` word: no colour here is reached by bleaching (tests/unit/runs/colourway-bleach.test.ts has those).

describe("colourways as text lines", () => {
  it("reads one colour a line under each colourway's name, in the order of work", () => {
    const text = ["Brown and indigo:", "Undyed mori #F4EFE6 [CP-0001 both]", "  Soga brown #8a5a2b", "", "Two blues:", "- Sky blue #6f9fc8 [CP-0002 CP-0003]", "Deep indigo #15243d [back]"].join("\n");
    expect(parseColourways(text)).toEqual([
      {
        name: "Brown and indigo",
        colours: [
          { name: "Undyed mori", swatch: "#f4efe6", waxStamps: ["CP-0001"], face: "both", bleach: false },
          { name: "Soga brown", swatch: "#8a5a2b", waxStamps: [], face: "front", bleach: false },
        ],
      },
      {
        name: "Two blues",
        colours: [
          { name: "Sky blue", swatch: "#6f9fc8", waxStamps: ["CP-0002", "CP-0003"], face: "front", bleach: false },
          { name: "Deep indigo", swatch: "#15243d", waxStamps: [], face: "back", bleach: false },
        ],
      },
    ]);
  });

  it("still reads the one-line form, and a line that is no colour keeps its text with no swatch for the schema to name", () => {
    expect(parseColourways("Night: Undyed #f4efe6 [both]; Indigo #1f3a5f")).toEqual([
      {
        name: "Night",
        colours: [
          { name: "Undyed", swatch: "#f4efe6", waxStamps: [], face: "both", bleach: false },
          { name: "Indigo", swatch: "#1f3a5f", waxStamps: [], face: "front", bleach: false },
        ],
      },
    ]);
    expect(parseColourways("Indigo #1f3a5f\nDay:\nsomething blue")).toEqual([
      { name: "", colours: [{ name: "Indigo", swatch: "#1f3a5f", waxStamps: [], face: "front", bleach: false }] },
      { name: "Day", colours: [{ name: "something blue", swatch: "", waxStamps: [], face: "front", bleach: false }] },
    ]);
  });

  it("writes colourways back as lines that read again to the same colourways", () => {
    const colourways = [
      {
        id: "a",
        name: "Brown and indigo",
        notes: null,
        colours: [
          { id: "c1", position: 0, name: "Undyed mori", swatch: "#f4efe6", dyeNotes: null, waxStamps: ["CP-0001"], face: "both", bleach: false },
          { id: "c2", position: 1, name: "Indigo", swatch: "#1f3a5f", dyeNotes: null, waxStamps: [], face: "front", bleach: false },
        ],
      },
      { id: "b", name: "Two blues", notes: null, colours: [{ id: "c3", position: 0, name: "Sky blue", swatch: "#6f9fc8", dyeNotes: null, waxStamps: [], face: "back", bleach: false }] },
    ] as unknown as ColourwayDto[];
    const text = colourwaysText(colourways);
    expect(text).toBe(["Brown and indigo:", "Undyed mori #f4efe6 [CP-0001 both]", "Indigo #1f3a5f", "", "Two blues:", "Sky blue #6f9fc8 [back]"].join("\n"));
    expect(parseColourways(text)).toEqual(colourways.map((w) => ({ name: w.name, colours: w.colours.map(({ name, swatch, waxStamps, face, bleach }) => ({ name, swatch, waxStamps, face, bleach })) })));
  });

  it("carries a colour's dye notes and a colourway's notes after // both ways, so editing the form keeps them", () => {
    const text = ["Market soga: // the dry-season order", "Cream #f4efe6 [CP-0001 front] // undyed mori", "Soga brown #8a5a2b // two baths, fixed with lime"].join("\n");
    const ways = parseColourways(text);
    expect(ways).toEqual([
      {
        name: "Market soga",
        notes: "the dry-season order",
        colours: [
          { name: "Cream", swatch: "#f4efe6", waxStamps: ["CP-0001"], face: "front", bleach: false, dyeNotes: "undyed mori" },
          { name: "Soga brown", swatch: "#8a5a2b", waxStamps: [], face: "front", bleach: false, dyeNotes: "two baths, fixed with lime" },
        ],
      },
    ]);
    const dto: ColourwayDto[] = [{ id: "x", name: "Market soga", notes: "the dry-season order", colours: ways[0].colours.map((c) => ({ ...c, dyeNotes: c.dyeNotes ?? null })) as ColourwayDto["colours"] }];
    expect(parseColourways(colourwaysText(dto))).toEqual(ways);
  });
});
