"use server";

import { getTranslations } from "next-intl/server";
import { redirect } from "next/navigation";
import type { FormState } from "@/lib/actions/form-state";
import { runForm } from "@/lib/actions/run-form";
import { passwordLinkStatus, setPasswordWithToken } from "@/lib/data/users";
import { setPasswordSchema } from "@/lib/validation/users";

export async function setPasswordAction(_prev: FormState, formData: FormData): Promise<FormState> {
  // The link first: a used or expired one says so, whatever password was typed.
  const token = formData.get("token");
  const status = typeof token === "string" ? await passwordLinkStatus(token) : "unknown";
  if (status !== "valid") return { status: "error", message: (await getTranslations("setPassword"))(`link.${status}`), data: { link: status } };
  return runForm(formData, setPasswordSchema, async ({ token, password }) => {
    await setPasswordWithToken(token, password);
    redirect("/signin?notice=password-set");
  });
}
