// Stamp scans' data layer: reading (read), uploading and deleting (upload), coverage review (review),
// look-alikes (look-alikes); shared lookups and the row → DTO map in shared.ts, row building in rows.ts.
export { scanLimits, scanObjectKeys } from "./shared";
export { getScan, listScans, newestThumbs, scanImage, scanOriginal, type ObjectStream } from "./read";
export { completeScanUpload, deleteScan, presignScanUpload } from "./upload";
export { coverageOverlay, previewCoverage, saveCoverage } from "./review";
export { similarStamps } from "./look-alikes";
export { similarToPicture, similarToStamp } from "./similar";
