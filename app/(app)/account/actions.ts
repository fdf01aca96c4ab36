"use server";

import { revalidatePath } from "next/cache";
import { signOut } from "@/lib/auth/config";
import type { FormState } from "@/lib/actions/form-state";
import { runForm } from "@/lib/actions/run-form";
import { revokeAllSessions } from "@/lib/data/sessions";
import { updateProfile } from "@/lib/data/users";
import { rememberLocale } from "@/lib/i18n/locale-cookie";
import { translator } from "@/lib/i18n/translator";
import { requirePermission } from "@/lib/session";
import { updateProfileSchema } from "@/lib/validation/users";

export async function updateProfileAction(_prev: FormState, formData: FormData): Promise<FormState> {
  return runForm(formData, updateProfileSchema, async (input) => {
    const actor = await requirePermission("account:self");
    await updateProfile(actor, input);
    await rememberLocale(input.locale);
    revalidatePath("/", "layout");
    // Said in the language just chosen: the page around it changes to it too.
    return { status: "success", message: translator(input.locale)("account.saved") };
  });
}

/** Ends every session of the person, this one included, and says so on the sign-in page. */
export async function signOutEverywhereAction() {
  const actor = await requirePermission("account:self");
  await revokeAllSessions(actor);
  await signOut({ redirectTo: "/signin?notice=signed-out-everywhere" });
}
