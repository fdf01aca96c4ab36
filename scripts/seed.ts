// npm run db:seed — adds the demo data where it is missing (idempotent) and prints the demo sign-ins.
import { loadConfig } from "./lib/config";

loadConfig();
const { database } = await import("@/db");
const { seedDemo, printSignIns } = await import("./lib/seed");

const { client, db } = database();
try {
  await seedDemo(db);
  printSignIns();
} finally {
  await client.end();
}
