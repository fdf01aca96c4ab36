import type { Metadata } from "next";
import Link from "next/link";
import { getFormatter, getTranslations } from "next-intl/server";
import { PrintSheetButton } from "@/components/plans/print-sheet-button";
import { runSizeText } from "@/components/runs/run-size";
import { SafetyCautions } from "@/components/wax/safety-cautions";
import { findingKinds, runPages, stageNumber } from "@/lib/contracts/runs";
import { calendarDay } from "@/lib/i18n/formats";
import { measures } from "@/lib/i18n/measures";
import { requirePageActor } from "@/lib/session";
import { loadRun } from "../load";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("runs"))("ticket.title") };
}

/**
 * The run ticket that travels with the cloth: the run, each stage with its days, plan, recipe and pot range, faces
 * and stamps, the wax and hours it needs, boxes to fill in by hand at each stage, the findings to look for, and the
 * wax cautions. A print view: the screen's header and navigation do not print.
 */
export default async function RunTicketPage({ params }: { params: Promise<{ id: string }> }) {
  const actor = await requirePageActor();
  const run = await loadRun(actor, (await params).id);
  const [t, format] = await Promise.all([getTranslations(), getFormatter()]);
  const m = measures(format, actor.unitSystem);
  const day = (iso: string | null) => (iso ? format.dateTime(calendarDay(iso), "day") : "—");
  return (
    <div className="mx-auto max-w-[190mm] text-stone-900 print:max-w-none" data-testid="run-ticket">
      <div className="mb-4 flex flex-wrap items-center gap-3 print:hidden">
        <Link href={runPages.one(run.id)} className="text-sm text-ink-700 hover:underline">
          {t("runs.ticket.back")}
        </Link>
        <PrintSheetButton label={t("runs.ticket.print")} />
      </div>
      <header className="mb-3 border-b-2 border-stone-800 pb-2">
        <p className="text-xs uppercase tracking-wide text-stone-600">{t("runs.ticket.title")}</p>
        <h1 className="text-xl font-semibold">{run.name}</h1>
        <p className="text-sm">
          {run.motif.name} · {run.colourway.name} · {run.cloth} · {runSizeText(t, m, run.size, actor.unitSystem)}
          {run.dueOn ? ` · ${t("runs.page.due", { day: day(run.dueOn) })}` : ""}
        </p>
        <p className="text-xs text-stone-600">
          {t("runs.ticket.totals", { wax: m.mass(run.totals.wax.kgEstimated * 1000), hours: run.totals.hours, impressions: run.totals.impressions.estimated })}
        </p>
      </header>
      <table className="w-full border-collapse text-xs" data-testid="ticket-stages">
        <thead>
          <tr className="border-b border-stone-800 text-left">
            <th scope="col" className="py-1 pr-2">#</th>
            <th scope="col" className="py-1 pr-2">{t("runs.ticket.stage")}</th>
            <th scope="col" className="py-1 pr-2">{t("runs.ticket.days")}</th>
            <th scope="col" className="py-1 pr-2">{t("runs.ticket.what")}</th>
            <th scope="col" className="py-1 pr-2">{t("runs.ticket.need")}</th>
            <th scope="col" className="w-[34%] py-1">{t("runs.ticket.check")}</th>
          </tr>
        </thead>
        <tbody>
          {run.stages.map((s) => (
            <tr key={s.id} className="break-inside-avoid border-b border-stone-300 align-top">
              <td className="py-2 pr-2 font-semibold">{stageNumber(s)}</td>
              <td className="py-2 pr-2">
                {t(`runs.stageKind.${s.kind}`)}
                {s.colourName ? (
                  <span className="flex items-center gap-1">
                    {s.swatch ? (
                      <svg width="10" height="10" aria-hidden="true">
                        <rect width="10" height="10" fill={s.swatch} stroke="#57534e" />
                      </svg>
                    ) : null}
                    {s.colourName}
                  </span>
                ) : null}
              </td>
              <td className="whitespace-nowrap py-2 pr-2">
                {day(s.plannedStartOn)}
                {s.plannedEndOn && s.plannedEndOn !== s.plannedStartOn ? <span className="block">{t("runs.ticket.until", { day: day(s.plannedEndOn) })}</span> : null}
              </td>
              <td className="py-2 pr-2">
                {s.kind === "wax" ? (
                  <>
                    {s.plan ? <span className="block">{t("runs.ticket.plan", { name: s.plan.name })}</span> : <span className="block">{t("runs.stage.noPlan")}</span>}
                    {s.recipe ? <span className="block">{t("runs.ticket.recipe", { name: s.recipe.name, minC: s.recipe.workingMinC, maxC: s.recipe.workingMaxC })}</span> : null}
                    {s.faces ? <span className="block">{t(`motifs.faces.${s.faces}`)}</span> : null}
                    {s.stamps.length ? <span className="block font-mono">{s.stamps.map((x) => x.code).join(", ")}</span> : null}
                  </>
                ) : s.kind === "dye" && s.dyeMethod ? (
                  t(`runs.dyeMethod.${s.dyeMethod}`)
                ) : null}
                {s.notes ? <span className="block italic">{s.notes}</span> : null}
              </td>
              <td className="whitespace-nowrap py-2 pr-2">
                {s.kind === "wax" && s.estimate.kg > 0 ? (
                  <>
                    <span className="block">{m.mass(s.estimate.kg * 1000)}</span>
                    <span className="block">{t("runs.page.hoursValue", { hours: s.estimate.hours })}</span>
                  </>
                ) : (
                  "—"
                )}
              </td>
              <td className="py-2">
                <span className="block border-b border-dotted border-stone-500 pb-3">{t("runs.ticket.doneBy")}</span>
                {s.kind === "wax" || s.kind === "boil_off" ? (
                  <span className="block border-b border-dotted border-stone-500 pb-3 pt-1">{s.kind === "wax" ? t("runs.ticket.potWeights") : t("runs.ticket.recovered")}</span>
                ) : null}
                {s.kind === "wax" ? <span className="block border-b border-dotted border-stone-500 pb-3 pt-1">{t("runs.ticket.potTemps")}</span> : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <section className="mt-4 break-inside-avoid text-xs">
        <h2 className="font-semibold">{t("runs.ticket.lookFor")}</h2>
        <ul className="mt-1 grid grid-cols-2 gap-x-4">
          {findingKinds.map((k) => (
            <li key={k}>☐ {t(`runs.findingKind.${k}`)}</li>
          ))}
        </ul>
      </section>
      <div className="mt-4 break-inside-avoid">
        <SafetyCautions />
      </div>
    </div>
  );
}
