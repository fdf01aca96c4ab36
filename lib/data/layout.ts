import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { stamps } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { layoutOf, withStamp, type LayoutResult, type LayoutSpec, type StampSize } from "@/lib/layout";
import type { LayoutRequest } from "@/lib/validation/layout";

/**
 * The footprint of a library stamp for `{ "stamp": { "code" } }`: its outline when it has one,
 * else its measured coverage ratio (from a scan), else the whole footprint.
 */
async function stampGeometry(code: string): Promise<StampSize> {
  const [stamp] = await db
    .select({ widthMm: stamps.widthMm, heightMm: stamps.heightMm, coverage: stamps.coverageRatio, outline: stamps.outlinePath })
    .from(stamps)
    .where(eq(stamps.code, code.trim().toUpperCase()))
    .limit(1);
  if (!stamp) throw new AppError("unprocessable", {}, { "stamp.code": ["validation.stampNotFound"] });
  return {
    widthMm: stamp.widthMm,
    heightMm: stamp.heightMm,
    ...(stamp.outline ? { outline: stamp.outline } : stamp.coverage !== null && stamp.coverage > 0 ? { coverage: stamp.coverage } : {}),
    fillRule: "nonzero",
  };
}

/** Computes a layout for anyone who may read (nothing is saved); the request was parsed once, by the route. */
export async function computeLayoutFor(actor: Actor, request: LayoutRequest): Promise<LayoutResult> {
  assertCan(actor, "data:read");
  const spec: LayoutSpec = "code" in request.stamp ? withStamp(request, await stampGeometry(request.stamp.code)) : (request as LayoutSpec);
  return layoutOf(spec);
}
