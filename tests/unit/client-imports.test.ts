import { readdirSync, readFileSync, statSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";

// The folder rules in eslint.config.mjs cover components/; client files live in app/ too. A file that runs
// in the browser ("use client") takes its types from the contracts and never imports the data layer.
function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? sourceFiles(path) : /\.(ts|tsx)$/.test(name) ? [path] : [];
  });
}

describe("client files", () => {
  const clients = [...sourceFiles("app"), ...sourceFiles("components"), ...sourceFiles("lib")].filter((f) => /^\s*["']use client["']/.test(readFileSync(f, "utf8")));

  it("are found", () => {
    expect(clients.length).toBeGreaterThan(15);
  });

  it("import nothing from lib/data, not even types", () => {
    const offenders = clients.filter((f) => /from\s+["']@\/lib\/data[/"']/.test(readFileSync(f, "utf8")));
    expect(offenders).toEqual([]);
  });
});
