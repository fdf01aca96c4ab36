import "server-only";
import { asc, count, eq, sql } from "drizzle-orm";
import { db } from "@/db";
import { locations, stamps, type Location } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import type { LocationInput } from "@/lib/validation/stamps";
import { isForeignKeyViolation, isUniqueViolation } from "./events";
import type { LocationDto } from "@/lib/contracts/stamps";
import { audit } from "@/lib/log";

const toDto = (l: Location, stampCount = 0): LocationDto => ({ id: l.id, site: l.site, code: l.code, description: l.description, stampCount });

export async function listLocations(actor: Actor): Promise<LocationDto[]> {
  assertCan(actor, "data:read");
  const rows = await db
    .select({ location: locations, n: count(stamps.id) })
    .from(locations)
    .leftJoin(stamps, eq(stamps.locationId, locations.id))
    .groupBy(locations.id)
    .orderBy(asc(locations.site), asc(locations.code));
  return rows.map((r) => toDto(r.location, Number(r.n)));
}

export async function getLocation(actor: Actor, id: string): Promise<LocationDto> {
  assertCan(actor, "data:read");
  const [row] = await db
    .select({ location: locations, n: count(stamps.id) })
    .from(locations)
    .leftJoin(stamps, eq(stamps.locationId, locations.id))
    .where(eq(locations.id, id))
    .groupBy(locations.id);
  if (!row) throw new AppError("notFound");
  return toDto(row.location, Number(row.n));
}

function taken(): never {
  throw new AppError("locationTaken", {}, { code: ["errors.locationTaken"] });
}

export async function createLocation(actor: Actor, input: LocationInput): Promise<LocationDto> {
  assertCan(actor, "stamps:write");
  try {
    const [row] = await db.insert(locations).values({ site: input.site, code: input.code, description: input.description ?? null }).returning();
    return toDto(row);
  } catch (error) {
    if (isUniqueViolation(error, "locations_site_code_key")) taken();
    throw error;
  }
}

export async function updateLocation(actor: Actor, id: string, patch: Partial<LocationInput>): Promise<LocationDto> {
  assertCan(actor, "stamps:write");
  try {
    const [row] = await db
      .update(locations)
      .set({ ...patch, updatedAt: sql`now()` })
      .where(eq(locations.id, id))
      .returning();
    if (!row) throw new AppError("notFound");
    return getLocation(actor, row.id);
  } catch (error) {
    if (isUniqueViolation(error, "locations_site_code_key")) taken();
    throw error;
  }
}

/** Only an empty location can go: the foreign key refuses while stamps still live there. */
export async function deleteLocation(actor: Actor, id: string): Promise<{ site: string; code: string }> {
  assertCan(actor, "stamps:write");
  try {
    const [row] = await db.delete(locations).where(eq(locations.id, id)).returning({ site: locations.site, code: locations.code });
    if (!row) throw new AppError("notFound");
    return row;
  } catch (error) {
    if (isForeignKeyViolation(error)) throw new AppError("locationInUse");
    throw error;
  }
  audit("record.deleted", actor, { kind: "location", id });
}
