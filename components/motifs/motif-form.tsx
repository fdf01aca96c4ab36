"use client";

import Link from "next/link";
import { useTranslations } from "next-intl";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { initialFormState, type FormState } from "@/lib/actions/form-state";
import type { CollectionDto } from "@/lib/contracts/motifs";

export interface MotifFormValues {
  id?: string;
  version?: number;
  name: string;
  description: string;
  tags: string;
  designer: string;
  firstUsedOn: string;
  notes: string;
  collectionIds: string[];
  stamps: string;
  colourways: string;
}

type Action = (state: FormState, formData: FormData) => Promise<FormState>;

/** Adds or edits a motif: its facts, collections, stamp set (one "CODE role" a line) and colourways (one colour a line under its colourway). */
export function MotifForm({ action, initial, collections, mode, cancelHref }: { action: Action; initial: MotifFormValues; collections: CollectionDto[]; mode: "create" | "edit"; cancelHref: string }) {
  const t = useTranslations();
  const [state, formAction, pending] = useActionState(action, initialFormState);
  const failed = state.status === "error";
  const v = (name: keyof MotifFormValues, fallback: string) => (failed ? (state.values?.[name] ?? "") : fallback);
  const e = state.fieldErrors ?? {};
  const chosen = failed ? new Set(String(state.values?.collectionIds ?? "").split(",").filter(Boolean)) : new Set(initial.collectionIds);
  return (
    <form action={formAction} className="space-y-4" aria-label={mode === "create" ? t("motifs.form.newTitle") : t("motifs.form.save")} noValidate>
      {initial.id ? <input type="hidden" name="id" value={initial.id} /> : null}
      {initial.version ? <input type="hidden" name="version" value={initial.version} /> : null}
      {failed && state.message ? <Notice tone="error">{state.message}</Notice> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <Field id="name" label={t("motifs.fields.name")} errors={e.name}>
          {(a) => <input {...a} name="name" defaultValue={v("name", initial.name)} />}
        </Field>
        <Field id="designer" label={t("motifs.fields.designer")} errors={e.designer}>
          {(a) => <input {...a} name="designer" defaultValue={v("designer", initial.designer)} />}
        </Field>
        <Field id="tags" label={t("motifs.fields.tags")} errors={e.tags} hint={t("motifs.fields.tagsHint")}>
          {(a) => <input {...a} name="tags" defaultValue={v("tags", initial.tags)} />}
        </Field>
        <Field id="firstUsedOn" label={t("motifs.fields.firstUsedOn")} errors={e.firstUsedOn}>
          {(a) => <input {...a} name="firstUsedOn" type="date" defaultValue={v("firstUsedOn", initial.firstUsedOn)} />}
        </Field>
      </div>
      <Field id="description" label={t("motifs.fields.description")} errors={e.description}>
        {(a) => <textarea {...a} name="description" rows={2} defaultValue={v("description", initial.description)} />}
      </Field>
      <fieldset>
        <legend className="text-sm font-medium text-stone-800">{t("motifs.fields.collections")}</legend>
        {collections.length === 0 ? <p className="text-sm text-stone-500">{t("motifs.fields.noCollections")}</p> : null}
        <div className="mt-1 flex flex-wrap gap-4" aria-describedby="collectionIds-error">
          {collections.map((c) => (
            <label key={c.id} className="flex items-center gap-2 text-sm text-stone-800">
              <input type="checkbox" name="collectionIds" value={c.id} defaultChecked={chosen.has(c.id)} />
              {c.name}
            </label>
          ))}
        </div>
        <p id="collectionIds-error" className={e.collectionIds?.length ? "text-sm text-red-700" : "sr-only"} aria-live="polite">
          {e.collectionIds?.join(" ")}
        </p>
      </fieldset>
      <Field id="stamps" label={t("motifs.fields.stamps")} errors={e.stamps} hint={t("motifs.fields.stampsHint")}>
        {(a) => <textarea {...a} name="stamps" rows={4} className={`${a.className} font-mono`} defaultValue={v("stamps", initial.stamps)} />}
      </Field>
      <Field id="colourways" label={t("motifs.fields.colourways")} errors={e.colourways} hint={t("motifs.fields.colourwaysHint")}>
        {(a) => <textarea {...a} name="colourways" rows={8} className={`${a.className} font-mono`} defaultValue={v("colourways", initial.colourways)} />}
      </Field>
      <Field id="notes" label={t("motifs.fields.notes")} errors={e.notes}>
        {(a) => <textarea {...a} name="notes" rows={3} defaultValue={v("notes", initial.notes)} />}
      </Field>
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={pending}>
          {pending ? t("motifs.form.saving") : mode === "create" ? t("motifs.form.create") : t("motifs.form.save")}
        </Button>
        <Link href={cancelHref} className="text-sm text-ink-700 hover:underline">
          {t("motifs.form.cancel")}
        </Link>
      </div>
    </form>
  );
}
