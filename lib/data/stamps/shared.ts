import "server-only";
import { and, eq, isNull, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { checkouts, locations, stamps, type Checkout, type Location, type Stamp } from "@/db/schema";
import { AppError } from "@/lib/errors";
import type { CheckoutDto, LocationRef } from "@/lib/contracts/stamps";

// What the shelf's data modules share: the row → DTO maps and the lookups every change starts with.

/** An open check-out as the API shows it; `today` (ISO date) decides whether it is overdue. */
export function toCheckoutDto(c: Checkout, checkedOutByName: string | null, today: string): CheckoutDto {
  return {
    id: c.id,
    borrowerId: c.borrowerId,
    borrowerName: c.borrowerName,
    borrowerEmail: c.borrowerEmail,
    workstation: c.workstation,
    outAt: c.outAt.toISOString(),
    dueOn: c.dueOn,
    overdue: c.dueOn < today,
    note: c.note,
    checkedOutByName,
    lastRemindedAt: c.lastRemindedAt?.toISOString() ?? null,
  };
}

export const toLocationRef = (l: Pick<Location, "id" | "site" | "code"> | null): LocationRef | null => (l && l.id ? { id: l.id, site: l.site, code: l.code } : null);

export async function findStamp(tx: Transaction | typeof db, code: string, lock = false): Promise<Stamp> {
  const query = tx.select().from(stamps).where(eq(stamps.code, code)).limit(1);
  const [stamp] = lock ? await query.for("update") : await query;
  if (!stamp) throw new AppError("notFound");
  return stamp;
}

export async function openCheckoutOf(tx: Transaction | typeof db, stampId: string) {
  const [open] = await tx.select().from(checkouts).where(and(eq(checkouts.stampId, stampId), isNull(checkouts.returnedAt))).limit(1);
  return open ?? null;
}

export async function locationOrFail(tx: Transaction, id: string): Promise<Location> {
  const [location] = await tx.select().from(locations).where(eq(locations.id, id)).limit(1);
  if (!location) throw new AppError("unprocessable", {}, { locationId: ["validation.locationUnknown"] });
  return location;
}

export const bump = { version: sql`${stamps.version} + 1`, updatedAt: sql`now()` };
