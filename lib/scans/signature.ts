import { greyHistogram, otsuThreshold, type GreyRaster } from "./otsu";

// A motif's signature for "looks like": what the wax covers, cropped to the motif and laid on a small grid,
// the same whether the picture is a wax print (dark on light), a dyed cloth or a photo of the copper face
// (light on dark), however large the picture and however much cloth lies around the motif.

/** Side of the square grid the cropped motif is laid on, cells. */
export const SIGNATURE_GRID = 24;
/** Side of the coarse grid used to shortlist candidates, cells (SIGNATURE_GRID / 3). */
export const COARSE_GRID = 8;
/** Channels of a signature: the filled silhouette, the ink itself and its edges. */
export const SIGNATURE_CHANNELS = 3;
/** Long side of the working raster the signature is taken from, px. */
export const SIGNATURE_WORK_SIDE = 320;
export const SIGNATURE_LENGTH = SIGNATURE_CHANNELS * SIGNATURE_GRID * SIGNATURE_GRID;
export const COARSE_LENGTH = SIGNATURE_CHANNELS * COARSE_GRID * COARSE_GRID;

/** Weight of each channel in a comparison (they sum to 1). */
export const CHANNEL_WEIGHTS = [0.4, 0.2, 0.4] as const;

export type Polarity = "darkIsWax" | "lightIsWax";

export interface MotifSignature {
  /** The channels on SIGNATURE_GRID, each centred and scaled so the whole has unit length. */
  grid: Float32Array;
  /** The same on COARSE_GRID, for the first pass over many candidates. */
  coarse: Float32Array;
  /** Width / height of the motif's crop, as the picture lies. */
  aspect: number;
  polarity: Polarity;
}

/** The maps a signature is sampled from, at the working size. */
export interface MotifMaps {
  width: number;
  height: number;
  /** How much wax each pixel shows, 0…1. */
  ink: Float32Array;
  /** The ink with every hole it closes filled: a filled print and the outline of a copper face agree here. */
  filled: Float32Array;
  /** Gradient strength of the ink. */
  edge: Float32Array;
  polarity: Polarity;
}

/** Box-average reduction of a grey raster so its long side is about `side` (never enlarged). */
export function reduceRaster(raster: GreyRaster, side: number): { data: Float32Array; width: number; height: number } {
  // An oblong stamp keeps at least half the side across its short side (at most twice the side along its long one).
  const long = Math.max(raster.widthPx, raster.heightPx);
  const short = Math.min(raster.widthPx, raster.heightPx);
  const scale = Math.min(1, Math.max(side / long, Math.min(side / 2 / short, (2 * side) / long)));
  const width = Math.max(1, Math.round(raster.widthPx * scale));
  const height = Math.max(1, Math.round(raster.heightPx * scale));
  const out = new Float32Array(width * height);
  const counts = new Float32Array(width * height);
  const columnOf = new Int32Array(raster.widthPx);
  for (let x = 0; x < raster.widthPx; x++) columnOf[x] = Math.min(width - 1, Math.floor((x * width) / raster.widthPx));
  for (let y = 0; y < raster.heightPx; y++) {
    const oy = Math.min(height - 1, Math.floor((y * height) / raster.heightPx)) * width;
    const row = y * raster.widthPx;
    for (let x = 0; x < raster.widthPx; x++) {
      const o = oy + columnOf[x];
      out[o] += raster.data[row + x];
      counts[o]++;
    }
  }
  for (let i = 0; i < out.length; i++) out[i] /= counts[i] || 1;
  return { data: out, width, height };
}

/** 3×3 binomial blur (1 2 1)², edges clamped, `passes` times. */
export function blur(data: Float32Array, width: number, height: number, passes = 1): Float32Array {
  let src = data;
  const tmp = new Float32Array(src.length);
  for (let p = 0; p < passes; p++) {
    for (let y = 0; y < height; y++) {
      const row = y * width;
      for (let x = 0; x < width; x++) {
        const l = src[row + (x > 0 ? x - 1 : 0)];
        const r = src[row + (x < width - 1 ? x + 1 : x)];
        tmp[row + x] = (l + 2 * src[row + x] + r) * 0.25;
      }
    }
    const out = new Float32Array(src.length);
    for (let y = 0; y < height; y++) {
      const up = (y > 0 ? y - 1 : 0) * width;
      const down = (y < height - 1 ? y + 1 : y) * width;
      const row = y * width;
      for (let x = 0; x < width; x++) out[row + x] = (tmp[up + x] + 2 * tmp[row + x] + tmp[down + x]) * 0.25;
    }
    src = out;
  }
  return src;
}

function median(values: ArrayLike<number>): number {
  const sorted = Array.from(values).sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)] ?? 0;
}

/** Solves the n×n system a·x = b (row-major a) by Gaussian elimination with partial pivoting; null if singular. */
function solve(a: number[], b: number[], n: number): number[] | null {
  const m = a.slice();
  const r = b.slice();
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let row = col + 1; row < n; row++) if (Math.abs(m[row * n + col]) > Math.abs(m[pivot * n + col])) pivot = row;
    if (Math.abs(m[pivot * n + col]) < 1e-12) return null;
    if (pivot !== col) {
      for (let k = 0; k < n; k++) [m[col * n + k], m[pivot * n + k]] = [m[pivot * n + k], m[col * n + k]];
      [r[col], r[pivot]] = [r[pivot], r[col]];
    }
    for (let row = col + 1; row < n; row++) {
      const f = m[row * n + col] / m[col * n + col];
      for (let k = col; k < n; k++) m[row * n + k] -= f * m[col * n + k];
      r[row] -= f * r[col];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let row = n - 1; row >= 0; row--) {
    let sum = r[row];
    for (let k = row + 1; k < n; k++) sum -= m[row * n + k] * x[k];
    x[row] = sum / m[row * n + row];
  }
  return x;
}

const quadraticTerms = (x: number, y: number) => [1, x, y, x * x, x * y, y * y];

/**
 * The ground (cloth, or the dark behind a copper face) as a smooth surface: a quadratic in x and y fitted by
 * least squares to a band along the picture's edge, refitted without the samples that lie on the motif's side
 * of it (ink that touches the edge), so light that falls off across the picture is taken out. `spread` is the
 * ground's own scatter (1.4826 × median absolute residual, a robust standard deviation).
 */
function groundSurface(data: Float32Array, width: number, height: number, darkIsWax: boolean) {
  const band = Math.max(1, Math.round(Math.min(width, height) * 0.04));
  const step = Math.max(1, Math.floor(Math.max(width, height) / 128));
  const points: { t: number[]; v: number }[] = [];
  const nx = (x: number) => (2 * x) / Math.max(1, width - 1) - 1;
  const ny = (y: number) => (2 * y) / Math.max(1, height - 1) - 1;
  for (let y = 0; y < height; y += step) {
    for (let x = 0; x < width; x += step) {
      if (x < band || y < band || x >= width - band || y >= height - band) points.push({ t: quadraticTerms(nx(x), ny(y)), v: data[y * width + x] });
    }
  }
  let kept = points;
  let coefficients = [median(points.map((p) => p.v)), 0, 0, 0, 0, 0];
  let spread = 0;
  const residual = (p: { t: number[]; v: number }) => p.v - p.t.reduce((sum, t, i) => sum + t * coefficients[i], 0);
  for (let round = 0; round < 4; round++) {
    const a = new Array<number>(36).fill(0);
    const b = new Array<number>(6).fill(0);
    for (const p of kept) {
      for (let i = 0; i < 6; i++) {
        b[i] += p.t[i] * p.v;
        for (let j = 0; j < 6; j++) a[i * 6 + j] += p.t[i] * p.t[j];
      }
    }
    coefficients = solve(a, b, 6) ?? coefficients;
    spread = 1.4826 * median(kept.map((p) => Math.abs(residual(p)))) + 1;
    // Ink lies darker than the ground on a print, lighter on a face photo: leave out what lies far on that side.
    const next = points.filter((p) => (darkIsWax ? residual(p) > -2.5 * spread : residual(p) < 2.5 * spread));
    if (next.length < 12) break;
    kept = next;
  }
  const [c0, cx, cy, cxx, cxy, cyy] = coefficients;
  const at = (x: number, y: number) => {
    const u = nx(x);
    const v = ny(y);
    return c0 + cx * u + cy * v + cxx * u * u + cxy * u * v + cyy * v * v;
  };
  return { at, spread };
}

/**
 * How much wax each pixel shows, 0…1. Otsu's threshold splits the picture, and the side of it that the band
 * along the edge lies on (cloth, or the dark behind a copper face, lies around a motif) decides the polarity.
 * The ground is then modelled as a smooth surface (uneven light is taken out), and a pixel counts by how far
 * it lies from that surface towards the motif's mean level, with a dead zone above the ground's own grain.
 */
export function inkMap(data: Float32Array, width: number, height: number): { ink: Float32Array; polarity: Polarity } {
  const ring: number[] = [];
  const band = Math.max(1, Math.round(Math.min(width, height) * 0.04));
  const stepX = Math.max(1, Math.floor(width / 96));
  const stepY = Math.max(1, Math.floor(height / 96));
  for (let y = 0; y < height; y += stepY) {
    for (let x = 0; x < width; x += stepX) {
      if (x < band || y < band || x >= width - band || y >= height - band) ring.push(data[y * width + x]);
    }
  }
  const grey = new Uint8Array(data.length);
  for (let i = 0; i < data.length; i++) grey[i] = Math.max(0, Math.min(255, Math.round(data[i])));
  const { threshold } = otsuThreshold(greyHistogram({ data: grey, widthPx: width, heightPx: height }));
  const darkIsWax = median(ring) > threshold + 0.5;
  const ground = groundSurface(data, width, height, darkIsWax);
  // Distance from the ground towards the motif, in grey levels.
  const lift = new Float32Array(data.length);
  const liftGrey = new Uint8Array(data.length);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = y * width + x;
      lift[i] = darkIsWax ? ground.at(x, y) - data[i] : data[i] - ground.at(x, y);
      liftGrey[i] = Math.max(0, Math.min(255, Math.round(lift[i])));
    }
  }
  const split = otsuThreshold(greyHistogram({ data: liftGrey, widthPx: width, heightPx: height })).threshold;
  let sum = 0;
  let n = 0;
  for (let i = 0; i < lift.length; i++) {
    if (lift[i] > split) {
      sum += lift[i];
      n++;
    }
  }
  const span = Math.max(8, n ? sum / n : 0);
  const dead = Math.min(0.45, Math.max(0.2, (3 * ground.spread) / span));
  const ink = new Float32Array(data.length);
  for (let i = 0; i < data.length; i++) ink[i] = Math.max(0, Math.min(1, (lift[i] / span - dead) / 0.5));
  // A scanner's or a photo's edge (a light line, a shadow) is no part of the motif.
  const frame = Math.max(1, Math.round(Math.min(width, height) * 0.01));
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) if (x < frame || y < frame || x >= width - frame || y >= height - frame) ink[y * width + x] = 0;
  }
  return { ink, polarity: darkIsWax ? "darkIsWax" : "lightIsWax" };
}

/** The ink with its holes filled: ground not reachable from the picture's edge through ground is counted as ink. */
export function fillHoles(ink: Float32Array, width: number, height: number, level = 0.5): Float32Array {
  const outside = new Uint8Array(ink.length);
  const stack = new Int32Array(ink.length);
  let top = 0;
  const push = (i: number) => {
    if (!outside[i] && ink[i] < level) {
      outside[i] = 1;
      stack[top++] = i;
    }
  };
  for (let x = 0; x < width; x++) {
    push(x);
    push((height - 1) * width + x);
  }
  for (let y = 0; y < height; y++) {
    push(y * width);
    push(y * width + width - 1);
  }
  while (top > 0) {
    const i = stack[--top];
    const x = i % width;
    if (x > 0) push(i - 1);
    if (x < width - 1) push(i + 1);
    if (i >= width) push(i - width);
    if (i < ink.length - width) push(i + width);
  }
  const filled = new Float32Array(ink.length);
  for (let i = 0; i < ink.length; i++) filled[i] = outside[i] ? ink[i] : Math.max(ink[i], 1);
  return filled;
}

/** Sobel gradient magnitude. */
function edges(map: Float32Array, width: number, height: number): Float32Array {
  const out = new Float32Array(map.length);
  for (let y = 0; y < height; y++) {
    const up = (y > 0 ? y - 1 : 0) * width;
    const row = y * width;
    const down = (y < height - 1 ? y + 1 : y) * width;
    for (let x = 0; x < width; x++) {
      const l = x > 0 ? x - 1 : 0;
      const r = x < width - 1 ? x + 1 : x;
      const gx = map[up + r] + 2 * map[row + r] + map[down + r] - map[up + l] - 2 * map[row + l] - map[down + l];
      const gy = map[down + l] + 2 * map[down + x] + map[down + r] - map[up + l] - 2 * map[up + x] - map[up + r];
      out[row + x] = Math.sqrt(gx * gx + gy * gy);
    }
  }
  return out;
}

/** The working maps of a picture: reduced, blurred against grain, ink, filled silhouette and edges. */
export function motifMaps(raster: GreyRaster): MotifMaps {
  const reduced = reduceRaster(raster, SIGNATURE_WORK_SIDE);
  const { width, height } = reduced;
  const smooth = blur(reduced.data, width, height, 2);
  const { ink, polarity } = inkMap(smooth, width, height);
  return { width, height, ink, filled: fillHoles(ink, width, height), edge: blur(edges(ink, width, height), width, height), polarity };
}

/** The range along an axis holding all but `tail` of the mass at each end, [first, last] (in histogram bins). */
function massRange(profile: Float64Array, tail: number): [number, number] {
  let total = 0;
  for (let i = 0; i < profile.length; i++) total += profile[i];
  if (total <= 0) return [0, profile.length - 1];
  let acc = 0;
  let first = 0;
  for (let i = 0; i < profile.length; i++) {
    acc += profile[i];
    if (acc >= total * tail) {
      first = i;
      break;
    }
  }
  acc = 0;
  let last = profile.length - 1;
  for (let i = profile.length - 1; i >= 0; i--) {
    acc += profile[i];
    if (acc >= total * tail) {
      last = i;
      break;
    }
  }
  return first <= last ? [first, last] : [0, profile.length - 1];
}

/** Zero mean, then scaled to length `norm` (all zero stays zero), in place. */
function centre(values: Float32Array, from: number, to: number, norm: number) {
  let mean = 0;
  for (let i = from; i < to; i++) mean += values[i];
  mean /= to - from;
  let ss = 0;
  for (let i = from; i < to; i++) {
    values[i] -= mean;
    ss += values[i] * values[i];
  }
  const k = ss > 0 ? norm / Math.sqrt(ss) : 0;
  for (let i = from; i < to; i++) values[i] *= k;
}

/** Crop of the motif in a frame turned by `angleDeg`: the middle 99 % of the silhouette's mass along each axis. */
function cropAt(maps: MotifMaps, angleDeg: number) {
  const { width, height, filled } = maps;
  const a = (angleDeg * Math.PI) / 180;
  const [c, s] = [Math.cos(a), Math.sin(a)];
  // Frame axes u = (c, s), v = (−s, c) about the picture's centre; histograms with one bin per pixel.
  const cx = (width - 1) / 2;
  const cy = (height - 1) / 2;
  const reach = Math.ceil(Math.hypot(width, height) / 2) + 1;
  const bins = 2 * reach + 1;
  const us = new Float64Array(bins);
  const vs = new Float64Array(bins);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const m = filled[y * width + x];
      if (m <= 0) continue;
      const dx = x - cx;
      const dy = y - cy;
      us[Math.round(dx * c + dy * s) + reach] += m;
      vs[Math.round(-dx * s + dy * c) + reach] += m;
    }
  }
  const [u0, u1] = massRange(us, 0.005);
  const [v0, v1] = massRange(vs, 0.005);
  return { c, s, cx, cy, u0: u0 - reach - 0.5, u1: u1 - reach + 0.5, v0: v0 - reach - 0.5, v1: v1 - reach + 0.5 };
}

const SUBSAMPLES = 3;

/**
 * The signature of the maps in a frame turned by `angleDeg` (0 = as the picture lies): each channel sampled on
 * a SIGNATURE_GRID grid over the motif's crop in that frame (SUBSAMPLES² bilinear samples per cell), blurred
 * once, centred and weighted (CHANNEL_WEIGHTS), and the coarse grid from 3 × 3 blocks of it.
 */
export function signatureAt(maps: MotifMaps, angleDeg = 0): MotifSignature {
  const g = SIGNATURE_GRID;
  const n = g * g;
  const crop = cropAt(maps, angleDeg);
  const du = (crop.u1 - crop.u0) / (g * SUBSAMPLES);
  const dv = (crop.v1 - crop.v0) / (g * SUBSAMPLES);
  const channels = [maps.filled, maps.ink, maps.edge];
  const raw = new Float32Array(SIGNATURE_LENGTH);
  for (let j = 0; j < g * SUBSAMPLES; j++) {
    const v = crop.v0 + (j + 0.5) * dv;
    const row = Math.floor(j / SUBSAMPLES) * g;
    for (let i = 0; i < g * SUBSAMPLES; i++) {
      const u = crop.u0 + (i + 0.5) * du;
      const x = crop.cx + u * crop.c - v * crop.s;
      const y = crop.cy + u * crop.s + v * crop.c;
      const cell = row + Math.floor(i / SUBSAMPLES);
      // Bilinear weights once for the three channels; outside the picture counts as 0.
      const x0 = Math.floor(x);
      const y0 = Math.floor(y);
      const fx = x - x0;
      const fy = y - y0;
      const w = maps.width;
      const inX0 = x0 >= 0 && x0 < w;
      const inX1 = x0 + 1 >= 0 && x0 + 1 < w;
      const inY0 = y0 >= 0 && y0 < maps.height;
      const inY1 = y0 + 1 >= 0 && y0 + 1 < maps.height;
      const w00 = inX0 && inY0 ? (1 - fx) * (1 - fy) : 0;
      const w10 = inX1 && inY0 ? fx * (1 - fy) : 0;
      const w01 = inX0 && inY1 ? (1 - fx) * fy : 0;
      const w11 = inX1 && inY1 ? fx * fy : 0;
      if (w00 + w10 + w01 + w11 === 0) continue;
      const i00 = y0 * w + x0;
      for (let k = 0; k < channels.length; k++) {
        const c = channels[k];
        raw[k * n + cell] += (w00 && c[i00]) * w00 + (w10 && c[i00 + 1]) * w10 + (w01 && c[i00 + w]) * w01 + (w11 && c[i00 + w + 1]) * w11;
      }
    }
  }
  const grid = new Float32Array(SIGNATURE_LENGTH);
  const coarse = new Float32Array(COARSE_LENGTH);
  const cg = COARSE_GRID;
  const block = g / cg;
  for (let k = 0; k < channels.length; k++) {
    const blurred = blur(raw.subarray(k * n, (k + 1) * n), g, g);
    grid.set(blurred, k * n);
    for (let y = 0; y < g; y++) for (let x = 0; x < g; x++) coarse[k * cg * cg + Math.floor(y / block) * cg + Math.floor(x / block)] += blurred[y * g + x];
    centre(grid, k * n, (k + 1) * n, Math.sqrt(CHANNEL_WEIGHTS[k]));
    centre(coarse, k * cg * cg, (k + 1) * cg * cg, Math.sqrt(CHANNEL_WEIGHTS[k]));
  }
  return { grid, coarse, aspect: (crop.u1 - crop.u0) / (crop.v1 - crop.v0), polarity: maps.polarity };
}

/** The signature of a picture as it lies. */
export function motifSignature(raster: GreyRaster): MotifSignature {
  return signatureAt(motifMaps(raster), 0);
}

/** The eight turns and mirrors of a square (dihedral group D4). */
export interface SquareSymmetry {
  /** Quarter turns clockwise, 0…3, applied after the mirror. */
  turns: 0 | 1 | 2 | 3;
  /** Mirrored left–right first. */
  mirrored: boolean;
}

export const squareSymmetries: readonly SquareSymmetry[] = [0, 1, 2, 3].flatMap((turns) => [false, true].map((mirrored) => ({ turns: turns as SquareSymmetry["turns"], mirrored })));

/** Index map of a symmetry on a g×g grid (row-major): cell i of the result comes from cell map[i]. */
export function symmetryMap(s: SquareSymmetry, g: number): Uint16Array {
  const map = new Uint16Array(g * g);
  for (let y = 0; y < g; y++) {
    for (let x = 0; x < g; x++) {
      // Undo the turns (counter-clockwise), then the mirror, to find the source cell.
      let sx = x;
      let sy = y;
      for (let t = 0; t < s.turns; t++) [sx, sy] = [sy, g - 1 - sx];
      if (s.mirrored) sx = g - 1 - sx;
      map[y * g + x] = sy * g + sx;
    }
  }
  return map;
}

/** A grid of several channels under a symmetry. */
export function transformGrid(grid: Float32Array, g: number, map: Uint16Array): Float32Array {
  const n = g * g;
  const out = new Float32Array(grid.length);
  for (let c = 0; c < grid.length / n; c++) for (let i = 0; i < n; i++) out[c * n + i] = grid[c * n + map[i]];
  return out;
}
