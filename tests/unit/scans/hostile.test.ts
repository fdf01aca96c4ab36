import { describe, expect, it } from "vitest";
import { scanRejectedStatus } from "@/lib/errors";
import { downloadFileName, processScan, ScanRejected } from "@/lib/scans";
import { newObjectKey } from "@/lib/object-store";
import { hostileFiles, hostileLimits } from "@/tests/helpers/hostile-files";

const files = await hostileFiles();

async function refusal(bytes: Buffer, name: string): Promise<ScanRejected> {
  try {
    await processScan(bytes, { ...hostileLimits, fileName: name });
  } catch (error) {
    if (error instanceof ScanRejected) return error;
    throw new Error(`expected ScanRejected, got ${String(error)}`);
  }
  throw new Error("the file was accepted");
}

describe("hostile uploads", () => {
  it("the generator makes at least 30 distinct files covering every refusal", () => {
    expect(files.length).toBeGreaterThanOrEqual(30);
    expect(new Set(files.map((f) => f.label)).size).toBe(files.length);
    const codes = new Set(files.map((f) => f.expected));
    for (const code of ["empty", "tooLarge", "notAnImage", "svgRefused", "markupRefused", "unsupportedType", "truncated", "corrupt", "tooManyPixels", "trailingData", "tooSmall", "badFileName"]) {
      expect(codes).toContain(code);
    }
  });

  it.each(files.map((f) => [f.label, f] as const))("refuses %s", async (_, file) => {
    const error = await refusal(file.bytes, file.name);
    expect(error.code).toBe(file.expected);
    const status = scanRejectedStatus[error.code];
    expect(status).toBeGreaterThanOrEqual(400);
    expect(status).toBeLessThan(500);
  });

  it("says which limit was hit", async () => {
    const oversize = files.find((f) => f.expected === "tooLarge")!;
    expect((await refusal(oversize.bytes, oversize.name)).params).toEqual({ sizeBytes: hostileLimits.maxBytes + 1, maxBytes: hostileLimits.maxBytes });
    const flood = files.find((f) => f.name === "flood.png")!;
    expect((await refusal(flood.bytes, flood.name)).params).toEqual({ widthPx: 100_000, heightPx: 100_000, maxPixels: hostileLimits.maxPixels });
  });

  it("refuses them all when they arrive at once, and still accepts a good scan after", async () => {
    const results = await Promise.allSettled(files.map((f) => processScan(f.bytes, { ...hostileLimits, fileName: f.name })));
    expect(results.every((r) => r.status === "rejected" && r.reason instanceof ScanRejected)).toBe(true);
    const good = files.find((f) => f.expected === "badFileName")!.bytes; // a sound PNG behind a bad name
    const scan = await processScan(good, { ...hostileLimits, fileName: "scan.png" });
    expect(scan.type).toBe("png");
  });

  it("file names never reach storage keys, and download names lose their path and hidden characters", () => {
    for (const file of files.filter((f) => f.expected === "badFileName")) {
      const key = newObjectKey("scans/originals");
      expect(key).toMatch(/^scans\/originals\/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/);
      const download = downloadFileName(file.name, "png");
      expect(download).not.toMatch(/[/\\\u0000-\u001f\u202a-\u202e]/);
      expect(download).not.toContain("..");
      expect(download.endsWith(".png")).toBe(true);
    }
    expect(downloadFileName("../../etc/passwd.png", "png")).toBe("passwd.png");
    expect(downloadFileName("scan\u202egnp.exe", "jpeg")).toBe("scangnp.jpg");
    expect(downloadFileName('a"b;c.tif', "tiff")).toBe("a_b_c.tif");
    expect(downloadFileName(null, "webp")).toBe("scan.webp");
    expect(() => newObjectKey("../up")).toThrow(RangeError);
    expect(() => newObjectKey("Scans")).toThrow(RangeError);
  });
});
