"use client";

// A run's quality findings on its page: the list, the photos, and the form that records one.
import Link from "next/link";
import { useFormatter, useNow, useTimeZone, useTranslations } from "next-intl";
import { runUrls, stageNumber, type RunDto } from "@/lib/contracts/runs";
import { calendarDay } from "@/lib/i18n/formats";
import { isoDateIn } from "@/lib/time-zone";
import { FindingForm } from "./finding-form";
import type { RunAbilities } from "./stage-work";

const stampPage = (code: string) => `/stamps/${encodeURIComponent(code)}`;

export function RunFindings({ run, can }: { run: RunDto; can: RunAbilities }) {
  const t = useTranslations("runs.findings");
  const tk = useTranslations("runs.findingKind");
  const tr = useTranslations("runs.repair");
  const ts = useTranslations("runs.stageKind");
  const format = useFormatter();
  const now = useNow();
  const timeZone = useTimeZone();
  const stages = new Map(run.stages.map((s) => [s.id, s]));
  return (
    <section aria-labelledby="run-findings-title" className="space-y-4" data-testid="run-findings">
      <h2 id="run-findings-title" className="text-base font-semibold text-stone-900">
        {t("title")}
      </h2>
      {run.findings.length ? (
        <div className="overflow-x-auto">
          <table className="min-w-full text-left text-sm">
            <caption className="sr-only">{t("caption")}</caption>
            <thead className="border-b border-stone-200 text-xs text-stone-600">
              <tr>
                <th scope="col" className="py-1.5 pr-3 font-medium">{t("col.day")}</th>
                <th scope="col" className="py-1.5 pr-3 font-medium">{t("col.kind")}</th>
                <th scope="col" className="py-1.5 pr-3 font-medium">{t("col.stage")}</th>
                <th scope="col" className="py-1.5 pr-3 font-medium">{t("col.location")}</th>
                <th scope="col" className="py-1.5 pr-3 font-medium">{t("col.count")}</th>
                <th scope="col" className="py-1.5 pr-3 font-medium">{t("col.stamp")}</th>
                <th scope="col" className="py-1.5 pr-3 font-medium">{t("col.repair")}</th>
                <th scope="col" className="py-1.5 pr-3 font-medium">{t("col.photo")}</th>
                <th scope="col" className="py-1.5 font-medium">{t("col.who")}</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-stone-100">
              {run.findings.map((f) => {
                const stage = f.stageId ? stages.get(f.stageId) : undefined;
                return (
                  <tr key={f.id} data-testid="finding-row">
                    <td className="py-1.5 pr-3 whitespace-nowrap">{format.dateTime(calendarDay(f.foundOn), "day")}</td>
                    <td className="py-1.5 pr-3">{tk(f.kind)}</td>
                    <td className="py-1.5 pr-3">{stage ? t("stageLabel", { n: stageNumber(stage), kind: ts(stage.kind) }) : "—"}</td>
                    <td className="py-1.5 pr-3">{f.location ?? "—"}</td>
                    <td className="py-1.5 pr-3">{format.number(f.count, "count")}</td>
                    <td className="py-1.5 pr-3">
                      {f.stamp ? (
                        <Link href={stampPage(f.stamp.code)} className="font-mono text-ink-700 hover:underline">
                          {f.stamp.code}
                        </Link>
                      ) : (
                        "—"
                      )}
                    </td>
                    <td className="py-1.5 pr-3">
                      {tr(f.repair)}
                      {f.repairNote ? <span className="block text-xs text-stone-600">{f.repairNote}</span> : null}
                    </td>
                    <td className="py-1.5 pr-3">
                      {f.photoKey ? (
                        <a href={runUrls.findingPhoto(run.id, f.id)} className="block w-16">
                          {/* eslint-disable-next-line @next/next/no-img-element -- a streamed thumbnail from the app's own route */}
                          <img src={runUrls.findingPhoto(run.id, f.id, "thumb")} alt={t("photoAlt", { kind: tk(f.kind), day: format.dateTime(calendarDay(f.foundOn), "day") })} className="h-16 w-16 rounded border border-stone-200 object-cover" />
                        </a>
                      ) : (
                        "—"
                      )}
                    </td>
                    <td className="py-1.5">{f.recordedByName}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      ) : (
        <p className="text-sm text-stone-600">{t("none")}</p>
      )}
      {can.recordFindings ? (
        <div className="rounded-md border border-stone-200 bg-stone-50 p-4">
          <h3 className="mb-3 text-sm font-semibold text-stone-900">{t("formTitle")}</h3>
          <FindingForm run={run} today={isoDateIn(timeZone ?? "UTC", now)} />
        </div>
      ) : null}
    </section>
  );
}
