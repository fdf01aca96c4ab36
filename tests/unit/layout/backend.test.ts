import polygonClipping, { type Polygon } from "polygon-clipping";
import { describe, expect, it } from "vitest";
import { computeLayout, initLayoutEngine, polygonBackend, type LayoutInput, type PolygonBackend } from "@/lib/layout";
import { clipperLibBackend } from "@/lib/layout/polygon";

let wasm: PolygonBackend;

const square = (x: number, y: number, side: number) => Float64Array.of(x, y, x + side, y, x + side, y + side, x, y + side);
const reversed = (ring: Float64Array) => {
  const out = new Float64Array(ring.length);
  for (let k = 0; k < ring.length; k += 2) {
    out[ring.length - 2 - k] = ring[k];
    out[ring.length - 1 - k] = ring[k + 1];
  }
  return out;
};

describe("polygon backends", () => {
  it("loads Clipper2 (WebAssembly) in Node and uses it from then on", async () => {
    wasm = await initLayoutEngine();
    expect(wasm.name).toBe("clipper2-wasm");
    expect(polygonBackend()).toBe(wasm);
  });

  for (const name of ["clipper-lib", "clipper2-wasm"]) {
    it(`${name}: unites overlapping rings once and keeps holes (worked by hand)`, () => {
      const backend = name === "clipper-lib" ? clipperLibBackend : wasm;
      // Two 10 × 10 squares overlapping in a 5 × 5 corner: 100 + 100 − 25 = 175.
      expect(backend.unionArea([square(0, 0, 10), square(5, 5, 10)])).toBe(175);
      // A 20 × 20 square with a 10 × 10 hole wound the other way: 400 − 100 = 300; the same ring twice is 400 once.
      expect(backend.unionArea([square(0, 0, 20), reversed(square(5, 5, 10))])).toBe(300);
      expect(backend.unionArea([square(0, 0, 20), square(0, 0, 20)])).toBe(400);
      expect(backend.unionArea([])).toBe(0);
    });
  }

  it("agree with each other and with polygon-clipping (independent npm library) on an overlapping layout", () => {
    // A lopsided 48-gon, stepped so that neighbours overlap; 1.2 m of a 1150 mm cloth.
    const ring: Array<[number, number]> = Array.from({ length: 48 }, (_, k) => {
      const t = (2 * Math.PI * k) / 48;
      const r = 85 * (0.8 + 0.15 * Math.cos(3 * t) + 0.05 * Math.sin(5 * t + 1));
      return [Math.round((90 + r * Math.cos(t)) * 1000) / 1000, Math.round((90 + r * Math.sin(t)) * 1000) / 1000];
    });
    const input: LayoutInput = {
      cloth: { widthMm: 1150, lengthMm: 1200, margins: { leftMm: 20, rightMm: 20 } },
      stamp: { widthMm: 180, heightMm: 180, outline: `M${ring.map(([x, y]) => `${x} ${y}`).join(" L")} Z` },
      gap: { xMm: -30, yMm: -30 },
      arrangement: "half-drop",
      edges: "clip",
      window: { startMm: 0, lengthMm: 1200 },
      impressions: true,
    };
    const byLib = computeLayout(input, { polygons: clipperLibBackend });
    const byWasm = computeLayout(input, { polygons: wasm });
    expect(Math.abs(byWasm.waxedAreaTotalM2 / byLib.waxedAreaTotalM2 - 1)).toBeLessThan(1e-9);
    expect(Math.abs(byWasm.waxedAreaPerMetreM2 / byLib.waxedAreaPerMetreM2 - 1)).toBeLessThan(1e-9);

    const polygons: Polygon[] = byLib.impressions!.map((imp) => {
      const [a, b, c, d, e, f] = imp.matrix;
      return [ring.map(([u, v]) => [a * u + c * v + e, b * u + d * v + f] as [number, number])];
    });
    const band: Polygon = [
      [
        [20, 0],
        [1130, 0],
        [1130, 1200],
        [20, 1200],
      ],
    ];
    const united = polygonClipping.intersection(polygonClipping.union(polygons[0], ...polygons.slice(1)), band);
    // Shoelace formula on polygon-clipping's rings (outer ring first, then holes).
    const shoelace = (r: Array<[number, number]>) => Math.abs(r.reduce((s, [x0, y0], i) => s + x0 * r[(i + 1) % r.length][1] - r[(i + 1) % r.length][0] * y0, 0)) / 2;
    const reference = united.reduce((s, poly) => s + shoelace(poly[0] as Array<[number, number]>) - poly.slice(1).reduce((h, r) => h + shoelace(r as Array<[number, number]>), 0), 0) / 1e6;
    expect(Math.abs(byWasm.waxedAreaTotalM2 / reference - 1)).toBeLessThan(1e-6);
  });
});
