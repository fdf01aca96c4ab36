import { Image, computeThreshold } from "image-js";
import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { greyHistogram, otsuThreshold, type GreyRaster } from "@/lib/scans";
import { motifSvg, renderScan } from "@/scripts/seed/scan-art";
import { decodeGrey, seededNoisePng } from "@/tests/helpers/scan-images";

/** σ_B²(k) written out from Otsu's definitions with floating point, independently of lib/scans. */
function betweenClassVariance(histogram: ArrayLike<number>, k: number): number {
  let n = 0;
  let sum = 0;
  for (let i = 0; i < histogram.length; i++) {
    n += histogram[i];
    sum += i * histogram[i];
  }
  let w0 = 0;
  let s0 = 0;
  for (let i = 0; i <= k; i++) {
    w0 += histogram[i];
    s0 += i * histogram[i];
  }
  const w1 = n - w0;
  if (w0 === 0 || w1 === 0) return 0;
  const mu0 = s0 / w0;
  const mu1 = (sum - s0) / w1;
  return (w0 / n) * (w1 / n) * (mu0 - mu1) ** 2;
}

// Otsu's method: N. Otsu, "A threshold selection method from gray-level histograms",
// IEEE Trans. Systems, Man, and Cybernetics 9(1):62–66, 1979. Levels ≤ k form class C0, levels > k class C1.
describe("Otsu's threshold on a worked example", () => {
  // Six grey levels, 36 pixels: h = [8, 7, 2, 6, 9, 4]; Σ i·h_i = 85. Worked by hand with
  // σ_B²(k) = (N·S_k − S_T·W_k)² / (N²·W_k·(N − W_k)):
  //   k=0: W=8,  S=0  → 7225/4536     = 1.59281
  //   k=1: W=15, S=7  → 116281/45360  = 2.56351
  //   k=2: W=17, S=11 → 1100401/418608 = 2.62871  ← maximum
  //   k=3: W=23, S=29 → 829921/387504 = 2.14171
  //   k=4: W=32, S=65 → 9025/10368    = 0.87047
  // (The same histogram is a widely used tutorial example, where the answer is given as "threshold 3" in the
  // convention C0 = levels < 3 — from memory.)
  const histogram = [8, 7, 2, 6, 9, 4];

  it("picks k = 2 with σ_B² = 1100401/418608", () => {
    const result = otsuThreshold(histogram);
    expect(result.threshold).toBe(2);
    expect(result.betweenClassVariance).toBeCloseTo(1100401 / 418608, 12);
  });

  it("the hand-worked variances agree with the definition written out separately", () => {
    const byHand = [7225 / 4536, 116281 / 45360, 1100401 / 418608, 829921 / 387504, 9025 / 10368];
    byHand.forEach((value, k) => expect(betweenClassVariance(histogram, k)).toBeCloseTo(value, 12));
  });

  it("two spikes with empty levels between: every cut between them ties, the middle one is taken", () => {
    const h = new Array(256).fill(0);
    h[40] = 500;
    h[200] = 300;
    // Any k in 40…199 gives the same classes; the middle of the 160 tied cuts is 40 + 79 = 119.
    expect(otsuThreshold(h).threshold).toBe(119);
  });

  it("a single occupied level has nothing to split", () => {
    const dark = new Array(256).fill(0);
    dark[10] = 99;
    const light = new Array(256).fill(0);
    light[230] = 99;
    expect(otsuThreshold(dark).threshold).toBe(10);
    expect(otsuThreshold(light).threshold).toBe(229);
    expect(otsuThreshold(new Array(256).fill(0)).threshold).toBe(0);
  });

  it("counts large images exactly (no overflow at 8000 × 8000)", () => {
    const h = new Array(256).fill(0);
    h[30] = 40_000_000;
    h[31] = 1;
    h[220] = 24_000_000 - 1;
    expect(otsuThreshold(h).threshold).toBeGreaterThanOrEqual(31);
    expect(otsuThreshold(h).threshold).toBeLessThan(220);
  });
});

function toImageJs(raster: GreyRaster): Image {
  return new Image(raster.widthPx, raster.heightPx, { data: Uint8Array.from(raster.data), colorModel: "GREY" });
}

/** Grey test pictures whose histograms have no empty stretch, so the maximum is unique. */
async function crossCheckImages(): Promise<Array<[string, GreyRaster]>> {
  const out: Array<[string, GreyRaster]> = [];
  for (const [seed, style] of [
    [3, "print"],
    [8, "face"],
    [21, "print"],
  ] as const) {
    out.push([`motif ${seed} (${style}) with grain`, await decodeGrey(await renderScan(motifSvg({ seed, widthMm: 120, heightMm: 90, style }), 100, { grain: 0.6 }))]);
  }
  const noise = await sharp(await seededNoisePng(300, 200, { mean: 90, sigma: 35 }))
    .composite([{ input: Buffer.from(`<svg width="300" height="200"><circle cx="150" cy="100" r="70" fill="#eee"/></svg>`), blend: "soft-light" }])
    .png()
    .toBuffer();
  out.push(["Gaussian noise under a light disc", await decodeGrey(noise)]);
  const ramp = Buffer.alloc(256 * 64);
  for (let y = 0; y < 64; y++) for (let x = 0; x < 256; x++) ramp[y * 256 + x] = Math.round(255 * (x / 255) ** 2.2);
  out.push(["a gamma ramp", { data: ramp, widthPx: 256, heightPx: 64 }]);
  return out;
}

// Independent general-purpose implementation: image-js 1.7.0 (npm), computeThreshold(image, { algorithm: "otsu" }).
describe("Otsu's threshold against image-js", () => {
  it("agrees on generated images", async () => {
    const images = await crossCheckImages();
    for (const [label, raster] of images) {
      const ours = otsuThreshold(greyHistogram(raster));
      const theirs = computeThreshold(toImageJs(raster), { algorithm: "otsu" });
      expect({ label, threshold: ours.threshold }).toEqual({ label, threshold: theirs });
      expect(ours.betweenClassVariance).toBeCloseTo(betweenClassVariance(greyHistogram(raster), theirs), 9);
    }
  });

  it("on a tie image-js takes the last tied cut, we take the middle; both have the same σ_B²", () => {
    const data = new Uint8Array(100).map((_, i) => (i < 40 ? 30 : 200));
    const raster = { data, widthPx: 10, heightPx: 10 };
    const theirs = computeThreshold(toImageJs(raster), { algorithm: "otsu" });
    const ours = otsuThreshold(greyHistogram(raster));
    expect(theirs).toBe(199);
    expect(ours.threshold).toBe(114);
    expect(betweenClassVariance(greyHistogram(raster), theirs)).toBeCloseTo(ours.betweenClassVariance, 9);
  });
});
