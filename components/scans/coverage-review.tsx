"use client";

import { useEffect, useState } from "react";
import { useRouter } from "next/navigation";
import { useFormatter, useTranslations } from "next-intl";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import type { ScanDto } from "@/lib/contracts/scans";
import { ApiError, apiFetch } from "@/lib/swr/fetcher";
import { scansKey, useCoveragePreview } from "@/lib/swr/use-scans";
import { waxPolarityValues } from "@/lib/validation/scans";

type Polarity = (typeof waxPolarityValues)[number];

/** Waits until the value has stopped changing for `ms`, so dragging the slider asks the server once per pause. */
function useSettled<T>(value: T, ms = 150): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return settled;
}

/**
 * The keeper's review of a scan's coverage: the overlay of what counts as wax, a threshold slider (starting at
 * the saved or Otsu's threshold), the live ratio, and saving it to the stamp. The server measures again on save.
 */
export function CoverageReview({
  scan,
  canWrite,
  stampCoverage,
  hasOutline,
  onClose,
  onSaved,
}: {
  scan: ScanDto;
  canWrite: boolean;
  stampCoverage: number | null;
  hasOutline: boolean;
  onClose: () => void;
  onSaved: () => void;
}) {
  const t = useTranslations("scans.coverage");
  const format = useFormatter();
  const router = useRouter();
  const [polarity, setPolarity] = useState<Polarity>(scan.polarity);
  const [threshold, setThreshold] = useState<number>(scan.threshold);
  const settledThreshold = useSettled(threshold);
  const { data, error, isLoading } = useCoveragePreview(scan, polarity, settledThreshold);
  const [saving, setSaving] = useState(false);
  const [saveError, setSaveError] = useState<string | null>(null);
  const [savedRatio, setSavedRatio] = useState<number | null>(null);
  const coverage = data?.coverage;
  const overlayUrl = `${scan.urls.overlay}?${new URLSearchParams({ polarity, threshold: String(settledThreshold) })}`;
  const percent = (ratio: number) => format.number(ratio, "percent");

  async function save() {
    setSaving(true);
    setSaveError(null);
    try {
      const answer = await apiFetch<{ coverageRatio: number }>(`${scansKey(scan.stampCode)}/${scan.id}/coverage`, { method: "POST", body: JSON.stringify({ polarity, threshold }) });
      setSavedRatio(answer.coverageRatio);
      onSaved();
      router.refresh();
    } catch (e) {
      setSaveError(e instanceof ApiError ? e.message : String(e));
    } finally {
      setSaving(false);
    }
  }

  return (
    <section className="rounded-lg border border-ink-200 bg-ink-50/40 p-4" data-testid="coverage-review" aria-label={t("title", { fileName: scan.fileName })}>
      <div className="flex items-start justify-between gap-3">
        <div>
          <h3 className="text-sm font-semibold text-stone-900">{t("title", { fileName: scan.fileName })}</h3>
          <p className="mt-1 text-xs text-stone-600">{t("intro")}</p>
        </div>
        <Button type="button" variant="ghost" className="px-2 py-1 text-xs" onClick={onClose}>
          {t("close")}
        </Button>
      </div>
      <div className="mt-3 grid gap-4 md:grid-cols-[minmax(0,1fr)_16rem]">
        {/* eslint-disable-next-line @next/next/no-img-element -- served by our API from the object store, sized by the server */}
        <img src={overlayUrl} alt={t("overlayAlt")} className="w-full rounded border border-stone-200 bg-stone-900 object-contain" data-testid="coverage-overlay" />
        <div className="space-y-4 text-sm">
          <label className="block">
            <span className="font-medium text-stone-800">{t("polarity")}</span>
            <select value={polarity} onChange={(e) => setPolarity(e.target.value as Polarity)} className="mt-1 block w-full rounded-md border border-stone-300 bg-white px-2.5 py-1.5">
              {waxPolarityValues.map((p) => (
                <option key={p} value={p}>
                  {t(`polarities.${p}`)}
                </option>
              ))}
            </select>
          </label>
          <label className="block">
            <span className="flex justify-between font-medium text-stone-800">
              {t("threshold")} <span className="font-mono">{threshold}</span>
            </span>
            <input type="range" min={0} max={255} step={1} value={threshold} onChange={(e) => setThreshold(Number(e.target.value))} className="mt-2 w-full" data-testid="coverage-threshold" />
          </label>
          {coverage ? (
            <div className="flex items-center justify-between text-xs text-stone-600">
              <span>{t("otsu", { value: coverage.otsuThreshold })}</span>
              <Button type="button" variant="secondary" className="px-2 py-1 text-xs" onClick={() => setThreshold(coverage.otsuThreshold)}>
                {t("useOtsu")}
              </Button>
            </div>
          ) : null}
          <div className="rounded-md bg-white p-3 shadow-xs">
            <div className="text-xs text-stone-500">{t("ratio")}</div>
            <div className="text-2xl font-semibold text-stone-900" data-testid="coverage-ratio" aria-live="polite">
              {coverage ? percent(coverage.ratio) : isLoading ? t("measuring") : "–"}
            </div>
            <div className="mt-1 text-xs text-stone-500">{t("current", { ratio: stampCoverage !== null ? percent(stampCoverage) : t("none") })}</div>
            <div className="mt-1 text-xs text-stone-500" data-testid="engine-uses">
              {hasOutline ? t("engineUsesOutline") : t("engineUsesCoverage")}
            </div>
          </div>
          {error ? <Notice tone="error">{t("failed", { message: error instanceof Error ? error.message : String(error) })}</Notice> : null}
          {canWrite ? (
            <Button type="button" onClick={save} disabled={saving || !coverage} className="w-full" data-testid="save-coverage">
              {saving ? t("saving") : t("save")}
            </Button>
          ) : null}
          {saveError ? <Notice tone="error">{saveError}</Notice> : null}
          {savedRatio !== null ? <Notice tone="success">{t(hasOutline ? "savedWithOutline" : "saved", { ratio: savedRatio })}</Notice> : null}
        </div>
      </div>
    </section>
  );
}
