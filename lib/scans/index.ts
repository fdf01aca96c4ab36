export { ScanRejected, type ScanRejectedCode, type ScanRejectedParams } from "./errors";
export { detectType, sniffContent, scanContentTypes, scanExtensions, scanTypeOfContent, type ScanType, type SniffResult, type RefusedImageType } from "./detect-type";
export { checkFileName, downloadFileName, MAX_FILE_NAME_LENGTH } from "./file-name";
export {
  processScan,
  processPicture,
  pictureTypes,
  type ProcessedPicture,
  decodeGreyRaster,
  encodeGreyRaster,
  defaultScanLimits,
  type ProcessScanOptions,
  type ProcessedScan,
  type ScanLimits,
  type ScanStage,
  type ScanThumbnail,
  type AnalysisRaster,
} from "./process-scan";
export { physicalSizeMm, impliedDpi, compareWithRecord, MM_PER_INCH, SIZE_WARN_PCT, type SizeMm, type SizeComparison } from "./physical-size";
export { otsuThreshold, greyHistogram, clampRect, type GreyRaster, type PixelRect, type OtsuResult } from "./otsu";
export {
  measureCoverage,
  renderCoverageOverlay,
  waxPolarities,
  type WaxPolarity,
  type CoverageOptions,
  type CoverageResult,
  type OverlayOptions,
} from "./coverage";
export {
  motifHashes,
  perceptualHash,
  mirroredHash,
  dctHash,
  hamming,
  nearest,
  type MotifHashes,
  type HashCandidate,
  type HashMatch,
} from "./phash";
export { LOOK_ALIKE_MAX_BITS, MIRROR_TWIN_MARGIN_BITS } from "./look-alikes";
export { createScanLimiter, scanLimiter, type ScanLimiter } from "./limiter";
export { analysisMmPerPx, footprintRect } from "./footprint";
export { motifSignature, type MotifSignature } from "./signature";
export {
  findSimilar,
  similarQuery,
  queryOfSignature,
  bestPerKey,
  encodeSignature,
  decodeSignature,
  kindOfSignature,
  SIMILAR_MAX_DISTANCE,
  CLOSE_DISTANCE,
  type PictureKind,
  type StoredSignature,
  type SimilarMatch,
  type SimilarQuery,
} from "./similar";
