import { readdirSync, readFileSync, statSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it, vi } from "vitest";
import { z } from "zod";
import { errorAnswer } from "@/lib/error-body";
import { AppError, errorStatus, scanRejectedStatus, statusOf } from "@/lib/errors";
import { translator } from "@/lib/i18n/translator";
import { computeLayout, LayoutInputError } from "@/lib/layout";
import { ScanRejected } from "@/lib/scans";
import { estimateWax, WaxInputError } from "@/lib/wax";

const t = translator("en");

function thrown(work: () => unknown): unknown {
  try {
    work();
  } catch (error) {
    return error;
  }
  throw new Error("expected the work to throw");
}

describe("one error body for every error", () => {
  it("answers zod failures with 400 and a message per field", () => {
    const error = thrown(() => z.object({ name: z.string().min(1, "validation.required") }).parse({ name: "" }));
    const { status, body } = errorAnswer(error, t);
    expect(status).toBe(400);
    expect(body.error).toEqual({ code: "validation", message: t("errors.validation"), fields: { name: ["Required."] } });
  });

  it("answers the layout engine's refusals with 422 naming each field", () => {
    const error = thrown(() => computeLayout({ cloth: { widthMm: 1000, lengthMm: 1000 }, stamp: { widthMm: 0, heightMm: 200 }, arrangement: "straight" }));
    expect(error).toBeInstanceOf(LayoutInputError);
    const { status, body } = errorAnswer(error, t);
    expect(status).toBe(422);
    expect(body.error.code).toBe("unprocessable");
    expect(body.error.fields?.["stamp.widthMm"]?.[0]).toMatch(/at least 5/);
  });

  it("answers the wax estimator's refusals the same way", () => {
    const error = thrown(() => estimateWax({ waxedAreaPerMetreM2: 1, metres: 1, rateGPerM2: 90, components: [{ material: "beeswax", pct: 90, densityGPerCm3: 0.96 }] }));
    expect(error).toBeInstanceOf(WaxInputError);
    const { status, body } = errorAnswer(error, t);
    expect(status).toBe(422);
    expect(Object.values(body.error.fields ?? {}).flat().join(" ")).toMatch(/add up to 90 %/);
  });

  it("answers a refused scan with the status of its code and its size in MB", () => {
    const { status, body } = errorAnswer(new ScanRejected("tooLarge", { sizeBytes: 9 * 1024 * 1024, maxBytes: 8 * 1024 * 1024 }), t);
    expect(status).toBe(413);
    expect(body.error.code).toBe("tooLarge");
    expect(body.error.message).toContain("8");
  });

  it("adds an error's details and translates a file's row problems", () => {
    const duplicate = errorAnswer(new AppError("scanDuplicate", { fileName: "a.png" }, undefined, { existing: { id: "x" } }), t);
    expect(duplicate.status).toBe(409);
    expect(duplicate.body.error.existing).toEqual({ id: "x" });
    const rows = [{ line: 3, column: "code", message: { key: "validation.csvDuplicateCode", values: { row: 2 } } }];
    const invalid = errorAnswer(new AppError("importInvalid", { count: 1 }, undefined, { rows }), t);
    expect(invalid.status).toBe(422);
    expect(invalid.body.error.rows).toEqual([{ line: 3, column: "code", message: t("validation.csvDuplicateCode", { row: 2 }) }]);
  });

  it("answers anything else with a bare 500 and logs it", () => {
    const log = vi.spyOn(console, "error").mockImplementation(() => {});
    const { status, body } = errorAnswer(new Error("secret detail"), t);
    expect(status).toBe(500);
    expect(JSON.stringify(body)).not.toContain("secret");
    expect(log).toHaveBeenCalled();
    log.mockRestore();
  });

  it("takes every status from the one table", () => {
    for (const [code, status] of Object.entries(errorStatus)) expect(statusOf(code as keyof typeof errorStatus)).toBe(status);
    for (const [code, status] of Object.entries(scanRejectedStatus)) expect(statusOf(code as keyof typeof scanRejectedStatus)).toBe(status);
  });
});

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? sourceFiles(path) : /\.(ts|tsx)$/.test(name) ? [path] : [];
  });
}

describe("the house keeps one pipeline", () => {
  it("builds error bodies in lib/error-body.ts only", () => {
    const builders = [...sourceFiles("app"), ...sourceFiles("lib")].filter((file) => /\{\s*error:\s*\{\s*code/.test(readFileSync(file, "utf8")));
    expect(builders).toEqual(["lib/error-body.ts"]);
  });

  it("keeps HTTP statuses out of the pure domain", () => {
    for (const file of [...sourceFiles("lib/layout"), ...sourceFiles("lib/scans"), ...sourceFiles("lib/wax"), ...sourceFiles("lib/stamps")]) {
      expect(readFileSync(file, "utf8"), file).not.toMatch(/\b(status|Status)\s*[:=]\s*\{?\s*\d{3}\b|: (400|404|409|413|415|422|503)\b/);
    }
  });
});
