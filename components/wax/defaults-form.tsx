"use client";

import { useLocale, useTranslations } from "next-intl";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { initialFormState, type FormState } from "@/lib/actions/form-state";
import { numberInput } from "@/lib/contracts/form-input";
import type { WaxDefaultsDto } from "@/lib/contracts/wax";

type Action = (state: FormState, formData: FormData) => Promise<FormState>;

/** The defaults new estimates start from: the rate before any calibration, losses and recovery after the boil-off. */
export function WaxDefaultsForm({ action, defaults }: { action: Action; defaults: WaxDefaultsDto }) {
  const t = useTranslations("waxRoom.defaults");
  const locale = useLocale();
  const [state, formAction, pending] = useActionState(action, initialFormState);
  const failed = state.status === "error";
  const v = (name: string, fallback: number) => (failed ? (state.values?.[name] ?? "") : numberInput(fallback, locale));
  const e = state.fieldErrors ?? {};
  return (
    <form action={formAction} className="space-y-4" aria-label={t("formLabel")} noValidate>
      {state.message ? <Notice tone={state.status === "success" ? "success" : "error"}>{state.message}</Notice> : null}
      <input type="hidden" name="version" value={defaults.version} />
      <div className="grid gap-4 md:grid-cols-3">
        <Field id="defaults-rate" label={t("rate")} hint={t("rateHint")} errors={e.waxRateGPerM2}>
          {(aria) => <input {...aria} name="waxRateGPerM2" inputMode="decimal" defaultValue={v("waxRateGPerM2", defaults.waxRateGPerM2)} />}
        </Field>
        <Field id="defaults-loss" label={t("loss")} errors={e.waxLossPct}>
          {(aria) => <input {...aria} name="waxLossPct" inputMode="decimal" defaultValue={v("waxLossPct", defaults.waxLossPct)} />}
        </Field>
        <Field id="defaults-recovery" label={t("recovery")} errors={e.waxRecoveryPct}>
          {(aria) => <input {...aria} name="waxRecoveryPct" inputMode="decimal" defaultValue={v("waxRecoveryPct", defaults.waxRecoveryPct)} />}
        </Field>
      </div>
      <Button type="submit" variant="secondary" disabled={pending}>
        {pending ? t("saving") : t("save")}
      </Button>
    </form>
  );
}
