/**
 * React adds its own hidden inputs to a server action's form (`$ACTION_REF_1`, `$ACTION_1:0`, `$ACTION_KEY`, …)
 * for progressive enhancement. They carry the framework's state, never the user's input, so they are dropped
 * before any schema sees the form: strict schemas would refuse them as unknown fields.
 */
export function formFields(formData: FormData): FormData {
  const fields = new FormData();
  for (const [key, value] of formData.entries()) if (!key.startsWith("$ACTION")) fields.append(key, value);
  return fields;
}
