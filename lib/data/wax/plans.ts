import "server-only";
import { asc, eq, sql } from "drizzle-orm";
import { db } from "@/db";
import { plans } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { getPlan } from "../plans";

// The wax room's one link to saved plans. Estimates and wax uses store a plan's id (wax_estimates.plan_id,
// wax_uses.plan_id, foreign keys that refuse deleting a plan they point at) and read what they need of the plan
// through planForWax alone.

/** What the wax room needs of a saved plan. */
export interface WaxPlan {
  id: string;
  name: string;
  /** Waxed area per metre of cloth, m², the faces the plan waxes counted (the plan's summary). */
  waxedAreaPerMetreM2: number;
  /** The plan's own run length, mm. */
  runLengthMm: number;
  /** Impressions of the whole run, every face (one face × sides). */
  impressionsTotal: number;
  sides: 1 | 2;
  clothWidthMm: number;
  /** The stamp the plan lays (its pair twin stamps the back), when it names one from the library. */
  stampId: string | null;
}

/** The saved plan with this id as the wax room reads it, or null when there is none (callers answer 422 wax.planUnknown). */
export async function planForWax(actor: Actor, planId: string): Promise<WaxPlan | null> {
  let plan;
  try {
    plan = await getPlan(actor, planId);
  } catch (error) {
    if (error instanceof AppError && error.code === "notFound") return null;
    throw error;
  }
  const [row] = await db.select({ stampId: plans.stampId }).from(plans).where(eq(plans.id, planId)).limit(1);
  const s = plan.summary;
  return {
    id: plan.id,
    name: plan.name,
    waxedAreaPerMetreM2: s.waxedAreaPerMetreM2,
    runLengthMm: s.runLengthMm,
    impressionsTotal: s.impressionsTotal,
    sides: s.sides,
    clothWidthMm: plan.layout.cloth.widthMm,
    stampId: row?.stampId ?? null,
  };
}

/** Saved plans to offer in the estimate and wax use forms, by name. */
export async function planChoices(actor: Actor): Promise<{ id: string; name: string }[]> {
  assertCan(actor, "data:read");
  return db.select({ id: plans.id, name: plans.name }).from(plans).orderBy(asc(sql`lower(${plans.name})`), asc(plans.id)).limit(1000);
}
