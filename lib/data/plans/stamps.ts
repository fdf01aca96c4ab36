import "server-only";
import { and, asc, eq, ilike, inArray, isNull, or, sql } from "drizzle-orm";
import { db } from "@/db";
import { checkouts, locations, stampScans, stamps } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { scanUrls } from "@/lib/contracts/scans";
import type { PlannerStamp, StampChoice, StampPicture } from "@/lib/contracts/plans";
import { engineStampOf } from "@/lib/plans";
import { toLocationRef } from "../stamps/shared";

// The stamp library as the planner sees it: a search with thumbnails, one stamp with its geometry and picture,
// and each stamp's picture for drawing impressions (its newest wax-print scan).

interface ScanPick {
  stampId: string;
  id: string;
  kind: "face" | "print";
  widthPx: number;
  heightPx: number;
  dpi: number | null;
}

/** The newest scan of each stamp: a wax print first (what the cloth will show), else a face photo. */
async function newestScans(stampIds: string[], printOnly = false): Promise<Map<string, ScanPick>> {
  if (stampIds.length === 0) return new Map();
  const rows = await db
    .selectDistinctOn([stampScans.stampId], { stampId: stampScans.stampId, id: stampScans.id, kind: stampScans.kind, widthPx: stampScans.widthPx, heightPx: stampScans.heightPx, dpi: stampScans.dpi })
    .from(stampScans)
    .where(and(inArray(stampScans.stampId, stampIds), printOnly ? eq(stampScans.kind, "print") : undefined))
    .orderBy(stampScans.stampId, sql`(${stampScans.kind} = 'print') DESC`, sql`${stampScans.createdAt} DESC`);
  return new Map(rows.map((r) => [r.stampId, r]));
}

/** A print scan as a picture: its physical size from its DPI (centred on the footprint), else the footprint's. */
function pictureOf(code: string, scan: ScanPick | undefined, widthMm: number, heightMm: number): StampPicture | null {
  if (!scan || scan.kind !== "print") return null;
  const href = scanUrls.image(code, scan.id, "thumb");
  if (!scan.dpi) return { href, widthMm, heightMm };
  return { href, widthMm: (scan.widthPx / scan.dpi) * 25.4, heightMm: (scan.heightPx / scan.dpi) * 25.4 };
}

/** Pictures of these stamps by id (only wax prints count: a photo of the copper face is the motif mirrored and light on dark). */
export async function stampPictures(list: { id: string; code: string; widthMm: number; heightMm: number }[]): Promise<Map<string, StampPicture | null>> {
  const scans = await newestScans(
    list.map((s) => s.id),
    true,
  );
  return new Map(list.map((s) => [s.id, pictureOf(s.code, scans.get(s.id), s.widthMm, s.heightMm)]));
}

/** Thumbnails (any scan kind) for table rows and search results, by stamp id. */
export async function stampThumbs(list: { id: string; code: string }[]): Promise<Map<string, string | null>> {
  const scans = await newestScans(list.map((s) => s.id));
  return new Map(list.map((s) => [s.id, scans.has(s.id) ? scanUrls.image(s.code, scans.get(s.id)!.id, "thumb") : null]));
}

const escapeLike = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

const choiceColumns = {
  id: stamps.id,
  code: stamps.code,
  name: stamps.name,
  widthMm: stamps.widthMm,
  heightMm: stamps.heightMm,
  condition: stamps.condition,
  face: stamps.face,
  coverageRatio: stamps.coverageRatio,
  outlinePath: stamps.outlinePath,
  twinId: stamps.twinId,
  checkoutId: checkouts.id,
  locationId: locations.id,
  locationSite: locations.site,
  locationCode: locations.code,
};

function choiceBase() {
  return db
    .select(choiceColumns)
    .from(stamps)
    .leftJoin(locations, eq(locations.id, stamps.locationId))
    .leftJoin(checkouts, and(eq(checkouts.stampId, stamps.id), isNull(checkouts.returnedAt)));
}

type ChoiceRow = Awaited<ReturnType<typeof choiceBase>>[number];

const toChoice = (r: ChoiceRow, thumbUrl: string | null): StampChoice => ({
  code: r.code,
  name: r.name,
  widthMm: r.widthMm,
  heightMm: r.heightMm,
  condition: r.condition,
  face: r.face,
  out: r.checkoutId !== null,
  coverageRatio: r.coverageRatio,
  hasOutline: !!r.outlinePath,
  thumbUrl,
});

/** Stamps whose code or name holds every word of `q` (at most `limit`), retired ones last, for the planner's search. */
export async function searchPlanStamps(actor: Actor, q: string, limit = 8): Promise<StampChoice[]> {
  assertCan(actor, "data:read");
  const words = q.split(/\s+/).filter(Boolean).slice(0, 6);
  const rows = await choiceBase()
    .where(and(...words.map((w) => or(ilike(stamps.code, `%${escapeLike(w)}%`), ilike(stamps.name, `%${escapeLike(w)}%`)))))
    .orderBy(sql`(${stamps.condition} = 'retired')`, asc(stamps.code))
    .limit(limit);
  const thumbs = await stampThumbs(rows);
  return rows.map((r) => toChoice(r, thumbs.get(r.id) ?? null));
}

/** One library stamp with its engine geometry, picture, location and twin (404 when the code is unknown). */
export async function getPlannerStamp(actor: Actor, code: string): Promise<PlannerStamp> {
  assertCan(actor, "data:read");
  const [row] = await choiceBase().where(eq(stamps.code, code)).limit(1);
  if (!row) throw new AppError("notFound");
  const [thumbs, pictures, twin] = await Promise.all([
    stampThumbs([row]),
    stampPictures([row]),
    row.twinId ? db.select({ code: stamps.code, name: stamps.name }).from(stamps).where(eq(stamps.id, row.twinId)).then((r) => r[0] ?? null) : null,
  ]);
  return {
    ...toChoice(row, thumbs.get(row.id) ?? null),
    geometry: engineStampOf(row),
    picture: pictures.get(row.id) ?? null,
    location: toLocationRef(row.locationId ? { id: row.locationId, site: row.locationSite!, code: row.locationCode! } : null),
    twin,
  };
}
