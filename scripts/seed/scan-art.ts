import sharp from "sharp";
import { checkContainer } from "@/lib/scans/containers";
import { seededUniform } from "../lib/seeded-random";

// Invented motif artwork for demo scans and benchmarks: plain geometry (ellipses, petals, curves, stars,
// bands) placed by a seeded random generator. Nothing here copies any existing artwork.

export type MotifFamily = "petals" | "lotus" | "vine" | "stars" | "bands";
export const motifFamilies: readonly MotifFamily[] = ["petals", "lotus", "vine", "stars", "bands"];

/** "print": a wax test print, dark wax on white cloth. "face": a photo of the stamp's copper face, light strips on dark. */
export type ScanStyle = "print" | "face";

export interface MotifOptions {
  seed: number;
  widthMm: number;
  heightMm: number;
  /** Default: chosen by the seed. */
  family?: MotifFamily;
  style?: ScanStyle;
}


const f = (n: number) => n.toFixed(2);

interface Drawing {
  /** Shapes filled with wax. */
  solids: string[];
  /** Lines made by copper strips, stroked. */
  strips: string[];
}

function ellipsePath(cx: number, cy: number, rx: number, ry: number, angleDeg: number): string {
  return `<ellipse cx="${f(cx)}" cy="${f(cy)}" rx="${f(rx)}" ry="${f(ry)}" transform="rotate(${f(angleDeg)} ${f(cx)} ${f(cy)})"/>`;
}

function petal(cx: number, cy: number, length: number, width: number, angleDeg: number): string {
  const a = (angleDeg * Math.PI) / 180;
  const tip = [cx + length * Math.cos(a), cy + length * Math.sin(a)];
  const side = (s: number) => [cx + (length / 2) * Math.cos(a) - s * width * Math.sin(a), cy + (length / 2) * Math.sin(a) + s * width * Math.cos(a)];
  const [l, r] = [side(1), side(-1)];
  return `<path d="M${f(cx)} ${f(cy)} Q${f(l[0])} ${f(l[1])} ${f(tip[0])} ${f(tip[1])} Q${f(r[0])} ${f(r[1])} ${f(cx)} ${f(cy)}Z"/>`;
}

function drawPetals(w: number, h: number, rnd: () => number): Drawing {
  const cells = 2 + Math.floor(rnd() * 3);
  const cw = w / cells;
  const ch = h / cells;
  const solids: string[] = [];
  const strips: string[] = [];
  for (let i = 0; i < cells; i++) {
    for (let j = 0; j < cells; j++) {
      const cx = (i + 0.5) * cw;
      const cy = (j + 0.5) * ch;
      const r = Math.min(cw, ch) * 0.24;
      for (let k = 0; k < 4; k++) solids.push(ellipsePath(cx + r * Math.cos((k * Math.PI) / 2), cy + r * Math.sin((k * Math.PI) / 2), r * 0.95, r * 0.5, k * 90));
      strips.push(`<circle cx="${f(cx)}" cy="${f(cy)}" r="${f(r * 0.18)}"/>`);
    }
  }
  return { solids, strips };
}

function drawLotus(w: number, h: number, rnd: () => number): Drawing {
  const cx = w * (0.42 + rnd() * 0.12);
  const cy = h * (0.4 + rnd() * 0.1);
  const size = Math.min(w, h) * 0.3;
  const count = 7 + Math.floor(rnd() * 5);
  const solids: string[] = [];
  for (let k = 0; k < count; k++) solids.push(petal(cx, cy, size * (0.8 + 0.3 * rnd()), size * 0.28, -170 + (160 * k) / (count - 1)));
  const strips = [
    `<path d="M${f(cx)} ${f(cy)} C${f(cx - w * 0.05)} ${f(h * 0.7)} ${f(cx + w * 0.2)} ${f(h * 0.8)} ${f(cx + w * 0.1)} ${f(h * 0.95)}"/>`,
    `<path d="M${f(cx + w * 0.04)} ${f(h * 0.72)} Q${f(cx + w * 0.3)} ${f(h * 0.6)} ${f(cx + w * 0.36)} ${f(h * 0.78)}"/>`,
  ];
  solids.push(petal(cx + w * 0.05, h * 0.74, size * 0.7, size * 0.3, -20 - 30 * rnd()));
  for (let k = 0; k < 14; k++) strips.push(`<circle cx="${f(w * (0.06 + 0.88 * rnd()))}" cy="${f(h * (0.06 + 0.88 * rnd()))}" r="${f(size * 0.03)}"/>`);
  return { solids, strips };
}

function drawVine(w: number, h: number, rnd: () => number): Drawing {
  const strips: string[] = [];
  const solids: string[] = [];
  const turns = 3 + Math.floor(rnd() * 2);
  let d = `M${f(w * 0.06)} ${f(h * 0.9)}`;
  const points: Array<[number, number]> = [];
  for (let k = 1; k <= turns; k++) {
    const x = w * (0.06 + (0.74 * k) / turns);
    const y = h * (0.88 - (0.6 * k) / turns) + (k % 2 ? -1 : 1) * h * 0.07;
    d += ` S${f(x - w * 0.12)} ${f(y + h * 0.15 * (k % 2 ? 1 : -1))} ${f(x)} ${f(y)}`;
    points.push([x, y]);
  }
  strips.push(`<path d="${d}"/>`);
  for (const [x, y] of points) {
    solids.push(petal(x, y, Math.min(w, h) * 0.16, Math.min(w, h) * 0.06, -60 - 80 * rnd()));
    solids.push(petal(x, y, Math.min(w, h) * 0.12, Math.min(w, h) * 0.05, 10 + 50 * rnd()));
    const r = Math.min(w, h) * 0.05;
    strips.push(`<path d="M${f(x)} ${f(y)} a${f(r)} ${f(r)} 0 1 1 ${f(r)} ${f(r)} a${f(r / 2)} ${f(r / 2)} 0 1 1 ${f(-r / 2)} ${f(-r / 2)}"/>`);
  }
  return { solids, strips };
}

function star(cx: number, cy: number, outer: number, inner: number, points: number, turnDeg: number): string {
  const v: string[] = [];
  for (let k = 0; k < points * 2; k++) {
    const a = ((turnDeg + (k * 180) / points) * Math.PI) / 180;
    const r = k % 2 ? inner : outer;
    v.push(`${f(cx + r * Math.cos(a))} ${f(cy + r * Math.sin(a))}`);
  }
  return `<path d="M${v.join("L")}Z"/>`;
}

function drawStars(w: number, h: number, rnd: () => number): Drawing {
  const cells = 2 + Math.floor(rnd() * 2);
  const solids: string[] = [];
  const strips: string[] = [];
  const points = 5 + Math.floor(rnd() * 4);
  for (let i = 0; i < cells; i++) {
    for (let j = 0; j < cells; j++) {
      const cx = ((i + 0.5) * w) / cells;
      const cy = ((j + 0.5) * h) / cells;
      const outer = (Math.min(w, h) / cells) * 0.4;
      solids.push(star(cx, cy, outer, outer * 0.45, points, 15 * rnd()));
      strips.push(`<circle cx="${f(cx)}" cy="${f(cy)}" r="${f(outer * 1.12)}" fill="none"/>`);
    }
  }
  strips.push(`<path d="M0 ${f(h * 0.02)} L${f(w)} ${f(h * 0.02)} M0 ${f(h * 0.98)} L${f(w)} ${f(h * 0.98)}"/>`);
  return { solids, strips };
}

function drawBands(w: number, h: number, rnd: () => number): Drawing {
  const solids: string[] = [];
  const strips: string[] = [];
  const bands = 3 + Math.floor(rnd() * 2);
  const step = (w + h) / bands;
  for (let k = 0; k < bands; k++) {
    const o = k * step - h * 0.3;
    solids.push(
      `<path d="M${f(o)} ${f(h)} C${f(o + w * 0.15)} ${f(h * 0.55)} ${f(o + w * 0.3)} ${f(h * 0.65)} ${f(o + h * 0.9)} 0 L${f(o + h * 0.9 + step * 0.3)} 0 C${f(o + w * 0.45)} ${f(h * 0.6)} ${f(o + w * 0.3)} ${f(h * 0.5)} ${f(o + step * 0.3)} ${f(h)}Z"/>`,
    );
    for (let d = 0; d < 5; d++) {
      const t = (d + 0.5) / 5;
      strips.push(`<circle cx="${f(o + step * 0.65 + t * h * 0.6)}" cy="${f(h * (1 - t))}" r="${f(Math.min(w, h) * 0.018)}"/>`);
    }
  }
  return { solids, strips };
}

const drawers: Record<MotifFamily, (w: number, h: number, rnd: () => number) => Drawing> = {
  petals: drawPetals,
  lotus: drawLotus,
  vine: drawVine,
  stars: drawStars,
  bands: drawBands,
};

/**
 * An invented motif as an SVG document sized in millimetres (width="…mm", viewBox in mm), so rendering it at
 * density d DPI gives widthMm / 25.4 × d pixels. Deterministic for a given seed; the family defaults to one
 * picked by the seed. Print style: dark wax on white cloth; face style: light copper strips on a dark ground.
 */
export function motifSvg(options: MotifOptions): string {
  const { widthMm: w, heightMm: h } = options;
  const rnd = seededUniform(options.seed);
  const family = options.family ?? motifFamilies[Math.floor(rnd() * motifFamilies.length)];
  const drawing = drawers[family](w, h, rnd);
  const face = options.style === "face";
  const ground = face ? "#1c1510" : "#f3eee4";
  const ink = face ? "#d69a5c" : "#2a1c12";
  const strip = Math.max(0.6, Math.min(w, h) * 0.008);
  const margin = Math.min(w, h) * 0.03;
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${f(w)}mm" height="${f(h)}mm" viewBox="0 0 ${f(w)} ${f(h)}">`,
    `<rect width="${f(w)}" height="${f(h)}" fill="${ground}"/>`,
    `<g transform="translate(${f(margin)} ${f(margin)}) scale(${f((w - 2 * margin) / w)} ${f((h - 2 * margin) / h)})">`,
    `<g fill="${face ? "none" : ink}" stroke="${ink}" stroke-width="${f(strip)}" stroke-linejoin="round">${drawing.solids.join("")}</g>`,
    `<g fill="${ink}" stroke="${ink}" stroke-width="${f(strip)}" stroke-linecap="round">${drawing.strips
      .map((s) => (s.startsWith("<path") ? s.replace("<path ", '<path fill="none" ') : s))
      .join("")}</g>`,
    `</g></svg>`,
  ].join("");
}

export interface RenderScanOptions {
  format?: "png" | "jpeg";
  /** Strength of the cloth grain laid over the drawing, 0 (none) … 1; default 0.35. */
  grain?: number;
  /** JPEG quality, default 90. */
  quality?: number;
}

/** Pixel size of an SVG whose root gives width and height in mm, at `dpi`: px = round(mm / 25.4 × dpi). */
export function svgPixelSize(svg: string, dpi: number): { widthPx: number; heightPx: number } {
  const root = /<svg\b[^>]*>/.exec(svg)?.[0] ?? "";
  const mm = (name: string) => {
    const match = new RegExp(`\\b${name}="([0-9.]+)mm"`).exec(root);
    if (!match) throw new Error(`the SVG root needs ${name}="…mm"`);
    return Number(match[1]);
  };
  return { widthPx: Math.round((mm("width") / 25.4) * dpi), heightPx: Math.round((mm("height") / 25.4) * dpi) };
}

function hashString(text: string): number {
  let h = 2166136261;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 16777619) >>> 0;
  return h;
}

/** Grey grain around 128 with roughly Gaussian spread `sigma` (sum of four uniforms), from a seeded generator. */
function seededGrain(length: number, sigma: number, seed: number): Buffer {
  const out = Buffer.alloc(length);
  let state = seed || 1;
  const next = () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 2 ** 32;
  };
  // Four uniforms on [0, 1) sum to mean 2 and variance 1/3.
  const scale = sigma * Math.sqrt(3);
  for (let i = 0; i < length; i++) out[i] = Math.max(0, Math.min(255, Math.round(128 + (next() + next() + next() + next() - 2) * scale)));
  return out;
}

/**
 * Renders an SVG sized in mm to a scan at `dpi` with sharp: rasterised to px = mm / 25.4 × dpi (the root size is
 * rewritten in pixels and drawn at 72 DPI, where libvips maps one SVG pixel to one output pixel), cloth grain from
 * Gaussian noise blended in (so files are as heavy as real scans), then the density written into the file
 * (PNG pHYs, JPEG JFIF) and no other metadata.
 */
export async function renderScan(svg: string, dpi: number, options: RenderScanOptions = {}): Promise<Buffer> {
  const format = options.format ?? "png";
  const grain = options.grain ?? 0.35;
  const { widthPx, heightPx } = svgPixelSize(svg, dpi);
  const sized = svg.replace(/<svg\b[^>]*>/, (root) => root.replace(/\bwidth="[^"]*"/, `width="${widthPx}"`).replace(/\bheight="[^"]*"/, `height="${heightPx}"`));
  const raw = { width: widthPx, height: heightPx, channels: 3 as const };
  let pixels = await sharp(Buffer.from(sized), { density: 72, limitInputPixels: false }).flatten({ background: "#ffffff" }).removeAlpha().raw().toBuffer();
  if (grain > 0) {
    // Seeded from the drawing, so the same motif always renders to the same bytes (demo data and tests repeat).
    const noise = seededGrain(widthPx * heightPx * 3, 60 * grain, hashString(svg));
    pixels = await sharp(pixels, { raw })
      .composite([{ input: noise, raw, blend: "soft-light" }])
      .removeAlpha()
      .raw()
      .toBuffer();
  }
  const image = sharp(pixels, { raw, limitInputPixels: false });
  const encoded = format === "png" ? await image.png({ compressionLevel: 6 }).toBuffer() : await image.jpeg({ quality: options.quality ?? 90 }).toBuffer();
  return checkContainer(format, encoded).strip(dpi) as Buffer;
}
