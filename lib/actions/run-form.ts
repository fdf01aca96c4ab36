import "server-only";
import { getLocale } from "next-intl/server";
import { unstable_rethrow } from "next/navigation";
import type { z } from "zod";
import { errorAnswer, issueFields } from "@/lib/error-body";
import { pickLocale } from "@/lib/i18n/config";
import { translator } from "@/lib/i18n/translator";
import { parseInput } from "@/lib/validation/parse";
import type { FormState } from "./form-state";

const secretFields = new Set(["password", "confirm", "token", "currentPassword"]);

/** The typed values, minus secrets, so a failed form keeps what the user entered but never echoes a password. */
function keepValues(formData: FormData): Record<string, string> {
  const values: Record<string, string> = {};
  for (const [key, value] of formData.entries()) {
    if (typeof value === "string" && !secretFields.has(key) && !key.startsWith("$")) values[key] = value;
  }
  return values;
}

/**
 * Runs a form's server action: validates the form with its zod schema, runs `work`, and turns
 * every failure into a FormState with translated messages. Redirects pass through.
 */
export async function runForm<S extends z.ZodType>(
  formData: FormData,
  schema: S,
  work: (input: z.output<S>) => Promise<FormState | void>,
  toInput: (formData: FormData) => unknown = (f) => Object.fromEntries(f.entries()),
): Promise<FormState> {
  const t = translator(pickLocale(await getLocale()));
  const values = keepValues(formData);
  const parsed = parseInput(schema, toInput(formData));
  if (!parsed.success) {
    return {
      status: "error",
      message: t("common.formHasErrors"),
      fieldErrors: issueFields(parsed.error.issues, t),
      values,
    };
  }
  try {
    return (await work(parsed.data)) ?? { status: "success" };
  } catch (error) {
    unstable_rethrow(error);
    const { error: answer } = errorAnswer(error, t).body;
    return { status: "error", message: answer.message, fieldErrors: answer.fields, values };
  }
}
