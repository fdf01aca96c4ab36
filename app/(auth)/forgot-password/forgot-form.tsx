"use client";

import { useTranslations } from "next-intl";
import Link from "next/link";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { initialFormState } from "@/lib/actions/form-state";
import { forgotPasswordAction } from "./actions";

export function ForgotForm({ minutes }: { minutes: number }) {
  const t = useTranslations("forgot");
  const [state, action, pending] = useActionState(forgotPasswordAction, initialFormState);
  return (
    <form action={action} className="space-y-4" noValidate>
      <h1 className="text-lg font-semibold">{t("title")}</h1>
      <p className="text-sm text-stone-600">{t("intro", { minutes })}</p>
      {state.message ? <Notice tone={state.status === "success" ? "success" : "error"}>{state.message}</Notice> : null}
      <Field id="email" label={t("email")} errors={state.fieldErrors?.email}>
        {(aria) => <input {...aria} name="email" type="email" autoComplete="email" required defaultValue={state.values?.email} />}
      </Field>
      <Button type="submit" className="w-full" disabled={pending}>
        {pending ? t("submitting") : t("submit")}
      </Button>
      <p className="text-center text-sm">
        <Link href="/signin" className="text-ink-700 hover:underline">
          {t("back")}
        </Link>
      </p>
    </form>
  );
}
