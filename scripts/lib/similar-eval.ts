import { decodeGreyRaster } from "@/lib/scans";
import { motifSignature } from "@/lib/scans/signature";
import { findSimilar, similarQuery, SIMILAR_MAX_DISTANCE, type StoredSignature } from "@/lib/scans/similar";
import { labelledSet, type LabelledSetOptions, type QueryCase } from "./similar-set";

// Runs the labelled set (scripts/lib/similar-set.ts) through search by picture and counts how often the true
// stamp ranks first and in the top five, and how close unrelated motifs come. Shared by the unit test and the
// benchmark.

const DECODE = { maxPixels: 80_000_000, maxSidePx: 1024 };

export interface QueryOutcome {
  label: string;
  case: QueryCase;
  expected: string | null;
  /** 1-based rank of the expected stamp among the answers, null when it is not answered. */
  rank: number | null;
  best: { code: string; distance: number; mirrored: boolean } | null;
  /** Distance of the expected stamp when answered. */
  distance: number | null;
  matchMs: number;
}

export interface SetEvaluation {
  outcomes: QueryOutcome[];
  related: number;
  first: number;
  topFive: number;
  unrelated: number;
  /** Unrelated queries that got any answer within SIMILAR_MAX_DISTANCE. */
  unrelatedAnswered: number;
  /** Nearest distance any unrelated query came to a stored stamp. */
  unrelatedNearest: number;
  stored: StoredSignature<{ code: string }>[];
}

export async function storedSignaturesOf(options: LabelledSetOptions = {}) {
  const set = labelledSet(options);
  const stored: StoredSignature<{ code: string }>[] = [];
  for (const ref of await set.references()) {
    const raster = await decodeGreyRaster(ref.bytes, DECODE);
    stored.push({ ref: { code: ref.code }, kind: ref.kind, signature: motifSignature(raster) });
  }
  return { set, stored };
}

/** Every query of the set against the set's references (plus `extra` distractors), one answer per stamp. */
export async function evaluateSet(options: LabelledSetOptions = {}, extra: StoredSignature<{ code: string }>[] = []): Promise<SetEvaluation> {
  const { set, stored } = await storedSignaturesOf(options);
  const all = [...stored, ...extra];
  const outcomes: QueryOutcome[] = [];
  for (const q of set.queries) {
    const raster = await decodeGreyRaster(await q.bytes(), DECODE);
    const t0 = performance.now();
    const query = similarQuery(raster, q.kind);
    const raw = findSimilar(query, all, { limit: 20, maxDistance: q.expected ? SIMILAR_MAX_DISTANCE : 1 });
    const matchMs = performance.now() - t0;
    const seen = new Set<string>();
    const ranked = raw.filter((m) => !seen.has(m.ref.code) && seen.add(m.ref.code));
    const index = q.expected ? ranked.findIndex((m) => m.ref.code === q.expected) : -1;
    outcomes.push({
      label: q.label,
      case: q.case,
      expected: q.expected,
      rank: index >= 0 ? index + 1 : null,
      best: ranked[0] ? { code: ranked[0].ref.code, distance: ranked[0].distance, mirrored: ranked[0].mirrored } : null,
      distance: index >= 0 ? ranked[index].distance : null,
      matchMs,
    });
  }
  const related = outcomes.filter((o) => o.expected);
  const unrelated = outcomes.filter((o) => !o.expected);
  return {
    outcomes,
    related: related.length,
    first: related.filter((o) => o.rank === 1).length,
    topFive: related.filter((o) => o.rank !== null && o.rank <= 5).length,
    unrelated: unrelated.length,
    unrelatedAnswered: unrelated.filter((o) => o.best && o.best.distance <= SIMILAR_MAX_DISTANCE).length,
    unrelatedNearest: Math.min(...unrelated.map((o) => o.best?.distance ?? 1)),
    stored,
  };
}
