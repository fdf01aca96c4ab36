import { ZodError, type z } from "zod";
import { AppError, InputRefused, issueMessage, issuePath, statusOf, ValidationFailed, type FieldErrors, type FieldMessage, type InputIssue, type MessageValues } from "@/lib/errors";
import type { Translator } from "@/lib/i18n/translator";
import { ScanRejected } from "@/lib/scans/errors";

/** The JSON error body every answer uses: `{ error: { code, message, fields?, …details } }`. */
export interface ErrorBody {
  error: { code: string; message: string; fields?: FieldErrors; [detail: string]: unknown };
}

export interface ErrorAnswer {
  status: number;
  body: ErrorBody;
}

/** Byte counts also as MB, so messages read "larger than 8 MB". */
function withMegabytes(values: MessageValues): MessageValues {
  const out: MessageValues = { ...values };
  for (const [key, value] of Object.entries(values)) {
    if (key.endsWith("Bytes") && typeof value === "number") out[key.replace(/Bytes$/, "Mb")] = Math.round((value / (1024 * 1024)) * 10) / 10;
  }
  return out;
}

/** Placeholder values that are catalogue keys, said in the reader's language. */
function spoken(t: Translator, values: MessageValues): Record<string, string | number> {
  return Object.fromEntries(Object.entries(values).map(([name, v]) => [name, typeof v === "object" ? (t.has(v.key) ? t(v.key) : v.key) : v]));
}

/** Translates one catalogue key; an unknown key (a schema naming a message that does not exist) reads "Not valid". */
function say(t: Translator, key: string, values: MessageValues): string {
  return t.has(key) ? t(key, spoken(t, withMegabytes(values))) : t("validation.invalid");
}

/**
 * A caution or refusal that is part of an answer rather than an error (a recipe's fume warning, an estimate
 * outside the published band): the same data, with its message in the caller's language added beside the code.
 * Walks plain objects and arrays; any object with a string `code` and an object `params` gets a `message`.
 */
export function withMessages<T>(value: T, t: Translator): T {
  if (Array.isArray(value)) return value.map((v) => withMessages(v, t)) as T;
  if (!value || typeof value !== "object" || value instanceof Date) return value;
  const entries = Object.entries(value as Record<string, unknown>).map(([k, v]) => [k, withMessages(v, t)] as const);
  const out = Object.fromEntries(entries) as Record<string, unknown>;
  if (typeof out.code === "string" && out.params && typeof out.params === "object" && !Array.isArray(out.params)) {
    const values = Object.fromEntries(Object.entries(out.params as Record<string, unknown>).map(([k, v]) => [k, typeof v === "number" || typeof v === "string" ? v : String(v)]));
    out.message = say(t, out.code, values);
  }
  return out as T;
}

/**
 * Translated messages per field for zod issues: the one issue → message path of the app. Two checks of one
 * field may fail with the same message (a pattern and a refinement): it is listed once.
 */
export function issueFields(issues: readonly z.core.$ZodIssue[], t: Translator): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of issues) {
    const { key, values } = issueMessage(issue);
    const message = say(t, key, values);
    const list = (fields[issuePath(issue)] ??= []);
    if (!list.includes(message)) list.push(message);
  }
  return fields;
}

function appErrorFields(fields: Record<string, FieldMessage[]>, params: MessageValues, t: Translator): FieldErrors {
  return Object.fromEntries(
    Object.entries(fields).map(([field, messages]) => [field, messages.map((m) => (typeof m === "string" ? say(t, m, params) : say(t, m.key, m.values)))]),
  );
}

/** Members an AppError adds to the body; per-row problems of a file are translated here too. */
function details(error: AppError, t: Translator): Record<string, unknown> {
  if (!error.details) return {};
  const { rows, ...rest } = error.details as { rows?: { line: number; column: string | null; message: { key: string; values: MessageValues } }[] };
  return { ...rest, ...(rows ? { rows: rows.map((r) => ({ line: r.line, column: r.column, message: say(t, r.message.key, r.message.values) })) } : {}) };
}

/**
 * The one function that turns any error into its status and JSON body, in the caller's language.
 * Route handlers (apiRoute), server actions (runForm) and file imports all answer through it;
 * anything not raised on purpose is logged and answered as a 500 without details.
 */
export function errorAnswer(error: unknown, t: Translator): ErrorAnswer {
  if (error instanceof ZodError) return errorAnswer(new ValidationFailed(error.issues), t);
  if (error instanceof ValidationFailed) {
    return { status: error.status, body: { error: { code: error.code, message: t(`errors.${error.code}`), fields: issueFields(error.issues, t) } } };
  }
  // The engines refuse input they cannot compute with: 422, one message per field.
  if (error instanceof InputRefused) {
    const fields: FieldErrors = {};
    for (const issue of error.issues as InputIssue[]) {
      const values = Object.fromEntries(Object.entries(issue.params).map(([k, v]) => [k, typeof v === "boolean" ? String(v) : v]));
      (fields[issue.field || "_form"] ??= []).push(say(t, issue.messageKey ?? issue.code, values));
    }
    return { status: statusOf("unprocessable"), body: { error: { code: "unprocessable", message: t("errors.unprocessable"), fields } } };
  }
  if (error instanceof ScanRejected) {
    return { status: statusOf(error.code), body: { error: { code: error.code, message: say(t, `scans.rejected.${error.code}`, error.params) } } };
  }
  if (error instanceof AppError) {
    const fields = error.fields ? appErrorFields(error.fields, error.params, t) : undefined;
    return {
      status: error.status,
      body: { error: { code: error.code, message: say(t, `errors.${error.code}`, error.params), ...(fields ? { fields } : {}), ...details(error, t) } },
    };
  }
  console.error(error);
  return { status: 500, body: { error: { code: "internal", message: t("errors.internal") } } };
}
