"use client";

import { useTranslations } from "next-intl";
import Link from "next/link";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { initialFormState } from "@/lib/actions/form-state";
import { setPasswordAction } from "./actions";

export function SetPasswordForm({ token }: { token: string }) {
  const t = useTranslations("setPassword");
  const [state, action, pending] = useActionState(setPasswordAction, initialFormState);
  const tokenError = state.fieldErrors?.token ?? (state.message && !state.fieldErrors ? [state.message] : undefined);
  return (
    <form action={action} className="space-y-4" noValidate>
      <h1 className="text-lg font-semibold">{t("title")}</h1>
      <p className="text-sm text-stone-600">{t("intro")}</p>
      {tokenError ? (
        <Notice tone="error">
          {tokenError.join(" ")}{" "}
          <Link href="/forgot-password" className="font-medium underline">
            {t("requestNew")}
          </Link>
        </Notice>
      ) : null}
      <input type="hidden" name="token" value={token} />
      <Field id="password" label={t("password")} errors={state.fieldErrors?.password}>
        {(aria) => <input {...aria} name="password" type="password" autoComplete="new-password" minLength={10} required />}
      </Field>
      <Field id="confirm" label={t("confirm")} errors={state.fieldErrors?.confirm}>
        {(aria) => <input {...aria} name="confirm" type="password" autoComplete="new-password" required />}
      </Field>
      <Button type="submit" className="w-full" disabled={pending}>
        {pending ? t("submitting") : t("submit")}
      </Button>
    </form>
  );
}
