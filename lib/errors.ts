import type { z } from "zod";
import type { ScanRejectedCode } from "@/lib/scans/errors";

/**
 * The one status table (two groups): every error code the app answers with, and its HTTP status. Domain errors
 * (lib/layout, lib/scans, …) carry a code, params and a field only; the status is decided here and
 * the text in the catalogue, when the error is answered (lib/error-body.ts).
 */
export const errorStatus = {
  badRequest: 400,
  validation: 400,
  unauthenticated: 401,
  forbidden: 403,
  crossSite: 403,
  notFound: 404,
  methodNotAllowed: 405,
  conflict: 409,
  emailTaken: 409,
  payloadTooLarge: 413,
  unsupportedMediaType: 415,
  unprocessable: 422,
  rateLimited: 429,
  tokenInvalid: 400,
  versionConflict: 409,
  codeTaken: 409,
  locationTaken: 409,
  locationInUse: 409,
  alreadyCheckedOut: 409,
  notCheckedOut: 409,
  stampUnavailable: 409,
  stampCheckedOut: 409,
  conditionChange: 422,
  importInvalid: 422,
  stockTakeOpen: 409,
  stockTakeClosed: 409,
  csvMediaType: 415,
  scanDuplicate: 409,
  scanUploadMissing: 409,
  settingsConflict: 409,
  lastAdmin: 409,
  materialTaken: 409,
  recipeNameTaken: 409,
  recipeInUse: 409,
  recipeArchived: 409,
  waxUseWithdrawn: 409,
  stampInPlans: 409,
  planInWaxRecords: 409,
  requestAnswered: 409,
  requestStampsUnavailable: 409,
  requestStampsReserved: 409,
  motifInUse: 409,
  colourwayInRuns: 409,
  motifHasMain: 409,
  collectionInUse: 409,
  collectionTaken: 409,
  runStageHasRecords: 409,
  runHasRecords: 409,
  runClosed: 409,
  stageHasNoStamps: 409,
  stageStampsRequested: 409,
  planInRuns: 409,
  stampInRuns: 409,
  internal: 500,
} as const;

/** Why lib/scans refused a file (codes in lib/scans/errors.ts); messages are `scans.rejected.<code>`. */
export const scanRejectedStatus = {
  badFileName: 400,
  empty: 400,
  tooLarge: 413,
  svgRefused: 415,
  markupRefused: 415,
  unsupportedType: 415,
  notAnImage: 415,
  truncated: 422,
  trailingData: 422,
  corrupt: 422,
  tooManyPixels: 413,
  tooSmall: 422,
  busy: 503,
} as const satisfies Record<ScanRejectedCode, number>;

const statusTable = { ...errorStatus, ...scanRejectedStatus } as const;

/** Codes of AppError; each has its message at `errors.<code>`. */
export type ErrorCode = keyof typeof errorStatus;
/** Every code an error body can carry. */
export type AnswerCode = keyof typeof statusTable;

export const statusOf = (code: AnswerCode): number => statusTable[code];

/**
 * A value for a message's placeholder: text, a number (formatted in the reader's language by `{n, number}`),
 * or a catalogue key to be said in the reader's language too (`{ key: "stamps.conditions.needs_repair" }`),
 * so an error about a stored code value never shows the code.
 */
export type MessageValue = string | number | { key: string };
export type MessageValues = Record<string, MessageValue>;

/** A message before translation: a catalogue key and the values of its placeholders. */
export interface MessageRef {
  key: string;
  values: MessageValues;
}

/** A field message before translation: a bare key (values from the error's params) or a key with its own values. */
export type FieldMessage = string | MessageRef;

/** Translated messages per field path ("cloth.widthMm"; "_form" for the whole input). */
export type FieldErrors = Record<string, string[]>;

/**
 * An error the app raises on purpose. `code` picks the status (table above) and the message
 * (`errors.<code>`); `fields` names per-field messages; `details` adds members to the error body
 * (e.g. the scan a duplicate repeats).
 */
export class AppError extends Error {
  constructor(
    readonly code: ErrorCode,
    readonly params: MessageValues = {},
    readonly fields?: Record<string, FieldMessage[]>,
    readonly details?: Record<string, unknown>,
  ) {
    super(code);
    this.name = "AppError";
  }

  get status(): number {
    return errorStatus[this.code];
  }
}

/** A validation failure with zod's issues (400, or 422 for values that are valid alone but not together). */
export class ValidationFailed extends AppError {
  constructor(
    readonly issues: readonly z.core.$ZodIssue[],
    status: 400 | 422 = 400,
  ) {
    super(status === 422 ? "unprocessable" : "validation");
  }
}

/** One thing a domain refuses about its input: the field's path, a stable code, the values for its message. */
export interface InputIssue {
  field: string;
  code: string;
  params: Record<string, number | string | boolean>;
  /** The catalogue key when it is not the code itself (the layout engine's `validation.*` / `layout.*`). */
  messageKey?: string;
}

/**
 * What a pure domain throws for input it cannot compute with (the layout engine, the wax estimator):
 * every issue found, and the first one's field, code and params for convenience. No status, no text:
 * the error body answers it with 422 and one translated message per field.
 */
export class InputRefused<I extends InputIssue = InputIssue> extends Error {
  readonly field: string;
  readonly code: string;
  readonly params: I["params"];
  readonly issues: I[];

  constructor(issues: I[]) {
    const first = issues[0];
    super(`${first.code} at ${first.field}`);
    this.field = first.field;
    this.code = first.code;
    this.params = first.params;
    this.issues = issues;
  }
}

type RawIssue = z.core.$ZodRawIssue | z.core.$ZodIssue;

/**
 * The one map from a zod issue to a catalogue key of the `validation` namespace. Schemas use it as
 * their error map (`{ error: issueKey }`) or name a key themselves (`"validation.stampSide"`).
 */
export function issueKey(issue: RawIssue): string {
  switch (issue.code) {
    case "invalid_type":
      if (issue.input === undefined) return "validation.required";
      return issue.expected === "int" ? "validation.notAnInteger" : "validation.invalidType";
    case "too_small":
      if (issue.origin === "string") return Number(issue.minimum) <= 1 ? "validation.required" : "validation.tooShort";
      return issue.origin === "array" ? "validation.tooFew" : "validation.tooSmall";
    case "too_big":
      return issue.origin === "string" ? "validation.tooLong" : issue.origin === "array" ? "validation.tooMany" : "validation.tooBig";
    case "invalid_format":
      return issue.format === "email" ? "validation.email" : "validation.invalidFormat";
    case "invalid_value":
      return "validation.invalidOption";
    case "unrecognized_keys":
      return "validation.unknownFields";
    case "not_multiple_of":
      return "validation.notMultipleOf";
    default:
      return "validation.invalid";
  }
}

/** The values a message for this issue interpolates ({min}, {max}, {options}, …, and a custom check's params). */
export function issueValues(issue: RawIssue): Record<string, string | number> {
  const values: Record<string, string | number> = {};
  switch (issue.code) {
    case "too_small":
      values.min = Number(issue.minimum);
      break;
    case "too_big":
      values.max = Number(issue.maximum);
      break;
    case "invalid_type":
      values.expected = String(issue.expected);
      break;
    case "invalid_value":
      values.options = issue.values.map(String).join(", ");
      break;
    case "unrecognized_keys":
      values.keys = issue.keys.join(", ");
      break;
    case "not_multiple_of":
      values.step = Number(issue.divisor);
      break;
    case "custom":
      for (const [key, v] of Object.entries(issue.params ?? {})) {
        if (typeof v === "number" || typeof v === "string") values[key] = v;
        else if (typeof v === "boolean") values[key] = String(v);
      }
      break;
  }
  return values;
}

/** A message that is a catalogue key ("validation.stampSide", "wax.mixNot100"), not zod's own prose. */
const CATALOGUE_KEY = /^[a-z][A-Za-z]*(\.[A-Za-z0-9]+)+$/;

/** Catalogue key and values for one zod issue: the schema's own key when it names one, else the key for its code. */
export function issueMessage(issue: RawIssue): { key: string; values: Record<string, string | number> } {
  const message = "message" in issue ? issue.message : undefined;
  const key = message && CATALOGUE_KEY.test(message) ? message : issueKey(issue);
  return { key, values: issueValues(issue) };
}

/** The dotted field path of an issue ("cloth.widthMm"); "_form" for the input as a whole. */
export const issuePath = (issue: { path: readonly PropertyKey[] }): string => (issue.path.length ? issue.path.map(String).join(".") : "_form");
