"use server";

import { getTranslations } from "next-intl/server";
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import type { FormState } from "@/lib/actions/form-state";
import { runForm } from "@/lib/actions/run-form";
import { motifFormInput } from "@/lib/contracts/motifs";
import { formText } from "@/lib/contracts/form-input";
import { copyMotif, createMotif, deleteMotif, updateMotif } from "@/lib/data/motifs";
import { AppError } from "@/lib/errors";
import { requirePermission } from "@/lib/session";
import { z } from "@/lib/zod";
import { copyMotifSchema, createMotifSchema, updateMotifSchema } from "@/lib/validation/motifs";

/** Messages about one stamp line or one colour show beside the box that holds them. */
function foldFields(state: FormState): FormState {
  if (!state.fieldErrors) return state;
  const folded: Record<string, string[]> = {};
  for (const [key, messages] of Object.entries(state.fieldErrors)) {
    const field = key.startsWith("stamps") ? "stamps" : key.startsWith("colourways") ? "colourways" : key;
    folded[field] = [...new Set([...(folded[field] ?? []), ...messages])];
  }
  return { ...state, fieldErrors: folded };
}

export async function createMotifAction(_prev: FormState, formData: FormData): Promise<FormState> {
  let id: string | undefined;
  const state = await runForm(
    formData,
    createMotifSchema,
    async (input) => {
      const actor = await requirePermission("motifs:write");
      id = (await createMotif(actor, input)).id;
    },
    motifFormInput,
  );
  if (state.status === "success" && id) {
    revalidatePath("/motifs");
    redirect(`/motifs/${id}?saved=created`);
  }
  return foldFields(state);
}

export async function updateMotifAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const id = z.uuid().safeParse(formText(formData, "id"));
  if (!id.success) throw new AppError("notFound");
  let conflict = false;
  const state = await runForm(
    formData,
    updateMotifSchema,
    async (input) => {
      const actor = await requirePermission("motifs:write");
      try {
        await updateMotif(actor, id.data, input);
      } catch (error) {
        if (error instanceof AppError && error.code === "versionConflict") conflict = true;
        throw error;
      }
    },
    (f) => {
      const input = motifFormInput(f);
      delete (input as { id?: unknown }).id;
      return input;
    },
  );
  if (state.status === "success") {
    revalidatePath(`/motifs/${id.data}`);
    redirect(`/motifs/${id.data}?saved=saved`);
  }
  if (conflict) return { ...state, message: (await getTranslations())("motifs.form.conflict") };
  return foldFields(state);
}

export async function copyMotifAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const id = z.uuid().safeParse(formText(formData, "id"));
  if (!id.success) throw new AppError("notFound");
  let copy: string | undefined;
  const state = await runForm(
    formData,
    copyMotifSchema,
    async (input) => {
      const actor = await requirePermission("motifs:write");
      copy = (await copyMotif(actor, id.data, input.name)).id;
    },
    (f) => ({ name: formText(f, "name") }),
  );
  if (state.status === "success" && copy) redirect(`/motifs/${copy}?saved=copied`);
  return state;
}

export async function deleteMotifAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const id = z.uuid().safeParse(formText(formData, "id"));
  if (!id.success) throw new AppError("notFound");
  const name = formText(formData, "name");
  const state = await runForm(
    formData,
    z.object({ version: z.coerce.number().int() }),
    async (input) => {
      const actor = await requirePermission("motifs:write");
      await deleteMotif(actor, id.data, input.version);
    },
    (f) => ({ version: formText(f, "version") }),
  );
  if (state.status === "success") {
    revalidatePath("/motifs");
    redirect(`/motifs?deleted=${encodeURIComponent(name)}`);
  }
  return state;
}
