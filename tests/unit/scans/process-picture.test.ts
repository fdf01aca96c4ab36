import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { processPicture, ScanRejected, type ScanRejectedCode } from "@/lib/scans";
import { hostileFiles, hostileLimits } from "@/tests/helpers/hostile-files";

// processPicture: the picture store's check (sketches, finding photos). The same refusals as a scan, from the same
// checks, except that it takes no TIFF; the original loses its metadata; one WebP thumbnail.
const files = await hostileFiles();

async function refusal(bytes: Buffer, name: string): Promise<ScanRejected> {
  try {
    await processPicture(bytes, { ...hostileLimits, fileName: name });
  } catch (error) {
    if (error instanceof ScanRejected) return error;
    throw new Error(`expected ScanRejected, got ${String(error)}`);
  }
  throw new Error("the file was accepted");
}

const drawing = `<svg xmlns="http://www.w3.org/2000/svg" width="1200" height="800"><rect width="1200" height="800" fill="#f6f1e7"/><circle cx="600" cy="400" r="300" fill="#3b2a1a"/></svg>`;

describe("processPicture", () => {
  it.each(files.map((f) => [f.label, f] as const))("refuses %s as a scan would (a TIFF as unsupported)", async (_, file) => {
    const expected: ScanRejectedCode = file.claimedType === "image/tiff" ? "unsupportedType" : file.expected;
    const error = await refusal(file.bytes, file.name);
    if (expected === "truncated" || expected === "corrupt") expect(["truncated", "corrupt"]).toContain(error.code);
    else expect(error.code).toBe(expected);
  });

  it("refuses a sound TIFF as unsupported", async () => {
    const tiff = await sharp(Buffer.from(drawing)).tiff().toBuffer();
    expect((await refusal(tiff, "drawing.tif")).code).toBe("unsupportedType");
  });

  it("keeps a JPEG's pixels without its EXIF and makes a WebP thumbnail at most 512 px on its long side", async () => {
    const jpeg = await sharp(Buffer.from(drawing))
      .jpeg({ quality: 90 })
      .withMetadata({ exif: { IFD0: { Artist: "Nobody Real", Copyright: "hidden workshop" } } })
      .toBuffer();
    expect((await sharp(jpeg).metadata()).exif).toBeDefined();
    const picture = await processPicture(jpeg, { ...hostileLimits, fileName: "photo.jpg" });
    expect(picture).toMatchObject({ type: "jpeg", contentType: "image/jpeg", widthPx: 1200, heightPx: 800 });
    const meta = await sharp(picture.original.bytes).metadata();
    expect(meta.exif).toBeUndefined();
    expect(picture.original.bytes.includes(Buffer.from("hidden workshop"))).toBe(false);
    expect([meta.width, meta.height]).toEqual([1200, 800]);
    // 1200 × 800 inside 512 × 512: 512 × 341.33 → 512 × 341 (fit "inside" keeps the proportion).
    expect(picture.thumb).toMatchObject({ contentType: "image/webp", widthPx: 512, heightPx: 341 });
    expect((await sharp(picture.thumb.bytes).metadata()).format).toBe("webp");
  });

  it("turns a photo upright by its orientation tag before dropping the tag", async () => {
    const tagged = await sharp(Buffer.from(drawing)).jpeg().withMetadata({ orientation: 6 }).toBuffer();
    const picture = await processPicture(tagged, hostileLimits);
    // Orientation 6 turns the 1200 × 800 pixels a quarter: shown 800 × 1200 (EXIF 2.3, "Orientation").
    expect([picture.widthPx, picture.heightPx]).toEqual([800, 1200]);
    expect(picture.original.reencoded).toBe(true);
    const meta = await sharp(picture.original.bytes).metadata();
    expect([meta.width, meta.height, meta.orientation ?? 1]).toEqual([800, 1200, 1]);
  });
});
