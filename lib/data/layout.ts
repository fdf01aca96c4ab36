import "server-only";
import { AppError } from "@/lib/errors";
import { computeLayout, LayoutInputError, type LayoutResult } from "@/lib/layout";
import type { StampRef, StampSize } from "@/lib/validation/layout";
import type { z } from "zod";
import type { layoutRequestSchema } from "@/lib/validation/layout";
import { assertCan, type Actor } from "@/lib/authz";

export type LayoutRequest = z.output<typeof layoutRequestSchema>;

/** The sizes, outline and coverage of a library stamp, for `{ "stamp": { "code" } }`. */
async function stampGeometry(code: string): Promise<StampSize> {
  void code;
  // The stamp shelf is not in the database yet: no code can match.
  throw new AppError("unprocessable", {}, { "stamp.code": ["validation.stampNotFound"] });
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
  const stamp: StampRef = request.stamp;
  const sized = "code" in stamp ? await stampGeometry(stamp.code) : stamp;
  try {
    return computeLayout({ ...request, stamp: sized });
  } catch (error) {
    if (error instanceof LayoutInputError) throw toAppError(error);
    throw error;
  }
}
