import "server-only";
import { LayoutInputError, layoutOf, layoutPicture, type LayoutPicture, type StampSize } from "@/lib/layout";
import { geometryRecord, planSummary, stampCodesOf, type PlanSummary, type StampGeometryRecord } from "@/lib/plans";
import { fingerprintOf, outlineDigest } from "@/lib/plans/digest";
import type { BorderRequest } from "@/lib/validation/layout";
import type { PlanLayout } from "@/lib/validation/plans";
import { resolveLayout } from "../layout";

// A plan's numbers: its saved inputs resolved against the library, laid out by the engine, and the geometry of every
// library stamp they came from (so reopening can tell when the summary went stale).


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
  let resolved: Awaited<ReturnType<typeof resolveLayout>>;
  let result: ReturnType<typeof layoutOf>;
  try {
    resolved = await resolveLayout(request);
    result = layoutOf({ ...resolved.spec, impressions: false, preview: false });
  } catch (error) {
    throw inPlanFields(error);
  }
  const { library } = resolved;
  const roles = stampCodesOf(request);
  const geometry = roles.map((r) => geometryRecord(r.role, r.code, library.get(r.code)!.geometry, outlineDigest));
  return {
    summary: planSummary(result),
    geometry,
    fingerprint: fingerprintOf(geometry),
    stampIds: roles.map((r) => ({ role: r.role, stampId: library.get(r.code)!.id })),
  };
}

/** The engine names the layout's own fields ("cloth.widthMm"); in a plan they sit under `layout`, borders beside it. */
function inPlanFields(error: unknown): unknown {
  if (!(error instanceof LayoutInputError)) return error;
  const planField = (field: string) => (field.startsWith("borders") || field === "_form" ? field : `layout.${field}`);
  return new LayoutInputError(error.issues.map((i) => ({ ...i, field: planField(i.field) })));
}

/** The geometry record of a library stamp as it is now. */
export const currentRecord = (role: string, code: string, stamp: StampSize) => geometryRecord(role, code, stamp, outlineDigest);

/** The picture of a window of a plan's first piece (the compare page and the stamping sheet draw it on the server). */
export async function pictureOfPlan(layout: PlanLayout, borders: BorderRequest[], window: { startMm: number; lengthMm: number }): Promise<LayoutPicture> {
  const { spec } = await resolveLayout({ ...layout, borders } as Parameters<typeof resolveLayout>[0]);
  return layoutPicture(spec, window);
}
