"use client";

import { useTranslations } from "next-intl";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { initialFormState, type FormState } from "@/lib/actions/form-state";
import { SEASONS, type Season } from "@/lib/wax";

type Action = (state: FormState, formData: FormData) => Promise<FormState>;

/** Copies the recipe under a new name into a season (the dry-season mix → its rainy-season variant). */
export function DuplicateForm({ action, recipeId, suggestedName, season }: { action: Action; recipeId: string; suggestedName: string; season: Season }) {
  const t = useTranslations("waxRoom");
  const [state, formAction, pending] = useActionState(action, initialFormState);
  const failed = state.status === "error";
  const v = (name: string, fallback: string) => (failed ? (state.values?.[name] ?? "") : fallback);
  const e = state.fieldErrors ?? {};
  return (
    <form action={formAction} className="space-y-3" aria-label={t("recipe.duplicateLabel")} noValidate>
      {failed && state.message ? <Notice tone="error">{state.message}</Notice> : null}
      <input type="hidden" name="id" value={recipeId} />
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="duplicate-name" label={t("recipe.duplicateName")} errors={e.name}>
          {(aria) => <input {...aria} name="name" autoComplete="off" defaultValue={v("name", suggestedName)} />}
        </Field>
        <Field id="duplicate-season" label={t("recipe.duplicateSeason")} errors={e.season}>
          {(aria) => <Select {...aria} name="season" defaultValue={v("season", season)} options={SEASONS.map((s) => ({ value: s, label: t(`seasons.${s}`) }))} />}
        </Field>
      </div>
      <Button type="submit" disabled={pending}>
        {pending ? t("recipe.duplicating") : t("recipe.duplicate")}
      </Button>
    </form>
  );
}

/** Archive or restore, and delete (asks first; refused with what points at it when estimates or uses name it). */
export function RecipeLifecycle({ archiveAction, deleteAction, recipe }: { archiveAction: Action; deleteAction: Action; recipe: { id: string; name: string; version: number; archived: boolean } }) {
  const t = useTranslations("waxRoom.recipe");
  const [archiveState, archiveFormAction, archiving] = useActionState(archiveAction, initialFormState);
  const [deleteState, deleteFormAction, deleting] = useActionState(deleteAction, initialFormState);
  const message = deleteState.status === "error" ? deleteState.message : archiveState.message;
  const tone = deleteState.status === "error" || archiveState.status === "error" ? "error" : "success";
  return (
    <div className="space-y-3">
      {message ? <Notice tone={tone}>{message}</Notice> : null}
      <div className="flex flex-wrap gap-3">
        <form action={archiveFormAction}>
          <input type="hidden" name="id" value={recipe.id} />
          <input type="hidden" name="version" value={recipe.version} />
          <input type="hidden" name="archived" value={String(!recipe.archived)} />
          <Button type="submit" variant="secondary" disabled={archiving}>
            {recipe.archived ? t("restore") : t("archive")}
          </Button>
        </form>
        <form action={deleteFormAction}>
          <input type="hidden" name="id" value={recipe.id} />
          <input type="hidden" name="version" value={recipe.version} />
          <input type="hidden" name="name" value={recipe.name} />
          <ConfirmButton variant="danger" disabled={deleting} question={t("deleteConfirm", { name: recipe.name })}>
            {t("delete")}
          </ConfirmButton>
        </form>
      </div>
    </div>
  );
}
