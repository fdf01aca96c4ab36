import { describe, expect, it } from "vitest";
import { computeLayout, type Impression, type LayoutInput } from "@/lib/layout";

// The plane group is found here from the laid-out impressions themselves, not from the engine's table:
// for an asymmetric motif an isometry is a symmetry of the layout exactly when it maps every impression's
// stamp-to-cloth matrix onto another impression's. The isometries found are then classified with the
// identification scheme of the International Tables for Crystallography, Vol. A (highest rotation order;
// reflections; glide reflections whose axes are not mirror lines).

type M = readonly number[];
const EPS = 1e-6;

function mul(m: M, n: M): M {
  return [
    m[0] * n[0] + m[2] * n[1],
    m[1] * n[0] + m[3] * n[1],
    m[0] * n[2] + m[2] * n[3],
    m[1] * n[2] + m[3] * n[3],
    m[0] * n[4] + m[2] * n[5] + m[4],
    m[1] * n[4] + m[3] * n[5] + m[5],
  ];
}

function inv(m: M): M {
  const det = m[0] * m[3] - m[1] * m[2];
  const a = m[3] / det;
  const b = -m[1] / det;
  const c = -m[2] / det;
  const d = m[0] / det;
  return [a, b, c, d, -(a * m[4] + c * m[5]), -(b * m[4] + d * m[5])];
}

function same(m: M, n: M): boolean {
  return m.every((v, k) => Math.abs(v - n[k]) < EPS * (k >= 4 ? 1000 : 1));
}

function classify(impressions: Impression[], inner: { x0: number; x1: number; y0: number; y1: number }): string {
  const cellKey = (x: number, y: number) => `${Math.floor(x / 50)},${Math.floor(y / 50)}`;
  const byCell = new Map<string, M[]>();
  for (const imp of impressions) {
    const key = cellKey(imp.matrix[4], imp.matrix[5]);
    byCell.set(key, [...(byCell.get(key) ?? []), imp.matrix]);
  }
  const exists = (m: M) => {
    const cx = Math.floor(m[4] / 50);
    const cy = Math.floor(m[5] / 50);
    for (let dx = -1; dx <= 1; dx++)
      for (let dy = -1; dy <= 1; dy++) if ((byCell.get(`${cx + dx},${cy + dy}`) ?? []).some((n) => same(m, n))) return true;
    return false;
  };
  const centre = [(inner.x0 + inner.x1) / 2, (inner.y0 + inner.y1) / 2];
  const ref = impressions.reduce((best, imp) =>
    Math.hypot(imp.xMm - centre[0], imp.yMm - centre[1]) < Math.hypot(best.xMm - centre[0], best.yMm - centre[1]) ? imp : best,
  );
  const probes = impressions.filter((i) => i.xMm > inner.x0 && i.xMm < inner.x1 && i.yMm > inner.y0 && i.yMm < inner.y1);
  const candidates = impressions.filter((i) => Math.hypot(i.xMm - ref.xMm, i.yMm - ref.yMm) < 700);
  const symmetries = candidates
    .map((c) => mul(c.matrix, inv(ref.matrix)))
    .filter((g) => probes.every((p) => exists(mul(g, p.matrix))));

  let order = 1;
  const mirrors: Array<{ angle: number; offset: number }> = [];
  const glides: Array<{ angle: number; offset: number }> = [];
  for (const g of symmetries) {
    const det = g[0] * g[3] - g[1] * g[2];
    if (det > 0) {
      const turn = Math.atan2(g[1], g[0]);
      if (Math.abs(turn) > 1e-6) order = Math.max(order, Math.round((2 * Math.PI) / Math.abs(turn)));
      continue;
    }
    // Reflection part about an axis at angle φ (2φ = atan2(b, a)); g∘g is a translation along the axis.
    const phi = Math.atan2(g[1], g[0]) / 2;
    const normal = [-Math.sin(phi), Math.cos(phi)];
    const axis = { angle: Math.round(((phi * 180) / Math.PI + 180) % 180), offset: (g[4] * normal[0] + g[5] * normal[1]) / 2 };
    const g2 = mul(g, g);
    (Math.hypot(g2[4], g2[5]) < 1e-6 ? mirrors : glides).push(axis);
  }
  const reflecting = mirrors.length + glides.length > 0;
  if (!reflecting) return `p${order}`;
  if (order > 1) return "other";
  if (mirrors.length === 0) return "pg";
  const onMirror = (a: { angle: number; offset: number }) =>
    mirrors.some((m) => m.angle === a.angle && Math.abs(m.offset - a.offset) < 1e-6);
  return glides.every(onMirror) ? "pm" : "cm";
}

function groups(extra: Partial<LayoutInput>, stamp = { widthMm: 120, heightMm: 90 }): { engine: string; found: string } {
  const r = computeLayout({
    cloth: { widthMm: 4000, lengthMm: 3000 },
    stamp,
    arrangement: "straight",
    edges: "clip",
    gap: { xMm: 10, yMm: 6 },
    window: { startMm: 0, lengthMm: 3000 },
    impressions: true,
    ...extra,
  } as LayoutInput);
  const found = classify(r.impressions!, { x0: 1200, x1: 2800, y0: 900, y1: 2100 });
  return { engine: r.group, found };
}

describe("plane group of each arrangement (International Tables for Crystallography, Vol. A)", () => {
  it.each([
    ["straight", {}, "p1"],
    ["half-drop", { arrangement: "half-drop" }, "p1"],
    ["brick", { arrangement: "brick" }, "p1"],
    ["diagonal", { arrangement: "diagonal", diagonalStep: 1 / 3 }, "p1"],
    ["mirror", { arrangement: "mirror" }, "pm"],
    ["turnover", { arrangement: "turnover" }, "p2"],
    ["half-drop-mirror", { arrangement: "half-drop-mirror" }, "pg"],
    ["rotation, n = 2", { arrangement: "rotation", rotationOrder: 2 }, "p2"],
    ["rotation, n = 4, square cell", { arrangement: "rotation", rotationOrder: 4, gap: { xMm: 8, yMm: 8 } }, "p4"],
    ["rotation, n = 4, oblong cell", { arrangement: "rotation", rotationOrder: 4, gap: { xMm: 8, yMm: 20 } }, "p2"],
    ["rotation, n = 3, hexagonal", { arrangement: "rotation", rotationOrder: 3, gap: { xMm: 8, yMm: 0 } }, "p3"],
    ["rotation, n = 6, hexagonal", { arrangement: "rotation", rotationOrder: 6, gap: { xMm: 8, yMm: 0 } }, "p6"],
    ["rotation, n = 3, rows pulled apart", { arrangement: "rotation", rotationOrder: 3, gap: { xMm: 8, yMm: 15 } }, "p1"],
    ["rotation, n = 6, rows pulled apart", { arrangement: "rotation", rotationOrder: 6, gap: { xMm: 8, yMm: 15 } }, "p2"],
  ] as Array<[string, Partial<LayoutInput>, string]>)("%s → %s", (_, extra, expected) => {
    const { engine, found } = groups(extra);
    expect(found).toBe(expected);
    expect(engine).toBe(expected);
  });
});
