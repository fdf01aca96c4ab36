"use server";

import { revalidatePath } from "next/cache";
import { chooseLocale } from "@/lib/data/users";
import { rememberLocale } from "@/lib/i18n/locale-cookie";
import { currentActor } from "@/lib/session";
import { chooseLocaleSchema } from "@/lib/validation/users";
import { parseInput } from "@/lib/validation/parse";

/**
 * The header's language switch (and the one on the sign-in pages). Signed in, the choice is stored on the
 * person's account (every device follows it); the cookie keeps it for this browser's pages before sign-in.
 * The switch offers only its own values, so anything else changes nothing.
 */
export async function chooseLocaleAction(formData: FormData): Promise<void> {
  const parsed = parseInput(chooseLocaleSchema, { locale: formData.get("locale") });
  if (!parsed.success) return;
  const actor = await currentActor();
  if (actor) await chooseLocale(actor, parsed.data.locale);
  await rememberLocale(parsed.data.locale);
  revalidatePath("/", "layout");
}
