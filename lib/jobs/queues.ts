import type PgBoss from "pg-boss";

// The job queues on PostgreSQL (pg-boss, schema "pgboss"): long or retryable work that leaves the request path.
// Each queue retries with a growing delay; a job is fetched by one worker only (SKIP LOCKED), so two app servers
// never run it twice, and a schedule sends one job per tick across all servers.

export const JOB_SCHEMA = "pgboss";

/** Overdue reminders: once a day (and whenever a keeper or `npm run remind` asks), the same as `npm run remind`. */
export const REMINDERS = "reminders";

export const queues: PgBoss.Queue[] = [{ name: REMINDERS, retryLimit: 3, retryDelay: 30, retryBackoff: true, expireInSeconds: 15 * 60 }];

/** 06:00 in the workshop's zone, every day. */
export const REMINDERS_CRON = "0 6 * * *";
