"use client";

import { useTranslations } from "next-intl";
import { useActionState, useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { initialFormState, type FormState } from "@/lib/actions/form-state";
import { damageKinds } from "@/lib/validation/stamps";
import { changeConditionAction, checkoutAction, deleteStampAction, reportDamageAction, returnAction } from "../actions";
import type { StampConditionValue } from "@/lib/validation/stamps";
import { Select } from "@/components/ui/select";

const val = (state: FormState, name: string, fallback = "") => (state.status === "error" ? (state.values?.[name] ?? fallback) : fallback);

function StateNotice({ state }: { state: FormState }) {
  return state.message ? <Notice tone={state.status === "success" ? "success" : "error"}>{state.message}</Notice> : null;
}

export function CheckoutForm({ code, borrowers, defaultDue }: { code: string; borrowers: { id: string; name: string }[]; defaultDue: string }) {
  const t = useTranslations();
  const [state, action, pending] = useActionState(checkoutAction, initialFormState);
  const [who, setWho] = useState(val(state, "borrowerId", ""));
  const other = who === "other" || borrowers.length === 0;
  return (
    <form action={action} className="space-y-3" aria-label={t("stamps.checkout.title")} noValidate>
      <StateNotice state={state} />
      <input type="hidden" name="code" value={code} />
      <Field id="checkout-borrower" label={t("stamps.checkout.borrower")} errors={state.fieldErrors?.borrowerId ?? (other ? undefined : state.fieldErrors?.borrowerName)}>
        {(aria) => (
          <select {...aria} name="borrowerId" value={who} onChange={(e) => setWho(e.target.value)}>
            <option value="">{t("stamps.checkout.choose")}</option>
            {borrowers.map((b) => (
              <option key={b.id} value={b.id}>
                {b.name}
              </option>
            ))}
            <option value="other">{t("stamps.checkout.someoneElse")}</option>
          </select>
        )}
      </Field>
      {other ? (
        <div className="grid gap-3 sm:grid-cols-2">
          <Field id="checkout-name" label={t("stamps.checkout.name")} errors={state.fieldErrors?.borrowerName}>
            {(aria) => <input {...aria} name="borrowerName" autoComplete="off" defaultValue={val(state, "borrowerName")} />}
          </Field>
          <Field id="checkout-email" label={t("stamps.checkout.email")} hint={t("stamps.checkout.emailHint")} errors={state.fieldErrors?.borrowerEmail}>
            {(aria) => <input {...aria} name="borrowerEmail" type="email" autoComplete="off" defaultValue={val(state, "borrowerEmail")} />}
          </Field>
        </div>
      ) : null}
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="checkout-workstation" label={t("stamps.checkout.workstation")} hint={t("stamps.checkout.workstationHint")} errors={state.fieldErrors?.workstation}>
          {(aria) => <input {...aria} name="workstation" autoComplete="off" defaultValue={val(state, "workstation")} />}
        </Field>
        <Field id="checkout-due" label={t("stamps.checkout.due")} errors={state.fieldErrors?.dueOn}>
          {(aria) => <input {...aria} name="dueOn" type="date" defaultValue={val(state, "dueOn", defaultDue)} />}
        </Field>
      </div>
      <Field id="checkout-note" label={t("stamps.checkout.note")} errors={state.fieldErrors?.note}>
        {(aria) => <input {...aria} name="note" autoComplete="off" defaultValue={val(state, "note")} />}
      </Field>
      <Button type="submit" disabled={pending}>
        {pending ? t("stamps.checkout.submitting") : t("stamps.checkout.submit")}
      </Button>
    </form>
  );
}

export function ReturnForm({ code, locations, currentLocationId }: { code: string; locations: { id: string; label: string }[]; currentLocationId: string | null }) {
  const t = useTranslations();
  const [state, action, pending] = useActionState(returnAction, initialFormState);
  return (
    <form action={action} className="space-y-3" aria-label={t("stamps.return.title")} noValidate>
      <StateNotice state={state} />
      <input type="hidden" name="code" value={code} />
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="return-location" label={t("stamps.return.location")} errors={state.fieldErrors?.locationId}>
          {(aria) => (
            <Select {...aria} name="locationId" defaultValue={val(state, "locationId", currentLocationId ?? "")} emptyOption={t("stamps.return.sameLocation")} options={locations.map((l) => ({ value: l.id, label: l.label }))} />
          )}
        </Field>
        <Field id="return-impressions" label={t("stamps.return.impressions")} hint={t("stamps.return.impressionsHint")} errors={state.fieldErrors?.impressions}>
          {(aria) => <input {...aria} name="impressions" inputMode="numeric" defaultValue={val(state, "impressions")} />}
        </Field>
      </div>
      <Field id="return-note" label={t("stamps.return.note")} errors={state.fieldErrors?.note}>
        {(aria) => <input {...aria} name="note" autoComplete="off" defaultValue={val(state, "note")} />}
      </Field>
      <Button type="submit" disabled={pending}>
        {pending ? t("stamps.return.submitting") : t("stamps.return.submit")}
      </Button>
    </form>
  );
}

export function ConditionForm({ code, next }: { code: string; next: readonly StampConditionValue[] }) {
  const t = useTranslations();
  const [state, action, pending] = useActionState(changeConditionAction, initialFormState);
  return (
    <form action={action} className="space-y-3" aria-label={t("stamps.condition.title")} noValidate>
      <StateNotice state={state} />
      <input type="hidden" name="code" value={code} />
      <Field id="condition-note" label={t("stamps.condition.note")} hint={t("stamps.condition.noteHint")} errors={state.fieldErrors?.note}>
        {(aria) => <input {...aria} name="note" autoComplete="off" defaultValue={val(state, "note")} />}
      </Field>
      <div className="flex flex-wrap gap-2">
        {next.map((c) => (
          <Button key={c} type="submit" name="condition" value={c} variant={c === "retired" ? "danger" : "secondary"} disabled={pending}>
            {t(`stamps.condition.to.${c}`)}
          </Button>
        ))}
      </div>
      {state.fieldErrors?.condition ? <p className="text-sm text-red-700">{state.fieldErrors.condition.join(" ")}</p> : null}
    </form>
  );
}

export function DamageForm({ code }: { code: string }) {
  const t = useTranslations();
  const [state, action, pending] = useActionState(reportDamageAction, initialFormState);
  const formKey = state.status === "success" ? state.message : "form";
  return (
    <form key={formKey} action={action} className="space-y-3" aria-label={t("stamps.damage.title")} noValidate>
      <StateNotice state={state} />
      <input type="hidden" name="code" value={code} />
      <Field id="damage-kind" label={t("stamps.damage.kind")} errors={state.fieldErrors?.kind}>
        {(aria) => (
          <Select {...aria} name="kind" defaultValue={val(state, "kind")} emptyOption={t("stamps.damage.choose")} options={damageKinds.map((k) => ({ value: k, label: t(`stamps.damageKinds.${k}`) }))} />
        )}
      </Field>
      <Field id="damage-note" label={t("stamps.damage.note")} hint={t("stamps.damage.noteHint")} errors={state.fieldErrors?.note}>
        {(aria) => <textarea {...aria} name="note" rows={2} defaultValue={val(state, "note")} />}
      </Field>
      <Button type="submit" variant="secondary" disabled={pending}>
        {pending ? t("stamps.damage.submitting") : t("stamps.damage.submit")}
      </Button>
    </form>
  );
}

export function DeleteStamp({ code, version }: { code: string; version: number }) {
  const t = useTranslations();
  const [state, action, pending] = useActionState(deleteStampAction, initialFormState);
  return (
    <form
      action={action}
      onSubmit={(e) => {
        if (!window.confirm(t("stamps.delete.confirm", { code }))) e.preventDefault();
      }}
      className="inline"
    >
      <input type="hidden" name="code" value={code} />
      <input type="hidden" name="version" value={version} />
      <Button type="submit" variant="danger" disabled={pending}>
        {t("stamps.delete.submit")}
      </Button>
      {state.message ? <Notice tone="error" className="mt-2">{state.message}</Notice> : null}
    </form>
  );
}
