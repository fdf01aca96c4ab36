/** A lobed, lopsided closed outline (SVG path data in mm) filling a size × size footprint; for benchmarks. */
export function lobedMotif(vertices: number, sizeMm: number): string {
  const c = sizeMm / 2;
  const points: string[] = [];
  for (let k = 0; k < vertices; k++) {
    const t = (2 * Math.PI * k) / vertices;
    const r = c * (0.78 + 0.22 * Math.cos(5 * t + 0.4 * Math.sin(2 * t)));
    points.push(`${(c + r * Math.cos(t)).toFixed(4)} ${(c + r * Math.sin(t)).toFixed(4)}`);
  }
  return `M${points.join("L")}Z`;
}
