import sharp from "sharp";
import type { GreyRaster } from "./otsu";

/** Side of the reduced image the hash is taken from, px. */
export const HASH_INPUT_SIDE = 32;
/** Side of the block of low frequencies that become the 64 bits. */
const BLOCK = 8;

const cosTable = (() => {
  const n = HASH_INPUT_SIDE;
  const table = new Float64Array(n * n);
  for (let k = 0; k < n; k++) for (let i = 0; i < n; i++) table[k * n + i] = Math.cos(((2 * i + 1) * k * Math.PI) / (2 * n));
  return table;
})();

/**
 * Unnormalised 2-D DCT-II of an N×N block (N = 32), row-major: C(v,u) = Σ_y Σ_x p(y,x)·cos((2x+1)uπ/2N)·cos((2y+1)vπ/2N).
 * Only the first `keep` rows and columns of coefficients are computed.
 */
export function dct2d(pixels: ArrayLike<number>, keep = HASH_INPUT_SIDE): Float64Array {
  const n = HASH_INPUT_SIDE;
  const rows = new Float64Array(n * keep);
  for (let y = 0; y < n; y++) {
    for (let u = 0; u < keep; u++) {
      let sum = 0;
      for (let x = 0; x < n; x++) sum += pixels[y * n + x] * cosTable[u * n + x];
      rows[y * keep + u] = sum;
    }
  }
  const out = new Float64Array(keep * keep);
  for (let v = 0; v < keep; v++) {
    for (let u = 0; u < keep; u++) {
      let sum = 0;
      for (let y = 0; y < n; y++) sum += rows[y * keep + u] * cosTable[v * n + y];
      out[v * keep + u] = sum;
    }
  }
  return out;
}

/**
 * 64-bit DCT perceptual hash of a 32×32 grey block, as 16 hex digits: the 8×8 lowest frequencies after the
 * constant row and column (u, v = 1…8, which carry overall brightness and one-sided gradients), each bit set
 * when its coefficient is above their median; bits in row-major order, most significant first.
 * Limitation: a motif that is exactly mirror-symmetric has its odd-frequency coefficients at zero, so those
 * bits follow noise and two scans of it can differ in up to about 20 bits; hand-made stamps are rarely that
 * symmetric. A dead zone around the median was tried and dropped: it made different symmetric motifs collide.
 */
export function dctHash(pixels: ArrayLike<number>): string {
  if (pixels.length !== HASH_INPUT_SIDE * HASH_INPUT_SIDE) throw new RangeError(`expected ${HASH_INPUT_SIDE}² pixels`);
  const keep = BLOCK + 1;
  const dct = dct2d(pixels, keep);
  const coefficients: number[] = [];
  for (let v = 1; v <= BLOCK; v++) for (let u = 1; u <= BLOCK; u++) coefficients.push(dct[v * keep + u]);
  const sorted = [...coefficients].sort((a, b) => a - b);
  const median = (sorted[31] + sorted[32]) / 2;
  let hex = "";
  for (let nibble = 0; nibble < 16; nibble++) {
    let value = 0;
    for (let bit = 0; bit < 4; bit++) value = (value << 1) | (coefficients[nibble * 4 + bit] > median ? 1 : 0);
    hex += value.toString(16);
  }
  return hex;
}

function mirrorBlock(pixels: Uint8Array): Uint8Array {
  const n = HASH_INPUT_SIDE;
  const out = new Uint8Array(n * n);
  for (let y = 0; y < n; y++) for (let x = 0; x < n; x++) out[y * n + x] = pixels[y * n + (n - 1 - x)];
  return out;
}

async function reduce(raster: GreyRaster): Promise<Uint8Array> {
  const { data } = await sharp(raster.data, { raw: { width: raster.widthPx, height: raster.heightPx, channels: 1 } })
    .resize(HASH_INPUT_SIDE, HASH_INPUT_SIDE, { fit: "fill" })
    .greyscale()
    .raw()
    .toBuffer({ resolveWithObject: true });
  return new Uint8Array(data.buffer, data.byteOffset, data.length);
}

export interface MotifHashes {
  /** Hash of the scan as it lies. */
  hash: string;
  /** Hash of the scan mirrored left–right: what a back-face twin's scan hashes to. */
  mirroredHash: string;
}

/**
 * Both perceptual hashes of a grey raster: the image squeezed to 32×32 (sharp, area-averaging reduction,
 * aspect ignored), then `dctHash` of it and of its left–right mirror.
 */
export async function motifHashes(raster: GreyRaster): Promise<MotifHashes> {
  const block = await reduce(raster);
  return { hash: dctHash(block), mirroredHash: dctHash(mirrorBlock(block)) };
}

/** 64-bit perceptual hash of a grey raster, 16 hex digits (see `motifHashes`). */
export async function perceptualHash(raster: GreyRaster): Promise<string> {
  return (await motifHashes(raster)).hash;
}

/** Perceptual hash of the raster mirrored left–right, 16 hex digits. */
export async function mirroredHash(raster: GreyRaster): Promise<string> {
  return (await motifHashes(raster)).mirroredHash;
}

const HASH_PATTERN = /^[0-9a-f]{16}$/i;

function popcount32(x: number): number {
  x -= (x >>> 1) & 0x55555555;
  x = (x & 0x33333333) + ((x >>> 2) & 0x33333333);
  x = (x + (x >>> 4)) & 0x0f0f0f0f;
  return Math.imul(x, 0x01010101) >>> 24;
}

/** Number of differing bits between two 64-bit hashes given as 16 hex digits (0…64). */
export function hamming(a: string, b: string): number {
  if (!HASH_PATTERN.test(a) || !HASH_PATTERN.test(b)) throw new RangeError("hashes must be 16 hex digits");
  const high = parseInt(a.slice(0, 8), 16) ^ parseInt(b.slice(0, 8), 16);
  const low = parseInt(a.slice(8), 16) ^ parseInt(b.slice(8), 16);
  return popcount32(high) + popcount32(low);
}

export interface HashCandidate<Id> {
  id: Id;
  hash: string;
}

export interface HashMatch<Id> {
  id: Id;
  /** Hamming distance of the better orientation, 0…64. */
  distance: number;
  /** "mirrored" when the candidate matches the target's mirror image better (a back-face twin). */
  orientation: "same" | "mirrored";
}

/**
 * The k candidates nearest to the target by Hamming distance: min(hamming(target.hash, c.hash),
 * hamming(target.mirroredHash, c.hash)). The orientation is "mirrored" only when the mirrored comparison is
 * at least `mirrorMarginBits` (default 1) closer than the straight one, else "same". Sorted by distance, then
 * by candidate order; `maxDistance` drops candidates farther than it.
 */
export function nearest<Id>(
  target: MotifHashes,
  candidates: readonly HashCandidate<Id>[],
  k: number,
  options: { maxDistance?: number; mirrorMarginBits?: number } = {},
): HashMatch<Id>[] {
  const margin = options.mirrorMarginBits ?? 1;
  const matches = candidates.map((candidate, index) => {
    const same = hamming(target.hash, candidate.hash);
    const mirrored = hamming(target.mirroredHash, candidate.hash);
    const orientation: HashMatch<Id>["orientation"] = same - mirrored >= margin ? "mirrored" : "same";
    return { id: candidate.id, distance: Math.min(same, mirrored), orientation, index };
  });
  return matches
    .filter((m) => options.maxDistance === undefined || m.distance <= options.maxDistance)
    .sort((a, b) => a.distance - b.distance || a.index - b.index)
    .slice(0, Math.max(0, k))
    .map(({ id, distance, orientation }) => ({ id, distance, orientation }));
}
