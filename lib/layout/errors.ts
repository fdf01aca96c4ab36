/** One problem with a layout input: the field path (e.g. "stamp.widthMm"), a stable code and its parameters. */
export interface LayoutIssue {
  field: string;
  code: string;
  /** Catalogue key for the message, e.g. "validation.tooSmall" or "layout.stampWiderThanBand". */
  messageKey: string;
  params: Record<string, number | string | boolean>;
}

/**
 * Thrown by the layout engine for input it cannot lay out. Carries every issue found; `field`, `code`
 * and `params` repeat the first one. The API layer answers it with 422 and catalogue messages.
 */
export class LayoutInputError extends Error {
  readonly field: string;
  readonly code: string;
  readonly messageKey: string;
  readonly params: Record<string, number | string | boolean>;
  readonly issues: LayoutIssue[];

  constructor(issues: LayoutIssue[]) {
    const first = issues[0];
    super(`${first.messageKey} at ${first.field}`);
    this.name = "LayoutInputError";
    this.field = first.field;
    this.code = first.code;
    this.messageKey = first.messageKey;
    this.params = first.params;
    this.issues = issues;
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
