import { drizzle } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import * as schema from "./schema";

function connect() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set (see .env.example)");
  const client = postgres(url, { max: Number(process.env.DATABASE_POOL_MAX ?? 10), onnotice: () => {} });
  return { client, db: drizzle(client, { schema }) };
}

// One pool per process; kept on globalThis so dev reloads do not open a new pool each time.
const globalForDb = globalThis as unknown as { capgridDb?: ReturnType<typeof connect> };

export function database() {
  globalForDb.capgridDb ??= connect();
  return globalForDb.capgridDb;
}

export const db = new Proxy({} as ReturnType<typeof connect>["db"], {
  get: (_target, property) => Reflect.get(database().db, property),
});

export type Database = ReturnType<typeof connect>["db"];
export type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];
export { schema };
