"use client";

import { useTranslations } from "next-intl";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SafetyCautions } from "@/components/wax/safety-cautions";
import { tempUnit } from "@/components/wax/measure";
import { recordReadingAction } from "@/lib/actions/run-records";
import { initialFormState } from "@/lib/actions/form-state";
import { stageNumber, type ReadingWarning, type RunDto, type RunStageDto } from "@/lib/contracts/runs";
import type { UnitSystem } from "@/lib/contracts/wax";

const known: readonly ReadingWarning[] = ["aboveRange", "fumes"];
const warningsOf = (text: string | undefined): ReadingWarning[] => (text ?? "").split(",").filter((w): w is ReadingWarning => (known as readonly string[]).includes(w));

/**
 * A pot reading at a waxing or the boil-off, in °C (°F for people who work in imperial units: the adapter reads
 * `tempF`). The wax cautions stand beside the form, compact; a reading above the recipe's range or above 100 °C
 * answers with its warnings and the cautions at once, prominently (role="alert").
 */
export function ReadingForm({ run, stage, unitSystem }: { run: RunDto; stage: RunStageDto; unitSystem: UnitSystem }) {
  const t = useTranslations("runs.work.readingForm");
  const tw = useTranslations("runs.readingWarning");
  const tk = useTranslations("runs.stageKind");
  const [state, formAction, pending] = useActionState(recordReadingAction, initialFormState);
  const failed = state.status === "error";
  const e = state.fieldErrors ?? {};
  const field = unitSystem === "imperial" ? "tempF" : "tempC";
  const id = (name: string) => `reading-${stage.id}-${name}`;
  const warnings = state.status === "success" ? warningsOf(state.data?.warnings) : [];
  const n = stageNumber(stage);
  return (
    <div className="space-y-3">
      <form action={formAction} className="space-y-4" aria-label={t("formLabel", { n, kind: tk(stage.kind) })} noValidate>
        {state.message && !warnings.length ? <Notice tone={state.status === "success" ? "success" : "error"}>{state.message}</Notice> : null}
        <input type="hidden" name="runId" value={run.id} />
        <input type="hidden" name="stageId" value={stage.id} />
        <div className="grid gap-4 md:grid-cols-3">
          <Field id={id("temp")} label={t("temp", { unit: tempUnit(unitSystem) })} hint={stage.recipe ? t("rangeHint", { recipe: stage.recipe.name }) : undefined} errors={e.tempC}>
            {(aria) => <input {...aria} name={field} inputMode="decimal" autoComplete="off" defaultValue={failed ? (state.values?.[field] ?? "") : ""} />}
          </Field>
          <Field id={id("note")} label={t("note")} errors={e.note}>
            {(aria) => <input {...aria} name="note" autoComplete="off" defaultValue={failed ? (state.values?.note ?? "") : ""} />}
          </Field>
        </div>
        <Button type="submit" disabled={pending}>
          {pending ? t("recording") : t("record")}
        </Button>
      </form>
      {warnings.length ? (
        <div className="space-y-3" data-testid="reading-warnings">
          <div role="alert" className="rounded-md border-2 border-red-400 bg-red-50 px-3.5 py-2.5 text-sm text-red-950">
            <p className="font-semibold">{state.message}</p>
            <ul className="mt-1 list-disc pl-5">
              {warnings.map((w) => (
                <li key={w}>{tw(w, { maxC: stage.recipe?.workingMaxC ?? 0 })}</li>
              ))}
            </ul>
          </div>
          <SafetyCautions variant="alert" headingId={id("cautions-alert")} />
        </div>
      ) : (
        <SafetyCautions variant="compact" headingId={id("cautions")} />
      )}
    </div>
  );
}
