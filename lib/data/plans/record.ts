import "server-only";
import { and, asc, desc, eq, isNull } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { db } from "@/db";
import { checkouts, locations, planEvents, planStamps, stamps, type Plan } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import type { PlanDto, PlanEventDto, PlanStampDto } from "@/lib/contracts/plans";
import type { LayoutPicture } from "@/lib/layout";
import { engineStampOf, staleReasons, type PlanSummary, type StampGeometryRecord } from "@/lib/plans";
import type { BorderRequest } from "@/lib/validation/layout";
import type { PlanLayout } from "@/lib/validation/plans";
import { toLocationRef } from "../stamps/shared";
import { currentRecord, pictureOfPlan } from "./compute";
import { findPlan } from "./shared";
import { stampPictures } from "./stamps";

// One plan: its inputs (with the library codes as they are now), its summary, its stamps and whether the summary is
// stale; and its history.

const twins = alias(stamps, "twins");

/** The library stamps of a plan, by role, as they are now. */
async function planStampRows(planId: string) {
  return db
    .select({
      role: planStamps.role,
      stamp: stamps,
      location: locations,
      checkoutId: checkouts.id,
      twinCode: twins.code,
      twinName: twins.name,
    })
    .from(planStamps)
    .innerJoin(stamps, eq(stamps.id, planStamps.stampId))
    .leftJoin(locations, eq(locations.id, stamps.locationId))
    .leftJoin(checkouts, and(eq(checkouts.stampId, stamps.id), isNull(checkouts.returnedAt)))
    .leftJoin(twins, eq(twins.id, stamps.twinId))
    .where(eq(planStamps.planId, planId))
    .orderBy(asc(planStamps.role));
}

/**
 * A plan's layout and borders with each library stamp named by its code now (a stamp's code may have been changed
 * since the plan was saved; the plan keeps the stamp itself through plan_stamps).
 */
export function withCurrentCodes(plan: Pick<Plan, "layout" | "borders">, codes: ReadonlyMap<string, string>): { layout: PlanLayout; borders: BorderRequest[] } {
  const layout = structuredClone(plan.layout) as PlanLayout;
  const borders = structuredClone(plan.borders) as BorderRequest[];
  if ("code" in layout.stamp && codes.has("field")) layout.stamp = { code: codes.get("field")! };
  borders.forEach((b, k) => {
    if ("code" in b.stamp && codes.has(`border:${k}`)) b.stamp = { code: codes.get(`border:${k}`)! };
  });
  return { layout, borders };
}

/** The plan as its DTO, with its stamps as they are now and whether its summary is stale. */
export async function planDto(plan: Plan): Promise<PlanDto> {
  const rows = await planStampRows(plan.id);
  const pictures = await stampPictures(rows.map((r) => r.stamp));
  const { layout, borders } = withCurrentCodes(plan, new Map(rows.map((r) => [r.role, r.stamp.code])));
  const current = new Map<string, StampGeometryRecord>(rows.map((r) => [r.role, currentRecord(r.role, r.stamp.code, engineStampOf(r.stamp))]));
  const reasons = staleReasons(plan.stampGeometry as unknown as StampGeometryRecord[], current);
  const stampDtos: PlanStampDto[] = rows.map((r) => ({
    role: r.role,
    code: r.stamp.code,
    name: r.stamp.name,
    widthMm: r.stamp.widthMm,
    heightMm: r.stamp.heightMm,
    condition: r.stamp.condition,
    location: toLocationRef(r.location),
    out: r.checkoutId !== null,
    twin: r.twinCode ? { code: r.twinCode, name: r.twinName! } : null,
    picture: pictures.get(r.stamp.id) ?? null,
  }));
  return {
    id: plan.id,
    name: plan.name,
    notes: plan.notes,
    motifId: plan.motifId,
    layout,
    ...(borders.length ? { borders } : {}),
    summary: plan.summary as unknown as PlanSummary,
    stamps: stampDtos.sort((a, b) => (a.role === "field" ? -1 : b.role === "field" ? 1 : a.role.localeCompare(b.role))),
    version: plan.version,
    stale: reasons.length > 0,
    ...(reasons.length ? { staleReasons: reasons } : {}),
    computedAt: plan.computedAt.toISOString(),
    createdAt: plan.createdAt.toISOString(),
    createdByName: plan.createdByName,
    updatedAt: plan.updatedAt.toISOString(),
    updatedByName: plan.updatedByName,
  };
}

/** One plan for anyone who may read (the wax room reads its summary). 404 when there is none. */
export async function getPlan(actor: Actor, id: string): Promise<PlanDto> {
  assertCan(actor, "data:read");
  return planDto(await findPlan(db, id));
}

/** Several plans in the order asked (the compare page); unknown ids are left out. */
export async function getPlans(actor: Actor, ids: string[]): Promise<PlanDto[]> {
  assertCan(actor, "data:read");
  const found: PlanDto[] = [];
  for (const id of ids) {
    try {
      found.push(await planDto(await findPlan(db, id)));
    } catch (error) {
      // an unknown or deleted plan is left out; the page says how many it could not find
      if (!(error instanceof AppError && error.code === "notFound")) throw error;
    }
  }
  return found;
}

export async function planHistory(actor: Actor, id: string): Promise<PlanEventDto[]> {
  assertCan(actor, "data:read");
  await findPlan(db, id);
  const rows = await db.select().from(planEvents).where(eq(planEvents.planId, id)).orderBy(desc(planEvents.at), desc(planEvents.version)).limit(200);
  return rows.map((e) => ({ id: e.id, kind: e.kind, at: e.at.toISOString(), actorName: e.actorName, version: e.version, details: e.details ?? null }));
}

/** The picture of the first `lengthMm` of a plan's first piece, as its inputs lay out with the stamps as they are now. */
export async function getPlanPicture(actor: Actor, plan: PlanDto, lengthMm = 1000): Promise<LayoutPicture> {
  assertCan(actor, "data:read");
  return pictureOfPlan(plan.layout, plan.borders ?? [], { startMm: 0, lengthMm });
}
