import "server-only";
import { getLocale } from "next-intl/server";
import { unstable_rethrow } from "next/navigation";
import type { z } from "zod";
import { errorAnswer, issueFields } from "@/lib/error-body";
import { pickLocale, type Locale } from "@/lib/i18n/config";
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

/** Follows an issue's path into the form's input. */
const valueAt = (input: unknown, path: readonly PropertyKey[]) =>
  path.reduce<unknown>((node, key) => (node !== null && typeof node === "object" ? (node as Record<PropertyKey, unknown>)[key] : undefined), input);

/**
 * A number box whose text is no number in the person's language (readNumber gave NaN) gets a message that
 * shows how their language writes one ("like 1.200,5" in Indonesian), instead of the schema's plain one.
 */
function withNumberExample(issues: readonly z.core.$ZodIssue[], input: unknown): z.core.$ZodIssue[] {
  return issues.map((issue) =>
    Number.isNaN(valueAt(input, issue.path)) ? { code: "custom", path: issue.path, message: "validation.numberAsWritten", params: { example: 1200.5 }, input: undefined } : issue,
  );
}

/**
 * Runs a form's server action: validates the form with its zod schema, runs `work`, and turns
 * every failure into a FormState with translated messages. Redirects pass through. `toInput` sees
 * only the form's own fields (see formFields), and the person's language, so it reads numbers as they
 * write them (readNumber in lib/contracts/form-input.ts). When a failure names fields, their messages stand
 * beside them and the form as a whole only says to look there, so no message shows twice.
 */
export async function runForm<S extends z.ZodType>(
  submitted: FormData,
  schema: S,
  work: (input: z.output<S>) => Promise<FormState | void>,
  toInput: (formData: FormData, locale: Locale) => unknown = (f) => Object.fromEntries(f.entries()),
): Promise<FormState> {
  const locale = pickLocale(await getLocale());
  const t = translator(locale);
  const formData = formFields(submitted);
  const values = keepValues(formData);
  const valueLists = keepLists(formData);
  const input = toInput(formData, locale);
  const parsed = parseInput(schema, input);
  if (!parsed.success) {
    return {
      status: "error",
      message: t("common.formHasErrors"),
      fieldErrors: issueFields(withNumberExample(parsed.error.issues, input), t),
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
