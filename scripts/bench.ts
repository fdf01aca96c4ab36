// npm run bench — runs every scripts/bench-*.ts in turn; each prints its own table.
import { spawnSync } from "node:child_process";
import { readdirSync } from "node:fs";
import { join } from "node:path";
import { projectRoot } from "./lib/config";

const only = process.argv[2];
const all = readdirSync(join(projectRoot, "scripts"))
  .filter((f) => /^bench-.+\.ts$/.test(f))
  .sort();
// An exact name runs that one alone (`layout` is the engine, not also `layout-api`); otherwise every match.
const benches = !only ? all : all.includes(`bench-${only}.ts`) ? [`bench-${only}.ts`] : all.filter((f) => f.includes(only));
if (benches.length === 0) {
  console.error(only ? `no benchmark matches "${only}"` : "no scripts/bench-*.ts found");
  process.exit(1);
}
let failed = 0;
for (const file of benches) {
  console.log(`\n=== ${file} ===`);
  const result = spawnSync(join(projectRoot, "node_modules", ".bin", "tsx"), [join("scripts", file)], { stdio: "inherit", cwd: projectRoot });
  if (result.status !== 0) failed++;
}
process.exit(failed ? 1 : 0);
