import { crc32 } from "node:zlib";
import type { ScanType } from "./detect-type";
import { ScanRejected } from "./errors";

// Structure walks for PNG, JPEG and WebP: they find where the image really ends (so truncated files and
// polyglots with a payload after the image are refused before any decoding) and let us drop metadata
// chunks without re-encoding, so the stored original keeps exactly the uploaded pixels.

interface Range {
  start: number;
  end: number;
}

const be16 = (b: Uint8Array, at: number) => (b[at] << 8) | b[at + 1];
const be32 = (b: Uint8Array, at: number) => ((b[at] << 24) >>> 0) + ((b[at + 1] << 16) | (b[at + 2] << 8) | b[at + 3]);
const le32 = (b: Uint8Array, at: number) => (b[at] | (b[at + 1] << 8) | (b[at + 2] << 16)) + ((b[at + 3] << 24) >>> 0);
const fourcc = (b: Uint8Array, at: number) => String.fromCharCode(b[at], b[at + 1], b[at + 2], b[at + 3]);

/**
 * Joins kept ranges of `bytes` and new pieces. When the result is the input unchanged it returns a view of the
 * input instead of a copy: copying a 40 MB scan costs more than the rest of this module together.
 */
function concat(bytes: Uint8Array, parts: Array<Range | Uint8Array>): Buffer {
  const merged: Array<Range | Uint8Array> = [];
  for (const part of parts) {
    const last = merged[merged.length - 1];
    if (!(part instanceof Uint8Array) && last && !(last instanceof Uint8Array) && last.end === part.start) last.end = part.end;
    else merged.push(part instanceof Uint8Array ? part : { ...part });
  }
  const only = merged[0];
  if (merged.length === 1 && !(only instanceof Uint8Array) && only.start === 0 && only.end === bytes.length) {
    return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.length);
  }
  return Buffer.concat(merged.map((p) => (p instanceof Uint8Array ? p : bytes.subarray(p.start, p.end))));
}

/** Bytes after the image's end are allowed only as zero padding, which some writers add. */
function checkTrailing(bytes: Uint8Array, end: number) {
  for (let i = end; i < bytes.length; i++) {
    if (bytes[i] !== 0) throw new ScanRejected("trailingData", { trailingBytes: bytes.length - end });
  }
}

// ---------------------------------------------------------------- PNG (ISO/IEC 15948, W3C PNG 3rd ed.)

interface PngChunk extends Range {
  type: string;
}

/** Colour, transparency and resolution chunks travel with the pixels; text, time, EXIF and animation chunks do not. */
const PNG_KEPT = new Set(["IHDR", "PLTE", "IDAT", "IEND", "tRNS", "gAMA", "cHRM", "sRGB", "iCCP", "sBIT", "pHYs", "cICP", "mDCV", "cLLI"]);

function walkPng(bytes: Uint8Array): { chunks: PngChunk[]; widthPx: number; heightPx: number } {
  const chunks: PngChunk[] = [];
  let pos = 8;
  for (;;) {
    if (pos + 12 > bytes.length) throw new ScanRejected("truncated");
    const length = be32(bytes, pos);
    const type = fourcc(bytes, pos + 4);
    if (length > 0x7fffffff || !/^[A-Za-z]{4}$/.test(type)) throw new ScanRejected("corrupt");
    const end = pos + 12 + length;
    if (end > bytes.length) throw new ScanRejected("truncated");
    if (crc32(bytes.subarray(pos + 4, pos + 8 + length)) !== be32(bytes, pos + 8 + length)) throw new ScanRejected("corrupt");
    if (chunks.length === 0 && (type !== "IHDR" || length !== 13)) throw new ScanRejected("corrupt");
    chunks.push({ type, start: pos, end });
    pos = end;
    if (type === "IEND") break;
  }
  checkTrailing(bytes, pos);
  return { chunks, widthPx: be32(bytes, 16), heightPx: be32(bytes, 20) };
}

function pngChunk(type: string, data: Uint8Array): Buffer {
  const out = Buffer.alloc(12 + data.length);
  out.writeUInt32BE(data.length, 0);
  out.write(type, 4, "latin1");
  out.set(data, 8);
  out.writeUInt32BE(crc32(out.subarray(4, 8 + data.length)), 8 + data.length);
  return out;
}

/** pHYs in pixels per metre (unit 1); 1 in = 0.0254 m exactly. */
function pngDensityChunk(dpi: number): Buffer {
  const data = Buffer.alloc(9);
  const perMetre = Math.round(dpi / 0.0254);
  data.writeUInt32BE(perMetre, 0);
  data.writeUInt32BE(perMetre, 4);
  data[8] = 1;
  return pngChunk("pHYs", data);
}

function stripPng(bytes: Uint8Array, chunks: PngChunk[], dpi: number | null): Buffer {
  const density = dpi === null ? null : pngDensityChunk(dpi);
  const sameDensity = (chunk: PngChunk) => density !== null && Buffer.compare(bytes.subarray(chunk.start, chunk.end), density) === 0;
  const hasSameDensity = chunks.some((c) => c.type === "pHYs" && sameDensity(c));
  const parts: Array<Range | Uint8Array> = [{ start: 0, end: 8 }];
  for (const chunk of chunks) {
    if (chunk.type === "pHYs" && density !== null && !sameDensity(chunk)) continue;
    if (PNG_KEPT.has(chunk.type)) parts.push(chunk);
    if (chunk.type === "IHDR" && density !== null && !hasSameDensity) parts.push(density);
  }
  return concat(bytes, parts);
}

// ---------------------------------------------------------------- JPEG (ITU-T T.81, JFIF 1.02)

interface JpegSegment extends Range {
  /** Marker byte (0xC0…0xFE), or -1 for entropy-coded data. */
  marker: number;
}

const isSof = (m: number) => m >= 0xc0 && m <= 0xcf && m !== 0xc4 && m !== 0xc8 && m !== 0xcc;
const isStandalone = (m: number) => m === 0x01 || (m >= 0xd0 && m <= 0xd7);
const segmentStartsWith = (b: Uint8Array, s: JpegSegment, text: string) =>
  s.end - s.start >= 4 + text.length && String.fromCharCode(...b.subarray(s.start + 4, s.start + 4 + text.length)) === text;

function walkJpeg(bytes: Uint8Array): { segments: JpegSegment[]; widthPx: number; heightPx: number } {
  const segments: JpegSegment[] = [];
  let widthPx = 0;
  let heightPx = 0;
  let pos = 2;
  let inScan = false;
  for (;;) {
    if (inScan) {
      // Entropy-coded data runs to the next marker that is neither a stuffed 0xFF00 nor a restart marker.
      let i = pos;
      for (;;) {
        const j = bytes.indexOf(0xff, i);
        if (j < 0 || j + 1 >= bytes.length) throw new ScanRejected("truncated");
        const next = bytes[j + 1];
        if (next === 0x00 || next === 0xff || isStandalone(next)) {
          i = next === 0xff ? j + 1 : j + 2;
          continue;
        }
        segments.push({ marker: -1, start: pos, end: j });
        pos = j;
        break;
      }
      inScan = false;
    }
    if (pos + 2 > bytes.length) throw new ScanRejected("truncated");
    if (bytes[pos] !== 0xff) throw new ScanRejected("corrupt");
    const marker = bytes[pos + 1];
    if (marker === 0xff) {
      pos += 1;
      continue;
    }
    if (marker === 0xd9) {
      segments.push({ marker, start: pos, end: pos + 2 });
      pos += 2;
      break;
    }
    // Markers are 0x01 and 0xC0…0xFE; anything else here means the bytes are not a JPEG stream.
    if (marker === 0xd8 || (marker < 0xc0 && marker !== 0x01)) throw new ScanRejected("corrupt");
    if (isStandalone(marker)) {
      segments.push({ marker, start: pos, end: pos + 2 });
      pos += 2;
      continue;
    }
    if (pos + 4 > bytes.length) throw new ScanRejected("truncated");
    const length = be16(bytes, pos + 2);
    if (length < 2) throw new ScanRejected("corrupt");
    const end = pos + 2 + length;
    if (end > bytes.length) throw new ScanRejected("truncated");
    if (isSof(marker)) {
      if (length < 8) throw new ScanRejected("corrupt");
      heightPx = be16(bytes, pos + 5);
      widthPx = be16(bytes, pos + 7);
    }
    segments.push({ marker, start: pos, end });
    pos = end;
    if (marker === 0xda) {
      if (widthPx === 0) throw new ScanRejected("corrupt");
      inScan = true;
    }
  }
  if (!segments.some((s) => s.marker === 0xda)) throw new ScanRejected("corrupt");
  checkTrailing(bytes, pos);
  return { segments, widthPx, heightPx };
}

/** JFIF APP0 with the density in dots per inch and no thumbnail. */
function jfifSegment(dpi: number): Buffer {
  const d = Math.min(65535, Math.max(1, Math.round(dpi)));
  return Buffer.from([0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01, 0x02, 0x01, d >> 8, d & 0xff, d >> 8, d & 0xff, 0x00, 0x00]);
}

/**
 * Keeps JFIF (density), ICC profile and Adobe (colour transform) segments; drops EXIF, XMP, IPTC, comments and
 * every other application segment. Writes the density into JFIF when known, unless an Adobe segment without
 * JFIF is present (adding JFIF there would change how decoders read the colours).
 */
function stripJpeg(bytes: Uint8Array, segments: JpegSegment[], dpi: number | null): Buffer {
  const isJfif = (s: JpegSegment) => s.marker === 0xe0 && segmentStartsWith(bytes, s, "JFIF\0");
  const isIcc = (s: JpegSegment) => s.marker === 0xe2 && segmentStartsWith(bytes, s, "ICC_PROFILE\0");
  const isAdobe = (s: JpegSegment) => s.marker === 0xee && segmentStartsWith(bytes, s, "Adobe");
  const hasJfif = segments.some(isJfif);
  const hasAdobe = segments.some(isAdobe);
  const parts: Array<Range | Uint8Array> = [{ start: 0, end: 2 }];
  if (dpi !== null && !hasJfif && !hasAdobe) parts.push(jfifSegment(dpi));
  for (const s of segments) {
    const app = s.marker >= 0xe0 && s.marker <= 0xef;
    if (s.marker === 0xfe) continue;
    if (app && !isJfif(s) && !isIcc(s) && !isAdobe(s)) continue;
    const d = dpi === null ? 0 : Math.min(65535, Math.max(1, Math.round(dpi)));
    const densityDiffers = (at: number) => bytes[at + 11] !== 1 || be16(bytes, at + 12) !== d || be16(bytes, at + 14) !== d;
    if (isJfif(s) && dpi !== null && s.end - s.start >= 16 && densityDiffers(s.start)) {
      const segment = Buffer.from(bytes.subarray(s.start, s.end));
      segment[11] = 1;
      segment.writeUInt16BE(d, 12);
      segment.writeUInt16BE(d, 14);
      parts.push(segment);
      continue;
    }
    parts.push(s);
  }
  return concat(bytes, parts);
}

// ---------------------------------------------------------------- WebP (RIFF container, RFC 9649)

interface WebpChunk extends Range {
  id: string;
}

const WEBP_KEPT = new Set(["VP8 ", "VP8L", "VP8X", "ALPH", "ANIM", "ANMF", "ICCP"]);
const VP8X_EXIF = 0x08;
const VP8X_XMP = 0x04;

function walkWebp(bytes: Uint8Array): { chunks: WebpChunk[] } {
  if (bytes.length < 20) throw new ScanRejected("truncated");
  const riffEnd = 8 + le32(bytes, 4);
  if (riffEnd > bytes.length) throw new ScanRejected("truncated");
  const chunks: WebpChunk[] = [];
  let pos = 12;
  while (pos < riffEnd) {
    if (pos + 8 > riffEnd) throw new ScanRejected("truncated");
    const id = fourcc(bytes, pos);
    const size = le32(bytes, pos + 4);
    const end = pos + 8 + size + (size & 1);
    if (pos + 8 + size > riffEnd) throw new ScanRejected("truncated");
    if (chunks.length === 0 && id !== "VP8 " && id !== "VP8L" && id !== "VP8X") throw new ScanRejected("corrupt");
    chunks.push({ id, start: pos, end: Math.min(end, riffEnd) });
    pos = end;
  }
  if (chunks.length === 0) throw new ScanRejected("corrupt");
  checkTrailing(bytes, riffEnd);
  return { chunks };
}

function stripWebp(bytes: Uint8Array, chunks: WebpChunk[]): Buffer {
  const parts: Array<Range | Uint8Array> = [];
  for (const chunk of chunks) {
    if (!WEBP_KEPT.has(chunk.id)) continue;
    if (chunk.id === "VP8X") {
      const copy = Buffer.from(bytes.subarray(chunk.start, chunk.end));
      copy[8] &= ~(VP8X_EXIF | VP8X_XMP);
      parts.push(copy);
    } else parts.push(chunk);
  }
  const body = concat(bytes, parts);
  const header = Buffer.alloc(12);
  header.write("RIFF", 0, "latin1");
  header.writeUInt32LE(body.length + 4, 4);
  header.write("WEBP", 8, "latin1");
  return Buffer.concat([header, body]);
}

// ---------------------------------------------------------------- entry points

export interface ContainerCheck {
  type: ScanType;
  /** Declared size from the header, when the walk reads it (PNG IHDR, JPEG SOF); 0 when unknown. */
  widthPx: number;
  heightPx: number;
  /** WebP only: the image is VP8L (lossless). */
  lossless: boolean;
  /** Returns the same image without metadata; null when that needs re-encoding (TIFF). */
  strip(dpi: number | null): Buffer | null;
}

/**
 * Walks the container of a PNG, JPEG or WebP file without decoding pixels; throws ScanRejected
 * ("truncated", "trailingData", "corrupt"). TIFF has no defined end, so only the decoder checks it.
 */
export function checkContainer(type: ScanType, bytes: Uint8Array): ContainerCheck {
  switch (type) {
    case "png": {
      const { chunks, widthPx, heightPx } = walkPng(bytes);
      return { type, widthPx, heightPx, lossless: true, strip: (dpi) => stripPng(bytes, chunks, dpi) };
    }
    case "jpeg": {
      const { segments, widthPx, heightPx } = walkJpeg(bytes);
      return { type, widthPx, heightPx, lossless: false, strip: (dpi) => stripJpeg(bytes, segments, dpi) };
    }
    case "webp": {
      const { chunks } = walkWebp(bytes);
      const lossless = chunks.some((c) => c.id === "VP8L") && !chunks.some((c) => c.id === "VP8 ");
      return { type, widthPx: 0, heightPx: 0, lossless, strip: () => stripWebp(bytes, chunks) };
    }
    case "tiff":
      return { type, widthPx: 0, heightPx: 0, lossless: true, strip: () => null };
  }
}
