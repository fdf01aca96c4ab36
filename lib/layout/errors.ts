import { InputRefused } from "@/lib/errors";

/** One problem with a layout input: the field path (e.g. "stamp.widthMm"), a stable code and its parameters. */
export interface LayoutIssue {
  field: string;
  code: string;
  /** Catalogue key for the message, e.g. "validation.tooSmall" or "layout.stampWiderThanBand". */
  messageKey: string;
  params: Record<string, number | string | boolean>;
}

/** Thrown by the layout engine for input it cannot lay out; `messageKey` repeats the first issue's key. */
export class LayoutInputError extends InputRefused<LayoutIssue> {
  readonly messageKey: string;

  constructor(issues: LayoutIssue[]) {
    super(issues);
    this.name = "LayoutInputError";
    this.messageKey = issues[0].messageKey;
  }
}

/** Builds a one-issue LayoutInputError for an engine check; the message key is "layout.<code>". */
export function layoutError(
  field: string,
  code: string,
  params: Record<string, number | string | boolean> = {},
): LayoutInputError {
  return new LayoutInputError([{ field, code, messageKey: `layout.${code}`, params }]);
}
