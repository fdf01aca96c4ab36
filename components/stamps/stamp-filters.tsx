"use client";

import { useTranslations } from "next-intl";
import { Button } from "@/components/ui/button";
import { cn } from "@/components/ui/cn";
import type { useUrlParams } from "@/components/ui/use-url-params";
import type { LocationDto } from "@/lib/contracts/stamps";
import { locationLabel, type UnitSystem } from "@/lib/stamps/format";
import { inchesToMm, mmToInches } from "@/lib/units";
import { stampConditions } from "@/lib/validation/stamps";
import { useState } from "react";

interface Props {
  url: ReturnType<typeof useUrlParams>;
  search: string;
  setSearch: (value: string) => void;
  locations: LocationDto[];
  sites: string[];
  unitSystem: UnitSystem;
  /** Messages per filter the API refused (a minimum above its maximum). */
  refused: Record<string, string[]>;
  filtered: boolean;
}

/** The stamp table's filters; each lives in the address (useUrlParams), sizes typed in the person's units. */
export function StampFilters({ url, search, setSearch, locations, sites, unitSystem, refused, filtered }: Props) {
  const t = useTranslations();
  const conditions = (url.params.get("condition") ?? "").split(",").filter(Boolean);
  const site = url.params.get("site") ?? "";
  const toUnits = (mm: string | null) => (mm ? String(unitSystem === "imperial" ? Number(mmToInches(Number(mm)).toFixed(2)) : Number(mm)) : "");
  const fromUnits = (value: string) => (value === "" || Number.isNaN(Number(value)) ? null : String(Math.round((unitSystem === "imperial" ? inchesToMm(Number(value)) : Number(value)) * 10) / 10));
  const unit = unitSystem === "imperial" ? "in" : "mm";
  const rangeErrors = (a: string, b: string) => [...(refused[a] ?? []), ...(refused[b] ?? [])];
  const widthErrors = rangeErrors("minWidthMm", "maxWidthMm");
  const heightErrors = rangeErrors("minHeightMm", "maxHeightMm");
  const outValue = url.params.get("overdue") === "true" ? "overdue" : (url.params.get("out") ?? "");
  return (
    <div className="flex flex-wrap items-end gap-3 rounded-lg border border-stone-200 bg-white p-3" role="search" aria-label={t("stamps.filters.label")}>
      <label className="flex min-w-56 flex-1 flex-col gap-1 text-xs font-medium text-stone-700">
        {t("stamps.filters.search")}
        <input
          type="search"
          aria-label={t("stamps.filters.search")}
          value={search}
          onChange={(e) => setSearch(e.target.value)}
          placeholder={t("stamps.filters.searchPlaceholder")}
          className="rounded-md border border-stone-300 px-3 py-1.5 text-sm font-normal"
        />
      </label>
      <details className="relative">
        <summary className="cursor-pointer list-none rounded-md border border-stone-300 bg-white px-3 py-1.5 text-sm">
          {t("stamps.filters.condition")}
          {conditions.length ? ` (${conditions.length})` : ""} ▾
        </summary>
        <fieldset className="absolute z-10 mt-1 w-56 space-y-1 rounded-md border border-stone-200 bg-white p-3 shadow-lg">
          <legend className="sr-only">{t("stamps.filters.condition")}</legend>
          {stampConditions.map((c) => (
            <label key={c} className="flex items-center gap-2 text-sm">
              <input
                type="checkbox"
                checked={conditions.includes(c)}
                onChange={(e) => {
                  const next = e.target.checked ? [...conditions, c] : conditions.filter((x) => x !== c);
                  url.set({ condition: next.join(",") || null });
                }}
              />
              {t(`stamps.conditions.${c}`)}
            </label>
          ))}
        </fieldset>
      </details>
      <label className="flex flex-col gap-1 text-xs font-medium text-stone-700">
        {t("stamps.filters.site")}
        <select aria-label={t("stamps.filters.site")} value={site} onChange={(e) => url.set({ site: e.target.value || null, location: null })} className="rounded-md border border-stone-300 bg-white px-2 py-1.5 text-sm font-normal">
          <option value="">{t("stamps.filters.anySite")}</option>
          {sites.map((s) => (
            <option key={s} value={s}>
              {s}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 text-xs font-medium text-stone-700">
        {t("stamps.filters.location")}
        <select aria-label={t("stamps.filters.location")} value={url.params.get("location") ?? ""} onChange={(e) => url.set({ location: e.target.value || null })} className="rounded-md border border-stone-300 bg-white px-2 py-1.5 text-sm font-normal">
          <option value="">{t("stamps.filters.anyLocation")}</option>
          {locations
            .filter((l) => !site || l.site === site)
            .map((l) => (
              <option key={l.id} value={l.id}>
                {locationLabel(l)}
              </option>
            ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 text-xs font-medium text-stone-700">
        {t("stamps.filters.face")}
        <select aria-label={t("stamps.filters.face")} value={url.params.get("face") ?? ""} onChange={(e) => url.set({ face: e.target.value || null })} className="rounded-md border border-stone-300 bg-white px-2 py-1.5 text-sm font-normal">
          <option value="">{t("stamps.filters.anyFace")}</option>
          <option value="single">{t("stamps.faces.single")}</option>
          <option value="pair">{t("stamps.faces.pair")}</option>
        </select>
      </label>
      <label className="flex flex-col gap-1 text-xs font-medium text-stone-700">
        {t("stamps.filters.out")}
        <select
          aria-label={t("stamps.filters.out")}
          value={outValue}
          onChange={(e) => {
            const v = e.target.value;
            url.set({ out: v === "true" || v === "false" ? v : null, overdue: v === "overdue" ? "true" : null });
          }}
          className="rounded-md border border-stone-300 bg-white px-2 py-1.5 text-sm font-normal"
        >
          <option value="">{t("stamps.filters.outAny")}</option>
          <option value="false">{t("stamps.filters.outNo")}</option>
          <option value="true">{t("stamps.filters.outYes")}</option>
          <option value="overdue">{t("stamps.filters.outOverdue")}</option>
        </select>
      </label>
      <fieldset className="flex flex-col gap-1 text-xs font-medium text-stone-700">
        <legend className="mb-1">{t("stamps.filters.width", { unit })}</legend>
        <span className="flex items-center gap-1">
          <RangeInput label={t("stamps.filters.widthFrom", { unit })} value={toUnits(url.params.get("minWidthMm"))} onCommit={(v) => url.set({ minWidthMm: fromUnits(v) })} errorId={widthErrors.length ? "filter-width-error" : undefined} />–
          <RangeInput label={t("stamps.filters.widthTo", { unit })} value={toUnits(url.params.get("maxWidthMm"))} onCommit={(v) => url.set({ maxWidthMm: fromUnits(v) })} errorId={widthErrors.length ? "filter-width-error" : undefined} />
        </span>
        <RangeError id="filter-width-error" messages={widthErrors} />
      </fieldset>
      <fieldset className="flex flex-col gap-1 text-xs font-medium text-stone-700">
        <legend className="mb-1">{t("stamps.filters.height", { unit })}</legend>
        <span className="flex items-center gap-1">
          <RangeInput label={t("stamps.filters.heightFrom", { unit })} value={toUnits(url.params.get("minHeightMm"))} onCommit={(v) => url.set({ minHeightMm: fromUnits(v) })} errorId={heightErrors.length ? "filter-height-error" : undefined} />–
          <RangeInput label={t("stamps.filters.heightTo", { unit })} value={toUnits(url.params.get("maxHeightMm"))} onCommit={(v) => url.set({ maxHeightMm: fromUnits(v) })} errorId={heightErrors.length ? "filter-height-error" : undefined} />
        </span>
        <RangeError id="filter-height-error" messages={heightErrors} />
      </fieldset>
      {filtered ? (
        <Button type="button" variant="ghost" onClick={url.clear}>
          {t("stamps.filters.clear")}
        </Button>
      ) : null}
    </div>
  );
}

/** The message under a from–to pair of filter boxes; both boxes point at it. */
function RangeError({ id, messages }: { id: string; messages: string[] }) {
  return (
    <p id={id} className={cn("max-w-48 text-xs font-normal text-red-700", !messages.length && "sr-only")} aria-live="polite">
      {messages.join(" ")}
    </p>
  );
}

/** A number box that applies its value when the person leaves it or presses Enter. */
function RangeInput({ label, value, onCommit, errorId }: { label: string; value: string; onCommit: (value: string) => void; errorId?: string }) {
  const [draft, setDraft] = useState(value);
  const [last, setLast] = useState(value);
  if (value !== last) {
    setLast(value);
    setDraft(value);
  }
  return (
    <input
      type="number"
      inputMode="decimal"
      min={0}
      step="any"
      aria-label={label}
      aria-invalid={errorId ? true : undefined}
      aria-describedby={errorId}
      value={draft}
      onChange={(e) => setDraft(e.target.value)}
      onBlur={() => draft !== value && onCommit(draft)}
      onKeyDown={(e) => e.key === "Enter" && onCommit(draft)}
      className="w-20 rounded-md border border-stone-300 px-2 py-1.5 text-sm font-normal aria-invalid:border-red-500"
    />
  );
}
