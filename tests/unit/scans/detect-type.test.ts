import { describe, expect, it } from "vitest";
import { detectType, sniffContent } from "@/lib/scans";

const bytes = (...values: number[]) => Uint8Array.from(values);
const text = (s: string) => new TextEncoder().encode(s);

// Signatures: PNG (ISO/IEC 15948 §5.2), JPEG SOI + marker (ITU-T T.81 Annex B), TIFF byte order + 42
// (TIFF 6.0 §2; BigTIFF uses 43), WebP RIFF/WEBP (RFC 9649 §2.4), GIF87a/89a, BMP "BM" + DIB header size.
describe("scan type from magic bytes", () => {
  const cases: Array<[string, Uint8Array, ReturnType<typeof detectType>]> = [
    ["PNG", bytes(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13), "png"],
    ["JPEG", bytes(0xff, 0xd8, 0xff, 0xe0, 0, 16), "jpeg"],
    ["TIFF little-endian", bytes(0x49, 0x49, 0x2a, 0x00, 8, 0, 0, 0), "tiff"],
    ["TIFF big-endian", bytes(0x4d, 0x4d, 0x00, 0x2a, 0, 0, 0, 8), "tiff"],
    ["BigTIFF", bytes(0x49, 0x49, 0x2b, 0x00, 8, 0, 0, 0), "tiff"],
    ["WebP", Uint8Array.from([...text("RIFF"), 40, 0, 0, 0, ...text("WEBPVP8 ")]), "webp"],
    ["PNG signature with one byte wrong", bytes(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0b), null],
    ["RIFF that is not WebP (a WAV)", Uint8Array.from([...text("RIFF"), 40, 0, 0, 0, ...text("WAVEfmt ")]), null],
    ["JPEG missing its third byte", bytes(0xff, 0xd8), null],
    ["empty", bytes(), null],
  ];
  it.each(cases)("%s", (_, input, expected) => {
    expect(detectType(input)).toBe(expected);
  });
});

describe("refused content is named", () => {
  it.each([
    ["<svg xmlns='http://www.w3.org/2000/svg'/>", { kind: "svg" }],
    ["  \n<?xml version='1.0'?><!-- x --><svg>", { kind: "svg" }],
    ["<!DOCTYPE svg PUBLIC '-//W3C//DTD SVG 1.1//EN' ''><svg>", { kind: "svg" }],
    ["<!doctype html><p>hi", { kind: "markup", markup: "html" }],
    ["<html><body>", { kind: "markup", markup: "html" }],
    ["<script>alert(1)</script>", { kind: "markup", markup: "html" }],
    ["<?xml version='1.0'?><stamp/>", { kind: "markup", markup: "xml" }],
    ["GIF89a\x01\x00\x01\x00", { kind: "refusedImage", type: "gif" }],
    ["%PDF-1.4", { kind: "refusedImage", type: "pdf" }],
    ["8BPS\x00\x01", { kind: "refusedImage", type: "psd" }],
    ["hello", { kind: "unknown" }],
    ["BM but just a sentence", { kind: "unknown" }],
  ])("%j", (input, expected) => {
    expect(sniffContent(text(input))).toEqual(expected);
  });

  it("reads an SVG written in UTF-16 with a byte-order mark", () => {
    const body = Buffer.from("<svg xmlns='http://www.w3.org/2000/svg'/>", "utf16le");
    expect(sniffContent(Buffer.concat([Buffer.from([0xff, 0xfe]), body]))).toEqual({ kind: "svg" });
  });

  it("a BMP needs a known DIB header size after 'BM'", () => {
    const bmp = new Uint8Array(30);
    bmp.set(text("BM"));
    bmp[14] = 40;
    expect(sniffContent(bmp)).toEqual({ kind: "refusedImage", type: "bmp" });
  });
});
