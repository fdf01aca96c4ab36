import sharp from "sharp";
import { clampRect, greyHistogram, otsuThreshold, type GreyRaster, type PixelRect } from "./otsu";

/** Which pixels are wax: dark on light (a wax print on white cloth) or light on dark (a photo of the copper face). */
export type WaxPolarity = "darkIsWax" | "lightIsWax";

export const waxPolarities: readonly WaxPolarity[] = ["darkIsWax", "lightIsWax"];

export interface CoverageOptions {
  polarity: WaxPolarity;
  /** Grey level 0…255 chosen by the keeper; Otsu's threshold when absent. */
  threshold?: number;
  /** The stamp's footprint in raster pixels; the whole raster when absent. */
  footprint?: PixelRect;
}

export interface CoverageResult {
  polarity: WaxPolarity;
  /** Threshold used: darkIsWax counts levels ≤ threshold as wax, lightIsWax counts levels > threshold. */
  threshold: number;
  thresholdSource: "otsu" | "keeper";
  /** Otsu's threshold for the same footprint, for the keeper to compare with. */
  otsuThreshold: number;
  waxPixels: number;
  totalPixels: number;
  /** waxPixels / totalPixels, 0…1 (0 for an empty footprint). */
  ratio: number;
}

function checkThreshold(threshold: number) {
  if (!Number.isInteger(threshold) || threshold < 0 || threshold > 255) throw new RangeError(`threshold must be an integer 0…255, got ${threshold}`);
}

const isWax = (grey: number, polarity: WaxPolarity, threshold: number) => (polarity === "darkIsWax" ? grey <= threshold : grey > threshold);

/**
 * Wax coverage of a stamp as an area fraction (point counting on the pixel grid, as in ASTM E562/E1245):
 * ratio = wax pixels / pixels in the footprint, where a pixel is wax when its grey level g satisfies
 * g ≤ t (darkIsWax) or g > t (lightIsWax), t = the keeper's threshold or Otsu's. Assumes the footprint holds
 * only the stamp's impression and even lighting; the error is about one pixel along every wax edge.
 */
export function measureCoverage(raster: GreyRaster, options: CoverageOptions): CoverageResult {
  const histogram = greyHistogram(raster, options.footprint);
  const otsu = otsuThreshold(histogram).threshold;
  if (options.threshold !== undefined) checkThreshold(options.threshold);
  const threshold = options.threshold ?? otsu;
  let waxPixels = 0;
  let totalPixels = 0;
  for (let g = 0; g < 256; g++) {
    totalPixels += histogram[g];
    if (isWax(g, options.polarity, threshold)) waxPixels += histogram[g];
  }
  return {
    polarity: options.polarity,
    threshold,
    thresholdSource: options.threshold === undefined ? "otsu" : "keeper",
    otsuThreshold: otsu,
    waxPixels,
    totalPixels,
    ratio: totalPixels === 0 ? 0 : waxPixels / totalPixels,
  };
}

export interface OverlayOptions {
  polarity: WaxPolarity;
  threshold: number;
  footprint?: PixelRect;
  /** Longest side of the picture, px (default 1024; never enlarged). */
  maxSidePx?: number;
  format?: "webp" | "png";
  /** Colour laid over counted wax pixels, sRGB 0…255 (default a strong red). */
  tint?: [number, number, number];
}

/**
 * A picture for the keeper's review: the scan in grey, every pixel counted as wax tinted, pixels outside the
 * footprint darkened. Classified at the raster's full resolution, then scaled to `maxSidePx`. Returns an
 * encoded WebP (default) or PNG.
 */
export async function renderCoverageOverlay(raster: GreyRaster, options: OverlayOptions): Promise<Buffer> {
  checkThreshold(options.threshold);
  const { data, widthPx, heightPx } = raster;
  const [tr, tg, tb] = options.tint ?? [220, 38, 38];
  const fp = clampRect(raster, options.footprint);
  const rgb = Buffer.alloc(widthPx * heightPx * 3);
  // Wax: 35 % grey + 65 % tint; outside the footprint: half brightness.
  for (let y = 0; y < heightPx; y++) {
    const inRows = y >= fp.topPx && y < fp.topPx + fp.heightPx;
    for (let x = 0; x < widthPx; x++) {
      const i = y * widthPx + x;
      const g = data[i];
      const o = i * 3;
      const inside = inRows && x >= fp.leftPx && x < fp.leftPx + fp.widthPx;
      if (inside && isWax(g, options.polarity, options.threshold)) {
        rgb[o] = (g * 0.35 + tr * 0.65) | 0;
        rgb[o + 1] = (g * 0.35 + tg * 0.65) | 0;
        rgb[o + 2] = (g * 0.35 + tb * 0.65) | 0;
      } else {
        const v = inside ? g : g >> 1;
        rgb[o] = v;
        rgb[o + 1] = v;
        rgb[o + 2] = v;
      }
    }
  }
  const maxSide = options.maxSidePx ?? 1024;
  const image = sharp(rgb, { raw: { width: widthPx, height: heightPx, channels: 3 } }).resize({
    width: maxSide,
    height: maxSide,
    fit: "inside",
    withoutEnlargement: true,
  });
  return options.format === "png" ? image.png().toBuffer() : image.webp({ quality: 82 }).toBuffer();
}
