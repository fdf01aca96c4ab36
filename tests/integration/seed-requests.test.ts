import { inArray } from "drizzle-orm";
import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import { newStampRequests } from "@/db/schema";
import { objectStore } from "@/lib/s3";
import { seedMotifs } from "@/scripts/seed/motifs";
import { seedPlans } from "@/scripts/seed/plans";
import { demoNewStampRequests, demoSketchPng, seedNewStampRequests } from "@/scripts/seed/requests";
import { seedStamps } from "@/scripts/seed/stamps";
import { seedUsers } from "@/scripts/seed/users";
import { seedWax } from "@/scripts/seed/wax";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { signIn, type Session } from "../helpers/http";
import { getPicture } from "../helpers/pictures";

// The demo new-stamp requests (scripts/seed/requests.ts): four invented requests in three states, added once; the
// designer's has a sketch drawn from the demo art, the same picture every time, served like an uploaded one.
const notes = demoNewStampRequests.map((r) => r.note);
let reader: Session;

beforeAll(async () => {
  testEnv();
  await seedUsers(db());
  await seedStamps(db());
  await seedWax(db());
  await seedPlans(db());
  await seedMotifs(db());
  await seedNewStampRequests(db(), objectStore());
  expect(await seedNewStampRequests(db(), objectStore())).toBe(0);
  const user = await createUser("designer");
  reader = (await signIn(user.email, user.password))!;
});

describe("demo new-stamp requests", () => {
  it("adds four requests once: two open, one declined with its reason, one made into a stamp of the motif's set", async () => {
    const rows = await db().select().from(newStampRequests).where(inArray(newStampRequests.note, notes));
    expect(rows).toHaveLength(4);
    expect(rows.map((r) => r.state).sort()).toEqual(["declined", "made", "open", "open"]);
    expect(rows.find((r) => r.state === "declined")?.declineReason).toMatch(/\w+/);
    const made = rows.find((r) => r.state === "made")!;
    expect(made.stampId).not.toBeNull();
    expect(made.answeredAt).not.toBeNull();
    expect(rows.find((r) => r.planId)?.state).toBe("open");
  });

  it("the sketch is the same picture every run, stored and served as a PNG with its thumbnail", async () => {
    const [a, b] = [await demoSketchPng(), await demoSketchPng()];
    expect(a.equals(b)).toBe(true);
    const rows = await db().select().from(newStampRequests).where(inArray(newStampRequests.note, notes));
    const sketched = rows.filter((r) => r.sketchKey);
    expect(sketched).toHaveLength(1);
    expect(sketched[0]).toMatchObject({ state: "open", sketchType: "image/png", role: "border" });
    const original = await getPicture(reader, `/api/v1/new-stamp-requests/${sketched[0].id}/sketch`);
    expect(original.status).toBe(200);
    expect(original.contentType).toBe("image/png");
    // 120 × 40 mm at 100 DPI: round(120 / 25.4 × 100) = 472, round(40 / 25.4 × 100) = 157 px (px = mm / 25.4 × dpi).
    const meta = await sharp(original.bytes).metadata();
    expect([meta.width, meta.height]).toEqual([472, 157]);
    expect((await getPicture(reader, `/api/v1/new-stamp-requests/${sketched[0].id}/sketch?variant=thumb`)).contentType).toBe("image/webp");
  });
});
