// npm run db:migrate — applies db/migrations to DATABASE_URL.
import { loadConfig } from "./lib/config";
import { runMigrations } from "./lib/migrate";

const env = loadConfig();
await runMigrations(env.DATABASE_URL!);
console.log("migrations applied");
