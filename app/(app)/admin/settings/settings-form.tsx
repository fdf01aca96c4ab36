"use client";

import { useRouter } from "next/navigation";
import { useFormatter, useNow, useTranslations } from "next-intl";
import { useActionState, useEffect, useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { initialFormState } from "@/lib/actions/form-state";
import { Select } from "@/components/ui/select";
import { isTimeZone } from "@/lib/time-zone";
import { currencies, type WorkshopSettings } from "@/lib/validation/settings";
import { updateSettingsAction } from "./actions";

/** The workshop settings; each setting one field. The version guards against saving over someone else's change. */
export function SettingsForm({ settings, version, timeZones }: { settings: WorkshopSettings; version: number; timeZones: string[] }) {
  const t = useTranslations("settings");
  const format = useFormatter();
  const now = useNow({ updateInterval: 30_000 });
  const router = useRouter();
  const [state, action, pending] = useActionState(updateSettingsAction, initialFormState);
  const failed = state.status === "error";
  const [timeZone, setTimeZone] = useState(failed ? (state.values?.timeZone ?? settings.timeZone) : settings.timeZone);
  const errorsAt = (path: string) => state.fieldErrors?.[path];
  // The saved cloths and one blank row to add another; a refused form shows what was typed.
  const typed = failed && state.valueLists ? state.valueLists : null;
  const presetRows = typed
    ? (typed.presetName ?? []).map((name, k) => ({ name, widthMm: typed.presetWidthMm?.[k] ?? "", marginMm: typed.presetMarginMm?.[k] ?? "" }))
    : [...settings.clothPresets.map((p) => ({ name: p.name, widthMm: String(p.widthMm), marginMm: String(p.marginMm) })), { name: "", widthMm: "", marginMm: "" }];
  // Pages rendered for this save still carry the old zone; the next render has the new one.
  useEffect(() => {
    if (state.status === "success") router.refresh();
  }, [state, router]);
  return (
    <form action={action} className="space-y-4" aria-label={t("formLabel")} noValidate>
      {state.message ? <Notice tone={state.status === "success" ? "success" : "error"}>{state.message}</Notice> : null}
      <input type="hidden" name="version" value={version} />
      <Field id="settings-time-zone" label={t("fields.timeZone.label")} hint={t("fields.timeZone.hint")} errors={state.fieldErrors?.timeZone}>
        {(aria) => (
          <>
            <input {...aria} name="timeZone" list="settings-time-zones" autoComplete="off" value={timeZone} onChange={(e) => setTimeZone(e.target.value)} />
            <datalist id="settings-time-zones">
              {timeZones.map((zone) => (
                <option key={zone} value={zone} />
              ))}
            </datalist>
          </>
        )}
      </Field>
      <p className="text-sm text-stone-600" data-testid="time-zone-preview" suppressHydrationWarning>
        {isTimeZone(timeZone.trim()) ? t("fields.timeZone.preview", { now: format.dateTime(now, { dateStyle: "full", timeStyle: "short", timeZone: timeZone.trim() }) }) : t("fields.timeZone.unknown")}
      </p>
      <Field id="settings-currency" label={t("fields.currency.label")} hint={t("fields.currency.hint")} errors={state.fieldErrors?.currency}>
        {(aria) => (
          <Select
            {...aria}
            name="currency"
            defaultValue={failed ? (state.values?.currency ?? settings.currency) : settings.currency}
            options={currencies.map((c) => ({ value: c, label: t(`fields.currency.options.${c}`) }))}
          />
        )}
      </Field>
      <fieldset className="space-y-2" aria-describedby="settings-presets-hint">
        <legend className="text-sm font-medium text-stone-800">{t("fields.clothPresets.label")}</legend>
        <p id="settings-presets-hint" className="text-xs text-stone-500">
          {t("fields.clothPresets.hint")}
        </p>
        {presetRows.map((p, k) => (
          <div key={k} className="grid grid-cols-[2fr_1fr_1fr] gap-2" role="group" aria-label={t("fields.clothPresets.row", { n: k + 1 })}>
            <Field id={`settings-preset-${k}-name`} label={t("fields.clothPresets.name")} errors={errorsAt(`clothPresets.${k}.name`)}>
              {(aria) => <input {...aria} name="presetName" autoComplete="off" defaultValue={p.name} />}
            </Field>
            <Field id={`settings-preset-${k}-width`} label={t("fields.clothPresets.widthMm")} errors={errorsAt(`clothPresets.${k}.widthMm`)}>
              {(aria) => <input {...aria} name="presetWidthMm" inputMode="decimal" autoComplete="off" defaultValue={p.widthMm} />}
            </Field>
            <Field id={`settings-preset-${k}-margin`} label={t("fields.clothPresets.marginMm")} errors={errorsAt(`clothPresets.${k}.marginMm`)}>
              {(aria) => <input {...aria} name="presetMarginMm" inputMode="decimal" autoComplete="off" defaultValue={p.marginMm} />}
            </Field>
          </div>
        ))}
        {state.fieldErrors?.clothPresets ? <p className="text-sm text-red-700">{state.fieldErrors.clothPresets.join(" ")}</p> : null}
      </fieldset>
      <Field id="settings-rate" label={t("fields.impressionsPerHour.label")} hint={t("fields.impressionsPerHour.hint")} errors={state.fieldErrors?.impressionsPerHour}>
        {(aria) => <input {...aria} name="impressionsPerHour" inputMode="decimal" autoComplete="off" defaultValue={failed ? (state.values?.impressionsPerHour ?? "") : String(settings.impressionsPerHour)} />}
      </Field>
      <Button type="submit" disabled={pending}>
        {pending ? t("saving") : t("save")}
      </Button>
    </form>
  );
}
