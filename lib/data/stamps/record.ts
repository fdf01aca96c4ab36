import "server-only";
import { and, desc, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { checkouts, damageReports, locations, stampEvents, stamps, users } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { workshopToday } from "../settings";
import type { StampDto, StampEventDto } from "@/lib/contracts/stamps";
import { findStamp, toCheckoutDto, toLocationRef } from "./shared";

// One stamp: its record page and its history.

export async function getStamp(actor: Actor, code: string): Promise<StampDto> {
  assertCan(actor, "data:read");
  const stamp = await findStamp(db, code);
  const today = await workshopToday();
  const [location, twin, checkoutRow, damage] = await Promise.all([
    stamp.locationId ? db.select().from(locations).where(eq(locations.id, stamp.locationId)).then((r) => r[0] ?? null) : null,
    stamp.twinId ? db.select({ code: stamps.code, name: stamps.name, mirrored: stamps.mirrored }).from(stamps).where(eq(stamps.id, stamp.twinId)).then((r) => r[0] ?? null) : null,
    db
      .select({ checkout: checkouts, byName: users.name })
      .from(checkouts)
      .leftJoin(users, eq(users.id, checkouts.checkedOutBy))
      .where(and(eq(checkouts.stampId, stamp.id), isNull(checkouts.returnedAt)))
      .limit(1)
      .then((r) => r[0] ?? null),
    db
      .select({ report: damageReports, byName: users.name })
      .from(damageReports)
      .leftJoin(users, eq(users.id, damageReports.reportedBy))
      .where(and(eq(damageReports.stampId, stamp.id), isNull(damageReports.resolvedAt)))
      .orderBy(desc(damageReports.reportedAt)),
  ]);
  const c = checkoutRow?.checkout;
  return {
    id: stamp.id,
    code: stamp.code,
    name: stamp.name,
    motifId: stamp.motifId,
    widthMm: stamp.widthMm,
    heightMm: stamp.heightMm,
    stripDepthMm: stamp.stripDepthMm,
    weightG: stamp.weightG,
    face: stamp.face,
    mirrored: stamp.mirrored,
    twin,
    maker: stamp.maker,
    madeOn: stamp.madeOn,
    condition: stamp.condition,
    location: toLocationRef(location),
    coverageRatio: stamp.coverageRatio,
    outlinePath: stamp.outlinePath,
    impressionsCount: stamp.impressionsCount,
    notes: stamp.notes,
    tags: stamp.tags,
    version: stamp.version,
    createdAt: stamp.createdAt.toISOString(),
    updatedAt: stamp.updatedAt.toISOString(),
    checkout: c ? toCheckoutDto(c, checkoutRow.byName, today) : null,
    openDamage: damage.map(({ report, byName }) => ({
      id: report.id,
      kind: report.kind,
      note: report.note,
      reportedAt: report.reportedAt.toISOString(),
      reportedByName: byName,
    })),
  };
}

export async function stampHistory(actor: Actor, code: string): Promise<StampEventDto[]> {
  assertCan(actor, "data:read");
  const stamp = await findStamp(db, code);
  const rows = await db.select().from(stampEvents).where(eq(stampEvents.stampId, stamp.id)).orderBy(desc(stampEvents.at), desc(stampEvents.id)).limit(500);
  return rows.map((e) => ({
    id: e.id,
    kind: e.kind,
    at: e.at.toISOString(),
    actorName: e.actorName,
    from: e.fromValue,
    to: e.toValue,
    note: e.note,
    details: e.details ?? null,
  }));
}
