import type { NewStampScan } from "@/db/schema";
import type { ProcessedScan } from "@/lib/scans";
import { encodeSignature } from "@/lib/scans/similar";

/** The object keys one stored scan occupies. */
export interface ScanKeys {
  objectKey: string;
  thumbKey: string;
  largeKey: string;
  rasterKey: string;
}

/** Where a scan's files live under its random root key. */
export const scanKeys = (root: string): ScanKeys => ({
  objectKey: `${root}/original`,
  thumbKey: `${root}/thumb`,
  largeKey: `${root}/large`,
  rasterKey: `${root}/raster`,
});

/**
 * The `stamp_scans` row for a processed scan: shared by uploads and the demo seed so both store the
 * same measurements. `coverage` is the one the keeper saw (Otsu's unless they moved the threshold).
 */
export function scanRow(p: {
  stampId: string;
  kind: NewStampScan["kind"];
  fileName: string;
  processed: ProcessedScan;
  keys: ScanKeys;
  polarity: NewStampScan["polarity"];
  coverage: { threshold: number; otsuThreshold: number; ratio: number };
  uploader: { id: string | null; name: string };
}): NewStampScan {
  const { processed } = p;
  return {
    stampId: p.stampId,
    kind: p.kind,
    fileName: p.fileName,
    contentType: processed.original.contentType,
    ...p.keys,
    widthPx: processed.widthPx,
    heightPx: processed.heightPx,
    dpi: processed.dpi,
    dpiSource: processed.dpiSource,
    sizeBytes: processed.sizeBytes,
    sha256: processed.sha256,
    polarity: p.polarity,
    threshold: p.coverage.threshold,
    otsuThreshold: p.coverage.otsuThreshold,
    coverageRatio: p.coverage.ratio,
    phash: processed.hashes.hash,
    phashMirrored: processed.hashes.mirroredHash,
    signature: encodeSignature(processed.signature),
    uploadedBy: p.uploader.id,
    uploadedByName: p.uploader.name,
  };
}
