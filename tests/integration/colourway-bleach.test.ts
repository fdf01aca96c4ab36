import { beforeAll, describe, expect, it } from "vitest";
import { seedWax } from "@/scripts/seed/wax";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn, type Session } from "../helpers/http";
import { createStampRow, uniquePrefix } from "../helpers/stamps";

// A colourway's colour says itself whether it is reached by bleaching (motif_colours.bleach, `bleach` in the
// motif API): the flag is stored and read back, and a run started from the colourway gets a bleach stage for that
// colour — and only for it: dye notes that speak of bleaching no longer decide it.

const prefix = uniquePrefix("BL");
const MAIN = `${prefix}-M`;
let designer: Session;
let planner: Session;

beforeAll(async () => {
  testEnv();
  await seedWax(db());
  const d = await createUser("designer");
  designer = (await signIn(d.email, d.password))!;
  const p = await createUser("planner");
  planner = (await signIn(p.email, p.password))!;
  await createStampRow({ code: MAIN, name: `Main ${prefix}`, widthMm: 200, heightMm: 200 });
});

describe("the bleach flag of a colourway's colour", () => {
  it("is kept with the colour and gives a run a bleach stage for it, not for dye notes that mention bleaching", async () => {
    const made = await api("POST", "/api/v1/motifs", {
      session: designer,
      body: {
        name: `${prefix} Pale ground`,
        stamps: [{ code: MAIN, role: "main" }],
        colourways: [
          {
            name: "Indigo taken back",
            colours: [
              { name: "Indigo", swatch: "#1f3a5f", waxStamps: [MAIN], face: "front", dyeNotes: "Not bleached: a plain dip." },
              { name: "Pale blue", swatch: "#9fb8d0", waxStamps: [MAIN], face: "front", bleach: true },
              { name: "Soga", swatch: "#6b4423" },
            ],
          },
        ],
      },
    });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    const motif = made.body.motif;
    expect(motif.colourways[0].colours.map((c: { bleach: boolean }) => c.bleach)).toEqual([false, true, false]);
    const read = await api("GET", `/api/v1/motifs/${motif.id}`, { session: planner });
    expect(read.body.motif.colourways[0].colours.map((c: { bleach: boolean }) => c.bleach)).toEqual([false, true, false]);

    const recipes = (await api("GET", "/api/v1/wax/recipes", { session: planner })).body.recipes as { id: string; archivedAt?: string | null }[];
    const run = await api("POST", "/api/v1/runs", {
      session: planner,
      body: { name: `${prefix} run`, motifId: motif.id, colourwayId: motif.colourways[0].id, cloth: "mori primissima 115 cm", metres: 10, recipeId: recipes.find((r) => !r.archivedAt)!.id },
    });
    expect(run.status, JSON.stringify(run.body)).toBe(201);
    const stages = run.body.run.stages as { kind: string; colourName: string | null; dyeMethod: string | null }[];
    expect(stages.map((s) => [s.kind, s.colourName])).toEqual([
      ["dye", "Indigo"],
      ["wax", "Indigo"],
      ["bleach", "Pale blue"],
      ["wax", "Pale blue"],
      ["dye", "Soga"],
      ["boil_off", null],
    ]);
    expect(stages[2].dyeMethod).toBeNull();
    // "Not bleached: a plain dip." spoke of bleaching, which the old inference from dye notes took for a bleach.
    expect(stages[0].dyeMethod).toBe("bath");
  });

  it("refuses a flag that is not true or false, beside the field", async () => {
    const res = await api("POST", "/api/v1/motifs", {
      session: designer,
      body: { name: `${prefix} Wrong flag`, colourways: [{ name: "One", colours: [{ name: "Cream", swatch: "#f4efe6", bleach: "yes" }] }] },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields["colourways.0.colours.0.bleach"]).toBeDefined();
  });
});
