import { availableParallelism } from "node:os";
import pLimit from "p-limit";
import { ScanRejected } from "./errors";

export interface ScanLimiter {
  /** Runs `task` when a slot is free; refuses at once with ScanRejected("busy") when the queue is full. */
  run<T>(task: () => Promise<T>): Promise<T>;
  readonly active: number;
  readonly queued: number;
}

/**
 * Bounded concurrency for scan processing (p-limit underneath). Decoding runs on libuv's thread pool, which
 * also serves file, DNS and crypto work for every request; capping the number of scans in flight keeps
 * those threads, and memory, for everyone else. Beyond `maxQueued` waiting scans new ones are refused.
 */
export function createScanLimiter(options: { concurrency: number; maxQueued: number }): ScanLimiter {
  const limit = pLimit(Math.max(1, options.concurrency));
  return {
    run<T>(task: () => Promise<T>) {
      if (limit.activeCount >= limit.concurrency && limit.pendingCount >= options.maxQueued) {
        return Promise.reject(new ScanRejected("busy", { maxQueued: options.maxQueued }));
      }
      return limit(task);
    },
    get active() {
      return limit.activeCount;
    },
    get queued() {
      return limit.pendingCount;
    },
  };
}

/** One limiter per app server: half the cores (at least one) process scans, up to 8 more wait. */
export const scanLimiter: ScanLimiter = createScanLimiter({
  concurrency: Math.max(1, Math.floor(availableParallelism() / 2)),
  maxQueued: 8,
});
