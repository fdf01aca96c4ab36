import "server-only";
import { createHash } from "node:crypto";
import { layoutOf, layoutPicture, type LayoutPicture, type StampSize } from "@/lib/layout";
import { canonicalGeometry, geometryRecord, planSummary, stampCodesOf, type PlanSummary, type StampGeometryRecord } from "@/lib/plans";
import type { BorderRequest } from "@/lib/validation/layout";
import type { PlanLayout } from "@/lib/validation/plans";
import { resolveLayout } from "../layout";

// A plan's numbers: its saved inputs resolved against the library, laid out by the engine, and the geometry of every
// library stamp they came from (so reopening can tell when the summary went stale).

/** A short digest of an outline's path data. */
export const outlineDigest = (outline: string) => createHash("sha256").update(outline).digest("hex").slice(0, 16);

export const fingerprintOf = (records: readonly StampGeometryRecord[]) => createHash("sha256").update(canonicalGeometry(records)).digest("hex");

export interface ComputedPlan {
  summary: PlanSummary;
  geometry: StampGeometryRecord[];
  fingerprint: string;
  /** The library stamps used, by role ("field", "border:<k>"). */
  stampIds: { role: string; stampId: string }[];
}

/** Lays out a plan's layout and borders (library stamps by code); refusals are the engine's, at the input's fields. */
export async function computePlan(layout: PlanLayout, borders: BorderRequest[] = []): Promise<ComputedPlan> {
  const request = { ...layout, borders } as Parameters<typeof resolveLayout>[0];
  const { spec, library } = await resolveLayout(request);
  const result = layoutOf({ ...spec, impressions: false, preview: false });
  const roles = stampCodesOf(request);
  const geometry = roles.map((r) => geometryRecord(r.role, r.code, library.get(r.code)!.geometry, outlineDigest));
  return {
    summary: planSummary(result),
    geometry,
    fingerprint: fingerprintOf(geometry),
    stampIds: roles.map((r) => ({ role: r.role, stampId: library.get(r.code)!.id })),
  };
}

/** The geometry record of a library stamp as it is now. */
export const currentRecord = (role: string, code: string, stamp: StampSize) => geometryRecord(role, code, stamp, outlineDigest);

/** The picture of a window of a plan's first piece (the compare page and the stamping sheet draw it on the server). */
export async function pictureOfPlan(layout: PlanLayout, borders: BorderRequest[], window: { startMm: number; lengthMm: number }): Promise<LayoutPicture> {
  const { spec } = await resolveLayout({ ...layout, borders } as Parameters<typeof resolveLayout>[0]);
  return layoutPicture(spec, window);
}
