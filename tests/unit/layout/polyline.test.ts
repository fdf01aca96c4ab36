import { describe, expect, it } from "vitest";
import { flattenPathData } from "@/lib/layout/outline";
import { polylineRings } from "@/lib/layout/polyline";

// Straight-line path data is read without paper.js; paper.js (a general-purpose vector library) is the reference.
describe("straight-line path data read directly", () => {
  const lobed = `M${Array.from({ length: 300 }, (_, k) => {
    const t = (2 * Math.PI * k) / 300;
    return `${(100 + 80 * Math.cos(t) * (1 + 0.1 * Math.sin(7 * t))).toFixed(3)} ${(100 + 80 * Math.sin(t)).toFixed(3)}`;
  }).join("L")}Z`;
  const cases = [
    "M0 0 L10 0 L10 10 Z",
    "m0,0 l10,0 0,10 z",
    "M0 0 H200 V200 H0 Z M50 50 V150 H150 V50 Z",
    "m5 5 h10 v10 h-10 z m20 0 h10 v10 h-10 z",
    "M1e1 2.5e-1 L.5.5 L-3-4Z",
    "M0 0 L10 0 L10 10 L0 0 Z",
    "M0 0 10 0 10 10 0 10",
    "M0 0 L10 0 L10 10 Z L20 0 L20 20",
    lobed,
  ];
  for (const d of cases) {
    it(`gives paper.js's rings for ${d.length > 40 ? "a 300-point outline" : d}`, () => {
      expect(polylineRings(d)).toEqual(flattenPathData(d).map((ring) => ring.map(([x, y]) => [x, y])));
    });
  }

  it("leaves curves and arcs to paper.js", () => {
    expect(polylineRings("M0 0 C5 -5 15 -5 20 0 Z")).toBeNull();
    expect(polylineRings("M10 10 A5 5 0 1 0 20 10 Z")).toBeNull();
    expect(polylineRings("M0 0 Q5 5 10 0 T20 0 Z")).toBeNull();
  });
});
