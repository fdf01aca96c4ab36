"use client";

import Link from "next/link";
import { useTranslations } from "next-intl";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { RunSizeFields } from "./run-size-fields";
import { initialFormState, type FormState } from "@/lib/actions/form-state";
import { runPages } from "@/lib/contracts/runs";

interface MotifChoice {
  id: string;
  name: string;
  colourways: { id: string; name: string; colours: number }[];
}

/**
 * A new run of a motif's colourway: name, cloth, metres or pieces of a length, the first day of work and the due
 * date, the plan its waxing stamps and the wax recipe. The stages come from the colourway's order of work.
 */
export function RunForm({
  action,
  motif,
  colourwayId,
  plans,
  planId,
  recipes,
  cloths,
  today,
}: {
  action: (prev: FormState, form: FormData) => Promise<FormState>;
  motif: MotifChoice;
  colourwayId: string;
  plans: { id: string; name: string }[];
  planId: string;
  recipes: { id: string; name: string }[];
  cloths: string[];
  today: string;
}) {
  const t = useTranslations();
  const [state, formAction, pending] = useActionState(action, initialFormState);
  const failed = state.status === "error";
  const e = state.fieldErrors ?? {};
  const v = (name: string, fallback = "") => (failed ? (state.values?.[name] ?? fallback) : fallback);
  const chosen = motif.colourways.find((c) => c.id === colourwayId) ?? motif.colourways[0];
  const k = (name: string) => `${name}-${state.status}`;
  return (
    <form action={formAction} className="max-w-2xl space-y-4" aria-label={t("runs.form.title")} noValidate>
      {state.message ? <Notice tone={failed ? "error" : "success"}>{state.message}</Notice> : null}
      <input type="hidden" name="motifId" value={motif.id} />
      <Field id="run-colourway" label={t("runs.form.colourway")} errors={e.colourwayId ?? e.motifId}>
        {(aria) => <Select {...aria} name="colourwayId" defaultValue={v("colourwayId", chosen.id)} options={motif.colourways.map((c) => ({ value: c.id, label: t("runs.form.colourwayOption", { name: c.name, colours: c.colours }) }))} />}
      </Field>
      <Field id="run-name" label={t("runs.form.name")} errors={e.name}>
        {(aria) => <input {...aria} name="name" defaultValue={v("name", `${motif.name} · ${chosen.name}`)} key={k("name")} />}
      </Field>
      <Field id="run-cloth" label={t("runs.form.cloth")} hint={t("runs.form.clothHint")} errors={e.cloth}>
        {(aria) => (
          <>
            <input {...aria} name="cloth" list="run-cloths" defaultValue={v("cloth", cloths[0] ?? "")} key={k("cloth")} />
            <datalist id="run-cloths">
              {cloths.map((c) => (
                <option key={c} value={c} />
              ))}
            </datalist>
          </>
        )}
      </Field>
      <RunSizeFields idPrefix="run" errors={e} values={{ metres: v("metres"), pieces: v("pieces"), pieceLengthCm: v("pieceLengthCm", "250") }} initialSizeBy={(failed ? state.values?.sizeBy : undefined) === "pieces" ? "pieces" : "metres"} stateKey={state.status} />
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="run-start" label={t("runs.form.startOn")} hint={t("runs.form.startHint")} errors={e.startOn}>
          {(aria) => <input {...aria} type="date" name="startOn" defaultValue={v("startOn", today)} key={k("startOn")} />}
        </Field>
        <Field id="run-due" label={t("runs.form.dueOn")} errors={e.dueOn}>
          {(aria) => <input {...aria} type="date" name="dueOn" defaultValue={v("dueOn")} key={k("dueOn")} />}
        </Field>
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="run-plan" label={t("runs.form.plan")} hint={t("runs.form.planHint")} errors={e.planIds ?? e["planIds.0"]}>
          {(aria) => <Select {...aria} name="planId" defaultValue={v("planId", planId)} emptyOption={t("runs.stageEdit.noPlan")} options={plans.map((p) => ({ value: p.id, label: p.name }))} />}
        </Field>
        <Field id="run-recipe" label={t("runs.form.recipe")} errors={e.recipeId}>
          {(aria) => <Select {...aria} name="recipeId" defaultValue={v("recipeId", recipes[0]?.id ?? "")} emptyOption={t("runs.stageEdit.noRecipe")} options={recipes.map((r) => ({ value: r.id, label: r.name }))} />}
        </Field>
      </div>
      <Field id="run-notes" label={t("runs.form.notes")} errors={e.notes}>
        {(aria) => <textarea {...aria} name="notes" rows={3} defaultValue={v("notes")} key={k("notes")} />}
      </Field>
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={pending}>
          {pending ? t("runs.form.creating") : t("runs.form.create")}
        </Button>
        <Link href={runPages.list()} className="text-sm text-stone-600 hover:underline">
          {t("runs.form.cancel")}
        </Link>
      </div>
    </form>
  );
}
