// Loads configuration for the scripts: the process environment wins, then `.env`, then the
// documented defaults in `.env.example` (so `npm start` works on a fresh clone without a .env).
import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { join, resolve } from "node:path";

export const projectRoot = resolve(import.meta.dirname, "..", "..");

export function loadConfig() {
  for (const file of [".env", ".env.example"]) {
    const path = join(projectRoot, file);
    // process.loadEnvFile never overrides variables that are already set.
    if (existsSync(path)) process.loadEnvFile(path);
  }
  process.env.NEXT_TELEMETRY_DISABLED = "1";
  return process.env;
}

export const localServicesOn = () => (process.env.CAPGRID_LOCAL_SERVICES ?? "on") !== "off";

/** A stable AUTH_SECRET for local runs, kept in the data folder so sessions survive restarts. */
export function ensureAuthSecret(dataDir: string) {
  if (process.env.AUTH_SECRET) return;
  const file = join(dataDir, "auth-secret");
  if (!existsSync(file)) {
    mkdirSync(dataDir, { recursive: true });
    writeFileSync(file, randomBytes(33).toString("base64"), { mode: 0o600 });
  }
  process.env.AUTH_SECRET = readFileSync(file, "utf8").trim();
}

export function portOf(url: string, fallback: number) {
  const port = new URL(url).port;
  return port ? Number(port) : fallback;
}
