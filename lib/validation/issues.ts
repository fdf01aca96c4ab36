import type { z } from "zod";
import type { FieldErrors } from "@/lib/errors";

type Translate = (key: string, values?: Record<string, string | number>) => string;
type HasKey = (key: string) => boolean;

/** The catalogue key and values for one zod issue; schemas may name a key as their message. */
export function issueMessage(issue: z.core.$ZodIssue): { key: string; values: Record<string, string | number> } {
  const byCode = messageForCode(issue);
  if (!issue.message.startsWith("validation.")) return byCode;
  // Custom checks pass their numbers (e.g. { min }) as params for the message.
  const params = issue.code === "custom" ? (issue.params ?? {}) : {};
  const extra = Object.fromEntries(Object.entries(params).filter(([, v]) => typeof v === "number" || typeof v === "string"));
  return { key: issue.message, values: { ...byCode.values, ...extra } };
}

function messageForCode(issue: z.core.$ZodIssue): { key: string; values: Record<string, string | number> } {
  switch (issue.code) {
    case "invalid_type":
      return issue.input === undefined || /received undefined/.test(issue.message)
        ? { key: "validation.required", values: {} }
        : { key: "validation.invalidType", values: { expected: String(issue.expected) } };
    case "too_small":
      return {
        key: issue.origin === "string" ? "validation.tooShort" : issue.origin === "array" ? "validation.tooFew" : "validation.tooSmall",
        values: { min: Number(issue.minimum) },
      };
    case "too_big":
      return {
        key: issue.origin === "string" ? "validation.tooLong" : issue.origin === "array" ? "validation.tooMany" : "validation.tooBig",
        values: { max: Number(issue.maximum) },
      };
    case "invalid_format":
      return { key: issue.format === "email" ? "validation.email" : "validation.invalidFormat", values: {} };
    case "invalid_value":
      return { key: "validation.invalidOption", values: { options: issue.values.map(String).join(", ") } };
    case "unrecognized_keys":
      return { key: "validation.unknownFields", values: { keys: issue.keys.join(", ") } };
    case "not_multiple_of":
      return { key: "validation.notMultipleOf", values: { step: Number(issue.divisor) } };
    default:
      return { key: "validation.invalid", values: {} };
  }
}

/**
 * Translated messages keyed by the field's dotted path ("cloth.widthMm"); "_form" for the whole input.
 * Two checks of one field may fail with the same message (a pattern and a refinement): it is listed once.
 */
export function translateIssues(issues: readonly z.core.$ZodIssue[], t: Translate, has?: HasKey): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of issues) {
    const path = issue.path.length ? issue.path.map(String).join(".") : "_form";
    let { key, values } = issueMessage(issue);
    if (has && !has(key)) ({ key, values } = { key: "validation.invalid", values: {} });
    const message = t(key, values);
    const list = (fields[path] ??= []);
    if (!list.includes(message)) list.push(message);
  }
  return fields;
}
