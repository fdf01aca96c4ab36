import { readFileSync, readdirSync, statSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { errorStatus } from "@/lib/errors";
import { catalogueFiles } from "@/lib/i18n/messages";
import { translator } from "@/lib/i18n/translator";
import { permissionTable, roles } from "@/lib/permissions";

const t = translator("en");

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? sourceFiles(path) : /\.(ts|tsx)$/.test(name) ? [path] : [];
  });
}

describe("English catalogue", () => {
  it("defines each namespace in one file only", () => {
    const seen = new Map<string, number>();
    catalogueFiles.en.forEach((file, index) => {
      for (const key of Object.keys(file)) {
        expect(seen.has(key), `namespace "${key}" in files ${seen.get(key)} and ${index}`).toBe(false);
        seen.set(key, index);
      }
    });
  });

  it("has a message for every error code, role and permission", () => {
    for (const code of Object.keys(errorStatus)) expect(t.has(`errors.${code}`), code).toBe(true);
    for (const role of roles) expect(t.has(`roles.${role}.name`) && t.has(`roles.${role}.summary`), role).toBe(true);
    for (const p of Object.keys(permissionTable)) expect(t.has(`permissions.${p}`), p).toBe(true);
  });

  it("has every validation key the schemas and data layer name", () => {
    const keys = new Set<string>();
    for (const file of [...sourceFiles("lib"), ...sourceFiles("app")]) {
      for (const match of readFileSync(file, "utf8").matchAll(/"(validation\.[A-Za-z]+)"/g)) keys.add(match[1]);
    }
    expect(keys.size).toBeGreaterThan(5);
    for (const key of keys) expect(t.has(key), key).toBe(true);
  });
});
