"use client";

import { useTranslations } from "next-intl";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { initialFormState } from "@/lib/actions/form-state";
import { sendRemindersAction } from "../actions";

export function RemindersButton() {
  const t = useTranslations();
  const [state, action, pending] = useActionState(sendRemindersAction, initialFormState);
  return (
    <form action={action} className="space-y-3">
      {state.message ? <Notice tone={state.status === "success" ? "success" : "error"}>{state.message}</Notice> : null}
      <Button type="submit" disabled={pending}>
        {pending ? t("overdue.sending") : t("overdue.send")}
      </Button>
    </form>
  );
}
