import type { Metadata } from "next";
import { getFormatter, getTranslations } from "next-intl/server";
import { PageHeader, Panel } from "@/components/ui/panel";
import { CalibrationChart } from "@/components/wax/calibration-chart";
import { gText } from "@/components/wax/measure";
import { WaxUseForm } from "@/components/wax/wax-use-form";
import { calendarDay } from "@/lib/i18n/formats";
import { workshopToday } from "@/lib/data/settings";
import { getCalibration, listWaxUses, planChoices, recipeChoices } from "@/lib/data/wax";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { recordWaxUseAction } from "../actions";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("waxRoom.use"))("title") };
}

/** Wax uses: record one, see the rate fitted from them per recipe (and per cloth) on the chart, and the list. */
export default async function WaxUsesPage() {
  const actor = await requirePageActor();
  const [t, tc, format, uses, calibration, recipes, plans, today] = await Promise.all([
    getTranslations("waxRoom.use"),
    getTranslations("waxRoom.calibration"),
    getFormatter(),
    listWaxUses(actor, { withdrawn: false }),
    getCalibration(actor),
    recipeChoices(actor),
    planChoices(actor),
    workshopToday(),
  ]);
  const units = actor.unitSystem;
  const n = (v: number, digits = 1) => format.number(v, { maximumFractionDigits: digits });
  const cloths = [...new Set(uses.map((u) => u.cloth).filter((c): c is string => !!c))].sort();
  return (
    <>
      <PageHeader title={t("title")} intro={t("intro")} />
      <div className="space-y-6">
        <Panel title={tc("title")} intro={tc("intro")}>
          <CalibrationChart recipes={calibration.recipes} defaultRateGPerM2={calibration.defaultRateGPerM2} minUses={calibration.minUses} />
        </Panel>
        {can(actor.role, "wax:write") ? (
          <Panel title={t("formTitle")}>
            <WaxUseForm action={recordWaxUseAction} recipes={recipes} plans={plans} cloths={cloths} today={today} unitSystem={units} />
          </Panel>
        ) : null}
        <Panel title={t("tableTitle")}>
          {uses.length ? (
            <div className="overflow-x-auto">
              <table className="min-w-full text-left text-sm" data-testid="wax-uses">
                <thead className="text-xs text-stone-600">
                  <tr>
                    <th scope="col" className="py-1 pr-3 font-medium">{t("usedOn")}</th>
                    <th scope="col" className="py-1 pr-3 font-medium">{t("recipe")}</th>
                    <th scope="col" className="py-1 pr-3 font-medium">{t("cloth")}</th>
                    <th scope="col" className="py-1 pr-3 text-right font-medium">{t("area")}</th>
                    <th scope="col" className="py-1 pr-3 text-right font-medium">{t("grams")}</th>
                    <th scope="col" className="py-1 pr-3 text-right font-medium">{t("rate")}</th>
                    <th scope="col" className="py-1 font-medium">{t("recordedBy")}</th>
                  </tr>
                </thead>
                <tbody>
                  {uses.map((u) => (
                    <tr key={u.id} className="border-t border-stone-200">
                      <td className="py-1 pr-3">{format.dateTime(calendarDay(u.usedOn), "day")}</td>
                      <td className="py-1 pr-3">{u.recipe.name}</td>
                      <td className="py-1 pr-3">{u.cloth ?? "—"}</td>
                      <td className="py-1 pr-3 text-right">{n(u.areaM2, 2)} m²</td>
                      <td className="py-1 pr-3 text-right">{gText(u.grams, units, format.number)}</td>
                      <td className="py-1 pr-3 text-right">{n(u.rateGPerM2)}</td>
                      <td className="py-1 text-stone-600">{u.recordedByName}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          ) : (
            <p className="text-sm text-stone-600">{t("empty")}</p>
          )}
        </Panel>
      </div>
    </>
  );
}
