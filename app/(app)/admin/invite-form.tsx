"use client";

import { useTranslations } from "next-intl";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { initialFormState } from "@/lib/actions/form-state";
import { localeNames, locales, type Locale } from "@/lib/i18n/config";
import { roles } from "@/lib/permissions";
import { inviteUserAction } from "./actions";

/** `locale`: the language offered first, the inviter's own (the person invited often shares it). */
export function InviteForm({ locale }: { locale: Locale }) {
  const t = useTranslations();
  const [state, action, pending] = useActionState(inviteUserAction, initialFormState);
  // A successful invitation clears the form (new key); a failed one keeps what was typed.
  const formKey = state.status === "success" ? state.message : "form";
  return (
    <form key={formKey} action={action} aria-label={t("admin.invite.title")} className="grid gap-4 md:grid-cols-[1fr_1fr_12rem_12rem_auto] md:items-start" noValidate>
      {state.message ? (
        <Notice tone={state.status === "success" ? "success" : "error"} className="md:col-span-5">
          {state.message}
        </Notice>
      ) : null}
      <Field id="invite-name" label={t("admin.invite.name")} errors={state.fieldErrors?.name}>
        {(aria) => <input {...aria} name="name" autoComplete="off" defaultValue={state.status === "error" ? state.values?.name : ""} />}
      </Field>
      <Field id="invite-email" label={t("admin.invite.email")} errors={state.fieldErrors?.email}>
        {(aria) => <input {...aria} name="email" type="email" autoComplete="off" defaultValue={state.status === "error" ? state.values?.email : ""} />}
      </Field>
      <Field id="invite-role" label={t("admin.invite.role")} errors={state.fieldErrors?.role}>
        {(aria) => (
          <select {...aria} key={state.status === "error" ? state.values?.role : "designer"} name="role" defaultValue={state.status === "error" ? state.values?.role : "designer"}>
            {roles.map((role) => (
              <option key={role} value={role}>
                {t(`roles.${role}.name`)}
              </option>
            ))}
          </select>
        )}
      </Field>
      <Field id="invite-language" label={t("admin.invite.language")} errors={state.fieldErrors?.locale}>
        {(aria) => (
          <select {...aria} key={state.status === "error" ? state.values?.locale : locale} name="locale" defaultValue={state.status === "error" ? state.values?.locale : locale}>
            {locales.map((l) => (
              <option key={l} value={l} lang={l}>
                {localeNames[l]}
              </option>
            ))}
          </select>
        )}
      </Field>
      <Button type="submit" disabled={pending} className="md:mt-6">
        {pending ? t("admin.invite.submitting") : t("admin.invite.submit")}
      </Button>
    </form>
  );
}
