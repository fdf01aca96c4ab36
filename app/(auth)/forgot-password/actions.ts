"use server";

import { getTranslations } from "next-intl/server";
import type { FormState } from "@/lib/actions/form-state";
import { runForm } from "@/lib/actions/run-form";
import { requestPasswordReset } from "@/lib/data/users";
import { forgotPasswordSchema } from "@/lib/validation/users";

export async function forgotPasswordAction(_prev: FormState, formData: FormData): Promise<FormState> {
  return runForm(formData, forgotPasswordSchema, async ({ email }) => {
    await requestPasswordReset(email);
    // The same answer whether or not the address exists, so the form cannot be used to find accounts.
    return { status: "success", message: (await getTranslations("forgot"))("sent") };
  });
}
