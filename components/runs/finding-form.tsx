"use client";

import { useTranslations } from "next-intl";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { recordFindingAction } from "@/lib/actions/run-records";
import { initialFormState } from "@/lib/actions/form-state";
import { findingKinds, repairs, stageNumber, type RunDto } from "@/lib/contracts/runs";

/**
 * Records a quality finding: the day, its kind, the stage, where on the cloth, how many, the stamp it came from
 * (by code), the repair and its note, and a photo if one was taken. Says when the finding flags its stamp.
 */
export function FindingForm({ run, today }: { run: RunDto; today: string }) {
  const t = useTranslations("runs.findings.form");
  const tk = useTranslations("runs.findingKind");
  const tr = useTranslations("runs.repair");
  const ts = useTranslations("runs.stageKind");
  const [state, formAction, pending] = useActionState(recordFindingAction, initialFormState);
  const failed = state.status === "error";
  const v = (name: string, fallback = "") => (failed ? (state.values?.[name] ?? "") : fallback);
  const e = state.fieldErrors ?? {};
  return (
    <form
      action={formAction}
      className="space-y-4"
      aria-label={t("formLabel")}
      noValidate
    >
      {state.message ? <Notice tone={state.status === "success" ? (state.data?.photoRefused ? "warning" : "success") : "error"}>{state.message}</Notice> : null}
      <input type="hidden" name="runId" value={run.id} />
      <div className="grid gap-4 md:grid-cols-3">
        <Field id="finding-day" label={t("foundOn")} errors={e.foundOn}>
          {(aria) => <input {...aria} name="foundOn" type="date" defaultValue={v("foundOn", today)} />}
        </Field>
        <Field id="finding-kind" label={t("kind")} errors={e.kind}>
          {(aria) => <Select {...aria} name="kind" defaultValue={v("kind", "seeped")} options={findingKinds.map((k) => ({ value: k, label: tk(k) }))} />}
        </Field>
        <Field id="finding-stage" label={t("stage")} errors={e.stageId}>
          {(aria) => (
            <Select
              {...aria}
              name="stageId"
              defaultValue={v("stageId", "")}
              emptyOption={t("noStage")}
              options={run.stages.map((s) => ({ value: s.id, label: s.colourName ? t("stageOptionColour", { n: stageNumber(s), kind: ts(s.kind), colour: s.colourName }) : t("stageOption", { n: stageNumber(s), kind: ts(s.kind) }) }))}
            />
          )}
        </Field>
        <Field id="finding-location" label={t("location")} hint={t("locationHint")} errors={e.location}>
          {(aria) => <input {...aria} name="location" autoComplete="off" defaultValue={v("location")} />}
        </Field>
        <Field id="finding-count" label={t("count")} errors={e.count}>
          {(aria) => <input {...aria} name="count" inputMode="numeric" autoComplete="off" defaultValue={v("count", "1")} />}
        </Field>
        <Field id="finding-stamp" label={t("stampCode")} hint={t("stampHint")} errors={e.stampCode}>
          {(aria) => <input {...aria} name="stampCode" autoComplete="off" defaultValue={v("stampCode")} />}
        </Field>
        <Field id="finding-repair" label={t("repair")} errors={e.repair}>
          {(aria) => <Select {...aria} name="repair" defaultValue={v("repair", "none")} options={repairs.map((r) => ({ value: r, label: tr(r) }))} />}
        </Field>
        <Field id="finding-repair-note" label={t("repairNote")} errors={e.repairNote}>
          {(aria) => <input {...aria} name="repairNote" autoComplete="off" defaultValue={v("repairNote")} />}
        </Field>
        <Field id="finding-photo" label={t("photo")} hint={t("photoHint")} errors={e.photo}>
          {(aria) => <input {...aria} name="photo" type="file" accept="image/png,image/jpeg,image/webp" />}
        </Field>
      </div>
      <Button type="submit" disabled={pending}>
        {pending ? t("recording") : t("record")}
      </Button>
    </form>
  );
}
