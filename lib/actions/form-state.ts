import type { FieldErrors } from "@/lib/errors";

/** What a form's server action answers: field messages, a message for the form, and the typed values back. */
export interface FormState {
  status: "idle" | "error" | "success";
  message?: string;
  fieldErrors?: FieldErrors;
  values?: Record<string, string>;
  /** Data the form shows once, e.g. a new API token. */
  data?: Record<string, string>;
}

export const initialFormState: FormState = { status: "idle" };
