"use server";

import { getTranslations } from "next-intl/server";
import { revalidatePath } from "next/cache";
import { z } from "@/lib/zod";
import type { FormState } from "@/lib/actions/form-state";
import { runForm } from "@/lib/actions/run-form";
import { revokeAnyApiToken } from "@/lib/data/api-tokens";
import { inviteUser, resendInvitation, sendPasswordResetFor, updateUser } from "@/lib/data/users";
import { requirePermission } from "@/lib/session";
import { idParamSchema, inviteUserSchema, roleSchema } from "@/lib/validation/users";

export async function inviteUserAction(_prev: FormState, formData: FormData): Promise<FormState> {
  return runForm(formData, inviteUserSchema, async (input) => {
    const actor = await requirePermission("users:manage");
    const user = await inviteUser(actor, input);
    revalidatePath("/admin");
    return { status: "success", message: (await getTranslations("admin"))("inviteSent", { email: user.email }) };
  });
}

const userActionSchema = z.discriminatedUnion("intent", [
  idParamSchema.extend({ intent: z.literal("role"), role: roleSchema }),
  idParamSchema.extend({ intent: z.literal("disable") }),
  idParamSchema.extend({ intent: z.literal("enable") }),
  idParamSchema.extend({ intent: z.literal("reset") }),
  idParamSchema.extend({ intent: z.literal("invite") }),
]);

/** One action for the row buttons of the people table, told apart by `intent`. */
export async function userRowAction(_prev: FormState, formData: FormData): Promise<FormState> {
  return runForm(formData, userActionSchema, async (input) => {
    const actor = await requirePermission("users:manage");
    const t = await getTranslations("admin");
    let message = t("saved");
    if (input.intent === "role") await updateUser(actor, input.id, { role: input.role });
    if (input.intent === "disable" || input.intent === "enable") await updateUser(actor, input.id, { disabled: input.intent === "disable" });
    if (input.intent === "reset") {
      await sendPasswordResetFor(actor, input.id);
      message = t("resetSent", { email: String(formData.get("email") ?? "") });
    }
    if (input.intent === "invite") {
      await resendInvitation(actor, input.id);
      message = t("inviteSent", { email: String(formData.get("email") ?? "") });
    }
    revalidatePath("/admin");
    return { status: "success", message };
  });
}

/** Revokes someone's API token from the administrators' list. */
export async function revokeTokenAction(_prev: FormState, formData: FormData): Promise<FormState> {
  return runForm(formData, idParamSchema, async ({ id }) => {
    const actor = await requirePermission("users:manage");
    const revoked = await revokeAnyApiToken(actor, id);
    revalidatePath("/admin");
    return { status: "success", message: (await getTranslations("admin"))("tokens.revoked", { name: revoked.name, owner: revoked.ownerName }) };
  });
}
