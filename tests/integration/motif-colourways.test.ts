import { beforeAll, describe, expect, it } from "vitest";
import { seedWax } from "@/scripts/seed/wax";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn, type Session } from "../helpers/http";
import { createStampRow, uniquePrefix } from "../helpers/stamps";

// Editing a motif's colourways while production runs follow them: a colourway keeps its id (and its runs) while
// its name stays, its colours and notes change in place; one that runs follow cannot be dropped (409, naming them).
const prefix = uniquePrefix("MC");
let designer: Session;
let planner: Session;

beforeAll(async () => {
  testEnv();
  await seedWax(db());
  const [d, p] = await Promise.all([createUser("designer"), createUser("planner")]);
  designer = (await signIn(d.email, d.password))!;
  planner = (await signIn(p.email, p.password))!;
});

describe("a motif's colourways under its runs", () => {
  it("keeps the colourway a run follows through an edit, and refuses to drop it", async () => {
    const code = `${prefix}-M`;
    await createStampRow({ code, widthMm: 200, heightMm: 200 });
    const colours = [
      { name: "Cream", swatch: "#f4efe6", waxStamps: [code], face: "front", dyeNotes: "undyed" },
      { name: "Soga", swatch: "#6b4423", dyeNotes: "two baths" },
    ];
    const made = await api("POST", "/api/v1/motifs", { session: designer, body: { name: `${prefix} Fern`, stamps: [{ code, role: "main" }], colourways: [{ name: "Soga", colours }, { name: "Blue", colours: [{ name: "Indigo", swatch: "#1f3a5f" }] }] } });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    const motif = made.body.motif;
    const soga = motif.colourways.find((w: { name: string }) => w.name === "Soga");
    const run = await api("POST", "/api/v1/runs", { session: planner, body: { name: `${prefix} run`, motifId: motif.id, colourwayId: soga.id, cloth: "mori 115 cm", metres: 10 } });
    expect(run.status, JSON.stringify(run.body)).toBe(201);

    // A new colour order and notes on the same colourway: same id, the run still follows it.
    const edited = await api("PATCH", `/api/v1/motifs/${motif.id}`, {
      session: designer,
      body: { version: motif.version, colourways: [{ name: "Soga", notes: "market order", colours: [...colours, { name: "Brown", swatch: "#4a2f1b", dyeNotes: "soga again" }] }, { name: "Blue", colours: [{ name: "Indigo", swatch: "#1f3a5f" }] }] },
    });
    expect(edited.status, JSON.stringify(edited.body)).toBe(200);
    const after = edited.body.motif.colourways.find((w: { name: string }) => w.name === "Soga");
    expect(after.id).toBe(soga.id);
    expect(after).toMatchObject({ notes: "market order", colours: [{ dyeNotes: "undyed" }, { dyeNotes: "two baths" }, { name: "Brown", dyeNotes: "soga again" }] });
    expect((await api("GET", `/api/v1/runs/${run.body.run.id}`, { session: planner })).body.run.colourway).toEqual({ id: soga.id, name: "Soga" });

    // Dropping it is refused while the run follows it; dropping the other one is fine.
    const version = edited.body.motif.version;
    const drop = await api("PATCH", `/api/v1/motifs/${motif.id}`, { session: designer, body: { version, colourways: [{ name: "Blue", colours: [{ name: "Indigo", swatch: "#1f3a5f" }] }] } });
    expect(drop.status).toBe(409);
    expect(drop.body.error).toMatchObject({ code: "colourwayInRuns" });
    expect(drop.body.error.message).toContain(`${prefix} run`);
    const keepSoga = await api("PATCH", `/api/v1/motifs/${motif.id}`, { session: designer, body: { version, colourways: [{ name: "Soga", colours }] } });
    expect(keepSoga.status, JSON.stringify(keepSoga.body)).toBe(200);
    expect(keepSoga.body.motif.colourways.map((w: { name: string }) => w.name)).toEqual(["Soga"]);
  });
});
