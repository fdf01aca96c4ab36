import type { Database } from "@/db";
import { seedPlans } from "../seed/plans";
import { seedMotifs } from "../seed/motifs";
import { seedNewStampRequests } from "../seed/requests";
import { seedRuns } from "../seed/runs";
import { seedScans } from "../seed/scans";
import { seedStamps } from "../seed/stamps";
import { demoUsers, seedUsers } from "../seed/users";
import { seedWax } from "../seed/wax";
import { objectStoreFromEnv } from "./object-store-config";

export async function seedDemo(db: Database) {
  await seedUsers(db);
  await seedStamps(db);
  const store = objectStoreFromEnv();
  await seedScans(db, store);
  await seedWax(db);
  await seedPlans(db);
  await seedMotifs(db);
  await seedRuns(db);
  await seedNewStampRequests(db, store);
}

export function printSignIns(appUrl = process.env.APP_URL ?? "http://localhost:3000") {
  const width = Math.max(...demoUsers.map((u) => u.email.length));
  console.log(`\nDemo sign-ins at ${appUrl}/signin (development only):`);
  for (const u of demoUsers) console.log(`  ${u.role.padEnd(10)} ${u.email.padEnd(width)}  ${u.password}`);
  console.log("");
}
