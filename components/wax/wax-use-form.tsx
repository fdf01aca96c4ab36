"use client";

import { useTranslations } from "next-intl";
import { useActionState, useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { initialFormState, type FormState } from "@/lib/actions/form-state";
import type { UnitSystem } from "@/lib/contracts/wax";
import { smallMassUnit } from "./measure";

type Action = (state: FormState, formData: FormData) => Promise<FormState>;

/**
 * Records what a waxing used: the day, recipe, plan (or the waxed area per metre), metres, passes, and the wax —
 * grams used, or the pot weighed before and after (plus any wax added) — with the stamp and its impressions when
 * there is no plan to count them from.
 */
export function WaxUseForm({ action, recipes, plans, cloths, today, unitSystem }: { action: Action; recipes: { id: string; name: string }[]; plans: { id: string; name: string }[]; cloths: string[]; today: string; unitSystem: UnitSystem }) {
  const t = useTranslations("waxRoom.useForm");
  const [state, formAction, pending] = useActionState(action, initialFormState);
  const failed = state.status === "error";
  const v = (name: string, fallback: string) => (failed ? (state.values?.[name] ?? "") : fallback);
  const e = state.fieldErrors ?? {};
  const [weighing, setWeighing] = useState(v("weighing", "grams") === "pot" ? "pot" : "grams");
  const [planId, setPlanId] = useState(v("planId", ""));
  // React resets the form after each answer, and a controlled select would keep its state while showing the reset
  // choice: on each answer, take the answer's choice and draw the select afresh with it as its default.
  const [answered, setAnswered] = useState(state);
  const [round, setRound] = useState(0);
  if (answered !== state) {
    setAnswered(state);
    setRound((r) => r + 1);
    setPlanId(v("planId", ""));
  }
  const unit = smallMassUnit(unitSystem);
  return (
    <form action={formAction} className="space-y-5" aria-label={t("formLabel")} noValidate>
      {state.message ? <Notice tone={state.status === "success" ? "success" : "error"}>{state.message}</Notice> : null}
      <input type="hidden" name="unitSystem" value={unitSystem} />
      <div className="grid gap-4 md:grid-cols-3">
        <Field id="use-day" label={t("usedOn")} errors={e.usedOn}>
          {(aria) => <input {...aria} name="usedOn" type="date" defaultValue={v("usedOn", today)} />}
        </Field>
        <Field id="use-recipe" label={t("recipe")} errors={e.recipeId}>
          {(aria) => <Select {...aria} name="recipeId" defaultValue={v("recipeId", recipes[0]?.id ?? "")} options={recipes.map((r) => ({ value: r.id, label: r.name }))} />}
        </Field>
        <Field id="use-cloth" label={t("cloth")} hint={t("clothHint")} errors={e.cloth}>
          {(aria) => (
            <>
              <input {...aria} name="cloth" list="use-cloths" autoComplete="off" defaultValue={v("cloth", "")} />
              <datalist id="use-cloths">
                {cloths.map((c) => (
                  <option key={c} value={c} />
                ))}
              </datalist>
            </>
          )}
        </Field>
        <Field id="use-plan" label={t("plan")} hint={plans.length ? t("planHint") : t("noPlans")} errors={e.planId}>
          {(aria) => (
            <select {...aria} key={round} name="planId" defaultValue={planId} onChange={(ev) => setPlanId(ev.target.value)} disabled={plans.length === 0}>
              <option value="">{t("noPlan")}</option>
              {plans.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.name}
                </option>
              ))}
            </select>
          )}
        </Field>
        {planId ? null : (
          <Field id="use-area" label={t("area")} hint={t("areaHint")} errors={e.waxedAreaPerMetreM2}>
            {(aria) => <input {...aria} name="waxedAreaPerMetreM2" inputMode="decimal" defaultValue={v("waxedAreaPerMetreM2", "")} />}
          </Field>
        )}
        <Field id="use-metres" label={t("metres")} errors={e.metres}>
          {(aria) => <input {...aria} name="metres" inputMode="decimal" defaultValue={v("metres", "")} />}
        </Field>
        <Field id="use-passes" label={t("passes")} errors={e.passes}>
          {(aria) => <input {...aria} name="passes" inputMode="numeric" defaultValue={v("passes", "1")} />}
        </Field>
      </div>

      <fieldset className="space-y-3">
        <legend className="text-sm font-semibold text-stone-900">{t("wax")}</legend>
        <div className="flex flex-wrap gap-4 text-sm">
          <label className="flex items-center gap-1.5">
            <input type="radio" name="weighing" value="grams" checked={weighing === "grams"} onChange={() => setWeighing("grams")} />
            {t("weighingGrams")}
          </label>
          <label className="flex items-center gap-1.5">
            <input type="radio" name="weighing" value="pot" checked={weighing === "pot"} onChange={() => setWeighing("pot")} />
            {t("weighingPot")}
          </label>
        </div>
        {weighing === "grams" ? (
          <div className="grid gap-4 md:grid-cols-3">
            <Field id="use-grams" label={t("gramsUsed", { unit })} errors={e.gramsUsed}>
              {(aria) => <input {...aria} name="gramsUsed" inputMode="decimal" defaultValue={v("gramsUsed", "")} />}
            </Field>
          </div>
        ) : (
          <div className="grid gap-4 md:grid-cols-3">
            <Field id="use-pot-before" label={t("potBefore", { unit })} errors={e.potBeforeG ?? e.gramsUsed}>
              {(aria) => <input {...aria} name="potBeforeG" inputMode="decimal" defaultValue={v("potBeforeG", "")} />}
            </Field>
            <Field id="use-pot-added" label={t("potAdded", { unit })} hint={t("potAddedHint")} errors={e.potAddedG}>
              {(aria) => <input {...aria} name="potAddedG" inputMode="decimal" defaultValue={v("potAddedG", "")} />}
            </Field>
            <Field id="use-pot-after" label={t("potAfter", { unit })} errors={e.potAfterG}>
              {(aria) => <input {...aria} name="potAfterG" inputMode="decimal" defaultValue={v("potAfterG", "")} />}
            </Field>
          </div>
        )}
      </fieldset>

      {planId ? (
        <p className="text-sm text-stone-600">{t("impressionsFromPlan")}</p>
      ) : (
        <fieldset className="grid gap-4 md:grid-cols-3">
          <legend className="mb-2 text-sm font-semibold text-stone-900">{t("stampTitle")}</legend>
          <Field id="use-stamp" label={t("stampCode")} hint={t("stampHint")} errors={e.stampCode}>
            {(aria) => <input {...aria} name="stampCode" autoComplete="off" defaultValue={v("stampCode", "")} />}
          </Field>
          <Field id="use-impressions" label={t("impressions")} errors={e.impressions}>
            {(aria) => <input {...aria} name="impressions" inputMode="numeric" defaultValue={v("impressions", "")} />}
          </Field>
        </fieldset>
      )}

      <Field id="use-note" label={t("note")} errors={e.note}>
        {(aria) => <input {...aria} name="note" autoComplete="off" defaultValue={v("note", "")} />}
      </Field>
      <Button type="submit" disabled={pending}>
        {pending ? t("recording") : t("record")}
      </Button>
    </form>
  );
}
