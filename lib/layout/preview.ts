import type { StampShape } from "./outline";
import type { Impression, LayerName } from "./types";

/** A layer to draw: its stamp's wax shape and the band its impressions are cut to (mm from the left selvedge). */
export interface PreviewLayer {
  layer: LayerName;
  shape: StampShape;
  x0Mm: number;
  x1Mm: number;
}

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
 * SVG markup (a string; no DOM) of the front face in a window: cloth and band, the border strips, each impression's
 * wax shape placed from its layer's stamp path data by its matrix and cut to its layer's band, and each footprint
 * outlined (dashed when cut). Each layer is one group with `data-layer`. Units are mm (viewBox in mm). The wax
 * opacity is the coverage ratio when a stamp has no outline.
 */
export function previewSvg(layers: readonly PreviewLayer[], impressions: Impression[], o: PreviewOptions): string {
  const id = o.idPrefix ?? "cg";
  const h = o.endMm - o.startMm;
  const front = impressions.filter((i) => i.face === "front");
  const key = (layer: LayerName) => (layer === "field" ? `${id}-wax` : `${id}-wax-${layer}`);
  const clip = (layer: LayerName) => (layer === "field" ? `${id}-band` : `${id}-band-${layer}`);
  const rect = (x0: number, x1: number, extra = "") =>
    `<rect x="${n(x0)}" y="${n(o.startMm)}" width="${n(x1 - x0)}" height="${n(h)}"${extra}/>`;

  const defs = layers
    .map(
      (l) =>
        `<path id="${key(l.layer)}" d="${l.shape.pathData}" fill-rule="${l.shape.fillRule}"/>` +
        `<clipPath id="${clip(l.layer)}">${rect(l.x0Mm, l.x1Mm)}</clipPath>`,
    )
    .join("");
  const strips = layers
    .filter((l) => l.layer !== "field")
    .map((l) => rect(l.x0Mm, l.x1Mm, ` fill="#efe6d3" data-layer="${l.layer}"`))
    .join("");
  const wax = layers
    .map((l) => {
      const uses = front
        .filter((i) => i.layer === l.layer)
        .map((i) => `<use href="#${key(l.layer)}" transform="matrix(${i.matrix.map(n).join(" ")})"/>`)
        .join("");
      return `<g data-layer="${l.layer}" clip-path="url(#${clip(l.layer)})" fill="#5b3a1e" fill-opacity="${n(l.shape.areaFactor)}">${uses}</g>`;
    })
    .join("");
  const frames = front
    .map((i) => `<rect x="${n(i.xMm)}" y="${n(i.yMm)}" width="${n(i.widthMm)}" height="${n(i.heightMm)}"${i.whole ? "" : ' stroke-dasharray="4 3"'}/>`)
    .join("");
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 ${n(o.startMm)} ${n(o.clothWidthMm)} ${n(h)}" width="${n(o.clothWidthMm)}mm" height="${n(h)}mm">`,
    `<defs>${defs}</defs>`,
    rect(0, o.clothWidthMm, ' fill="#ece4d4"'),
    rect(o.bandX0Mm, o.bandX1Mm, ' fill="#f7f2e8"'),
    strips,
    wax,
    `<g fill="none" stroke="#8c7a62" stroke-width="0.6">${frames}</g>`,
    `</svg>`,
  ].join("");
}
