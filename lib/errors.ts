/**
 * One error type for the app. `code` names a message in the catalogue (`errors.<code>`) and
 * decides the HTTP status; `fields` carries per-field message keys for forms and the API.
 */
export const errorStatus = {
  badRequest: 400,
  validation: 400,
  unauthenticated: 401,
  forbidden: 403,
  crossSite: 403,
  notFound: 404,
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
  settingsConflict: 409,
  lastAdmin: 409,
  internal: 500,
} as const;

export type ErrorCode = keyof typeof errorStatus;

export type FieldErrors = Record<string, string[]>;

/** A field message before translation: a catalogue key, with values for its placeholders. */
export type FieldMessage = string | { key: string; values: Record<string, string | number> };

export class AppError extends Error {
  readonly status: number;
  constructor(
    readonly code: ErrorCode,
    readonly params: Record<string, string | number> = {},
    readonly fields?: Record<string, FieldMessage[]>,
  ) {
    super(code);
    this.name = "AppError";
    this.status = errorStatus[code];
  }
}
