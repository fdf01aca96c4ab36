import type { GreyRaster } from "./otsu";
import {
  CHANNEL_WEIGHTS,
  COARSE_GRID,
  COARSE_LENGTH,
  SIGNATURE_GRID,
  SIGNATURE_LENGTH,
  motifMaps,
  signatureAt,
  squareSymmetries,
  symmetryMap,
  transformGrid,
  type MotifSignature,
  type SquareSymmetry,
} from "./signature";

// Search by picture: a query picture against the stored signatures of every scan. A cheap pass on the coarse
// grids shortlists candidates, the full grids rank them. The query is tried in the eight turns and mirrors of a
// square and a few small turns (a picture taken again is rarely square to the camera); a stored scan is one
// signature as it lies.

export type PictureKind = "print" | "face";

/**
 * Farthest distance (0 the same … 1 the opposite) still answered as a match, and the nearest that counts as
 * close. Measured on the labelled set (scripts/lib/similar-set.ts, tests/unit/scans/similar-set.test.ts): the
 * true stamp lies within 0.1 in about 95 % of queries (a face photo against a print is the far tail, up to about
 * 0.2); unrelated motifs came no nearer than about 0.13.
 */
export const SIMILAR_MAX_DISTANCE = 0.2;
export const CLOSE_DISTANCE = 0.1;
/** Small turns the query is tried at, degrees (a rescan lies within ±5°). */
export const QUERY_ANGLES_DEG = [-4, -2, 0, 2, 4] as const;
/** An oblong motif's crop moves more with a small turn: it is tried every degree up to ±5°. */
export const OBLONG_QUERY_ANGLES_DEG = [-5, -4, -3, -2, -1, 0, 1, 2, 3, 4, 5] as const;
/**
 * A face photo (outlines of copper strips) and a wax print (solid wax) of one stamp lie farther apart than two
 * pictures of one kind, and so do unrelated motifs (measured on the labelled set): between the kinds distances
 * are scaled by this so one cut-off serves both.
 */
export const CROSS_KIND_SCALE = 0.6;
/**
 * Added to a match that needed a mirror, and to one that needed a quarter turn, so that of a pair of mirror twins
 * the one that matches as it lies comes first (both match equally well otherwise).
 */
export const MIRROR_PENALTY = 0.1;
export const TURN_PENALTY = 0.004;
/** Candidates kept from the coarse pass for the full comparison. */
export const SHORTLIST = 48;
/** A crop's width / height may differ by this factor and still match (cloth around it, a trimmed photo). */
export const ASPECT_TOLERANCE = 1.3;

export interface StoredSignature<Ref = unknown> {
  /** What the caller wants back (scan id, stamp code…). */
  ref: Ref;
  kind: PictureKind;
  signature: MotifSignature;
}

export interface QueryVariant {
  symmetry: SquareSymmetry;
  angleDeg: number;
  grid: Float32Array;
  coarse: Float32Array;
  aspect: number;
}

export interface SimilarQuery {
  kind: PictureKind;
  variants: QueryVariant[];
}

export interface SimilarMatch<Ref = unknown> {
  ref: Ref;
  distance: number;
  /** The match needed a mirror beyond the one between a face photo and a print. */
  mirrored: boolean;
  symmetry: SquareSymmetry;
}

const gridMaps = squareSymmetries.map((s) => symmetryMap(s, SIGNATURE_GRID));
const coarseMaps = squareSymmetries.map((s) => symmetryMap(s, COARSE_GRID));

/** What kind of picture a query shows when the caller does not say: light motif on dark → a face photo. */
export function kindOfSignature(signature: MotifSignature): PictureKind {
  return signature.polarity === "lightIsWax" ? "face" : "print";
}

/** The query's variants: each small turn × each of the eight square symmetries. */
export function similarQuery(raster: GreyRaster, kind?: PictureKind): SimilarQuery {
  const maps = motifMaps(raster);
  const variants: QueryVariant[] = [];
  const asLies = signatureAt(maps, 0);
  const oblong = asLies.aspect > 1.4 || asLies.aspect < 1 / 1.4;
  for (const angleDeg of oblong ? OBLONG_QUERY_ANGLES_DEG : QUERY_ANGLES_DEG) {
    const signature = angleDeg === 0 ? asLies : signatureAt(maps, angleDeg);
    squareSymmetries.forEach((symmetry, i) => {
      variants.push({
        symmetry,
        angleDeg,
        grid: transformGrid(signature.grid, SIGNATURE_GRID, gridMaps[i]),
        coarse: transformGrid(signature.coarse, COARSE_GRID, coarseMaps[i]),
        aspect: symmetry.turns % 2 ? 1 / signature.aspect : signature.aspect,
      });
    });
  }
  return { kind: kind ?? kindOfSignature(asLies), variants };
}

/**
 * How much each channel (filled silhouette, ink, edges) counts: between pictures of one kind, and between a
 * face photo (outlines of copper strips) and a wax print (solid wax), which share mostly the silhouette.
 */
export interface ChannelMix {
  same: readonly [number, number, number];
  cross: readonly [number, number, number];
}
export const CHANNEL_MIX: ChannelMix = { same: [0.4, 0.2, 0.4], cross: [0.6, 0.1, 0.3] };

const CHANNEL_CELLS = [SIGNATURE_GRID * SIGNATURE_GRID, COARSE_GRID * COARSE_GRID] as const;

/** Weighted mean of the per-channel cosines (each channel portion has length √CHANNEL_WEIGHTS[k]). */
function similarity(a: Float32Array, b: Float32Array, mix: readonly [number, number, number], coarse: boolean): number {
  const n = CHANNEL_CELLS[coarse ? 1 : 0];
  let total = 0;
  let weights = 0;
  for (let k = 0; k < 3; k++) {
    if (!mix[k]) continue;
    let sum = 0;
    for (let i = k * n, end = (k + 1) * n; i < end; i++) sum += a[i] * b[i];
    total += (mix[k] * sum) / CHANNEL_WEIGHTS[k];
    weights += mix[k];
  }
  return total / weights;
}


function aspectFits(a: number, b: number): boolean {
  const r = a > b ? a / b : b / a;
  return r <= ASPECT_TOLERANCE;
}

/** A stored signature as a query (the eight square symmetries, no small turns: it was taken as it lies). */
export function queryOfSignature(signature: MotifSignature, kind: PictureKind): SimilarQuery {
  return {
    kind,
    variants: squareSymmetries.map((symmetry, i) => ({
      symmetry,
      angleDeg: 0,
      grid: transformGrid(signature.grid, SIGNATURE_GRID, gridMaps[i]),
      coarse: transformGrid(signature.coarse, COARSE_GRID, coarseMaps[i]),
      aspect: symmetry.turns % 2 ? 1 / signature.aspect : signature.aspect,
    })),
  };
}

/** Cosine similarity → distance 0 (the same) … 1 (the opposite). */
const distanceOf = (cosine: number) => Math.max(0, Math.min(1, (1 - cosine) / 2));

/**
 * Stored signatures nearest the query, best first, at most `limit`, each at most `maxDistance` away. A face
 * photo is the mirror image of its print, so between a face and a print the mirror is expected and not reported.
 */
export function findSimilar<Ref>(
  query: SimilarQuery,
  stored: readonly StoredSignature<Ref>[],
  options: { limit?: number; maxDistance?: number; mix?: ChannelMix; mirrorPenalty?: number } = {},
): SimilarMatch<Ref>[] {
  const limit = options.limit ?? 10;
  const maxDistance = options.maxDistance ?? SIMILAR_MAX_DISTANCE;
  const mix = options.mix ?? CHANNEL_MIX;
  const mirrorPenalty = options.mirrorPenalty ?? MIRROR_PENALTY;
  const penalty = (v: QueryVariant, mirrored: boolean) => (mirrored ? mirrorPenalty : 0) + (v.symmetry.turns ? TURN_PENALTY : 0);
  const straight = query.variants.filter((v) => v.angleDeg === 0);
  // Coarse pass: each stored signature's best straight-angle variant.
  const scores = new Float32Array(stored.length);
  for (let k = 0; k < stored.length; k++) {
    const s = stored[k];
    const flip = s.kind !== query.kind;
    let best = -Infinity;
    for (const v of straight) {
      if (!aspectFits(v.aspect, s.signature.aspect)) continue;
      const score = similarity(v.coarse, s.signature.coarse, flip ? mix.cross : mix.same, true) - 2 * penalty(v, v.symmetry.mirrored !== flip);
      if (score > best) best = score;
    }
    scores[k] = best;
  }
  const order = Array.from(scores.keys())
    .filter((k) => scores[k] > -Infinity)
    .sort((a, b) => scores[b] - scores[a])
    .slice(0, Math.max(SHORTLIST, limit));
  const matches: Array<SimilarMatch<Ref> & { rank: number }> = [];
  for (const k of order) {
    const s = stored[k];
    const flip = s.kind !== query.kind;
    let best: (SimilarMatch<Ref> & { rank: number }) | null = null;
    for (const v of query.variants) {
      if (!aspectFits(v.aspect, s.signature.aspect)) continue;
      const mirrored = v.symmetry.mirrored !== flip;
      const distance = distanceOf(similarity(v.grid, s.signature.grid, flip ? mix.cross : mix.same, false)) * (flip ? CROSS_KIND_SCALE : 1);
      // The penalties order the answers; the distance reported is the comparison's own.
      const rank = distance + penalty(v, mirrored);
      if (!best || rank < best.rank) best = { ref: s.ref, distance, mirrored, symmetry: v.symmetry, rank };
    }
    if (best && best.distance <= maxDistance) matches.push(best);
  }
  return matches
    .sort((a, b) => a.rank - b.rank)
    .slice(0, limit)
    .map(({ ref, distance, mirrored, symmetry }) => ({ ref, distance, mirrored, symmetry }));
}

/** One match per stamp (its best scan), best first. */
export function bestPerKey<Ref>(matches: readonly SimilarMatch<Ref>[], keyOf: (ref: Ref) => string): SimilarMatch<Ref>[] {
  const seen = new Set<string>();
  return matches.filter((m) => {
    const key = keyOf(m.ref);
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

const HEADER = 2;
/** Bytes of an encoded signature. */
export const SIGNATURE_BYTES = 4 * (HEADER + SIGNATURE_LENGTH + COARSE_LENGTH);

/** A signature as bytes to store beside its scan: aspect, polarity, the grid and the coarse grid (float32, little-endian). */
export function encodeSignature(signature: MotifSignature): Buffer {
  const out = Buffer.alloc(SIGNATURE_BYTES);
  out.writeFloatLE(signature.aspect, 0);
  out.writeFloatLE(signature.polarity === "lightIsWax" ? 1 : 0, 4);
  for (let i = 0; i < SIGNATURE_LENGTH; i++) out.writeFloatLE(signature.grid[i], 4 * (HEADER + i));
  for (let i = 0; i < COARSE_LENGTH; i++) out.writeFloatLE(signature.coarse[i], 4 * (HEADER + SIGNATURE_LENGTH + i));
  return out;
}

/** The stored bytes back as a signature; null for bytes of another length (an older layout). */
export function decodeSignature(bytes: Uint8Array): MotifSignature | null {
  if (bytes.length !== SIGNATURE_BYTES) return null;
  const buf = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.length);
  const grid = new Float32Array(SIGNATURE_LENGTH);
  const coarse = new Float32Array(COARSE_LENGTH);
  for (let i = 0; i < SIGNATURE_LENGTH; i++) grid[i] = buf.readFloatLE(4 * (HEADER + i));
  for (let i = 0; i < COARSE_LENGTH; i++) coarse[i] = buf.readFloatLE(4 * (HEADER + SIGNATURE_LENGTH + i));
  return { aspect: buf.readFloatLE(0), polarity: buf.readFloatLE(4) === 1 ? "lightIsWax" : "darkIsWax", grid, coarse };
}

