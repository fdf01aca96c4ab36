"use client";

import { useLocale, useTranslations } from "next-intl";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { initialFormState, type FormState } from "@/lib/actions/form-state";
import { numberInput } from "@/lib/contracts/form-input";
import type { Currency, MaterialDto, RecipeRuleBreakDto, UnitSystem } from "@/lib/contracts/wax";
import { poundsToKilograms } from "@/lib/units";
import { inputOf, kgIn, massUnit, tempIn, tempUnit } from "./measure";
import { NoteText } from "./wax-note";

type Action = (state: FormState, formData: FormData) => Promise<FormState>;

/** Adds or changes a material: every figure with the text of its source, temperatures in the person's unit. */
export function MaterialForm({ action, material, unitSystem, currency }: { action: Action; material: MaterialDto | null; unitSystem: UnitSystem; currency: Currency }) {
  const t = useTranslations("waxRoom.materialForm");
  const locale = useLocale();
  const [state, formAction, pending] = useActionState(action, initialFormState);
  const failed = state.status === "error";
  const v = (name: string, fallback: string) => (failed ? (state.values?.[name] ?? "") : fallback);
  const e = state.fieldErrors ?? {};
  const unit = tempUnit(unitSystem);
  const mass = massUnit(unitSystem);
  // A price per lb for imperial: the price per kg × 0.453 592 37.
  const price = material?.pricePerKg == null ? "" : numberInput(unitSystem === "imperial" ? material.pricePerKg * poundsToKilograms(1) : material.pricePerKg, locale, 2);
  const recheck = state.status === "success" && state.data?.recheck ? (JSON.parse(state.data.recheck) as { recipesChecked: number; breaking: RecipeRuleBreakDto[] }) : null;
  return (
    <form action={formAction} className="space-y-5" aria-label={material ? t("editLabel") : t("createLabel")} noValidate>
      {state.message ? <Notice tone={state.status === "success" ? (recheck?.breaking.length ? "warning" : "success") : "error"}>{state.message}</Notice> : null}
      {recheck?.breaking.length ? (
        <ul className="space-y-1 text-sm text-amber-900" data-testid="recheck-breaking">
          {recheck.breaking.map((b) => (
            <li key={b.recipeId}>
              <a href={`/wax/recipes/${b.recipeId}`} className="font-medium underline">
                {b.recipeName}
              </a>
              : <NoteText note={b.problem} />
            </li>
          ))}
        </ul>
      ) : null}
      <input type="hidden" name="unitSystem" value={unitSystem} />
      {material ? (
        <>
          <input type="hidden" name="id" value={material.id} />
          <input type="hidden" name="version" value={material.version} />
        </>
      ) : null}
      <div className="grid gap-4 md:grid-cols-3">
        <Field id="material-name" label={t("name")} errors={e.name}>
          {(aria) => <input {...aria} name="name" autoComplete="off" defaultValue={v("name", material?.name ?? "")} />}
        </Field>
        <Field id="material-code" label={t("code")} hint={t("codeHint")} errors={e.code}>
          {(aria) => <input {...aria} name="code" autoComplete="off" defaultValue={v("code", material?.code ?? "")} />}
        </Field>
        <Field id="material-density" label={t("density")} errors={e.densityGPerCm3}>
          {(aria) => <input {...aria} name="densityGPerCm3" inputMode="decimal" defaultValue={v("densityGPerCm3", material ? numberInput(material.densityGPerCm3, locale) : "")} />}
        </Field>
        <Field id="material-melt-from" label={t("meltFrom", { unit })} errors={e["meltingRangeC.fromC"] ?? e.meltingRangeC}>
          {(aria) => <input {...aria} name="meltFrom" inputMode="decimal" defaultValue={v("meltFrom", inputOf(material?.meltingRangeC.fromC, tempIn, unitSystem, locale, 1))} />}
        </Field>
        <Field id="material-melt-to" label={t("meltTo", { unit })} errors={e["meltingRangeC.toC"]}>
          {(aria) => <input {...aria} name="meltTo" inputMode="decimal" defaultValue={v("meltTo", inputOf(material?.meltingRangeC.toC, tempIn, unitSystem, locale, 1))} />}
        </Field>
        <Field id="material-flash" label={t("flashPoint", { unit })} hint={t("flashPointHint")} errors={e.flashPointC}>
          {(aria) => <input {...aria} name="flashPoint" inputMode="decimal" defaultValue={v("flashPoint", inputOf(material?.flashPointC, tempIn, unitSystem, locale, 1))} />}
        </Field>
        <Field id="material-discolours" label={t("discoloursAbove", { unit })} hint={t("optional")} errors={e.discoloursAboveC}>
          {(aria) => <input {...aria} name="discoloursAbove" inputMode="decimal" defaultValue={v("discoloursAbove", inputOf(material?.discoloursAboveC, tempIn, unitSystem, locale, 1))} />}
        </Field>
        <Field id="material-price" label={t("price", { currency, unit: mass })} hint={t("priceHint")} errors={e.pricePerKg}>
          {(aria) => <input {...aria} name="pricePerKg" inputMode="decimal" defaultValue={v("pricePerKg", price)} />}
        </Field>
        <Field id="material-reorder" label={t("reorderLevel", { unit: mass })} hint={t("reorderHint")} errors={e.reorderLevelKg}>
          {(aria) => <input {...aria} name="reorderLevel" inputMode="decimal" defaultValue={v("reorderLevel", inputOf(material?.reorderLevelKg ?? 0, kgIn, unitSystem, locale, 3))} />}
        </Field>
      </div>
      <fieldset className="grid gap-4 md:grid-cols-2">
        <legend className="mb-2 text-sm font-semibold text-stone-900">{t("sources")}</legend>
        <Field id="material-source-density" label={t("sourceDensity")} errors={e["sources.density"]}>
          {(aria) => <input {...aria} name="sourceDensity" autoComplete="off" defaultValue={v("sourceDensity", material?.sources.density ?? "")} />}
        </Field>
        <Field id="material-source-melting" label={t("sourceMelting")} errors={e["sources.melting"]}>
          {(aria) => <input {...aria} name="sourceMelting" autoComplete="off" defaultValue={v("sourceMelting", material?.sources.melting ?? "")} />}
        </Field>
        <Field id="material-source-flash" label={t("sourceFlashPoint")} errors={e["sources.flashPoint"]}>
          {(aria) => <input {...aria} name="sourceFlashPoint" autoComplete="off" defaultValue={v("sourceFlashPoint", material?.sources.flashPoint ?? "")} />}
        </Field>
        <Field id="material-source-price" label={t("sourcePrice")} errors={e["sources.price"]}>
          {(aria) => <input {...aria} name="sourcePrice" autoComplete="off" defaultValue={v("sourcePrice", material?.sources.price ?? "")} />}
        </Field>
      </fieldset>
      <Button type="submit" disabled={pending}>
        {pending ? t("saving") : material ? t("save") : t("create")}
      </Button>
    </form>
  );
}

const movementKinds = ["receipt", "recovery", "correction"] as const;

/** Records stock coming in (a receipt, wax recovered after the boil-off) or a correction after counting. */
export function MovementForm({ action, materialId, unitSystem }: { action: Action; materialId: string; unitSystem: UnitSystem }) {
  const t = useTranslations("waxRoom.movement");
  const [state, formAction, pending] = useActionState(action, initialFormState);
  const failed = state.status === "error";
  const v = (name: string, fallback: string) => (failed ? (state.values?.[name] ?? "") : fallback);
  const e = state.fieldErrors ?? {};
  return (
    <form action={formAction} className="space-y-3" aria-label={t("formLabel")} noValidate>
      {state.message ? <Notice tone={state.status === "success" ? "success" : "error"}>{state.message}</Notice> : null}
      <input type="hidden" name="id" value={materialId} />
      <input type="hidden" name="unitSystem" value={unitSystem} />
      <div className="grid gap-3 sm:grid-cols-3">
        <Field id="movement-kind" label={t("kind")} errors={e.kind}>
          {(aria) => <Select {...aria} name="kind" defaultValue={v("kind", "receipt")} options={movementKinds.map((k) => ({ value: k, label: t(`kinds.${k}`) }))} />}
        </Field>
        <Field id="movement-amount" label={t("amount", { unit: massUnit(unitSystem) })} hint={t("amountHint")} errors={e.kg}>
          {(aria) => <input {...aria} name="amount" inputMode="decimal" defaultValue={v("amount", "")} />}
        </Field>
        <Field id="movement-note" label={t("note")} errors={e.note}>
          {(aria) => <input {...aria} name="note" autoComplete="off" defaultValue={v("note", "")} />}
        </Field>
      </div>
      <Button type="submit" disabled={pending}>
        {pending ? t("recording") : t("record")}
      </Button>
    </form>
  );
}
