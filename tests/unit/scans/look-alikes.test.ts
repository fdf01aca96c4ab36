import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import { motifFamilies, motifSvg, renderScan, type MotifFamily, type ScanStyle } from "@/scripts/seed/scan-art";
import { defaultScanLimits, hamming, LOOK_ALIKE_MAX_BITS, MIRROR_TWIN_MARGIN_BITS, nearest, processScan, type MotifHashes } from "@/lib/scans";

// "Stamps that look like this one" against the invented demo art (db/seed/scan-art.ts), through the same
// pipeline as an upload. Unrelated 64-bit perceptual hashes differ in about half their bits: 32 ± 4 for
// independent bits (binomial 64 × ½, sd = √(64/4) = 4), the "random pair" figure of the DCT-hash literature
// (from memory). A look-alike must be clearly closer than that.

const limits = { ...defaultScanLimits, fileName: "scan.png" };
const options = { maxDistance: LOOK_ALIKE_MAX_BITS, mirrorMarginBits: MIRROR_TWIN_MARGIN_BITS };

async function hashes(bytes: Buffer, style: ScanStyle): Promise<MotifHashes> {
  return (await processScan(bytes, { ...limits, polarity: style === "print" ? "darkIsWax" : "lightIsWax" })).hashes;
}

const svg = (family: MotifFamily, seed: number, style: ScanStyle) => motifSvg({ seed, family, style, widthMm: 150, heightMm: 150 });
const render = (family: MotifFamily, seed: number, style: ScanStyle, dpi = 60) => renderScan(svg(family, seed, style), dpi, { format: style === "print" ? "png" : "jpeg" });

interface Art {
  label: string;
  family: MotifFamily;
  style: ScanStyle;
  hashes: MotifHashes;
}

let art: Art[] = [];

beforeAll(async () => {
  const list: Art[] = [];
  for (const family of motifFamilies)
    for (const seed of [1, 2])
      for (const style of ["print", "face"] as const) list.push({ label: `${family}/${seed}/${style}`, family, style, hashes: await hashes(await render(family, seed, style), style) });
  art = list;
}, 120_000);

describe("look-alikes among the demo art", () => {
  it("leave out every motif of another family, prints and face photos alike (a lotus photo is no four-petal drawing)", () => {
    const tooClose: string[] = [];
    for (const a of art)
      for (const b of art) {
        if (a.family === b.family) continue;
        const found = nearest(a.hashes, [{ id: b.label, hash: b.hashes.hash }], 1, options);
        if (found.length) tooClose.push(`${a.label} ~ ${b.label}: ${found[0].distance}`);
      }
    expect(tooClose).toEqual([]);
    // The nearest of those pairs is still well away from the cut-off, not just past it.
    const closest = Math.min(...art.flatMap((a) => art.filter((b) => b.family !== a.family).map((b) => Math.min(hamming(a.hashes.hash, b.hashes.hash), hamming(a.hashes.mirroredHash, b.hashes.hash)))));
    expect(closest).toBeGreaterThanOrEqual(LOOK_ALIKE_MAX_BITS + 4);
  });

  it.each(["lotus", "vine", "bands"] as const)("find the same %s motif scanned again at another DPI, smaller and as JPEG, as itself", async (family) => {
    const base = art.find((a) => a.label === `${family}/1/print`)!.hashes;
    const again = await hashes(await renderScan(svg(family, 1, "print"), 150, { grain: 0.7, format: "jpeg" }), "print");
    const smaller = await hashes(await sharp(await render(family, 1, "print", 100)).resize({ width: 300 }).jpeg({ quality: 60 }).toBuffer(), "print");
    const found = nearest(base, [{ id: "again", hash: again.hash }, { id: "smaller", hash: smaller.hash }], 2, options);
    expect(found.map((m) => [m.id, m.orientation]).sort()).toEqual([
      ["again", "same"],
      ["smaller", "same"],
    ]);
    for (const m of found) expect(m.distance).toBeLessThanOrEqual(LOOK_ALIKE_MAX_BITS - 4);
  }, 30_000);

  it.each(["lotus", "vine", "bands"] as const)("call the mirrored %s motif (a back-face twin) a mirror twin", async (family) => {
    const base = art.find((a) => a.label === `${family}/2/print`)!.hashes;
    const twin = await hashes(await sharp(await render(family, 2, "print")).flop().png().toBuffer(), "print");
    expect(nearest(base, [{ id: "twin", hash: twin.hash }], 1, options)).toEqual([{ id: "twin", distance: expect.any(Number), orientation: "mirrored" }]);
    expect(hamming(base.hash, twin.hash) - hamming(base.mirroredHash, twin.hash)).toBeGreaterThanOrEqual(MIRROR_TWIN_MARGIN_BITS * 2);
  }, 30_000);
});

describe("the mirror-twin rule, on hand-made hashes", () => {
  const target = { hash: "0000000000000000", mirroredHash: "00000000000000ff" };
  it("needs the mirrored comparison clearly closer than the straight one", () => {
    // 5 bits straight, 3 mirrored: close both ways, as a symmetric motif is: the same picture, no twin.
    const symmetric = { id: "symmetric", hash: "000000000000001f" };
    // 8 bits straight, 0 mirrored: only the mirror image matches.
    const twin = { id: "twin", hash: "00000000000000ff" };
    expect(nearest(target, [symmetric, twin], 2, options)).toEqual([
      { id: "twin", distance: 0, orientation: "mirrored" },
      { id: "symmetric", distance: 3, orientation: "same" },
    ]);
  });
  it("drops matches no closer than chance allows", () => {
    const far = { id: "far", hash: "0000000000001fff" }; // 13 straight, 5 mirrored → found, mirrored
    const chance = { id: "chance", hash: "00000000ffffffff" }; // 32 straight, 24 mirrored
    expect(nearest(target, [far, chance], 2, options)).toEqual([{ id: "far", distance: 5, orientation: "mirrored" }]);
  });
});
