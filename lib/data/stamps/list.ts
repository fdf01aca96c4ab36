import "server-only";
import { and, asc, count, desc, eq, gte, ilike, inArray, isNull, lt, lte, ne, or, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { checkouts, locations, stamps, type Stamp } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { LOW_COVERAGE_RATIO } from "@/lib/stamps/coverage";
import type { StampListQuery } from "@/lib/validation/stamps";
import { workshopToday } from "../settings";
import type { StampListItem, StampPage } from "@/lib/contracts/stamps";

// The stamp table: filters, sort and pages (the list API, the export and the labels use the same query), and the shelf's counts.

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
