// Benchmark of the layout engine against a straightforward full union of every impression, measured side by side.
// Run: npx tsx scripts/bench-layout.ts
import ClipperLib, { type Path, type Paths } from "clipper-lib";
import { computeLayout, type LayoutInput } from "@/lib/layout";
import { buildPattern } from "@/lib/layout/arrangements";
import { prepareSets } from "@/lib/layout/area";
import { buildGrid } from "@/lib/layout/grid";
import { CLIPPER_UNITS_PER_MM } from "@/lib/layout/limits";
import { buildStampShape } from "@/lib/layout/outline";
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
console.log(`Layout engine vs full union: ${CLOTH_WIDTH_MM} mm cloth, ${STAMP_MM} mm stamp, half-drop, gap ${GAP_MM} mm (overlapping)`);
console.log(`node ${process.version}; engine = median of 7 warm computeLayout calls; full union = one clipper-lib union of every impression, cut to the band`);
console.log(line(header));
for (const r of rows) console.log(line(r));
for (const v of verdicts) console.log(v);
