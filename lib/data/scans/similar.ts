import "server-only";
import { count, inArray, max } from "drizzle-orm";
import { db } from "@/db";
import { stampScans, stamps } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import {
  bestPerKey,
  CLOSE_DISTANCE,
  decodeGreyRaster,
  decodeSignature,
  findSimilar,
  ScanRejected,
  scanLimiter,
  queryOfSignature,
  similarQuery,
  sniffContent,
  type PictureKind,
  type SimilarQuery,
  type StoredSignature,
} from "@/lib/scans";
import { scanUrls, type SimilarMatchDto } from "@/lib/contracts/scans";
import { scanLimits } from "./shared";

// Search by picture: a picture against the stored signature of every scan on the shelf. The signatures are
// kept in memory and read again only when scans were added or removed since.

interface ScanRef {
  scanId: string;
  stampId: string;
}

let cache: { key: string; stored: StoredSignature<ScanRef>[] } | null = null;

async function storedSignatures(): Promise<StoredSignature<ScanRef>[]> {
  const [state] = await db.select({ n: count(), latest: max(stampScans.createdAt) }).from(stampScans);
  const key = `${state?.n ?? 0}|${state?.latest?.toISOString() ?? ""}`;
  if (cache?.key === key) return cache.stored;
  const rows = await db.select({ id: stampScans.id, stampId: stampScans.stampId, kind: stampScans.kind, signature: stampScans.signature }).from(stampScans);
  const stored = rows.flatMap((r) => {
    const signature = r.signature ? decodeSignature(r.signature) : null;
    return signature ? [{ ref: { scanId: r.id, stampId: r.stampId }, kind: r.kind, signature }] : [];
  });
  cache = { key, stored };
  return stored;
}

async function answer(query: SimilarQuery, options: { limit: number; exceptStampId?: string }): Promise<SimilarMatchDto[]> {
  const stored = (await storedSignatures()).filter((s) => s.ref.stampId !== options.exceptStampId);
  const matches = bestPerKey(findSimilar(query, stored, { limit: options.limit * 4 }), (r) => r.stampId).slice(0, options.limit);
  if (matches.length === 0) return [];
  const rows = await db
    .select({ id: stamps.id, code: stamps.code, name: stamps.name, motifId: stamps.motifId })
    .from(stamps)
    .where(inArray(stamps.id, matches.map((m) => m.ref.stampId)));
  const byId = new Map(rows.map((r) => [r.id, r]));
  return matches.flatMap((m) => {
    const s = byId.get(m.ref.stampId);
    if (!s) return [];
    const distance = Math.round(m.distance * 1000) / 1000;
    return [{ stampCode: s.code, stampName: s.name, motifId: s.motifId, scanId: m.ref.scanId, distance, mirrored: m.mirrored, close: distance <= CLOSE_DISTANCE, urls: { thumb: scanUrls.image(s.code, m.ref.scanId, "thumb") } }];
  });
}

/**
 * Stamps whose scans look like the picture, best first (one answer per stamp, its nearest scan). PNG, JPEG or
 * WebP under the scan limits; `kind` says whether it shows a print or a face (else the picture's polarity does).
 */
export async function similarToPicture(actor: Actor, bytes: Buffer, options: { kind?: PictureKind; limit?: number } = {}): Promise<SimilarMatchDto[]> {
  assertCan(actor, "data:read");
  const limits = scanLimits();
  if (bytes.length === 0) throw new ScanRejected("empty");
  if (bytes.length > limits.maxBytes) throw new ScanRejected("tooLarge", { sizeBytes: bytes.length, maxBytes: limits.maxBytes });
  const sniffed = sniffContent(bytes);
  if (sniffed.kind === "scan" && sniffed.type === "tiff") throw new ScanRejected("unsupportedType", { type: "tiff" });
  const raster = await scanLimiter.run(() => decodeGreyRaster(bytes, { maxPixels: limits.maxPixels, maxSidePx: 1024 }));
  return answer(similarQuery(raster, options.kind), { limit: options.limit ?? 10 });
}

/** Other stamps that look like this one's scans: each of its scans as the query, the best answer per stamp. */
export async function similarToStamp(actor: Actor, stampId: string, limit = 8): Promise<SimilarMatchDto[]> {
  assertCan(actor, "data:read");
  const own = (await storedSignatures()).filter((s) => s.ref.stampId === stampId);
  const all: SimilarMatchDto[] = [];
  for (const s of own) all.push(...(await answer(queryOfSignature(s.signature, s.kind), { limit, exceptStampId: stampId })));
  all.sort((a, b) => a.distance - b.distance);
  const seen = new Set<string>();
  return all.filter((m) => !seen.has(m.stampCode) && seen.add(m.stampCode)).slice(0, limit);
}
