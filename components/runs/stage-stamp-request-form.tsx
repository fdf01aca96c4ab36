"use client";

import { useTranslations } from "next-intl";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { initialFormState, type FormState } from "@/lib/actions/form-state";

/**
 * One click: ask the keepers for the stage's stamps for its planned days. The workstation is the only thing to say
 * (filled in with the waxing tables); the stamps, days and run come from the stage.
 */
export function StageStampRequestForm({ action, runId, stageId, codes }: { action: (prev: FormState, form: FormData) => Promise<FormState>; runId: string; stageId: string; codes: string[] }) {
  const t = useTranslations();
  const [state, formAction, pending] = useActionState(action, initialFormState);
  const e = state.fieldErrors ?? {};
  const id = `request-${stageId}`;
  const workstation = state.status === "error" ? (state.values?.workstation ?? "") : t("runs.stampRequest.defaultWorkstation");
  return (
    <form action={formAction} className="mt-3 flex flex-wrap items-end gap-3 rounded-md border border-stone-200 bg-stone-50 p-3" aria-label={t("runs.stampRequest.title")} noValidate>
      <input type="hidden" name="runId" value={runId} />
      <input type="hidden" name="stageId" value={stageId} />
      <div className="space-y-1">
        <label htmlFor={`${id}-workstation`} className="block text-xs font-medium text-stone-700">
          {t("runs.stampRequest.workstation")}
        </label>
        <input
          id={`${id}-workstation`}
          name="workstation"
          defaultValue={workstation}
          key={`${state.status}-${workstation}`}
          aria-invalid={e.workstation?.length ? true : undefined}
          aria-describedby={`${id}-workstation-error`}
          className="rounded-md border border-stone-300 bg-white px-2.5 py-1.5 text-sm aria-invalid:border-red-500"
        />
        <p id={`${id}-workstation-error`} className={e.workstation?.length ? "text-sm text-red-700" : "sr-only"} aria-live="polite">
          {e.workstation?.join(" ")}
        </p>
      </div>
      <Button type="submit" disabled={pending} data-testid="request-stage-stamps">
        {pending ? t("runs.stampRequest.sending") : t("runs.stampRequest.send", { codes: codes.join(", ") })}
      </Button>
      {state.message && !Object.keys(e).length ? (
        <Notice tone={state.status === "success" ? "success" : "error"} className="w-full">
          {state.message}
        </Notice>
      ) : null}
    </form>
  );
}
