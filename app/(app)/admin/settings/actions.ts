"use server";

import { getTranslations } from "next-intl/server";
import { revalidatePath } from "next/cache";
import type { FormState } from "@/lib/actions/form-state";
import { runForm } from "@/lib/actions/run-form";
import { settingsFormInput } from "@/lib/contracts/people";
import { updateWorkshopSettings } from "@/lib/data/settings";
import { requirePermission } from "@/lib/session";
import { updateWorkshopSettingsSchema } from "@/lib/validation/settings";

export async function updateSettingsAction(_prev: FormState, formData: FormData): Promise<FormState> {
  return runForm(formData, updateWorkshopSettingsSchema, async (input) => {
    const actor = await requirePermission("settings:manage");
    const saved = await updateWorkshopSettings(actor, input);
    // Every page shows dates in the zone: all of them render again.
    revalidatePath("/", "layout");
    return { status: "success", message: (await getTranslations("settings"))("saved", { timeZone: saved.settings.timeZone }) };
  }, settingsFormInput);
}
