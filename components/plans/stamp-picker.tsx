"use client";

import { useFormatter, useTranslations } from "next-intl";
import { useId, useState } from "react";
import { ConditionBadge, OutBadge } from "@/components/stamps/condition-badge";
import { measures } from "@/lib/i18n/measures";
import { cn } from "@/components/ui/cn";
import type { PlannerStamp, StampChoice } from "@/lib/contracts/plans";
import type { UnitSystem } from "@/lib/stamps/format";
import { usePlanStampSearch } from "@/lib/swr/use-planner-stamp";

const control = "block w-full rounded-md border border-stone-300 bg-white px-3 py-2 text-sm shadow-xs focus:border-ink-500 aria-invalid:border-red-500";

function Thumb({ url, label }: { url: string | null; label: string }) {
  // eslint-disable-next-line @next/next/no-img-element -- scan thumbnails stream from the API with the session cookie
  return url ? <img src={url} alt={label} className="h-10 w-10 shrink-0 rounded border border-stone-200 bg-white object-contain" /> : <span className="h-10 w-10 shrink-0 rounded border border-dashed border-stone-300 bg-stone-50" aria-hidden="true" />;
}

/** A stamp as the picker lists it: thumbnail, code, name, size, condition and whether it is out. */
export function StampLine({ stamp, unitSystem }: { stamp: StampChoice; unitSystem: UnitSystem }) {
  const t = useTranslations();
  const format = useFormatter();
  return (
    <span className="flex items-center gap-3">
      <Thumb url={stamp.thumbUrl} label={t("plans.form.thumbOf", { code: stamp.code })} />
      <span className="min-w-0">
        <span className="block truncate">
          <span className="font-mono font-medium">{stamp.code}</span> · {stamp.name}
        </span>
        <span className="flex flex-wrap items-center gap-1.5 text-xs text-stone-600">
          {measures(format, unitSystem).size(stamp.widthMm, stamp.heightMm)}
          <ConditionBadge condition={stamp.condition} label={t(`stamps.conditions.${stamp.condition}`)} />
          {stamp.out ? <OutBadge label={t("stamps.table.out")} /> : null}
        </span>
      </span>
    </span>
  );
}

/**
 * A search box for a library stamp by code or name (a combobox: arrow keys and Enter pick). Its text is the field's
 * value, so a typed code works without picking; the chosen stamp shows below it with its thumbnail and state.
 */
export function StampPicker({ id, name, label, hint, value, onChange, errors, chosen, unitSystem, disabled }: { id: string; name: string; label: string; hint?: string; value: string; onChange: (code: string) => void; errors?: string[]; chosen: PlannerStamp | null | undefined; unitSystem: UnitSystem; disabled?: boolean }) {
  const t = useTranslations("plans.form");
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(0);
  const { data: results = [], isLoading } = usePlanStampSearch(open ? value : "");
  const listId = useId();
  const errorId = `${id}-error`;
  const hintId = `${id}-hint`;
  const shown = open && value.trim() !== "" && !(results.length === 1 && results[0].code === value.trim().toUpperCase());
  const pick = (code: string) => {
    onChange(code);
    setOpen(false);
  };
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium text-stone-800">
        {label}
      </label>
      <div className="relative">
        <input
          id={id}
          name={name}
          role="combobox"
          aria-expanded={shown}
          aria-controls={shown ? listId : undefined}
          aria-autocomplete="list"
          aria-activedescendant={shown && results[active] ? `${listId}-${active}` : undefined}
          aria-invalid={errors?.length ? true : undefined}
          aria-describedby={[hint ? hintId : null, errors?.length ? errorId : null].filter(Boolean).join(" ") || undefined}
          autoComplete="off"
          disabled={disabled}
          value={value}
          className={cn(control, "font-mono uppercase placeholder:normal-case")}
          placeholder={t("stampSearchPlaceholder")}
          onChange={(e) => {
            onChange(e.target.value);
            setOpen(true);
            setActive(0);
          }}
          onFocus={() => setOpen(true)}
          onBlur={() => setTimeout(() => setOpen(false), 150)}
          onKeyDown={(e) => {
            if (!shown) return;
            if (e.key === "ArrowDown") {
              e.preventDefault();
              setActive((a) => Math.min(results.length - 1, a + 1));
            } else if (e.key === "ArrowUp") {
              e.preventDefault();
              setActive((a) => Math.max(0, a - 1));
            } else if (e.key === "Enter" && results[active]) {
              e.preventDefault();
              pick(results[active].code);
            } else if (e.key === "Escape") setOpen(false);
          }}
        />
        {shown ? (
          <ul id={listId} role="listbox" aria-label={t("stampResults")} className="absolute z-20 mt-1 max-h-80 w-full overflow-auto rounded-md border border-stone-200 bg-white py-1 text-sm shadow-lg">
            {results.length === 0 ? (
              <li role="presentation" className="px-3 py-2 text-stone-600">
                {isLoading ? t("searching") : t("noStamps")}
              </li>
            ) : (
              results.map((s, k) => (
                <li
                  key={s.code}
                  id={`${listId}-${k}`}
                  role="option"
                  aria-selected={k === active}
                  className={cn("cursor-pointer px-3 py-1.5", k === active ? "bg-ink-50" : "hover:bg-stone-50")}
                  onMouseDown={(e) => {
                    e.preventDefault();
                    pick(s.code);
                  }}
                >
                  <StampLine stamp={s} unitSystem={unitSystem} />
                </li>
              ))
            )}
          </ul>
        ) : null}
      </div>
      {hint ? (
        <p id={hintId} className="text-xs text-stone-500">
          {hint}
        </p>
      ) : null}
      <p id={errorId} className={cn("text-sm text-red-700", !errors?.length && "sr-only")} aria-live="polite">
        {errors?.join(" ")}
      </p>
      {chosen ? (
        <div className="rounded-md border border-stone-200 bg-stone-50 p-2 text-sm" data-testid={`${id}-chosen`}>
          <StampLine stamp={chosen} unitSystem={unitSystem} />
          <p className="mt-1 text-xs text-stone-600">
            {chosen.picture ? t("drawnFromScan") : chosen.hasOutline ? t("drawnFromOutline") : chosen.coverageRatio !== null ? t("drawnFromCoverage") : t("drawnFromFootprint")}
            {chosen.location ? ` · ${chosen.location.site} · ${chosen.location.code}` : ""}
          </p>
        </div>
      ) : null}
    </div>
  );
}
