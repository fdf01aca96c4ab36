"use server";

import { AuthError } from "next-auth";
import { getTranslations } from "next-intl/server";
import type { FormState } from "@/lib/actions/form-state";
import { runForm } from "@/lib/actions/run-form";
import { signIn } from "@/lib/auth/config";
import { signInSchema } from "@/lib/validation/users";

export async function signInAction(_prev: FormState, formData: FormData): Promise<FormState> {
  return runForm(formData, signInSchema, async ({ email, password }) => {
    const t = await getTranslations("signin");
    try {
      await signIn("credentials", { email, password, redirectTo: safeNext(formData.get("next")) });
    } catch (error) {
      if (error instanceof AuthError) {
        const rateLimited = "code" in error && error.code === "rateLimited";
        return { status: "error", message: t(rateLimited ? "rateLimited" : "invalid"), values: { email } };
      }
      throw error;
    }
  });
}

/** Only same-site paths, so the sign-in page cannot be used to send people elsewhere. */
function safeNext(next: FormDataEntryValue | null): string {
  return typeof next === "string" && next.startsWith("/") && !next.startsWith("//") ? next : "/";
}
