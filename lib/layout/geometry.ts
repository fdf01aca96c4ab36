/** Plane geometry helpers in mm: affine maps in SVG order and axis-aligned boxes. */

/** Affine map [a, b, c, d, e, f]: (u, v) → (a·u + c·v + e, b·u + d·v + f), as in SVG's matrix(). */
export type Affine = readonly [number, number, number, number, number, number];
/** A closed ring of points [x, y] in mm; the closing point is not repeated. */
export type Ring = Array<readonly [number, number]>;
export interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

/** Composition m ∘ n: first n, then m. */
export function compose(m: Affine, n: Affine): Affine {
  return [
    m[0] * n[0] + m[2] * n[1],
    m[1] * n[0] + m[3] * n[1],
    m[0] * n[2] + m[2] * n[3],
    m[1] * n[2] + m[3] * n[3],
    m[0] * n[4] + m[2] * n[5] + m[4],
    m[1] * n[4] + m[3] * n[5] + m[5],
  ];
}

/** Shift by (tx, ty) mm. */
export function translation(tx: number, ty: number): Affine {
  return [1, 0, 0, 1, tx, ty];
}

/** Turn by angleDeg about the origin; with y pointing down the cloth a positive angle turns clockwise as seen. */
export function rotation(angleDeg: number): Affine {
  const t = (angleDeg * Math.PI) / 180;
  // Exact values at multiples of 90° keep mirrored and turned copies on the integer grid.
  const round = (v: number) => (Math.abs(v) < 1e-15 ? 0 : Math.abs(Math.abs(v) - 1) < 1e-15 ? Math.sign(v) : v);
  const c = round(Math.cos(t));
  const s = round(Math.sin(t));
  return [c, s, -s, c, 0, 0];
}

/** Determinant of the linear part: +1 for turns, −1 for mirror images (area scale otherwise). */
export function determinant(m: Affine): number {
  return m[0] * m[3] - m[1] * m[2];
}

/** Image of the point (x, y) mm under m. */
export function applyAffine(m: Affine, x: number, y: number): [number, number] {
  return [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]];
}

/** Axis-aligned bounding box of points (mm). */
export function boxOfPoints(points: Iterable<readonly [number, number]>): Box {
  let x0 = Infinity;
  let y0 = Infinity;
  let x1 = -Infinity;
  let y1 = -Infinity;
  for (const [x, y] of points) {
    if (x < x0) x0 = x;
    if (x > x1) x1 = x;
    if (y < y0) y0 = y;
    if (y > y1) y1 = y;
  }
  return { x0, y0, x1, y1 };
}

/** Box of the rectangle [0, w] × [0, h] after the map m. */
export function mappedRectBox(m: Affine, widthMm: number, heightMm: number): Box {
  return boxOfPoints([
    applyAffine(m, 0, 0),
    applyAffine(m, widthMm, 0),
    applyAffine(m, widthMm, heightMm),
    applyAffine(m, 0, heightMm),
  ]);
}

/** Smallest box holding both boxes. */
export function unionBox(a: Box, b: Box): Box {
  return { x0: Math.min(a.x0, b.x0), y0: Math.min(a.y0, b.y0), x1: Math.max(a.x1, b.x1), y1: Math.max(a.y1, b.y1) };
}

/** Signed area by the shoelace formula, mm²; positive for clockwise rings on a y-down cloth. */
export function ringArea(ring: Ring): number {
  let sum = 0;
  for (let i = 0, n = ring.length; i < n; i++) {
    const [x0, y0] = ring[i];
    const [x1, y1] = ring[(i + 1) % n];
    sum += x0 * y1 - x1 * y0;
  }
  return sum / 2;
}
