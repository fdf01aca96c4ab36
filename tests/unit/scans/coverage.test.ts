import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import { measureCoverage, processScan, renderCoverageOverlay, type GreyRaster } from "@/lib/scans";
import { decodeGrey, shapeScan } from "@/tests/helpers/scan-images";

/**
 * Largest area error the pixel grid allows for a shape of perimeter P counted on pixels of side s: every pixel
 * wholly inside is counted and every pixel wholly outside is not, so only pixels within one pixel diagonal
 * (s·√2) of the outline can be wrong — for a circle of radius r that is the ring
 * π((r + s√2)² − (r − s√2)²) = 4√2·π·r·s, i.e. P·s·2√2 in general (worked by hand).
 */
const gridBoundMm2 = (perimeterMm: number, mmPerPx: number) => perimeterMm * mmPerPx * 2 * Math.SQRT2;

const SIDE_MM = 200;
const R_MM = 80;
const disc = `<circle cx="100" cy="100" r="${R_MM}"/>`;
// Area of a circle πr² (Euclid XII.2; any handbook).
const discAreaMm2 = Math.PI * R_MM ** 2;

describe.each([300, 600])("coverage of a disc r = 80 mm at %i DPI", (dpi) => {
  let print: { raster: GreyRaster; mmPerPx: number };
  let face: { raster: GreyRaster; mmPerPx: number };

  beforeAll(async () => {
    const p = await shapeScan({ dpi, sideMm: SIDE_MM, body: disc, ink: "#2a1c12", ground: "#f3eee4" });
    print = { raster: await decodeGrey(p.png), mmPerPx: p.mmPerPx };
    const f = await shapeScan({ dpi, sideMm: SIDE_MM, body: disc, ink: "#d69a5c", ground: "#1c1510" });
    face = { raster: await decodeGrey(f.png), mmPerPx: f.mmPerPx };
  });

  it("wax print (dark on light): area = πr² within the grid's bound", () => {
    const c = measureCoverage(print.raster, { polarity: "darkIsWax" });
    const areaMm2 = c.waxPixels * print.mmPerPx ** 2;
    expect(Math.abs(areaMm2 - discAreaMm2)).toBeLessThanOrEqual(gridBoundMm2(2 * Math.PI * R_MM, print.mmPerPx));
    expect(c.totalPixels).toBe(print.raster.widthPx * print.raster.heightPx);
    expect(c.thresholdSource).toBe("otsu");
  });

  it("in practice far inside that bound: edge pixels cancel, leaving the renderer's own curve error", () => {
    // Otsu's cut lies midway between ink and ground, so partly covered edge pixels are counted about half the
    // time and their errors cancel. What remains is librsvg drawing the circle as four cubic Béziers, which lie
    // up to 2.7e-4·r outside the true circle (the 0.027 % radial error of the standard four-arc cubic circle,
    // A. Riškus, Information Technology and Control 35(4), 2006): at most 2·2.7e-4·πr² of extra area. Allow that plus
    // a tenth of the grid bound.
    const c = measureCoverage(print.raster, { polarity: "darkIsWax" });
    const areaMm2 = c.waxPixels * print.mmPerPx ** 2;
    const allowance = 2 * 2.7e-4 * discAreaMm2 + 0.1 * gridBoundMm2(2 * Math.PI * R_MM, print.mmPerPx);
    expect(Math.abs(areaMm2 - discAreaMm2)).toBeLessThanOrEqual(allowance);
  });

  it("the ratio is πr² over the footprint's area", () => {
    const c = measureCoverage(print.raster, { polarity: "darkIsWax" });
    const footprintMm2 = (print.raster.widthPx * print.mmPerPx) ** 2;
    const bound = gridBoundMm2(2 * Math.PI * R_MM, print.mmPerPx) / footprintMm2;
    expect(Math.abs(c.ratio - discAreaMm2 / footprintMm2)).toBeLessThanOrEqual(bound);
  });

  it("face photo (light on dark) measured with lightIsWax gives the same area", () => {
    const c = measureCoverage(face.raster, { polarity: "lightIsWax" });
    const areaMm2 = c.waxPixels * face.mmPerPx ** 2;
    expect(Math.abs(areaMm2 - discAreaMm2)).toBeLessThanOrEqual(gridBoundMm2(2 * Math.PI * R_MM, face.mmPerPx));
  });

  it("the wrong polarity counts the ground instead", () => {
    const c = measureCoverage(print.raster, { polarity: "lightIsWax" });
    const areaMm2 = c.waxPixels * print.mmPerPx ** 2;
    const groundMm2 = (print.raster.widthPx * print.mmPerPx) ** 2 - discAreaMm2;
    expect(Math.abs(areaMm2 - groundMm2)).toBeLessThanOrEqual(gridBoundMm2(2 * Math.PI * R_MM, print.mmPerPx));
  });
});

describe("coverage details", () => {
  let ring: { raster: GreyRaster; mmPerPx: number };

  beforeAll(async () => {
    // Annulus R = 90, r = 40 mm, drawn as one even-odd path: area π(R² − r²).
    const body = `<path d="M190 100 A90 90 0 1 0 10 100 A90 90 0 1 0 190 100 Z M140 100 A40 40 0 1 0 60 100 A40 40 0 1 0 140 100 Z"/>`;
    const s = await shapeScan({ dpi: 300, sideMm: SIDE_MM, body, ink: "#000", ground: "#fff" });
    ring = { raster: await decodeGrey(s.png), mmPerPx: s.mmPerPx };
  });

  it("a ring's hole is not wax: area = π(R² − r²) within the bound of both edges", () => {
    const c = measureCoverage(ring.raster, { polarity: "darkIsWax" });
    const areaMm2 = c.waxPixels * ring.mmPerPx ** 2;
    const expected = Math.PI * (90 ** 2 - 40 ** 2);
    expect(Math.abs(areaMm2 - expected)).toBeLessThanOrEqual(gridBoundMm2(2 * Math.PI * (90 + 40), ring.mmPerPx));
  });

  it("a footprint counts only inside it", () => {
    // The left half of the picture holds half the ring.
    const half = { leftPx: 0, topPx: 0, widthPx: ring.raster.widthPx / 2, heightPx: ring.raster.heightPx };
    const c = measureCoverage(ring.raster, { polarity: "darkIsWax", footprint: half });
    expect(c.totalPixels).toBe(half.widthPx * half.heightPx);
    const areaMm2 = c.waxPixels * ring.mmPerPx ** 2;
    const expected = (Math.PI * (90 ** 2 - 40 ** 2)) / 2;
    expect(Math.abs(areaMm2 - expected)).toBeLessThanOrEqual(gridBoundMm2(Math.PI * (90 + 40) + 100, ring.mmPerPx));
  });

  it("a keeper's threshold replaces Otsu's and moves the count the right way", () => {
    const otsu = measureCoverage(ring.raster, { polarity: "darkIsWax" });
    const strict = measureCoverage(ring.raster, { polarity: "darkIsWax", threshold: 10 });
    const loose = measureCoverage(ring.raster, { polarity: "darkIsWax", threshold: 250 });
    expect(strict.thresholdSource).toBe("keeper");
    expect(strict.otsuThreshold).toBe(otsu.threshold);
    expect(strict.waxPixels).toBeLessThan(otsu.waxPixels);
    expect(loose.waxPixels).toBeGreaterThan(otsu.waxPixels);
    expect(() => measureCoverage(ring.raster, { polarity: "darkIsWax", threshold: 300 })).toThrow(RangeError);
    expect(() => measureCoverage(ring.raster, { polarity: "darkIsWax", threshold: 12.5 })).toThrow(RangeError);
  });

  it("an empty footprint has ratio 0", () => {
    const c = measureCoverage(ring.raster, { polarity: "darkIsWax", footprint: { leftPx: 5, topPx: 5, widthPx: 0, heightPx: 0 } });
    expect(c).toMatchObject({ totalPixels: 0, waxPixels: 0, ratio: 0 });
  });

  it("the overlay tints counted pixels and leaves the rest grey", async () => {
    const c = measureCoverage(ring.raster, { polarity: "darkIsWax" });
    const overlay = await renderCoverageOverlay(ring.raster, { polarity: "darkIsWax", threshold: c.threshold, maxSidePx: 400, format: "png" });
    const { data, info } = await sharp(overlay).raw().toBuffer({ resolveWithObject: true });
    expect(Math.max(info.width, info.height)).toBe(400);
    const at = (xMm: number, yMm: number) => {
      const x = Math.round((xMm / SIDE_MM) * info.width);
      const y = Math.round((yMm / SIDE_MM) * info.height);
      const o = (y * info.width + x) * info.channels;
      return [data[o], data[o + 1], data[o + 2]];
    };
    const [wr, wg, wb] = at(100, 35); // on the ring
    expect(wr - wg).toBeGreaterThan(80);
    expect(wr - wb).toBeGreaterThan(80);
    const [hr, hg, hb] = at(100, 100); // in the hole
    expect(Math.max(hr, hg, hb) - Math.min(hr, hg, hb)).toBeLessThan(6);
    expect(hr).toBeGreaterThan(200);
  });
});

describe("coverage through processScan at 600 DPI", () => {
  it("a 200 mm scan measured on the reduced analysis raster still gives πr² within that raster's grid bound", async () => {
    const s = await shapeScan({ dpi: 600, sideMm: SIDE_MM, body: disc, ink: "#2a1c12", ground: "#f3eee4" });
    const scan = await processScan(s.png, { maxBytes: 50_000_000, maxPixels: 40_000_000 });
    expect(scan.dpi).toBe(600);
    expect(scan.analysis.widthPx).toBe(2048);
    const mmPerPx = scan.analysis.mmPerPx!;
    expect(mmPerPx).toBeCloseTo((s.sidePx / 2048) * (25.4 / 600), 12);
    const areaMm2 = scan.coverage.waxPixels * mmPerPx ** 2;
    expect(Math.abs(areaMm2 - discAreaMm2)).toBeLessThanOrEqual(gridBoundMm2(2 * Math.PI * R_MM, mmPerPx));
  });
});
