// Benchmark of the layout engine: its polygon backends side by side (with and without border layers), then the
// engine against a straightforward full union of every impression.
// Run: npx tsx scripts/bench-layout.ts (or npm run bench -- layout)
import ClipperLib, { type Path, type Paths } from "clipper-lib";
import { computeLayout, initLayoutEngine, type LayoutInput, type PolygonBackend } from "@/lib/layout";
import { buildPattern } from "@/lib/layout/arrangements";
import { prepareSets } from "@/lib/layout/area";
import { buildGrid } from "@/lib/layout/grid";
import { CLIPPER_UNITS_PER_MM } from "@/lib/layout/limits";
import { buildStampShape } from "@/lib/layout/outline";
import { clipperLibBackend } from "@/lib/layout/polygon";
import { clipper2TsBackend } from "./lib/clipper2-ts-backend";
import { lobedMotif } from "./lib/motifs";

const CLOTH_WIDTH_MM = 1150;
const STAMP_MM = 210;
const GAP_MM = -15;
const LENGTHS_M = [1, 10, 100];
const VERTICES = [200, 2000];
const FULL_UNION_BUDGET_MS = 60_000;
const TARGET_MS: Record<number, number> = { 200: 100, 2000: 500 };

const motif = (vertices: number) => lobedMotif(vertices, STAMP_MM);

type Edges = "whole" | "clip";
const EDGES: Edges[] = ["whole", "clip"];

function input(vertices: number, lengthM: number, edges: Edges): LayoutInput {
  return {
    cloth: { widthMm: CLOTH_WIDTH_MM, lengthMm: lengthM * 1000 },
    stamp: { widthMm: STAMP_MM, heightMm: STAMP_MM, outline: motif(vertices) },
    gap: { xMm: GAP_MM, yMm: GAP_MM },
    arrangement: "half-drop",
    edges,
  };
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

function timeEngine(li: LayoutInput): { ms: number; areaM2: number } {
  computeLayout(li);
  const times: number[] = [];
  let areaM2 = 0;
  for (let k = 0; k < 7; k++) {
    const t0 = performance.now();
    areaM2 = computeLayout(li).waxedAreaTotalM2;
    times.push(performance.now() - t0);
  }
  return { ms: median(times), areaM2 };
}

/** Every impression of the run united in one clipper-lib call and cut to the band: the approach the engine avoids. */
function fullUnion(vertices: number, lengthM: number, edges: Edges): { ms: number; areaM2: number; impressions: number } {
  const t0 = performance.now();
  const stamp = { widthMm: STAMP_MM, heightMm: STAMP_MM, outline: motif(vertices) };
  const shape = buildStampShape(stamp);
  const pattern = buildPattern(
    { arrangement: "half-drop", widthMm: STAMP_MM, heightMm: STAMP_MM, gapXMm: GAP_MM, gapYMm: GAP_MM },
    shape.box,
  );
  const L = lengthM * 1000;
  const grid = buildGrid(pattern, 0, CLOTH_WIDTH_MM, L, "centre", edges);
  const S = CLIPPER_UNITS_PER_MM;
  const subject: Paths = [];
  let impressions = 0;
  for (const { set, rings } of prepareSets(grid, shape)) {
    for (let j = set.memberY.first; j <= set.memberY.last; j++) {
      for (let i = set.memberX.first; i <= set.memberX.last; i++) {
        impressions++;
        const dx = grid.originXMm + i * pattern.pitchXMm;
        const dy = j * pattern.periodYMm;
        for (const ring of rings) {
          const path: Path = [];
          for (let k = 0; k < ring.length; k += 2) path.push({ X: Math.round((ring[k] + dx) * S), Y: Math.round((ring[k + 1] + dy) * S) });
          subject.push(path);
        }
      }
    }
  }
  const clipper = new ClipperLib.Clipper();
  clipper.AddPaths(subject, ClipperLib.PolyType.ptSubject, true);
  const band: Path = [
    { X: 0, Y: 0 },
    { X: CLOTH_WIDTH_MM * S, Y: 0 },
    { X: CLOTH_WIDTH_MM * S, Y: L * S },
    { X: 0, Y: L * S },
  ];
  clipper.AddPath(band, ClipperLib.PolyType.ptClip, true);
  const solution: Paths = [];
  clipper.Execute(ClipperLib.ClipType.ctIntersection, solution, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
  const areaMm2 = Math.abs(solution.reduce((sum, p) => sum + ClipperLib.Clipper.Area(p), 0)) / (S * S);
  return { ms: performance.now() - t0, areaM2: areaMm2 / 1e6, impressions };
}

type BorderCase = "none" | "apart" | "under";
const BORDER_CASES: Array<[BorderCase, string]> = [
  ["none", "no border"],
  ["apart", "border both sides, 10 mm apart"],
  ["under", "border both sides, 10 mm under the field"],
];
const BORDER_MM = 100;
const RUNS = 11;

/** 100 m of the half-drop plan; a 100 mm border motif of the same detail on both sides, stepped 95 mm (overlapping). */
function withBorder(vertices: number, lengthM: number, border: BorderCase): LayoutInput {
  const li = input(vertices, lengthM, "whole");
  if (border === "none") return li;
  const stamp = { widthMm: BORDER_MM, heightMm: BORDER_MM, outline: lobedMotif(vertices, BORDER_MM) };
  return { ...li, borders: [{ side: "both", stamp, gapYMm: -5, gapToFieldMm: border === "apart" ? 10 : -10 }] };
}

/** Median ms and area per backend; the backends take turns run by run, so load from other work falls on all alike. */
function timeBackends(li: LayoutInput, backends: PolygonBackend[], runs: number): Array<{ ms: number; areaM2: number }> {
  const times: number[][] = backends.map(() => []);
  const areas = backends.map((polygons) => computeLayout(li, { polygons }).waxedAreaTotalM2);
  for (let k = 0; k < runs; k++) {
    backends.forEach((polygons, b) => {
      const t0 = performance.now();
      computeLayout(li, { polygons });
      times[b].push(performance.now() - t0);
    });
  }
  return backends.map((_, b) => ({ ms: median(times[b]), areaM2: areas[b] }));
}

const loadStart = performance.now();
const wasm = await initLayoutEngine();
const loadMs = performance.now() - loadStart;
if (wasm.name !== "clipper2-wasm") throw new Error("Clipper2 (WebAssembly) did not load");
const BACKENDS: PolygonBackend[] = [clipperLibBackend, clipper2TsBackend, wasm];

const backendRows: string[][] = [];
let worstDiff = 0;
for (const vertices of VERTICES) {
  for (const [border, label] of BORDER_CASES) {
    const li = withBorder(vertices, 100, border);
    const r = computeLayout(li, { polygons: clipperLibBackend });
    const timed = timeBackends(li, BACKENDS, RUNS);
    const diffs = timed.slice(1).map((t) => Math.abs(t.areaM2 / timed[0].areaM2 - 1));
    worstDiff = Math.max(worstDiff, ...diffs);
    const overlap = r.overlaps.length ? `${r.overlaps[0].periodMm} mm` : "-";
    backendRows.push([
      String(vertices),
      label,
      String(r.impressionsTotal),
      overlap,
      ...timed.map((t) => t.ms.toFixed(1)),
      (timed[0].ms / timed[2].ms).toFixed(1),
      diffs.map((d) => d.toExponential(1)).join(" / "),
      timed[2].areaM2.toFixed(4),
    ]);
  }
}

/** One union of every impression of a 1.4 m stretch (33 impressions) handed to each backend directly. */
function rawUnion(vertices: number): string[] {
  const stamp = { widthMm: STAMP_MM, heightMm: STAMP_MM, outline: motif(vertices) };
  const shape = buildStampShape(stamp);
  const pattern = buildPattern({ arrangement: "half-drop", widthMm: STAMP_MM, heightMm: STAMP_MM, gapXMm: GAP_MM, gapYMm: GAP_MM }, shape.box);
  const grid = buildGrid(pattern, 0, CLOTH_WIDTH_MM, 1400, "centre", "whole");
  const rings: Float64Array[] = [];
  for (const { set, rings: placed } of prepareSets(grid, shape)) {
    for (let j = set.memberY.first; j <= set.memberY.last; j++) {
      for (let i = set.memberX.first; i <= set.memberX.last; i++) {
        const dx = grid.originXMm + i * pattern.pitchXMm - CLOTH_WIDTH_MM / 2;
        const dy = j * pattern.periodYMm;
        for (const ring of placed) rings.push(ring.map((v, k) => Math.round((v + (k % 2 ? dy : dx)) * CLIPPER_UNITS_PER_MM)));
      }
    }
  }
  for (const b of BACKENDS) b.unionArea(rings);
  const times: number[][] = BACKENDS.map(() => []);
  for (let k = 0; k < RUNS; k++) {
    BACKENDS.forEach((b, i) => {
      const t0 = performance.now();
      b.unionArea(rings);
      times[i].push(performance.now() - t0);
    });
  }
  const cells = times.map((t) => median(t).toFixed(1));
  return [String(vertices), String(rings.reduce((n, r) => n + r.length / 2, 0)), ...cells];
}
const rawRows = VERTICES.map(rawUnion);

// Warm the JIT on every code path first so the first row is not charged for compilation.
for (const edges of EDGES) for (const vertices of VERTICES) computeLayout(input(vertices, 1, edges));

const rows: string[][] = [];
const verdicts: string[] = [];
for (const edges of EDGES) {
  for (const vertices of VERTICES) {
    let previous: { ms: number; impressions: number } | null = null;
    for (const lengthM of LENGTHS_M) {
      const li = input(vertices, lengthM, edges);
      const engine = timeEngine(li);
      const impressions = computeLayout(li).impressionsTotal;
      // Full union grows faster than linearly; estimate from the previous size before committing a minute to it.
      const estimateMs: number = previous ? previous.ms * Math.pow(impressions / previous.impressions, 1.3) : 0;
      let unionCell: string;
      let ratioCell = "-";
      let diffCell = "-";
      if (estimateMs <= FULL_UNION_BUDGET_MS) {
        const ref = fullUnion(vertices, lengthM, edges);
        previous = { ms: ref.ms, impressions: ref.impressions };
        unionCell = ref.ms.toFixed(1);
        ratioCell = (ref.ms / engine.ms).toFixed(1);
        diffCell = (Math.abs(engine.areaM2 - ref.areaM2) / ref.areaM2).toExponential(2);
      } else {
        unionCell = `skipped (est. ${(estimateMs / 1000).toFixed(0)} s)`;
      }
      rows.push([
        edges,
        String(vertices),
        `${lengthM} m`,
        String(impressions),
        engine.ms.toFixed(1),
        unionCell,
        ratioCell,
        diffCell,
        engine.areaM2.toFixed(4),
      ]);
      if (lengthM === 100) {
        const target = TARGET_MS[vertices];
        verdicts.push(
          `${edges} edges, ${vertices}-vertex motif, 100 m: engine ${engine.ms.toFixed(1)} ms, target < ${target} ms: ${engine.ms < target ? "met" : "MISSED"}`,
        );
      }
    }
  }
}

const header = ["edges", "vertices", "run", "impressions", "engine ms", "full union ms", "union/engine", "rel. area diff", "waxed m²"];
const widths = header.map((h, k) => Math.max(h.length, ...rows.map((r) => r[k].length)));
const line = (cells: string[]) => cells.map((c, k) => c.padStart(widths[k])).join("  ");
const table = (header: string[], rows: string[][]) => {
  const w = header.map((h, k) => Math.max(h.length, ...rows.map((r) => r[k].length)));
  const fmt = (cells: string[]) => cells.map((c, k) => c.padStart(w[k])).join("  ");
  console.log(fmt(header));
  for (const r of rows) console.log(fmt(r));
};
console.log(`Polygon backends side by side: 100 m, ${CLOTH_WIDTH_MM} mm cloth, ${STAMP_MM} mm motif half-drop gap ${GAP_MM} mm, whole edges;`);
console.log(`border: ${BORDER_MM} mm motif of the same detail, both sides, stepped ${BORDER_MM - 5} mm; median of ${RUNS} warm runs each (backends in turn), ms`);
console.log(`node ${process.version}; Clipper2 (WebAssembly) loaded in ${loadMs.toFixed(1)} ms`);
table(
  ["vertices", "layers", "impressions", "overlap period", "clipper-lib", "clipper2-ts", "clipper2-wasm", "lib/wasm", "rel. area diff ts / wasm", "waxed m²"],
  backendRows,
);
console.log(`largest relative area difference from clipper-lib: ${worstDiff.toExponential(2)} (limit 1e-9: ${worstDiff < 1e-9 ? "met" : "MISSED"})`);
console.log(`\nOne union of a 1.4 m stretch (33 impressions) per backend, median of ${RUNS}, ms`);
table(["vertices", "union vertices", "clipper-lib", "clipper2-ts", "clipper2-wasm"], rawRows);
console.log("");
console.log(`Layout engine vs full union: ${CLOTH_WIDTH_MM} mm cloth, ${STAMP_MM} mm stamp, half-drop, gap ${GAP_MM} mm (overlapping)`);
console.log(`engine = median of 7 warm computeLayout calls (${wasm.name}); full union = one clipper-lib union of every impression, cut to the band`);
console.log(line(header));
for (const r of rows) console.log(line(r));
for (const v of verdicts) console.log(v);
