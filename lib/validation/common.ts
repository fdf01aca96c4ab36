import { z } from "@/lib/zod";

// Building blocks every input schema shares, so a rule (what a date is, what a blank field means)
// is written once.

/** Text a person must give: trimmed, not blank, at most `max` characters. */
export const requiredText = (max: number) => z.string("validation.required").trim().min(1, "validation.required").max(max, "validation.tooLong");

/** Optional free text: empty becomes null, so a form's blank field clears the value. */
export const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, "validation.tooLong")
    .transform((v) => (v === "" ? null : v))
    .nullable()
    .optional();

/** A calendar date written YYYY-MM-DD that exists (no 31 February). */
export const isoDate = z
  .string()
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, "validation.date")
  .refine((v) => !Number.isNaN(Date.parse(`${v}T00:00:00Z`)) && new Date(`${v}T00:00:00Z`).toISOString().startsWith(v), "validation.date");

/** A yes/no query parameter: "true" or "false". */
export const boolParam = z.enum(["true", "false"], "validation.invalidOption").transform((v) => v === "true");

/** A UUID path parameter; anything else cannot name a record, so it reads as not found. */
export const idParamSchema = z.object({ id: z.uuid("validation.notFound") });

/** URLSearchParams → plain object for a query schema; empty values count as absent, a repeated key joins with commas. */
export function queryObject(params: URLSearchParams): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, value] of params.entries()) if (value !== "") out[key] = out[key] ? `${out[key]},${value}` : value;
  return out;
}
