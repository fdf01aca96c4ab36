// Reading a form's fields for its zod schema, the same for every form: text as typed, numbers with a
// decimal point or comma (what the person's locale writes), empty as "not given". Neither server-only nor React.

/** A text field as typed; "" when absent. */
export function formText(form: FormData, name: string): string {
  const value = form.get(name);
  return typeof value === "string" ? value : "";
}

/** A text field trimmed; undefined when blank (the schema then applies its default or says it is required). */
export function formOptional(form: FormData, name: string): string | undefined {
  return formText(form, name).trim() || undefined;
}

/** A number field: null when empty, "120,5" and "120.5" alike, NaN for anything else (the schema names the field). */
export function formNumber(form: FormData, name: string): number | null {
  const value = formText(form, name).trim();
  return value === "" ? null : Number(value.replace(",", "."));
}

/** A checkbox: checked or not. */
export const formChecked = (form: FormData, name: string): boolean => form.get(name) === "on";
