// npm run deps: each runtime dependency's pinned version against the newest release of its line, read from the
// npm registry (the advisory service `npm audit` needs cannot be reached from these machines, so this is what
// tells us a patch release is out). Exits 1 when one of the packages that must be current is behind.
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { lineReport, type LineReport } from "./lib/dependency-lines";

/** These must be on the newest patch release of their line (or the README says why not). */
const mustBeCurrent = new Set(["next", "react", "react-dom", "next-auth", "sharp"]);

const root = join(import.meta.dirname, "..");
const pkg = JSON.parse(readFileSync(join(root, "package.json"), "utf8")) as { dependencies: Record<string, string> };

function published(name: string): string[] {
  try {
    const out = execFileSync("npm", ["view", name, "versions", "--json"], { encoding: "utf8", stdio: ["ignore", "pipe", "ignore"], timeout: 60_000 });
    const parsed = JSON.parse(out) as string[] | string;
    return Array.isArray(parsed) ? parsed : [parsed];
  } catch {
    return [];
  }
}

const reports: LineReport[] = Object.entries(pkg.dependencies).map(([name, pinned]) => lineReport(name, pinned.replace(/^[\^~=]/, ""), published(name)));
const width = Math.max(...reports.map((r) => r.name.length));
console.log(`${"package".padEnd(width)}  pinned        newest of line  newest        `);
for (const r of reports) {
  const mark = r.status === "behind" ? (mustBeCurrent.has(r.name) ? "BEHIND (must be current)" : "behind") : r.status === "unknown" ? "registry not reached" : "";
  console.log(`${r.name.padEnd(width)}  ${r.pinned.padEnd(12)}  ${(r.newestOfLine ?? "?").padEnd(14)}  ${(r.newest ?? "?").padEnd(12)}  ${mark}`);
}
const behind = reports.filter((r) => r.status === "behind");
console.log(`\n${reports.length} runtime dependencies: ${reports.length - behind.length} on the newest release of their line, ${behind.length} behind.`);
process.exit(behind.some((r) => mustBeCurrent.has(r.name)) ? 1 : 0);
