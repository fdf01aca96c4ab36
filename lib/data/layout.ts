import "server-only";
import { eq } from "drizzle-orm";
import type { z } from "zod";
import { db } from "@/db";
import { stamps } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { computeLayout, LayoutInputError, type LayoutResult } from "@/lib/layout";
import type { layoutRequestSchema, StampSize } from "@/lib/validation/layout";

export type LayoutRequest = z.output<typeof layoutRequestSchema>;

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

/** Turns the engine's refusal into a 422 naming each field, with the numbers for its message. */
function toAppError(error: LayoutInputError): AppError {
  const fields: Record<string, { key: string; values: Record<string, string | number> }[]> = {};
  for (const issue of error.issues) {
    const values = Object.fromEntries(Object.entries(issue.params).map(([k, v]) => [k, typeof v === "boolean" ? String(v) : v]));
    (fields[issue.field] ??= []).push({ key: issue.messageKey, values });
  }
  return new AppError("unprocessable", {}, fields);
}

/** Computes a layout for anyone who may read (nothing is saved). */
export async function computeLayoutFor(actor: Actor, request: LayoutRequest): Promise<LayoutResult> {
  assertCan(actor, "data:read");
  const stamp = "code" in request.stamp ? await stampGeometry(request.stamp.code) : request.stamp;
  try {
    return computeLayout({ ...request, stamp });
  } catch (error) {
    if (error instanceof LayoutInputError) throw toAppError(error);
    throw error;
  }
}
