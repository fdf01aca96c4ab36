"use client";

import { useTranslations } from "next-intl";
import { useActionState, useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { initialFormState, type FormState } from "@/lib/actions/form-state";

type Action = (prev: FormState, form: FormData) => Promise<FormState>;

/** A keeper's answer to one request: accept (all its stamps at once), or decline with a reason the requester reads. */
export function RequestAnswer({ id, version, canAccept, accept, decline }: { id: string; version: number; canAccept: boolean; accept?: Action; decline: Action }) {
  const t = useTranslations("requests.queue");
  const [acceptState, acceptAction, accepting] = useActionState(accept ?? (async () => initialFormState), initialFormState);
  const [declineState, declineAction, declining] = useActionState(decline, initialFormState);
  const [declineOpen, setDeclineOpen] = useState(false);
  const fieldId = useId();
  const done = acceptState.status === "success" || declineState.status === "success";
  const reason = declineState.status === "error" ? (declineState.values?.reason ?? "") : "";
  return (
    <div className="space-y-2">
      {acceptState.message ? <Notice tone={acceptState.status === "success" ? "success" : "error"}>{acceptState.message}</Notice> : null}
      {declineState.message && declineState.status === "success" ? <Notice tone="success">{declineState.message}</Notice> : null}
      {!done ? (
        <div className="flex flex-wrap items-start gap-2">
          {canAccept && accept ? (
            <form action={acceptAction}>
              <input type="hidden" name="id" value={id} />
              <input type="hidden" name="version" value={version} />
              <Button type="submit" disabled={accepting}>
                {accepting ? t("accepting") : t("accept")}
              </Button>
            </form>
          ) : null}
          {!declineOpen && declineState.status !== "error" ? (
            <Button type="button" variant="secondary" onClick={() => setDeclineOpen(true)}>
              {t("decline")}
            </Button>
          ) : (
            <form action={declineAction} className="flex min-w-72 flex-1 flex-wrap items-end gap-2" aria-label={t("declineLabel")} noValidate>
              <input type="hidden" name="id" value={id} />
              <input type="hidden" name="version" value={version} />
              <div className="min-w-60 flex-1">
                <Field id={`${fieldId}-reason`} label={t("reason")} hint={t("reasonHint")} errors={declineState.fieldErrors?.reason}>
                  {(aria) => <input {...aria} name="reason" autoComplete="off" defaultValue={reason} />}
                </Field>
              </div>
              <Button type="submit" variant="danger" disabled={declining}>
                {declining ? t("declining") : t("declineConfirm")}
              </Button>
              {declineState.status === "error" && !declineState.fieldErrors ? <Notice tone="error">{declineState.message}</Notice> : null}
            </form>
          )}
        </div>
      ) : null}
    </div>
  );
}
