import { readdirSync, readFileSync, statSync } from "node:fs";
import { join } from "node:path";

/** The folders whose code can name a catalogue key or show text. */
export const codeFolders = ["app", "components", "lib", "scripts"] as const;

/** Every .ts/.tsx file under the folders, without the catalogues themselves. */
export function sourceFiles(folders: readonly string[] = codeFolders): { path: string; text: string }[] {
  const walk = (dir: string): string[] =>
    readdirSync(dir).flatMap((name) => {
      const path = join(dir, name);
      if (statSync(path).isDirectory()) return name === "node_modules" || path === join("lib", "i18n", "messages") ? [] : walk(path);
      return /\.(ts|tsx)$/.test(name) && !name.endsWith(".d.ts") ? [path] : [];
    });
  return folders.flatMap(walk).map((path) => ({ path, text: readFileSync(path, "utf8") }));
}

/** Every leaf of a catalogue tree by its dotted key. */
export function catalogueLeaves(tree: unknown, prefix = "", out = new Map<string, string>()): Map<string, string> {
  if (tree !== null && typeof tree === "object" && !Array.isArray(tree)) {
    for (const [key, value] of Object.entries(tree)) catalogueLeaves(value, prefix ? `${prefix}.${key}` : key, out);
  } else if (typeof tree === "string") out.set(prefix, tree);
  return out;
}
