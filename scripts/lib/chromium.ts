import { execFileSync } from "node:child_process";
import { existsSync } from "node:fs";

export const chromiumPath = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";

/** The browser tests drive Debian's chromium; install it when missing and we are root. */
export function ensureChromium() {
  if (existsSync(chromiumPath)) return;
  const isRoot = typeof process.getuid === "function" && process.getuid() === 0;
  if (!isRoot) {
    throw new Error(`Chromium is missing at ${chromiumPath}. Install it with:\n\n    sudo apt-get update && sudo apt-get install -y chromium\n`);
  }
  console.log("[chromium] missing; installing Debian's chromium package (apt-get)…");
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  execFileSync("apt-get", ["update", "-qq"], { stdio: "inherit", env });
  execFileSync("apt-get", ["install", "-y", "-qq", "chromium"], { stdio: "inherit", env });
}
