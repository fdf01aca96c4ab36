import "server-only";
import { and, count, desc, eq, inArray, isNull, ne, or, sql } from "drizzle-orm";
import { db } from "@/db";
import { checkouts, locations, stamps, stockTakeSightings, stockTakes, users } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { codeFromScan } from "@/lib/stamps/codes";
import { relocations, stockTakeReport, type ExpectedStamp } from "@/lib/stamps/stock-take";
import { locationLabel } from "@/lib/stamps/format";
import { isUniqueViolation } from "./events";
import { updateStamp } from "./edit";
import type { StockTakeDto, StockTakePlace, StockTakeSummary } from "@/lib/contracts/stamps";

export async function listStockTakes(actor: Actor): Promise<StockTakeSummary[]> {
  assertCan(actor, "data:read");
  const rows = await db
    .select({ take: stockTakes, byName: users.name, seen: count(stockTakeSightings.id) })
    .from(stockTakes)
    .leftJoin(users, eq(users.id, stockTakes.startedBy))
    .leftJoin(stockTakeSightings, eq(stockTakeSightings.stockTakeId, stockTakes.id))
    .groupBy(stockTakes.id, users.name)
    .orderBy(desc(stockTakes.startedAt))
    .limit(100);
  return rows.map((r) => summary(r.take, r.byName, Number(r.seen)));
}

function summary(take: typeof stockTakes.$inferSelect, byName: string | null, seen: number): StockTakeSummary {
  return {
    id: take.id,
    site: take.site,
    status: take.status,
    startedAt: take.startedAt.toISOString(),
    endedAt: take.endedAt?.toISOString() ?? null,
    startedByName: byName,
    expectedAtStart: take.expectedCount,
    seen,
  };
}

/** Stamps recorded at the site that are not retired and not out: what a count expects to see. */
async function expectedAt(site: string) {
  const [row] = await db
    .select({ n: count() })
    .from(stamps)
    .innerJoin(locations, eq(locations.id, stamps.locationId))
    .leftJoin(checkouts, and(eq(checkouts.stampId, stamps.id), isNull(checkouts.returnedAt)))
    .where(and(eq(locations.site, site), ne(stamps.condition, "retired"), isNull(checkouts.id)));
  return Number(row.n);
}

export async function startStockTake(actor: Actor, input: { site: string }): Promise<StockTakeSummary> {
  assertCan(actor, "stamps:write");
  const [known] = await db.select({ site: locations.site }).from(locations).where(eq(locations.site, input.site)).limit(1);
  if (!known) throw new AppError("unprocessable", {}, { site: ["validation.siteUnknown"] });
  try {
    const [take] = await db.insert(stockTakes).values({ site: input.site, startedBy: actor.id, expectedCount: await expectedAt(input.site) }).returning();
    return summary(take, actor.name, 0);
  } catch (error) {
    if (isUniqueViolation(error, "stock_takes_one_open_per_site")) throw new AppError("stockTakeOpen");
    throw error;
  }
}

async function findTake(id: string) {
  const [row] = await db.select({ take: stockTakes, byName: users.name }).from(stockTakes).leftJoin(users, eq(users.id, stockTakes.startedBy)).where(eq(stockTakes.id, id)).limit(1);
  if (!row) throw new AppError("notFound");
  return row;
}

/** The count so far: progress, and the stamps missing, misplaced and unexpected. */
export async function getStockTake(actor: Actor, id: string): Promise<StockTakeDto> {
  assertCan(actor, "data:read");
  const { take, byName } = await findTake(id);
  const sightings = await db.select().from(stockTakeSightings).where(eq(stockTakeSightings.stockTakeId, id)).orderBy(desc(stockTakeSightings.seenAt));
  const seenIds = sightings.map((s) => s.stampId).filter((x): x is string => x !== null);
  const rows = await db
    .select({
      id: stamps.id,
      code: stamps.code,
      name: stamps.name,
      condition: stamps.condition,
      locationId: stamps.locationId,
      site: locations.site,
      checkoutId: checkouts.id,
    })
    .from(stamps)
    .leftJoin(locations, eq(locations.id, stamps.locationId))
    .leftJoin(checkouts, and(eq(checkouts.stampId, stamps.id), isNull(checkouts.returnedAt)))
    .where(seenIds.length ? or(eq(locations.site, take.site), inArray(stamps.id, seenIds)) : eq(locations.site, take.site));
  const allLocations = await db.select().from(locations);
  const place = (locationId: string | null): StockTakePlace => {
    const l = locationId ? allLocations.find((x) => x.id === locationId) : undefined;
    return l ? { id: l.id, label: locationLabel(l)! } : null;
  };
  const byCode = new Map(rows.map((r) => [r.code, r]));
  const expected: ExpectedStamp[] = rows.map((r) => ({
    id: r.id,
    code: r.code,
    locationId: r.locationId,
    site: r.site,
    checkedOut: r.checkoutId !== null,
    retired: r.condition === "retired",
  }));
  const report = stockTakeReport(take.site, expected, sightings.map((s) => ({ code: s.code, stampId: s.stampId, locationId: s.locationId })));
  const name = (code: string) => byCode.get(code)?.name ?? null;
  const outcome = new Map<string, "found" | "misplaced" | "unexpected">();
  for (const s of sightings) outcome.set(s.code, "found");
  for (const m of report.misplaced) outcome.set(m.code, "misplaced");
  for (const u of report.unexpected) outcome.set(u.code, "unexpected");
  return {
    ...summary(take, byName, sightings.length),
    expected: report.expected,
    seenExpected: report.seenExpected,
    missing: report.missing.map((code) => ({ code, name: name(code) ?? "", recorded: place(byCode.get(code)?.locationId ?? null) })),
    misplaced: report.misplaced.map((m) => ({ code: m.code, name: name(m.code) ?? "", recorded: place(m.recordedLocationId), seenAt: place(m.seenLocationId) })),
    unexpected: report.unexpected.map((u) => ({ code: u.code, name: name(u.code), reason: u.reason, recorded: place(u.recordedLocationId), seenAt: place(u.seenLocationId) })),
    checkedOut: report.checkedOut.map((code) => ({ code, name: name(code) ?? "" })),
    recent: sightings.slice(0, 15).map((s) => ({ code: s.code, name: name(s.code), seenAt: place(s.locationId), at: s.seenAt.toISOString(), result: outcome.get(s.code) ?? "found" })),
    relocatable: relocations(report).length,
    locations: allLocations.filter((l) => l.site === take.site).sort((a, b) => a.code.localeCompare(b.code)).map((l) => ({ id: l.id, code: l.code })),
  };
}

/** Marks a stamp as seen at a location of the count's site; scanning it again updates where. */
export async function recordSighting(actor: Actor, id: string, input: { code: string; locationId: string }) {
  assertCan(actor, "stamps:write");
  const { take } = await findTake(id);
  if (take.status !== "open") throw new AppError("stockTakeClosed");
  const code = codeFromScan(input.code);
  if (!code) throw new AppError("validation", {}, { code: ["validation.scanCode"] });
  const [location] = await db.select().from(locations).where(and(eq(locations.id, input.locationId), eq(locations.site, take.site))).limit(1);
  if (!location) throw new AppError("unprocessable", {}, { locationId: ["validation.locationUnknown"] });
  const [stamp] = await db.select({ id: stamps.id, name: stamps.name }).from(stamps).where(eq(stamps.code, code)).limit(1);
  await db
    .insert(stockTakeSightings)
    .values({ stockTakeId: id, code, stampId: stamp?.id ?? null, locationId: location.id, seenBy: actor.id })
    .onConflictDoUpdate({
      target: [stockTakeSightings.stockTakeId, stockTakeSightings.code],
      set: { locationId: location.id, seenBy: actor.id, seenAt: sql`now()` },
    });
  return { code, known: Boolean(stamp), name: stamp?.name ?? null, location: locationLabel(location) };
}

export async function removeSighting(actor: Actor, id: string, code: string) {
  assertCan(actor, "stamps:write");
  const { take } = await findTake(id);
  if (take.status !== "open") throw new AppError("stockTakeClosed");
  const [row] = await db.delete(stockTakeSightings).where(and(eq(stockTakeSightings.stockTakeId, id), eq(stockTakeSightings.code, code))).returning({ id: stockTakeSightings.id });
  if (!row) throw new AppError("notFound");
}

export async function endStockTake(actor: Actor, id: string): Promise<StockTakeSummary> {
  assertCan(actor, "stamps:write");
  const [take] = await db
    .update(stockTakes)
    .set({ status: "closed", endedAt: new Date() })
    .where(and(eq(stockTakes.id, id), eq(stockTakes.status, "open")))
    .returning();
  if (!take) {
    await findTake(id);
    throw new AppError("stockTakeClosed");
  }
  const [{ n }] = await db.select({ n: count() }).from(stockTakeSightings).where(eq(stockTakeSightings.stockTakeId, id));
  return summary(take, null, Number(n));
}

/**
 * Moves every misplaced or stray stamp of the count to where it was seen, in one transaction;
 * each move lands in the stamp's history with a note naming the count.
 */
export async function relocateFound(actor: Actor, id: string): Promise<{ moved: string[] }> {
  assertCan(actor, "stamps:write");
  const dto = await getStockTake(actor, id);
  const moves = [
    ...dto.misplaced,
    ...dto.unexpected.filter((u) => u.reason === "otherSite" || u.reason === "noLocation"),
  ].filter((m) => m.seenAt !== null);
  await db.transaction(async (tx) => {
    for (const m of moves) {
      await updateStamp(actor, m.code, { locationId: m.seenAt!.id, version: 0 }, { ignoreVersion: true, tx, moveDetails: { stockTakeSite: dto.site, stockTakeId: dto.id } });
    }
  });
  return { moved: moves.map((m) => m.code) };
}
