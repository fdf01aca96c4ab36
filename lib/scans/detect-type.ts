/** The four image containers accepted as scans. */
export type ScanType = "png" | "jpeg" | "tiff" | "webp";

/** Image or document types that are recognised but never accepted as scans. */
export type RefusedImageType = "gif" | "bmp" | "ico" | "pdf" | "postscript" | "heif" | "avif" | "jpeg2000" | "jpegxl" | "psd" | "qoi";

export type SniffResult =
  | { kind: "scan"; type: ScanType }
  | { kind: "svg" }
  | { kind: "markup"; markup: "html" | "xml" }
  | { kind: "refusedImage"; type: RefusedImageType }
  | { kind: "unknown" };

export const scanContentTypes: Record<ScanType, string> = {
  png: "image/png",
  jpeg: "image/jpeg",
  tiff: "image/tiff",
  webp: "image/webp",
};

export const scanExtensions: Record<ScanType, string> = { png: "png", jpeg: "jpg", tiff: "tif", webp: "webp" };

/** The scan type of a stored content type (as scanContentTypes wrote it); PNG for anything else. */
export function scanTypeOfContent(contentType: string): ScanType {
  return (Object.keys(scanContentTypes) as ScanType[]).find((type) => scanContentTypes[type] === contentType) ?? "png";
}

const startsWith = (bytes: Uint8Array, signature: ArrayLike<number>, offset = 0) => {
  if (bytes.length < offset + signature.length) return false;
  for (let i = 0; i < signature.length; i++) if (bytes[offset + i] !== signature[i]) return false;
  return true;
};

const ascii = (text: string) => Array.from(text, (c) => c.charCodeAt(0));

const PNG = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
const JPEG = [0xff, 0xd8, 0xff];
const TIFF_LE = [0x49, 0x49, 0x2a, 0x00];
const TIFF_BE = [0x4d, 0x4d, 0x00, 0x2a];
const BIGTIFF_LE = [0x49, 0x49, 0x2b, 0x00];
const BIGTIFF_BE = [0x4d, 0x4d, 0x00, 0x2b];
const JP2_BOX = [0x00, 0x00, 0x00, 0x0c, 0x6a, 0x50, 0x20, 0x20, 0x0d, 0x0a, 0x87, 0x0a];
const JXL_BOX = [0x00, 0x00, 0x00, 0x0c, 0x4a, 0x58, 0x4c, 0x20, 0x0d, 0x0a, 0x87, 0x0a];
const BMP_HEADER_SIZES = new Set([12, 16, 40, 52, 56, 64, 108, 124]);
const AVIF_BRANDS = new Set(["avif", "avis"]);
const HEIF_BRANDS = new Set(["heic", "heix", "hevc", "hevx", "heim", "heis", "mif1", "msf1"]);

/** First characters of the file as text, for markup detection (UTF-8 or UTF-16 with a byte-order mark). */
function textHead(bytes: Uint8Array, maxBytes = 4096): string {
  const head = bytes.subarray(0, maxBytes);
  if (startsWith(head, [0xff, 0xfe])) return new TextDecoder("utf-16le").decode(head.subarray(2));
  if (startsWith(head, [0xfe, 0xff])) return new TextDecoder("utf-16be").decode(head.subarray(2));
  const body = startsWith(head, [0xef, 0xbb, 0xbf]) ? head.subarray(3) : head;
  return new TextDecoder("utf-8", { fatal: false }).decode(body);
}

function sniffMarkup(bytes: Uint8Array): SniffResult | null {
  const text = textHead(bytes).replace(/^[\s\u0000]+/, "").toLowerCase();
  if (!text.startsWith("<")) return null;
  // Browsers and image libraries render these by content, whatever the extension says.
  if (/<svg[\s>/]/.test(text) || text.includes("<!doctype svg")) return { kind: "svg" };
  if (/<(!doctype html|html|head|body|script|iframe|object|embed|meta|a\s|div|img)[\s>/]/.test(text)) return { kind: "markup", markup: "html" };
  if (/^<(\?xml|!|[a-z_])/.test(text)) return { kind: "markup", markup: "xml" };
  return null;
}

function sniffRefusedImage(bytes: Uint8Array): RefusedImageType | null {
  if (startsWith(bytes, ascii("GIF87a")) || startsWith(bytes, ascii("GIF89a"))) return "gif";
  if (startsWith(bytes, ascii("BM")) && bytes.length >= 18) {
    const dibSize = bytes[14] | (bytes[15] << 8) | (bytes[16] << 16) | (bytes[17] << 24);
    if (BMP_HEADER_SIZES.has(dibSize)) return "bmp";
  }
  if ((startsWith(bytes, [0, 0, 1, 0]) || startsWith(bytes, [0, 0, 2, 0])) && bytes.length >= 6 && (bytes[4] | bytes[5]) !== 0) return "ico";
  if (startsWith(bytes, ascii("%PDF-"))) return "pdf";
  if (startsWith(bytes, ascii("%!PS")) || startsWith(bytes, [0xc5, 0xd0, 0xd3, 0xc6])) return "postscript";
  if (startsWith(bytes, ascii("ftyp"), 4) && bytes.length >= 12) {
    const brand = String.fromCharCode(...bytes.subarray(8, 12));
    if (AVIF_BRANDS.has(brand)) return "avif";
    if (HEIF_BRANDS.has(brand)) return "heif";
  }
  if (startsWith(bytes, JP2_BOX) || startsWith(bytes, [0xff, 0x4f, 0xff, 0x51])) return "jpeg2000";
  if (startsWith(bytes, JXL_BOX) || startsWith(bytes, [0xff, 0x0a])) return "jpegxl";
  if (startsWith(bytes, ascii("8BPS"))) return "psd";
  if (startsWith(bytes, ascii("qoif"))) return "qoi";
  return null;
}

/**
 * What a file is, judged by its leading bytes only (never its name or the browser's claim).
 * Signatures: PNG 89 50 4E 47 0D 0A 1A 0A; JPEG FF D8 FF; TIFF "II*\0" / "MM\0*" (and BigTIFF "II+\0" / "MM\0+");
 * WebP "RIFF" size "WEBP". SVG, HTML and other XML are recognised so they can be refused by name.
 */
export function sniffContent(bytes: Uint8Array): SniffResult {
  if (startsWith(bytes, PNG)) return { kind: "scan", type: "png" };
  if (startsWith(bytes, JPEG)) return { kind: "scan", type: "jpeg" };
  if (startsWith(bytes, TIFF_LE) || startsWith(bytes, TIFF_BE) || startsWith(bytes, BIGTIFF_LE) || startsWith(bytes, BIGTIFF_BE)) {
    return { kind: "scan", type: "tiff" };
  }
  if (startsWith(bytes, ascii("RIFF")) && startsWith(bytes, ascii("WEBP"), 8)) return { kind: "scan", type: "webp" };
  const refused = sniffRefusedImage(bytes);
  if (refused) return { kind: "refusedImage", type: refused };
  return sniffMarkup(bytes) ?? { kind: "unknown" };
}

/** The accepted scan type from the magic bytes, or null for anything else (SVG, HTML, GIF, text, …). */
export function detectType(bytes: Uint8Array): ScanType | null {
  const sniffed = sniffContent(bytes);
  return sniffed.kind === "scan" ? sniffed.type : null;
}
