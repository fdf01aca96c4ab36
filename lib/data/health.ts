import "server-only";
import { sql } from "drizzle-orm";
import { db } from "@/db";
import { objectStore } from "@/lib/s3";

// What a load balancer asks every app server: can it reach the database and the object store? Each check has a
// short limit of its own, so a hung dependency answers "down" instead of holding the check open.

export type Reach = "ok" | "down";

export interface Health {
  ok: boolean;
  database: Reach;
  objectStore: Reach;
}

const LIMIT_MS = 2_000;

async function within(check: () => Promise<unknown>): Promise<Reach> {
  let timer: NodeJS.Timeout | undefined;
  try {
    await Promise.race([check(), new Promise((_, reject) => (timer = setTimeout(() => reject(new Error("timed out")), LIMIT_MS)))]);
    return "ok";
  } catch {
    return "down";
  } finally {
    clearTimeout(timer);
  }
}

/** The database answers a query and the object store's bucket answers; no names, versions or errors are told. */
export async function health(): Promise<Health> {
  const [database, store] = await Promise.all([within(() => db.execute(sql`select 1`)), within(() => objectStore().ping())]);
  return { ok: database === "ok" && store === "ok", database, objectStore: store };
}
