import { createHash } from "node:crypto";
import { crc32 } from "node:zlib";
import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import {
  createScanLimiter,
  decodeGreyRaster,
  detectType,
  encodeGreyRaster,
  hamming,
  processScan,
  ScanRejected,
  type ProcessedScan,
  type ScanStage,
} from "@/lib/scans";
import { decodeGrey, decodeRgb } from "@/tests/helpers/scan-images";
import { seededNoisePng } from "../../helpers/scan-images";

const limits = { maxBytes: 20_000_000, maxPixels: 20_000_000 };

function pngChunk(type: string, data: Buffer): Buffer {
  const out = Buffer.alloc(12 + data.length);
  out.writeUInt32BE(data.length, 0);
  out.write(type, 4, "latin1");
  data.copy(out, 8);
  out.writeUInt32BE(crc32(out.subarray(4, 8 + data.length)), 8 + data.length);
  return out;
}

function pngChunkTypes(png: Buffer): string[] {
  const types: string[] = [];
  for (let pos = 8; pos < png.length; pos += 12 + png.readUInt32BE(pos)) types.push(png.toString("latin1", pos + 4, pos + 8));
  return types;
}

/** Inserts chunks right after IHDR (which ends at byte 33). */
const withChunks = (png: Buffer, ...chunks: Buffer[]) => Buffer.concat([png.subarray(0, 33), ...chunks, png.subarray(33)]);

const picture = () =>
  seededNoisePng(320, 200, { mean: 140, sigma: 50 }).then((b) => sharp(b));

const contains = (haystack: Buffer, needle: string) => haystack.includes(Buffer.from(needle, "latin1"));

describe("processScan on sound files", () => {
  let png600: Buffer;
  let scan: ProcessedScan;

  beforeAll(async () => {
    const base = await (await picture()).png().withDensity(600).toBuffer();
    png600 = withChunks(
      base,
      pngChunk("tEXt", Buffer.from("Author\0Someone Private", "latin1")),
      pngChunk("tIME", Buffer.from([0x07, 0xea, 1, 2, 3, 4, 5])),
      pngChunk("prVt", Buffer.from("private data")),
    );
    scan = await processScan(png600, limits);
  });

  it("measures the picture and reads the DPI from the file", () => {
    expect(scan).toMatchObject({ type: "png", contentType: "image/png", extension: "png", widthPx: 320, heightPx: 200, dpi: 600, dpiSource: "file", fileDpi: 600 });
    // 320 px / 600 DPI × 25.4 mm (NIST SP 811: 1 in = 25.4 mm).
    expect(scan.sizeMm!.widthMm).toBeCloseTo(13.546667, 6);
    expect(scan.sizeMm!.heightMm).toBeCloseTo(8.466667, 6);
    expect(scan.sizeBytes).toBe(png600.length);
  });

  it("the SHA-256 is that of the uploaded bytes (node:crypto's createHash as the reference)", () => {
    expect(scan.sha256).toBe(createHash("sha256").update(png600).digest("hex"));
  });

  it("stores the original without text, time or private chunks, pixels untouched, density kept", async () => {
    expect(scan.original.reencoded).toBe(false);
    expect(pngChunkTypes(png600)).toEqual(expect.arrayContaining(["tEXt", "tIME", "prVt", "eXIf"]));
    const kept = pngChunkTypes(scan.original.bytes);
    expect(kept).not.toEqual(expect.arrayContaining(["tEXt"]));
    for (const t of ["tEXt", "tIME", "prVt", "eXIf"]) expect(kept).not.toContain(t);
    expect(kept).toContain("pHYs");
    expect(contains(scan.original.bytes, "Someone Private")).toBe(false);
    expect(await decodeRgb(scan.original.bytes)).toEqual(await decodeRgb(png600));
    expect((await sharp(scan.original.bytes).metadata()).density).toBeCloseTo(600, 1);
  });

  it("makes WebP thumbnails 256 and 1024 px on the long side, never enlarged", () => {
    expect(scan.thumbnails.map((t) => [t.longSidePx, t.widthPx, t.heightPx])).toEqual([
      [256, 256, 160],
      [1024, 320, 200],
    ]);
    for (const t of scan.thumbnails) expect(detectType(t.bytes)).toBe("webp");
  });

  it("keeps a grey analysis raster with the size of one pixel in mm", () => {
    expect(scan.analysis).toMatchObject({ widthPx: 320, heightPx: 200 });
    expect(scan.analysis.data.length).toBe(320 * 200);
    expect(scan.analysis.mmPerPx).toBeCloseTo(25.4 / 600, 12);
  });

  it("the same bytes again give the same digest; the same picture re-encoded does not, but hashes alike", async () => {
    const again = await processScan(Buffer.from(png600), limits);
    expect(again.sha256).toBe(scan.sha256);
    const reencoded = await processScan(await sharp(png600).png({ compressionLevel: 9 }).toBuffer(), limits);
    expect(reencoded.sha256).not.toBe(scan.sha256);
    expect(hamming(reencoded.hashes.hash, scan.hashes.hash)).toBe(0);
  });

  it("reports each step's time", async () => {
    const stages: ScanStage[] = [];
    await processScan(png600, { ...limits, onStage: (stage, ms) => (expect(ms).toBeGreaterThanOrEqual(0), stages.push(stage)) });
    expect(new Set(stages)).toEqual(new Set(["check", "decode", "sha256", "original", "thumbnails", "phash", "coverage", "signature"]));
  });
});

describe("metadata and DPI across formats", () => {
  it("JPEG: EXIF and comments dropped without re-encoding; density kept", async () => {
    const jpeg = await (await picture()).jpeg({ quality: 90 }).withExif({ IFD0: { Artist: "Someone Private", Copyright: "Nobody" } }).withDensity(300).toBuffer();
    expect(contains(jpeg, "Someone Private")).toBe(true);
    const scan = await processScan(jpeg, limits);
    expect(scan).toMatchObject({ type: "jpeg", dpi: 300, dpiSource: "file", fileDpiLikelyDefault: false });
    expect(scan.original.reencoded).toBe(false);
    expect(contains(scan.original.bytes, "Exif\0")).toBe(false);
    expect(contains(scan.original.bytes, "Someone Private")).toBe(false);
    expect(contains(scan.original.bytes, "JFIF\0")).toBe(true);
    expect(await decodeRgb(scan.original.bytes)).toEqual(await decodeRgb(jpeg));
    expect((await sharp(scan.original.bytes).metadata()).density).toBe(300);
  });

  it("JPEG turned by its orientation tag: measured upright and stored upright", async () => {
    const jpeg = await (await picture()).jpeg().withMetadata({ orientation: 6 }).toBuffer();
    expect((await sharp(jpeg).metadata()).orientation).toBe(6);
    const scan = await processScan(jpeg, limits);
    expect([scan.widthPx, scan.heightPx]).toEqual([200, 320]);
    expect(scan.original.reencoded).toBe(true);
    const stored = await sharp(scan.original.bytes).metadata();
    expect([stored.width, stored.height, stored.orientation ?? 1]).toEqual([200, 320, 1]);
    expect([scan.analysis.widthPx, scan.analysis.heightPx]).toEqual([200, 320]);
  });

  it("JPEG written with a screen default of 72 DPI is flagged", async () => {
    const scan = await processScan(await (await picture()).jpeg().toBuffer(), limits);
    expect(scan.fileDpi).toBe(72);
    expect(scan.fileDpiLikelyDefault).toBe(true);
  });

  it("TIFF: re-encoded losslessly with its density", async () => {
    const tiff = await (await picture()).tiff({ compression: "none", xres: 400 / 25.4, yres: 400 / 25.4, resolutionUnit: "inch" }).toBuffer();
    const scan = await processScan(tiff, limits);
    expect(scan).toMatchObject({ type: "tiff", dpi: 400 });
    expect(scan.original.reencoded).toBe(true);
    expect(detectType(scan.original.bytes)).toBe("tiff");
    expect((await sharp(scan.original.bytes).metadata()).density).toBeCloseTo(400, 6);
    expect(await decodeRgb(scan.original.bytes)).toEqual(await decodeRgb(tiff));
  });

  it("WebP: EXIF and XMP chunks dropped and their flags cleared", async () => {
    const webp = await (await picture()).webp({ quality: 90 }).withExif({ IFD0: { Artist: "Someone Private" } }).withXmp('<x:xmpmeta xmlns:x="adobe:ns:meta/"><note>secret</note></x:xmpmeta>').toBuffer();
    expect(contains(webp, "EXIF")).toBe(true);
    const scan = await processScan(webp, limits);
    expect(scan.original.reencoded).toBe(false);
    expect(contains(scan.original.bytes, "Someone Private")).toBe(false);
    expect(contains(scan.original.bytes, "secret")).toBe(false);
    const meta = await sharp(scan.original.bytes).metadata();
    expect(meta.exif).toBeUndefined();
    expect(meta.xmp).toBeUndefined();
    expect(await decodeRgb(scan.original.bytes)).toEqual(await decodeRgb(webp));
  });

  it("the keeper's DPI wins and is written into the stored file", async () => {
    const png = await (await picture()).png().toBuffer();
    const plain = await processScan(png, limits);
    expect(plain).toMatchObject({ dpi: null, dpiSource: null, fileDpi: null, sizeMm: null });
    expect(plain.analysis.mmPerPx).toBeNull();
    const scan = await processScan(png, { ...limits, dpiOverride: 300 });
    expect(scan).toMatchObject({ dpi: 300, dpiSource: "keeper" });
    expect(scan.sizeMm!.widthMm).toBeCloseTo((320 / 300) * 25.4, 10);
    expect((await sharp(scan.original.bytes).metadata()).density).toBeCloseTo(300, 1);
    await expect(processScan(png, { ...limits, dpiOverride: 0 })).rejects.toThrow(RangeError);
  });

  it("16-bit PNG with transparency: flattened onto the ground the polarity implies", async () => {
    const disc = (fill: string) => Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg" width="200" height="200"><circle cx="100" cy="100" r="50" fill="${fill}"/></svg>`);
    const darkDisc = await sharp(disc("#222")).toColourspace("rgb16").png().toBuffer();
    const lightDisc = await sharp(disc("#eee")).toColourspace("rgb16").png().toBuffer();
    expect((await sharp(darkDisc).metadata())).toMatchObject({ depth: "ushort", hasAlpha: true });
    // The disc covers π·50² / 200² = π/16 = 0.19635 of the square (grid error about ±0.005 here).
    expect((await processScan(darkDisc, limits)).coverage.ratio).toBeCloseTo(Math.PI / 16, 2);
    // A light disc read as light-on-dark: the transparent ground must become dark, or it would count as wax.
    expect((await processScan(lightDisc, { ...limits, polarity: "lightIsWax" })).coverage.ratio).toBeCloseTo(Math.PI / 16, 2);
  });
});

describe("analysis raster round trip", () => {
  it("encodes losslessly as grey PNG and decodes back", async () => {
    const raster = await decodeGrey(await (await picture()).png().toBuffer());
    const png = await encodeGreyRaster(raster);
    expect((await sharp(png).metadata()).channels).toBe(1);
    const back = await decodeGreyRaster(png, { maxPixels: 1_000_000 });
    expect(back.widthPx).toBe(raster.widthPx);
    expect(Buffer.from(back.data).equals(Buffer.from(raster.data))).toBe(true);
  });

  it("decodeGreyRaster refuses what processScan refuses", async () => {
    await expect(decodeGreyRaster(Buffer.from("<svg/>"), { maxPixels: 100 })).rejects.toMatchObject({ code: "svgRefused" });
    const big = await (await picture()).png().toBuffer();
    await expect(decodeGreyRaster(big, { maxPixels: 1000 })).rejects.toMatchObject({ code: "tooManyPixels" });
  });
});

describe("scan limiter", () => {
  it("runs at most `concurrency` at once and refuses beyond the queue", async () => {
    const limiter = createScanLimiter({ concurrency: 1, maxQueued: 1 });
    let running = 0;
    let most = 0;
    const releases: Array<() => void> = [];
    const task = () =>
      new Promise<string>((resolve) => {
        running++;
        most = Math.max(most, running);
        releases.push(() => {
          running--;
          resolve("done");
        });
      });
    const first = limiter.run(task);
    const second = limiter.run(task);
    await expect(limiter.run(task)).rejects.toMatchObject({ code: "busy", params: { maxQueued: 1 } });
    expect([limiter.active, limiter.queued]).toEqual([1, 1]);
    await new Promise((r) => setTimeout(r, 10));
    releases.shift()!();
    await expect(first).resolves.toBe("done");
    await new Promise((r) => setTimeout(r, 10));
    releases.shift()!();
    await expect(second).resolves.toBe("done");
    expect(most).toBe(1);
    expect(limiter.run(async () => 1)).toBeInstanceOf(Promise);
  });

  it("busy is a ScanRejected", async () => {
    const limiter = createScanLimiter({ concurrency: 1, maxQueued: 0 });
    const hold = limiter.run(() => new Promise((r) => setTimeout(r, 20)));
    await expect(limiter.run(async () => 1)).rejects.toBeInstanceOf(ScanRejected);
    await hold;
  });
});
