import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { z } from "@/lib/validation/zod";

describe("schemas that run in the browser", () => {
  it("are built with zod's jitless mode, so they never reach for eval under the pages' CSP", () => {
    expect(z.core.globalConfig.jitless).toBe(true);
    for (const name of readdirSync("lib/validation").filter((f) => f.endsWith(".ts") && f !== "zod.ts")) {
      const source = readFileSync(join("lib/validation", name), "utf8");
      expect(source, name).not.toMatch(/import \{[^}]*\bz\b[^}]*\} from "zod"/);
    }
  });
});
