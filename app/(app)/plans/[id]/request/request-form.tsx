"use client";

import Link from "next/link";
import { useTranslations } from "next-intl";
import { startTransition, useActionState, useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { initialFormState } from "@/lib/actions/form-state";
import { planPages } from "@/lib/contracts/plans";
import type { LocationRef } from "@/lib/contracts/stamps";
import { requestStampsAction } from "../../actions";

interface Choice {
  code: string;
  name: string;
  out: boolean;
  location: LocationRef | null;
  checked: boolean;
}

/** Asks the keepers for the plan's stamps: which, for whom, at which workstation, from and until when. */
export function StampRequestForm({ planId, planName, choices, forWhom, fromOn, untilOn }: { planId: string; planName: string; choices: Choice[]; forWhom: string; fromOn: string; untilOn: string }) {
  const t = useTranslations("requests");
  const [state, action, pending] = useActionState(requestStampsAction, initialFormState);
  const failed = state.status === "error";
  const value = (name: string, fallback: string) => (failed ? (state.values?.[name] ?? "") : fallback);
  const e = state.fieldErrors ?? {};
  const [ticked, setTicked] = useState(() => new Set(choices.filter((c) => c.checked).map((c) => c.code)));
  // Sent by hand rather than as a form action, so a refused form keeps every box as it was (React resets forms after actions).
  const submit = (event: React.FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const fd = new FormData(event.currentTarget);
    startTransition(() => action(fd));
  };
  return (
    <form onSubmit={submit} className="space-y-4" aria-label={t("formTitle")} noValidate>
      {state.message ? <Notice tone="error">{state.message}</Notice> : null}
      <input type="hidden" name="planId" value={planId} />
      <fieldset className="space-y-2" aria-describedby={e.stampCodes?.length ? "request-stamps-error" : undefined}>
        <legend className="text-sm font-medium text-stone-800">{t("stamps")}</legend>
        {choices.map((c) => (
          <label key={c.code} className="flex items-center gap-2 text-sm">
            <input
              type="checkbox"
              name="stampCodes"
              value={c.code}
              checked={ticked.has(c.code)}
              onChange={(ev) =>
                setTicked((old) => {
                  const next = new Set(old);
                  if (ev.target.checked) next.add(c.code);
                  else next.delete(c.code);
                  return next;
                })
              }
              aria-invalid={e.stampCodes?.length ? true : undefined} aria-describedby={e.stampCodes?.length ? "request-stamps-error" : undefined} />
            <span className="font-mono">{c.code}</span> · {c.name}
            {c.location ? <span className="text-stone-500"> · {c.location.site} · {c.location.code}</span> : null}
            {c.out ? <span className="rounded-full bg-ink-100 px-2 text-xs text-ink-800">{t("outNow")}</span> : null}
          </label>
        ))}
        <p id="request-stamps-error" className={e.stampCodes?.length ? "text-sm text-red-700" : "sr-only"} aria-live="polite">
          {e.stampCodes?.join(" ")}
        </p>
      </fieldset>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="request-for" label={t("forWhom")} hint={t("forWhomHint")} errors={e.forWhom}>
          {(aria) => <input {...aria} name="forWhom" autoComplete="off" defaultValue={value("forWhom", forWhom)} />}
        </Field>
        <Field id="request-workstation" label={t("workstation")} errors={e.workstation}>
          {(aria) => <input {...aria} name="workstation" autoComplete="off" defaultValue={value("workstation", "")} />}
        </Field>
        <Field id="request-from" label={t("fromOn")} errors={e.fromOn}>
          {(aria) => <input {...aria} name="fromOn" type="date" defaultValue={value("fromOn", fromOn)} />}
        </Field>
        <Field id="request-until" label={t("untilOn")} errors={e.untilOn}>
          {(aria) => <input {...aria} name="untilOn" type="date" defaultValue={value("untilOn", untilOn)} />}
        </Field>
      </div>
      <Field id="request-note" label={t("note")} hint={t("noteHint", { plan: planName })} errors={e.note}>
        {(aria) => <textarea {...aria} name="note" rows={3} defaultValue={value("note", "")} />}
      </Field>
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={pending}>
          {pending ? t("sending") : t("send")}
        </Button>
        <Link href={planPages.one(planId)} className="text-sm text-stone-600 hover:underline">
          {t("cancel")}
        </Link>
      </div>
    </form>
  );
}
