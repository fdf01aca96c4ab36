import { join } from "node:path";
import { drizzle } from "drizzle-orm/postgres-js";
import { migrate } from "drizzle-orm/postgres-js/migrator";
import postgres from "postgres";
import { projectRoot } from "./config";

/** Applies the committed migrations in db/migrations to DATABASE_URL. */
export async function runMigrations(databaseUrl: string) {
  const client = postgres(databaseUrl, { max: 1, onnotice: () => {} });
  try {
    await migrate(drizzle(client), { migrationsFolder: join(projectRoot, "db", "migrations") });
  } finally {
    await client.end();
  }
}
