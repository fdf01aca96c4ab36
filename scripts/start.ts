// npm start — runs Capgrid on this machine: PostgreSQL, mail catcher and object store on loopback,
// migrations, demo data on first run, a production build, and the app at http://localhost:3000.
// `npm run dev` does the same with the Next.js dev server. Ctrl-C stops everything it started.
import { spawn } from "node:child_process";
import { join } from "node:path";
import { ensureAuthSecret, loadConfig, localServicesOn, projectRoot } from "./lib/config";
import { runMigrations } from "./lib/migrate";
import { buildIfStale } from "./lib/build";
import { objectStoreFromEnv } from "./lib/object-store-config";
import { startStack } from "./lib/stack";
import { printSignIns, seedDemo } from "./lib/seed";

const dev = process.argv.includes("--dev");
const env = loadConfig();
const dataDir = join(projectRoot, ".data");
ensureAuthSecret(dataDir);

let stack: Awaited<ReturnType<typeof startStack>> | undefined;
try {
  stack = await startStack(dataDir);
  await runMigrations(env.DATABASE_URL!);
  // A real bucket may not exist yet on a first deployment; the local fake creates its own.
  await objectStoreFromEnv(env).ensureBucket();

  const { database } = await import("@/db");
  const { users } = await import("@/db/schema");
  const { client, db } = database();
  const firstRun = (await db.select({ id: users.id }).from(users).limit(1)).length === 0;
  // Demo people only go into a local database; a managed one is never seeded by starting the app.
  if (firstRun && localServicesOn()) {
    console.log("[seed] empty database: adding the demo workshop");
    await seedDemo(db);
  }
  await client.end();

  if (!dev) buildIfStale();
} catch (error) {
  console.error(`\n${(error as Error).message}\n`);
  stack?.stop();
  process.exit(1);
}

const port = env.PORT ?? "3000";
// scripts/server.ts serves the app (Next's handler behind node:http), so the app sees each client's real address.
const app = spawn(join(projectRoot, "node_modules", ".bin", "tsx"), [join(projectRoot, "scripts", "server.ts"), ...(dev ? ["--dev"] : []), "--port", port, "--host", env.CAPGRID_HOST ?? "127.0.0.1"], {
  stdio: "inherit",
  env: process.env,
  cwd: projectRoot,
});

if (localServicesOn()) printSignIns(env.APP_URL);
console.log(`Capgrid: ${env.APP_URL}`);
if (env.MAIL_VIEWER_URL) console.log(`Captured mail: ${env.MAIL_VIEWER_URL}`);
console.log("Press Ctrl-C to stop.\n");

let stopping = false;
const shutdown = (code: number) => {
  if (stopping) return;
  stopping = true;
  if (app.exitCode === null) app.kill("SIGTERM");
  stack?.stop();
  process.exit(code);
};
process.on("SIGINT", () => shutdown(0));
process.on("SIGTERM", () => shutdown(0));
app.on("exit", (code) => shutdown(code ?? 0));
