import "server-only";
import { and, asc, count, desc, eq, gte, ilike, inArray, isNull, lt, lte, ne, or, sql, type SQL } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { checkouts, damageReports, locations, stampEvents, stamps, users, type Checkout, type Location, type Stamp } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { LOW_COVERAGE_RATIO } from "@/lib/stamps/coverage";
import { canBeCheckedOut, canChangeCondition, isRepair, needsToBeIn, type Condition } from "@/lib/stamps/condition";
import type {
  CheckoutInput,
  ConditionChangeInput,
  CreateStampInput,
  DamageReportInput,
  ReturnInput,
  StampListQuery,
  UpdateStampInput,
} from "@/lib/validation/stamps";
import { deleteObjects } from "@/lib/s3";
import { scanObjectKeys } from "./scans";
import { workshopToday } from "./settings";
import { isUniqueViolation, locationLabel, recordEvent } from "./stamp-events";
import { notifyKeepersOfDamage } from "./stamp-mail";
import type { CheckoutDto, LocationRef, OpenCheckoutDto, StampDto, StampEventDto, StampListItem, StampPage } from "@/lib/contracts/stamps";

// --- DTOs ------------------------------------------------------------------------------------

/** An open check-out as the API shows it; `today` (ISO date) decides whether it is overdue. */
function toCheckoutDto(c: Checkout, checkedOutByName: string | null, today: string): CheckoutDto {
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

const toLocationRef = (l: Pick<Location, "id" | "site" | "code"> | null): LocationRef | null => (l && l.id ? { id: l.id, site: l.site, code: l.code } : null);

// --- list ---------------------------------------------------------------------------------------

const escapeLike = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

/** The WHERE clause of a list query; shared by the table, the count and the CSV export. `today` decides "overdue". */
export function stampFilter(query: Partial<StampListQuery> & { codes?: string[] }, today: string): SQL | undefined {
  const where: (SQL | undefined)[] = [];
  if (query.codes) where.push(query.codes.length ? inArray(stamps.code, query.codes) : sql`false`);
  for (const word of (query.q ?? "").split(/\s+/).filter(Boolean).slice(0, 8)) {
    const pattern = `%${escapeLike(word)}%`;
    where.push(
      or(
        ilike(stamps.code, pattern),
        ilike(stamps.name, pattern),
        ilike(stamps.maker, pattern),
        sql`array_to_string(${stamps.tags}, ' ') ILIKE ${pattern}`,
      ),
    );
  }
  if (query.condition?.length) where.push(inArray(stamps.condition, query.condition));
  if (query.location) where.push(eq(stamps.locationId, query.location));
  if (query.site) where.push(eq(locations.site, query.site));
  if (query.face) where.push(eq(stamps.face, query.face));
  if (query.tag) where.push(sql`${stamps.tags} @> ARRAY[${query.tag}]::text[]`);
  if (query.lowCoverage === true) where.push(lt(stamps.coverageRatio, LOW_COVERAGE_RATIO));
  if (query.lowCoverage === false) where.push(or(isNull(stamps.coverageRatio), gte(stamps.coverageRatio, LOW_COVERAGE_RATIO)));
  if (query.out === true) where.push(sql`${checkouts.id} IS NOT NULL`);
  if (query.out === false) where.push(isNull(checkouts.id));
  if (query.overdue === true) where.push(lt(checkouts.dueOn, today));
  if (query.overdue === false) where.push(or(isNull(checkouts.id), gte(checkouts.dueOn, today)));
  if (query.minWidthMm !== undefined) where.push(gte(stamps.widthMm, query.minWidthMm));
  if (query.maxWidthMm !== undefined) where.push(lte(stamps.widthMm, query.maxWidthMm));
  if (query.minHeightMm !== undefined) where.push(gte(stamps.heightMm, query.minHeightMm));
  if (query.maxHeightMm !== undefined) where.push(lte(stamps.heightMm, query.maxHeightMm));
  return and(...where);
}

function orderFor(sort: string): SQL[] {
  const desc_ = sort.startsWith("-");
  const key = desc_ ? sort.slice(1) : sort;
  const dir = (column: SQL | typeof stamps.code) => (desc_ ? desc(column) : asc(column));
  const nullsLast = (expr: SQL) => sql`${expr} ${sql.raw(desc_ ? "DESC" : "ASC")} NULLS LAST`;
  const order: Record<string, SQL[]> = {
    code: [dir(stamps.code)],
    name: [dir(sql`lower(${stamps.name})`)],
    width: [dir(sql`${stamps.widthMm}`)],
    height: [dir(sql`${stamps.heightMm}`)],
    condition: [dir(sql`${stamps.condition}`)],
    location: [nullsLast(sql`${locations.site}`), nullsLast(sql`${locations.code}`)],
    maker: [nullsLast(sql`lower(${stamps.maker})`)],
    madeOn: [nullsLast(sql`${stamps.madeOn}`)],
    updated: [dir(sql`${stamps.updatedAt}`)],
    impressions: [dir(sql`${stamps.impressionsCount}`)],
  };
  return [...(order[key] ?? order.code), asc(stamps.code)];
}

const listColumns = {
  id: stamps.id,
  code: stamps.code,
  name: stamps.name,
  widthMm: stamps.widthMm,
  heightMm: stamps.heightMm,
  face: stamps.face,
  mirrored: stamps.mirrored,
  maker: stamps.maker,
  madeOn: stamps.madeOn,
  condition: stamps.condition,
  tags: stamps.tags,
  impressionsCount: stamps.impressionsCount,
  coverageRatio: stamps.coverageRatio,
  updatedAt: stamps.updatedAt,
  locationId: locations.id,
  locationSite: locations.site,
  locationCode: locations.code,
  borrowerName: checkouts.borrowerName,
  workstation: checkouts.workstation,
  dueOn: checkouts.dueOn,
};

type ListRow = { [K in keyof typeof listColumns]: unknown };

function toListItem(r: ListRow, today: string): StampListItem {
  return {
    id: r.id as string,
    code: r.code as string,
    name: r.name as string,
    widthMm: r.widthMm as number,
    heightMm: r.heightMm as number,
    face: r.face as Stamp["face"],
    mirrored: r.mirrored as boolean,
    maker: r.maker as string | null,
    madeOn: r.madeOn as string | null,
    condition: r.condition as Stamp["condition"],
    location: r.locationId ? { id: r.locationId as string, site: r.locationSite as string, code: r.locationCode as string } : null,
    tags: r.tags as string[],
    impressionsCount: r.impressionsCount as number,
    coverageRatio: r.coverageRatio as number | null,
    updatedAt: (r.updatedAt as Date).toISOString(),
    checkout: r.borrowerName
      ? { borrowerName: r.borrowerName as string, workstation: r.workstation as string, dueOn: r.dueOn as string, overdue: (r.dueOn as string) < today }
      : null,
  };
}

/** The rows and joins of the stamp table: each stamp with its location and its open check-out. */
function listBase<T extends Record<string, unknown>>(columns: T) {
  return db
    .select(columns as never)
    .from(stamps)
    .leftJoin(locations, eq(locations.id, stamps.locationId))
    .leftJoin(checkouts, and(eq(checkouts.stampId, stamps.id), isNull(checkouts.returnedAt)));
}

export async function listStamps(actor: Actor, query: StampListQuery): Promise<StampPage> {
  assertCan(actor, "data:read");
  const today = await workshopToday();
  const where = stampFilter(query, today);
  const [rows, [{ n }]] = await Promise.all([
    listBase(listColumns)
      .where(where)
      .orderBy(...orderFor(query.sort))
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize) as unknown as Promise<ListRow[]>,
    listBase({ n: count() }).where(where) as unknown as Promise<{ n: number }[]>,
  ]);
  return { stamps: rows.map((r) => toListItem(r, today)), total: Number(n), page: query.page, pageSize: query.pageSize };
}

/** Every matching stamp, in table order (for the CSV export and labels). */
export async function listAllStamps(actor: Actor, query: Partial<StampListQuery> & { codes?: string[] }, limit = 50_000) {
  assertCan(actor, "data:read");
  const today = await workshopToday();
  const rows = (await listBase({ ...listColumns, stripDepthMm: stamps.stripDepthMm, weightG: stamps.weightG, notes: stamps.notes, outlinePath: stamps.outlinePath, twinId: stamps.twinId })
    .where(stampFilter(query, today))
    .orderBy(...orderFor(query.sort ?? "code"))
    .limit(limit)) as unknown as (ListRow & { stripDepthMm: number | null; weightG: number | null; notes: string | null; outlinePath: string | null; twinId: string | null })[];
  const twinIds = [...new Set(rows.map((r) => r.twinId).filter((id): id is string => !!id))];
  const twins = twinIds.length ? await db.select({ id: stamps.id, code: stamps.code }).from(stamps).where(inArray(stamps.id, twinIds)) : [];
  const twinCode = new Map(twins.map((t) => [t.id, t.code]));
  return rows.map((r) => ({
    ...toListItem(r, today),
    stripDepthMm: r.stripDepthMm,
    weightG: r.weightG,
    notes: r.notes,
    outlinePath: r.outlinePath,
    twinCode: r.twinId ? (twinCode.get(r.twinId) ?? null) : null,
  }));
}

/** Tags and makers in use, for the filters' suggestions. */
export async function stampFacets(actor: Actor): Promise<{ tags: string[]; sites: string[] }> {
  assertCan(actor, "data:read");
  const [tagRows, siteRows] = await Promise.all([
    db.execute<{ tag: string }>(sql`SELECT DISTINCT unnest(tags) AS tag FROM stamps ORDER BY 1 LIMIT 500`),
    db.selectDistinct({ site: locations.site }).from(locations).orderBy(asc(locations.site)),
  ]);
  return { tags: [...tagRows].map((r) => r.tag), sites: siteRows.map((r) => r.site) };
}

// --- one stamp ------------------------------------------------------------------------------------

async function findStamp(tx: Transaction | typeof db, code: string, lock = false): Promise<Stamp> {
  const query = tx.select().from(stamps).where(eq(stamps.code, code)).limit(1);
  const [stamp] = lock ? await query.for("update") : await query;
  if (!stamp) throw new AppError("notFound");
  return stamp;
}

async function openCheckoutOf(tx: Transaction | typeof db, stampId: string) {
  const [open] = await tx.select().from(checkouts).where(and(eq(checkouts.stampId, stampId), isNull(checkouts.returnedAt))).limit(1);
  return open ?? null;
}

export async function getStamp(actor: Actor, code: string): Promise<StampDto> {
  assertCan(actor, "data:read");
  const stamp = await findStamp(db, code);
  const today = await workshopToday();
  const [location, twin, checkoutRow, damage] = await Promise.all([
    stamp.locationId ? db.select().from(locations).where(eq(locations.id, stamp.locationId)).then((r) => r[0] ?? null) : null,
    stamp.twinId ? db.select({ code: stamps.code, name: stamps.name, mirrored: stamps.mirrored }).from(stamps).where(eq(stamps.id, stamp.twinId)).then((r) => r[0] ?? null) : null,
    db
      .select({ checkout: checkouts, byName: users.name })
      .from(checkouts)
      .leftJoin(users, eq(users.id, checkouts.checkedOutBy))
      .where(and(eq(checkouts.stampId, stamp.id), isNull(checkouts.returnedAt)))
      .limit(1)
      .then((r) => r[0] ?? null),
    db
      .select({ report: damageReports, byName: users.name })
      .from(damageReports)
      .leftJoin(users, eq(users.id, damageReports.reportedBy))
      .where(and(eq(damageReports.stampId, stamp.id), isNull(damageReports.resolvedAt)))
      .orderBy(desc(damageReports.reportedAt)),
  ]);
  const c = checkoutRow?.checkout;
  return {
    id: stamp.id,
    code: stamp.code,
    name: stamp.name,
    motifId: stamp.motifId,
    widthMm: stamp.widthMm,
    heightMm: stamp.heightMm,
    stripDepthMm: stamp.stripDepthMm,
    weightG: stamp.weightG,
    face: stamp.face,
    mirrored: stamp.mirrored,
    twin,
    maker: stamp.maker,
    madeOn: stamp.madeOn,
    condition: stamp.condition,
    location: toLocationRef(location),
    coverageRatio: stamp.coverageRatio,
    outlinePath: stamp.outlinePath,
    impressionsCount: stamp.impressionsCount,
    notes: stamp.notes,
    tags: stamp.tags,
    version: stamp.version,
    createdAt: stamp.createdAt.toISOString(),
    updatedAt: stamp.updatedAt.toISOString(),
    checkout: c ? toCheckoutDto(c, checkoutRow.byName, today) : null,
    openDamage: damage.map(({ report, byName }) => ({
      id: report.id,
      kind: report.kind,
      note: report.note,
      reportedAt: report.reportedAt.toISOString(),
      reportedByName: byName,
    })),
  };
}

export async function stampHistory(actor: Actor, code: string): Promise<StampEventDto[]> {
  assertCan(actor, "data:read");
  const stamp = await findStamp(db, code);
  const rows = await db.select().from(stampEvents).where(eq(stampEvents.stampId, stamp.id)).orderBy(desc(stampEvents.at), desc(stampEvents.id)).limit(500);
  return rows.map((e) => ({
    id: e.id,
    kind: e.kind,
    at: e.at.toISOString(),
    actorName: e.actorName,
    from: e.fromValue,
    to: e.toValue,
    note: e.note,
    details: e.details ?? null,
  }));
}

// --- create, change, delete ------------------------------------------------------------------

async function locationOrFail(tx: Transaction, id: string): Promise<Location> {
  const [location] = await tx.select().from(locations).where(eq(locations.id, id)).limit(1);
  if (!location) throw new AppError("unprocessable", {}, { locationId: ["validation.locationUnknown"] });
  return location;
}

async function twinOrFail(tx: Transaction, code: string): Promise<Stamp> {
  const [twin] = await tx.select().from(stamps).where(eq(stamps.code, code)).limit(1).for("update");
  if (!twin) throw new AppError("unprocessable", {}, { twinCode: ["validation.twinUnknown"] });
  return twin;
}

const bump = { version: sql`${stamps.version} + 1`, updatedAt: sql`now()` };

/**
 * Makes `stamp` and `twin` each other's mirror twin (or unlinks `stamp` when twin is null).
 * Former partners on either side lose their link; every stamp touched gets a history entry.
 */
async function relinkTwin(tx: Transaction, actor: Actor, stamp: Pick<Stamp, "id" | "code" | "twinId">, twin: Stamp | null) {
  if (stamp.twinId && stamp.twinId !== twin?.id) {
    const [former] = await tx
      .update(stamps)
      .set({ twinId: null, ...bump })
      .where(and(eq(stamps.id, stamp.twinId), eq(stamps.twinId, stamp.id)))
      .returning({ id: stamps.id });
    if (former) await recordEvent(tx, former.id, actor, { kind: "twin_linked", from: stamp.code, to: null });
  }
  if (!twin || twin.twinId === stamp.id) return;
  if (twin.twinId) {
    const [former] = await tx
      .update(stamps)
      .set({ twinId: null, ...bump })
      .where(and(eq(stamps.id, twin.twinId), eq(stamps.twinId, twin.id)))
      .returning({ id: stamps.id });
    if (former) await recordEvent(tx, former.id, actor, { kind: "twin_linked", from: twin.code, to: null });
  }
  await tx.update(stamps).set({ twinId: stamp.id, face: "pair", ...bump }).where(eq(stamps.id, twin.id));
  await recordEvent(tx, twin.id, actor, { kind: "twin_linked", from: null, to: stamp.code });
}

function codeTaken(): never {
  throw new AppError("codeTaken", {}, { code: ["errors.codeTaken"] });
}

export async function createStamp(actor: Actor, input: CreateStampInput, tx?: Transaction): Promise<{ code: string; id: string }> {
  assertCan(actor, "stamps:write");
  const work = async (tx: Transaction) => {
    const location = input.locationId ? await locationOrFail(tx, input.locationId) : null;
    const twin = input.twinCode ? await twinOrFail(tx, input.twinCode) : null;
    const { twinCode: _twinCode, ...fields } = input;
    void _twinCode;
    let created: Stamp;
    try {
      [created] = await tx
        .insert(stamps)
        .values({ ...fields, twinId: twin?.id ?? null })
        .returning();
    } catch (error) {
      if (isUniqueViolation(error, "stamps_code_key")) codeTaken();
      throw error;
    }
    await recordEvent(tx, created.id, actor, { kind: "created", to: created.code, details: { location: locationLabel(location), condition: created.condition } });
    if (twin) {
      await relinkTwin(tx, actor, { id: created.id, code: created.code, twinId: null }, twin);
      await recordEvent(tx, created.id, actor, { kind: "twin_linked", from: null, to: twin.code });
    }
    return { code: created.code, id: created.id };
  };
  if (tx) return work(tx);
  // A unique violation inside the transaction ends it; the error surfaces as codeTaken above.
  return db.transaction(work);
}

/** Fields whose change an "edited" history entry lists, with their before and after. */
const trackedFields = [
  "code",
  "name",
  "widthMm",
  "heightMm",
  "stripDepthMm",
  "weightG",
  "face",
  "mirrored",
  "maker",
  "madeOn",
  "coverageRatio",
  "outlinePath",
  "impressionsCount",
  "notes",
  "tags",
  "motifId",
] as const;

const same = (a: unknown, b: unknown) => JSON.stringify(a ?? null) === JSON.stringify(b ?? null);

/**
 * Applies a change made from `patch.version`. Someone else's save in between → 409 versionConflict,
 * never a silent overwrite. Location, condition and twin changes get their own history entries.
 */
export async function updateStamp(actor: Actor, code: string, patch: UpdateStampInput, options: { ignoreVersion?: boolean; tx?: Transaction; moveDetails?: Record<string, unknown> } = {}): Promise<{ code: string; version: number }> {
  assertCan(actor, "stamps:write");
  const work = async (tx: Transaction) => {
    const current = await findStamp(tx, code, true);
    if (!options.ignoreVersion && current.version !== patch.version) throw new AppError("versionConflict");

    const changes: { field: string; from: unknown; to: unknown }[] = [];
    const set: Partial<typeof stamps.$inferInsert> = {};
    for (const field of trackedFields) {
      if (!(field in patch) || patch[field] === undefined) continue;
      const to = patch[field];
      if (same(current[field], to)) continue;
      changes.push({ field, from: current[field] ?? null, to: to ?? null });
      (set as Record<string, unknown>)[field] = to;
    }

    // Location
    let moved: { from: string | null; to: string | null } | null = null;
    if (patch.locationId !== undefined && patch.locationId !== current.locationId) {
      const [from, to] = await Promise.all([
        current.locationId ? tx.select().from(locations).where(eq(locations.id, current.locationId)).then((r) => r[0] ?? null) : null,
        patch.locationId ? locationOrFail(tx, patch.locationId) : null,
      ]);
      set.locationId = patch.locationId;
      moved = { from: locationLabel(from), to: locationLabel(to) };
    }

    // Condition
    let conditionChange: { from: Condition; to: Condition } | null = null;
    if (patch.condition !== undefined && patch.condition !== current.condition) {
      conditionChange = await checkConditionChange(tx, current, patch.condition);
      set.condition = patch.condition;
    }

    // Twin
    const face = patch.face ?? current.face;
    let twin: Stamp | null | undefined;
    if (patch.twinCode !== undefined) {
      const wanted = patch.twinCode;
      if (wanted && face !== "pair") throw new AppError("unprocessable", {}, { twinCode: ["validation.twinNeedsPair"] });
      if (wanted && wanted === (patch.code ?? current.code)) throw new AppError("unprocessable", {}, { twinCode: ["validation.twinSelf"] });
      twin = wanted ? await twinOrFail(tx, wanted) : null;
    } else if (face === "single" && current.twinId) {
      twin = null; // a single stamp has no twin
    }
    const twinChanged = twin !== undefined && (twin?.id ?? null) !== current.twinId;
    if (twinChanged) set.twinId = twin?.id ?? null;

    if (Object.keys(set).length === 0) return { code: current.code, version: current.version };

    let updated: Stamp | undefined;
    try {
      [updated] = await tx
        .update(stamps)
        .set({ ...set, ...bump })
        .where(eq(stamps.id, current.id))
        .returning();
    } catch (error) {
      if (isUniqueViolation(error, "stamps_code_key")) codeTaken();
      throw error;
    }

    if (changes.length) await recordEvent(tx, current.id, actor, { kind: "edited", details: { changes } });
    if (moved) await recordEvent(tx, current.id, actor, { kind: "moved", from: moved.from, to: moved.to, details: options.moveDetails ?? null });
    if (conditionChange) await recordConditionChange(tx, actor, current.id, conditionChange, null);
    if (twinChanged) {
      const formerTwin = current.twinId ? await tx.select({ code: stamps.code }).from(stamps).where(eq(stamps.id, current.twinId)).then((r) => r[0]?.code ?? null) : null;
      await relinkTwin(tx, actor, { id: current.id, code: updated!.code, twinId: current.twinId }, twin ?? null);
      await recordEvent(tx, current.id, actor, { kind: "twin_linked", from: formerTwin, to: twin?.code ?? null });
    }
    return { code: updated!.code, version: updated!.version };
  };
  return options.tx ? work(options.tx) : db.transaction(work);
}

export async function deleteStamp(actor: Actor, code: string, version?: number) {
  assertCan(actor, "stamps:write");
  const scanKeys = await db.transaction(async (tx) => {
    const stamp = await findStamp(tx, code, true);
    if (version !== undefined && version !== stamp.version) throw new AppError("versionConflict");
    if (await openCheckoutOf(tx, stamp.id)) throw new AppError("stampCheckedOut");
    const keys = await scanObjectKeys(stamp.id, tx);
    await tx.delete(stamps).where(eq(stamps.id, stamp.id));
    return keys;
  });
  // The rows went with the stamp (cascade); the files go once the delete is committed.
  if (scanKeys.length) await deleteObjects(scanKeys);
}

// --- condition and damage -------------------------------------------------------------------

async function checkConditionChange(tx: Transaction, stamp: Stamp, to: Condition) {
  const from = stamp.condition;
  if (!canChangeCondition(from, to)) throw new AppError("conditionChange", { from, to }, { condition: ["errors.conditionChange"] });
  if (needsToBeIn(to) && (await openCheckoutOf(tx, stamp.id))) throw new AppError("stampCheckedOut");
  return { from, to };
}

async function recordConditionChange(tx: Transaction, actor: Actor, stampId: string, change: { from: Condition; to: Condition }, note: string | null) {
  await recordEvent(tx, stampId, actor, { kind: isRepair(change.from, change.to) ? "repaired" : "condition_changed", from: change.from, to: change.to, note });
  // Back in use (or gone for good): the damage reported so far is dealt with.
  if (change.to === "sound" || change.to === "worn" || change.to === "retired") {
    await tx.update(damageReports).set({ resolvedAt: new Date() }).where(and(eq(damageReports.stampId, stampId), isNull(damageReports.resolvedAt)));
  }
}

/** A keeper's step in the repair path: needs repair → in repair → sound, or retired. */
export async function changeCondition(actor: Actor, code: string, input: ConditionChangeInput) {
  assertCan(actor, "stamps:write");
  return db.transaction(async (tx) => {
    const stamp = await findStamp(tx, code, true);
    if (stamp.condition === input.condition) throw new AppError("conditionChange", { from: stamp.condition, to: input.condition }, { condition: ["errors.conditionChange"] });
    const change = await checkConditionChange(tx, stamp, input.condition);
    const [updated] = await tx.update(stamps).set({ condition: input.condition, ...bump }).where(eq(stamps.id, stamp.id)).returning();
    await recordConditionChange(tx, actor, stamp.id, change, input.note ?? null);
    return { code: updated.code, condition: updated.condition, version: updated.version };
  });
}

/** Anyone may report damage; the keepers hear of it by e-mail. */
export async function reportDamage(actor: Actor, code: string, input: DamageReportInput) {
  assertCan(actor, "stamps:request");
  const { stamp, report } = await db.transaction(async (tx) => {
    const stamp = await findStamp(tx, code);
    const [report] = await tx.insert(damageReports).values({ stampId: stamp.id, kind: input.kind, note: input.note ?? null, reportedBy: actor.id }).returning();
    await recordEvent(tx, stamp.id, actor, { kind: "damage_reported", to: input.kind, note: input.note ?? null });
    return { stamp, report };
  });
  await notifyKeepersOfDamage({ code: stamp.code, name: stamp.name, kind: input.kind, note: input.note ?? null, reporter: actor.name, at: report.reportedAt });
  return { id: report.id, kind: report.kind, reportedAt: report.reportedAt.toISOString() };
}

// --- check-out and return -----------------------------------------------------------------------

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
    const set: Partial<typeof stamps.$inferInsert> = {};
    if (input.impressions) set.impressionsCount = stamp.impressionsCount + input.impressions;
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

/** For the overview: how many stamps, how many out, overdue, waiting for repair, and with a coverage to check. */
export async function stampCounts(actor: Actor) {
  assertCan(actor, "data:read");
  const today = await workshopToday();
  const [[all], [out], [repair], [lowCoverage]] = await Promise.all([
    db.select({ n: count() }).from(stamps).where(ne(stamps.condition, "retired")),
    db
      .select({ n: count(), overdue: sql<number>`count(*) FILTER (WHERE ${checkouts.dueOn} < ${today})` })
      .from(checkouts)
      .where(isNull(checkouts.returnedAt)),
    db.select({ n: count() }).from(stamps).where(inArray(stamps.condition, ["needs_repair", "in_repair"])),
    db.select({ n: count() }).from(stamps).where(lt(stamps.coverageRatio, LOW_COVERAGE_RATIO)),
  ]);
  return { active: Number(all.n), out: Number(out.n), overdue: Number(out.overdue), repair: Number(repair.n), lowCoverage: Number(lowCoverage.n) };
}
