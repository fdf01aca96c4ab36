// Reads the V8 CPU profiles `node --cpu-prof` wrote (scripts/load-test.ts --profile) and says where the time went:
// self time by package (or the app's own code) and the functions with the most self time.
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join } from "node:path";

interface ProfileNode {
  id: number;
  callFrame: { functionName: string; url: string; lineNumber: number };
  hitCount?: number;
}
interface Profile {
  nodes: ProfileNode[];
  startTime: number;
  endTime: number;
  samples: number[];
}

/** "node_modules/next/dist/…" → "next"; the app's own files → "app code"; Node's → "node"; idle, GC, program apart. */
function ownerOf(url: string, functionName: string): string {
  if (!url) return functionName.startsWith("(") ? functionName : "(native)";
  const modules = url.lastIndexOf("node_modules/");
  if (modules >= 0) {
    const rest = url.slice(modules + "node_modules/".length).split("/");
    return rest[0].startsWith("@") ? `${rest[0]}/${rest[1]}` : rest[0];
  }
  if (url.startsWith("node:")) return "node";
  if (url.includes("/.next")) return "app code (built)";
  return "app code";
}

const pct = (part: number, whole: number) => `${((100 * part) / whole).toFixed(1)} %`.padStart(7);

/** Prints the summary of the largest profile in `dir` (the server's; tsx's own parent process is nearly idle). */
export function printProfileSummary(dir: string, top = 12) {
  const files = readdirSync(dir)
    .filter((f) => f.endsWith(".cpuprofile"))
    .map((f) => join(dir, f))
    .sort((a, b) => statSync(b).size - statSync(a).size);
  if (!files.length) {
    console.log(`[profile] no .cpuprofile in ${dir}`);
    return;
  }
  const profile = JSON.parse(readFileSync(files[0], "utf8")) as Profile;
  const byId = new Map(profile.nodes.map((n) => [n.id, n]));
  const hits = new Map<number, number>();
  for (const id of profile.samples) hits.set(id, (hits.get(id) ?? 0) + 1);
  // Shares of the time the server was busy: idle time (before and between the runs) left out.
  const idle = [...hits].filter(([id]) => byId.get(id)!.callFrame.functionName === "(idle)").reduce((a, [, n]) => a + n, 0);
  const total = profile.samples.length - idle;
  const owners = new Map<string, number>();
  const functions = new Map<string, number>();
  for (const [id, n] of hits) {
    const node = byId.get(id)!;
    if (node.callFrame.functionName === "(idle)") continue;
    const { functionName, url, lineNumber } = node.callFrame;
    const owner = ownerOf(url, functionName);
    owners.set(owner, (owners.get(owner) ?? 0) + n);
    const name = `${functionName || "(anonymous)"} ${url ? `${url.replace(/^.*node_modules\//, "").replace(/^file:\/\/.*?\/(\.next[^/]*)/, "$1")}:${lineNumber + 1}` : ""}`;
    functions.set(name, (functions.get(name) ?? 0) + n);
  }
  const seconds = (profile.endTime - profile.startTime) / 1e6;
  console.log(`\n[profile] ${files[0]}: ${profile.samples.length} samples over ${seconds.toFixed(0)} s of the server, busy in ${total}`);
  console.log("  self time by owner, share of the busy time (the app's chunks bundle Drizzle, postgres.js and Auth.js):");
  for (const [owner, n] of [...owners].sort((a, b) => b[1] - a[1]).slice(0, top)) console.log(`  ${pct(n, total)}  ${owner}`);
  console.log("  functions with the most self time:");
  for (const [name, n] of [...functions].sort((a, b) => b[1] - a[1]).slice(0, top)) console.log(`  ${pct(n, total)}  ${name.slice(0, 140)}`);
}
