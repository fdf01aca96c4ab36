import Link from "next/link";
import { getFormatter, getTranslations } from "next-intl/server";
import { kgText, tempText } from "@/components/wax/measure";
import type { OverviewDto } from "@/lib/contracts/overview";
import { POT_WARNING_DAYS } from "@/lib/contracts/overview";
import { runPages, stageNumber } from "@/lib/contracts/runs";
import { waxPages, type UnitSystem } from "@/lib/contracts/wax";
import { calendarDay } from "@/lib/i18n/formats";
import { OverviewItem, OverviewItems, OverviewPanel } from "./overview-panel";
import { RunLine } from "./run-line";

// The wax masters' panels: runs at a waxing stage, the week's wax against stock, pot readings that called for a
// caution (with the wax room's fume and fire cautions and who decides).

type Props<K extends keyof OverviewDto> = { data: NonNullable<OverviewDto[K]> };

export async function WaxingRunsPanel({ data }: Props<"waxingRuns">) {
  const t = await getTranslations("overview.waxingRuns");
  return (
    <OverviewPanel section="waxingRuns" title={t("title")} total={data.total} shown={data.items.length} empty={t("empty")} moreHref={runPages.list()}>
      <OverviewItems>
        {data.items.map((r) => (
          <RunLine key={r.id} run={r} testId={`waxing-${r.id}`} />
        ))}
      </OverviewItems>
    </OverviewPanel>
  );
}

export async function WaxNeedPanel({ data, unitSystem }: Props<"waxNeed"> & { unitSystem: UnitSystem }) {
  const [t, format] = await Promise.all([getTranslations("overview.waxNeed"), getFormatter()]);
  const kg = (value: number) => kgText(value, unitSystem, format.number, 2);
  const day = (iso: string) => format.dateTime(calendarDay(iso), "day");
  return (
    <OverviewPanel
      section="waxNeed"
      title={t("title")}
      intro={t("intro", { from: day(data.fromOn), until: day(data.untilOn) })}
      total={data.stages}
      shown={data.stages}
      empty={t("empty")}
      moreHref={waxPages.purchase}
      moreLabel={t("purchase")}
    >
      <p className={data.shortKg > 0 ? "font-medium text-amber-900" : "text-stone-700"} data-testid="wax-need-summary">
        {t("stages", { count: data.stages })} · {kg(data.totalKg)} · {data.shortKg > 0 ? t("shortTotal", { amount: kg(data.shortKg) }) : t("enoughTotal")}
      </p>
      <table className="mt-2 w-full text-left" data-testid="wax-need">
        <caption className="sr-only">{t("title")}</caption>
        <thead className="text-xs text-stone-600">
          <tr>
            <th scope="col" className="py-1 font-medium">
              {t("material")}
            </th>
            <th scope="col" className="py-1 text-right font-medium">
              {t("needed")}
            </th>
            <th scope="col" className="py-1 text-right font-medium">
              {t("onHand")}
            </th>
            <th scope="col" className="py-1 text-right font-medium">
              {t("short")}
            </th>
          </tr>
        </thead>
        <tbody>
          {data.lines.map((l) => (
            <tr key={l.material.id} className="border-t border-stone-100" data-material={l.material.name}>
              <td className="py-1">
                <Link href={waxPages.material(l.material.id)} className="text-ink-700 hover:underline">
                  {l.material.name}
                </Link>
              </td>
              <td className="py-1 text-right">{kg(l.neededKg)}</td>
              <td className="py-1 text-right">{kg(l.onHandKg)}</td>
              <td className={l.shortKg > 0 ? "py-1 text-right font-semibold text-amber-900" : "py-1 text-right text-stone-600"}>{l.shortKg > 0 ? kg(l.shortKg) : t("enough")}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </OverviewPanel>
  );
}

export async function PotWarningsPanel({ data, unitSystem }: Props<"potWarnings"> & { unitSystem: UnitSystem }) {
  const [t, format] = await Promise.all([getTranslations(), getFormatter()]);
  return (
    <OverviewPanel
      section="potWarnings"
      title={t("overview.potWarnings.title")}
      intro={t("overview.potWarnings.intro", { days: POT_WARNING_DAYS })}
      total={data.total}
      shown={data.items.length}
      empty={t("overview.potWarnings.empty")}
    >
      <OverviewItems>
        {data.items.map((w, i) => (
          <OverviewItem
            key={`${w.runId}-${w.at}-${i}`}
            href={runPages.one(w.runId)}
            label={
              <>
                {w.runName} · {t("overview.run.stage", { number: stageNumber({ position: w.stagePosition }), kind: t(`runs.stageKind.${w.stageKind}`) })}
              </>
            }
            detail={
              <>
                <span className="font-medium">{t("overview.potWarnings.line", { temp: tempText(w.tempC, unitSystem, format.number), when: format.dateTime(new Date(w.at), "moment") })}</span>
                <ul className="mt-1 space-y-0.5 text-amber-900">
                  {w.warnings.map((code) => (
                    <li key={code}>{t(`runs.readingWarning.${code}`, { maxC: w.maxC ?? 0 })}</li>
                  ))}
                </ul>
              </>
            }
          />
        ))}
      </OverviewItems>
      <p className="mt-3 rounded-md border border-amber-300 bg-amber-50 px-3 py-2 text-xs text-amber-950" data-testid="pot-cautions">
        <span className="font-semibold">{t("waxRoom.safety.fumes.title")}</span> {t("waxRoom.safety.fumes.body")} <span className="font-semibold">{t("waxRoom.safety.fire.title")}</span>{" "}
        {t("waxRoom.safety.fire.body")} {t("waxRoom.safety.decides")}
      </p>
    </OverviewPanel>
  );
}
