"use server";

import { getLocale, getTranslations } from "next-intl/server";
import { revalidatePath } from "next/cache";
import { unstable_rethrow } from "next/navigation";
import type { FormState } from "@/lib/actions/form-state";
import { runForm } from "@/lib/actions/run-form";
import { formText } from "@/lib/contracts/form-input";
import { findingFormInput, progressFormInput, readingFormInput, runPages } from "@/lib/contracts/runs";
import { recordFinding, recordProgress, recordReading } from "@/lib/data/runs";
import { attachFindingPhoto } from "@/lib/data/runs/finding-photo";
import { errorAnswer } from "@/lib/error-body";
import { pickLocale } from "@/lib/i18n/config";
import { translator } from "@/lib/i18n/translator";
import { requirePermission } from "@/lib/session";
import { recordFindingSchema, recordProgressSchema, recordReadingSchema } from "@/lib/validation/runs";
import { z } from "@/lib/zod";

// The run page's record forms (components/runs/stage-work.tsx, run-findings.tsx): a stage's progress, a pot
// reading, a quality finding with its photo. They live in lib/actions rather than beside the page because the
// components that post them may not import from app/ (house/components-no-app), like the language switch.

const NO_ID = "00000000-0000-4000-8000-000000000000";
const idOf = (formData: FormData, name: string) => z.uuid().safeParse(formText(formData, name)).data ?? NO_ID;
const refreshRun = (runId: string) => revalidatePath(runPages.one(runId));

/**
 * A day's work at a stage. Readers get this far, as on the progress route: recordProgress checks the permission
 * the stage's kind needs (waxing and boil-off: runs:recordWaxing; dye and bleach: runs:write) before writing.
 */
export async function recordProgressAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const t = await getTranslations("runs.work");
  const runId = idOf(formData, "runId");
  const stageId = idOf(formData, "stageId");
  const state = await runForm(
    formData,
    recordProgressSchema,
    async (input) => {
      await recordProgress(await requirePermission("data:read"), runId, stageId, input);
      return { status: "success", message: input.finished ? t("progressRecordedFinished") : t("progressRecorded") };
    },
    (f, locale) => progressFormInput(f, locale),
  );
  if (state.status === "success") refreshRun(runId);
  return state;
}

/** A pot reading; the answer carries the cautions it calls for, which the form shows at once. */
export async function recordReadingAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const t = await getTranslations("runs.work");
  const runId = idOf(formData, "runId");
  const stageId = idOf(formData, "stageId");
  const state = await runForm(
    formData,
    recordReadingSchema,
    async (input) => {
      const reading = await recordReading(await requirePermission("runs:recordWaxing"), runId, stageId, input);
      return {
        status: "success",
        message: reading.warnings.length ? t("readingRecordedWarn") : t("readingRecorded"),
        data: { readingId: reading.id, warnings: reading.warnings.join(","), tempC: String(reading.tempC) },
      };
    },
    (f, locale) => readingFormInput(f, locale),
  );
  if (state.status === "success") refreshRun(runId);
  return state;
}

/**
 * A quality finding, then its photo when one was chosen (attachFindingPhoto checks and stores it). The finding
 * stands even when the photo is refused: the answer says so, and the form does not offer the finding again.
 */
export async function recordFindingAction(_prev: FormState, formData: FormData): Promise<FormState> {
  const t = await getTranslations("runs.findings");
  const runId = idOf(formData, "runId");
  const photo = formData.get("photo");
  const state = await runForm(
    formData,
    recordFindingSchema,
    async (input) => {
      const actor = await requirePermission("runs:recordFindings");
      const { finding, flagged } = await recordFinding(actor, runId, input);
      const said = [t("recorded")];
      if (flagged && finding.stamp) said.push(t("flagged", { code: finding.stamp.code }));
      const data: Record<string, string> = { findingId: finding.id, flagged: flagged && finding.stamp ? finding.stamp.code : "" };
      if (photo instanceof File && photo.size > 0) {
        try {
          await attachFindingPhoto(actor, runId, finding.id, new Uint8Array(await photo.arrayBuffer()), photo.name || undefined);
        } catch (error) {
          // The finding stands; the photo's refusal stands beside the photo field (and the form says so).
          unstable_rethrow(error);
          const reason = errorAnswer(error, translator(pickLocale(await getLocale()))).body.error.message;
          said.push(t("photoRefused", { reason }));
          data.photoRefused = "true";
          return { status: "success", message: said.join(" "), data, fieldErrors: { photo: [reason] } };
        }
      }
      return { status: "success", message: said.join(" "), data };
    },
    (f, locale) => findingFormInput(f, locale),
  );
  if (state.status === "success") refreshRun(runId);
  return state;
}
