import "server-only";
import { and, eq } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { stampScans, stamps, type Stamp, type StampScan } from "@/db/schema";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { compareWithRecord, defaultScanLimits, physicalSizeMm, type ScanLimits } from "@/lib/scans";
import { deleteObjects } from "@/lib/s3";
import { scanUrls, type ScanDto } from "@/lib/contracts/scans";

// What the scan modules share: this server's limits, the row → DTO map, lookups and object clean-up.

/** The limits this app server applies (SCAN_MAX_BYTES / SCAN_MAX_PIXELS, else lib/scans' defaults). */
export function scanLimits(): Required<ScanLimits> {
  const e = env();
  return { ...defaultScanLimits, maxBytes: e.SCAN_MAX_BYTES ?? defaultScanLimits.maxBytes, maxPixels: e.SCAN_MAX_PIXELS ?? defaultScanLimits.maxPixels };
}



export function sizeCheckOf(row: Pick<StampScan, "widthPx" | "heightPx" | "dpi">, stamp: Pick<Stamp, "widthMm" | "heightMm">) {
  if (!row.dpi) return { sizeMm: null, sizeCheck: null };
  const sizeMm = physicalSizeMm(row.widthPx, row.heightPx, row.dpi);
  const { widthDeviationPct, heightDeviationPct, maxDeviationPct, warn, turned, tolerancePct } = compareWithRecord(sizeMm, stamp);
  return { sizeMm, sizeCheck: { widthDeviationPct, heightDeviationPct, maxDeviationPct, warn, turned, tolerancePct } };
}

export function toDto(row: StampScan, stamp: Pick<Stamp, "code" | "widthMm" | "heightMm">): ScanDto {
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

export async function findStamp(code: string): Promise<Stamp> {
  const [stamp] = await db.select().from(stamps).where(eq(stamps.code, code)).limit(1);
  if (!stamp) throw new AppError("notFound");
  return stamp;
}

export async function findScan(code: string, id: string): Promise<{ stamp: Stamp; scan: StampScan }> {
  const stamp = await findStamp(code);
  const [scan] = await db
    .select()
    .from(stampScans)
    .where(and(eq(stampScans.id, id), eq(stampScans.stampId, stamp.id)))
    .limit(1);
  if (!scan) throw new AppError("notFound");
  return { stamp, scan };
}

export const keysOf = (scan: Pick<StampScan, "objectKey" | "thumbKey" | "largeKey" | "rasterKey">) => [scan.objectKey, scan.thumbKey, scan.largeKey, scan.rasterKey];

/** Deletes objects without letting a store hiccup hide the error that got us here. */
export async function deleteQuietly(keys: string[]) {
  try {
    await deleteObjects(keys);
  } catch (error) {
    console.error("could not delete scan objects", keys, error);
  }
}


/** Every object key the scans of a stamp use; for cleaning up after a stamp is deleted. */
export async function scanObjectKeys(stampId: string, tx: Transaction | typeof db = db): Promise<string[]> {
  const rows = await tx.select().from(stampScans).where(eq(stampScans.stampId, stampId));
  return rows.flatMap(keysOf);
}

export const uploadPrefix = (stampId: string, actorId: string) => `uploads/${stampId}/${actorId}`;
