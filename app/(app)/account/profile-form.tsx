"use client";

import { useTranslations } from "next-intl";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { initialFormState } from "@/lib/actions/form-state";
import { localeNames, locales, type Locale } from "@/lib/i18n/config";
import { updateProfileAction } from "./actions";

export function ProfileForm({ name, unitSystem, locale }: { name: string; unitSystem: "metric" | "imperial"; locale: Locale }) {
  const t = useTranslations("account");
  const [state, action, pending] = useActionState(updateProfileAction, initialFormState);
  return (
    <form action={action} className="space-y-4" noValidate>
      {state.message ? <Notice tone={state.status === "success" ? "success" : "error"}>{state.message}</Notice> : null}
      <Field id="profile-name" label={t("name")} errors={state.fieldErrors?.name}>
        {(aria) => <input {...aria} name="name" autoComplete="name" defaultValue={state.values?.name ?? name} />}
      </Field>
      <Field id="profile-units" label={t("units")} errors={state.fieldErrors?.unitSystem}>
        {(aria) => (
          <select {...aria} key={state.values?.unitSystem ?? unitSystem} name="unitSystem" defaultValue={state.values?.unitSystem ?? unitSystem}>
            <option value="metric">{t("unitsMetric")}</option>
            <option value="imperial">{t("unitsImperial")}</option>
          </select>
        )}
      </Field>
      <Field id="profile-language" label={t("language")} hint={t("languageHint")} errors={state.fieldErrors?.locale}>
        {(aria) => (
          <select {...aria} key={state.values?.locale ?? locale} name="locale" defaultValue={state.values?.locale ?? locale}>
            {locales.map((l) => (
              <option key={l} value={l} lang={l}>
                {localeNames[l]}
              </option>
            ))}
          </select>
        )}
      </Field>
      <Button type="submit" disabled={pending}>
        {pending ? t("saving") : t("save")}
      </Button>
    </form>
  );
}
