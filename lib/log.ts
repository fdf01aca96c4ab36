import "server-only";
import pino, { type Logger } from "pino";

// The app's structured log: one JSON line per event on standard output (or LOG_FILE), for sign-ins, failed
// sign-ins, permission denials, destructive actions and job failures, each with who and when. Secrets never reach
// it: callers pass ids, e-mails and names only, and the redaction below blanks any field that still carries one.

export type AuditEvent =
  | "signIn.succeeded"
  | "signIn.failed"
  | "signIn.limited"
  | "permission.denied"
  | "record.deleted"
  | "job.failed";

const redact = {
  paths: ["password", "token", "secret", "authorization", "cookie", "*.password", "*.token", "*.secret", "*.authorization", "*.cookie", "passwordHash", "*.passwordHash"],
  censor: "[hidden]",
};

let logger: Logger | undefined;

function make(): Logger {
  const level = process.env.LOG_LEVEL || "info";
  const file = process.env.LOG_FILE;
  const options = { level, redact, base: { service: "capgrid" }, timestamp: pino.stdTimeFunctions.isoTime };
  // Synchronous writes: a line is on disk before the answer leaves, so a crash loses no acknowledged event.
  return pino(options, file ? pino.destination({ dest: file, sync: true, mkdir: true }) : pino.destination({ dest: 1, sync: true }));
}

export function log(): Logger {
  logger ??= make();
  return logger;
}

/** Who did it: an actor's id, role and name (never a token or a session id). */
export interface Who {
  id?: string | null;
  role?: string | null;
  name?: string | null;
}

/** One audit event with who did it and what it was about. */
export function audit(event: AuditEvent, who: Who | null, details: Record<string, unknown> = {}) {
  const line = { event, who: who ? { id: who.id ?? null, role: who.role ?? null, name: who.name ?? null } : null, ...details };
  if (event === "permission.denied" || event === "signIn.failed" || event === "signIn.limited" || event === "job.failed") log().warn(line, event);
  else log().info(line, event);
}
