"use client";

import Link from "next/link";
import { useLocale, useTranslations } from "next-intl";
import { useActionState, useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { initialFormState, type FormState } from "@/lib/actions/form-state";
import { numberInput } from "@/lib/contracts/form-input";
import { ratioToPercent } from "@/lib/stamps/coverage";
import { lengthInput, massInput, type UnitSystem } from "@/lib/stamps/format";
import { stampConditions } from "@/lib/validation/stamps";
import { Select } from "@/components/ui/select";

export interface StampFormValues {
  code: string;
  name: string;
  widthMm: number | null;
  heightMm: number | null;
  stripDepthMm: number | null;
  weightG: number | null;
  face: "single" | "pair";
  mirrored: boolean;
  twinCode: string | null;
  maker: string | null;
  madeOn: string | null;
  condition: string;
  locationId: string | null;
  coverageRatio: number | null;
  outlinePath: string | null;
  impressionsCount: number;
  notes: string | null;
  tags: string[];
  version?: number;
}

type Action = (state: FormState, formData: FormData) => Promise<FormState>;

/** Adds or edits a stamp; lengths and weight in the person's units, stored in mm and g. */
export function StampForm({
  action,
  initial,
  mode,
  unitSystem,
  locations,
  hidden = {},
  cancelTo,
}: {
  action: Action;
  initial: StampFormValues;
  mode: "create" | "edit";
  unitSystem: UnitSystem;
  locations: { id: string; label: string }[];
  /** Extra hidden fields (a new-stamp request's id and version). */
  hidden?: Record<string, string>;
  cancelTo?: string;
}) {
  const t = useTranslations();
  const locale = useLocale();
  const [state, formAction, pending] = useActionState(action, initialFormState);
  const failed = state.status === "error";
  const v = (name: string, fallback: string) => (failed ? (state.values?.[name] ?? "") : fallback);
  const [face, setFace] = useState(v("face", initial.face));
  const lengthUnit = unitSystem === "imperial" ? "in" : "mm";
  const weightUnit = unitSystem === "imperial" ? "oz" : "g";
  const e = state.fieldErrors ?? {};
  const cancelHref = cancelTo ?? (mode === "edit" ? `/stamps/${encodeURIComponent(initial.code)}` : "/stamps");

  return (
    <form action={formAction} className="space-y-6" aria-label={mode === "edit" ? t("stamps.form.editTitle") : t("stamps.form.newTitle")} noValidate>
      {state.message ? (
        <Notice tone={state.status === "success" ? "success" : "error"}>
          {state.message}
          {state.data?.conflict ? (
            <>
              {" "}
              <Link href={cancelHref} target="_blank" className="underline">
                {t("stamps.form.openLatest")}
              </Link>
            </>
          ) : null}
        </Notice>
      ) : null}
      <input type="hidden" name="unitSystem" value={unitSystem} />
      {Object.entries(hidden).map(([name, value]) => (
        <input key={name} type="hidden" name={name} value={value} />
      ))}
      {mode === "edit" ? (
        <>
          <input type="hidden" name="version" value={initial.version} />
          <input type="hidden" name="originalCode" value={initial.code} />
        </>
      ) : null}

      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-sm font-semibold text-stone-900">{t("stamps.form.identity")}</legend>
        <Field id="stamp-code" label={t("stamps.fields.code")} hint={t("stamps.form.codeHint")} errors={e.code}>
          {(aria) => <input {...aria} name="code" autoComplete="off" defaultValue={v("code", initial.code)} className={`${aria.className} font-mono uppercase`} />}
        </Field>
        <Field id="stamp-name" label={t("stamps.fields.name")} errors={e.name}>
          {(aria) => <input {...aria} name="name" autoComplete="off" defaultValue={v("name", initial.name)} />}
        </Field>
        <Field id="stamp-tags" label={t("stamps.fields.tags")} hint={t("stamps.form.tagsHint")} errors={e.tags}>
          {(aria) => <input {...aria} name="tags" autoComplete="off" defaultValue={v("tags", initial.tags.join(", "))} />}
        </Field>
      </fieldset>

      <fieldset className="grid gap-4 md:grid-cols-4">
        <legend className="mb-2 text-sm font-semibold text-stone-900">{t("stamps.form.size")}</legend>
        <Field id="stamp-width" label={t("stamps.form.width", { unit: lengthUnit })} errors={e.widthMm}>
          {(aria) => <input {...aria} name="widthMm" inputMode="decimal" defaultValue={v("widthMm", numberInput(lengthInput(initial.widthMm, unitSystem), locale))} />}
        </Field>
        <Field id="stamp-height" label={t("stamps.form.height", { unit: lengthUnit })} errors={e.heightMm}>
          {(aria) => <input {...aria} name="heightMm" inputMode="decimal" defaultValue={v("heightMm", numberInput(lengthInput(initial.heightMm, unitSystem), locale))} />}
        </Field>
        <Field id="stamp-depth" label={t("stamps.form.depth", { unit: lengthUnit })} hint={t("stamps.form.depthHint")} errors={e.stripDepthMm}>
          {(aria) => <input {...aria} name="stripDepthMm" inputMode="decimal" defaultValue={v("stripDepthMm", numberInput(lengthInput(initial.stripDepthMm, unitSystem), locale))} />}
        </Field>
        <Field id="stamp-weight" label={t("stamps.form.weight", { unit: weightUnit })} errors={e.weightG}>
          {(aria) => <input {...aria} name="weightG" inputMode="decimal" defaultValue={v("weightG", numberInput(massInput(initial.weightG, unitSystem), locale))} />}
        </Field>
      </fieldset>

      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-sm font-semibold text-stone-900">{t("stamps.form.faces")}</legend>
        <Field id="stamp-face" label={t("stamps.fields.face")} hint={t("stamps.form.faceHint")} errors={e.face}>
          {(aria) => (
            <select {...aria} name="face" value={face} onChange={(ev) => setFace(ev.target.value)}>
              <option value="single">{t("stamps.faces.single")}</option>
              <option value="pair">{t("stamps.faces.pair")}</option>
            </select>
          )}
        </Field>
        <Field id="stamp-twin" label={t("stamps.fields.twinCode")} hint={face === "pair" ? t("stamps.form.twinHint") : t("stamps.form.twinSingle")} errors={e.twinCode}>
          {(aria) => <input {...aria} name="twinCode" autoComplete="off" disabled={face !== "pair"} defaultValue={v("twinCode", initial.twinCode ?? "")} className={`${aria.className} font-mono uppercase disabled:bg-stone-100`} />}
        </Field>
        <label className="flex items-center gap-2 self-center text-sm text-stone-800 md:mt-5">
          <input type="checkbox" name="mirrored" defaultChecked={failed ? state.values?.mirrored === "on" : initial.mirrored} />
          {t("stamps.fields.mirrored")}
        </label>
      </fieldset>

      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-sm font-semibold text-stone-900">{t("stamps.form.placeAndState")}</legend>
        <Field id="stamp-location" label={t("stamps.fields.location")} errors={e.locationId}>
          {(aria) => (
            <Select {...aria} name="locationId" defaultValue={v("locationId", initial.locationId ?? "")} emptyOption={t("stamps.form.noLocation")} options={locations.map((l) => ({ value: l.id, label: l.label }))} />
          )}
        </Field>
        {mode === "create" ? (
          <Field id="stamp-condition" label={t("stamps.fields.condition")} errors={e.condition}>
            {(aria) => (
              <Select {...aria} name="condition" defaultValue={v("condition", initial.condition)} options={stampConditions.map((c) => ({ value: c, label: t(`stamps.conditions.${c}`) }))} />
            )}
          </Field>
        ) : (
          <p className="self-center text-sm text-stone-600 md:mt-5">{t("stamps.form.conditionElsewhere")}</p>
        )}
        {mode === "edit" ? (
          <div className="space-y-1">
            <p className="block text-sm font-medium text-stone-800">{t("stamps.fields.impressionsCount")}</p>
            <p className="text-sm text-stone-900" data-testid="impressions-count">
              {t("stamps.form.impressionsCount", { count: initial.impressionsCount })}
            </p>
            <p className="text-xs text-stone-500">{t("stamps.form.impressionsReadOnly")}</p>
          </div>
        ) : null}
      </fieldset>

      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-sm font-semibold text-stone-900">{t("stamps.form.origin")}</legend>
        <Field id="stamp-maker" label={t("stamps.fields.maker")} errors={e.maker}>
          {(aria) => <input {...aria} name="maker" autoComplete="off" defaultValue={v("maker", initial.maker ?? "")} />}
        </Field>
        <Field id="stamp-made" label={t("stamps.fields.madeOn")} errors={e.madeOn}>
          {(aria) => <input {...aria} name="madeOn" type="date" defaultValue={v("madeOn", initial.madeOn ?? "")} />}
        </Field>
        <div className="space-y-2">
          <Field id="stamp-coverage" label={t("stamps.form.coverage")} hint={t("stamps.form.coverageHint")} errors={e.coveragePct}>
            {(aria) => (
              <input {...aria} name="coveragePct" inputMode="decimal" defaultValue={v("coveragePct", initial.coverageRatio !== null ? numberInput(ratioToPercent(initial.coverageRatio), locale) : "")} />
            )}
          </Field>
          {state.data?.lowCoverage ? (
            <label className="flex items-start gap-2 text-sm text-stone-800">
              <input type="checkbox" name="confirmLowCoverage" className="mt-0.5" />
              {t("stamps.form.coverageKeepLow", { typed: state.values?.coveragePct ?? "" })}
            </label>
          ) : null}
        </div>
      </fieldset>

      <fieldset className="grid gap-4 md:grid-cols-2">
        <legend className="mb-2 text-sm font-semibold text-stone-900">{t("stamps.form.more")}</legend>
        <Field id="stamp-outline" label={t("stamps.fields.outlinePath")} hint={t("stamps.form.outlineHint")} errors={e.outlinePath}>
          {(aria) => <textarea {...aria} name="outlinePath" rows={3} defaultValue={v("outlinePath", initial.outlinePath ?? "")} className={`${aria.className} font-mono text-xs`} />}
        </Field>
        <Field id="stamp-notes" label={t("stamps.fields.notes")} errors={e.notes}>
          {(aria) => <textarea {...aria} name="notes" rows={3} defaultValue={v("notes", initial.notes ?? "")} />}
        </Field>
      </fieldset>

      {e._form ? <Notice tone="error">{e._form.join(" ")}</Notice> : null}
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={pending}>
          {pending ? t("stamps.form.saving") : mode === "edit" ? t("stamps.form.save") : t("stamps.form.create")}
        </Button>
        <Link href={cancelHref} className="text-sm text-stone-600 hover:underline">
          {t("stamps.form.cancel")}
        </Link>
      </div>
    </form>
  );
}
