import "server-only";
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { stampScans, type StampScan } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { checkFileName, compareWithRecord, encodeGreyRaster, measureCoverage, processScan, ScanRejected, scanLimiter, footprintRect } from "@/lib/scans";
import { deleteObjects, getObjectBytes, headObject, newObjectKey, ObjectTooLarge, presignPut, putObject } from "@/lib/s3";
import { polarityForKind, type CompleteScanInput, type PresignScanInput } from "@/lib/validation/scans";
import { isUniqueViolation, recordEvent } from "../stamps/events";
import { scanKeys, scanRow } from "./rows";
import { type ScanDto, type ScanUpload } from "@/lib/contracts/scans";
import { deleteQuietly, findScan, findStamp, keysOf, scanLimits, toDto, uploadPrefix } from "./shared";
import { audit } from "@/lib/log";

// Uploading scans: a presigned PUT, then checking, measuring and keeping the file; deleting a scan.

function duplicateOf(existing: { id: string; fileName: string; createdAt: Date }) {
  return new AppError("scanDuplicate", { fileName: existing.fileName }, undefined, { existing: { id: existing.id, fileName: existing.fileName, createdAt: existing.createdAt.toISOString() } });
}



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


export async function deleteScan(actor: Actor, code: string, id: string): Promise<void> {
  assertCan(actor, "stamps:write");
  const { scan } = await findScan(code, id);
  await db.delete(stampScans).where(eq(stampScans.id, scan.id));
  // After the row: a failed delete leaves orphaned bytes, never a row pointing at nothing.
  await deleteObjects(keysOf(scan));
  audit("record.deleted", actor, { kind: "scan", id, code });
}
