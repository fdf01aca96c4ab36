import "server-only";
import { and, eq } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { locations, planStamps, plans, stamps, type Stamp, runs, runStages, runStageStamps } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { type Condition } from "@/lib/stamps/condition";
import type { CreateStampInput, UpdateStampInput } from "@/lib/validation/stamps";
import { deleteObjects } from "@/lib/s3";
import { scanObjectKeys } from "../scans";
import { locationLabel } from "@/lib/stamps/format";
import { isForeignKeyViolation, isUniqueViolation, recordEvent } from "./events";
import { bump, findStamp, locationOrFail, openCheckoutOf } from "./shared";
import { checkConditionChange, recordConditionChange } from "./condition";
import { audit } from "@/lib/log";

// Adding, changing and deleting stamps, with their mirror twins; every change writes its history in the same transaction.

async function twinOrFail(tx: Transaction, code: string): Promise<Stamp> {
  const [twin] = await tx.select().from(stamps).where(eq(stamps.code, code)).limit(1).for("update");
  if (!twin) throw new AppError("unprocessable", {}, { twinCode: ["validation.twinUnknown"] });
  return twin;
}


/**
 * Makes `stamp` and `twin` each other's mirror twin (or unlinks `stamp` when twin is null).
 * Former partners on either side lose their link; every stamp touched gets a history entry.
 */
async function relinkTwin(tx: Transaction, actor: Actor, stamp: Pick<Stamp, "id" | "code" | "twinId">, twin: Stamp | null) {
  if (stamp.twinId && stamp.twinId !== twin?.id) {
    const [former] = await tx
      .update(stamps)
      .set({ twinId: null, ...bump })
      .where(and(eq(stamps.id, stamp.twinId), eq(stamps.twinId, stamp.id)))
      .returning({ id: stamps.id });
    if (former) await recordEvent(tx, former.id, actor, { kind: "twin_linked", from: stamp.code, to: null });
  }
  if (!twin || twin.twinId === stamp.id) return;
  if (twin.twinId) {
    const [former] = await tx
      .update(stamps)
      .set({ twinId: null, ...bump })
      .where(and(eq(stamps.id, twin.twinId), eq(stamps.twinId, twin.id)))
      .returning({ id: stamps.id });
    if (former) await recordEvent(tx, former.id, actor, { kind: "twin_linked", from: twin.code, to: null });
  }
  await tx.update(stamps).set({ twinId: stamp.id, face: "pair", ...bump }).where(eq(stamps.id, twin.id));
  await recordEvent(tx, twin.id, actor, { kind: "twin_linked", from: null, to: stamp.code });
}

function codeTaken(): never {
  throw new AppError("codeTaken", {}, { code: ["errors.codeTaken"] });
}

export async function createStamp(actor: Actor, input: CreateStampInput, tx?: Transaction): Promise<{ code: string; id: string }> {
  assertCan(actor, "stamps:write");
  const work = async (tx: Transaction) => {
    const location = input.locationId ? await locationOrFail(tx, input.locationId) : null;
    const twin = input.twinCode ? await twinOrFail(tx, input.twinCode) : null;
    const { twinCode: _twinCode, ...fields } = input;
    void _twinCode;
    let created: Stamp;
    try {
      [created] = await tx
        .insert(stamps)
        .values({ ...fields, twinId: twin?.id ?? null })
        .returning();
    } catch (error) {
      if (isUniqueViolation(error, "stamps_code_key")) codeTaken();
      throw error;
    }
    await recordEvent(tx, created.id, actor, { kind: "created", to: created.code, details: { location: locationLabel(location), condition: created.condition } });
    if (twin) {
      await relinkTwin(tx, actor, { id: created.id, code: created.code, twinId: null }, twin);
      await recordEvent(tx, created.id, actor, { kind: "twin_linked", from: null, to: twin.code });
    }
    return { code: created.code, id: created.id };
  };
  if (tx) return work(tx);
  // A unique violation inside the transaction ends it; the error surfaces as codeTaken above.
  return db.transaction(work);
}

/** Fields whose change an "edited" history entry lists, with their before and after. */
const trackedFields = [
  "code",
  "name",
  "widthMm",
  "heightMm",
  "stripDepthMm",
  "weightG",
  "face",
  "mirrored",
  "maker",
  "madeOn",
  "coverageRatio",
  "outlinePath",
  "notes",
  "tags",
  "motifId",
] as const;

const same = (a: unknown, b: unknown) => JSON.stringify(a ?? null) === JSON.stringify(b ?? null);

/**
 * Applies a change made from `patch.version`. Someone else's save in between → 409 versionConflict,
 * never a silent overwrite. Location, condition and twin changes get their own history entries.
 */
export async function updateStamp(actor: Actor, code: string, patch: UpdateStampInput, options: { ignoreVersion?: boolean; tx?: Transaction; moveDetails?: Record<string, unknown> } = {}): Promise<{ code: string; version: number }> {
  assertCan(actor, "stamps:write");
  const work = async (tx: Transaction) => {
    const current = await findStamp(tx, code, true);
    if (!options.ignoreVersion && current.version !== patch.version) throw new AppError("versionConflict");

    const changes: { field: string; from: unknown; to: unknown }[] = [];
    const set: Partial<typeof stamps.$inferInsert> = {};
    for (const field of trackedFields) {
      if (!(field in patch) || patch[field] === undefined) continue;
      const to = patch[field];
      if (same(current[field], to)) continue;
      changes.push({ field, from: current[field] ?? null, to: to ?? null });
      (set as Record<string, unknown>)[field] = to;
    }

    // Location
    let moved: { from: string | null; to: string | null } | null = null;
    if (patch.locationId !== undefined && patch.locationId !== current.locationId) {
      const [from, to] = await Promise.all([
        current.locationId ? tx.select().from(locations).where(eq(locations.id, current.locationId)).then((r) => r[0] ?? null) : null,
        patch.locationId ? locationOrFail(tx, patch.locationId) : null,
      ]);
      set.locationId = patch.locationId;
      moved = { from: locationLabel(from), to: locationLabel(to) };
    }

    // Condition
    let conditionChange: { from: Condition; to: Condition } | null = null;
    if (patch.condition !== undefined && patch.condition !== current.condition) {
      conditionChange = await checkConditionChange(tx, current, patch.condition);
      set.condition = patch.condition;
    }

    // Twin
    const face = patch.face ?? current.face;
    let twin: Stamp | null | undefined;
    if (patch.twinCode !== undefined) {
      const wanted = patch.twinCode;
      if (wanted && face !== "pair") throw new AppError("unprocessable", {}, { twinCode: ["validation.twinNeedsPair"] });
      if (wanted && wanted === (patch.code ?? current.code)) throw new AppError("unprocessable", {}, { twinCode: ["validation.twinSelf"] });
      twin = wanted ? await twinOrFail(tx, wanted) : null;
    } else if (face === "single" && current.twinId) {
      twin = null; // a single stamp has no twin
    }
    const twinChanged = twin !== undefined && (twin?.id ?? null) !== current.twinId;
    if (twinChanged) set.twinId = twin?.id ?? null;

    if (Object.keys(set).length === 0) return { code: current.code, version: current.version };

    let updated: Stamp | undefined;
    try {
      [updated] = await tx
        .update(stamps)
        .set({ ...set, ...bump })
        .where(eq(stamps.id, current.id))
        .returning();
    } catch (error) {
      if (isUniqueViolation(error, "stamps_code_key")) codeTaken();
      throw error;
    }

    if (changes.length) await recordEvent(tx, current.id, actor, { kind: "edited", details: { changes } });
    if (moved) await recordEvent(tx, current.id, actor, { kind: "moved", from: moved.from, to: moved.to, details: options.moveDetails ?? null });
    if (conditionChange) await recordConditionChange(tx, actor, current.id, conditionChange, null);
    if (twinChanged) {
      const formerTwin = current.twinId ? await tx.select({ code: stamps.code }).from(stamps).where(eq(stamps.id, current.twinId)).then((r) => r[0]?.code ?? null) : null;
      await relinkTwin(tx, actor, { id: current.id, code: updated!.code, twinId: current.twinId }, twin ?? null);
      await recordEvent(tx, current.id, actor, { kind: "twin_linked", from: formerTwin, to: twin?.code ?? null });
    }
    return { code: updated!.code, version: updated!.version };
  };
  return options.tx ? work(options.tx) : db.transaction(work);
}

/** Refuses (409 stampInPlans, naming them) to delete a stamp that cloth plans use; the foreign keys back this up. */
async function refuseIfInPlans(tx: Transaction, stampId: string) {
  const using = await tx.selectDistinct({ id: plans.id, name: plans.name }).from(planStamps).innerJoin(plans, eq(plans.id, planStamps.planId)).where(eq(planStamps.stampId, stampId)).orderBy(plans.name);
  if (using.length === 0) return;
  const names = using.slice(0, 5).map((p) => `“${p.name}”`);
  if (using.length > 5) names.push("…");
  throw new AppError("stampInPlans", { count: using.length, plans: names.join(", ") }, undefined, { plans: using });
}

/** Refuses (409 stampInRuns, naming them) to delete a stamp that production runs' waxing stages need. */
async function refuseIfInRuns(tx: Transaction, stampId: string) {
  const using = await tx
    .selectDistinct({ id: runs.id, name: runs.name })
    .from(runStageStamps)
    .innerJoin(runStages, eq(runStages.id, runStageStamps.stageId))
    .innerJoin(runs, eq(runs.id, runStages.runId))
    .where(eq(runStageStamps.stampId, stampId))
    .orderBy(runs.name);
  if (using.length === 0) return;
  const names = using.slice(0, 5).map((r) => `“${r.name}”`);
  if (using.length > 5) names.push("…");
  throw new AppError("stampInRuns", { count: using.length, names: names.join(", ") }, undefined, { runs: using });
}

export async function deleteStamp(actor: Actor, code: string, version?: number) {
  assertCan(actor, "stamps:write");
  const scanKeys = await db.transaction(async (tx) => {
    const stamp = await findStamp(tx, code, true);
    if (version !== undefined && version !== stamp.version) throw new AppError("versionConflict");
    if (await openCheckoutOf(tx, stamp.id)) throw new AppError("stampCheckedOut");
    await refuseIfInPlans(tx, stamp.id);
    await refuseIfInRuns(tx, stamp.id);
    const keys = await scanObjectKeys(stamp.id, tx);
    try {
      await tx.delete(stamps).where(eq(stamps.id, stamp.id));
    } catch (error) {
      // A plan saved in between: the foreign key refuses; say which plans.
      if (isForeignKeyViolation(error)) await refuseIfInPlans(db as unknown as Transaction, stamp.id);
      throw error;
    }
    return keys;
  });
  // The rows went with the stamp (cascade); the files go once the delete is committed.
  if (scanKeys.length) await deleteObjects(scanKeys);
  audit("record.deleted", actor, { kind: "stamp", code });
}
