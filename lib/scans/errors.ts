/**
 * Why a scan was refused: stable codes only. The app's status table (lib/errors.ts) gives each its
 * HTTP status and the catalogue its message (`scans.rejected.<code>`); the domain never returns prose.
 * - badFileName: the name has path separators, "..", control characters, or is empty or too long (400)
 * - empty: zero bytes (400)
 * - tooLarge: more bytes than allowed (413); params { sizeBytes, maxBytes }
 * - svgRefused: an SVG drawing, never accepted as a scan (415)
 * - markupRefused: HTML or other XML (415)
 * - unsupportedType: a recognised image or document type that is not PNG, JPEG, TIFF or WebP (415); params { type }
 * - notAnImage: no known image signature (415)
 * - truncated: the file ends before the image does (422)
 * - trailingData: bytes after the end of the image, as in a polyglot file (422)
 * - corrupt: the image structure or its pixel data cannot be decoded (422)
 * - tooManyPixels: width × height above the pixel limit; refused before decoding (413); params { widthPx, heightPx, maxPixels }
 * - tooSmall: a side shorter than the minimum a scan needs (422); params { widthPx, heightPx, minSidePx }
 * - busy: too many scans already waiting to be processed (503); params { maxQueued }
 */
export type ScanRejectedCode =
  | "badFileName"
  | "empty"
  | "tooLarge"
  | "svgRefused"
  | "markupRefused"
  | "unsupportedType"
  | "notAnImage"
  | "truncated"
  | "trailingData"
  | "corrupt"
  | "tooManyPixels"
  | "tooSmall"
  | "busy";

export type ScanRejectedParams = Record<string, string | number>;

/** Thrown by lib/scans for input it refuses. `cause` may hold the decoder's own message, for logs only. */
export class ScanRejected extends Error {
  constructor(
    readonly code: ScanRejectedCode,
    readonly params: ScanRejectedParams = {},
    options?: { cause?: unknown },
  ) {
    super(`scan rejected: ${code}`, options);
    this.name = "ScanRejected";
  }
}
