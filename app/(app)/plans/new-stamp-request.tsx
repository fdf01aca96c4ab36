"use client";

import { useTranslations } from "next-intl";
import { useActionState, useId } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Modal } from "@/components/ui/modal";
import { Notice } from "@/components/ui/notice";
import { sketchAccept } from "@/components/motifs/new-stamp-request-form";
import { initialFormState } from "@/lib/actions/form-state";
import type { UnitSystem } from "@/lib/stamps/format";
import { requestNewStampAction } from "../stamps/requests/actions";

const shown = (mm: number, unit: "mm" | "in") => String(Number((unit === "in" ? mm / 25.4 : mm).toFixed(unit === "in" ? 3 : 1)));

/** "Make a stamp W mm wide": asks the keepers for a new stamp of this size for the plan, with a note. */
export function NewStampRequestDialog({ widthMm, heightMm, planId, unitSystem, onClose }: { widthMm: number; heightMm: number; planId: string | null; unitSystem: UnitSystem; onClose: () => void }) {
  const t = useTranslations("plans.newStamp");
  const [state, action, pending] = useActionState(requestNewStampAction, initialFormState);
  const titleId = useId();
  const unit = unitSystem === "imperial" ? "in" : "mm";
  const value = (name: string, fallback: string) => (state.status === "error" ? (state.values?.[name] ?? fallback) : fallback);
  return (
    <Modal open onClose={onClose} labelledBy={titleId} className="w-full max-w-md">
      <form action={action} className="space-y-3 p-5" aria-labelledby={titleId} noValidate>
        <h2 id={titleId} className="text-base font-semibold text-stone-900">
          {t("title")}
        </h2>
        <p className="text-sm text-stone-600">{t(planId ? "intro" : "introNoPlan")}</p>
        {state.message ? <Notice tone={state.status === "success" ? "success" : "error"}>{state.message}</Notice> : null}
        {state.status !== "success" ? (
          <>
            <input type="hidden" name="unit" value={unit} />
            {planId ? <input type="hidden" name="planId" value={planId} /> : null}
            <div className="grid grid-cols-2 gap-3">
              <Field id="new-stamp-width" label={t("width", { unit })} errors={state.fieldErrors?.widthMm}>
                {(aria) => <input {...aria} name="width" inputMode="decimal" autoComplete="off" defaultValue={value("width", shown(widthMm, unit))} />}
              </Field>
              <Field id="new-stamp-height" label={t("height", { unit })} errors={state.fieldErrors?.heightMm}>
                {(aria) => <input {...aria} name="height" inputMode="decimal" autoComplete="off" defaultValue={value("height", shown(heightMm, unit))} />}
              </Field>
            </div>
            <Field id="new-stamp-note" label={t("note")} hint={t("noteHint")} errors={state.fieldErrors?.note}>
              {(aria) => <textarea {...aria} name="note" rows={3} defaultValue={value("note", "")} />}
            </Field>
            <Field id="new-stamp-sketch" label={t("sketch")} hint={t("sketchHint")} errors={state.fieldErrors?.sketch}>
              {(aria) => <input {...aria} type="file" name="sketch" accept={sketchAccept} />}
            </Field>
          </>
        ) : null}
        <div className="flex justify-end gap-2 pt-1">
          <Button type="button" variant="secondary" onClick={onClose}>
            {state.status === "success" ? t("close") : t("cancel")}
          </Button>
          {state.status !== "success" ? (
            <Button type="submit" disabled={pending}>
              {pending ? t("sending") : t("send")}
            </Button>
          ) : null}
        </div>
      </form>
    </Modal>
  );
}
