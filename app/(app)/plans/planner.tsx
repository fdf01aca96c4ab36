"use client";

import Link from "next/link";
import { useLocale, useTranslations } from "next-intl";
import { startTransition, useActionState, useEffect, useMemo, useRef, useState } from "react";
import { SWRConfig } from "swr";
import { FitHelper } from "@/components/plans/fit-helper";
import { PictureViewport } from "@/components/plans/picture-viewport";
import { PlanNumbers } from "@/components/plans/plan-numbers";
import { StampPicker } from "@/components/plans/stamp-picker";
import { useLiveLayout } from "@/components/plans/use-live-layout";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { initialFormState } from "@/lib/actions/form-state";
import { planFieldErrors, planFormInput, planPages, planUrls, type PlannerStamp, type PlannerValues } from "@/lib/contracts/plans";
import { ARRANGEMENTS, type LayerName, type StampSize } from "@/lib/layout";
import type { UnitSystem } from "@/lib/stamps/format";
import { usePlannerStamp } from "@/lib/swr/use-planner-stamp";
import { NewStampRequestDialog } from "./new-stamp-request";
import { savePlanAction } from "./actions";

export interface ClothPreset {
  name: string;
  widthMm: number;
  marginMm: number;
}

/** The planner with the stamps the page already looked up, so the first picture needs no round trip. */
export function PlannerWithStamps({ stamps, ...props }: PlannerProps & { stamps: PlannerStamp[] }) {
  const fallback = Object.fromEntries(stamps.map((s) => [planUrls.stamp(s.code), s]));
  return (
    <SWRConfig value={{ fallback }}>
      <Planner {...props} />
    </SWRConfig>
  );
}

interface PlannerProps {
  mode: "new" | "edit" | "view";
  plan?: { id: string; version: number };
  initialValues: PlannerValues;
  presets: ClothPreset[];
  impressionsPerHour: number;
  unitSystem: UnitSystem;
  canRequestNew: boolean;
}

const acrossFields = ["clothWidth", "marginLeft", "marginRight", "gapX", "gapY", "stampWidth", "stampHeight", "borderStampWidth", "borderStampHeight", "borderGapY", "borderGapToField", "borderOffset", "borderStart"];
const runFields = ["runLength", "pieceLength"];

const toMm = (v: number, unit: string) => (unit === "in" ? v * 25.4 : unit === "m" ? v * 1000 : unit === "yd" ? v * 914.4 : v);
const fromMm = (mm: number, unit: string, digits = 4) => String(Number((unit === "in" ? mm / 25.4 : unit === "m" ? mm / 1000 : unit === "yd" ? mm / 914.4 : mm).toFixed(digits)));
const parse = (text: string | undefined) => (text && text.trim() !== "" ? Number(text.replace(",", ".")) : Number.NaN);

/** When a change was typed, for the measure of how long it takes to reach the screen. */
function markInput(): number {
  performance.mark("capgrid:plan-input");
  return performance.now();
}

function formDataOf(values: PlannerValues): FormData {
  const fd = new FormData();
  for (const [k, v] of Object.entries(values)) if (v !== undefined && v !== "") fd.set(k, v);
  return fd;
}

/**
 * The planner's workbench: the form on one side, the live picture, numbers and fit helper on the other. Every
 * change lays the plan out again in the browser (the engine of lib/layout, in a Web Worker: see use-live-layout.ts), so the numbers and the
 * picture follow the typing; Save sends the same form to the server, which computes the summary it keeps.
 */
export function Planner({ mode, plan, initialValues, presets, impressionsPerHour, unitSystem, canRequestNew }: PlannerProps) {
  const t = useTranslations();
  const tf = useTranslations("plans.form");
  const locale = useLocale();
  const readOnly = mode === "view";
  const [state, formAction, pending] = useActionState(savePlanAction, initialFormState);
  const [values, setValues] = useState<PlannerValues>(initialValues);
  const [submitted, setSubmitted] = useState(false);
  const [askWidthMm, setAskWidthMm] = useState<number | null>(null);
  const inputAt = useRef<number | null>(null);
  const v = (name: string) => values[name] ?? "";

  // A refused save comes back with what was typed (the inputs are controlled, so nothing is lost).
  const [seenState, setSeenState] = useState(state);
  if (state !== seenState) {
    setSeenState(state);
    if (state.status === "error" && state.values) setValues((old) => ({ ...old, ...state.values }));
  }

  const set = (changes: PlannerValues) => {
    inputAt.current = markInput();
    setValues((old) => ({ ...old, ...changes }));
  };
  const setField = (name: string) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement>) =>
    set({ [name]: e.target instanceof HTMLInputElement && e.target.type === "checkbox" ? (e.target.checked ? "on" : "") : e.target.value });

  const code = (mode: string, text: string) => (mode === "free" ? null : text.trim().toUpperCase() || null);
  const fieldCode = code(v("stampMode"), v("stampCode"));
  const hasBorder = ["left", "right", "both"].includes(v("borderSide"));
  const borderCode = hasBorder ? code(v("borderStampMode"), v("borderStampCode")) : null;
  const fieldStamp = usePlannerStamp(fieldCode);
  const borderStamp = usePlannerStamp(borderCode);
  const waiting = (fieldCode && fieldStamp.isLoading) || (borderCode && borderStamp.isLoading);

  const input = useMemo(() => {
    const { layout, borders } = planFormInput(formDataOf(values), locale);
    return { layout, borders };
  }, [values, locale]);
  const geometry = useMemo(() => {
    const map = new Map<string, StampSize>();
    for (const s of [fieldStamp.data, borderStamp.data]) if (s) map.set(s.code, s.geometry);
    return map;
  }, [fieldStamp.data, borderStamp.data]);
  const key = JSON.stringify([input, [...geometry.keys()]]);

  const outcome = useLiveLayout(input, geometry, key, Boolean(waiting));

  // How long a change took to reach the screen (scripts/bench-planner.ts reads these measures).
  useEffect(() => {
    if (!outcome || inputAt.current === null) return;
    const start = inputAt.current;
    inputAt.current = null;
    requestAnimationFrame(() => setTimeout(() => performance.measure("capgrid:plan-update", { start, end: performance.now() }), 0));
  }, [outcome]);

  const liveErrors = useMemo(() => {
    if (!outcome || outcome.ok) return {};
    const byPath: Record<string, string[]> = {};
    for (const issue of outcome.issues) {
      if (!submitted && issue.key === "validation.required") continue;
      (byPath[issue.path] ??= []).push(t(issue.key as never, issue.values as never));
    }
    return planFieldErrors(byPath);
  }, [outcome, submitted, t]);
  const serverErrors = state.status === "error" ? planFieldErrors(state.fieldErrors) : {};
  const errors = (name: string) => {
    const list = [...(serverErrors[name] ?? []), ...(liveErrors[name] ?? [])];
    return list.length ? [...new Set(list)] : undefined;
  };

  const unit = v("unit") === "in" ? "in" : "mm";
  const runUnit = v("runUnit") === "yd" ? "yd" : "m";
  const changeUnit = (next: string) => {
    const changes: PlannerValues = { unit: next };
    for (const f of acrossFields) if (!Number.isNaN(parse(values[f]))) changes[f] = fromMm(toMm(parse(values[f]), unit), next);
    set(changes);
  };
  const changeRunUnit = (next: string) => {
    const changes: PlannerValues = { runUnit: next };
    for (const f of runFields) if (!Number.isNaN(parse(values[f]))) changes[f] = fromMm(toMm(parse(values[f]), runUnit), next);
    set(changes);
  };
  const presetIndex = presets.findIndex((p) => Math.abs(toMm(parse(v("clothWidth")), unit) - p.widthMm) < 0.05 && Math.abs(toMm(parse(v("marginLeft")), unit) - p.marginMm) < 0.05 && Math.abs(toMm(parse(v("marginRight")), unit) - p.marginMm) < 0.05);
  const choosePreset = (value: string) => {
    const p = presets[Number(value)];
    if (p) set({ clothWidth: fromMm(p.widthMm, unit), marginLeft: fromMm(p.marginMm, unit), marginRight: fromMm(p.marginMm, unit) });
  };

  const pictures: Partial<Record<LayerName, PlannerStamp["picture"]>> = {
    field: fieldCode ? (fieldStamp.data?.picture ?? null) : null,
    "border-left": borderCode ? (borderStamp.data?.picture ?? null) : null,
    "border-right": borderCode ? (borderStamp.data?.picture ?? null) : null,
  };
  const result = outcome?.ok ? outcome.result : null;
  const stampHeightMm = fieldStamp.data?.heightMm ?? (Number.isNaN(parse(v("stampHeight"))) ? 200 : toMm(parse(v("stampHeight")), unit));
  const byPieces = v("runBy") !== "length";

  const submit = (e: React.FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    setSubmitted(true);
    const fd = new FormData(e.currentTarget);
    startTransition(() => formAction(fd));
  };

  const lengthLabel = (key: "clothWidth" | "marginLeft" | "marginRight" | "gapX" | "gapY" | "stampWidth" | "stampHeight" | "borderGapY" | "borderGapToField" | "borderOffset" | "borderStart") => tf(`labels.${key}`, { unit });
  const numberInput = (name: string, label: string, hint?: string) => (
    <Field id={`plan-${name}`} label={label} hint={hint} errors={errors(name)}>
      {(aria) => <input {...aria} name={name} inputMode="decimal" autoComplete="off" value={v(name)} onChange={setField(name)} />}
    </Field>
  );

  return (
    <div className="grid gap-6 xl:grid-cols-[26rem_1fr]">
      <form onSubmit={submit} className="space-y-5" aria-label={mode === "new" ? tf("newLabel") : tf("editLabel")} noValidate>
        {state.message && state.status === "error" ? (
          <Notice tone="error">
            {state.message}
            {state.data?.conflict && plan ? (
              <>
                {" "}
                <Link href={planPages.one(plan.id)} target="_blank" className="underline">
                  {tf("openLatest")}
                </Link>
              </>
            ) : null}
          </Notice>
        ) : null}
        {plan ? (
          <>
            <input type="hidden" name="planId" value={plan.id} />
            <input type="hidden" name="version" value={plan.version} />
          </>
        ) : null}
        <input type="hidden" name="motifId" value={v("motifId")} />
        <fieldset disabled={readOnly} className="space-y-5">
          <fieldset className="space-y-3 rounded-lg border border-stone-200 bg-white p-4">
            <legend className="px-1 text-sm font-semibold text-stone-900">{tf("stampTitle")}</legend>
            <div className="flex gap-4 text-sm" role="radiogroup" aria-label={tf("stampMode")}>
              {(["library", "free"] as const).map((m) => (
                <label key={m} className="flex items-center gap-1.5">
                  <input type="radio" name="stampMode" value={m} checked={(v("stampMode") || "library") === m} onChange={setField("stampMode")} />
                  {tf(`stampModes.${m}`)}
                </label>
              ))}
            </div>
            {v("stampMode") === "free" ? (
              <div className="grid grid-cols-3 gap-3">
                {numberInput("stampWidth", lengthLabel("stampWidth"))}
                {numberInput("stampHeight", lengthLabel("stampHeight"))}
                {numberInput("coveragePct", tf("labels.coveragePct"), tf("coverageHint"))}
              </div>
            ) : (
              <StampPicker id="plan-stampCode" name="stampCode" label={tf("labels.stampCode")} hint={tf("stampHint")} value={v("stampCode")} onChange={(c) => set({ stampCode: c })} errors={errors("stampCode")} chosen={fieldStamp.data} unitSystem={unitSystem} disabled={readOnly} />
            )}
          </fieldset>

          <fieldset className="space-y-3 rounded-lg border border-stone-200 bg-white p-4">
            <legend className="px-1 text-sm font-semibold text-stone-900">{tf("clothTitle")}</legend>
            <div className="grid grid-cols-[1fr_auto] gap-3">
              <Field id="plan-clothPreset" label={tf("labels.clothPreset")}>
                {(aria) => (
                  <select {...aria} value={presetIndex >= 0 ? String(presetIndex) : "custom"} onChange={(e) => choosePreset(e.target.value)}>
                    {presets.map((p, k) => (
                      <option key={p.name} value={k}>
                        {p.name}
                      </option>
                    ))}
                    <option value="custom">{tf("customWidth")}</option>
                  </select>
                )}
              </Field>
              <Field id="plan-unit" label={tf("labels.unit")}>
                {(aria) => (
                  <select {...aria} name="unit" value={unit} onChange={(e) => changeUnit(e.target.value)}>
                    <option value="mm">mm</option>
                    <option value="in">in</option>
                  </select>
                )}
              </Field>
            </div>
            <div className="grid grid-cols-3 gap-3">
              {numberInput("clothWidth", lengthLabel("clothWidth"), tf("widthHint"))}
              {numberInput("marginLeft", lengthLabel("marginLeft"))}
              {numberInput("marginRight", lengthLabel("marginRight"))}
            </div>
          </fieldset>

          <fieldset className="space-y-3 rounded-lg border border-stone-200 bg-white p-4">
            <legend className="px-1 text-sm font-semibold text-stone-900">{tf("runTitle")}</legend>
            <div className="flex flex-wrap gap-4 text-sm" role="radiogroup" aria-label={tf("runBy")}>
              {(["length", "pieces", "kodi"] as const).map((m) => (
                <label key={m} className="flex items-center gap-1.5">
                  <input type="radio" name="runBy" value={m} checked={(v("runBy") || "length") === m} onChange={setField("runBy")} />
                  {tf(`runByOptions.${m}`)}
                </label>
              ))}
            </div>
            <div className="grid grid-cols-[1fr_1fr_auto] gap-3">
              {v("runBy") === "length" || !v("runBy") ? (
                <div className="col-span-2">{numberInput("runLength", tf("labels.runLength", { unit: runUnit }))}</div>
              ) : (
                <>
                  {v("runBy") === "kodi" ? numberInput("kodi", tf("labels.kodi"), tf("kodiHint")) : numberInput("pieces", tf("labels.pieces"))}
                  {numberInput("pieceLength", tf("labels.pieceLength", { unit: runUnit }))}
                </>
              )}
              <Field id="plan-runUnit" label={tf("labels.runUnit")}>
                {(aria) => (
                  <select {...aria} name="runUnit" value={runUnit} onChange={(e) => changeRunUnit(e.target.value)}>
                    <option value="m">m</option>
                    <option value="yd">yd</option>
                  </select>
                )}
              </Field>
            </div>
          </fieldset>

          <fieldset className="space-y-3 rounded-lg border border-stone-200 bg-white p-4">
            <legend className="px-1 text-sm font-semibold text-stone-900">{tf("repeatTitle")}</legend>
            <Field id="plan-arrangement" label={tf("labels.arrangement")} errors={errors("arrangement")}>
              {(aria) => (
                <select {...aria} name="arrangement" value={v("arrangement")} onChange={setField("arrangement")}>
                  {ARRANGEMENTS.map((a) => (
                    <option key={a} value={a}>
                      {t(`plans.arrangements.${a}`)}
                    </option>
                  ))}
                </select>
              )}
            </Field>
            {v("arrangement") === "diagonal" ? numberInput("diagonalStep", tf("labels.diagonalStep"), tf("diagonalHint")) : null}
            {v("arrangement") === "rotation" ? (
              <Field id="plan-rotationOrder" label={tf("labels.rotationOrder")} errors={errors("rotationOrder")}>
                {(aria) => (
                  <select {...aria} name="rotationOrder" value={v("rotationOrder") || "4"} onChange={setField("rotationOrder")}>
                    {["2", "3", "4", "6"].map((o) => (
                      <option key={o} value={o}>
                        {o}
                      </option>
                    ))}
                  </select>
                )}
              </Field>
            ) : null}
            <div className="grid grid-cols-2 gap-3">
              {numberInput("gapX", lengthLabel("gapX"), tf("gapHint"))}
              {numberInput("gapY", lengthLabel("gapY"))}
            </div>
            <div className="grid grid-cols-3 gap-3">
              <Field id="plan-align" label={tf("labels.align")}>
                {(aria) => (
                  <select {...aria} name="align" value={v("align") || "centre"} onChange={setField("align")}>
                    <option value="centre">{tf("aligns.centre")}</option>
                    <option value="left">{tf("aligns.left")}</option>
                  </select>
                )}
              </Field>
              <Field id="plan-edges" label={tf("labels.edges")}>
                {(aria) => (
                  <select {...aria} name="edges" value={v("edges") || "whole"} onChange={setField("edges")}>
                    <option value="whole">{tf("edgeModes.whole")}</option>
                    <option value="clip">{tf("edgeModes.clip")}</option>
                  </select>
                )}
              </Field>
              <Field id="plan-sides" label={tf("labels.sides")}>
                {(aria) => (
                  <select {...aria} name="sides" value={v("sides") || "1"} onChange={setField("sides")}>
                    <option value="1">{tf("sidesOptions.one")}</option>
                    <option value="2">{tf("sidesOptions.both")}</option>
                  </select>
                )}
              </Field>
            </div>
          </fieldset>

          <fieldset className="space-y-3 rounded-lg border border-stone-200 bg-white p-4">
            <legend className="px-1 text-sm font-semibold text-stone-900">{tf("borderTitle")}</legend>
            <Field id="plan-borderSide" label={tf("labels.borderSide")} errors={errors("borderSide")}>
              {(aria) => (
                <select {...aria} name="borderSide" value={v("borderSide") || "none"} onChange={setField("borderSide")}>
                  {(["none", "left", "right", "both"] as const).map((s) => (
                    <option key={s} value={s}>
                      {tf(`borderSides.${s}`)}
                    </option>
                  ))}
                </select>
              )}
            </Field>
            {hasBorder ? (
              <>
                <div className="flex gap-4 text-sm" role="radiogroup" aria-label={tf("borderStampMode")}>
                  {(["library", "free"] as const).map((m) => (
                    <label key={m} className="flex items-center gap-1.5">
                      <input type="radio" name="borderStampMode" value={m} checked={(v("borderStampMode") || "library") === m} onChange={setField("borderStampMode")} />
                      {tf(`stampModes.${m}`)}
                    </label>
                  ))}
                </div>
                {v("borderStampMode") === "free" ? (
                  <div className="grid grid-cols-3 gap-3">
                    {numberInput("borderStampWidth", lengthLabel("stampWidth"))}
                    {numberInput("borderStampHeight", lengthLabel("stampHeight"))}
                    {numberInput("borderCoveragePct", tf("labels.coveragePct"))}
                  </div>
                ) : (
                  <StampPicker id="plan-borderStampCode" name="borderStampCode" label={tf("labels.borderStampCode")} value={v("borderStampCode")} onChange={(c) => set({ borderStampCode: c })} errors={errors("borderStampCode")} chosen={borderStamp.data} unitSystem={unitSystem} disabled={readOnly} />
                )}
                <div className="grid grid-cols-2 gap-3">
                  <Field id="plan-borderTurn" label={tf("labels.borderTurn")} errors={errors("borderTurn")}>
                    {(aria) => (
                      <select {...aria} name="borderTurn" value={v("borderTurn") || "0"} onChange={setField("borderTurn")}>
                        {["0", "90", "180", "270"].map((d) => (
                          <option key={d} value={d}>
                            {d}°
                          </option>
                        ))}
                      </select>
                    )}
                  </Field>
                  {v("borderSide") === "both" ? (
                    <Field id="plan-borderRightCopy" label={tf("labels.borderRightCopy")}>
                      {(aria) => (
                        <select {...aria} name="borderRightCopy" value={v("borderRightCopy") || "mirror"} onChange={setField("borderRightCopy")}>
                          {(["mirror", "turn", "same"] as const).map((c) => (
                            <option key={c} value={c}>
                              {tf(`rightCopies.${c}`)}
                            </option>
                          ))}
                        </select>
                      )}
                    </Field>
                  ) : null}
                </div>
                <label className="flex items-center gap-2 text-sm text-stone-800">
                  <input type="checkbox" name="borderMirror" checked={v("borderMirror") === "on"} onChange={setField("borderMirror")} />
                  {tf("labels.borderMirror")}
                </label>
                <div className="grid grid-cols-2 gap-3">
                  {numberInput("borderGapY", lengthLabel("borderGapY"))}
                  {numberInput("borderGapToField", lengthLabel("borderGapToField"), tf("gapToFieldHint"))}
                  {numberInput("borderOffset", lengthLabel("borderOffset"))}
                  {numberInput("borderStart", lengthLabel("borderStart"))}
                </div>
              </>
            ) : null}
          </fieldset>

          {!readOnly ? (
            <fieldset className="space-y-3 rounded-lg border border-stone-200 bg-white p-4">
              <legend className="px-1 text-sm font-semibold text-stone-900">{tf("saveTitle")}</legend>
              <Field id="plan-name" label={tf("labels.name")} errors={errors("name")}>
                {(aria) => <input {...aria} name="name" autoComplete="off" value={v("name")} onChange={setField("name")} />}
              </Field>
              <Field id="plan-notes" label={tf("labels.notes")} errors={errors("notes")}>
                {(aria) => <textarea {...aria} name="notes" rows={3} value={v("notes")} onChange={setField("notes")} />}
              </Field>
              {errors("_form") ? <Notice tone="error">{errors("_form")!.join(" ")}</Notice> : null}
              <Button type="submit" disabled={pending}>
                {pending ? tf("saving") : mode === "new" ? tf("create") : tf("save")}
              </Button>
            </fieldset>
          ) : null}
        </fieldset>
      </form>

      <div className="min-w-0 space-y-4" data-testid="plan-live" data-seq={outcome?.seq ?? 0} data-state={waiting ? "waiting" : outcome?.ok ? "ready" : outcome ? "invalid" : "waiting"}>
        <Panel title={tf("pictureTitle")}>
          {waiting ? (
            <p className="text-sm text-stone-600">{tf("lookingUp")}</p>
          ) : outcome && outcome.ok ? (
            <PictureViewport spec={outcome.spec} leftover={outcome.result.leftover} stampPictures={pictures} unitSystem={unitSystem} />
          ) : (
            <p className="text-sm text-stone-600" data-testid="picture-waiting">
              {outcome ? tf("fixFields") : tf("computing")}
            </p>
          )}
        </Panel>
        <Panel title={tf("numbersTitle")}>
          {result ? <PlanNumbers summary={result} unitSystem={unitSystem} impressionsPerHour={impressionsPerHour} byPieces={byPieces} /> : <p className="text-sm text-stone-600">{outcome ? tf("fixFields") : tf("computing")}</p>}
        </Panel>
        {result ? (
          <Panel title={tf("fitTitle")} intro={tf("fitIntro")}>
            <FitHelper
              rows={result.fitTable}
              unitSystem={unitSystem}
              canEdit={!readOnly}
              canAskStamp={canRequestNew && v("stampMode") !== "free"}
              onApplyGap={(gapMm) => set({ gapX: fromMm(gapMm, unit) })}
              onAskStamp={(widthMm) => setAskWidthMm(widthMm)}
            />
          </Panel>
        ) : null}
      </div>
      {askWidthMm !== null ? <NewStampRequestDialog widthMm={askWidthMm} heightMm={stampHeightMm} planId={plan?.id ?? null} unitSystem={unitSystem} onClose={() => setAskWidthMm(null)} /> : null}
    </div>
  );
}
