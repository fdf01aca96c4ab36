import ClipperLib, { type Path, type Paths } from "clipper-lib";
import type { PolygonBackend } from "./backend";

function toPath(ring: Float64Array): Path {
  const n = ring.length >> 1;
  const path: Path = new Array(n);
  for (let k = 0; k < n; k++) path[k] = { X: ring[2 * k], Y: ring[2 * k + 1] };
  return path;
}

/** clipper-lib 6.4.2 (JavaScript Clipper 1): synchronous, always available; the fallback. */
export const clipperLibBackend: PolygonBackend = {
  name: "clipper-lib",
  unionArea(rings) {
    if (rings.length === 0) return 0;
    const clipper = new ClipperLib.Clipper();
    clipper.AddPaths(rings.map(toPath), ClipperLib.PolyType.ptSubject, true);
    const solution: Paths = [];
    clipper.Execute(ClipperLib.ClipType.ctUnion, solution, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
    let area = 0;
    for (const path of solution) area += ClipperLib.Clipper.Area(path);
    return Math.abs(area);
  },
};
