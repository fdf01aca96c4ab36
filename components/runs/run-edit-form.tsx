"use client";

import Link from "next/link";
import { useLocale, useTranslations } from "next-intl";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { RunSizeFields } from "./run-size-fields";
import { initialFormState, type FormState } from "@/lib/actions/form-state";
import { numberInput } from "@/lib/contracts/form-input";
import { runPages, runStates, type RunDto } from "@/lib/contracts/runs";

type Action = (prev: FormState, form: FormData) => Promise<FormState>;

/** The run's own fields and its state (stop with a reason, take up again, finish); deleting a run without records. */
export function RunEditForm({ action, deleteAction, run }: { action: Action; deleteAction: Action; run: RunDto }) {
  const t = useTranslations();
  const locale = useLocale();
  const [state, formAction, pending] = useActionState(action, initialFormState);
  const [deleteState, deleteFormAction, deleting] = useActionState(deleteAction, initialFormState);
  const failed = state.status === "error";
  const e = state.fieldErrors ?? {};
  const v = (name: string, current: string) => (failed ? (state.values?.[name] ?? "") : current);
  const k = (name: string) => `${name}-${state.status}`;
  return (
    <div className="max-w-2xl space-y-8">
      <form action={formAction} className="space-y-4" aria-label={t("runs.edit.title")} noValidate>
        {state.message ? <Notice tone={failed ? "error" : "success"}>{state.message}</Notice> : null}
        <input type="hidden" name="runId" value={run.id} />
        <input type="hidden" name="version" value={run.version} />
        <Field id="edit-name" label={t("runs.form.name")} errors={e.name}>
          {(aria) => <input {...aria} name="name" defaultValue={v("name", run.name)} key={k("name")} />}
        </Field>
        <Field id="edit-cloth" label={t("runs.form.cloth")} errors={e.cloth}>
          {(aria) => <input {...aria} name="cloth" defaultValue={v("cloth", run.cloth)} key={k("cloth")} />}
        </Field>
        <RunSizeFields idPrefix="edit" errors={e} values={{ metres: v("metres", numberInput(run.size.metres ?? run.size.totalMetres, locale)), pieces: v("pieces", numberInput(run.size.pieces, locale)), pieceLengthCm: v("pieceLengthCm", numberInput(run.size.pieceLengthMm === null ? null : run.size.pieceLengthMm / 10, locale)) }} initialSizeBy={(failed ? state.values?.sizeBy : run.size.pieces ? "pieces" : "metres") === "pieces" ? "pieces" : "metres"} stateKey={state.status} />
        <Field id="edit-due" label={t("runs.form.dueOn")} errors={e.dueOn}>
          {(aria) => <input {...aria} type="date" name="dueOn" defaultValue={v("dueOn", run.dueOn ?? "")} key={k("dueOn")} />}
        </Field>
        <div className="grid gap-3 sm:grid-cols-2">
          <Field id="edit-state" label={t("runs.edit.state")} hint={t("runs.edit.stateHint")} errors={e.state}>
            {(aria) => <Select {...aria} name="state" defaultValue={v("state", run.state)} options={runStates.map((s) => ({ value: s, label: t(`runs.state.${s}`) }))} />}
          </Field>
          <Field id="edit-state-note" label={t("runs.edit.stateNote")} errors={e.stateNote}>
            {(aria) => <input {...aria} name="stateNote" defaultValue={v("stateNote", run.stateNote ?? "")} key={k("stateNote")} />}
          </Field>
        </div>
        <Field id="edit-notes" label={t("runs.form.notes")} errors={e.notes}>
          {(aria) => <textarea {...aria} name="notes" rows={3} defaultValue={v("notes", run.notes ?? "")} key={k("notes")} />}
        </Field>
        <div className="flex items-center gap-3">
          <Button type="submit" disabled={pending}>
            {pending ? t("runs.edit.saving") : t("runs.edit.save")}
          </Button>
          <Link href={runPages.one(run.id)} className="text-sm text-stone-600 hover:underline">
            {t("runs.form.cancel")}
          </Link>
        </div>
      </form>
      <form action={deleteFormAction} className="space-y-2 rounded-md border border-red-200 bg-red-50 p-4" aria-label={t("runs.edit.deleteTitle")}>
        <input type="hidden" name="runId" value={run.id} />
        <input type="hidden" name="version" value={run.version} />
        <h2 className="text-sm font-semibold text-red-900">{t("runs.edit.deleteTitle")}</h2>
        <p className="text-sm text-red-900">{t("runs.edit.deleteIntro")}</p>
        {deleteState.message ? <Notice tone="error">{deleteState.message}</Notice> : null}
        <ConfirmButton variant="danger" question={t("runs.edit.deleteConfirm", { name: run.name })} disabled={deleting}>
          {t("runs.edit.delete")}
        </ConfirmButton>
      </form>
    </div>
  );
}
