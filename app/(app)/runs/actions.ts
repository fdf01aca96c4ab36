"use server";

import { getTranslations } from "next-intl/server";
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import type { FormState } from "@/lib/actions/form-state";
import { runForm } from "@/lib/actions/run-form";
import { formNumber, formText } from "@/lib/contracts/form-input";
import { runFormInput, runPages, stageFormInput, type RunDto } from "@/lib/contracts/runs";
import { createRun, deleteRun, getRun, requestStageStamps, updateRun } from "@/lib/data/runs";
import { AppError } from "@/lib/errors";
import { requirePermission } from "@/lib/session";
import { createRunSchema, stageStampRequestSchema, updateRunSchema } from "@/lib/validation/runs";
import { z } from "@/lib/zod";

/** Messages about one stage of the list (`stages.3.planId`) stand beside that field of the stage's form. */
function foldStageFields(state: FormState): FormState {
  if (!state.fieldErrors) return state;
  const folded: Record<string, string[]> = {};
  for (const [key, messages] of Object.entries(state.fieldErrors)) {
    const parts = key.split(".");
    const field = parts[0] === "stages" ? (parts[2] === "stamps" ? "stamps" : (parts[2] ?? "stages")) : key;
    folded[field] = [...new Set([...(folded[field] ?? []), ...messages])];
  }
  return { ...state, fieldErrors: folded };
}

const idOf = (form: FormData, name: string) => {
  const id = z.uuid().safeParse(formText(form, name));
  if (!id.success) throw new AppError("notFound");
  return id.data;
};

/** The new-run form → the run's page. */
export async function createRunAction(_prev: FormState, formData: FormData): Promise<FormState> {
  let id: string | undefined;
  const state = await runForm(
    formData,
    createRunSchema,
    async (input) => {
      const actor = await requirePermission("runs:write");
      id = (await createRun(actor, input)).id;
    },
    (f, locale) => {
      // The form asks "metres" or "pieces"; only the chosen size goes to the schema.
      const input = runFormInput(f, locale);
      if (formText(f, "sizeBy") === "pieces") delete input.metres;
      else {
        delete input.pieces;
        delete input.pieceLengthMm;
      }
      return input;
    },
  );
  if (state.status === "success" && id) {
    revalidatePath(runPages.list());
    redirect(`${runPages.one(id)}?saved=created`);
  }
  return state;
}

/** One stage's days, plan, recipe, faces, stamps and notes (the run's whole stage list is saved from its version). */
export async function updateStageAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const runId = idOf(formData, "runId");
  const stageId = idOf(formData, "stageId");
  const actor = await requirePermission("runs:write");
  const run: RunDto = await getRun(actor, runId);
  const version = formNumber(formData, "version", "en");
  let conflict = false;
  const state = await runForm(
    formData,
    updateRunSchema,
    async (input) => {
      try {
        await updateRun(actor, runId, input);
      } catch (error) {
        if (error instanceof AppError && error.code === "versionConflict") conflict = true;
        throw error;
      }
    },
    (f, locale) => ({ ...stageFormInput(f, locale, run, stageId), version: version ?? run.version }),
  );
  if (state.status === "success") {
    revalidatePath(runPages.one(runId));
    redirect(`${runPages.one(runId)}?saved=stage#stage-${(run.stages.find((s) => s.id === stageId)?.position ?? 0) + 1}`);
  }
  if (conflict) return { ...state, message: (await getTranslations())("runs.form.conflict") };
  return foldStageFields(state);
}

/** One click on a waxing stage: its stamps asked for, for its days. */
export async function requestStageStampsAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const runId = idOf(formData, "runId");
  const stageId = idOf(formData, "stageId");
  const state = await runForm(
    formData,
    stageStampRequestSchema,
    async (input) => {
      const actor = await requirePermission("stamps:request");
      await requestStageStamps(actor, runId, stageId, input);
    },
    (f) => ({ workstation: formText(f, "workstation"), note: undefined }),
  );
  if (state.status === "success") {
    revalidatePath(runPages.one(runId));
    redirect(`${runPages.one(runId)}?saved=requested`);
  }
  return state;
}

/** The run's own fields and its state (stop, take up again, finish), from its version. */
export async function updateRunAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const runId = idOf(formData, "runId");
  let conflict = false;
  const state = await runForm(
    formData,
    updateRunSchema,
    async (input) => {
      const actor = await requirePermission("runs:write");
      try {
        await updateRun(actor, runId, input);
      } catch (error) {
        if (error instanceof AppError && error.code === "versionConflict") conflict = true;
        throw error;
      }
    },
    (f, locale) => {
      const input = runFormInput(f, locale) as Record<string, unknown>;
      for (const k of ["motifId", "colourwayId", "planIds", "recipeId", "startOn"]) delete input[k];
      if (formText(f, "sizeBy") === "pieces") input.metres = null;
      else {
        input.pieces = null;
        input.pieceLengthMm = null;
      }
      return { ...input, version: formNumber(f, "version", "en"), state: formText(f, "state") || undefined, stateNote: formText(f, "stateNote") || null, notes: formText(f, "notes") || null };
    },
  );
  if (state.status === "success") {
    revalidatePath(runPages.one(runId));
    redirect(`${runPages.one(runId)}?saved=saved`);
  }
  if (conflict) return { ...state, message: (await getTranslations())("runs.form.conflict") };
  return state;
}

/** Deletes a run without records (one with records is refused: stop it instead). */
export async function deleteRunAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const runId = idOf(formData, "runId");
  const state = await runForm(
    formData,
    z.object({ version: z.number().int().min(1) }),
    async ({ version }) => {
      const actor = await requirePermission("runs:write");
      await deleteRun(actor, runId, version);
    },
    (f) => ({ version: formNumber(f, "version", "en") }),
  );
  if (state.status === "success") {
    revalidatePath(runPages.list());
    redirect(`${runPages.list()}?deleted=1`);
  }
  return state;
}
