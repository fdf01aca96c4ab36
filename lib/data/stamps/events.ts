import "server-only";
import { stampEvents, type StampEventKind } from "@/db/schema";
import type { Database, Transaction } from "@/db";
import type { Actor } from "@/lib/authz";

/** The PostgreSQL error under a driver or ORM wrapper: its SQLSTATE and constraint name. */
export function pgErrorOf(error: unknown): { code?: string; constraint?: string } | null {
  for (let e = error as { code?: unknown; constraint_name?: unknown; cause?: unknown } | undefined, depth = 0; e && depth < 5; e = e.cause as typeof e, depth++) {
    if (typeof e.code === "string" && /^[0-9A-Z]{5}$/.test(e.code)) return { code: e.code, constraint: typeof e.constraint_name === "string" ? e.constraint_name : undefined };
  }
  return null;
}

export const isUniqueViolation = (error: unknown, constraint: string) => {
  const pg = pgErrorOf(error);
  return pg?.code === "23505" && pg.constraint === constraint;
};

export const isForeignKeyViolation = (error: unknown) => pgErrorOf(error)?.code === "23503";

export interface EventInput {
  kind: StampEventKind;
  from?: string | null;
  to?: string | null;
  note?: string | null;
  details?: Record<string, unknown> | null;
}

/** Adds one entry to a stamp's history, in the caller's transaction. */
export async function recordEvent(tx: Transaction | Database, stampId: string, actor: Pick<Actor, "id" | "name">, event: EventInput) {
  await tx.insert(stampEvents).values({
    stampId,
    kind: event.kind,
    actorId: actor.id,
    actorName: actor.name,
    fromValue: event.from ?? null,
    toValue: event.to ?? null,
    note: event.note ?? null,
    details: event.details ?? null,
  });
}

