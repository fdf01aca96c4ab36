import type { PolygonBackend } from "./backend";
import { clipperLibBackend } from "./clipper-lib";
import { loadClipper2Wasm } from "./clipper2-wasm";

export type { PolygonBackend } from "./backend";
export { clipperLibBackend } from "./clipper-lib";

// The engine's API is synchronous, WebAssembly loads asynchronously. So: clipper-lib answers until Clipper2
// (WebAssembly) is ready, and Clipper2 from then on. Loading starts on the first layout or on
// initLayoutEngine(), whichever comes first, and happens once. The two agree on every area to about 1e-10
// relative (they round intersection points on the 0.1 µm grid differently); tests hold both to the
// independent polygon-clipping reference.

let current: PolygonBackend = clipperLibBackend;
let loading: Promise<PolygonBackend> | null = null;
let failure: unknown = null;

function startLoading(): Promise<PolygonBackend> {
  loading ??= loadClipper2Wasm().then(
    (backend) => {
      // A guard against a broken build: the unit square must come out as 1.
      if (backend.unionArea([Float64Array.of(0, 0, 1, 0, 1, 1, 0, 1)]) !== 1) throw new Error("clipper2-wasm self-check failed");
      current = withFallback(backend);
      return current;
    },
    (error: unknown) => {
      failure = error;
      return clipperLibBackend;
    },
  );
  return loading;
}

/** A backend that gives way to clipper-lib for good if it ever throws (a WebAssembly module that ran out of memory). */
function withFallback(fast: PolygonBackend): PolygonBackend {
  return {
    name: fast.name,
    unionArea(rings) {
      try {
        return fast.unionArea(rings);
      } catch (error) {
        failure = error;
        current = clipperLibBackend;
        return clipperLibBackend.unionArea(rings);
      }
    },
  };
}

/**
 * Loads the fast polygon backend (Clipper2 in WebAssembly) and resolves with the backend in use from then on.
 * Call once at start-up where the first layouts should be fast already; never rejects (clipper-lib stays if
 * WebAssembly cannot load, and `polygonBackendFailure()` says why).
 */
export function initLayoutEngine(): Promise<PolygonBackend> {
  return startLoading();
}

/** The backend for a layout now; starts loading Clipper2 in the background the first time. */
export function polygonBackend(): PolygonBackend {
  if (!loading) void startLoading();
  return current;
}

/** Why Clipper2 could not be loaded, or null. */
export function polygonBackendFailure(): unknown {
  return failure;
}
