import { spawnSync } from "node:child_process";
import { existsSync, readFileSync, readdirSync, statSync, utimesSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { projectRoot } from "./config";

const sourceEntries = ["app", "components", "lib", "db", "public", "proxy.ts", "next.config.ts", "package-lock.json", "postcss.config.mjs", "tsconfig.json"];

function newestMtime(path: string): number {
  if (!existsSync(path)) return 0;
  const stat = statSync(path);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(path)) newest = Math.max(newest, newestMtime(join(path, entry)));
  return newest;
}

/**
 * Builds the app with `next build` unless the last build started after every source file was last changed. The
 * start time is kept beside the build (a file saved while a build runs makes the next start build again).
 */
export function buildIfStale(force = false) {
  const dist = join(projectRoot, process.env.NEXT_DIST_DIR || ".next");
  const startedFile = join(dist, "capgrid-build-started");
  const buildId = join(dist, "BUILD_ID");
  const builtAt = existsSync(buildId) && existsSync(startedFile) ? Number(readFileSync(startedFile, "utf8")) || 0 : 0;
  const sourcesAt = Math.max(...sourceEntries.map((e) => newestMtime(join(projectRoot, e))));
  if (!force && builtAt > sourcesAt) {
    console.log("[build] the last build is up to date");
    return;
  }
  console.log("[build] next build (a minute or two the first time)…");
  // next build adds its dist folder's type paths to tsconfig.json; test and bench builds use
  // folders of their own (.next-test-N), which must not end up in the committed file.
  const tsconfig = join(projectRoot, "tsconfig.json");
  const before = readFileSync(tsconfig, "utf8");
  const beforeStat = statSync(tsconfig);
  const started = Date.now();
  const result = spawnSync(join(projectRoot, "node_modules", ".bin", "next"), ["build"], { stdio: "inherit", cwd: projectRoot, env: process.env });
  if ((process.env.NEXT_DIST_DIR || ".next") !== ".next" && readFileSync(tsconfig, "utf8") !== before) {
    writeFileSync(tsconfig, before);
    // Put back its time too, so the restored file does not count as a change made after the build started.
    utimesSync(tsconfig, beforeStat.atime, beforeStat.mtime);
  }
  if (result.status !== 0) throw new Error("next build failed; see the messages above");
  writeFileSync(startedFile, String(started));
}
