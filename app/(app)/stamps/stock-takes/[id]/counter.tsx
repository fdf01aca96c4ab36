"use client";

import Link from "next/link";
import { useFormatter, useTranslations } from "next-intl";
import { useRef, useState } from "react";
import { QrScanner } from "@/components/stamps/qr-scanner";
import { Button } from "@/components/ui/button";
import { cn } from "@/components/ui/cn";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { PageHeader, Panel } from "@/components/ui/panel";
import { stampUrls, type StockTakeDto } from "@/lib/contracts/stamps";
import { locationFromScan } from "@/lib/stamps/codes";
import { ApiError, apiFetch } from "@/lib/swr/fetcher";
import { useStockTake } from "@/lib/swr/use-stock-take";

type Feedback = { tone: "success" | "warning" | "error"; text: string } | null;

export function StockTakeCounter({ initial, canWrite }: { initial: StockTakeDto; canWrite: boolean }) {
  const t = useTranslations();
  const format = useFormatter();
  const { data, mutate } = useStockTake(initial.id, initial);
  const take = data?.stockTake ?? initial;
  const open = take.status === "open";
  // No location until the keeper picks one or scans a shelf label: a guess would report false "wrong place" results.
  const [locationId, setLocationId] = useState("");
  const [code, setCode] = useState("");
  const [feedback, setFeedback] = useState<Feedback>(null);
  const [fieldErrors, setFieldErrors] = useState<{ locationId?: string[]; code?: string[] }>({});
  const [busy, setBusy] = useState(false);
  const input = useRef<HTMLInputElement>(null);
  const percent = take.expected ? Math.round((take.seenExpected / take.expected) * 100) : 0;

  /** A scanned shelf label switches where the count is; answers whether the text was one. */
  function switchShelf(text: string): boolean {
    const scanned = locationFromScan(text);
    if (!scanned) return false;
    const shelf = take.locations.find((l) => l.id === scanned);
    setCode((current) => (current === text ? "" : current));
    if (shelf) {
      setLocationId(shelf.id);
      setFieldErrors({});
      setFeedback({ tone: "success", text: t("stockTake.nowCountingAt", { code: shelf.code }) });
    } else {
      setFeedback({ tone: "error", text: t("stockTake.shelfElsewhere", { site: take.site }) });
    }
    input.current?.focus();
    return true;
  }

  async function see(text: string) {
    if (!text.trim()) return;
    if (switchShelf(text)) return;
    if (!locationId) {
      setFeedback(null);
      setFieldErrors({ locationId: [t("stockTake.chooseLocation")] });
      return;
    }
    setFieldErrors({});
    setBusy(true);
    try {
      const { sighting } = await apiFetch<{ sighting: { code: string; known: boolean; name: string | null; location: string } }>(stampUrls.sightings(take.id), {
        method: "POST",
        body: JSON.stringify({ code: text, locationId }),
      });
      setFeedback(
        sighting.known
          ? { tone: "success", text: t("stockTake.seen", { code: sighting.code, name: sighting.name ?? "", place: sighting.location }) }
          : { tone: "warning", text: t("stockTake.seenUnknown", { code: sighting.code }) },
      );
      // A scanner gun may already have typed the next code: clear only the one just marked.
      setCode((current) => (current === text ? "" : current));
      await mutate();
    } catch (e) {
      const error = e instanceof ApiError ? e : null;
      if (error?.fields) {
        setFeedback(null);
        setFieldErrors({ locationId: error.fields.locationId, code: error.fields.code ?? (error.fields.locationId ? undefined : Object.values(error.fields).flat()) });
      } else {
        setFeedback({ tone: "error", text: error?.message ?? t("common.error") });
      }
    } finally {
      setBusy(false);
      input.current?.focus();
    }
  }

  async function post(path: "relocate" | "end", confirmText: string, done: (body: { moved?: string[] }) => string) {
    if (!window.confirm(confirmText)) return;
    setBusy(true);
    try {
      const body = await apiFetch<{ moved?: string[] }>(stampUrls.stockTakeAction(take.id, path), { method: "POST" });
      setFeedback({ tone: "success", text: done(body) });
      await mutate();
    } catch (e) {
      setFeedback({ tone: "error", text: e instanceof ApiError ? e.message : t("common.error") });
    } finally {
      setBusy(false);
    }
  }

  async function undo(c: string) {
    try {
      await apiFetch(stampUrls.sighting(take.id, c), { method: "DELETE" });
      await mutate();
    } catch (e) {
      setFeedback({ tone: "error", text: e instanceof ApiError ? e.message : t("common.error") });
    }
  }

  const place = (p: { label: string } | null) => p?.label ?? t("stockTake.nowhere");
  const stampLink = (c: string) => (
    <Link href={`/stamps/${encodeURIComponent(c)}`} className="font-mono font-medium text-ink-700 hover:underline">
      {c}
    </Link>
  );

  return (
    <>
      <PageHeader
        title={t("stockTake.countAt", { site: take.site })}
        intro={t("stockTake.startedBy", { name: take.startedByName ?? "—", when: format.dateTime(new Date(take.startedAt), "moment") })}
        actions={
          <Link href="/stamps/stock-takes" className="text-sm text-ink-700 hover:underline">
            {t("stockTake.allCounts")}
          </Link>
        }
      />
      <div className="grid gap-6 lg:grid-cols-[2fr_3fr]">
        <div className="space-y-6">
          <Panel title={t("stockTake.progress")}>
            <p className="text-3xl font-semibold tabular-nums text-stone-900" data-testid="progress">
              {t("stockTake.seenOfExpected", { seen: take.seenExpected, expected: take.expected })}
            </p>
            <div className="mt-2 h-3 overflow-hidden rounded-full bg-stone-200" role="progressbar" aria-valuemin={0} aria-valuemax={take.expected} aria-valuenow={take.seenExpected} aria-label={t("stockTake.progress")}>
              {/* An SVG bar, not an inline style: the pages' CSP refuses style attributes in server-rendered HTML. */}
              <svg className="block h-full w-full" viewBox="0 0 100 1" preserveAspectRatio="none" aria-hidden="true">
                <rect width={percent} height="1" className="fill-emerald-600" />
              </svg>
            </div>
            <p className="mt-2 text-sm text-stone-600">
              {t("stockTake.summary", { missing: take.missing.length, misplaced: take.misplaced.length, unexpected: take.unexpected.length, out: take.checkedOut.length })}
            </p>
            {!open ? <Notice className="mt-3">{t("stockTake.closedOn", { when: format.dateTime(new Date(take.endedAt!), "moment") })}</Notice> : null}
          </Panel>

          {open && canWrite ? (
            <Panel title={t("stockTake.scanTitle")} intro={t("stockTake.scanIntro")}>
              <form
                className="space-y-3"
                aria-label={t("stockTake.scanTitle")}
                onSubmit={(e) => {
                  e.preventDefault();
                  void see(code);
                }}
              >
                <Field id="count-location" label={t("stockTake.countingAt")} hint={t("stockTake.countingAtHint")} errors={fieldErrors.locationId}>
                  {(aria) => (
                    <select
                      {...aria}
                      value={locationId}
                      onChange={(e) => {
                        setLocationId(e.target.value);
                        setFieldErrors({});
                      }}
                    >
                      <option value="">{t("stockTake.chooseLocationOption")}</option>
                      {take.locations.map((l) => (
                        <option key={l.id} value={l.id}>
                          {l.code}
                        </option>
                      ))}
                    </select>
                  )}
                </Field>
                <Field id="count-code" label={t("stockTake.code")} errors={fieldErrors.code}>
                  {(aria) => (
                    <span className="flex gap-2">
                      <input
                        {...aria}
                        ref={input}
                        value={code}
                        onChange={(e) => setCode(e.target.value)}
                        autoFocus
                        autoComplete="off"
                        placeholder={t("stockTake.codePlaceholder")}
                        className={cn(aria.className, "font-mono uppercase placeholder:normal-case")}
                      />
                      {/* Never disabled: a scanner gun types the next code while the last one is being saved. */}
                      <Button type="submit">{t("stockTake.mark")}</Button>
                    </span>
                  )}
                </Field>
                {feedback ? (
                  <Notice tone={feedback.tone} className="text-sm">
                    {feedback.text}
                  </Notice>
                ) : null}
              </form>
              <div className="mt-4">
                <QrScanner onCode={(text) => void see(text)} />
              </div>
            </Panel>
          ) : feedback ? (
            <Notice tone={feedback.tone}>{feedback.text}</Notice>
          ) : null}

          {canWrite ? (
            <Panel title={t("stockTake.finishTitle")}>
              <div className="flex flex-wrap gap-2">
                <Button
                  type="button"
                  variant="secondary"
                  disabled={busy || take.relocatable === 0}
                  onClick={() => post("relocate", t("stockTake.relocateConfirm", { count: take.relocatable }), (b) => t("stockTake.relocated", { count: b.moved?.length ?? 0 }))}
                >
                  {t("stockTake.relocate", { count: take.relocatable })}
                </Button>
                {open ? (
                  <Button type="button" variant="danger" disabled={busy} onClick={() => post("end", t("stockTake.endConfirm"), () => t("stockTake.ended"))}>
                    {t("stockTake.end")}
                  </Button>
                ) : null}
              </div>
            </Panel>
          ) : null}
        </div>

        <div className="space-y-6">
          <Panel title={t("stockTake.recent")}>
            {take.recent.length === 0 ? (
              <p className="text-sm text-stone-500">{t("stockTake.nothingYet")}</p>
            ) : (
              <ul className="divide-y divide-stone-100 text-sm" data-testid="recent">
                {take.recent.map((r) => (
                  <li key={r.code} className="flex items-center justify-between gap-2 py-1.5">
                    <span>
                      {stampLink(r.code)} <span className="text-stone-600">{r.name ?? t("stockTake.unknownStamp")}</span>
                      <span className="block text-xs text-stone-500">{place(r.seenAt)}</span>
                    </span>
                    <span className="flex items-center gap-2">
                      <span
                        className={cn(
                          "rounded-full px-2 py-0.5 text-xs font-medium",
                          r.result === "found" ? "bg-emerald-100 text-emerald-900" : r.result === "misplaced" ? "bg-amber-100 text-amber-900" : "bg-red-100 text-red-900",
                        )}
                      >
                        {t(`stockTake.result.${r.result}`)}
                      </span>
                      {open && canWrite ? (
                        <button type="button" className="text-xs text-stone-500 underline" onClick={() => undo(r.code)} aria-label={t("stockTake.undoOf", { code: r.code })}>
                          {t("stockTake.undo")}
                        </button>
                      ) : null}
                    </span>
                  </li>
                ))}
              </ul>
            )}
          </Panel>

          <Panel title={t("stockTake.reportTitle")}>
            <div className="space-y-5 text-sm" data-testid="report">
              <section>
                <h3 className="font-medium text-stone-900">{t("stockTake.missing", { count: take.missing.length })}</h3>
                {take.missing.length ? (
                  <ul className="mt-1 grid gap-1 sm:grid-cols-2">
                    {take.missing.map((m) => (
                      <li key={m.code}>
                        {stampLink(m.code)} <span className="text-stone-600">{t("stockTake.recordedAt", { place: place(m.recorded) })}</span>
                      </li>
                    ))}
                  </ul>
                ) : (
                  <p className="text-stone-500">{t("stockTake.noneMissing")}</p>
                )}
              </section>
              <section>
                <h3 className="font-medium text-stone-900">{t("stockTake.misplaced", { count: take.misplaced.length })}</h3>
                <ul className="mt-1 space-y-1">
                  {take.misplaced.map((m) => (
                    <li key={m.code}>
                      {stampLink(m.code)} <span className="text-stone-600">{t("stockTake.recordedSeen", { recorded: place(m.recorded), seenAt: place(m.seenAt) })}</span>
                    </li>
                  ))}
                </ul>
              </section>
              <section>
                <h3 className="font-medium text-stone-900">{t("stockTake.unexpected", { count: take.unexpected.length })}</h3>
                <ul className="mt-1 space-y-1">
                  {take.unexpected.map((u) => (
                    <li key={u.code}>
                      {stampLink(u.code)} <span className="text-stone-600">{t(`stockTake.reasons.${u.reason}`, { recorded: place(u.recorded), seenAt: place(u.seenAt) })}</span>
                    </li>
                  ))}
                </ul>
              </section>
              {take.checkedOut.length ? (
                <section>
                  <h3 className="font-medium text-stone-900">{t("stockTake.out", { count: take.checkedOut.length })}</h3>
                  <p className="text-stone-600">{take.checkedOut.map((c) => c.code).join(", ")}</p>
                </section>
              ) : null}
            </div>
          </Panel>
        </div>
      </div>
    </>
  );
}
