"use server";

import { getTranslations } from "next-intl/server";
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import type { FormState } from "@/lib/actions/form-state";
import { runForm } from "@/lib/actions/run-form";
import { planFormInput, planPages, stampRequestFormInput } from "@/lib/contracts/plans";
import { formText } from "@/lib/contracts/form-input";
import { createPlan, deletePlan, duplicatePlan, recomputePlan, updatePlan } from "@/lib/data/plans";
import { createStampRequest } from "@/lib/data/requests";
import { AppError } from "@/lib/errors";
import { requirePermission } from "@/lib/session";
import { z } from "@/lib/zod";
import { createPlanSchema, createStampRequestSchema, updatePlanSchema } from "@/lib/validation/plans";

const idField = z.uuid("validation.notFound");
const versionField = z.coerce.number("validation.required").int().positive();

/** The planner's Save: a new plan, or a change to the plan the form was opened on (from its version). */
export async function savePlanAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const planId = formText(formData, "planId");
  let saved: { id: string; kind: "created" | "updated" } | undefined;
  let conflict = false;
  const state = planId
    ? await runForm(
        formData,
        updatePlanSchema,
        async (input) => {
          const actor = await requirePermission("plans:write");
          if (!idField.safeParse(planId).success) return { status: "error", message: (await getTranslations())("errors.notFound") };
          try {
            saved = { id: (await updatePlan(actor, planId, input)).id, kind: "updated" };
          } catch (error) {
            conflict = error instanceof AppError && error.code === "versionConflict";
            throw error;
          }
        },
        (f, locale) => ({ ...planFormInput(f, locale), version: formText(f, "version") }),
      )
    : await runForm(
        formData,
        createPlanSchema,
        async (input) => {
          const actor = await requirePermission("plans:write");
          saved = { id: (await createPlan(actor, input)).id, kind: "created" };
        },
        planFormInput,
      );
  if (state.status === "success" && saved) {
    revalidatePath("/plans");
    redirect(`${planPages.one(saved.id)}?saved=${saved.kind}`);
  }
  if (conflict) state.data = { conflict: "1" };
  return state;
}

const planVersion = z.object({ id: idField, version: versionField });

export async function duplicatePlanAction(_prev: FormState, formData: FormData): Promise<FormState> {
  let copy: string | undefined;
  const state = await runForm(formData, z.object({ id: idField }), async ({ id }) => {
    const actor = await requirePermission("plans:write");
    copy = (await duplicatePlan(actor, id)).id;
  });
  if (copy) {
    revalidatePath("/plans");
    redirect(`${planPages.one(copy)}?saved=duplicated`);
  }
  return state;
}

export async function deletePlanAction(_prev: FormState, formData: FormData): Promise<FormState> {
  let done = false;
  const state = await runForm(formData, planVersion, async ({ id, version }) => {
    const actor = await requirePermission("plans:write");
    await deletePlan(actor, id, version);
    done = true;
  });
  if (done) {
    revalidatePath("/plans");
    redirect(planPages.list("deleted=1"));
  }
  return state;
}

export async function recomputePlanAction(_prev: FormState, formData: FormData): Promise<FormState> {
  let id: string | undefined;
  const state = await runForm(formData, planVersion, async (input) => {
    const actor = await requirePermission("plans:write");
    id = (await recomputePlan(actor, input.id, input.version)).id;
  });
  if (id) {
    revalidatePath("/plans");
    redirect(`${planPages.one(id)}?saved=recomputed`);
  }
  return state;
}

/** "Request these stamps": a check-out request to the keepers (any role). */
export async function requestStampsAction(_prev: FormState, formData: FormData): Promise<FormState> {
  let planId: string | null | undefined;
  let done = false;
  const state = await runForm(
    formData,
    createStampRequestSchema,
    async (input) => {
      const actor = await requirePermission("stamps:request");
      await createStampRequest(actor, input);
      planId = input.planId;
      done = true;
    },
    stampRequestFormInput,
  );
  if (done) {
    revalidatePath("/stamps/requests");
    redirect(planId ? `${planPages.one(planId)}?saved=requested` : "/stamps/requests");
  }
  return state;
}
