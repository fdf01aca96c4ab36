import type { StampShape } from "./outline";
import type { Impression } from "./types";

export interface PreviewOptions {
  clothWidthMm: number;
  bandX0Mm: number;
  bandX1Mm: number;
  startMm: number;
  endMm: number;
  /** Prefix for element ids, so several previews can share one page. */
  idPrefix?: string;
}

function n(v: number): string {
  const s = Number(v.toFixed(3)).toString();
  return s === "-0" ? "0" : s;
}

/**
 * SVG markup (a string; no DOM) of the front face in a window: cloth and band, each impression's wax shape
 * placed from the stamp's path data by its matrix and clipped to the band, and each footprint outlined
 * (dashed when cut). Units are mm (viewBox in mm). The wax opacity is the coverage ratio when there is no outline.
 */
export function previewSvg(shape: StampShape, impressions: Impression[], o: PreviewOptions): string {
  const id = o.idPrefix ?? "cg";
  const h = o.endMm - o.startMm;
  const front = impressions.filter((i) => i.face === "front");
  const uses = front.map((i) => `<use href="#${id}-wax" transform="matrix(${i.matrix.map(n).join(" ")})"/>`).join("");
  const frames = front
    .map(
      (i) =>
        `<rect x="${n(i.xMm)}" y="${n(i.yMm)}" width="${n(i.widthMm)}" height="${n(i.heightMm)}"${i.whole ? "" : ' stroke-dasharray="4 3"'}/>`,
    )
    .join("");
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 ${n(o.startMm)} ${n(o.clothWidthMm)} ${n(h)}" width="${n(o.clothWidthMm)}mm" height="${n(h)}mm">`,
    `<defs><path id="${id}-wax" d="${shape.pathData}" fill-rule="${shape.fillRule}"/>`,
    `<clipPath id="${id}-band"><rect x="${n(o.bandX0Mm)}" y="${n(o.startMm)}" width="${n(o.bandX1Mm - o.bandX0Mm)}" height="${n(h)}"/></clipPath></defs>`,
    `<rect x="0" y="${n(o.startMm)}" width="${n(o.clothWidthMm)}" height="${n(h)}" fill="#ece4d4"/>`,
    `<rect x="${n(o.bandX0Mm)}" y="${n(o.startMm)}" width="${n(o.bandX1Mm - o.bandX0Mm)}" height="${n(h)}" fill="#f7f2e8"/>`,
    `<g clip-path="url(#${id}-band)" fill="#5b3a1e" fill-opacity="${n(shape.areaFactor)}">${uses}</g>`,
    `<g fill="none" stroke="#8c7a62" stroke-width="0.6">${frames}</g>`,
    `</svg>`,
  ].join("");
}
