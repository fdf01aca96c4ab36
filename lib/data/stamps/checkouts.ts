import "server-only";
import { and, asc, eq, isNull, lt } from "drizzle-orm";
import { db } from "@/db";
import { checkouts, locations, stamps, users } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { canBeCheckedOut } from "@/lib/stamps/condition";
import type { CheckoutInput, ReturnInput } from "@/lib/validation/stamps";
import { workshopToday } from "../settings";
import { locationLabel } from "@/lib/stamps/format";
import { isUniqueViolation, recordEvent } from "./events";
import { addImpressions } from "./impressions";
import type { OpenCheckoutDto } from "@/lib/contracts/stamps";
import { bump, findStamp, locationOrFail, openCheckoutOf, toCheckoutDto, toLocationRef } from "./shared";

// Checking stamps out and back in, and who has what.

/**
 * Hands a stamp out. The stamp row is locked first, so concurrent check-outs queue and all but
 * the first see the open one (409); the partial unique index backs this up in the database.
 */
export async function checkOutStamp(actor: Actor, code: string, input: CheckoutInput) {
  assertCan(actor, "stamps:write");
  let borrower = { id: null as string | null, name: input.borrowerName ?? "", email: input.borrowerEmail ?? null };
  if (input.borrowerId) {
    const [user] = await db.select().from(users).where(and(eq(users.id, input.borrowerId), eq(users.disabled, false))).limit(1);
    if (!user) throw new AppError("unprocessable", {}, { borrowerId: ["validation.borrowerUnknown"] });
    borrower = { id: user.id, name: user.name, email: user.email };
  }
  try {
    return await db.transaction(async (tx) => {
      const stamp = await findStamp(tx, code, true);
      if (!canBeCheckedOut(stamp.condition)) throw new AppError("stampUnavailable");
      if (await openCheckoutOf(tx, stamp.id)) throw new AppError("alreadyCheckedOut");
      const [row] = await tx
        .insert(checkouts)
        .values({
          stampId: stamp.id,
          borrowerId: borrower.id,
          borrowerName: borrower.name,
          borrowerEmail: borrower.email,
          workstation: input.workstation,
          dueOn: input.dueOn,
          note: input.note ?? null,
          checkedOutBy: actor.id,
        })
        .returning();
      await recordEvent(tx, stamp.id, actor, { kind: "checked_out", to: borrower.name, note: input.note ?? null, details: { workstation: input.workstation, dueOn: input.dueOn } });
      return { id: row.id, code: stamp.code, borrowerName: row.borrowerName, workstation: row.workstation, dueOn: row.dueOn, outAt: row.outAt.toISOString() };
    });
  } catch (error) {
    if (isUniqueViolation(error, "checkouts_one_open_per_stamp")) throw new AppError("alreadyCheckedOut");
    throw error;
  }
}

export async function returnStamp(actor: Actor, code: string, input: ReturnInput) {
  assertCan(actor, "stamps:write");
  const today = await workshopToday();
  return db.transaction(async (tx) => {
    const stamp = await findStamp(tx, code, true);
    const open = await openCheckoutOf(tx, stamp.id);
    if (!open) throw new AppError("notCheckedOut");
    await tx.update(checkouts).set({ returnedAt: new Date(), returnedBy: actor.id }).where(eq(checkouts.id, open.id));
    if (input.impressions) await addImpressions(tx, [{ stampId: stamp.id, impressions: input.impressions }], { kind: "return" });
    const set: Partial<typeof stamps.$inferInsert> = {};
    let moved: { from: string | null; to: string | null } | null = null;
    if (input.locationId && input.locationId !== stamp.locationId) {
      const [from, to] = await Promise.all([
        stamp.locationId ? tx.select().from(locations).where(eq(locations.id, stamp.locationId)).then((r) => r[0] ?? null) : null,
        locationOrFail(tx, input.locationId),
      ]);
      set.locationId = to.id;
      moved = { from: locationLabel(from), to: locationLabel(to) };
    }
    if (Object.keys(set).length) await tx.update(stamps).set({ ...set, ...bump }).where(eq(stamps.id, stamp.id));
    await recordEvent(tx, stamp.id, actor, {
      kind: "returned",
      from: open.borrowerName,
      note: input.note ?? null,
      details: { workstation: open.workstation, impressions: input.impressions ?? null, late: open.dueOn < today },
    });
    if (moved) await recordEvent(tx, stamp.id, actor, { kind: "moved", from: moved.from, to: moved.to });
    return { code: stamp.code, returnedAt: new Date().toISOString() };
  });
}

/** Stamps that are out (or only the overdue ones), the longest overdue first. */
export async function listCheckouts(actor: Actor, options: { overdue?: boolean } = {}): Promise<OpenCheckoutDto[]> {
  assertCan(actor, "data:read");
  const today = await workshopToday();
  const rows = await db
    .select({ checkout: checkouts, code: stamps.code, name: stamps.name, location: locations, byName: users.name })
    .from(checkouts)
    .innerJoin(stamps, eq(stamps.id, checkouts.stampId))
    .leftJoin(locations, eq(locations.id, stamps.locationId))
    .leftJoin(users, eq(users.id, checkouts.checkedOutBy))
    .where(and(isNull(checkouts.returnedAt), options.overdue ? lt(checkouts.dueOn, today) : undefined))
    .orderBy(asc(checkouts.dueOn), asc(stamps.code));
  return rows.map(({ checkout: c, code, name, location, byName }) => ({
    ...toCheckoutDto(c, byName, today),
    stampCode: code,
    stampName: name,
    location: toLocationRef(location),
  }));
}

/** People who may borrow a stamp: active users, for the check-out form. */
export async function listBorrowers(actor: Actor): Promise<{ id: string; name: string; email: string }[]> {
  assertCan(actor, "stamps:write");
  return db.select({ id: users.id, name: users.name, email: users.email }).from(users).where(eq(users.disabled, false)).orderBy(asc(users.name));
}
