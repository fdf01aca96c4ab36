"use client";

import Link from "next/link";
import { useTranslations } from "next-intl";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { initialFormState, type FormState } from "@/lib/actions/form-state";
import type { UnitSystem } from "@/lib/stamps/format";

const roles = ["main", "filler", "border", "corner", "reverse_twin"] as const;

/** What the file picker offers; the server decides from the bytes (lib/scans), never from this. */
export const sketchAccept = "image/png,image/jpeg,image/webp";

/** A motif's new-stamp request: the size in the person's unit (inches for imperial), the role the stamp will play in the set, a note for the maker. */
export function NewStampRequestForm({ action, motifId, backTo, unitSystem }: { action: (prev: FormState, form: FormData) => Promise<FormState>; motifId: string; backTo: string; unitSystem: UnitSystem }) {
  const t = useTranslations();
  const [state, formAction, pending] = useActionState(action, initialFormState);
  const e = state.fieldErrors ?? {};
  const unit = unitSystem === "imperial" ? "in" : "mm";
  const v = (name: string, fallback = "") => (state.status === "error" ? (state.values?.[name] ?? fallback) : fallback);
  return (
    <form action={formAction} className="max-w-xl space-y-4" aria-label={t("requests.ask.title")} noValidate>
      {state.message ? <Notice tone={state.status === "success" ? "success" : "error"}>{state.message}</Notice> : null}
      <input type="hidden" name="motifId" value={motifId} />
      <input type="hidden" name="unit" value={unit} />
      <div className="grid gap-4 sm:grid-cols-2">
        <Field id="ask-width" label={t("requests.ask.width", { unit })} errors={e.widthMm}>
          {(aria) => <input {...aria} name="width" inputMode="decimal" defaultValue={v("width")} key={`w-${state.status}`} />}
        </Field>
        <Field id="ask-height" label={t("requests.ask.height", { unit })} errors={e.heightMm}>
          {(aria) => <input {...aria} name="height" inputMode="decimal" defaultValue={v("height")} key={`h-${state.status}`} />}
        </Field>
      </div>
      <Field id="ask-role" label={t("requests.ask.role")} errors={e.role ?? e.motifId}>
        {(aria) => <Select {...aria} name="role" defaultValue={v("role", "filler")} options={roles.map((r) => ({ value: r, label: t(`motifs.roles.${r}`) }))} />}
      </Field>
      <Field id="ask-note" label={t("requests.ask.note")} errors={e.note}>
        {(aria) => <textarea {...aria} name="note" rows={3} defaultValue={v("note")} key={`n-${state.status}`} />}
      </Field>
      <Field id="ask-sketch" label={t("requests.ask.sketch")} hint={t("requests.ask.sketchHint")} errors={e.sketch}>
        {(aria) => <input {...aria} type="file" name="sketch" accept={sketchAccept} key={`s-${state.status}`} />}
      </Field>
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={pending}>
          {pending ? t("requests.ask.sending") : t("requests.ask.send")}
        </Button>
        <Link href={backTo} className="text-sm text-stone-600 hover:underline">
          {t("requests.ask.cancel")}
        </Link>
      </div>
    </form>
  );
}
