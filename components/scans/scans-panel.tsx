"use client";

import { useState } from "react";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useFormatter, useTranslations } from "next-intl";
import { Button } from "@/components/ui/button";
import { cn } from "@/components/ui/cn";
import { Notice } from "@/components/ui/notice";
import { scanUrls, type ScanDto } from "@/lib/contracts/scans";
import { ApiError, apiFetch } from "@/lib/swr/fetcher";
import { useScans, useSimilarStamps, type ScansAnswer } from "@/lib/swr/use-scans";
import { CoverageReview } from "./coverage-review";
import { ScanUploader } from "./scan-uploader";
import { Modal } from "@/components/ui/modal";
import { measures } from "@/lib/i18n/measures";

interface Props {
  code: string;
  canWrite: boolean;
  unitSystem: "metric" | "imperial";
  stampCoverage: number | null;
  /** With an outline the layout engine uses its area and ignores the coverage. */
  hasOutline: boolean;
  initial: ScansAnswer;
}

/** Scans of one stamp on its record page: uploader, gallery, viewer, coverage review and look-alike stamps. */
export function ScansPanel({ code, canWrite, unitSystem, stampCoverage, hasOutline, initial }: Props) {
  const t = useTranslations("scans");
  const { data, error, isLoading, mutate } = useScans(code, initial);
  const similar = useSimilarStamps(code);
  const [reviewing, setReviewing] = useState<string | null>(null);
  const [viewing, setViewing] = useState<ScanDto | null>(null);
  const scans = data?.scans ?? [];
  const reviewed = scans.find((s) => s.id === reviewing) ?? null;

  return (
    <div className="space-y-5" data-testid="scans-panel">
      {canWrite ? (
        <ScanUploader
          code={code}
          maxBytes={data?.limits.maxBytes ?? initial.limits.maxBytes}
          onStored={(scan) => {
            void mutate((current) => (current ? { ...current, scans: [scan, ...current.scans.filter((s) => s.id !== scan.id)] } : current), { revalidate: true });
            void similar.mutate();
          }}
        />
      ) : null}

      {error ? (
        <Notice tone="error">
          {t("panel.loadFailed", { message: error instanceof Error ? error.message : String(error) })}{" "}
          <button type="button" className="underline" onClick={() => mutate()}>
            {t("panel.retry")}
          </button>
        </Notice>
      ) : isLoading && !data ? (
        <p className="text-sm text-stone-500">{t("panel.loading")}</p>
      ) : scans.length === 0 ? (
        <p className="text-sm text-stone-500" data-testid="scans-empty">
          {canWrite ? t("panel.emptyKeeper") : t("panel.empty")}
        </p>
      ) : (
        <ul className="grid gap-3 sm:grid-cols-2" data-testid="scan-gallery">
          {scans.map((scan) => (
            <ScanCard
              key={scan.id}
              scan={scan}
              canWrite={canWrite}
              unitSystem={unitSystem}
              onView={() => setViewing(scan)}
              onReview={() => setReviewing(scan.id)}
              onDeleted={() => {
                if (reviewing === scan.id) setReviewing(null);
                void mutate();
                void similar.mutate();
              }}
            />
          ))}
        </ul>
      )}

      {reviewed ? <CoverageReview key={reviewed.id} scan={reviewed} canWrite={canWrite} stampCoverage={stampCoverage} hasOutline={hasOutline} onClose={() => setReviewing(null)} onSaved={() => mutate()} /> : null}

      <ScanViewer scan={viewing} code={code} onClose={() => setViewing(null)} />

      <section className="border-t border-stone-100 pt-4" data-testid="similar-stamps">
        <h3 className="text-sm font-semibold text-stone-900">{t("similar.title")}</h3>
        <p className="mt-0.5 text-xs text-stone-500">{t("similar.intro")}</p>
        {scans.length === 0 ? (
          <p className="mt-2 text-sm text-stone-500">{t("similar.noScans")}</p>
        ) : similar.data && similar.data.stamps.length === 0 ? (
          <p className="mt-2 text-sm text-stone-500">{t("similar.none")}</p>
        ) : (
          <ul className="mt-3 grid grid-cols-3 gap-3 sm:grid-cols-4">
            {(similar.data?.stamps ?? []).map((s) => (
              <li key={s.code}>
                <Link href={`/stamps/${encodeURIComponent(s.code)}`} className="group block text-xs">
                  {/* eslint-disable-next-line @next/next/no-img-element -- thumbnails come from our API */}
                  <img src={s.urls.thumb} alt="" loading="lazy" className="aspect-square w-full rounded border border-stone-200 bg-stone-100 object-contain group-hover:border-ink-400" />
                  <span className="mt-1 block font-mono text-ink-700 group-hover:underline">{s.code}</span>
                  <span className="block truncate text-stone-600">{s.name}</span>
                  <span className="block text-stone-500">
                    {t("similar.distance", { alike: 1 - s.distance })}
                    {s.close ? null : <span className="ml-1">· {t("similar.loose")}</span>}
                    {s.orientation === "mirrored" ? (
                      <span className="ml-1 rounded bg-soga-50 px-1 text-soga-700" title={t("similar.mirrorHint")}>
                        {t("similar.mirror")}
                      </span>
                    ) : null}
                  </span>
                </Link>
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}

function ScanCard({ scan, canWrite, unitSystem, onView, onReview, onDeleted }: { scan: ScanDto; canWrite: boolean; unitSystem: "metric" | "imperial"; onView: () => void; onReview: () => void; onDeleted: () => void }) {
  const t = useTranslations("scans");
  const format = useFormatter();
  const router = useRouter();
  const [deleting, setDeleting] = useState(false);
  const [deleteError, setDeleteError] = useState<string | null>(null);
  const kind = t(`kindShort.${scan.kind}`);
  const measure = measures(format, unitSystem);
  const check = scan.sizeCheck;

  async function remove() {
    if (!window.confirm(t("card.confirmDelete", { fileName: scan.fileName }))) return;
    setDeleting(true);
    setDeleteError(null);
    try {
      await apiFetch(scanUrls.one(scan.stampCode, scan.id), { method: "DELETE" });
      onDeleted();
      router.refresh();
    } catch (e) {
      setDeleteError(t("card.deleteFailed", { message: e instanceof ApiError ? e.message : String(e) }));
      setDeleting(false);
    }
  }

  return (
    <li className="flex gap-3 rounded-md border border-stone-200 p-2.5" data-testid="scan-card" data-scan-id={scan.id}>
      <button type="button" onClick={onView} className="shrink-0" aria-label={t("card.view")}>
        {/* eslint-disable-next-line @next/next/no-img-element -- thumbnails come from our API */}
        <img src={scan.urls.thumb} alt={t("card.thumbAlt", { kind, code: scan.stampCode, fileName: scan.fileName })} className="h-24 w-24 rounded border border-stone-200 bg-stone-100 object-contain" data-testid="scan-thumb" />
      </button>
      <div className="min-w-0 flex-1 space-y-1 text-xs text-stone-600">
        <div className="flex items-center gap-1.5">
          <span className="rounded bg-stone-100 px-1.5 py-0.5 font-medium text-stone-700">{kind}</span>
          <span className="truncate text-stone-800" title={scan.fileName}>
            {scan.fileName}
          </span>
        </div>
        <div>
          {t("card.pixels", { width: scan.widthPx, height: scan.heightPx })}
          {scan.dpi ? ` · ${t("card.dpi", { dpi: scan.dpi })} (${scan.dpiSource === "keeper" ? t("card.dpiFromKeeper") : t("card.dpiFromFile")})` : null}
        </div>
        {scan.sizeMm && check ? (
          <div data-testid="size-check" className={cn(check.warn ? "text-amber-800" : "text-emerald-800")}>
            {t("card.measured", { size: measure.size(scan.sizeMm.widthMm, scan.sizeMm.heightMm) })}.{" "}
            {check.warn ? t("card.sizeWarn", { deviation: check.maxDeviationPct, tolerance: check.tolerancePct }) : t("card.sizeOk", { tolerance: check.tolerancePct })}
          </div>
        ) : (
          <div className="text-amber-800" data-testid="size-check">
            {t("card.noDpi")}
          </div>
        )}
        <div>{t("card.coverage", { ratio: scan.coverageRatio })}</div>
        <div className="text-stone-500">{t("card.uploaded", { name: scan.uploadedByName, when: format.dateTime(new Date(scan.createdAt), "moment") })}</div>
        <div className="flex flex-wrap gap-x-3 gap-y-1 pt-1">
          <button type="button" className="text-ink-700 hover:underline" onClick={onView}>
            {t("card.view")}
          </button>
          <a href={scan.urls.download} className="text-ink-700 hover:underline" download>
            {t("card.download")}
          </a>
          <button type="button" className="text-ink-700 hover:underline" onClick={onReview} data-testid="review-coverage">
            {t("card.review")}
          </button>
          {canWrite ? (
            <button type="button" className="text-red-700 hover:underline disabled:text-red-300" onClick={remove} disabled={deleting} data-testid="delete-scan">
              {t("card.delete")}
            </button>
          ) : null}
        </div>
        {deleteError ? (
          <p role="alert" className="text-red-800">
            {deleteError}
          </p>
        ) : null}
      </div>
    </li>
  );
}

/** The large view in a modal dialog (Escape closes it). */
function ScanViewer({ scan, code, onClose }: { scan: ScanDto | null; code: string; onClose: () => void }) {
  const t = useTranslations("scans.viewer");
  return (
    <Modal open={scan !== null} onClose={onClose} className="max-h-[95vh] max-w-[95vw] backdrop:bg-stone-900/70" data-testid="scan-viewer">
      {scan ? (
        <div className="flex flex-col">
          <div className="flex items-center justify-between gap-4 border-b border-stone-200 px-4 py-2 text-sm">
            <span className="truncate font-medium">{t("title", { fileName: scan.fileName })}</span>
            <Button type="button" variant="secondary" className="px-2 py-1 text-xs" onClick={onClose}>
              {t("close")}
            </Button>
          </div>
          {/* eslint-disable-next-line @next/next/no-img-element -- the 1024 px view from our API */}
          <img src={scan.urls.large} alt={t("alt", { fileName: scan.fileName, code })} className="max-h-[85vh] max-w-[90vw] object-contain" />
        </div>
      ) : null}
    </Modal>
  );
}
