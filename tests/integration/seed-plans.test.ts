import { inArray } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { plans } from "@/db/schema";
import { seedPlans } from "@/scripts/seed/plans";
import { seedStamps } from "@/scripts/seed/stamps";
import { seedUsers } from "@/scripts/seed/users";
import { createUser, db } from "../helpers/db";
import { api, signIn, type Session } from "../helpers/http";

// The demo plans (scripts/seed/plans.ts): at least six invented plans across the demo stamps, one with borders and
// one on both faces, computed as a save through the API would be (so they open fresh, not stale), added once.

let reader: Session;
beforeAll(async () => {
  await seedUsers(db());
  await seedStamps(db());
  await seedPlans(db());
  await seedPlans(db());
  const user = await createUser("waxmaster");
  reader = (await signIn(user.email, user.password))!;
});

describe("demo plans", () => {
  it("adds at least six plans once, with borders in one and both faces in another", async () => {
    const rows = await db().select().from(plans).where(inArray(plans.name, ["Market run, straight on mori 106", "Two kodi of long cloths, half-drop", "Export cotton, brick", "Diagonal sample, a third a row", "Free footprint trial, turnover", "Sarong with borders down both selvedges", "Both faces, front and mirror twin"]));
    expect(rows.length).toBe(7);
    expect(rows.filter((r) => (r.borders as unknown[]).length > 0)).toHaveLength(1);
    expect(rows.filter((r) => r.sides === 2)).toHaveLength(1);
    expect(new Set(rows.map((r) => r.arrangement)).size).toBeGreaterThanOrEqual(6);
  });

  it("open through the API with their numbers and nothing stale", async () => {
    const rows = await db().select({ id: plans.id }).from(plans).where(inArray(plans.name, ["Sarong with borders down both selvedges", "Both faces, front and mirror twin"]));
    for (const { id } of rows) {
      const res = await api("GET", `/api/v1/plans/${id}`, { session: reader });
      expect(res.status).toBe(200);
      expect(res.body.plan.stale).toBe(false);
      expect(res.body.plan.summary.impressionsTotal).toBeGreaterThan(0);
    }
  });
});
