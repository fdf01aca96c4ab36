// The TypeScript port of Clipper2 (@countertype/clipper2-ts, a devDependency) as a layout polygon backend, for the
// side-by-side benchmark only: the engine itself uses Clipper2 in WebAssembly, or clipper-lib until that is loaded.
import { Clipper, FillRule, type Path64 } from "@countertype/clipper2-ts";
import type { PolygonBackend } from "@/lib/layout";

export const clipper2TsBackend: PolygonBackend = {
  name: "clipper2-ts",
  unionArea(rings) {
    if (rings.length === 0) return 0;
    const subject: Path64[] = rings.map((ring) => {
      const path: Path64 = new Array(ring.length >> 1);
      for (let k = 0; k < path.length; k++) path[k] = { x: ring[2 * k], y: ring[2 * k + 1] };
      return path;
    });
    return Math.abs(Clipper.areaPaths(Clipper.union(subject, FillRule.NonZero)));
  },
};
