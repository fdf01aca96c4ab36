import { describe, expect, it } from "vitest";
import { translator } from "@/lib/i18n/translator";
import { scanRejectedStatus } from "@/lib/errors";

describe("scan refusal messages", () => {
  const t = translator("en");
  it("has a message for every refusal code and every scan problem", () => {
    for (const code of Object.keys(scanRejectedStatus)) expect(t.has(`scans.rejected.${code}`), code).toBe(true);
    for (const code of ["scanDuplicate", "scanUploadMissing"]) expect(t.has(`errors.${code}`), code).toBe(true);
  });

  it("fills in the limits the server sends", () => {
    expect(t("scans.rejected.tooLarge", { maxMb: 8 })).toContain("larger than 8 MB");
    expect(t("scans.rejected.tooManyPixels", { maxPixels: 40_000_000 })).toContain("40,000,000 pixels");
    expect(t("scans.rejected.unsupportedType", { type: "GIF" })).toMatch(/^GIF files are not accepted/);
  });

  it("every refusal is a 4xx, except the busy queue (503)", () => {
    for (const [code, status] of Object.entries(scanRejectedStatus)) {
      if (code === "busy") expect(status).toBe(503);
      else expect(status >= 400 && status < 500, code).toBe(true);
    }
  });
});
