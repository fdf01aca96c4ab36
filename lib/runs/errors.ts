import type { z } from "zod";
import { InputRefused, issueKey, issueMessage } from "@/lib/errors";

export type RunParams = Record<string, number | string | boolean>;

/** One problem with a run input: field path, a stable code that is also its catalogue key, and its values. */
export interface RunIssue {
  field: string;
  code: string;
  params: RunParams;
}

/** Thrown by lib/runs for input it refuses; `code` is the catalogue key. Never a status or text. */
export class RunInputError extends InputRefused<RunIssue> {
  constructor(issues: RunIssue[]) {
    super(issues);
    this.name = "RunInputError";
  }
}

/** The options of every zod schema in lib/runs: keys come from the app's one map. */
export const keyed = { error: (issue: z.core.$ZodRawIssue) => issueKey(issue) };

/** Parses with a lib/runs schema; any problem becomes one RunInputError listing every field. */
export function parseRun<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const parsed = schema.safeParse(input);
  if (parsed.success) return parsed.data;
  throw new RunInputError(
    parsed.error.issues.map((issue) => {
      const { key, values } = issueMessage(issue);
      return { field: issue.path.map(String).join("."), code: key, params: values };
    }),
  );
}
