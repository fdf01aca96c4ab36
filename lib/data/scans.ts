import "server-only";
import { GetObjectCommand } from "@aws-sdk/client-s3";
import { and, desc, eq, inArray, ne, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { stampScans, stamps, type Stamp, type StampScan } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { checkFileName, compareWithRecord, decodeGreyRaster, defaultScanLimits, downloadFileName, encodeGreyRaster, LOOK_ALIKE_MAX_BITS, measureCoverage, MIRROR_TWIN_MARGIN_BITS, MM_PER_INCH, nearest, physicalSizeMm, processScan, renderCoverageOverlay, ScanRejected, scanLimiter, type GreyRaster, type PixelRect, type ScanLimits, type ScanType, type WaxPolarity } from "@/lib/scans";
import { deleteObjects, getObjectBytes, headObject, newObjectKey, objectStore, ObjectTooLarge, presignPut, putObject } from "@/lib/s3";
import { polarityForKind, type CompleteScanInput, type PresignScanInput, type SaveCoverageInput } from "@/lib/validation/scans";
import { isUniqueViolation, recordEvent } from "./stamps/events";
import { scanKeys, scanRow } from "./scan-rows";
import { scanUrls, type CoveragePreviewDto, type ScanDto, type ScanUpload, type SimilarStampDto } from "@/lib/contracts/scans";

// --- limits and errors ---------------------------------------------------------------------

/** The limits this app server applies (SCAN_MAX_BYTES / SCAN_MAX_PIXELS, else lib/scans' defaults). */
export function scanLimits(): Required<ScanLimits> {
  const e = env();
  return { ...defaultScanLimits, maxBytes: e.SCAN_MAX_BYTES ?? defaultScanLimits.maxBytes, maxPixels: e.SCAN_MAX_PIXELS ?? defaultScanLimits.maxPixels };
}

// --- DTOs ------------------------------------------------------------------------------------


function sizeCheckOf(row: Pick<StampScan, "widthPx" | "heightPx" | "dpi">, stamp: Pick<Stamp, "widthMm" | "heightMm">) {
  if (!row.dpi) return { sizeMm: null, sizeCheck: null };
  const sizeMm = physicalSizeMm(row.widthPx, row.heightPx, row.dpi);
  const { widthDeviationPct, heightDeviationPct, maxDeviationPct, warn, turned, tolerancePct } = compareWithRecord(sizeMm, stamp);
  return { sizeMm, sizeCheck: { widthDeviationPct, heightDeviationPct, maxDeviationPct, warn, turned, tolerancePct } };
}

function toDto(row: StampScan, stamp: Pick<Stamp, "code" | "widthMm" | "heightMm">): ScanDto {
  return {
    id: row.id,
    stampCode: stamp.code,
    kind: row.kind,
    fileName: row.fileName,
    contentType: row.contentType,
    widthPx: row.widthPx,
    heightPx: row.heightPx,
    dpi: row.dpi,
    dpiSource: row.dpiSource,
    sizeBytes: row.sizeBytes,
    sha256: row.sha256,
    polarity: row.polarity,
    threshold: row.threshold,
    otsuThreshold: row.otsuThreshold,
    coverageRatio: row.coverageRatio,
    ...sizeCheckOf(row, stamp),
    uploadedByName: row.uploadedByName,
    createdAt: row.createdAt.toISOString(),
    urls: {
      thumb: scanUrls.image(stamp.code, row.id, "thumb"),
      large: scanUrls.image(stamp.code, row.id, "large"),
      download: scanUrls.download(stamp.code, row.id),
      overlay: scanUrls.overlay(stamp.code, row.id),
    },
  };
}

async function findStamp(code: string): Promise<Stamp> {
  const [stamp] = await db.select().from(stamps).where(eq(stamps.code, code)).limit(1);
  if (!stamp) throw new AppError("notFound");
  return stamp;
}

async function findScan(code: string, id: string): Promise<{ stamp: Stamp; scan: StampScan }> {
  const stamp = await findStamp(code);
  const [scan] = await db
    .select()
    .from(stampScans)
    .where(and(eq(stampScans.id, id), eq(stampScans.stampId, stamp.id)))
    .limit(1);
  if (!scan) throw new AppError("notFound");
  return { stamp, scan };
}

const keysOf = (scan: Pick<StampScan, "objectKey" | "thumbKey" | "largeKey" | "rasterKey">) => [scan.objectKey, scan.thumbKey, scan.largeKey, scan.rasterKey];

/** Deletes objects without letting a store hiccup hide the error that got us here. */
async function deleteQuietly(keys: string[]) {
  try {
    await deleteObjects(keys);
  } catch (error) {
    console.error("could not delete scan objects", keys, error);
  }
}

// --- reading -----------------------------------------------------------------------------------

export async function listScans(actor: Actor, code: string): Promise<ScanDto[]> {
  assertCan(actor, "data:read");
  const stamp = await findStamp(code);
  const rows = await db.select().from(stampScans).where(eq(stampScans.stampId, stamp.id)).orderBy(desc(stampScans.createdAt), desc(stampScans.id));
  return rows.map((r) => toDto(r, stamp));
}

export async function getScan(actor: Actor, code: string, id: string): Promise<ScanDto> {
  assertCan(actor, "data:read");
  const { stamp, scan } = await findScan(code, id);
  return toDto(scan, stamp);
}

export interface ObjectStream {
  body: ReadableStream<Uint8Array>;
  sizeBytes: number | null;
  contentType: string;
  fileName: string;
}

async function streamObject(key: string): Promise<{ body: ReadableStream<Uint8Array>; sizeBytes: number | null } | null> {
  const store = objectStore();
  try {
    const response = await store.client.send(new GetObjectCommand({ Bucket: store.bucket, Key: key }));
    const body = response.Body as { transformToWebStream(): ReadableStream<Uint8Array> } | undefined;
    if (!body) return null;
    return { body: body.transformToWebStream(), sizeBytes: response.ContentLength ?? null };
  } catch (error) {
    const e = error as { name?: string; $metadata?: { httpStatusCode?: number } };
    if (e?.$metadata?.httpStatusCode === 404 || e?.name === "NoSuchKey") return null;
    throw error;
  }
}

/** A thumbnail (256 px) or the large view (1024 px), WebP. */
export async function scanImage(actor: Actor, code: string, id: string, size: "thumb" | "large"): Promise<ObjectStream> {
  assertCan(actor, "data:read");
  const { scan } = await findScan(code, id);
  const stream = await streamObject(size === "thumb" ? scan.thumbKey : scan.largeKey);
  if (!stream) throw new AppError("notFound");
  return { ...stream, contentType: "image/webp", fileName: `${scan.id}-${size}.webp` };
}

/** The stored original (metadata stripped), with a safe download name and the type of its content. */
export async function scanOriginal(actor: Actor, code: string, id: string): Promise<ObjectStream> {
  assertCan(actor, "data:read");
  const { stamp, scan } = await findScan(code, id);
  const stream = await streamObject(scan.objectKey);
  if (!stream) throw new AppError("notFound");
  const type = typeOfContent(scan.contentType);
  return { ...stream, contentType: scan.contentType, fileName: downloadFileName(scan.fileName, type, `${stamp.code}-${scan.kind}`) };
}

function typeOfContent(contentType: string): ScanType {
  const types: Record<string, ScanType> = { "image/png": "png", "image/jpeg": "jpeg", "image/tiff": "tiff", "image/webp": "webp" };
  return types[contentType] ?? "png";
}

// --- upload -------------------------------------------------------------------------------------

const uploadPrefix = (stampId: string, actorId: string) => `uploads/${stampId}/${actorId}`;

/**
 * Step 1 of an upload: a presigned PUT for the claimed size. The name and size are checked now so the keeper
 * hears at once; both are checked again on the stored object, since a client can claim anything.
 */
export async function presignScanUpload(actor: Actor, code: string, input: PresignScanInput): Promise<{ upload: ScanUpload; maxBytes: number }> {
  assertCan(actor, "stamps:write");
  const stamp = await findStamp(code);
  const limits = scanLimits();
  checkFileName(input.fileName);
  if (input.sizeBytes === 0) throw new ScanRejected("empty");
  if (input.sizeBytes > limits.maxBytes) throw new ScanRejected("tooLarge", { sizeBytes: input.sizeBytes, maxBytes: limits.maxBytes });
  const key = newObjectKey(uploadPrefix(stamp.id, actor.id));
  // Signed with a fixed type: the file's real type is decided from its bytes, never from what the browser says.
  const put = await presignPut(key, input.sizeBytes, "application/octet-stream", 15 * 60);
  return { upload: { key, url: put.url, method: put.method, headers: put.headers, expiresAt: put.expiresAt.toISOString() }, maxBytes: limits.maxBytes };
}

/**
 * The stamp's footprint in analysis pixels: the recorded size centred on the scan when the scan is larger
 * than the stamp (a print with cloth around it), else the whole scan. Needs the DPI; without it, the whole scan.
 */
export function footprintRect(raster: Pick<GreyRaster, "widthPx" | "heightPx">, mmPerPx: number | null, stamp: Pick<Stamp, "widthMm" | "heightMm">, turned = false): PixelRect | undefined {
  if (!mmPerPx) return undefined;
  const [wMm, hMm] = turned ? [stamp.heightMm, stamp.widthMm] : [stamp.widthMm, stamp.heightMm];
  const widthPx = Math.min(raster.widthPx, Math.round(wMm / mmPerPx));
  const heightPx = Math.min(raster.heightPx, Math.round(hMm / mmPerPx));
  if (widthPx >= raster.widthPx && heightPx >= raster.heightPx) return undefined;
  return { leftPx: Math.floor((raster.widthPx - widthPx) / 2), topPx: Math.floor((raster.heightPx - heightPx) / 2), widthPx, heightPx };
}

function analysisMmPerPx(scan: Pick<StampScan, "widthPx" | "dpi">, raster: Pick<GreyRaster, "widthPx">) {
  return scan.dpi ? (scan.widthPx / raster.widthPx) * (MM_PER_INCH / scan.dpi) : null;
}

/**
 * Step 2: checks the uploaded object (size from the store, type by magic bytes, pixel limit, decoding),
 * measures it, stores the stripped original, thumbnails and grey raster under fresh keys, and records the
 * scan and a "scanned" history entry in one transaction. The upload object is deleted in every outcome.
 */
export async function completeScanUpload(actor: Actor, code: string, input: CompleteScanInput): Promise<ScanDto> {
  assertCan(actor, "stamps:write");
  const stamp = await findStamp(code);
  const limits = scanLimits();
  if (!input.uploadKey.startsWith(`${uploadPrefix(stamp.id, actor.id)}/`)) throw new AppError("scanUploadMissing");
  const uploadKey = input.uploadKey;
  let storedKeys: string[] = [];
  try {
    const head = await headObject(uploadKey);
    if (!head) throw new AppError("scanUploadMissing");
    // The store does not enforce the signed length everywhere (the local fake does not): check what arrived.
    if (head.sizeBytes > limits.maxBytes) throw new ScanRejected("tooLarge", { sizeBytes: head.sizeBytes, maxBytes: limits.maxBytes });
    let bytes: Buffer | null;
    try {
      bytes = await getObjectBytes(uploadKey, { maxBytes: limits.maxBytes });
    } catch (error) {
      if (error instanceof ObjectTooLarge) throw new ScanRejected("tooLarge", { maxBytes: limits.maxBytes });
      throw error;
    }
    if (!bytes) throw new AppError("scanUploadMissing");
    const data = bytes;
    const polarity = polarityForKind[input.kind];
    const processed = await scanLimiter.run(() =>
      processScan(data, { ...limits, fileName: input.fileName, polarity, ...(input.dpi ? { dpiOverride: input.dpi } : {}) }),
    );

    const [existing] = await db
      .select({ id: stampScans.id, fileName: stampScans.fileName, createdAt: stampScans.createdAt })
      .from(stampScans)
      .where(and(eq(stampScans.stampId, stamp.id), eq(stampScans.sha256, processed.sha256)))
      .limit(1);
    if (existing) throw duplicateOf(existing);

    // Coverage inside the stamp's footprint when the DPI tells where it is.
    const turned = processed.sizeMm ? compareWithRecord(processed.sizeMm, stamp).turned : false;
    const footprint = footprintRect(processed.analysis, processed.analysis.mmPerPx, stamp, turned);
    const coverage = footprint ? measureCoverage(processed.analysis, { polarity, footprint }) : processed.coverage;

    const root = newObjectKey(`scans/${stamp.id}`);
    const [thumb, large] = [256, 1024].map((side) => processed.thumbnails.find((t) => t.longSidePx === side) ?? processed.thumbnails[processed.thumbnails.length - 1]);
    const keys = scanKeys(root);
    storedKeys = Object.values(keys);
    await Promise.all([
      putObject(keys.objectKey, processed.original.bytes, { contentType: processed.original.contentType }),
      putObject(keys.thumbKey, thumb.bytes, { contentType: "image/webp" }),
      putObject(keys.largeKey, large.bytes, { contentType: "image/webp" }),
      putObject(keys.rasterKey, await encodeGreyRaster(processed.analysis), { contentType: "image/png" }),
    ]);

    let row: StampScan;
    try {
      row = await db.transaction(async (tx) => {
        const [inserted] = await tx
          .insert(stampScans)
          .values(scanRow({ stampId: stamp.id, kind: input.kind, fileName: input.fileName, processed, keys, polarity, coverage, uploader: actor }))
          .returning();
        await recordEvent(tx, stamp.id, actor, {
          kind: "scanned",
          to: input.kind,
          note: input.fileName,
          details: { scanId: inserted.id, kind: input.kind, fileName: input.fileName, dpi: processed.dpi, coverageRatio: coverage.ratio },
        });
        return inserted;
      });
    } catch (error) {
      if (isUniqueViolation(error, "stamp_scans_stamp_sha256_key")) {
        const [other] = await db
          .select({ id: stampScans.id, fileName: stampScans.fileName, createdAt: stampScans.createdAt })
          .from(stampScans)
          .where(and(eq(stampScans.stampId, stamp.id), eq(stampScans.sha256, processed.sha256)))
          .limit(1);
        throw duplicateOf(other ?? { id: "", fileName: input.fileName, createdAt: new Date() });
      }
      throw error;
    }
    storedKeys = [];
    return toDto(row, stamp);
  } finally {
    // The upload key never survives: kept scans live under their own keys, refused ones are gone.
    await deleteQuietly([uploadKey, ...storedKeys]);
  }
}

function duplicateOf(existing: { id: string; fileName: string; createdAt: Date }) {
  return new AppError("scanDuplicate", { fileName: existing.fileName }, undefined, { existing: { id: existing.id, fileName: existing.fileName, createdAt: existing.createdAt.toISOString() } });
}

export async function deleteScan(actor: Actor, code: string, id: string): Promise<void> {
  assertCan(actor, "stamps:write");
  const { scan } = await findScan(code, id);
  await db.delete(stampScans).where(eq(stampScans.id, scan.id));
  // After the row: a failed delete leaves orphaned bytes, never a row pointing at nothing.
  await deleteObjects(keysOf(scan));
}

// --- coverage review -------------------------------------------------------------------------------

async function loadRaster(scan: StampScan): Promise<GreyRaster> {
  const bytes = await getObjectBytes(scan.rasterKey, { maxBytes: 32 * 1024 * 1024 });
  if (!bytes) throw new AppError("notFound");
  return decodeGreyRaster(bytes, { maxPixels: 16_000_000, maxSidePx: 4096 });
}

async function reviewContext(code: string, id: string) {
  const { stamp, scan } = await findScan(code, id);
  const raster = await loadRaster(scan);
  const mmPerPx = analysisMmPerPx(scan, raster);
  const turned = scan.dpi ? compareWithRecord(physicalSizeMm(scan.widthPx, scan.heightPx, scan.dpi), stamp).turned : false;
  return { stamp, scan, raster, footprint: footprintRect(raster, mmPerPx, stamp, turned) };
}

/** Coverage for a polarity and threshold (Otsu's when none), without saving anything. */
export async function previewCoverage(actor: Actor, code: string, id: string, input: { polarity: WaxPolarity; threshold?: number }): Promise<CoveragePreviewDto> {
  assertCan(actor, "data:read");
  const { raster, footprint } = await reviewContext(code, id);
  const result = measureCoverage(raster, { polarity: input.polarity, threshold: input.threshold, footprint });
  return {
    polarity: result.polarity,
    threshold: result.threshold,
    otsuThreshold: result.otsuThreshold,
    ratio: result.ratio,
    footprint: footprint
      ? { left: footprint.leftPx / raster.widthPx, top: footprint.topPx / raster.heightPx, width: footprint.widthPx / raster.widthPx, height: footprint.heightPx / raster.heightPx }
      : null,
  };
}

/** The review picture: counted wax tinted, outside the footprint darkened (WebP, long side ≤ 1024 px). */
export async function coverageOverlay(actor: Actor, code: string, id: string, input: { polarity: WaxPolarity; threshold?: number }): Promise<Buffer> {
  assertCan(actor, "data:read");
  const { raster, footprint } = await reviewContext(code, id);
  const threshold = input.threshold ?? measureCoverage(raster, { polarity: input.polarity, footprint }).threshold;
  return renderCoverageOverlay(raster, { polarity: input.polarity, threshold, footprint, maxSidePx: 1024 });
}

/**
 * Measures again with the keeper's polarity and threshold and saves the ratio to the scan and to the stamp
 * (whose version goes up, so an edit form opened before sees the change), with an "edited" history entry.
 */
export async function saveCoverage(actor: Actor, code: string, id: string, input: SaveCoverageInput): Promise<{ scan: ScanDto; coverageRatio: number; version: number }> {
  assertCan(actor, "stamps:write");
  const { scan, raster, footprint } = await reviewContext(code, id);
  const result = measureCoverage(raster, { polarity: input.polarity, threshold: input.threshold, footprint });
  const ratio = Math.round(result.ratio * 10_000) / 10_000;
  return db.transaction(async (tx) => {
    const [current] = await tx.select().from(stamps).where(eq(stamps.id, scan.stampId)).for("update");
    if (!current) throw new AppError("notFound");
    const [updatedScan] = await tx
      .update(stampScans)
      .set({ polarity: input.polarity, threshold: result.threshold, coverageRatio: result.ratio })
      .where(eq(stampScans.id, scan.id))
      .returning();
    if (!updatedScan) throw new AppError("notFound");
    const [updated] = await tx
      .update(stamps)
      .set({ coverageRatio: ratio, version: sql`${stamps.version} + 1`, updatedAt: sql`now()` })
      .where(eq(stamps.id, current.id))
      .returning({ version: stamps.version });
    await recordEvent(tx, current.id, actor, {
      kind: "edited",
      note: updatedScan.fileName,
      details: {
        changes: [{ field: "coverageRatio", from: current.coverageRatio, to: ratio }],
        scanId: scan.id,
        polarity: input.polarity,
        threshold: result.threshold,
      },
    });
    return { scan: toDto(updatedScan, current), coverageRatio: ratio, version: updated.version };
  });
}

// --- similar motifs ----------------------------------------------------------------------------------

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

/** Every object key the scans of a stamp use; for cleaning up after a stamp is deleted. */
export async function scanObjectKeys(stampId: string, tx: Transaction | typeof db = db): Promise<string[]> {
  const rows = await tx.select().from(stampScans).where(eq(stampScans.stampId, stampId));
  return rows.flatMap(keysOf);
}
