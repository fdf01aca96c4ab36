"use server";

import { getTranslations } from "next-intl/server";
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { z } from "@/lib/zod";
import type { FormState } from "@/lib/actions/form-state";
import { runForm } from "@/lib/actions/run-form";
import { createLocation, deleteLocation, updateLocation } from "@/lib/data/stamps/locations";
import { locationLabel } from "@/lib/stamps/format";
import { sendOverdueReminders } from "@/lib/data/stamps/mail";
import { AppError } from "@/lib/errors";
import { changeCondition, checkOutStamp, createStamp, deleteStamp, reportDamage, returnStamp, updateStamp } from "@/lib/data/stamps";
import { requirePermission } from "@/lib/session";
import { isLowCoverage, ratioToPercent } from "@/lib/stamps/coverage";
import { checkoutFormInput, conditionFormInput, damageFormInput, returnFormInput, stampFormInput } from "@/lib/contracts/stamps";
import { formText } from "@/lib/contracts/form-input";
import type { Locale } from "@/lib/i18n/config";
import {
  checkoutSchema,
  conditionChangeSchema,
  createStampSchema,
  damageReportSchema,
  locationIdParamSchema,
  locationSchema,
  returnSchema,
  stampCodeSchema,
  updateStampSchema,
} from "@/lib/validation/stamps";

/**
 * The form takes coverage in %, the schema a ratio: the percentage field's errors show under its own
 * name and speak of percent, so the person sees one unit on screen and in the message.
 */
async function renameCoverage(state: FormState): Promise<FormState> {
  const errors = state.fieldErrors?.coverageRatio;
  if (errors) {
    const t = await getTranslations();
    const ratioMessage = t("validation.coverageRatio");
    state.fieldErrors!.coveragePct = errors.map((m) => (m === ratioMessage ? t("validation.coveragePct") : m));
    delete state.fieldErrors!.coverageRatio;
  }
  return state;
}

/**
 * Coverage under 1 % is saved only when the person ticked "keep it" (confirmLowCoverage): until then the
 * form says what the value means and what they may have meant, beside the field.
 */
async function lowCoverageUnconfirmed(formData: FormData, ratio: number | null | undefined): Promise<FormState | null> {
  if (!isLowCoverage(ratio) || formData.get("confirmLowCoverage") === "on") return null;
  const t = await getTranslations();
  const pct = ratioToPercent(ratio);
  return {
    status: "error",
    message: t("common.formHasErrors"),
    fieldErrors: { coveragePct: [ratio === 0 ? t("validation.coverageZero") : t("validation.coverageLow", { pct, meant: ratioToPercent(ratio * 100) })] },
    data: { lowCoverage: "1" },
  };
}

export async function createStampAction(_prev: FormState, formData: FormData): Promise<FormState> {
  let code: string | undefined;
  const state = await runForm(
    formData,
    createStampSchema,
    async (input) => {
      const actor = await requirePermission("stamps:write");
      const unconfirmed = await lowCoverageUnconfirmed(formData, input.coverageRatio);
      if (unconfirmed) return unconfirmed;
      code = (await createStamp(actor, input)).code;
    },
    (f, locale) => stampFormInput(f, "create", locale),
  );
  if (state.status === "success" && code) {
    revalidatePath("/stamps");
    redirect(`/stamps/${encodeURIComponent(code)}?saved=created`);
  }
  return renameCoverage(state);
}

export async function updateStampAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const original = stampCodeSchema.safeParse(formText(formData, "originalCode"));
  let code: string | undefined;
  let conflict = false;
  const state = await runForm(
    formData,
    updateStampSchema,
    async (input) => {
      const actor = await requirePermission("stamps:write");
      if (!original.success) return { status: "error", message: (await getTranslations())("errors.notFound") };
      const unconfirmed = await lowCoverageUnconfirmed(formData, input.coverageRatio);
      if (unconfirmed) return unconfirmed;
      try {
        code = (await updateStamp(actor, original.data, input)).code;
      } catch (error) {
        conflict = error instanceof AppError && error.code === "versionConflict";
        throw error;
      }
    },
    (f, locale) => stampFormInput(f, "update", locale),
  );
  if (state.status === "success" && code) {
    revalidatePath("/stamps");
    redirect(`/stamps/${encodeURIComponent(code)}?saved=updated`);
  }
  // The form keeps what was typed and offers the latest saved version beside it.
  if (conflict) state.data = { conflict: "1" };
  return renameCoverage(state);
}

const codeField = z.object({ code: stampCodeSchema });

export async function deleteStampAction(_prev: FormState, formData: FormData): Promise<FormState> {
  let done = false;
  const state = await runForm(formData, codeField.extend({ version: z.coerce.number().int().positive() }), async ({ code, version }) => {
    const actor = await requirePermission("stamps:write");
    await deleteStamp(actor, code, version);
    done = true;
  });
  if (done) {
    revalidatePath("/stamps");
    redirect(`/stamps?deleted=${encodeURIComponent(formText(formData, "code").trim().toUpperCase())}`);
  }
  return state;
}

/** Runs an action on one stamp: the code comes from a hidden field, the rest through `schema`. */
async function onStamp<S extends z.ZodType>(
  formData: FormData,
  schema: S,
  toInput: (f: FormData, locale: Locale) => unknown,
  work: (code: string, input: z.output<S>) => Promise<string>,
): Promise<FormState> {
  const code = stampCodeSchema.safeParse(formText(formData, "code"));
  const state = await runForm(formData, schema, async (input) => {
    if (!code.success) return { status: "error", message: (await getTranslations())("errors.notFound") };
    return { status: "success", message: await work(code.data, input) };
  }, toInput);
  if (state.status === "success" && code.success) revalidatePath(`/stamps/${code.data}`);
  return state;
}

/** After a check-out or return the record opens again with a note of what happened (who has it now, or where it went). */
function showOnRecord(state: FormState, formData: FormData, saved: "checkedOut" | "returned"): FormState {
  const code = stampCodeSchema.safeParse(formText(formData, "code"));
  if (state.status === "success" && code.success) redirect(`/stamps/${encodeURIComponent(code.data)}?saved=${saved}`);
  return state;
}

export async function checkoutAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const state = await onStamp(
    formData,
    checkoutSchema,
    checkoutFormInput,
    async (code, input) => {
      const actor = await requirePermission("stamps:write");
      const out = await checkOutStamp(actor, code, input);
      return (await getTranslations())("stamps.checkout.done", { name: out.borrowerName });
    },
  );
  return showOnRecord(state, formData, "checkedOut");
}

export async function returnAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const state = await onStamp(
    formData,
    returnSchema,
    returnFormInput,
    async (code, input) => {
      const actor = await requirePermission("stamps:write");
      await returnStamp(actor, code, input);
      return (await getTranslations())("stamps.return.done");
    },
  );
  return showOnRecord(state, formData, "returned");
}

export async function reportDamageAction(_prev: FormState, formData: FormData): Promise<FormState> {
  return onStamp(
    formData,
    damageReportSchema,
    damageFormInput,
    async (code, input) => {
      const actor = await requirePermission("stamps:request");
      await reportDamage(actor, code, input);
      return (await getTranslations())("stamps.damage.done");
    },
  );
}

export async function changeConditionAction(_prev: FormState, formData: FormData): Promise<FormState> {
  return onStamp(
    formData,
    conditionChangeSchema,
    conditionFormInput,
    async (code, input) => {
      const actor = await requirePermission("stamps:write");
      await changeCondition(actor, code, input);
      const t = await getTranslations();
      return t("stamps.condition.done", { condition: t(`stamps.conditions.${input.condition}`) });
    },
  );
}

// --- locations -----------------------------------------------------------------------------

export async function createLocationAction(_prev: FormState, formData: FormData): Promise<FormState> {
  return runForm(formData, locationSchema, async (input) => {
    const actor = await requirePermission("stamps:write");
    const location = await createLocation(actor, input);
    revalidatePath("/stamps/locations");
    return { status: "success", message: (await getTranslations())("locations.created", { site: location.site, code: location.code }) };
  });
}

export async function locationRowAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const schema = z.discriminatedUnion("intent", [
    locationIdParamSchema.extend({ intent: z.literal("delete") }),
    locationIdParamSchema.extend({ intent: z.literal("describe"), description: z.string().trim().max(300, "validation.tooLong") }),
  ]);
  let deleted: { site: string; code: string } | null = null;
  const state = await runForm(formData, schema, async (input) => {
    const actor = await requirePermission("stamps:write");
    const t = await getTranslations();
    if (input.intent === "delete") deleted = await deleteLocation(actor, input.id);
    else await updateLocation(actor, input.id, { description: input.description || null });
    revalidatePath("/stamps/locations");
    return { status: "success", message: input.intent === "delete" ? t("locations.deleted") : t("locations.saved") };
  });
  // The row goes away with the location, and its message with it: the page says it instead.
  if (deleted) redirect(`/stamps/locations?deleted=${encodeURIComponent(locationLabel(deleted)!)}`);
  return state;
}

// --- reminders -----------------------------------------------------------------------------------

export async function sendRemindersAction(_prev: FormState, formData: FormData): Promise<FormState> {
  return runForm(formData, z.object({}), async () => {
    const actor = await requirePermission("stamps:write");
    const result = await sendOverdueReminders(actor);
    revalidatePath("/stamps/out");
    const t = await getTranslations();
    const parts = [t("overdue.sent", { count: result.sent.length })];
    if (result.skipped.length) parts.push(t("overdue.skipped", { count: result.skipped.length, hours: result.gapHours, names: result.skipped.map((s) => `${s.borrowerName} (${s.code})`).join(", ") }));
    if (result.withoutEmail.length) parts.push(t("overdue.withoutEmail", { names: result.withoutEmail.map((w) => `${w.borrowerName} (${w.code})`).join(", ") }));
    if (result.failed.length) parts.push(t("overdue.failed", { count: result.failed.length }));
    return { status: result.failed.length ? "error" : "success", message: parts.join(" ") };
  });
}
