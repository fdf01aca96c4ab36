import type { PixelRect } from "./otsu";
import { MM_PER_INCH } from "./physical-size";

/** Millimetres per pixel of the analysis raster (smaller than the scan), from the scan's DPI; null without one. */
export function analysisMmPerPx(scan: { widthPx: number; dpi: number | null }, raster: { widthPx: number }): number | null {
  return scan.dpi ? (scan.widthPx / raster.widthPx) * (MM_PER_INCH / scan.dpi) : null;
}

/**
 * The stamp's footprint in analysis pixels: the recorded size centred on the scan when the scan is larger
 * than the stamp (a print with cloth around it), else the whole scan. Needs the DPI; without it, the whole scan.
 */
export function footprintRect(raster: { widthPx: number; heightPx: number }, mmPerPx: number | null, stamp: { widthMm: number; heightMm: number }, turned = false): PixelRect | undefined {
  if (!mmPerPx) return undefined;
  const [wMm, hMm] = turned ? [stamp.heightMm, stamp.widthMm] : [stamp.widthMm, stamp.heightMm];
  const widthPx = Math.min(raster.widthPx, Math.round(wMm / mmPerPx));
  const heightPx = Math.min(raster.heightPx, Math.round(hMm / mmPerPx));
  if (widthPx >= raster.widthPx && heightPx >= raster.heightPx) return undefined;
  return { leftPx: Math.floor((raster.widthPx - widthPx) / 2), topPx: Math.floor((raster.heightPx - heightPx) / 2), widthPx, heightPx };
}
