import "server-only";
import { and, eq, inArray, isNull } from "drizzle-orm";
import { checkouts, stampRequestItems, stampRequests, stamps } from "@/db/schema";
import type { RunStageStampBusyDto, RunStageStampRequestDto } from "@/lib/contracts/runs";
import { daysOverlap } from "@/lib/runs";
import type { Db } from "./shared";

// Whether the stamps a waxing stage needs are free on its planned days: not in repair or retired, not out past the
// stage's first day, not asked for by someone else for days that meet the stage's. Without planned days the
// question is "free now". The requests a stage sent itself (one click on the run page) are listed with the stage.

const UNFIT = new Set(["needs_repair", "in_repair", "retired"]);

export interface StageDays {
  id: string;
  plannedStartOn: string | null;
  plannedEndOn: string | null;
  stampIds: string[];
}

export interface StampOnDays {
  freeOnDays: boolean;
  busy: RunStageStampBusyDto[];
}

export async function stampAvailability(tx: Db, stages: readonly StageDays[], today: string): Promise<Map<string, Map<string, StampOnDays>>> {
  const stampIds = [...new Set(stages.flatMap((s) => s.stampIds))];
  const answer = new Map<string, Map<string, StampOnDays>>();
  if (!stampIds.length) return answer;
  const [conditions, open, asked] = await Promise.all([
    tx.select({ id: stamps.id, condition: stamps.condition }).from(stamps).where(inArray(stamps.id, stampIds)),
    tx
      .select({ stampId: checkouts.stampId, dueOn: checkouts.dueOn, who: checkouts.borrowerName })
      .from(checkouts)
      .where(and(inArray(checkouts.stampId, stampIds), isNull(checkouts.returnedAt))),
    tx
      .select({ stampId: stampRequestItems.stampId, fromOn: stampRequests.fromOn, untilOn: stampRequests.untilOn, who: stampRequests.forWhom, runStageId: stampRequests.runStageId })
      .from(stampRequestItems)
      .innerJoin(stampRequests, eq(stampRequests.id, stampRequestItems.requestId))
      .where(and(inArray(stampRequestItems.stampId, stampIds), inArray(stampRequests.state, ["open", "accepted"]))),
  ]);
  const condition = new Map(conditions.map((c) => [c.id, c.condition]));
  for (const stage of stages) {
    const from = stage.plannedStartOn ?? stage.plannedEndOn ?? today;
    const until = stage.plannedEndOn ?? from;
    const perStamp = new Map<string, StampOnDays>();
    for (const stampId of stage.stampIds) {
      const busy: RunStageStampBusyDto[] = [];
      const c = condition.get(stampId);
      if (c && UNFIT.has(c)) busy.push({ reason: "condition", condition: c, fromOn: null, untilOn: null, who: null });
      for (const o of open.filter((o) => o.stampId === stampId)) {
        // Out now: it blocks the stage unless it is due back before the stage's first day.
        if (o.dueOn >= from) busy.push({ reason: "out", condition: null, fromOn: null, untilOn: o.dueOn, who: o.who });
      }
      for (const r of asked.filter((r) => r.stampId === stampId && r.runStageId !== stage.id)) {
        if (daysOverlap(from, until, r.fromOn, r.untilOn)) busy.push({ reason: "requested", condition: null, fromOn: r.fromOn, untilOn: r.untilOn, who: r.who });
      }
      perStamp.set(stampId, { freeOnDays: busy.length === 0, busy });
    }
    answer.set(stage.id, perStamp);
  }
  return answer;
}

/** The stamp requests each stage sent, newest first. */
export async function stageStampRequests(tx: Db, stageIds: readonly string[]): Promise<Map<string, RunStageStampRequestDto[]>> {
  const answer = new Map<string, RunStageStampRequestDto[]>();
  if (!stageIds.length) return answer;
  const rows = await tx
    .select({ id: stampRequests.id, stageId: stampRequests.runStageId, state: stampRequests.state, fromOn: stampRequests.fromOn, untilOn: stampRequests.untilOn, createdAt: stampRequests.createdAt, code: stamps.code })
    .from(stampRequests)
    .innerJoin(stampRequestItems, eq(stampRequestItems.requestId, stampRequests.id))
    .innerJoin(stamps, eq(stamps.id, stampRequestItems.stampId))
    .where(inArray(stampRequests.runStageId, [...stageIds]));
  const byId = new Map<string, RunStageStampRequestDto & { stageId: string; at: number }>();
  for (const r of rows) {
    const entry = byId.get(r.id) ?? { id: r.id, stageId: r.stageId!, state: r.state, fromOn: r.fromOn, untilOn: r.untilOn, codes: [], at: r.createdAt.getTime() };
    entry.codes.push(r.code);
    byId.set(r.id, entry);
  }
  for (const r of [...byId.values()].sort((a, b) => b.at - a.at)) {
    answer.set(r.stageId, [...(answer.get(r.stageId) ?? []), { id: r.id, state: r.state, fromOn: r.fromOn, untilOn: r.untilOn, codes: [...r.codes].sort() }]);
  }
  return answer;
}
