import "server-only";
import { remindOverdueBorrowers } from "@/lib/data/stamps/mail";
import { workshopTimeZone } from "@/lib/data/settings";
import { audit, log } from "@/lib/log";
import { jobBoss } from "./boss";
import { REMINDERS, REMINDERS_CRON } from "./queues";

// The workers every app server runs (scripts/server.ts starts them unless JOBS=off). A failing job is logged as
// job.failed and thrown again, so pg-boss retries it with its backoff.

async function logged<T>(queue: string, id: string, work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (error) {
    audit("job.failed", null, { queue, jobId: id, error: error instanceof Error ? error.message : String(error) });
    throw error;
  }
}

export async function startJobWorkers() {
  const boss = await jobBoss();
  await boss.work(REMINDERS, { batchSize: 1 }, async ([job]) =>
    logged(REMINDERS, job.id, async () => {
      // 20 hours: a daily tick that comes a little early still reaches yesterday's borrowers (as npm run remind).
      const result = await remindOverdueBorrowers({ gapHours: 20 });
      log().info({ event: "job.done", queue: REMINDERS, jobId: job.id, sent: result.sent.length, failed: result.failed.length }, "job.done");
      if (result.failed.length) throw new Error(`${result.failed.length} reminder(s) could not be sent`);
      return { sent: result.sent.length };
    }),
  );
  await boss.schedule(REMINDERS, REMINDERS_CRON, {}, { tz: await workshopTimeZone() });
}
