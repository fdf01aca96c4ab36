import "server-only";
import { eq, sql } from "drizzle-orm";
import { db } from "@/db";
import { stampScans, stamps, type StampScan } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { compareWithRecord, decodeGreyRaster, measureCoverage, physicalSizeMm, renderCoverageOverlay, footprintRect, analysisMmPerPx, type GreyRaster, type WaxPolarity } from "@/lib/scans";
import { getObjectBytes } from "@/lib/s3";
import { type SaveCoverageInput } from "@/lib/validation/scans";
import { recordEvent } from "../stamps/events";
import { type CoveragePreviewDto, type ScanDto } from "@/lib/contracts/scans";
import { findScan, toDto } from "./shared";

// Reviewing a scan's coverage: measure at a polarity and threshold, show what counts as wax, save it to the stamp.

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
