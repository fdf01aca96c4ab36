import { seedMotifs } from "@/scripts/seed/motifs";
import { seedPlans } from "@/scripts/seed/plans";
import { seedRuns } from "@/scripts/seed/runs";
import { seedStamps } from "@/scripts/seed/stamps";
import { seedUsers } from "@/scripts/seed/users";
import { seedWax } from "@/scripts/seed/wax";
import { db } from "./db";

/** The demo data a production run stands on, in the order `npm start` seeds it (without scans and requests). */
export async function seedDemoRuns() {
  await seedUsers(db());
  await seedStamps(db());
  await seedWax(db());
  await seedPlans(db());
  await seedMotifs(db());
  await seedRuns(db());
}
