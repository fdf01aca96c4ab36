"use server";

import { redirect } from "next/navigation";
import type { FormState } from "@/lib/actions/form-state";
import { runForm } from "@/lib/actions/run-form";
import { setPasswordWithToken } from "@/lib/data/users";
import { setPasswordSchema } from "@/lib/validation/users";

export async function setPasswordAction(_prev: FormState, formData: FormData): Promise<FormState> {
  return runForm(formData, setPasswordSchema, async ({ token, password }) => {
    await setPasswordWithToken(token, password);
    redirect("/signin?notice=password-set");
  });
}
