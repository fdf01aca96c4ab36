import type { z } from "zod";

export type WaxParams = Record<string, number | string | boolean>;

/**
 * One problem with a wax input: the field path ("components.1.pct"), a stable code that is also its catalogue key
 * ("validation.tooBig", "wax.mixNot100"), and the values for the message's placeholders. No status, no text.
 */
export interface WaxIssue {
  field: string;
  code: string;
  params: WaxParams;
}

/** A caution that does not refuse (fumes, a result outside the published band); `field` when it concerns one input. */
export interface WaxWarning {
  code: string;
  params: WaxParams;
  field?: string;
}

/**
 * Thrown by lib/wax for input it refuses. Carries every issue found; `field`, `code` and `params` repeat the
 * first one. The API layer chooses the status and translates `code` with `params`.
 */
export class WaxInputError extends Error {
  readonly field: string;
  readonly code: string;
  readonly params: WaxParams;
  readonly issues: WaxIssue[];

  constructor(issues: WaxIssue[]) {
    const first = issues[0];
    super(`${first.code} at ${first.field}`);
    this.name = "WaxInputError";
    this.field = first.field;
    this.code = first.code;
    this.params = first.params;
    this.issues = issues;
  }
}

/**
 * The catalogue key for a zod issue that names none itself: the same "validation.*" keys lib/validation/issues.ts
 * gives by issue code, so their interpolation values ({min}, {max}, {options}) apply. Used as every schema's
 * error map, so each issue's message is a key.
 */
export function keyFor(issue: z.core.$ZodRawIssue): string {
  switch (issue.code) {
    case "invalid_type":
      if (issue.input === undefined) return "validation.required";
      return issue.expected === "int" ? "validation.notAnInteger" : "validation.invalidType";
    case "too_small":
      if (issue.origin === "string") return "validation.required";
      return issue.origin === "array" ? "validation.tooFew" : "validation.tooSmall";
    case "too_big":
      if (issue.origin === "string") return "validation.tooLong";
      return issue.origin === "array" ? "validation.tooMany" : "validation.tooBig";
    case "invalid_value":
      return "validation.invalidOption";
    case "unrecognized_keys":
      return "validation.unknownFields";
    default:
      return "validation.invalid";
  }
}

/** Pass as the options of every zod schema in lib/wax: `z.number(keyed).min(0, keyed)`. */
export const keyed = { error: keyFor };

function paramsOf(issue: z.core.$ZodIssue): WaxParams {
  const params: WaxParams = {};
  switch (issue.code) {
    case "too_small":
      params.min = Number(issue.minimum);
      break;
    case "too_big":
      params.max = Number(issue.maximum);
      break;
    case "invalid_type":
      params.expected = String(issue.expected);
      break;
    case "invalid_value":
      params.options = issue.values.map(String).join(", ");
      break;
    case "unrecognized_keys":
      params.keys = issue.keys.join(", ");
      break;
    case "custom":
      for (const [key, v] of Object.entries(issue.params ?? {})) {
        if (typeof v === "number" || typeof v === "string" || typeof v === "boolean") params[key] = v;
      }
      break;
  }
  return params;
}

const CATALOGUE_KEY = /^(validation|wax)\.[A-Za-z0-9.]+$/;

/** Zod issues → WaxIssues (the issue's message is its key, see `keyed`; any other message counts as invalid). */
export function toWaxIssues(issues: readonly z.core.$ZodIssue[]): WaxIssue[] {
  return issues.map((issue) => ({
    field: issue.path.map(String).join("."),
    code: CATALOGUE_KEY.test(issue.message) ? issue.message : "validation.invalid",
    params: paramsOf(issue),
  }));
}

/** Parses with a lib/wax schema; any problem becomes one WaxInputError listing every field. */
export function parseWax<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const parsed = schema.safeParse(input);
  if (parsed.success) return parsed.data;
  throw new WaxInputError(toWaxIssues(parsed.error.issues));
}
