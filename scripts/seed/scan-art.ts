import sharp from "sharp";
import { checkContainer } from "@/lib/scans/containers";
import { seededUniform } from "../lib/seeded-random";

// Invented motif artwork for demo scans and benchmarks: plain geometry (ellipses, petals, curves, stars,
// bands) placed by a seeded random generator. Nothing here copies any existing artwork.

export type MotifFamily = "petals" | "lotus" | "vine" | "stars" | "bands";
export const motifFamilies: readonly MotifFamily[] = ["petals", "lotus", "vine", "stars", "bands"];

/**
 * "print": a wax test print, dark wax on white cloth. "face": a photo of the stamp's copper face, light strips on
 * dark, and the mirror image of the print (the face is what presses onto the cloth).
 */
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
  // Each flower of the grid gets its own petal count, turn and size, and one cell holds a bud instead, so no two
  // seeds draw the same grid and no grid is mirror-symmetric.
  const bud = Math.floor(rnd() * cells * cells);
  for (let i = 0; i < cells; i++) {
    for (let j = 0; j < cells; j++) {
      const cx = (i + 0.4 + 0.2 * rnd()) * cw;
      const cy = (j + 0.4 + 0.2 * rnd()) * ch;
      const r = Math.min(cw, ch) * (0.18 + 0.1 * rnd());
      if (i * cells + j === bud) {
        solids.push(petal(cx, cy + r, r * 1.6, r * 0.5, -90 + 40 * (rnd() - 0.5)));
        strips.push(`<path d="M${f(cx)} ${f(cy + r)} Q${f(cx + r)} ${f(cy + 1.6 * r)} ${f(cx + 0.4 * r)} ${f(cy + 2 * r)}"/>`);
        continue;
      }
      const count = 3 + Math.floor(rnd() * 4);
      const turn = rnd() * 360;
      for (let k = 0; k < count; k++) {
        const a = turn + (k * 360) / count;
        const rad = (a * Math.PI) / 180;
        solids.push(ellipsePath(cx + r * Math.cos(rad), cy + r * Math.sin(rad), r * (0.75 + 0.3 * rnd()), r * (0.35 + 0.2 * rnd()), a));
      }
      strips.push(`<circle cx="${f(cx)}" cy="${f(cy)}" r="${f(r * (0.12 + 0.12 * rnd()))}"/>`);
    }
  }
  return { solids, strips };
}

function drawLotus(w: number, h: number, rnd: () => number): Drawing {
  const cx = w * (0.3 + rnd() * 0.4);
  const cy = h * (0.28 + rnd() * 0.25);
  const size = Math.min(w, h) * (0.2 + rnd() * 0.14);
  const count = 5 + Math.floor(rnd() * 8);
  const spread = 110 + rnd() * 90;
  const tilt = (rnd() - 0.5) * 60;
  const solids: string[] = [];
  for (let k = 0; k < count; k++) solids.push(petal(cx, cy, size * (0.7 + 0.45 * rnd()), size * (0.2 + 0.15 * rnd()), -90 + tilt - spread / 2 + (spread * k) / (count - 1)));
  // The stem bends to one side or the other, with one to three leaves along it.
  const side = rnd() < 0.5 ? -1 : 1;
  const foot = [cx + side * w * (0.05 + 0.2 * rnd()), h * (0.9 + 0.06 * rnd())];
  const strips = [`<path d="M${f(cx)} ${f(cy)} C${f(cx - side * w * 0.1)} ${f(h * 0.65)} ${f(foot[0] + side * w * 0.1)} ${f(h * 0.75)} ${f(foot[0])} ${f(foot[1])}"/>`];
  const leaves = 1 + Math.floor(rnd() * 3);
  for (let k = 0; k < leaves; k++) {
    const t = 0.35 + 0.5 * rnd();
    const lx = cx + (foot[0] - cx) * t;
    const ly = cy + (foot[1] - cy) * t;
    const dir = rnd() < 0.5 ? -1 : 1;
    strips.push(`<path d="M${f(lx)} ${f(ly)} Q${f(lx + dir * w * 0.15)} ${f(ly - h * 0.12)} ${f(lx + dir * w * (0.2 + 0.1 * rnd()))} ${f(ly + h * 0.02)}"/>`);
    solids.push(petal(lx + dir * w * 0.08, ly - h * 0.04, size * (0.5 + 0.3 * rnd()), size * 0.22, dir < 0 ? 180 + 30 * rnd() : -30 * rnd()));
  }
  const dots = 6 + Math.floor(rnd() * 14);
  for (let k = 0; k < dots; k++) strips.push(`<circle cx="${f(w * (0.06 + 0.88 * rnd()))}" cy="${f(h * (0.06 + 0.88 * rnd()))}" r="${f(size * (0.02 + 0.03 * rnd()))}"/>`);
  return { solids, strips };
}

function drawVine(w: number, h: number, rnd: () => number): Drawing {
  const strips: string[] = [];
  const solids: string[] = [];
  const turns = 2 + Math.floor(rnd() * 4);
  // Starts in a random corner region and wanders towards the opposite side.
  const fromLeft = rnd() < 0.5;
  const x0 = fromLeft ? w * (0.04 + 0.1 * rnd()) : w * (0.86 + 0.1 * rnd());
  const y0 = h * (0.7 + 0.25 * rnd());
  const amplitude = 0.04 + 0.12 * rnd();
  let d = `M${f(x0)} ${f(y0)}`;
  const points: Array<[number, number]> = [];
  for (let k = 1; k <= turns; k++) {
    const along = (0.8 * k) / turns;
    const x = fromLeft ? x0 + w * along : x0 - w * along;
    const y = y0 - h * (0.6 * k) / turns + (k % 2 ? -1 : 1) * h * amplitude;
    d += ` S${f(x - w * 0.12)} ${f(y + h * 0.15 * (k % 2 ? 1 : -1))} ${f(x)} ${f(y)}`;
    points.push([x, y]);
  }
  strips.push(`<path d="${d}"/>`);
  for (const [x, y] of points) {
    const leaves = 1 + Math.floor(rnd() * 3);
    for (let k = 0; k < leaves; k++) solids.push(petal(x, y, Math.min(w, h) * (0.08 + 0.12 * rnd()), Math.min(w, h) * (0.03 + 0.04 * rnd()), rnd() * 360));
    if (rnd() < 0.6) {
      const r = Math.min(w, h) * (0.03 + 0.04 * rnd());
      strips.push(`<path d="M${f(x)} ${f(y)} a${f(r)} ${f(r)} 0 1 ${rnd() < 0.5 ? 1 : 0} ${f(r)} ${f(r)} a${f(r / 2)} ${f(r / 2)} 0 1 1 ${f(-r / 2)} ${f(-r / 2)}"/>`);
    }
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
  const cells = 2 + Math.floor(rnd() * 3);
  const solids: string[] = [];
  const strips: string[] = [];
  const points = 5 + Math.floor(rnd() * 4);
  for (let i = 0; i < cells; i++) {
    for (let j = 0; j < cells; j++) {
      const cx = ((i + 0.4 + 0.2 * rnd()) * w) / cells;
      const cy = ((j + 0.4 + 0.2 * rnd()) * h) / cells;
      const outer = (Math.min(w, h) / cells) * (0.28 + 0.14 * rnd());
      const kind = rnd();
      // Mostly stars, some rings or a small flower of dots in their place.
      if (kind < 0.7) solids.push(star(cx, cy, outer, outer * (0.35 + 0.2 * rnd()), points + (rnd() < 0.3 ? 1 : 0), 40 * rnd()));
      else if (kind < 0.85) strips.push(`<circle cx="${f(cx)}" cy="${f(cy)}" r="${f(outer * 0.6)}" fill="none"/>`, `<circle cx="${f(cx)}" cy="${f(cy)}" r="${f(outer * 0.15)}"/>`);
      else for (let k = 0; k < 5; k++) strips.push(`<circle cx="${f(cx + outer * 0.6 * Math.cos(k * 1.2566))}" cy="${f(cy + outer * 0.6 * Math.sin(k * 1.2566))}" r="${f(outer * 0.18)}"/>`);
      if (rnd() < 0.6) strips.push(`<circle cx="${f(cx)}" cy="${f(cy)}" r="${f(outer * 1.12)}" fill="none"/>`);
      else strips.push(`<circle cx="${f(cx + outer * 1.1)}" cy="${f(cy - outer * 0.9)}" r="${f(outer * 0.12)}"/>`);
    }
  }
  strips.push(`<path d="M0 ${f(h * 0.02)} L${f(w * (0.5 + 0.5 * rnd()))} ${f(h * 0.02)} M${f(w * 0.5 * rnd())} ${f(h * 0.98)} L${f(w)} ${f(h * 0.98)}"/>`);
  return { solids, strips };
}

function drawBands(w: number, h: number, rnd: () => number): Drawing {
  const solids: string[] = [];
  const strips: string[] = [];
  const bands = 2 + Math.floor(rnd() * 4);
  const step = (w + h) / bands;
  const lean = 0.5 + 0.7 * rnd();
  const wave = rnd() * 0.25;
  for (let k = 0; k < bands; k++) {
    const o = k * step - h * (0.1 + 0.3 * rnd());
    const thick = step * (0.15 + 0.3 * rnd());
    const bend = 0.35 + 0.3 * rnd() + (k % 2 ? wave : -wave);
    solids.push(
      `<path d="M${f(o)} ${f(h)} C${f(o + w * 0.15)} ${f(h * bend)} ${f(o + w * 0.3)} ${f(h * (bend + 0.1))} ${f(o + h * lean)} 0 L${f(o + h * lean + thick)} 0 C${f(o + w * 0.45)} ${f(h * (bend + 0.05))} ${f(o + w * 0.3)} ${f(h * (bend - 0.05))} ${f(o + thick)} ${f(h)}Z"/>`,
    );
    // Between the bands: a row of dots, or a thin wavy strip.
    if (rnd() < 0.6) {
      const dots = 2 + Math.floor(rnd() * 6);
      for (let d = 0; d < dots; d++) {
        const t = (d + 0.5) / dots;
        strips.push(`<circle cx="${f(o + step * 0.65 + t * h * 0.6)}" cy="${f(h * (1 - t))}" r="${f(Math.min(w, h) * (0.012 + 0.02 * rnd()))}"/>`);
      }
    } else {
      const x = o + step * 0.6;
      strips.push(`<path d="M${f(x)} ${f(h)} Q${f(x + w * 0.3 * rnd())} ${f(h * 0.5)} ${f(x + h * lean * 0.8)} ${f(h * 0.1)}"/>`);
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
 * picked by the seed. Print style: dark wax on white cloth; face style: light copper strips on a dark ground, mirrored
 * (a photo of the face shows the print's mirror image).
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
    face ? `<g transform="translate(${f(w)} 0) scale(-1 1)">` : "<g>",
    `<g transform="translate(${f(margin)} ${f(margin)}) scale(${f((w - 2 * margin) / w)} ${f((h - 2 * margin) / h)})">`,
    `<g fill="${face ? "none" : ink}" stroke="${ink}" stroke-width="${f(strip)}" stroke-linejoin="round">${drawing.solids.join("")}</g>`,
    `<g fill="${ink}" stroke="${ink}" stroke-width="${f(strip)}" stroke-linecap="round">${drawing.strips
      .map((s) => (s.startsWith("<path") ? s.replace("<path ", '<path fill="none" ') : s))
      .join("")}</g>`,
    `</g></g></svg>`,
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

export function hashString(text: string): number {
  let h = 2166136261;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 16777619) >>> 0;
  return h;
}

/** Grey grain around 128 with roughly Gaussian spread `sigma` (sum of four uniforms), from a seeded generator. */
export function seededGrain(length: number, sigma: number, seed: number): Buffer {
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

/** An SVG sized in mm as raw RGB pixels at `dpi` (px = round(mm / 25.4 × dpi)), no grain. */
export async function rasteriseSvg(svg: string, dpi: number): Promise<Buffer> {
  const { widthPx, heightPx } = svgPixelSize(svg, dpi);
  // Whole pixels stretch the mm box by less than a pixel; "none" fills them edge to edge (no uncovered sliver).
  const sized = svg.replace(/<svg\b[^>]*>/, (root) =>
    root.replace(/\bwidth="[^"]*"/, `width="${widthPx}"`).replace(/\bheight="[^"]*"/, `height="${heightPx}" preserveAspectRatio="none"`),
  );
  return sharp(Buffer.from(sized), { density: 72, limitInputPixels: false }).flatten({ background: "#ffffff" }).removeAlpha().raw().toBuffer();
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
  const raw = { width: widthPx, height: heightPx, channels: 3 as const };
  let pixels = await rasteriseSvg(svg, dpi);
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

/** The SVG mirrored left–right inside its own box (width in mm): the art of a back-face twin. */
export function mirrorSvg(svg: string, widthMm: number): string {
  return svg.replace(/(<svg\b[^>]*>)/, `$1<g transform="translate(${widthMm.toFixed(2)} 0) scale(-1 1)">`).replace(/<\/svg>\s*$/, "</g></svg>");
}
