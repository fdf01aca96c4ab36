"use client";

import Link from "next/link";
import { useFormatter, useLocale, useTranslations } from "next-intl";
import { useActionState, useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { cn } from "@/components/ui/cn";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { initialFormState, type FormState } from "@/lib/actions/form-state";
import { numberInput, readNumber } from "@/lib/contracts/form-input";
import type { UnitSystem } from "@/lib/contracts/wax";
import { fahrenheitToCelsius } from "@/lib/units";
import { FLASH_POINT_MARGIN_C, FUME_WARNING_ABOVE_C, MIX_SUM_TOLERANCE_PCT, RECIPE_USES, SEASONS } from "@/lib/wax";
import { inputOf, tempIn, tempText, tempUnit } from "./measure";

type Action = (state: FormState, formData: FormData) => Promise<FormState>;

/** What the form needs to know of a material: its name and the figures the live temperature hints read. */
export interface RecipeFormMaterial {
  id: string;
  name: string;
  flashPointC: number | null;
}

export interface RecipeFormValues {
  id?: string;
  name: string;
  season: string;
  use: string;
  components: { material: string; pct: number | null }[];
  workingRangeC: { minC: number | null; maxC: number | null };
  notes: string | null;
  version?: number;
}

interface Row {
  key: number;
  material: string;
  pct: string;
}

/** Rows from what a refused form sent back (components.<i>.material / .pct), else from the recipe. */
function initialRows(state: FormState, initial: RecipeFormValues, locale: string): Row[] {
  if (state.status === "error" && state.values) {
    const indices = [...new Set(Object.keys(state.values).flatMap((k) => /^components\.(\d+)\./.exec(k)?.[1] ?? []))].map(Number).sort((a, b) => a - b);
    if (indices.length) return indices.map((i) => ({ key: i, material: state.values![`components.${i}.material`] ?? "", pct: state.values![`components.${i}.pct`] ?? "" }));
  }
  const rows = initial.components.map((c, i) => ({ key: i, material: c.material, pct: numberInput(c.pct, locale) }));
  return rows.length ? rows : [{ key: 0, material: "", pct: "" }];
}

/** What a box holds as a number, read as the person's language writes it; null while empty or not a number yet. */
const parse = (value: string, locale: string) => {
  const n = readNumber(value, locale);
  return n === null || Number.isNaN(n) ? null : n;
};

/**
 * Adds or changes a recipe: components by mass % with the running total (anything but 100 % is refused), the
 * working range in the person's unit with the fume warning and the flash-point limit live, and guidance beside the mix.
 */
export function RecipeForm({ action, mode, initial, materials, unitSystem }: { action: Action; mode: "create" | "edit"; initial: RecipeFormValues; materials: RecipeFormMaterial[]; unitSystem: UnitSystem }) {
  const t = useTranslations("waxRoom.recipeForm");
  const tw = useTranslations("waxRoom");
  const format = useFormatter();
  const locale = useLocale();
  const [state, formAction, pending] = useActionState(action, initialFormState);
  const failed = state.status === "error";
  const v = (name: string, fallback: string) => (failed ? (state.values?.[name] ?? "") : fallback);
  const e = state.fieldErrors ?? {};
  const [rows, setRows] = useState<Row[]>(() => initialRows(state, initial, locale));
  const [nextKey, setNextKey] = useState(() => Math.max(...rows.map((r) => r.key)) + 1);
  const [maxTyped, setMaxTyped] = useState(() => v("workingMax", inputOf(initial.workingRangeC.maxC, tempIn, unitSystem, locale, 1)));

  const total = rows.reduce((sum, r) => sum + (parse(r.pct, locale) ?? 0), 0);
  const totalOk = Math.abs(total - 100) <= MIX_SUM_TOLERANCE_PCT;
  const maxTypedC = parse(maxTyped, locale);
  const maxC = maxTypedC === null ? null : unitSystem === "imperial" ? fahrenheitToCelsius(maxTypedC) : maxTypedC;
  const lowestFlash = useMemo(() => {
    const chosen = rows.map((r) => materials.find((m) => m.id === r.material)).filter((m): m is RecipeFormMaterial => !!m);
    const known = chosen.filter((m) => m.flashPointC !== null).sort((a, b) => a.flashPointC! - b.flashPointC!);
    return { material: known[0] ?? null, unknown: chosen.filter((m) => m.flashPointC === null).map((m) => m.name) };
  }, [rows, materials]);
  const limitC = lowestFlash.material ? lowestFlash.material.flashPointC! - FLASH_POINT_MARGIN_C : null;

  const setRow = (key: number, patch: Partial<Row>) => setRows((list) => list.map((r) => (r.key === key ? { ...r, ...patch } : r)));
  const unit = tempUnit(unitSystem);

  return (
    <form action={formAction} className="space-y-6" aria-label={mode === "create" ? t("createLabel") : t("editLabel")} noValidate>
      {state.message ? <Notice tone={state.status === "success" ? "success" : "error"}>{state.message}</Notice> : null}
      <input type="hidden" name="unitSystem" value={unitSystem} />
      {initial.id ? <input type="hidden" name="id" value={initial.id} /> : null}
      {initial.version ? <input type="hidden" name="version" value={initial.version} /> : null}

      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-sm font-semibold text-stone-900">{t("what")}</legend>
        <Field id="recipe-name" label={t("name")} errors={e.name}>
          {(aria) => <input {...aria} name="name" autoComplete="off" defaultValue={v("name", initial.name)} />}
        </Field>
        <Field id="recipe-season" label={t("season")} errors={e.season}>
          {(aria) => <Select {...aria} name="season" defaultValue={v("season", initial.season)} options={SEASONS.map((s) => ({ value: s, label: tw(`seasons.${s}`) }))} />}
        </Field>
        <Field id="recipe-use" label={t("use")} errors={e.use}>
          {(aria) => <Select {...aria} name="use" defaultValue={v("use", initial.use)} options={RECIPE_USES.map((u) => ({ value: u, label: tw(`uses.${u}`) }))} />}
        </Field>
      </fieldset>

      <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
        <fieldset className="space-y-3" aria-describedby="recipe-total recipe-components-error">
          <legend className="mb-2 text-sm font-semibold text-stone-900">{t("mix")}</legend>
          <p className="text-xs text-stone-600">{t("mixHint")}</p>
          {rows.map((row, i) => (
            <div key={row.key} className="grid grid-cols-[1fr_7rem_auto] items-start gap-2" data-testid="component-row">
              <Field id={`recipe-material-${row.key}`} label={t("material", { line: i + 1 })} errors={e[`components.${i}.material`]}>
                {(aria) => (
                  <select {...aria} name={`components.${i}.material`} value={row.material} onChange={(ev) => setRow(row.key, { material: ev.target.value })}>
                    <option value="">{t("chooseMaterial")}</option>
                    {materials.map((m) => (
                      <option key={m.id} value={m.id}>
                        {m.name}
                      </option>
                    ))}
                  </select>
                )}
              </Field>
              <Field id={`recipe-pct-${row.key}`} label={t("pct", { line: i + 1 })} errors={e[`components.${i}.pct`]}>
                {(aria) => <input {...aria} name={`components.${i}.pct`} inputMode="decimal" value={row.pct} onChange={(ev) => setRow(row.key, { pct: ev.target.value })} />}
              </Field>
              <Button type="button" variant="ghost" className="mt-6" onClick={() => setRows((list) => list.filter((r) => r.key !== row.key))} disabled={rows.length === 1} aria-label={t("removeLine", { line: i + 1 })}>
                ×
              </Button>
            </div>
          ))}
          <div className="flex flex-wrap items-center justify-between gap-3">
            <Button
              type="button"
              variant="secondary"
              onClick={() => {
                setRows((list) => [...list, { key: nextKey, material: "", pct: "" }]);
                setNextKey((k) => k + 1);
              }}
            >
              {t("addLine")}
            </Button>
            <p id="recipe-total" aria-live="polite" data-testid="recipe-total" className={cn("text-sm font-medium", totalOk ? "text-emerald-800" : "text-red-700")}>
              {totalOk ? t("totalOk", { total }) : t("totalOff", { total, left: 100 - total })}
            </p>
          </div>
          <p id="recipe-components-error" className={cn("text-sm text-red-700", !e.components?.length && "sr-only")} aria-live="polite">
            {e.components?.join(" ")}
          </p>
        </fieldset>
        <aside className="rounded-md border border-stone-200 bg-stone-50 p-4 text-sm text-stone-700" aria-labelledby="recipe-guidance-title">
          <h3 id="recipe-guidance-title" className="font-semibold text-stone-900">
            {t("guidanceTitle")}
          </h3>
          <ul className="mt-2 list-disc space-y-1 pl-5">
            <li>{t("guidanceBeeswax")}</li>
            <li>{t("guidanceParaffin")}</li>
            <li>{t("guidanceSeason")}</li>
            <li>{t("guidanceResins")}</li>
          </ul>
        </aside>
      </div>

      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-sm font-semibold text-stone-900">{t("temperature")}</legend>
        <Field id="recipe-min" label={t("workingMin", { unit })} errors={e["workingRangeC.minC"] ?? e.workingRangeC}>
          {(aria) => <input {...aria} name="workingMin" inputMode="decimal" defaultValue={v("workingMin", inputOf(initial.workingRangeC.minC, tempIn, unitSystem, locale, 1))} />}
        </Field>
        <Field id="recipe-max" label={t("workingMax", { unit })} errors={e["workingRangeC.maxC"]}>
          {(aria) => <input {...aria} name="workingMax" inputMode="decimal" value={maxTyped} onChange={(ev) => setMaxTyped(ev.target.value)} />}
        </Field>
        <div className="space-y-2 text-sm md:mt-6" aria-live="polite" data-testid="recipe-temperature-hints">
          {maxC !== null && maxC > FUME_WARNING_ABOVE_C ? <Notice tone="warning">{t("fumeWarning", { limit: tempText(FUME_WARNING_ABOVE_C, unitSystem, format.number) })}</Notice> : null}
          {limitC !== null ? (
            <p className={cn(maxC !== null && maxC >= limitC ? "font-medium text-red-700" : "text-stone-600")}>
              {t("flashLimit", { material: lowestFlash.material!.name, flash: tempText(lowestFlash.material!.flashPointC!, unitSystem, format.number), limit: tempText(limitC, unitSystem, format.number) })}
            </p>
          ) : null}
          {lowestFlash.unknown.length ? <p className="text-amber-900">{t("flashUnknown", { materials: lowestFlash.unknown.join(", ") })}</p> : null}
        </div>
      </fieldset>

      <Field id="recipe-notes" label={t("notes")} errors={e.notes}>
        {(aria) => <textarea {...aria} name="notes" rows={3} defaultValue={v("notes", initial.notes ?? "")} />}
      </Field>

      <div className="flex items-center gap-3">
        <Button type="submit" disabled={pending}>
          {pending ? t("saving") : mode === "create" ? t("create") : t("save")}
        </Button>
        <Link href={initial.id ? `/wax/recipes/${initial.id}` : "/wax/recipes"} className="text-sm text-stone-600 hover:underline">
          {t("cancel")}
        </Link>
      </div>
    </form>
  );
}
