// Test pictures with a known geometry, drawn as SVG and rendered by sharp (librsvg), and a plain decoder.
import sharp from "sharp";
import type { GreyRaster } from "@/lib/scans";

export interface ShapeScan {
  png: Buffer;
  /** Size of one pixel on the stamp, mm (25.4 / dpi). */
  mmPerPx: number;
  sidePx: number;
}

/**
 * A square scan of `sideMm` at `dpi` holding the SVG elements given in mm (origin top-left). The viewBox is set
 * to exactly sidePx × (25.4 / dpi) mm, so one SVG millimetre lands on dpi / 25.4 pixels with no rounding drift.
 */
export async function shapeScan(options: { dpi: number; sideMm: number; body: string; ink: string; ground: string }): Promise<ShapeScan> {
  const mmPerPx = 25.4 / options.dpi;
  const sidePx = Math.round(options.sideMm / mmPerPx);
  const viewMm = sidePx * mmPerPx;
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${sidePx}" height="${sidePx}" viewBox="0 0 ${viewMm} ${viewMm}">
    <rect width="${viewMm}" height="${viewMm}" fill="${options.ground}"/><g fill="${options.ink}" fill-rule="evenodd">${options.body}</g></svg>`;
  const png = await sharp(Buffer.from(svg), { density: 72 }).flatten({ background: options.ground }).png().withDensity(options.dpi).toBuffer();
  return { png, mmPerPx, sidePx };
}

/** Decodes any image to one grey byte per pixel with sharp alone (no lib/scans code in between). */
export async function decodeGrey(bytes: Buffer): Promise<GreyRaster> {
  const { data, info } = await sharp(bytes).greyscale().raw().toBuffer({ resolveWithObject: true });
  if (info.channels !== 1) throw new Error(`expected one channel, got ${info.channels}`);
  return { data: new Uint8Array(data.buffer, data.byteOffset, data.length), widthPx: info.width, heightPx: info.height };
}

/** Decodes to raw RGB, for comparing the pixels of two encodings. */
export async function decodeRgb(bytes: Buffer): Promise<Buffer> {
  return sharp(bytes).removeAlpha().toColourspace("srgb").raw().toBuffer();
}

/**
 * A PNG of grain around `mean` with roughly Gaussian spread `sigma` (sum of four uniforms) from a seeded
 * generator: the same bytes every run, unlike sharp's random noise, so tests built on it never flake.
 */
export async function seededNoisePng(width: number, height: number, options: { mean: number; sigma: number; seed?: number }): Promise<Buffer> {
  const pixels = Buffer.alloc(width * height * 3);
  let state = options.seed ?? 0x2f6b1c3d;
  const next = () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 2 ** 32;
  };
  const scale = options.sigma * Math.sqrt(3);
  for (let i = 0; i < pixels.length; i++) pixels[i] = Math.max(0, Math.min(255, Math.round(options.mean + (next() + next() + next() + next() - 2) * scale)));
  return sharp(pixels, { raw: { width, height, channels: 3 } }).png().toBuffer();
}
