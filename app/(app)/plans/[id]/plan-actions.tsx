"use client";

import { useTranslations } from "next-intl";
import { startTransition, useActionState, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { Notice } from "@/components/ui/notice";
import { initialFormState } from "@/lib/actions/form-state";
import { deletePlanAction, duplicatePlanAction, recomputePlanAction } from "../actions";

/** Copy and delete (after asking) for the plan's writers. */
export function PlanActions({ id, version, name }: { id: string; version: number; name: string }) {
  const t = useTranslations("plans.actions");
  const [copyState, copy, copying] = useActionState(duplicatePlanAction, initialFormState);
  const [deleteState, remove, deleting] = useActionState(deletePlanAction, initialFormState);
  const [asking, setAsking] = useState(false);
  const deleteForm = useRef<HTMLFormElement>(null);
  const problem = copyState.message ?? deleteState.message;
  return (
    <div className="flex flex-wrap items-center gap-2 print:hidden">
      <form action={copy}>
        <input type="hidden" name="id" value={id} />
        <Button type="submit" variant="secondary" disabled={copying}>
          {copying ? t("duplicating") : t("duplicate")}
        </Button>
      </form>
      <form ref={deleteForm} action={remove}>
        <input type="hidden" name="id" value={id} />
        <input type="hidden" name="version" value={version} />
        <Button type="button" variant="danger" disabled={deleting} onClick={() => setAsking(true)}>
          {t("delete")}
        </Button>
      </form>
      <ConfirmDialog
        request={asking ? { title: t("deleteTitle"), body: t("deleteBody", { name }), confirmLabel: t("deleteConfirm"), tone: "danger" } : null}
        cancelLabel={t("cancel")}
        onCancel={() => setAsking(false)}
        onConfirm={() => {
          setAsking(false);
          const form = deleteForm.current;
          if (form) startTransition(() => remove(new FormData(form)));
        }}
      />
      {problem ? <Notice tone="error">{problem}</Notice> : null}
    </div>
  );
}

/** Computes the summary again from the stamps as they are now (offered when it is stale). */
export function RecomputeButton({ id, version }: { id: string; version: number }) {
  const t = useTranslations("plans.stale");
  const [state, action, pending] = useActionState(recomputePlanAction, initialFormState);
  return (
    <form action={action} className="mt-2">
      <input type="hidden" name="id" value={id} />
      <input type="hidden" name="version" value={version} />
      <Button type="submit" disabled={pending}>
        {pending ? t("recomputing") : t("recompute")}
      </Button>
      {state.message ? <Notice tone="error" className="mt-2">{state.message}</Notice> : null}
    </form>
  );
}
