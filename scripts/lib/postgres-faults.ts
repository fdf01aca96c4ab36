// Faults for the crash test: PostgreSQL stopped abruptly (`pg_ctl stop -m immediate`: no checkpoint, every
// backend killed, crash recovery at the next start), then started again with the same options as before.
import { spawnSync } from "node:child_process";
import { join } from "node:path";
import { clusterPaths, findPostgresBin, startCluster } from "./postgres";

const isRoot = typeof process.getuid === "function" && process.getuid() === 0;

/** `pg_ctl stop -m immediate` on the cluster in `dir` (as the `postgres` user when we are root); waits for it to be down. */
export function stopClusterAbruptly(dir: string) {
  const bin = findPostgresBin();
  const { data } = clusterPaths(dir);
  const args = ["-D", data, "-m", "immediate", "-w", "stop"];
  const result = isRoot ? spawnSync("runuser", ["-u", "postgres", "--", join(bin, "pg_ctl"), ...args], { encoding: "utf8" }) : spawnSync(join(bin, "pg_ctl"), args, { encoding: "utf8" });
  if (result.status !== 0) throw new Error(`pg_ctl stop -m immediate failed (${result.status}): ${result.stderr || result.stdout}`);
}

/** Starts the cluster again (crash recovery runs first); quiet apart from errors. */
export function restartCluster(dir: string, databaseUrl: string) {
  const log = console.log;
  console.log = () => {};
  try {
    startCluster({ dir, databaseUrl });
  } finally {
    console.log = log;
  }
}
