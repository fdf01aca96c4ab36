// Benchmark of search by picture (lib/scans/similar.ts): the labelled set's figures (the true stamp first, in
// the top five, how near unrelated motifs come) and the time to match one picture against 10,000 stamps, the
// query's decode apart. No app: signatures in memory, as the data layer keeps them.
// Run: npm run bench -- similar   (or npx tsx scripts/bench-similar.ts)
import { decodeGreyRaster } from "@/lib/scans";
import { motifMaps, signatureAt } from "@/lib/scans/signature";
import { CLOSE_DISTANCE, findSimilar, similarQuery, SIMILAR_MAX_DISTANCE, type StoredSignature } from "@/lib/scans/similar";
import { motifSvg, renderScan } from "./seed/scan-art";
import { evaluateSet } from "./lib/similar-eval";
import { labelledSet } from "./lib/similar-set";
import { seededUniform } from "./lib/seeded-random";

const STAMPS = 10_000;
const GOAL_MS = 200;
const FIRST_GOAL = 0.95;
const TOP_FIVE_GOAL = 0.99;

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
const pct = (n: number, of: number) => `${((100 * n) / of).toFixed(1)} %`;

const t0 = performance.now();
const evaluation = await evaluateSet({ stamps: 48, seed: 2027 });
const byCase = new Map<string, { n: number; first: number; topFive: number }>();
for (const o of evaluation.outcomes.filter((o) => o.expected)) {
  const c = byCase.get(o.case) ?? { n: 0, first: 0, topFive: 0 };
  c.n++;
  if (o.rank === 1) c.first++;
  if (o.rank !== null && o.rank <= 5) c.topFive++;
  byCase.set(o.case, c);
}
console.log(`labelled set: ${evaluation.stored.length} reference scans of 48 stamps, ${evaluation.related} queries of them, ${evaluation.unrelated} unrelated (${((performance.now() - t0) / 1000).toFixed(0)} s to render and run)`);
console.log("case          queries  first    top five");
for (const [name, c] of byCase) console.log(`${name.padEnd(13)} ${String(c.n).padStart(7)}  ${pct(c.first, c.n).padStart(7)}  ${pct(c.topFive, c.n).padStart(8)}`);
const firstShare = evaluation.first / evaluation.related;
const topFiveShare = evaluation.topFive / evaluation.related;
console.log(`all           ${String(evaluation.related).padStart(7)}  ${pct(evaluation.first, evaluation.related).padStart(7)}  ${pct(evaluation.topFive, evaluation.related).padStart(8)}   goals ${FIRST_GOAL * 100} % / ${TOP_FIVE_GOAL * 100} %: ${firstShare >= FIRST_GOAL && topFiveShare >= TOP_FIVE_GOAL ? "met" : "NOT met"}`);
console.log(
  `unrelated motifs: nearest ${evaluation.unrelatedNearest.toFixed(3)} (close ≤ ${CLOSE_DISTANCE}, answered ≤ ${SIMILAR_MAX_DISTANCE}); ${evaluation.unrelatedAnswered} of ${evaluation.unrelated} got an answer, ${evaluation.outcomes.filter((o) => !o.expected && o.best && o.best.distance <= CLOSE_DISTANCE).length} a close one`,
);
for (const o of evaluation.outcomes.filter((o) => o.expected && o.rank !== 1)) console.log(`  missed first: ${o.label} (rank ${o.rank ?? "none"}, best ${o.best?.code} at ${o.best?.distance.toFixed(3)})`);

// 10,000 stamps: the set's references among signatures of other invented motifs, each taken at a few turns.
const fillers: StoredSignature<{ code: string }>[] = [];
const rnd = seededUniform(99);
let art = 0;
while (fillers.length + evaluation.stored.length < STAMPS) {
  const sizeMm = 150 + Math.round(rnd() * 150);
  const raster = await decodeGreyRaster(await renderScan(motifSvg({ seed: 10_000 + art, widthMm: sizeMm, heightMm: sizeMm, style: rnd() < 0.25 ? "face" : "print" }), 40), { maxPixels: 8e7 });
  const maps = motifMaps(raster);
  for (let k = 0; k < 24 && fillers.length + evaluation.stored.length < STAMPS; k++) {
    fillers.push({ ref: { code: `FILL-${art}-${k}` }, kind: maps.polarity === "lightIsWax" ? "face" : "print", signature: signatureAt(maps, -23 + 2 * k) });
  }
  art++;
}
const stored = [...evaluation.stored, ...fillers];
const set = labelledSet({ stamps: 48, seed: 2027 });
const signatureMs: number[] = [];
const matchMs: number[] = [];
let first = 0;
let related = 0;
for (const q of set.queries.slice(0, 60)) {
  const raster = await decodeGreyRaster(await q.bytes(), { maxPixels: 8e7, maxSidePx: 1024 });
  const a = performance.now();
  const query = similarQuery(raster, q.kind);
  const b = performance.now();
  const matches = findSimilar(query, stored, { limit: 10 });
  const c = performance.now();
  signatureMs.push(b - a);
  matchMs.push(c - b);
  if (q.expected) {
    related++;
    if (matches[0]?.ref.code === q.expected) first++;
  }
}
const total = median(signatureMs.map((s, i) => s + matchMs[i]));
console.log(`\n${stored.length} stamps in memory (${fillers.length} from ${art} other invented motifs at 24 turns each), ${signatureMs.length} queries:`);
console.log(`  query signature (40 variants) median ${median(signatureMs).toFixed(1)} ms, matching median ${median(matchMs).toFixed(1)} ms, together ${total.toFixed(1)} ms (goal < ${GOAL_MS} ms: ${total < GOAL_MS ? "met" : "NOT met"})`);
console.log(`  true stamp first among 10,000: ${pct(first, related)}`);
