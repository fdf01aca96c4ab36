"use client";

import { useFormatter, useLocale, useTranslations } from "next-intl";
import { useActionState, useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { initialFormState, type FormState } from "@/lib/actions/form-state";
import { numberInput } from "@/lib/contracts/form-input";
import type { EstimateResultDto, UnitSystem, WaxDefaultsDto } from "@/lib/contracts/wax";
import { BandPicture } from "./band-picture";
import { kgText } from "./measure";
import { NoteText } from "./wax-note";

type Action = (state: FormState, formData: FormData) => Promise<FormState>;

export interface EstimateRecipeChoice {
  id: string;
  name: string;
  /** The calibrated rate new estimates take for it (the recipe's own fit), when there are enough uses. */
  calibrated: { rateGPerM2: number; uses: number } | null;
}

const runKinds = ["metres", "pieces", "kodi"] as const;

/**
 * Estimates the wax for a saved plan or a waxed area per metre: run in metres, pieces or kodi, passes, the rate
 * (empty: the calibrated one, else the default), losses and recovery; shows the result against the published band,
 * and saves it with a name (wax masters), planned or not.
 */
export function EstimateForm({
  action,
  recipes,
  plans,
  initialPlanId = "",
  cloths,
  defaults,
  canWrite,
  unitSystem,
}: {
  action: Action;
  recipes: EstimateRecipeChoice[];
  plans: { id: string; name: string }[];
  /** The plan chosen when the page opens (`?plan=<id>`). */
  initialPlanId?: string;
  cloths: string[];
  defaults: WaxDefaultsDto;
  canWrite: boolean;
  unitSystem: UnitSystem;
}) {
  const t = useTranslations("waxRoom.estimate");
  const locale = useLocale();
  const format = useFormatter();
  const [state, formAction, pending] = useActionState(action, initialFormState);
  const typed = state.values;
  const v = (name: string, fallback: string) => typed?.[name] ?? fallback;
  const e = state.fieldErrors ?? {};
  const [runKind, setRunKind] = useState<(typeof runKinds)[number]>(() => (runKinds as readonly string[]).includes(v("runKind", "")) ? (v("runKind", "metres") as (typeof runKinds)[number]) : "metres");
  const [recipeId, setRecipeId] = useState(v("recipeId", recipes[0]?.id ?? ""));
  const [planId, setPlanId] = useState(v("planId", initialPlanId));
  // React resets the form after each answer, and a controlled select would keep its state while showing the reset
  // choice: on each answer, take the typed choices back and draw the selects afresh with them as their defaults.
  const [answered, setAnswered] = useState(state);
  const [round, setRound] = useState(0);
  if (answered !== state) {
    setAnswered(state);
    setRound((r) => r + 1);
    setPlanId(v("planId", planId));
    setRecipeId(v("recipeId", recipeId));
  }
  const recipe = recipes.find((r) => r.id === recipeId);
  const result = state.status === "success" && state.data?.result ? (JSON.parse(state.data.result) as EstimateResultDto) : null;
  const n = (value: number, digits = 2) => format.number(value, { maximumFractionDigits: digits });
  // The recovery measured at the runs' boil-offs when there is one (rounded to a tenth, as people write it), else the
  // wax master's default; the hint says which, and from how many boil-offs.
  const measured = defaults.measuredRecoveryPct;
  const recoveryOffered = measured === null ? defaults.waxRecoveryPct : Math.round(measured * 10) / 10;
  const recoveryHint =
    measured === null ? t("recoveryDefault", { pct: defaults.waxRecoveryPct }) : t("recoveryMeasured", { pct: recoveryOffered, boilOffs: defaults.measuredRecoveryBoilOffs });
  const money = (value: number) => format.number(value, { style: "currency", currency: defaults.currency, maximumFractionDigits: defaults.currency === "IDR" ? 0 : 2 });

  return (
    <div className="grid gap-6 xl:grid-cols-[3fr_2fr]">
      <form action={formAction} className="space-y-5" aria-label={t("formLabel")} noValidate>
        {state.message ? <Notice tone={state.status === "success" ? "success" : "error"}>{state.message}</Notice> : null}
        <div className="grid gap-4 md:grid-cols-2">
          <Field id="estimate-recipe" label={t("recipe")} errors={e.recipeId}>
            {(aria) => (
              <select {...aria} key={round} name="recipeId" defaultValue={recipeId} onChange={(ev) => setRecipeId(ev.target.value)}>
                {recipes.map((r) => (
                  <option key={r.id} value={r.id}>
                    {r.name}
                  </option>
                ))}
              </select>
            )}
          </Field>
          <Field id="estimate-plan" label={t("plan")} hint={plans.length ? t("planHint") : t("noPlans")} errors={e.planId}>
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
            <Field id="estimate-area" label={t("area")} hint={t("areaHint")} errors={e.waxedAreaPerMetreM2}>
              {(aria) => <input {...aria} name="waxedAreaPerMetreM2" inputMode="decimal" defaultValue={v("waxedAreaPerMetreM2", "")} />}
            </Field>
          )}
          <Field id="estimate-cloth" label={t("cloth")} hint={t("clothHint")} errors={e.cloth}>
            {(aria) => (
              <>
                <input {...aria} name="cloth" list="estimate-cloths" autoComplete="off" defaultValue={v("cloth", "")} />
                <datalist id="estimate-cloths">
                  {cloths.map((c) => (
                    <option key={c} value={c} />
                  ))}
                </datalist>
              </>
            )}
          </Field>
        </div>

        <fieldset className="space-y-3">
          <legend className="text-sm font-semibold text-stone-900">{t("run")}</legend>
          <div className="flex flex-wrap gap-4 text-sm">
            {runKinds.map((k) => (
              <label key={k} className="flex items-center gap-1.5">
                <input type="radio" name="runKind" value={k} checked={runKind === k} onChange={() => setRunKind(k)} />
                {t(`runKinds.${k}`)}
              </label>
            ))}
          </div>
          <div className="grid gap-4 md:grid-cols-3">
            {runKind === "metres" ? (
              <Field id="estimate-metres" label={t("metres")} hint={planId ? t("metresFromPlan") : undefined} errors={e.metres}>
                {(aria) => <input {...aria} name="metres" inputMode="decimal" defaultValue={v("metres", "")} />}
              </Field>
            ) : (
              <>
                <Field id="estimate-count" label={runKind === "kodi" ? t("kodi") : t("pieces")} hint={runKind === "kodi" ? t("kodiHint") : undefined} errors={e[runKind] ?? e.metres}>
                  {(aria) => <input {...aria} name="runCount" inputMode="numeric" defaultValue={v("runCount", "")} />}
                </Field>
                <Field id="estimate-piece-length" label={t("pieceLength")} hint={t("pieceLengthHint")} errors={e.pieceLengthMm}>
                  {(aria) => <input {...aria} name="pieceLengthMm" inputMode="decimal" defaultValue={v("pieceLengthMm", "2650")} />}
                </Field>
              </>
            )}
          </div>
        </fieldset>

        <fieldset className="grid gap-4 md:grid-cols-4">
          <legend className="mb-2 text-sm font-semibold text-stone-900">{t("waxing")}</legend>
          <Field id="estimate-passes" label={t("passes")} hint={t("passesHint")} errors={e.passes}>
            {(aria) => <input {...aria} name="passes" inputMode="numeric" defaultValue={v("passes", "2")} />}
          </Field>
          <Field
            id="estimate-rate"
            label={t("rate")}
            hint={recipe?.calibrated ? t("rateCalibrated", { rate: n(recipe.calibrated.rateGPerM2, 1), uses: recipe.calibrated.uses }) : t("rateDefault", { rate: n(defaults.waxRateGPerM2, 1) })}
            errors={e.rateGPerM2}
          >
            {(aria) => <input {...aria} name="rateGPerM2" inputMode="decimal" defaultValue={v("rateGPerM2", "")} />}
          </Field>
          <Field id="estimate-loss" label={t("loss")} errors={e.lossPct}>
            {(aria) => <input {...aria} name="lossPct" inputMode="decimal" defaultValue={v("lossPct", numberInput(defaults.waxLossPct, locale))} />}
          </Field>
          <Field id="estimate-recovery" label={t("recovery")} hint={recoveryHint} errors={e.recoveryPct}>
            {(aria) => <input {...aria} name="recoveryPct" inputMode="decimal" defaultValue={v("recoveryPct", numberInput(recoveryOffered, locale))} />}
          </Field>
        </fieldset>

        <div className="flex flex-wrap items-end gap-3">
          <Button type="submit" name="intent" value="estimate" disabled={pending}>
            {pending ? t("working") : t("estimate")}
          </Button>
          {canWrite ? (
            <>
              <Field id="estimate-name" label={t("name")} errors={e.name}>
                {(aria) => <input {...aria} name="name" autoComplete="off" defaultValue={v("name", "")} />}
              </Field>
              <label className="flex items-center gap-2 pb-2 text-sm">
                <input type="checkbox" name="planned" defaultChecked={typed?.planned === "on"} />
                {t("planned")}
              </label>
              <Button type="submit" name="intent" value="save" variant="secondary" disabled={pending}>
                {t("save")}
              </Button>
            </>
          ) : null}
        </div>
      </form>

      <section aria-labelledby="estimate-result-title" className="rounded-lg border border-stone-200 bg-stone-50 p-4" aria-live="polite">
        <h3 id="estimate-result-title" className="text-base font-semibold text-stone-900">
          {t("result")}
        </h3>
        {result ? (
          <div className="mt-3 space-y-4 text-sm" data-testid="estimate-result">
            <p className="text-2xl font-semibold text-stone-900" data-testid="grams-per-metre">
              {t("gramsPerMetre", { grams: n(result.gramsPerMetre, 1) })}
            </p>
            <BandPicture
              band={result.band}
              label={t(`band.${result.band.position}`, { grams: n(result.gramsPerMetre, 1), source: result.band.source })}
              labels={{ benchmark: t("band.benchmarkLabel"), measured: t("band.measuredLabel"), estimate: t("band.estimateLabel", { grams: n(result.gramsPerMetre, 0) }) }}
            />
            <p className="text-stone-700">{t(`band.${result.band.position}`, { grams: n(result.gramsPerMetre, 1), source: result.band.source })}</p>
            <dl className="grid grid-cols-2 gap-x-4 gap-y-1">
              <dt className="text-stone-600">{t("kgGross")}</dt>
              <dd data-testid="kg-gross">{kgText(result.kgGross, unitSystem, format.number, 3)}</dd>
              <dt className="text-stone-600">{t("kgRecovered")}</dt>
              <dd>{kgText(result.kgRecovered, unitSystem, format.number, 3)}</dd>
              <dt className="text-stone-600">{t("kgNew")}</dt>
              <dd data-testid="kg-new" className="font-semibold">
                {kgText(result.kgNew, unitSystem, format.number, 3)}
              </dd>
              <dt className="text-stone-600">{t("runLength")}</dt>
              <dd>{t("metresValue", { metres: n(result.inputs.metres, 2) })}</dd>
              <dt className="text-stone-600">{t("rateUsed")}</dt>
              <dd>{t(`rateBasis.${result.rate.basis}`, { rate: n(result.rate.gPerM2, 1), uses: result.rate.uses ?? 0 })}</dd>
              <dt className="text-stone-600">{t("density")}</dt>
              <dd>{t("densityValue", { density: n(result.densityGPerCm3, 3) })}</dd>
              <dt className="text-stone-600">{t("cost")}</dt>
              <dd data-testid="estimate-cost">{result.cost === null ? t("noCost") : money(result.cost)}</dd>
            </dl>
            <table className="w-full text-left">
              <caption className="sr-only">{t("byMaterial")}</caption>
              <thead className="text-xs text-stone-600">
                <tr>
                  <th scope="col" className="py-1 font-medium">
                    {t("material")}
                  </th>
                  <th scope="col" className="py-1 font-medium">
                    %
                  </th>
                  <th scope="col" className="py-1 text-right font-medium">
                    {t("newWax")}
                  </th>
                  <th scope="col" className="py-1 text-right font-medium">
                    {t("cost")}
                  </th>
                </tr>
              </thead>
              <tbody>
                {result.byMaterial.map((m) => (
                  <tr key={m.material} className="border-t border-stone-200">
                    <td className="py-1">{m.name}</td>
                    <td className="py-1">{n(m.pct, 2)}</td>
                    <td className="py-1 text-right">{kgText(m.kg, unitSystem, format.number, 3)}</td>
                    <td className="py-1 text-right">{m.cost === null ? "—" : money(m.cost)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            {result.warnings.length ? (
              <ul className="space-y-1 text-amber-900">
                {result.warnings.map((w, i) => (
                  <li key={i}>
                    <NoteText note={w} />
                  </li>
                ))}
              </ul>
            ) : null}
          </div>
        ) : (
          <p className="mt-2 text-sm text-stone-600">{t("noResult")}</p>
        )}
      </section>
    </div>
  );
}
