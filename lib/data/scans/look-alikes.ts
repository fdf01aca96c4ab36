import "server-only";
import { eq, inArray, ne } from "drizzle-orm";
import { db } from "@/db";
import { stampScans, stamps } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { LOOK_ALIKE_MAX_BITS, MIRROR_TWIN_MARGIN_BITS, nearest } from "@/lib/scans";
import { scanUrls, type SimilarStampDto } from "@/lib/contracts/scans";
import { findStamp } from "./shared";

// Stamps whose scans look like this stamp's, mirror twins included.

/**
 * Stamps whose scans look like this stamp's, nearest first: for every pair of scans the better of the
 * straight and the mirrored comparison (a back-face twin is a mirror image), the best pair per stamp. Only
 * matches clearly closer than chance (LOOK_ALIKE_MAX_BITS); a mirror twin only when the mirrored comparison
 * is clearly the closer one (MIRROR_TWIN_MARGIN_BITS).
 */
export async function similarStamps(actor: Actor, code: string, limit = 8): Promise<SimilarStampDto[]> {
  assertCan(actor, "data:read");
  const stamp = await findStamp(code);
  const own = await db.select({ phash: stampScans.phash, phashMirrored: stampScans.phashMirrored }).from(stampScans).where(eq(stampScans.stampId, stamp.id));
  if (own.length === 0) return [];
  const others = await db
    .select({ id: stampScans.id, stampId: stampScans.stampId, phash: stampScans.phash })
    .from(stampScans)
    .where(ne(stampScans.stampId, stamp.id));
  const candidates = others.map((o) => ({ id: o, hash: o.phash }));
  const best = new Map<string, { scanId: string; distance: number; orientation: "same" | "mirrored" }>();
  for (const target of own) {
    for (const match of nearest({ hash: target.phash, mirroredHash: target.phashMirrored }, candidates, candidates.length, { maxDistance: LOOK_ALIKE_MAX_BITS, mirrorMarginBits: MIRROR_TWIN_MARGIN_BITS })) {
      const current = best.get(match.id.stampId);
      if (!current || match.distance < current.distance) best.set(match.id.stampId, { scanId: match.id.id, distance: match.distance, orientation: match.orientation });
    }
  }
  const ranked = [...best.entries()].sort((a, b) => a[1].distance - b[1].distance).slice(0, limit);
  if (ranked.length === 0) return [];
  const rows = await db
    .select({ id: stamps.id, code: stamps.code, name: stamps.name })
    .from(stamps)
    .where(inArray(stamps.id, ranked.map(([stampId]) => stampId)));
  const byId = new Map(rows.map((r) => [r.id, r]));
  return ranked.flatMap(([stampId, m]) => {
    const s = byId.get(stampId);
    return s ? [{ code: s.code, name: s.name, scanId: m.scanId, distance: m.distance, orientation: m.orientation, urls: { thumb: scanUrls.image(s.code, m.scanId, "thumb") } }] : [];
  });
}
