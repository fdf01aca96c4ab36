import { count, eq, inArray } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { runs } from "@/db/schema";
import { seedRuns } from "@/scripts/seed/runs";
import { createUser, db } from "../helpers/db";
import { api, signIn, type Session } from "../helpers/http";
import { seedDemoRuns } from "../helpers/seed";

// The demo runs (scripts/seed/runs.ts): four invented runs in four states, added once; the one in work has
// findings that flag a stamp, and each run's totals are the sums of its stages through the API.

const names = ["Harbour blues, two kodi of long cloths", "Market cream and soga, 30 m", "Dry season sarongs, 20 m", "Trial on export cotton, 12 m"];
let reader: Session;

beforeAll(async () => {
  await seedDemoRuns();
  await seedRuns(db());
  const user = await createUser("keeper");
  reader = (await signIn(user.email, user.password))!;
});

describe("demo runs", () => {
  it("adds four runs once, in four states", async () => {
    const rows = await db().select({ name: runs.name, state: runs.state }).from(runs).where(inArray(runs.name, names));
    expect(rows).toHaveLength(4);
    expect(new Set(rows.map((r) => r.state))).toEqual(new Set(["setup", "underway", "complete", "halted"]));
    const [{ n }] = await db().select({ n: count() }).from(runs).where(eq(runs.name, names[1]));
    expect(n).toBe(1);
  });

  it("flag a stamp by their findings, and open with totals that are the sums of their stages", async () => {
    const flagged = await api("GET", "/api/v1/runs/flagged-stamps", { session: reader });
    expect(flagged.body.stamps.some((f: { kind: string }) => f.kind === "pooled")).toBe(true);
    const rows = await db().select({ id: runs.id }).from(runs).where(inArray(runs.name, names));
    for (const { id } of rows) {
      const run = (await api("GET", `/api/v1/runs/${id}`, { session: reader })).body.run;
      const kg = run.stages.reduce((a: number, s: { estimate: { kg: number } }) => a + s.estimate.kg, 0);
      expect(run.totals.wax.kgEstimated).toBeCloseTo(kg, 9);
      expect(run.totals.wax.kgEstimated).toBeGreaterThan(0);
    }
  });
});
