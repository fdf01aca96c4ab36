"use client";

import { useTranslations } from "next-intl";
import { useActionState, useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { recordProgressAction } from "@/lib/actions/run-records";
import { initialFormState } from "@/lib/actions/form-state";
import { stageNumber, type RunDto, type RunStageDto } from "@/lib/contracts/runs";

/**
 * A day's work at a stage, by its kind. A waxing: the day, metres, impressions (one stamp, or counted from the
 * plan), the wax — grams used, or the pot weighed before and after (plus any wax added) — and "stage finished".
 * Dyeing and bleaching: metres or pieces. The boil-off: the wax recovered. Masses in g (the form's adapter
 * reads grams); numbers as the person's language writes them.
 */
export function ProgressForm({ run, stage, today }: { run: RunDto; stage: RunStageDto; today: string }) {
  const t = useTranslations("runs.work.progressForm");
  const tk = useTranslations("runs.stageKind");
  const [state, formAction, pending] = useActionState(recordProgressAction, initialFormState);
  const failed = state.status === "error";
  const v = (name: string, fallback = "") => (failed ? (state.values?.[name] ?? "") : fallback);
  const e = state.fieldErrors ?? {};
  const [weighing, setWeighing] = useState(v("weighing", "pot") === "grams" ? "grams" : "pot");
  const id = (name: string) => `progress-${stage.id}-${name}`;
  const n = stageNumber(stage);
  const oneStamp = stage.stamps.length <= 1;
  return (
    <form action={formAction} className="space-y-4" aria-label={t("formLabel", { n, kind: tk(stage.kind) })} noValidate>
      {state.message ? <Notice tone={state.status === "success" ? "success" : "error"}>{state.message}</Notice> : null}
      <input type="hidden" name="runId" value={run.id} />
      <input type="hidden" name="stageId" value={stage.id} />
      <div className="grid gap-4 md:grid-cols-3">
        <Field id={id("day")} label={t("doneOn")} errors={e.doneOn}>
          {(aria) => <input {...aria} name="doneOn" type="date" defaultValue={v("doneOn", today)} />}
        </Field>
        {stage.kind === "boil_off" ? (
          <Field id={id("recovered")} label={t("recoveredG")} hint={t("recoveredHint")} errors={e.recoveredG}>
            {(aria) => <input {...aria} name="recoveredG" inputMode="decimal" autoComplete="off" defaultValue={v("recoveredG")} />}
          </Field>
        ) : (
          <Field id={id("metres")} label={t("metres")} errors={e.metres}>
            {(aria) => <input {...aria} name="metres" inputMode="decimal" autoComplete="off" defaultValue={v("metres")} />}
          </Field>
        )}
        {stage.kind === "dye" || stage.kind === "bleach" ? (
          <Field id={id("pieces")} label={t("pieces")} hint={t("piecesHint")} errors={e.pieces}>
            {(aria) => <input {...aria} name="pieces" inputMode="numeric" autoComplete="off" defaultValue={v("pieces")} />}
          </Field>
        ) : null}
        {stage.kind === "wax" && oneStamp ? (
          <Field id={id("impressions")} label={t("impressions")} hint={t("impressionsHint")} errors={e.impressions}>
            {(aria) => <input {...aria} name="impressions" inputMode="numeric" autoComplete="off" defaultValue={v("impressions")} />}
          </Field>
        ) : null}
      </div>
      {stage.kind === "wax" && !oneStamp ? <p className="text-sm text-stone-600">{t("impressionsFromPlan")}</p> : null}

      {stage.kind === "wax" ? (
        <fieldset className="space-y-3">
          <legend className="text-sm font-semibold text-stone-900">{t("wax")}</legend>
          <div className="flex flex-wrap gap-4 text-sm">
            <label className="flex items-center gap-1.5">
              <input type="radio" name="weighing" value="pot" checked={weighing === "pot"} onChange={() => setWeighing("pot")} />
              {t("weighingPot")}
            </label>
            <label className="flex items-center gap-1.5">
              <input type="radio" name="weighing" value="grams" checked={weighing === "grams"} onChange={() => setWeighing("grams")} />
              {t("weighingGrams")}
            </label>
          </div>
          {weighing === "grams" ? (
            <div className="grid gap-4 md:grid-cols-3">
              <Field id={id("grams")} label={t("gramsUsed")} errors={e.gramsUsed}>
                {(aria) => <input {...aria} name="gramsUsed" inputMode="decimal" autoComplete="off" defaultValue={v("gramsUsed")} />}
              </Field>
            </div>
          ) : (
            <div className="grid gap-4 md:grid-cols-3">
              <Field id={id("pot-before")} label={t("potBefore")} errors={e.potBeforeG ?? e.gramsUsed}>
                {(aria) => <input {...aria} name="potBeforeG" inputMode="decimal" autoComplete="off" defaultValue={v("potBeforeG")} />}
              </Field>
              <Field id={id("pot-added")} label={t("potAdded")} hint={t("potAddedHint")} errors={e.potAddedG}>
                {(aria) => <input {...aria} name="potAddedG" inputMode="decimal" autoComplete="off" defaultValue={v("potAddedG")} />}
              </Field>
              <Field id={id("pot-after")} label={t("potAfter")} errors={e.potAfterG}>
                {(aria) => <input {...aria} name="potAfterG" inputMode="decimal" autoComplete="off" defaultValue={v("potAfterG")} />}
              </Field>
            </div>
          )}
        </fieldset>
      ) : null}

      <div className="grid gap-4 md:grid-cols-3">
        <Field id={id("note")} label={t("note")} errors={e.note}>
          {(aria) => <input {...aria} name="note" autoComplete="off" defaultValue={v("note")} />}
        </Field>
      </div>
      <label className="flex items-center gap-2 text-sm text-stone-800">
        <input type="checkbox" name="finished" defaultChecked={failed && state.values?.finished === "on"} key={`${state.status}-${state.values?.finished ?? ""}`} />
        {t("finished")}
      </label>
      {e.stampImpressions || e.recipeId || e.waxedAreaPerMetreM2 ? (
        <Notice tone="error">{[...(e.stampImpressions ?? []), ...(e.recipeId ?? []), ...(e.waxedAreaPerMetreM2 ?? [])].join(" ")}</Notice>
      ) : null}
      <Button type="submit" disabled={pending}>
        {pending ? t("recording") : t("record")}
      </Button>
    </form>
  );
}
