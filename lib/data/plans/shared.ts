import "server-only";
import { eq } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { planEvents, plans, type Plan, type PlanEventKind } from "@/db/schema";
import type { Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";

export async function findPlan(tx: Transaction | typeof db, id: string, lock = false): Promise<Plan> {
  const query = tx.select().from(plans).where(eq(plans.id, id)).limit(1);
  const [plan] = lock ? await query.for("update") : await query;
  if (!plan) throw new AppError("notFound");
  return plan;
}

/** Adds one entry to a plan's history, in the caller's transaction. */
export async function recordPlanEvent(tx: Transaction, planId: string, actor: Pick<Actor, "id" | "name">, kind: PlanEventKind, version: number, details: Record<string, unknown> | null = null) {
  await tx.insert(planEvents).values({ planId, kind, actorId: actor.id, actorName: actor.name, version, details });
}
