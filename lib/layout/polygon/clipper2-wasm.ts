import type { Clipper2Module, Paths64 } from "clipper2-wasm";
import type { PolygonBackend } from "./backend";

/**
 * Loads Clipper2 compiled to WebAssembly (clipper2-wasm 0.4.0). `import("clipper2-wasm")` picks the package's
 * CommonJS build in Node (it reads the .wasm beside itself) and its ES build in a bundle (the bundler emits the
 * .wasm as an asset from `new URL(…, import.meta.url)`), so one line serves the server, scripts, tests and the
 * browser. Loading is asynchronous; callers keep a synchronous backend until it is done (see ./index.ts).
 */
export async function loadClipper2Wasm(): Promise<PolygonBackend> {
  const imported = (await import("clipper2-wasm")) as unknown as { default: unknown };
  // CommonJS seen through import(): default is module.exports, itself the factory (or holding it as .default).
  const candidate = imported.default as { default?: unknown };
  const factory = (typeof candidate === "function" ? candidate : candidate.default) as (o?: object) => Promise<Clipper2Module>;
  return clipper2Backend(await factory());
}

/** The backend over a loaded module. Every embind object made here is deleted before returning. */
export function clipper2Backend(wasm: Clipper2Module): PolygonBackend {
  return {
    name: "clipper2-wasm",
    unionArea(rings) {
      if (rings.length === 0) return 0;
      const subjects: Paths64 = new wasm.Paths64();
      let solution: Paths64 | null = null;
      try {
        for (const ring of rings) {
          const n = ring.length >> 1;
          const flat = new BigInt64Array(3 * n);
          for (let k = 0; k < n; k++) {
            flat[3 * k] = BigInt(ring[2 * k]);
            flat[3 * k + 1] = BigInt(ring[2 * k + 1]);
          }
          const path = new wasm.Path64();
          path.assign(flat);
          subjects.push_back(path);
          path.delete();
        }
        solution = wasm.UnionSelf64(subjects, wasm.FillRule.NonZero);
        return Math.abs(wasm.AreaPaths64(solution));
      } finally {
        solution?.delete();
        subjects.delete();
      }
    },
  };
}
