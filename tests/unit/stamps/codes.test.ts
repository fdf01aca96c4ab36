import jsQR from "jsqr";
import QRCode from "qrcode";
import { describe, expect, it } from "vitest";
import { codeFromScan, locationFromScan, shelfUrl, stampUrl } from "@/lib/stamps/codes";

describe("codeFromScan", () => {
  it("reads a code from a label's address, with or without a trailing slash or query", () => {
    expect(codeFromScan("https://capgrid.example/stamps/CP-0142")).toBe("CP-0142");
    expect(codeFromScan("http://localhost:3000/stamps/cp-0142/")).toBe("CP-0142");
    expect(codeFromScan("http://localhost:3000/stamps/CP-0142?from=label")).toBe("CP-0142");
    expect(codeFromScan("http://localhost:3000/stamps/CP%2D0142")).toBe("CP-0142");
  });

  it("takes a typed code in any case and refuses text that cannot be a code", () => {
    expect(codeFromScan("  br-07 ")).toBe("BR-07");
    expect(codeFromScan("")).toBeNull();
    expect(codeFromScan("two words")).toBeNull();
    expect(codeFromScan("https://elsewhere.example/a/b")).toBeNull();
  });
});

describe("locationFromScan", () => {
  const id = "3f2b8c1e-7a4d-4e2f-9b1a-0c5d6e7f8a9b";
  it("reads the location from a shelf label's address", () => {
    expect(shelfUrl("http://localhost:3000/", id)).toBe(`http://localhost:3000/stamps?location=${id}`);
    expect(locationFromScan(shelfUrl("https://capgrid.example", id))).toBe(id);
    expect(locationFromScan(` http://localhost:3000/stamps/?location=${id.toUpperCase()} `)).toBe(id);
  });

  it("is null for a stamp's label, a typed code or another address", () => {
    expect(locationFromScan("http://localhost:3000/stamps/CP-0142")).toBeNull();
    expect(locationFromScan("CP-0142")).toBeNull();
    expect(locationFromScan(`http://localhost:3000/stamps?location=not-an-id`)).toBeNull();
    expect(locationFromScan(`http://localhost:3000/elsewhere?location=${id}`)).toBeNull();
    // A shelf label is never taken for a stamp code.
    expect(codeFromScan(shelfUrl("http://localhost:3000", id))).toBeNull();
  });
});

describe("label QR codes", () => {
  // Cross-check with an independent decoder (jsQR, from the npm registry): the matrix the
  // label prints decodes back to the stamp's address.
  it("decode to the stamp's address", async () => {
    const url = stampUrl("http://localhost:3000/", "CP-0142");
    expect(url).toBe("http://localhost:3000/stamps/CP-0142");
    const qr = QRCode.create(url, { errorCorrectionLevel: "M" });
    const scale = 4;
    const margin = 4;
    const modules = qr.modules.size;
    const side = (modules + 2 * margin) * scale;
    const pixels = new Uint8ClampedArray(side * side * 4).fill(255);
    for (let y = 0; y < modules; y++)
      for (let x = 0; x < modules; x++) {
        if (!qr.modules.get(y, x)) continue;
        for (let dy = 0; dy < scale; dy++)
          for (let dx = 0; dx < scale; dx++) {
            const i = (((y + margin) * scale + dy) * side + (x + margin) * scale + dx) * 4;
            pixels[i] = pixels[i + 1] = pixels[i + 2] = 0;
          }
      }
    const decoded = jsQR(pixels, side, side);
    expect(decoded?.data).toBe(url);
    expect(codeFromScan(decoded!.data)).toBe("CP-0142");
  });
});
