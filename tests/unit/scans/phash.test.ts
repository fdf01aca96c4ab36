import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import { dctHash, hamming, motifHashes, nearest, type MotifHashes } from "@/lib/scans";
import { dct2d } from "@/lib/scans/phash";
import { motifSvg, renderScan } from "@/scripts/seed/scan-art";
import { decodeGrey } from "@/tests/helpers/scan-images";

const hashesOf = async (bytes: Buffer) => motifHashes(await decodeGrey(bytes));

describe("DCT and Hamming distance", () => {
  it("the DCT-II matches the textbook double sum (Ahmed, Natarajan & Rao, IEEE Trans. Computers C-23, 1974)", () => {
    const n = 32;
    const pixels = Array.from({ length: n * n }, (_, i) => (i * 7919) % 251);
    const fast = dct2d(pixels, 9);
    for (const [v, u] of [
      [0, 0],
      [1, 2],
      [8, 8],
      [5, 0],
    ]) {
      let direct = 0;
      for (let y = 0; y < n; y++)
        for (let x = 0; x < n; x++) direct += pixels[y * n + x] * Math.cos(((2 * x + 1) * u * Math.PI) / (2 * n)) * Math.cos(((2 * y + 1) * v * Math.PI) / (2 * n));
      expect(fast[v * 9 + u]).toBeCloseTo(direct, 6);
    }
  });

  it("bits follow the sign of each frequency's amplitude, row-major, most significant first", () => {
    // A block built from the 64 cosines themselves (u, v = 1…8): by orthogonality its DCT coefficient (v, u) is
    // proportional to that cosine's amplitude, so with amplitudes +1 for v ≤ 4 and −1 for v > 4 the median is 0
    // and exactly the first 32 bits are set.
    const n = 32;
    const amplitude = (v: number, u: number) => (v <= 4 ? 1 : -1) * (1 + u / 100);
    const block = new Float64Array(n * n).fill(128);
    for (let v = 1; v <= 8; v++)
      for (let u = 1; u <= 8; u++)
        for (let y = 0; y < n; y++)
          for (let x = 0; x < n; x++) block[y * n + x] += amplitude(v, u) * Math.cos(((2 * x + 1) * u * Math.PI) / (2 * n)) * Math.cos(((2 * y + 1) * v * Math.PI) / (2 * n));
    expect(dctHash(block)).toBe("ffffffff00000000");
    const swapped = block.map((p) => 256 - p);
    expect(dctHash(swapped)).toBe("00000000ffffffff");
  });

  it("counts differing bits", () => {
    expect(hamming("0000000000000000", "ffffffffffffffff")).toBe(64);
    expect(hamming("8000000000000001", "0000000000000000")).toBe(2);
    expect(hamming("0123456789abcdef", "0123456789ABCDEF")).toBe(0);
    expect(hamming("f0f0f0f0f0f0f0f0", "0f0f0f0f0f0f0f0f")).toBe(64);
    expect(() => hamming("xyz", "0000000000000000")).toThrow(RangeError);
  });
});

// For 64-bit DCT hashes, ≤ 10 differing bits as "the same picture" is common practice; unrelated pictures
// differ in about half their bits: two independent hashes of fair bits are 32 apart on average (binomial,
// n = 64, p = ½; standard deviation 4).
describe("perceptual hashes of motif scans", () => {
  let original: Buffer;
  let hashes: MotifHashes;

  beforeAll(async () => {
    original = await renderScan(motifSvg({ seed: 5, widthMm: 200, heightMm: 200, family: "vine" }), 150);
    hashes = await hashesOf(original);
  });

  it("gives 16 hex digits", () => {
    expect(hashes.hash).toMatch(/^[0-9a-f]{16}$/);
    expect(hashes.mirroredHash).toMatch(/^[0-9a-f]{16}$/);
  });

  it("the same motif scanned smaller and saved as JPEG stays close", async () => {
    const smaller = await sharp(original).resize({ width: 700 }).jpeg({ quality: 70 }).toBuffer();
    expect(hamming(hashes.hash, (await hashesOf(smaller)).hash)).toBeLessThanOrEqual(6);
  });

  it("the same motif at another DPI with other grain stays close", async () => {
    const again = await renderScan(motifSvg({ seed: 5, widthMm: 200, heightMm: 200, family: "vine" }), 300, { grain: 0.7, format: "jpeg" });
    expect(hamming(hashes.hash, (await hashesOf(again)).hash)).toBeLessThanOrEqual(6);
  });

  it("other motifs are far", async () => {
    for (const [seed, family] of [
      [5, "lotus"],
      [6, "stars"],
      [7, "bands"],
      [8, "petals"],
    ] as const) {
      const other = await renderScan(motifSvg({ seed, widthMm: 200, heightMm: 200, family }), 150);
      const h = await hashesOf(other);
      expect(hamming(hashes.hash, h.hash)).toBeGreaterThanOrEqual(18);
      expect(hamming(hashes.mirroredHash, h.hash)).toBeGreaterThanOrEqual(18);
    }
  });

  it("a mirrored copy (the back-face twin) matches through mirroredHash, not through hash", async () => {
    const twin = await sharp(original).flop().png().toBuffer();
    const h = await hashesOf(twin);
    expect(hamming(hashes.mirroredHash, h.hash)).toBeLessThanOrEqual(2);
    expect(hamming(hashes.hash, h.hash)).toBeGreaterThanOrEqual(16);
    expect(hamming(h.mirroredHash, hashes.hash)).toBeLessThanOrEqual(2);
  });

  it("nearest ranks copies first and says which ones are mirror twins", async () => {
    const candidates = [
      { id: "other-lotus", hash: (await hashesOf(await renderScan(motifSvg({ seed: 5, widthMm: 200, heightMm: 200, family: "lotus" }), 100))).hash },
      { id: "twin", hash: (await hashesOf(await sharp(original).flop().jpeg({ quality: 80 }).toBuffer())).hash },
      { id: "copy", hash: (await hashesOf(await sharp(original).resize({ width: 500 }).png().toBuffer())).hash },
      { id: "other-stars", hash: (await hashesOf(await renderScan(motifSvg({ seed: 6, widthMm: 200, heightMm: 200, family: "stars" }), 100))).hash },
    ];
    const found = nearest(hashes, candidates, 3);
    expect(found.slice(0, 2).map((m) => [m.id, m.orientation]).sort()).toEqual([
      ["copy", "same"],
      ["twin", "mirrored"],
    ]);
    expect(found[2].id).toMatch(/^other-/);
    expect(found[0].distance).toBeLessThanOrEqual(6);
    expect(found[1].distance).toBeLessThanOrEqual(6);
    expect(found[2].distance).toBeGreaterThanOrEqual(18);
    expect(nearest(hashes, candidates, 5, { maxDistance: 10 }).map((m) => m.id).sort()).toEqual(["copy", "twin"]);
  });

});

describe("nearest, on hand-made hashes", () => {
  const target = { hash: "00000000000000ff", mirroredHash: "ff00000000000000" };
  it("orders by distance, ties by candidate order, and reports the better orientation", () => {
    const matches = nearest(
      target,
      [
        { id: 1, hash: "00000000000000fe" }, // 1 bit from hash
        { id: 2, hash: "fe00000000000000" }, // 1 bit from the mirror
        { id: 3, hash: "0000000000000000" }, // 8 from either
        { id: 4, hash: "00000000000000ff" }, // equal
      ],
      3,
    );
    expect(matches).toEqual([
      { id: 4, distance: 0, orientation: "same" },
      { id: 1, distance: 1, orientation: "same" },
      { id: 2, distance: 1, orientation: "mirrored" },
    ]);
    expect(nearest(target, [], 3)).toEqual([]);
    expect(nearest(target, [{ id: 1, hash: "0000000000000000" }], 0)).toEqual([]);
  });
});
