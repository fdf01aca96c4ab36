import type { z } from "zod";
import { InputRefused, issueKey, issueMessage } from "@/lib/errors";

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

/** Thrown by lib/wax for input it refuses; `code` is the catalogue key. */
export class WaxInputError extends InputRefused<WaxIssue> {
  constructor(issues: WaxIssue[]) {
    super(issues);
    this.name = "WaxInputError";
  }
}

/** Pass as the options of every zod schema in lib/wax: `z.number(keyed).min(0, keyed)`; keys come from the app's one map. */
export const keyed = { error: (issue: z.core.$ZodRawIssue) => issueKey(issue) };

/** Zod issues → WaxIssues: the issue's catalogue key (its own, or the one for its code) and the values for it. */
export function toWaxIssues(issues: readonly z.core.$ZodIssue[]): WaxIssue[] {
  return issues.map((issue) => {
    const { key, values } = issueMessage(issue);
    return { field: issue.path.map(String).join("."), code: key, params: values };
  });
}

/** Parses with a lib/wax schema; any problem becomes one WaxInputError listing every field. */
export function parseWax<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const parsed = schema.safeParse(input);
  if (parsed.success) return parsed.data;
  throw new WaxInputError(toWaxIssues(parsed.error.issues));
}
