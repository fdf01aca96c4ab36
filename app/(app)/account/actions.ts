"use server";

import { getTranslations } from "next-intl/server";
import { revalidatePath } from "next/cache";
import { signOut } from "@/lib/auth/config";
import type { FormState } from "@/lib/actions/form-state";
import { runForm } from "@/lib/actions/run-form";
import { revokeAllSessions } from "@/lib/data/sessions";
import { updateProfile } from "@/lib/data/users";
import { requirePermission } from "@/lib/session";
import { updateProfileSchema } from "@/lib/validation/users";

export async function updateProfileAction(_prev: FormState, formData: FormData): Promise<FormState> {
  return runForm(formData, updateProfileSchema, async (input) => {
    const actor = await requirePermission("account:self");
    await updateProfile(actor, input);
    revalidatePath("/", "layout");
    return { status: "success", message: (await getTranslations("account"))("saved") };
  });
}

/** Ends every session of the person, this one included, and says so on the sign-in page. */
export async function signOutEverywhereAction() {
  const actor = await requirePermission("account:self");
  await revokeAllSessions(actor);
  await signOut({ redirectTo: "/signin?notice=signed-out-everywhere" });
}
