import "server-only";
import { getLocale } from "next-intl/server";
import { unstable_rethrow } from "next/navigation";
import type { z } from "zod";
import { errorAnswer, issueFields } from "@/lib/error-body";
import { pickLocale } from "@/lib/i18n/config";
import { translator } from "@/lib/i18n/translator";
import { parseInput } from "@/lib/validation/parse";
import { formFields } from "./form-fields";
import type { FormState } from "./form-state";

const secretFields = new Set(["password", "confirm", "token", "currentPassword"]);

/** The typed values, minus secrets, so a failed form keeps what the user entered but never echoes a password. */
/** The values of fields that occur more than once (rows of a table in a form), in order. */
function keepLists(formData: FormData): Record<string, string[]> | undefined {
  const lists: Record<string, string[]> = {};
  for (const key of new Set(formData.keys())) {
    const all = formData.getAll(key).filter((v): v is string => typeof v === "string");
    if (all.length > 1 && !secretFields.has(key)) lists[key] = all;
  }
  return Object.keys(lists).length ? lists : undefined;
}

function keepValues(formData: FormData): Record<string, string> {
  const values: Record<string, string> = {};
  for (const [key, value] of formData.entries()) {
    if (typeof value === "string" && !secretFields.has(key)) values[key] = value;
  }
  return values;
}

/**
 * Runs a form's server action: validates the form with its zod schema, runs `work`, and turns
 * every failure into a FormState with translated messages. Redirects pass through. `toInput` sees
 * only the form's own fields (see formFields). When a failure names fields, their messages stand
 * beside them and the form as a whole only says to look there, so no message shows twice.
 */
export async function runForm<S extends z.ZodType>(
  submitted: FormData,
  schema: S,
  work: (input: z.output<S>) => Promise<FormState | void>,
  toInput: (formData: FormData) => unknown = (f) => Object.fromEntries(f.entries()),
): Promise<FormState> {
  const t = translator(pickLocale(await getLocale()));
  const formData = formFields(submitted);
  const values = keepValues(formData);
  const valueLists = keepLists(formData);
  const parsed = parseInput(schema, toInput(formData));
  if (!parsed.success) {
    return {
      status: "error",
      message: t("common.formHasErrors"),
      fieldErrors: issueFields(parsed.error.issues, t),
      values,
      ...(valueLists ? { valueLists } : {}),
    };
  }
  try {
    const state = (await work(parsed.data)) ?? { status: "success" };
    // A refusal decided in `work` keeps what was typed, like a schema's.
    return state.status === "error" ? { values, ...(valueLists ? { valueLists } : {}), ...state } : state;
  } catch (error) {
    unstable_rethrow(error);
    const { error: answer } = errorAnswer(error, t).body;
    // A refusal that names fields shows beside them; the form as a whole only says to look there.
    return { status: "error", message: answer.fields ? t("common.formHasErrors") : answer.message, fieldErrors: answer.fields, values, ...(valueLists ? { valueLists } : {}) };
  }
}
