// Starts what the app needs on this machine: PostgreSQL, the mail catcher and the object store.
import type { ChildProcess } from "node:child_process";
import { join } from "node:path";
import { localServicesOn, portOf } from "./config";
import { startCluster, stopCluster } from "./postgres";
import { startMailCatcher, startObjectStore, stopChildren } from "./services";

export interface Stack {
  stop(): void;
}

/** `dataDir` holds the cluster and the object store's files (.data for npm start, .test-data for npm test). */
export async function startStack(dataDir: string, opts: { quiet?: boolean } = {}): Promise<Stack> {
  if (!localServicesOn()) {
    console.log("CAPGRID_LOCAL_SERVICES=off: using the PostgreSQL, SMTP and S3 services named in the environment.");
    return { stop() {} };
  }
  const env = process.env;
  const pgDir = join(dataDir, "postgres");
  const children: ChildProcess[] = [];
  let stopped = false;
  const stop = () => {
    if (stopped) return;
    stopped = true;
    stopChildren(children);
    stopCluster(pgDir);
  };
  try {
    startCluster({ dir: pgDir, databaseUrl: env.DATABASE_URL! });
    const webPort = env.MAIL_VIEWER_URL ? portOf(env.MAIL_VIEWER_URL, 1080) : 1080;
    children.push(await startMailCatcher({ smtpPort: Number(env.SMTP_PORT), webPort, quiet: opts.quiet }));
    if (env.S3_ENDPOINT) {
      children.push(await startObjectStore({ port: portOf(env.S3_ENDPOINT, 4568), dir: join(dataDir, "objects"), bucket: env.S3_BUCKET!, quiet: opts.quiet }));
    }
  } catch (error) {
    stop();
    throw error;
  }
  return { stop };
}
