"use client";

import { useTranslations } from "next-intl";
import Link from "next/link";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { initialFormState } from "@/lib/actions/form-state";
import { signInAction } from "./actions";

export function SignInForm({ next, notice }: { next?: string; notice?: string }) {
  const t = useTranslations("signin");
  const [state, action, pending] = useActionState(signInAction, initialFormState);
  return (
    <form action={action} className="space-y-4" noValidate>
      <h1 className="text-lg font-semibold">{t("title")}</h1>
      {state.message ? <Notice tone="error">{state.message}</Notice> : notice ? <Notice tone="success">{notice}</Notice> : null}
      <input type="hidden" name="next" value={next ?? "/"} />
      <Field id="email" label={t("email")} errors={state.fieldErrors?.email}>
        {(aria) => <input {...aria} name="email" type="email" autoComplete="username" required defaultValue={state.values?.email} />}
      </Field>
      <Field id="password" label={t("password")} errors={state.fieldErrors?.password}>
        {(aria) => <input {...aria} name="password" type="password" autoComplete="current-password" required />}
      </Field>
      <Button type="submit" className="w-full" disabled={pending}>
        {pending ? t("submitting") : t("submit")}
      </Button>
      <p className="text-center text-sm">
        <Link href="/forgot-password" className="text-ink-700 underline-offset-2 hover:underline">
          {t("forgot")}
        </Link>
      </p>
    </form>
  );
}
