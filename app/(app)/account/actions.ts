"use server";

import { getTranslations } from "next-intl/server";
import { revalidatePath } from "next/cache";
import type { FormState } from "@/lib/actions/form-state";
import { runForm } from "@/lib/actions/run-form";
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
