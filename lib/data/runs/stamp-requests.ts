import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import { runStages, runStageStamps, stampRequestItems, stampRequests, stamps } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import type { StampRequestDto } from "@/lib/contracts/plans";
import { AppError } from "@/lib/errors";
import type { StageStampRequestInput } from "@/lib/validation/runs";
import { createStampRequest } from "../requests";
import { workshopToday } from "../settings";
import { findRun } from "./shared";

// One click on a waxing stage: ask the keepers for the stamps it needs, for its planned days (from today when they
// lie in the past or are not planned), through the ordinary stamp request (its mail, queue and check-out on the
// first day). Stamps an open or accepted request of this stage already asks for are left out.

export async function requestStageStamps(actor: Actor, runId: string, stageId: string, input: StageStampRequestInput): Promise<StampRequestDto> {
  assertCan(actor, "stamps:request");
  const run = await findRun(db, runId);
  if (run.state === "complete" || run.state === "halted") throw new AppError("runClosed");
  const [stage] = await db.select().from(runStages).where(and(eq(runStages.id, stageId), eq(runStages.runId, runId))).limit(1);
  if (!stage) throw new AppError("notFound");
  if (stage.kind !== "wax") throw new AppError("unprocessable", {}, { stageId: ["runs.onlyWaxing"] });
  const needed = await db.select({ code: stamps.code, id: stamps.id }).from(runStageStamps).innerJoin(stamps, eq(stamps.id, runStageStamps.stampId)).where(eq(runStageStamps.stageId, stageId));
  if (!needed.length) throw new AppError("stageHasNoStamps");
  const asked = new Set(
    (
      await db
        .select({ stampId: stampRequestItems.stampId })
        .from(stampRequestItems)
        .innerJoin(stampRequests, eq(stampRequests.id, stampRequestItems.requestId))
        .where(and(eq(stampRequests.runStageId, stageId), inArray(stampRequests.state, ["open", "accepted"])))
    ).map((r) => r.stampId),
  );
  const codes = needed.filter((s) => !asked.has(s.id)).map((s) => s.code);
  if (!codes.length) throw new AppError("stageStampsRequested");
  const today = await workshopToday();
  const fromOn = stage.plannedStartOn && stage.plannedStartOn > today ? stage.plannedStartOn : today;
  const untilOn = stage.plannedEndOn && stage.plannedEndOn > fromOn ? stage.plannedEndOn : fromOn;
  return createStampRequest(
    actor,
    { planId: stage.planId, stampCodes: codes, forWhom: run.name, workstation: input.workstation, fromOn, untilOn, note: input.note },
    { runStageId: stageId },
  );
}
