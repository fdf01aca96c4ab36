import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { decodeGreyRaster } from "@/lib/scans";
import { motifSignature, squareSymmetries, symmetryMap } from "@/lib/scans/signature";
import { decodeSignature, encodeSignature, findSimilar, queryOfSignature, similarQuery, SIMILAR_MAX_DISTANCE } from "@/lib/scans/similar";

const L_SHAPE = `<path d="M20 20 H70 V35 H35 V120 H20 Z"/><circle cx="100" cy="105" r="18"/><rect x="85" y="30" width="30" height="12"/>`;
const OTHER = `<circle cx="75" cy="75" r="50" fill="none" stroke-width="14"/><circle cx="75" cy="75" r="10"/>`;

async function raster(body: string, opts: { ink?: string; ground?: string; mirror?: boolean; turnDeg?: number } = {}) {
  const inner = opts.mirror ? `<g transform="translate(150 0) scale(-1 1)">${body}</g>` : body;
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="300" height="300" viewBox="0 0 150 150"><rect width="150" height="150" fill="${opts.ground ?? "#f4efe6"}"/><g fill="${opts.ink ?? "#2a2018"}" stroke="${opts.ink ?? "#2a2018"}">${inner}</g></svg>`;
  let image = sharp(Buffer.from(svg)).flatten({ background: opts.ground ?? "#f4efe6" });
  if (opts.turnDeg) image = sharp(await image.png().toBuffer()).rotate(opts.turnDeg, { background: opts.ground ?? "#f4efe6" });
  return decodeGreyRaster(await image.png().toBuffer(), { maxPixels: 1e7 });
}

describe("square symmetries", () => {
  it("are the eight distinct elements of the dihedral group of the square; four quarter turns give back the grid", () => {
    // D4 has order 8 (any algebra text, e.g. Dummit & Foote, Abstract Algebra, §1.2).
    const maps = squareSymmetries.map((s) => Array.from(symmetryMap(s, 5)).join(","));
    expect(new Set(maps).size).toBe(8);
    const quarter = symmetryMap({ turns: 1, mirrored: false }, 5);
    let cells = Array.from({ length: 25 }, (_, i) => i);
    for (let k = 0; k < 4; k++) cells = Array.from(quarter, (from) => cells[from]);
    expect(cells).toEqual(Array.from({ length: 25 }, (_, i) => i));
  });
});

describe("signatures", () => {
  it("survive being stored as bytes", async () => {
    const s = motifSignature(await raster(L_SHAPE));
    const back = decodeSignature(encodeSignature(s))!;
    expect(back.aspect).toBeCloseTo(s.aspect, 5);
    expect(back.polarity).toBe(s.polarity);
    expect(Array.from(back.grid)).toEqual(Array.from(s.grid));
    expect(decodeSignature(new Uint8Array(10))).toBeNull();
  });

  it("find a picture again turned 4° and quarter-turned, a mirror image only as mirrored, and not an unrelated shape", async () => {
    const stored = [
      { ref: "L", kind: "print" as const, signature: motifSignature(await raster(L_SHAPE)) },
      { ref: "ring", kind: "print" as const, signature: motifSignature(await raster(OTHER)) },
    ];
    const turned = findSimilar(similarQuery(await raster(L_SHAPE, { turnDeg: 94 }), "print"), stored);
    expect(turned[0]).toMatchObject({ ref: "L", mirrored: false });
    expect(turned.find((m) => m.ref === "ring")).toBeUndefined();
    const mirrored = findSimilar(similarQuery(await raster(L_SHAPE, { mirror: true }), "print"), stored);
    expect(mirrored[0]).toMatchObject({ ref: "L", mirrored: true });
    expect(mirrored[0].distance).toBeLessThanOrEqual(SIMILAR_MAX_DISTANCE);
  });

  it("take a light-on-dark face photo (the print's mirror image) for its print without calling it mirrored", async () => {
    const stored = [{ ref: "L", kind: "print" as const, signature: motifSignature(await raster(L_SHAPE)) }];
    const face = await raster(L_SHAPE, { mirror: true, ink: "#e8c48a", ground: "#1c1510" });
    const query = similarQuery(face);
    expect(query.kind).toBe("face");
    expect(findSimilar(query, stored)[0]).toMatchObject({ ref: "L", mirrored: false });
    // The stored signature as its own query finds itself at distance 0.
    expect(findSimilar(queryOfSignature(stored[0].signature, "print"), stored)[0].distance).toBeCloseTo(0, 5);
  });
});
