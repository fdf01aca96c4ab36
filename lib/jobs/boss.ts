import "server-only";
import PgBoss from "pg-boss";
import { log } from "@/lib/log";
import { JOB_SCHEMA, queues } from "./queues";

// One pg-boss per process, started on first use, with the app's queues created (creating one that exists is a
// no-op). Uses DATABASE_URL, so every app server shares the same queues.

let started: Promise<PgBoss> | undefined;

export function jobBoss(): Promise<PgBoss> {
  started ??= (async () => {
    const boss = new PgBoss({ connectionString: process.env.DATABASE_URL!, schema: JOB_SCHEMA, max: 4 });
    boss.on("error", (error) => log().error({ event: "job.error", error: error.message }, "job.error"));
    await boss.start();
    for (const q of queues) if (!(await boss.getQueue(q.name))) await boss.createQueue(q.name, q);
    return boss;
  })();
  return started;
}

export async function stopJobBoss() {
  if (!started) return;
  const boss = await started;
  started = undefined;
  await boss.stop({ graceful: true, wait: true });
}
