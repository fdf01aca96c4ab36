"use server";

import { getTranslations } from "next-intl/server";
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import type { FormState } from "@/lib/actions/form-state";
import { runForm } from "@/lib/actions/run-form";
import { formText } from "@/lib/contracts/form-input";
import {
  duplicateFormInput,
  estimateFormInput,
  materialFormInput,
  movementFormInput,
  recipeFormInput,
  waxDefaultsFormInput,
  waxPages,
  waxUseFormInput,
} from "@/lib/contracts/wax";
import {
  computeEstimate,
  createMaterial,
  createRecipe,
  deleteEstimate,
  deleteRecipe,
  duplicateRecipe,
  recordMovement,
  recordWaxUse,
  saveEstimate,
  updateEstimate,
  updateMaterial,
  updateRecipe,
  updateWaxDefaults,
  withdrawWaxUse,
} from "@/lib/data/wax";
import { requirePermission } from "@/lib/session";
import { z } from "@/lib/zod";
import { updateWaxDefaultsSchema } from "@/lib/validation/settings";
import {
  createMaterialSchema,
  createRecipeSchema,
  duplicateRecipeSchema,
  estimateRequestSchema,
  recordWaxUseSchema,
  saveEstimateSchema,
  stockMovementSchema,
  updateEstimateSchema,
  updateMaterialSchema,
  updateRecipeSchema,
  withdrawWaxUseSchema,
} from "@/lib/validation/wax";

const idOf = (formData: FormData) => z.uuid().safeParse(formText(formData, "id")).data ?? "00000000-0000-4000-8000-000000000000";
const refreshWax = () => revalidatePath("/wax", "layout");

// --- recipes --------------------------------------------------------------------------------

export async function createRecipeAction(_prev: FormState, formData: FormData): Promise<FormState> {
  let id: string | undefined;
  const state = await runForm(
    formData,
    createRecipeSchema,
    async (input) => {
      id = (await createRecipe(await requirePermission("wax:write"), input)).id;
    },
    (f, locale) => recipeFormInput(f, "create", locale),
  );
  if (state.status === "success" && id) {
    refreshWax();
    redirect(`${waxPages.recipe(id)}?saved=created`);
  }
  return state;
}

export async function updateRecipeAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const id = idOf(formData);
  const state = await runForm(formData, updateRecipeSchema, async (input) => {
    await updateRecipe(await requirePermission("wax:write"), id, input);
  }, (f, locale) => recipeFormInput(f, "update", locale));
  if (state.status === "success") {
    refreshWax();
    redirect(`${waxPages.recipe(id)}?saved=edited`);
  }
  return state;
}

export async function duplicateRecipeAction(_prev: FormState, formData: FormData): Promise<FormState> {
  let copyId: string | undefined;
  const state = await runForm(formData, duplicateRecipeSchema, async (input) => {
    copyId = (await duplicateRecipe(await requirePermission("wax:write"), idOf(formData), input)).id;
  }, duplicateFormInput);
  if (state.status === "success" && copyId) {
    refreshWax();
    redirect(`${waxPages.recipe(copyId)}?saved=duplicated`);
  }
  return state;
}

/** Archives or restores a recipe (a hidden field says which), from its version. */
export async function archiveRecipeAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const id = idOf(formData);
  const t = await getTranslations("waxRoom.recipe");
  const state = await runForm(
    formData,
    updateRecipeSchema,
    async (input) => {
      await updateRecipe(await requirePermission("wax:write"), id, input);
      return { status: "success", message: input.archived ? t("archived") : t("restored") };
    },
    (f) => ({ version: formText(f, "version"), archived: formText(f, "archived") === "true" }),
  );
  if (state.status === "success") refreshWax();
  return state;
}

export async function deleteRecipeAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const state = await runForm(formData, z.object({ version: z.coerce.number().int().positive() }), async ({ version }) => {
    await deleteRecipe(await requirePermission("wax:write"), idOf(formData), version);
  }, (f) => ({ version: formText(f, "version") }));
  if (state.status === "success") {
    refreshWax();
    redirect(`${waxPages.recipes}?deleted=${encodeURIComponent(formText(formData, "name"))}`);
  }
  return state;
}

// --- materials ------------------------------------------------------------------------------

export async function createMaterialAction(_prev: FormState, formData: FormData): Promise<FormState> {
  let id: string | undefined;
  const state = await runForm(formData, createMaterialSchema, async (input) => {
    id = (await createMaterial(await requirePermission("wax:write"), input)).id;
  }, (f, locale) => materialFormInput(f, "create", locale));
  if (state.status === "success" && id) {
    refreshWax();
    redirect(`${waxPages.material(id)}?saved=created`);
  }
  return state;
}

/** Saves a material; when its temperature figures changed, the answer lists the recipes that now break the rule. */
export async function updateMaterialAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const t = await getTranslations("waxRoom.material");
  const state = await runForm(formData, updateMaterialSchema, async (input) => {
    const { recheck } = await updateMaterial(await requirePermission("wax:write"), idOf(formData), input);
    const message = recheck ? (recheck.breaking.length ? t("recheckBreaking", { checked: recheck.recipesChecked, count: recheck.breaking.length }) : t("recheckFine", { checked: recheck.recipesChecked })) : t("saved");
    return { status: "success", message, data: recheck ? { recheck: JSON.stringify(recheck) } : undefined };
  }, (f, locale) => materialFormInput(f, "update", locale));
  if (state.status === "success") refreshWax();
  return state;
}

export async function recordMovementAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const t = await getTranslations("waxRoom.movement");
  const state = await runForm(formData, stockMovementSchema, async (input) => {
    await recordMovement(await requirePermission("wax:write"), idOf(formData), input);
    return { status: "success", message: t("recorded") };
  }, movementFormInput);
  if (state.status === "success") refreshWax();
  return state;
}

// --- estimates ------------------------------------------------------------------------------

/**
 * The estimate form's two buttons: "estimate" computes (anyone may), "save" stores it with a name (wax masters).
 * The result travels back as JSON in the state's data, so the form shows it beside what was typed.
 */
export async function estimateAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const saving = formText(formData, "intent") === "save";
  const t = await getTranslations("waxRoom.estimate");
  // React resets a form after its action: what was typed comes back so the result stands beside it.
  const typed = Object.fromEntries([...formData.entries()].filter((e): e is [string, string] => typeof e[1] === "string" && !e[0].startsWith("$ACTION")));
  if (!saving) {
    return runForm(
      formData,
      estimateRequestSchema,
      async (request) => {
        const result = await computeEstimate(await requirePermission("data:read"), request);
        return { status: "success", data: { result: JSON.stringify(result) }, values: typed };
      },
      (f, locale) => {
        const { name: _name, planned: _planned, ...request } = estimateFormInput(f, locale);
        void _name;
        void _planned;
        return request;
      },
    );
  }
  const state = await runForm(
    formData,
    saveEstimateSchema,
    async (input) => {
      const saved = await saveEstimate(await requirePermission("wax:write"), input);
      return { status: "success", message: t("saved", { name: saved.name }), data: { result: JSON.stringify({ ...saved.results, inputs: saved.inputs }) }, values: typed };
    },
    estimateFormInput,
  );
  if (state.status === "success") refreshWax();
  return state;
}

export async function planEstimateAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const state = await runForm(formData, updateEstimateSchema, async (input) => {
    await updateEstimate(await requirePermission("wax:write"), idOf(formData), input);
  }, (f) => ({ version: formText(f, "version"), planned: formText(f, "planned") === "true" }));
  if (state.status === "success") refreshWax();
  return state;
}

export async function deleteEstimateAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const state = await runForm(formData, z.object({ version: z.coerce.number().int().positive() }), async ({ version }) => {
    await deleteEstimate(await requirePermission("wax:write"), idOf(formData), version);
  }, (f) => ({ version: formText(f, "version") }));
  if (state.status === "success") refreshWax();
  return state;
}

// --- wax uses ------------------------------------------------------------------

export async function recordWaxUseAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const t = await getTranslations("waxRoom.use");
  const state = await runForm(formData, recordWaxUseSchema, async (input) => {
    const use = await recordWaxUse(await requirePermission("wax:write"), input);
    return { status: "success", message: t("recorded", { grams: Math.round(use.grams), recipe: use.recipe.name }) };
  }, waxUseFormInput);
  if (state.status === "success") refreshWax();
  return state;
}

/** Withdraws a mistaken wax use with its reason: its wax back into stock, its impressions back, out of the calibration. */
export async function withdrawWaxUseAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const t = await getTranslations("waxRoom.use");
  const state = await runForm(formData, withdrawWaxUseSchema, async (input) => {
    await withdrawWaxUse(await requirePermission("wax:write"), idOf(formData), input);
    return { status: "success", message: t("withdrawn") };
  }, (f) => ({ reason: formText(f, "reason") }));
  if (state.status === "success") refreshWax();
  return state;
}

// --- the defaults of new estimates ----------------------------------------------------------

export async function updateWaxDefaultsAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const t = await getTranslations("waxRoom.defaults");
  const state = await runForm(formData, updateWaxDefaultsSchema, async (input) => {
    await updateWaxDefaults(await requirePermission("wax:write"), input);
    return { status: "success", message: t("saved") };
  }, waxDefaultsFormInput);
  if (state.status === "success") refreshWax();
  return state;
}
