import "server-only";
import { asc, eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import { planStamps, plans, stamps } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { engineStampOf, staleReasons, type StaleReason, type StampGeometryRecord } from "@/lib/plans";
import { currentRecord } from "./compute";

// Every saved plan whose summary is stale (a stamp's size, outline or coverage changed since it was computed), by
// the same check the plan's own page makes (lib/plans staleReasons), for the planners' overview.

export interface StalePlan {
  id: string;
  name: string;
  reasons: StaleReason[];
  computedAt: Date;
}

export async function listStalePlans(actor: Actor): Promise<StalePlan[]> {
  assertCan(actor, "data:read");
  const rows = await db.select({ id: plans.id, name: plans.name, stampGeometry: plans.stampGeometry, computedAt: plans.computedAt }).from(plans).orderBy(asc(plans.name), asc(plans.id));
  const withStamps = rows.filter((p) => Array.isArray(p.stampGeometry) && p.stampGeometry.length > 0);
  if (!withStamps.length) return [];
  const used = await db
    .select({
      planId: planStamps.planId,
      role: planStamps.role,
      code: stamps.code,
      widthMm: stamps.widthMm,
      heightMm: stamps.heightMm,
      outlinePath: stamps.outlinePath,
      coverageRatio: stamps.coverageRatio,
    })
    .from(planStamps)
    .innerJoin(stamps, eq(stamps.id, planStamps.stampId))
    .where(inArray(planStamps.planId, withStamps.map((p) => p.id)));
  const stale: StalePlan[] = [];
  for (const plan of withStamps) {
    const current = new Map<string, StampGeometryRecord>(used.filter((u) => u.planId === plan.id).map((u) => [u.role, currentRecord(u.role, u.code, engineStampOf(u))]));
    const reasons = staleReasons(plan.stampGeometry as unknown as StampGeometryRecord[], current);
    if (reasons.length) stale.push({ id: plan.id, name: plan.name, reasons, computedAt: plan.computedAt });
  }
  return stale;
}
