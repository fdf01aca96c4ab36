import type { FieldErrors } from "@/lib/errors";

/** What a form's server action answers: field messages, a message for the form, and the typed values back. */
export interface FormState {
  status: "idle" | "error" | "success";
  message?: string;
  fieldErrors?: FieldErrors;
  values?: Record<string, string>;
  /** Fields the form repeats (rows of the same inputs), every value in order, so a refused form keeps each row. */
  valueLists?: Record<string, string[]>;
  /** Data the form shows once, e.g. a new API token. */
  data?: Record<string, string>;
}

export const initialFormState: FormState = { status: "idle" };
