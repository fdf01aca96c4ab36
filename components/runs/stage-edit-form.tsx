"use client";

import { useLocale, useTranslations } from "next-intl";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { initialFormState, type FormState } from "@/lib/actions/form-state";
import { numberInput } from "@/lib/contracts/form-input";
import type { RunDto, RunStageDto } from "@/lib/contracts/runs";

const waxMethods = ["stamp", "screen"] as const;
const dyeMethods = ["bath", "brush"] as const;
const faces = ["front", "back", "both"] as const;

/** A stage's plan for work, edited in place (folded away until opened): days, plan, recipe, faces, stamps, notes. */
export function StageEditForm({
  action,
  run,
  stage,
  recipes,
  plans,
}: {
  action: (prev: FormState, form: FormData) => Promise<FormState>;
  run: RunDto;
  stage: RunStageDto;
  recipes: { id: string; name: string }[];
  plans: { id: string; name: string }[];
}) {
  const t = useTranslations();
  const locale = useLocale();
  const [state, formAction, pending] = useActionState(action, initialFormState);
  const e = state.fieldErrors ?? {};
  const failed = state.status === "error";
  const v = (name: string, current: string) => (failed ? (state.values?.[name] ?? "") : current);
  const id = (name: string) => `stage-${stage.position + 1}-${name}`;
  return (
    <details className="mt-4 rounded-md border border-stone-200" open={failed || undefined}>
      <summary className="cursor-pointer px-3 py-2 text-sm font-medium text-ink-700">{t("runs.stageEdit.open")}</summary>
      <form action={formAction} className="space-y-3 border-t border-stone-200 p-3" aria-label={t("runs.stageEdit.title", { n: stage.position + 1 })} noValidate>
        {state.message ? <Notice tone={failed ? "error" : "success"}>{state.message}</Notice> : null}
        <input type="hidden" name="runId" value={run.id} />
        <input type="hidden" name="stageId" value={stage.id} />
        <input type="hidden" name="version" value={run.version} />
        <div className="grid gap-3 sm:grid-cols-2">
          <Field id={id("start")} label={t("runs.stageEdit.start")} errors={e.plannedStartOn}>
            {(aria) => <input {...aria} type="date" name="plannedStartOn" defaultValue={v("plannedStartOn", stage.plannedStartOn ?? "")} key={`s-${state.status}`} />}
          </Field>
          <Field id={id("end")} label={t("runs.stageEdit.end")} errors={e.plannedEndOn}>
            {(aria) => <input {...aria} type="date" name="plannedEndOn" defaultValue={v("plannedEndOn", stage.plannedEndOn ?? "")} key={`e-${state.status}`} />}
          </Field>
        </div>
        {stage.kind === "wax" ? (
          <>
            <div className="grid gap-3 sm:grid-cols-2">
              <Field id={id("method")} label={t("runs.stage.method")} errors={e.waxMethod}>
                {(aria) => <Select {...aria} name="waxMethod" defaultValue={v("waxMethod", stage.waxMethod ?? "stamp")} options={waxMethods.map((m) => ({ value: m, label: t(`runs.waxMethod.${m}`) }))} />}
              </Field>
              <Field id={id("faces")} label={t("runs.stage.faces")} errors={e.faces}>
                {(aria) => <Select {...aria} name="faces" defaultValue={v("faces", stage.faces ?? "front")} options={faces.map((f) => ({ value: f, label: t(`motifs.faces.${f}`) }))} />}
              </Field>
              <Field id={id("plan")} label={t("runs.stage.plan")} errors={e.planId}>
                {(aria) => <Select {...aria} name="planId" defaultValue={v("planId", stage.plan?.id ?? "")} emptyOption={t("runs.stageEdit.noPlan")} options={plans.map((p) => ({ value: p.id, label: p.name }))} />}
              </Field>
              <Field id={id("recipe")} label={t("runs.stage.recipe")} errors={e.recipeId}>
                {(aria) => <Select {...aria} name="recipeId" defaultValue={v("recipeId", stage.recipe?.id ?? "")} emptyOption={t("runs.stageEdit.noRecipe")} options={recipes.map((r) => ({ value: r.id, label: r.name }))} />}
              </Field>
              <Field id={id("passes")} label={t("runs.stage.passes")} errors={e.passes}>
                {(aria) => <input {...aria} name="passes" inputMode="numeric" defaultValue={v("passes", numberInput(stage.passes, locale))} key={`p-${state.status}`} />}
              </Field>
            </div>
            <Field id={id("stamps")} label={t("runs.stageEdit.stamps")} hint={t("runs.stageEdit.stampsHint")} errors={e.stamps}>
              {(aria) => <textarea {...aria} name="stampCodes" rows={2} defaultValue={v("stampCodes", stage.stamps.map((s) => s.code).join("\n"))} key={`c-${state.status}`} />}
            </Field>
          </>
        ) : stage.kind === "dye" ? (
          <Field id={id("dye")} label={t("runs.stageEdit.dyeMethod")} errors={e.dyeMethod}>
            {(aria) => <Select {...aria} name="dyeMethod" defaultValue={v("dyeMethod", stage.dyeMethod ?? "bath")} options={dyeMethods.map((m) => ({ value: m, label: t(`runs.dyeMethod.${m}`) }))} />}
          </Field>
        ) : null}
        <Field id={id("notes")} label={t("runs.stageEdit.notes")} errors={e.notes}>
          {(aria) => <textarea {...aria} name="notes" rows={2} defaultValue={v("notes", stage.notes ?? "")} key={`n-${state.status}`} />}
        </Field>
        <Button type="submit" disabled={pending}>
          {pending ? t("runs.stageEdit.saving") : t("runs.stageEdit.save")}
        </Button>
      </form>
    </details>
  );
}
