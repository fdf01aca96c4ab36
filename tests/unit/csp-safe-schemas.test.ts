import { readdirSync, readFileSync, statSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { z } from "@/lib/zod";

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? sourceFiles(path) : /\.(ts|tsx)$/.test(name) ? [path] : [];
  });
}

describe("schemas that run in the browser", () => {
  it("are built with zod's jitless mode, so they never reach for eval under the pages' CSP", () => {
    expect(z.core.globalConfig.jitless).toBe(true);
    const folders = ["lib/validation", "lib/layout", "lib/wax", "lib/contracts", "components", "app"];
    for (const file of folders.flatMap(sourceFiles)) {
      expect(readFileSync(file, "utf8"), file).not.toMatch(/import \{[^}]*\bz\b[^}]*\} from "zod"/);
    }
  });
});
