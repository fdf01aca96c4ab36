import "server-only";
import { eq, inArray, sql } from "drizzle-orm";
import type { Database, Transaction } from "@/db";
import { stamps } from "@/db/schema";
import type { Actor } from "@/lib/authz";
import { recordEvent } from "./events";

// The one writer of stamps' impression counts. Returns, wax uses and (later) a production run's stages add the
// impressions they made here; nothing else changes the count (the stamp form shows it read-only, a PATCH cannot
// set it). The count is wear, not an edit: it never bumps the stamp's version, so a keeper editing the record
// meanwhile gets no false conflict.

/** Where impressions came from; recorded in the stamp's history. */
export type ImpressionSource = { kind: "return" } | { kind: "waxUse"; id: string; withdrawn?: boolean } | { kind: "runStage"; id: string };

export interface ImpressionsToAdd {
  stampId: string;
  /** Impressions the stamp itself made (negative takes back a withdrawn record's). */
  impressions: number;
  /**
   * Impressions of the back face of the cloth. A stamp of a pair with a mirror twin leaves those to the twin,
   * which stamps the back; any other stamp (one that serves both faces) counts them itself.
   */
  backFace?: number;
}

export interface ImpressionsAdded {
  stampId: string;
  code: string;
  impressions: number;
}

/**
 * Adds impressions to stamps in the caller's transaction: `impressions` to the stamp, `backFace` to its mirror
 * twin when it is one of a pair (else to itself). One UPDATE per stamp adding to the stored count (never below 0),
 * so concurrent writers never lose each other's impressions; version and updated-at stay as they are. With an
 * actor, each stamp counted gets an "impressions_added" history entry naming the source (a return records its
 * own "returned" entry instead). Answers what each stamp got.
 */
export async function addImpressions(
  tx: Transaction | Database,
  additions: readonly ImpressionsToAdd[],
  source: ImpressionSource,
  actor?: Pick<Actor, "id" | "name">,
): Promise<ImpressionsAdded[]> {
  const ids = [...new Set(additions.map((a) => a.stampId))];
  if (ids.length === 0) return [];
  const rows = await tx.select({ id: stamps.id, face: stamps.face, twinId: stamps.twinId }).from(stamps).where(inArray(stamps.id, ids));
  const byId = new Map(rows.map((r) => [r.id, r]));
  const totals = new Map<string, number>();
  const add = (id: string, n: number) => n && totals.set(id, (totals.get(id) ?? 0) + n);
  for (const a of additions) {
    const stamp = byId.get(a.stampId);
    if (!stamp) continue;
    add(stamp.id, a.impressions);
    if (a.backFace) add(stamp.face === "pair" && stamp.twinId ? stamp.twinId : stamp.id, a.backFace);
  }
  const added: ImpressionsAdded[] = [];
  for (const [stampId, impressions] of totals) {
    if (!Number.isInteger(impressions)) throw new Error(`impressions must be whole numbers, got ${impressions}`);
    const [row] = await tx
      .update(stamps)
      .set({ impressionsCount: sql`GREATEST(0, ${stamps.impressionsCount} + ${impressions})` })
      .where(eq(stamps.id, stampId))
      .returning({ code: stamps.code });
    if (!row) continue;
    added.push({ stampId, code: row.code, impressions });
    if (actor && source.kind !== "return") {
      await recordEvent(tx, stampId, actor, {
        kind: "impressions_added",
        to: String(impressions),
        details: { impressions, source: source.kind, sourceId: source.id, ...(source.kind === "waxUse" && source.withdrawn ? { withdrawn: true } : {}) },
      });
    }
  }
  return added;
}
