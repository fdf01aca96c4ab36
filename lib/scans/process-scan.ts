import { createHash } from "node:crypto";
import sharp, { type Metadata, type Sharp, type SharpOptions } from "sharp";
import { checkContainer } from "./containers";
import { measureCoverage, type CoverageResult, type WaxPolarity } from "./coverage";
import { scanContentTypes, scanExtensions, sniffContent, type ScanType } from "./detect-type";
import { ScanRejected } from "./errors";
import { checkFileName } from "./file-name";
import type { GreyRaster } from "./otsu";
import { motifHashes, type MotifHashes } from "./phash";
import { motifSignature, type MotifSignature } from "./signature";
import { MM_PER_INCH, physicalSizeMm, type SizeMm } from "./physical-size";

export interface ScanLimits {
  /** Largest file accepted, bytes. */
  maxBytes: number;
  /** Largest width × height decoded; larger images are refused from their header, never decoded. */
  maxPixels: number;
  /** Shortest side a scan may have, px (default 64). */
  minSidePx?: number;
}

/**
 * Suggested limits: 200 MiB holds an uncompressed 8-bit RGB TIFF of 8000 × 8000 px; 80 Mpx holds a
 * 30 × 30 cm stamp at 750 DPI. Raise them only with the benchmark's memory figures in view.
 */
export const defaultScanLimits: Required<ScanLimits> = { maxBytes: 200 * 1024 * 1024, maxPixels: 80_000_000, minSidePx: 64 };

/** Steps reported to `onStage`, in the order they finish. */
export type ScanStage = "check" | "decode" | "sha256" | "original" | "thumbnails" | "phash" | "coverage" | "signature";

export interface ProcessScanOptions extends ScanLimits {
  /** DPI entered by the keeper; wins over the file's own density. */
  dpiOverride?: number;
  /** Name the file came with; checked for path tricks, never used for storage. */
  fileName?: string;
  /** Which pixels are wax for the first coverage measurement (default "darkIsWax"); also decides how transparency is flattened. */
  polarity?: WaxPolarity;
  /** Long sides of the WebP thumbnails, px (default 256 and 1024). */
  thumbnailSidesPx?: readonly number[];
  /** Long side of the grey analysis raster, px (default 2048). */
  analysisMaxSidePx?: number;
  /** Receives each step's wall time, ms; for benchmarks and logs. */
  onStage?: (stage: ScanStage, ms: number) => void;
}

export interface ScanThumbnail {
  longSidePx: number;
  widthPx: number;
  heightPx: number;
  contentType: "image/webp";
  bytes: Buffer;
}

export interface AnalysisRaster extends GreyRaster {
  /** Size of one analysis pixel on the stamp, mm; null when the DPI is unknown. */
  mmPerPx: number | null;
}

export interface ProcessedScan {
  type: ScanType;
  contentType: string;
  /** Extension that fits the content, for download names. */
  extension: string;
  /** Size as displayed, after the file's orientation tag is applied. */
  widthPx: number;
  heightPx: number;
  /** Resolution used: the keeper's when given, else the file's; null when neither is known. */
  dpi: number | null;
  dpiSource: "keeper" | "file" | null;
  /** Density the file declares, rounded to 0.01; null when it declares none. */
  fileDpi: number | null;
  /** The file's density is a screen default (72 or 96), more likely a writer's default than a scanner's setting. */
  fileDpiLikelyDefault: boolean;
  /** widthPx, heightPx at `dpi`, mm; null without a DPI. */
  sizeMm: SizeMm | null;
  /** Hex SHA-256 of the bytes as uploaded: the same file uploaded twice has the same digest. */
  sha256: string;
  sizeBytes: number;
  /**
   * The original to store: the same format without metadata (EXIF, XMP, IPTC, text chunks, comments). PNG, JPEG
   * and WebP keep their compressed pixel data untouched (`reencoded: false`); TIFF files, and files whose
   * orientation tag turns them, are re-encoded (lossless except JPEG at quality 95). Colour profile and density kept.
   */
  original: { bytes: Buffer; contentType: string; reencoded: boolean };
  thumbnails: ScanThumbnail[];
  /** Grey raster, long side ≤ analysisMaxSidePx, for coverage, the review overlay and re-thresholding. */
  analysis: AnalysisRaster;
  coverage: CoverageResult;
  hashes: MotifHashes;
  /** The motif's signature for search by picture. */
  signature: MotifSignature;
}

const DEFAULT_THUMBNAILS = [256, 1024] as const;
const DEFAULT_ANALYSIS_SIDE = 2048;
const SCREEN_DEFAULT_DPI = new Set([72, 96]);

// libvips' operation cache keys buffer inputs by address: a freed upload's address reused by the
// next one could hand back the earlier decode. Every scan is decoded once, so the cache buys nothing.
sharp.cache(false);

/** Decoder options on every sharp call that reads uploaded bytes. */
function decoderOptions(maxPixels: number): SharpOptions {
  // failOn "warning": a scan the decoder has to guess about is refused rather than stored half-read.
  return { limitInputPixels: maxPixels, failOn: "warning", sequentialRead: true };
}

function decodeFailure(error: unknown, limits: { maxPixels: number }): ScanRejected {
  if (error instanceof ScanRejected) return error;
  const message = error instanceof Error ? error.message : String(error);
  if (/pixel limit/i.test(message)) return new ScanRejected("tooManyPixels", { maxPixels: limits.maxPixels }, { cause: error });
  return new ScanRejected("corrupt", {}, { cause: error });
}

/**
 * SHA-256 in 1 MiB slices with a turn of the event loop between them: hashing a 100 MB upload in one call
 * would hold every other request for a noticeable time (WebCrypto's digest copies its input on this thread first).
 */
async function sha256Hex(bytes: Uint8Array): Promise<string> {
  const hash = createHash("sha256");
  const slice = 1 << 20;
  for (let at = 0; at < bytes.length; at += slice) {
    hash.update(bytes.subarray(at, at + slice));
    if (at + slice < bytes.length) await new Promise<void>((resolve) => setImmediate(resolve));
  }
  return hash.digest("hex");
}

async function timed<T>(stage: ScanStage, onStage: ProcessScanOptions["onStage"], work: () => Promise<T> | T): Promise<T> {
  const t0 = performance.now();
  const result = await work();
  onStage?.(stage, performance.now() - t0);
  return result;
}

function checkDpi(dpi: number) {
  if (!Number.isFinite(dpi) || dpi < 10 || dpi > 20_000) throw new RangeError(`dpiOverride must be 10…20000, got ${dpi}`);
}

/** Re-encodes in the same format without metadata, turning the pixels upright. */
async function reencodeOriginal(
  bytes: Uint8Array,
  type: ScanType,
  meta: Metadata,
  options: { dpi: number | null; maxPixels: number; lossless: boolean },
): Promise<Buffer> {
  const { dpi, maxPixels } = options;
  let image: Sharp = sharp(bytes, { ...decoderOptions(maxPixels), autoOrient: true });
  if (meta.space !== "cmyk") image = image.keepIccProfile();
  if (meta.depth === "ushort" && type !== "jpeg" && type !== "webp") image = image.toColourspace((meta.channels ?? 3) <= 2 ? "grey16" : "rgb16");
  switch (type) {
    case "tiff":
      return image
        .tiff({
          compression: "deflate",
          predictor: "horizontal",
          ...(dpi ? { xres: dpi / MM_PER_INCH, yres: dpi / MM_PER_INCH, resolutionUnit: "inch" as const } : {}),
        })
        .toBuffer();
    case "png":
      return checkContainer("png", await image.png({ compressionLevel: 6 }).toBuffer()).strip(dpi) as Buffer;
    case "jpeg":
      return checkContainer("jpeg", await image.jpeg({ quality: 95, chromaSubsampling: "4:4:4" }).toBuffer()).strip(dpi) as Buffer;
    case "webp":
      return image.webp(options.lossless ? { lossless: true } : { quality: 95 }).toBuffer();
  }
}

interface CheckedImage {
  type: ScanType;
  container: ReturnType<typeof checkContainer>;
  meta: Metadata;
  /** Size as displayed, after the orientation tag. */
  widthPx: number;
  heightPx: number;
}

/**
 * The checks every uploaded picture passes before it is decoded: file name (if given), size, type by magic bytes
 * (only `types`; SVG and markup refused by name), container structure, declared pixels against `maxPixels`, then
 * the decoder's own header read under `limitInputPixels`, and the shortest side.
 */
async function checkImage(
  bytes: Buffer,
  options: Required<ScanLimits> & { fileName?: string; types?: readonly ScanType[] },
): Promise<CheckedImage> {
  const { maxBytes, maxPixels, minSidePx } = options;
  if (options.fileName !== undefined) checkFileName(options.fileName);
  if (bytes.length === 0) throw new ScanRejected("empty");
  if (bytes.length > maxBytes) throw new ScanRejected("tooLarge", { sizeBytes: bytes.length, maxBytes });
  const sniffed = sniffContent(bytes);
  if (sniffed.kind === "svg") throw new ScanRejected("svgRefused");
  if (sniffed.kind === "markup") throw new ScanRejected("markupRefused", { markup: sniffed.markup });
  if (sniffed.kind === "refusedImage") throw new ScanRejected("unsupportedType", { type: sniffed.type });
  if (sniffed.kind === "unknown") throw new ScanRejected("notAnImage");
  const type = sniffed.type;
  if (options.types && !options.types.includes(type)) throw new ScanRejected("unsupportedType", { type });
  const container = checkContainer(type, bytes);
  const declared = container.widthPx * container.heightPx;
  if (declared > maxPixels) throw new ScanRejected("tooManyPixels", { widthPx: container.widthPx, heightPx: container.heightPx, maxPixels });
  let meta: Metadata;
  try {
    meta = await sharp(bytes, decoderOptions(maxPixels)).metadata();
  } catch (error) {
    throw decodeFailure(error, { maxPixels });
  }
  if (meta.format !== type || !meta.width || !meta.height) throw new ScanRejected("corrupt");
  if (meta.width * meta.height > maxPixels) throw new ScanRejected("tooManyPixels", { widthPx: meta.width, heightPx: meta.height, maxPixels });
  const widthPx = meta.autoOrient?.width ?? meta.width;
  const heightPx = meta.autoOrient?.height ?? meta.height;
  if (Math.min(widthPx, heightPx) < minSidePx) throw new ScanRejected("tooSmall", { widthPx, heightPx, minSidePx });
  return { type, container, meta, widthPx, heightPx };
}

/**
 * Checks, measures and prepares one uploaded scan. In order: file name (if given), size, type by magic bytes
 * (PNG, JPEG, TIFF, WebP only; SVG and markup refused by name), container structure (truncation, data after
 * the image), declared pixel count against `maxPixels` before any decoding, then one full decode by sharp
 * with `limitInputPixels`, `failOn: "warning"` and sequential reads, streamed straight into a reduction to the
 * analysis size (so an 8000² scan never sits in memory whole). From that: WebP thumbnails, a grey raster,
 * perceptual hashes and the Otsu coverage. DPI: keeper's override, else the file's density; sizes mm = px /
 * dpi × 25.4. Throws ScanRejected with a code for anything refused; nothing is stored here.
 */
export async function processScan(bytes: Buffer, options: ProcessScanOptions): Promise<ProcessedScan> {
  const { maxBytes, maxPixels, onStage } = options;
  const minSidePx = options.minSidePx ?? defaultScanLimits.minSidePx;
  if (options.dpiOverride !== undefined) checkDpi(options.dpiOverride);

  const { type, container, meta, widthPx, heightPx } = await timed("check", onStage, () => checkImage(bytes, { maxBytes, maxPixels, minSidePx, fileName: options.fileName }));

  const fileDpi = meta.density && Number.isFinite(meta.density) && meta.density > 0 ? Math.round(meta.density * 100) / 100 : null;
  const dpi = options.dpiOverride ?? fileDpi;
  const orientationTurns = (meta.orientation ?? 1) !== 1;
  const polarity = options.polarity ?? "darkIsWax";
  const analysisSide = options.analysisMaxSidePx ?? DEFAULT_ANALYSIS_SIDE;

  // The decode runs on the thread pool while this thread hashes (in slices) and strips the container.
  const digest = timed("sha256", onStage, () => sha256Hex(bytes));
  const decoded = timed("decode", onStage, async () => {
    try {
      let image = sharp(bytes, { ...decoderOptions(maxPixels), autoOrient: true });
      if (meta.hasAlpha) image = image.flatten({ background: polarity === "darkIsWax" ? "#ffffff" : "#000000" });
      return await image
        .resize({ width: analysisSide, height: analysisSide, fit: "inside", withoutEnlargement: true })
        .toColourspace("srgb")
        .raw({ depth: "uchar" })
        .toBuffer({ resolveWithObject: true });
    } catch (error) {
      throw decodeFailure(error, { maxPixels });
    }
  });
  // Both are awaited below; until then a rejection must not count as unhandled.
  digest.catch(() => undefined);
  decoded.catch(() => undefined);

  const stripped = orientationTurns ? null : await timed("original", onStage, () => container.strip(dpi));
  const reduced = await decoded;
  const sha256 = await digest;
  const original = stripped
    ? { bytes: stripped, contentType: scanContentTypes[type], reencoded: false }
    : await timed("original", onStage, async () => ({
        bytes: await reencodeOriginal(bytes, type, meta, { dpi, maxPixels, lossless: container.lossless }),
        contentType: scanContentTypes[type],
        reencoded: true,
      }));

  const raw = { width: reduced.info.width, height: reduced.info.height, channels: reduced.info.channels };
  const thumbnailsDone = timed("thumbnails", onStage, () =>
    Promise.all(
      (options.thumbnailSidesPx ?? DEFAULT_THUMBNAILS).map(async (longSidePx) => {
        const { data, info } = await sharp(reduced.data, { raw })
          .resize({ width: longSidePx, height: longSidePx, fit: "inside", withoutEnlargement: true })
          .webp({ quality: 80, effort: 2 })
          .toBuffer({ resolveWithObject: true });
        return { longSidePx, widthPx: info.width, heightPx: info.height, contentType: "image/webp" as const, bytes: data };
      }),
    ),
  );
  thumbnailsDone.catch(() => undefined);
  const grey = await sharp(reduced.data, { raw }).greyscale().raw().toBuffer({ resolveWithObject: true });
  const analysis: AnalysisRaster = {
    data: new Uint8Array(grey.data.buffer, grey.data.byteOffset, grey.data.length),
    widthPx: grey.info.width,
    heightPx: grey.info.height,
    mmPerPx: dpi ? (widthPx / grey.info.width) * (MM_PER_INCH / dpi) : null,
  };
  const hashes = await timed("phash", onStage, () => motifHashes(analysis));
  const coverage = await timed("coverage", onStage, () => measureCoverage(analysis, { polarity }));
  const signature = await timed("signature", onStage, () => motifSignature(analysis));
  const thumbnails = await thumbnailsDone;

  return {
    type,
    contentType: scanContentTypes[type],
    extension: scanExtensions[type],
    widthPx,
    heightPx,
    dpi,
    dpiSource: options.dpiOverride !== undefined ? "keeper" : fileDpi !== null ? "file" : null,
    fileDpi,
    fileDpiLikelyDefault: fileDpi !== null && SCREEN_DEFAULT_DPI.has(Math.round(fileDpi)),
    sizeMm: dpi ? physicalSizeMm(widthPx, heightPx, dpi) : null,
    sha256,
    sizeBytes: bytes.length,
    original,
    thumbnails,
    analysis,
    coverage,
    hashes,
    signature,
  };
}

/**
 * Decodes any accepted image (same checks as `processScan`, no name check) to a grey raster whose long side is
 * at most `maxSidePx`; for re-thresholding a stored analysis raster or hashing a picture outside an upload.
 */
export async function decodeGreyRaster(bytes: Buffer, options: { maxPixels: number; maxSidePx?: number }): Promise<GreyRaster> {
  if (bytes.length === 0) throw new ScanRejected("empty");
  const sniffed = sniffContent(bytes);
  if (sniffed.kind !== "scan") throw new ScanRejected(sniffed.kind === "svg" ? "svgRefused" : "notAnImage");
  try {
    const side = options.maxSidePx ?? DEFAULT_ANALYSIS_SIDE;
    const { data, info } = await sharp(bytes, { ...decoderOptions(options.maxPixels), autoOrient: true })
      .flatten({ background: "#ffffff" })
      .resize({ width: side, height: side, fit: "inside", withoutEnlargement: true })
      .greyscale()
      .raw({ depth: "uchar" })
      .toBuffer({ resolveWithObject: true });
    return { data: new Uint8Array(data.buffer, data.byteOffset, data.length), widthPx: info.width, heightPx: info.height };
  } catch (error) {
    throw decodeFailure(error, options);
  }
}

/** The analysis raster as a lossless grey PNG, to keep beside the scan for later re-thresholding. */
export function encodeGreyRaster(raster: GreyRaster): Promise<Buffer> {
  return sharp(raster.data, { raw: { width: raster.widthPx, height: raster.heightPx, channels: 1 } })
    .toColourspace("b-w")
    .png({ compressionLevel: 6 })
    .toBuffer();
}

/** Types a picture that is not a stamp scan may have (sketches, finding photos): what every browser shows. */
export const pictureTypes = ["png", "jpeg", "webp"] as const satisfies readonly ScanType[];

export interface ProcessedPicture {
  type: (typeof pictureTypes)[number];
  contentType: string;
  widthPx: number;
  heightPx: number;
  sizeBytes: number;
  /** The original without metadata (as `ProcessedScan.original`). */
  original: { bytes: Buffer; contentType: string; reencoded: boolean };
  /** A WebP thumbnail, long side at most `thumbnailSidePx`. */
  thumb: ScanThumbnail;
}

/**
 * Checks and prepares an uploaded picture that is not a stamp scan (a sketch for a new stamp, a finding's photo):
 * the same checks as a scan (`checkImage`: magic bytes, container, pixel limit before decoding; PNG, JPEG or
 * WebP only, TIFF is `unsupportedType`), the original without metadata, and one WebP thumbnail. Nothing is
 * measured and nothing is stored here.
 */
export async function processPicture(bytes: Buffer, options: ScanLimits & { fileName?: string; thumbnailSidePx?: number }): Promise<ProcessedPicture> {
  const { maxBytes, maxPixels } = options;
  const minSidePx = options.minSidePx ?? defaultScanLimits.minSidePx;
  const { type, container, meta, widthPx, heightPx } = await checkImage(bytes, { maxBytes, maxPixels, minSidePx, fileName: options.fileName, types: pictureTypes });
  const side = options.thumbnailSidePx ?? 512;
  let thumb: ScanThumbnail;
  try {
    const { data, info } = await sharp(bytes, { ...decoderOptions(maxPixels), autoOrient: true })
      .resize({ width: side, height: side, fit: "inside", withoutEnlargement: true })
      .webp({ quality: 80, effort: 2 })
      .toBuffer({ resolveWithObject: true });
    thumb = { longSidePx: side, widthPx: info.width, heightPx: info.height, contentType: "image/webp", bytes: data };
  } catch (error) {
    throw decodeFailure(error, { maxPixels });
  }
  const turns = (meta.orientation ?? 1) !== 1;
  const stripped = turns ? null : container.strip(null);
  const original = stripped
    ? { bytes: stripped, contentType: scanContentTypes[type], reencoded: false }
    : { bytes: await reencodeOriginal(bytes, type, meta, { dpi: null, maxPixels, lossless: container.lossless }), contentType: scanContentTypes[type], reencoded: true };
  return { type: type as ProcessedPicture["type"], contentType: scanContentTypes[type], widthPx, heightPx, sizeBytes: bytes.length, original, thumb };
}
