import { sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, page, signIn, type Session } from "../helpers/http";
import { seedDemoRuns } from "../helpers/seed";

// The wax estimate form offers the recovery measured at the runs' boil-offs (the demo's finished run has one) as
// its default recovery %, and says how many boil-offs it comes from; the figure is Σ recovered ÷ Σ used over the
// runs with both, counted here again straight from the records.

let waxmaster: Session;

beforeAll(async () => {
  testEnv();
  await seedDemoRuns();
  const user = await createUser("waxmaster");
  waxmaster = (await signIn(user.email, user.password))!;
});

/** Σ recovered ÷ Σ used (%) over the runs whose boil-off recovered wax and whose waxings used some, and how many. */
async function measuredByHand(): Promise<{ pct: number; boilOffs: number }> {
  const rows = await db().execute<{ used: string; recovered: string }>(sql`
    SELECT coalesce(sum(p.wax_used_g), 0) AS used, coalesce(sum(p.recovered_g), 0) AS recovered
    FROM run_progress p JOIN run_stages s ON s.id = p.stage_id GROUP BY s.run_id`);
  const runs = [...rows].map((r) => ({ used: Number(r.used), recovered: Number(r.recovered) })).filter((r) => r.used > 0 && r.recovered > 0);
  const used = runs.reduce((a, r) => a + r.used, 0);
  const recovered = runs.reduce((a, r) => a + r.recovered, 0);
  return { pct: Math.min(100, (recovered / used) * 100), boilOffs: runs.length };
}

describe("the estimate form's recovery", () => {
  it("is the recovery measured at the boil-offs, with a line saying from how many", async () => {
    const expected = await measuredByHand();
    expect(expected.boilOffs).toBeGreaterThanOrEqual(1);
    const defaults = (await api("GET", "/api/v1/wax/defaults", { session: waxmaster })).body.defaults;
    expect(defaults.measuredRecoveryPct).toBeCloseTo(expected.pct, 9);
    expect(defaults.measuredRecoveryBoilOffs).toBe(expected.boilOffs);

    const res = await page("/wax/estimates", waxmaster);
    expect(res.status).toBe(200);
    const input = /<input[^>]*name="recoveryPct"[^>]*>/.exec(res.html)?.[0] ?? "";
    const offered = Math.round(expected.pct * 10) / 10;
    expect(input).toContain(`value="${offered}"`);
    // The wax master's own default is not what is offered while a measured figure exists.
    expect(offered).not.toBe(defaults.waxRecoveryPct);
    const boilOffs = expected.boilOffs === 1 ? "1 boil-off" : `${expected.boilOffs} boil-offs`;
    expect(res.html).toContain(`Wax won back after the boil-off: ${offered} % measured at ${boilOffs} of the runs.`);
  });
});
