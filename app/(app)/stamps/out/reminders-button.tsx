"use client";

import { useTranslations } from "next-intl";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { initialFormState } from "@/lib/actions/form-state";
import { sendRemindersAction } from "../actions";

/** Sends the overdue reminders; says how many are due and how many were reminded too recently to send again. */
export function RemindersButton({ due, recent, hours }: { due: number; recent: number; hours: number }) {
  const t = useTranslations();
  const [state, action, pending] = useActionState(sendRemindersAction, initialFormState);
  return (
    <form action={action} className="space-y-3">
      {state.message ? <Notice tone={state.status === "success" ? "success" : "error"}>{state.message}</Notice> : null}
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" disabled={pending || due === 0} aria-describedby={recent ? "reminders-recent" : undefined}>
          {pending ? t("overdue.sending") : due === 0 ? t("overdue.noneDue") : t("overdue.sendCount", { count: due })}
        </Button>
        {recent ? (
          <span id="reminders-recent" className="text-sm text-stone-600">
            {t("overdue.recentlyReminded", { count: recent, hours })}
          </span>
        ) : null}
      </div>
    </form>
  );
}
