"use client";

import { useTranslations } from "next-intl";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { initialFormState, type FormState } from "@/lib/actions/form-state";

type Action = (state: FormState, formData: FormData) => Promise<FormState>;

/** "Copy as a new design" (a name, then the copy opens) and deleting the motif after a confirmation. */
export function MotifActions({ motif, copyAction, deleteAction }: { motif: { id: string; name: string; version: number }; copyAction: Action; deleteAction: Action }) {
  const t = useTranslations("motifs");
  const [copyState, copy, copying] = useActionState(copyAction, initialFormState);
  const [deleteState, remove, deleting] = useActionState(deleteAction, initialFormState);
  const copyFailed = copyState.status === "error";
  return (
    <div className="space-y-4">
      <form action={copy} className="flex flex-wrap items-end gap-2" aria-label={t("actions.copy")} noValidate>
        <input type="hidden" name="id" value={motif.id} />
        <div className="min-w-64 flex-1">
          <Field id="copy-name" label={t("copy.name")} errors={copyState.fieldErrors?.name}>
            {(a) => <input {...a} name="name" defaultValue={copyFailed ? (copyState.values?.name ?? "") : t("copy.defaultName", { name: motif.name })} />}
          </Field>
        </div>
        <Button type="submit" variant="secondary" disabled={copying} className="mb-6">
          {t("actions.copy")}
        </Button>
      </form>
      <form action={remove}>
        <input type="hidden" name="id" value={motif.id} />
        <input type="hidden" name="name" value={motif.name} />
        <input type="hidden" name="version" value={motif.version} />
        {deleteState.status === "error" && deleteState.message ? (
          <Notice tone="error" className="mb-2">
            {deleteState.message}
          </Notice>
        ) : null}
        <ConfirmButton variant="danger" question={`${t("delete.confirmTitle")} ${t("delete.confirmBody")}`} disabled={deleting}>
          {t("actions.delete")}
        </ConfirmButton>
      </form>
    </div>
  );
}
