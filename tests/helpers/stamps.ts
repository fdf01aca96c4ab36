import { randomBytes } from "node:crypto";
import { and, eq, isNull } from "drizzle-orm";
import { checkouts, locations, stampEvents, stamps, type Location, type Stamp } from "@/db/schema";
import { db } from "./db";

/** A short prefix unique to one test file's run, so fixtures never collide across files or runs. */
export const uniquePrefix = (label: string) => `${label}${randomBytes(3).toString("hex")}`.toUpperCase();

export async function createLocation(site: string, code: string): Promise<Location> {
  const [row] = await db().insert(locations).values({ site, code }).onConflictDoNothing().returning();
  if (row) return row;
  const [existing] = await db().select().from(locations).where(and(eq(locations.site, site), eq(locations.code, code)));
  return existing;
}

/** A stamp straight in the database (no history entry), for tests that need one to act on. */
export async function createStampRow(values: Partial<typeof stamps.$inferInsert> & { code: string }): Promise<Stamp> {
  const [row] = await db()
    .insert(stamps)
    .values({ name: `Test stamp ${values.code}`, widthMm: 200, heightMm: 200, ...values })
    .returning();
  return row;
}

export async function reloadStamp(code: string): Promise<Stamp | undefined> {
  const [row] = await db().select().from(stamps).where(eq(stamps.code, code));
  return row;
}

export async function openCheckouts(stampId: string) {
  return db().select().from(checkouts).where(and(eq(checkouts.stampId, stampId), isNull(checkouts.returnedAt)));
}

export async function eventsOf(stampId: string) {
  return db().select().from(stampEvents).where(eq(stampEvents.stampId, stampId));
}

/** A date n days from today (UTC), YYYY-MM-DD. */
export const daysFromToday = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);
