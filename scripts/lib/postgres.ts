// Private PostgreSQL cluster from Debian's `postgresql` package, in a data folder inside
// the project, listening on 127.0.0.1 only. Used by `npm start`, `npm test` and `scripts/db.ts`.
import { execFileSync, spawnSync } from "node:child_process";
import { randomBytes } from "node:crypto";
import { chmodSync, existsSync, mkdirSync, readdirSync, rmSync, statSync, writeFileSync } from "node:fs";
import { dirname, join, resolve } from "node:path";

export interface ClusterOptions {
  /** Folder holding `pgdata/`, `run/` (socket) and `postgres.log`. */
  dir: string;
  /** DATABASE_URL the app will use: its port, user, password and database are created here. */
  databaseUrl: string;
}

const isRoot = typeof process.getuid === "function" && process.getuid() === 0;

function log(message: string) {
  console.log(`[postgres] ${message}`);
}

/** Finds pg_ctl and friends; installs Debian's package when missing and we are root. */
export function findPostgresBin(): string {
  const base = "/usr/lib/postgresql";
  const find = () => {
    if (!existsSync(base)) return null;
    const majors = readdirSync(base)
      .filter((v) => existsSync(join(base, v, "bin", "initdb")) && existsSync(join(base, v, "bin", "postgres")))
      .sort((a, b) => Number(b) - Number(a));
    return majors.length ? join(base, majors[0], "bin") : null;
  };
  const found = find();
  if (found) return found;
  if (!isRoot) {
    throw new Error(
      "PostgreSQL server binaries are missing. Install them with:\n\n" +
        "    sudo apt-get update && sudo apt-get install -y postgresql\n\n" +
        "then run this command again.",
    );
  }
  log("server binaries missing; installing Debian's postgresql package (apt-get)…");
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  execFileSync("apt-get", ["update", "-qq"], { stdio: "inherit", env });
  execFileSync("apt-get", ["install", "-y", "-qq", "postgresql"], { stdio: "inherit", env });
  const installed = find();
  if (!installed) throw new Error("apt-get installed postgresql but no server binaries were found in /usr/lib/postgresql.");
  return installed;
}

/** Runs a PostgreSQL binary; as root it must run as the `postgres` user (initdb refuses root). */
function runPg(bin: string, tool: string, args: string[], options: { allowFail?: boolean } = {}) {
  const command = isRoot ? "runuser" : join(bin, tool);
  const fullArgs = isRoot ? ["-u", "postgres", "--", join(bin, tool), ...args] : args;
  const result = spawnSync(command, fullArgs, { encoding: "utf8" });
  if (result.status !== 0 && !options.allowFail) {
    throw new Error(`${tool} failed (${result.status}): ${result.stderr || result.stdout}`);
  }
  return result;
}

/** As root the cluster runs as `postgres`, which must be able to reach the project folder. */
function grantTraverse(dir: string) {
  if (!isRoot) return;
  const changed: string[] = [];
  for (let current = resolve(dir); current !== "/"; current = dirname(current)) {
    if (!existsSync(current)) continue;
    const mode = statSync(current).mode;
    if ((mode & 0o001) === 0) {
      chmodSync(current, mode | 0o001);
      changed.push(current);
    }
  }
  if (changed.length) log(`let the postgres user traverse (o+x): ${changed.join(", ")}`);
}

function chownToPostgres(path: string) {
  if (isRoot) execFileSync("chown", ["-R", "postgres:postgres", path]);
}

export function clusterPaths(dir: string) {
  const root = resolve(dir);
  return { root, data: join(root, "pgdata"), socketDir: join(root, "run"), logFile: join(root, "postgres.log") };
}

function parseUrl(databaseUrl: string) {
  const url = new URL(databaseUrl);
  const host = url.hostname;
  if (host !== "127.0.0.1" && host !== "localhost") {
    throw new Error(`DATABASE_URL points at ${host}; the private cluster only serves 127.0.0.1. Unset CAPGRID_LOCAL_SERVICES or use a loopback URL.`);
  }
  return {
    port: Number(url.port || 5432),
    user: decodeURIComponent(url.username),
    password: decodeURIComponent(url.password),
    database: url.pathname.replace(/^\//, ""),
  };
}

export function isClusterRunning(dir: string): boolean {
  const { data } = clusterPaths(dir);
  if (!existsSync(join(data, "PG_VERSION"))) return false;
  const bin = findPostgresBin();
  return runPg(bin, "pg_ctl", ["-D", data, "status"], { allowFail: true }).status === 0;
}

function psql(bin: string, socketDir: string, port: number, sql: string, database = "postgres") {
  const args = ["-h", socketDir, "-p", String(port), "-U", "postgres", "-d", database, "-v", "ON_ERROR_STOP=1", "-qAtc", sql];
  const result = spawnSync(join(bin, "psql"), args, { encoding: "utf8" });
  if (result.status !== 0) throw new Error(`psql failed: ${result.stderr}`);
  return result.stdout.trim();
}

const quoteIdent = (name: string) => `"${name.replace(/"/g, '""')}"`;
const quoteLiteral = (value: string) => `'${value.replace(/'/g, "''")}'`;

/**
 * Creates (first time) and starts the cluster, then makes sure the app's role and database
 * exist with the password from DATABASE_URL. Harmless when the cluster is already up.
 */
export function startCluster({ dir, databaseUrl }: ClusterOptions) {
  const bin = findPostgresBin();
  const { root, data, socketDir, logFile } = clusterPaths(dir);
  const { port, user, password, database } = parseUrl(databaseUrl);
  mkdirSync(root, { recursive: true });
  grantTraverse(root);

  if (!existsSync(join(data, "PG_VERSION"))) {
    log(`creating a new cluster in ${data}`);
    mkdirSync(data, { recursive: true });
    mkdirSync(socketDir, { recursive: true });
    // The superuser only connects through the private socket folder (trust there);
    // every TCP connection needs a password (scram-sha-256).
    const pwFile = join(root, ".initdb-pw");
    writeFileSync(pwFile, randomBytes(24).toString("hex"), { mode: 0o600 });
    chownToPostgres(root);
    try {
      runPg(bin, "initdb", ["-D", data, "-U", "postgres", `--pwfile=${pwFile}`, "--auth-local=trust", "--auth-host=scram-sha-256", "-E", "UTF8", "--locale=C.UTF-8"]);
    } finally {
      rmSync(pwFile, { force: true });
    }
  }
  mkdirSync(socketDir, { recursive: true, mode: 0o700 });
  chownToPostgres(socketDir);
  if (isRoot) execFileSync("chown", ["postgres:postgres", root]);

  if (!isClusterRunning(dir)) {
    log(`starting on 127.0.0.1:${port} (data ${data})`);
    const opts = `-p ${port} -c listen_addresses=127.0.0.1 -c unix_socket_directories='${socketDir}'`;
    runPg(bin, "pg_ctl", ["-D", data, "-l", logFile, "-w", "-t", "60", "-o", opts, "start"]);
  } else {
    log(`already running on port ${port}`);
  }

  const roleExists = psql(bin, socketDir, port, `SELECT 1 FROM pg_roles WHERE rolname = ${quoteLiteral(user)}`) === "1";
  const setPassword = `PASSWORD ${quoteLiteral(password)}`;
  psql(bin, socketDir, port, roleExists ? `ALTER ROLE ${quoteIdent(user)} WITH LOGIN CREATEDB ${setPassword}` : `CREATE ROLE ${quoteIdent(user)} WITH LOGIN CREATEDB ${setPassword}`);
  const dbExists = psql(bin, socketDir, port, `SELECT 1 FROM pg_database WHERE datname = ${quoteLiteral(database)}`) === "1";
  if (!dbExists) {
    psql(bin, socketDir, port, `CREATE DATABASE ${quoteIdent(database)} OWNER ${quoteIdent(user)}`);
    log(`created database ${database} owned by ${user}`);
  }
}

export function stopCluster(dir: string) {
  const { data } = clusterPaths(dir);
  if (!existsSync(join(data, "PG_VERSION"))) return;
  const bin = findPostgresBin();
  if (runPg(bin, "pg_ctl", ["-D", data, "status"], { allowFail: true }).status !== 0) return;
  runPg(bin, "pg_ctl", ["-D", data, "-m", "fast", "-w", "stop"], { allowFail: true });
  log("stopped");
}

/** Drops the dev data: stops the cluster and removes its folder. */
export function removeCluster(dir: string) {
  stopCluster(dir);
  rmSync(clusterPaths(dir).root, { recursive: true, force: true });
}
