import sharp from "sharp";
import { seededUniform } from "./seeded-random";
import { hashString, mirrorSvg, motifSvg, rasteriseSvg, renderScan, seededGrain, svgPixelSize, type ScanStyle } from "../seed/scan-art";

// A labelled set for search by picture, built from the invented demo art (scripts/seed/scan-art.ts): reference
// scans made the way the demo seed makes them, and queries that are the same stamps pictured again — turned by
// up to ±5°, scaled 90–110 %, at another DPI, on other cloth grain and lighting, with cloth around them, as
// JPEG —, mirrored (a query for the back-face twin), as a face photo (light on dark, the mirror image) against
// a wax print (dark on light) and the other way round, and unrelated motifs that are in no reference at all.
// Deterministic: the same options give the same bytes.

/** One stamp of the reference set, as the shelf would hold it. */
export interface SetStamp {
  code: string;
  /** Seed of its art (the family follows from it). */
  seed: number;
  widthMm: number;
  heightMm: number;
  /** A back-face twin: its art is its partner's mirrored. */
  mirrored: boolean;
  twinCode: string | null;
  /** The scans on record: a wax print, a face photo or both. */
  scans: ScanStyle[];
}

export interface ReferenceScan {
  code: string;
  kind: ScanStyle;
  bytes: Buffer;
}

export type QueryCase = "rescan" | "quarterTurn" | "faceOfPrint" | "printOfFace" | "twin" | "unrelated";

export interface SetQuery {
  label: string;
  case: QueryCase;
  /** What the picture shows, as a caller would say it (`?kind=`). */
  kind: ScanStyle;
  /** The stamp that should come first; null for an unrelated motif. */
  expected: string | null;
  bytes: () => Promise<Buffer>;
}

/** Sizes like the demo shelf's: mostly square main stamps of 18–30 cm, some oblong, fillers, corners and long borders. */
function stampSize(rnd: () => number): { widthMm: number; heightMm: number } {
  const kind = rnd();
  if (kind < 0.1) {
    const w = 60 + Math.round(rnd() * 60);
    return { widthMm: w, heightMm: w };
  }
  if (kind < 0.2) return { widthMm: 280 + Math.round(rnd() * 40), heightMm: 70 + Math.round(rnd() * 30) };
  if (kind < 0.25) {
    const w = 120 + Math.round(rnd() * 40);
    return { widthMm: w, heightMm: w };
  }
  const w = 180 + Math.round(rnd() * 120);
  return { widthMm: w, heightMm: rnd() < 0.7 ? w : 180 + Math.round(rnd() * 120) };
}

export interface LabelledSetOptions {
  /** Stamps in the reference set (default 40). */
  stamps?: number;
  /** Unrelated queries (default a quarter of the stamps). */
  unrelated?: number;
  /** Seed of the whole set (default 2026). */
  seed?: number;
  /** Code prefix of the set's stamps (default "SIM"). */
  prefix?: string;
  /** DPI of the reference scans (default 100, as the demo seed). */
  referenceDpi?: number;
}

export interface LabelledSet {
  stamps: SetStamp[];
  references: () => Promise<ReferenceScan[]>;
  queries: SetQuery[];
}

const PRINT_GROUND = { r: 0xf3, g: 0xee, b: 0xe4 };
const FACE_GROUND = { r: 0x1c, g: 0x15, b: 0x10 };

export interface PictureChanges {
  dpi: number;
  /** Turn in degrees, clockwise, before any quarter turns. */
  angleDeg: number;
  /** Size of the motif against its nominal size at `dpi`. */
  scale: number;
  /** Cloth around the stamp on each side, as a fraction of its size. */
  marginFraction: number;
  /** Cloth grain 0…1 (as renderScan). */
  grain: number;
  /** Overall brightness factor. */
  gain: number;
  /** Lighting falling off across the picture: ±gradient about the gain. */
  gradient: number;
  gradientAngleDeg: number;
  quarterTurns: 0 | 1 | 2 | 3;
  /** Mirror the finished picture left–right. */
  mirror: boolean;
  jpegQuality: number;
}

/** Randomly drawn changes of a picture taken again: ±5°, 90–110 %, 60–150 DPI, grain, light, margin, JPEG. */
export function randomChanges(rnd: () => number, overrides: Partial<PictureChanges> = {}): PictureChanges {
  const dpis = [60, 75, 100, 150];
  return {
    dpi: dpis[Math.floor(rnd() * dpis.length)],
    angleDeg: (rnd() * 2 - 1) * 5,
    scale: 0.9 + rnd() * 0.2,
    marginFraction: rnd() * 0.1,
    grain: 0.1 + rnd() * 0.7,
    gain: 0.85 + rnd() * 0.25,
    gradient: rnd() * 0.15,
    gradientAngleDeg: rnd() * 360,
    quarterTurns: 0,
    mirror: false,
    jpegQuality: 70 + Math.round(rnd() * 22),
    ...overrides,
  };
}

/**
 * The art pictured again with `changes`: rendered at dpi × scale, mirrored if asked, turned by the angle and the
 * quarter turns (the corners filled with the ground), cloth added around it, then grain and uneven light laid
 * over it, as a JPEG that declares `dpi`.
 */
export async function picture(svg: string, style: ScanStyle, changes: PictureChanges): Promise<Buffer> {
  const ground = style === "face" ? FACE_GROUND : PRINT_GROUND;
  const dpi = changes.dpi * changes.scale;
  const size = svgPixelSize(svg, dpi);
  const rendered = await rasteriseSvg(svg, dpi);
  let image = sharp(rendered, { raw: { width: size.widthPx, height: size.heightPx, channels: 3 } });
  if (changes.mirror) image = image.flop();
  const margin = Math.round(Math.max(size.widthPx, size.heightPx) * changes.marginFraction);
  const { data, info } = await image
    .rotate(changes.angleDeg + 90 * changes.quarterTurns, { background: ground })
    .extend({ top: margin, bottom: margin, left: margin, right: margin, background: ground })
    .removeAlpha()
    .raw()
    .toBuffer({ resolveWithObject: true });
  const raw = { width: info.width, height: info.height, channels: 3 as const };
  const noise = seededGrain(info.width * info.height * 3, 60 * changes.grain, hashString(`${svg}|${JSON.stringify(changes)}`));
  const grained = await sharp(data, { raw }).composite([{ input: noise, raw, blend: "soft-light" }]).removeAlpha().raw().toBuffer();
  const a = (changes.gradientAngleDeg * Math.PI) / 180;
  const [cx, cy] = [Math.cos(a), Math.sin(a)];
  const reach = Math.abs(cx) * info.width + Math.abs(cy) * info.height || 1;
  const x0 = Math.min(0, cx * info.width) + Math.min(0, cy * info.height);
  for (let y = 0; y < info.height; y++) {
    for (let x = 0; x < info.width; x++) {
      const t = (x * cx + y * cy - x0) / reach;
      const light = changes.gain * (1 + changes.gradient * (2 * t - 1));
      const i = (y * info.width + x) * 3;
      for (let c = 0; c < 3; c++) grained[i + c] = Math.max(0, Math.min(255, Math.round(grained[i + c] * light)));
    }
  }
  return sharp(grained, { raw }).jpeg({ quality: changes.jpegQuality }).withMetadata({ density: changes.dpi }).toBuffer();
}

/** The art of a set stamp in one style (a twin's is its partner's mirrored; a face photo is mirrored again by motifSvg). */
export function artOf(stamp: SetStamp, style: ScanStyle, bySeed: Map<string, SetStamp>): string {
  const source = stamp.mirrored && stamp.twinCode ? (bySeed.get(stamp.twinCode) ?? stamp) : stamp;
  const svg = motifSvg({ seed: source.seed, widthMm: stamp.widthMm, heightMm: stamp.heightMm, style });
  return stamp.mirrored ? mirrorSvg(svg, stamp.widthMm) : svg;
}

/**
 * The labelled set: `stamps` reference stamps (every eighth a front with its mirrored back twin after it; every
 * fourth also has a face photo on record, every seventh only a face photo), and for each stamp a rescan, a
 * quarter-turned rescan (square stamps), a face photo against its print or a print against its face photo,
 * and for each front of a pair a mirrored picture of it whose answer is its twin; plus unrelated motifs.
 */
export function labelledSet(options: LabelledSetOptions = {}): LabelledSet {
  const count = options.stamps ?? 40;
  const seed = options.seed ?? 2026;
  const prefix = options.prefix ?? "SIM";
  const referenceDpi = options.referenceDpi ?? 100;
  const rnd = seededUniform(seed);
  const stamps: SetStamp[] = [];
  for (let i = 0; i < count; i++) {
    const code = `${prefix}-${String(i + 1).padStart(4, "0")}`;
    const size = stampSize(rnd);
    const scans: ScanStyle[] = i % 7 === 3 ? ["face"] : i % 4 === 0 ? ["print", "face"] : ["print"];
    stamps.push({ code, seed: Math.floor(rnd() * 2 ** 31), ...size, mirrored: false, twinCode: null, scans });
  }
  for (let i = 0; i + 1 < stamps.length; i += 8) {
    const [front, back] = [stamps[i], stamps[i + 1]];
    Object.assign(back, { widthMm: front.widthMm, heightMm: front.heightMm, mirrored: true, twinCode: front.code, scans: ["print"] });
    front.twinCode = back.code;
  }
  const bySeed = new Map(stamps.map((s) => [s.code, s]));

  const references = async () => {
    const out: ReferenceScan[] = [];
    for (const stamp of stamps) {
      for (const kind of stamp.scans) out.push({ code: stamp.code, kind, bytes: await renderScan(artOf(stamp, kind, bySeed), referenceDpi, { format: kind === "print" ? "png" : "jpeg" }) });
    }
    return out;
  };

  const queries: SetQuery[] = [];
  const add = (label: string, c: QueryCase, kind: ScanStyle, expected: string | null, svg: string, changes: PictureChanges) =>
    queries.push({ label, case: c, kind, expected, bytes: () => picture(svg, kind, changes) });
  for (const stamp of stamps) {
    const onRecord = stamp.scans;
    add(`${stamp.code} rescan`, "rescan", "print", stamp.code, artOf(stamp, "print", bySeed), randomChanges(rnd));
    if (stamp.widthMm === stamp.heightMm) {
      add(`${stamp.code} quarter turn`, "quarterTurn", "print", stamp.code, artOf(stamp, "print", bySeed), randomChanges(rnd, { quarterTurns: (1 + Math.floor(rnd() * 3)) as 1 | 2 | 3 }));
    }
    if (onRecord.includes("print")) add(`${stamp.code} face photo`, "faceOfPrint", "face", stamp.code, artOf(stamp, "face", bySeed), randomChanges(rnd));
    else add(`${stamp.code} print of a face photo`, "printOfFace", "print", stamp.code, artOf(stamp, "print", bySeed), randomChanges(rnd));
    if (stamp.twinCode && !stamp.mirrored) {
      add(`${stamp.code} mirrored → ${stamp.twinCode}`, "twin", "print", stamp.twinCode, artOf(stamp, "print", bySeed), randomChanges(rnd, { mirror: true }));
    }
  }
  const unrelated = options.unrelated ?? Math.ceil(count / 4);
  for (let i = 0; i < unrelated; i++) {
    const size = stampSize(rnd);
    const svg = motifSvg({ seed: Math.floor(rnd() * 2 ** 31), ...size, style: "print" });
    add(`unrelated ${i + 1}`, "unrelated", "print", null, svg, randomChanges(rnd));
  }
  return { stamps, references, queries };
}
