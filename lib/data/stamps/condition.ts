import "server-only";
import { and, eq, isNull } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { damageReports, stamps, type Stamp } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { canChangeCondition, isRepair, needsToBeIn, type Condition } from "@/lib/stamps/condition";
import type { ConditionChangeInput, DamageReportInput } from "@/lib/validation/stamps";
import { recordEvent } from "./events";
import { notifyKeepersOfDamage } from "./mail";
import { bump, findStamp, openCheckoutOf } from "./shared";

// A stamp's condition path (sound → worn → needs repair → in repair → sound, or retired) and damage reports.

/** The message names both conditions in the reader's language, never their stored codes. */
const conditionChangeRefused = (from: Condition, to: Condition) =>
  new AppError("conditionChange", { from: { key: `stamps.conditions.${from}` }, to: { key: `stamps.conditions.${to}` } }, { condition: ["errors.conditionChange"] });

export async function checkConditionChange(tx: Transaction, stamp: Stamp, to: Condition) {
  const from = stamp.condition;
  if (!canChangeCondition(from, to)) throw conditionChangeRefused(from, to);
  if (needsToBeIn(to) && (await openCheckoutOf(tx, stamp.id))) throw new AppError("stampCheckedOut");
  return { from, to };
}

export async function recordConditionChange(tx: Transaction, actor: Actor, stampId: string, change: { from: Condition; to: Condition }, note: string | null) {
  await recordEvent(tx, stampId, actor, { kind: isRepair(change.from, change.to) ? "repaired" : "condition_changed", from: change.from, to: change.to, note });
  // Back in use (or gone for good): the damage reported so far is dealt with.
  if (change.to === "sound" || change.to === "worn" || change.to === "retired") {
    await tx.update(damageReports).set({ resolvedAt: new Date() }).where(and(eq(damageReports.stampId, stampId), isNull(damageReports.resolvedAt)));
  }
}

/** A keeper's step in the repair path: needs repair → in repair → sound, or retired. */
export async function changeCondition(actor: Actor, code: string, input: ConditionChangeInput) {
  assertCan(actor, "stamps:write");
  return db.transaction(async (tx) => {
    const stamp = await findStamp(tx, code, true);
    if (stamp.condition === input.condition) throw conditionChangeRefused(stamp.condition, input.condition);
    const change = await checkConditionChange(tx, stamp, input.condition);
    const [updated] = await tx.update(stamps).set({ condition: input.condition, ...bump }).where(eq(stamps.id, stamp.id)).returning();
    await recordConditionChange(tx, actor, stamp.id, change, input.note ?? null);
    return { code: updated.code, condition: updated.condition, version: updated.version };
  });
}

/** Anyone may report damage; the keepers hear of it by e-mail. */
export async function reportDamage(actor: Actor, code: string, input: DamageReportInput) {
  assertCan(actor, "stamps:request");
  const { stamp, report } = await db.transaction(async (tx) => {
    const stamp = await findStamp(tx, code);
    const [report] = await tx.insert(damageReports).values({ stampId: stamp.id, kind: input.kind, note: input.note ?? null, reportedBy: actor.id }).returning();
    await recordEvent(tx, stamp.id, actor, { kind: "damage_reported", to: input.kind, note: input.note ?? null });
    return { stamp, report };
  });
  await notifyKeepersOfDamage({ code: stamp.code, name: stamp.name, kind: input.kind, note: input.note ?? null, reporter: actor.name, at: report.reportedAt });
  return { id: report.id, kind: report.kind, reportedAt: report.reportedAt.toISOString() };
}
