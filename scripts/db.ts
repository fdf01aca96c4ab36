// npm run db:start | db:stop | db:reset — the private PostgreSQL cluster in .data/postgres.
import { join } from "node:path";
import { loadConfig, projectRoot } from "./lib/config";
import { removeCluster, startCluster, stopCluster } from "./lib/postgres";

const env = loadConfig();
const dir = join(projectRoot, ".data", "postgres");
const command = process.argv[2];

try {
  if (command === "start") startCluster({ dir, databaseUrl: env.DATABASE_URL! });
  else if (command === "stop") stopCluster(dir);
  else if (command === "reset") {
    removeCluster(dir);
    console.log("removed the local database; the next `npm start` creates and seeds a new one");
  } else {
    console.error("usage: tsx scripts/db.ts start|stop|reset");
    process.exit(2);
  }
} catch (error) {
  console.error((error as Error).message);
  process.exit(1);
}
