import "server-only";
import { and, asc, count, desc, eq, exists, ilike, or, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { planStamps, plans, stamps } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import type { PlanListItem, PlanPage } from "@/lib/contracts/plans";
import { pathNameOf, type Arrangement } from "@/lib/layout";
import type { PlanListQuery } from "@/lib/validation/plans";
import { stampThumbs } from "./stamps";

// The plan table: search, filters, sort and pages.

const escapeLike = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

/** Plans that use a library stamp whose code matches `pattern` (field or border). */
const usesStamp = (pattern: SQL | string, exact: boolean) =>
  exists(
    db
      .select({ one: sql`1` })
      .from(planStamps)
      .innerJoin(stamps, eq(stamps.id, planStamps.stampId))
      .where(and(eq(planStamps.planId, plans.id), exact ? eq(stamps.code, pattern as string) : or(ilike(stamps.code, pattern as string), ilike(stamps.name, pattern as string)))),
  );

function planFilter(query: PlanListQuery): SQL | undefined {
  const where: (SQL | undefined)[] = [];
  for (const word of (query.q ?? "").split(/\s+/).filter(Boolean).slice(0, 8)) {
    const pattern = `%${escapeLike(word)}%`;
    where.push(or(ilike(plans.name, pattern), ilike(plans.notes, pattern), usesStamp(pattern, false)));
  }
  if (query.stamp) where.push(usesStamp(query.stamp, true));
  if (query.arrangement) where.push(eq(plans.arrangement, query.arrangement));
  return and(...where);
}

function orderFor(sort: string): SQL[] {
  const descending = sort.startsWith("-");
  const key = descending ? sort.slice(1) : sort;
  const dir = (column: SQL) => (descending ? desc(column) : asc(column));
  const order: Record<string, SQL> = {
    name: sql`lower(${plans.name})`,
    updated: sql`${plans.updatedAt}`,
    impressions: sql`${plans.impressionsPerMetre}`,
    waxed: sql`${plans.waxedAreaPerMetreM2}`,
    cloth: sql`${plans.clothWidthMm}`,
    arrangement: sql`${plans.arrangement}`,
  };
  return [dir(order[key] ?? order.updated), asc(plans.id)];
}

export async function listPlans(actor: Actor, query: PlanListQuery): Promise<PlanPage> {
  assertCan(actor, "data:read");
  const where = planFilter(query);
  const [rows, [{ n }]] = await Promise.all([
    db
      .select({
        id: plans.id,
        name: plans.name,
        clothWidthMm: plans.clothWidthMm,
        arrangement: plans.arrangement,
        sides: plans.sides,
        borders: sql<number>`jsonb_array_length(${plans.borders})`,
        impressionsPerMetre: plans.impressionsPerMetre,
        waxedAreaPerMetreM2: plans.waxedAreaPerMetreM2,
        createdByName: plans.createdByName,
        updatedAt: plans.updatedAt,
        version: plans.version,
        stampId: stamps.id,
        stampCode: stamps.code,
        stampName: stamps.name,
      })
      .from(plans)
      .leftJoin(stamps, eq(stamps.id, plans.stampId))
      .where(where)
      .orderBy(...orderFor(query.sort))
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize),
    db.select({ n: count() }).from(plans).where(where),
  ]);
  const thumbs = await stampThumbs(rows.flatMap((r) => (r.stampId ? [{ id: r.stampId, code: r.stampCode! }] : [])));
  const items: PlanListItem[] = rows.map((r) => ({
    id: r.id,
    name: r.name,
    stamp: r.stampId ? { code: r.stampCode!, name: r.stampName!, thumbUrl: thumbs.get(r.stampId) ?? null } : null,
    clothWidthMm: r.clothWidthMm,
    arrangement: r.arrangement as Arrangement,
    pathName: pathNameOf(r.arrangement as Arrangement),
    sides: r.sides === 2 ? 2 : 1,
    borders: Number(r.borders),
    impressionsPerMetre: r.impressionsPerMetre,
    waxedAreaPerMetreM2: r.waxedAreaPerMetreM2,
    createdByName: r.createdByName,
    updatedAt: r.updatedAt.toISOString(),
    version: r.version,
  }));
  return { plans: items, total: Number(n), page: query.page, pageSize: query.pageSize };
}

/** For the overview: how many plans there are. */
export async function planCount(actor: Actor): Promise<number> {
  assertCan(actor, "data:read");
  const [{ n }] = await db.select({ n: count() }).from(plans);
  return Number(n);
}
