import "server-only";
import type { Actor } from "@/lib/authz";

// The wax room's one link to saved plans. Estimates and wax uses store a plan's id (wax_estimates.plan_id,
// wax_uses.plan_id: uuid columns without a foreign key until the plans table exists) and read what they need of
// the plan through planForWax alone, so wiring the plans area in is this function's body and nothing else.

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

/**
 * The saved plan with this id as the wax room reads it, or null when there is none the actor may read.
 * Saved plans do not exist yet, so every id is unknown: callers answer 422 "wax.planUnknown" on planId.
 * When they land: `const plan = await getPlan(actor, planId)` (lib/data/plans), catch its notFound → null, and map
 * `plan.summary.waxedAreaPerMetreM2`, `summary.runLengthMm`, `summary.impressionsTotal`, `summary.sides`, the
 * cloth width and the stamp's id into a WaxPlan.
 */
export async function planForWax(actor: Actor, planId: string): Promise<WaxPlan | null> {
  void actor;
  void planId;
  return null;
}

/** Saved plans to offer in the estimate and wax use forms; none until saved plans exist. */
export async function planChoices(actor: Actor): Promise<{ id: string; name: string }[]> {
  void actor;
  return [];
}
