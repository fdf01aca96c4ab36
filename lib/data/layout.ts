import "server-only";
import { inArray } from "drizzle-orm";
import { db } from "@/db";
import { stamps } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { initLayoutEngine, layoutOf, type LayoutResult, type LayoutSpec, type StampSize } from "@/lib/layout";
import { engineStampOf, resolveLayoutRequest, stampCodesOf, type LayoutRequestLike } from "@/lib/plans";
import type { LayoutRequest } from "@/lib/validation/layout";

// The first layouts after start-up should already get the fast polygon backend (Clipper2 in WebAssembly):
// loading it takes about 40 ms once, and never fails (clipper-lib stays if it cannot load).
void initLayoutEngine();

/** A library stamp as the engine takes it, with the record it came from. */
export interface LibraryStamp {
  id: string;
  code: string;
  geometry: StampSize;
}

/**
 * The library stamps a request names (field and borders), by upper-case code; unknown codes are simply absent.
 * Each footprint is its outline when it has one, else its measured coverage ratio (from a scan), else the whole footprint.
 */
export async function libraryStampsOf(request: LayoutRequestLike): Promise<Map<string, LibraryStamp>> {
  const codes = [...new Set(stampCodesOf(request).map((s) => s.code))];
  if (codes.length === 0) return new Map();
  const rows = await db
    .select({ id: stamps.id, code: stamps.code, widthMm: stamps.widthMm, heightMm: stamps.heightMm, coverageRatio: stamps.coverageRatio, outlinePath: stamps.outlinePath })
    .from(stamps)
    .where(inArray(stamps.code, codes));
  return new Map(rows.map((r) => [r.code, { id: r.id, code: r.code, geometry: engineStampOf(r) }]));
}

/** The engine input of a request whose stamps may be library codes (refused at the code's field when unknown). */
export async function resolveLayout(request: LayoutRequestLike): Promise<{ spec: LayoutSpec; library: Map<string, LibraryStamp> }> {
  const library = await libraryStampsOf(request);
  const geometry = new Map([...library].map(([code, s]) => [code, s.geometry]));
  return { spec: resolveLayoutRequest(request, geometry), library };
}

/** Computes a layout for anyone who may read (nothing is saved); the request was parsed once, by the route. */
export async function computeLayoutFor(actor: Actor, request: LayoutRequest): Promise<LayoutResult> {
  assertCan(actor, "data:read");
  return layoutOf((await resolveLayout(request)).spec);
}
