import type { Metadata } from "next";
import Link from "next/link";
import { getFormatter, getTranslations } from "next-intl/server";
import { Notice } from "@/components/ui/notice";
import { PageHeader, Panel } from "@/components/ui/panel";
import { kgText } from "@/components/wax/measure";
import { PrintButton } from "@/components/wax/print-button";
import { calendarDay } from "@/lib/i18n/formats";
import { waxPages } from "@/lib/contracts/wax";
import { workshopToday } from "@/lib/data/settings";
import { getPurchaseList } from "@/lib/data/wax";
import { requirePageActor } from "@/lib/session";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("waxRoom.purchase"))("title") };
}

/** What to buy: the planned estimates by material against stock and reorder levels, kg and cost; prints on one sheet. */
export default async function WaxPurchasePage() {
  const actor = await requirePageActor();
  const [t, format, list, today] = await Promise.all([getTranslations("waxRoom.purchase"), getFormatter(), getPurchaseList(actor), workshopToday()]);
  const units = actor.unitSystem;
  const kg = (v: number) => kgText(v, units, format.number, 2);
  const money = (v: number) => format.number(v, { style: "currency", currency: list.currency, maximumFractionDigits: list.currency === "IDR" ? 0 : 2 });
  const cell = "py-1.5 pr-3";
  return (
    <>
      <PageHeader title={t("title")} intro={t("intro")} actions={<PrintButton label={t("print")} />} />
      <p className="mb-4 hidden text-sm text-stone-600 print:block">{t("printedOn", { day: format.dateTime(calendarDay(today), "day") })}</p>
      <div className="space-y-6">
        {list.estimates.length === 0 ? (
          <Notice tone="info">
            <Link href={waxPages.estimates} className="underline">
              {t("noPlanned")}
            </Link>
          </Notice>
        ) : null}
        {list.belowReorder.length ? <Notice tone="warning">{t("belowReorder", { materials: list.belowReorder.join(", ") })}</Notice> : null}
        {list.pricesMissing.length ? <Notice tone="info">{t("pricesMissing", { materials: list.pricesMissing.join(", ") })}</Notice> : null}
        <Panel>
          <div className="overflow-x-auto">
            <table className="min-w-full text-left text-sm" data-testid="purchase-list">
              <thead className="text-xs text-stone-600">
                <tr>
                  <th scope="col" className={`${cell} font-medium`}>{t("material")}</th>
                  <th scope="col" className={`${cell} text-right font-medium`}>{t("needed")}</th>
                  <th scope="col" className={`${cell} text-right font-medium`}>{t("onHand")}</th>
                  <th scope="col" className={`${cell} text-right font-medium`}>{t("after")}</th>
                  <th scope="col" className={`${cell} text-right font-medium`}>{t("reorderLevel")}</th>
                  <th scope="col" className={`${cell} text-right font-medium`}>{t("toBuy")}</th>
                  <th scope="col" className={`${cell} text-right font-medium`}>{t("cost")}</th>
                </tr>
              </thead>
              <tbody>
                {list.lines.map((l) => (
                  <tr key={l.material.id} className="border-t border-stone-200" data-testid={`purchase-line-${l.material.code}`}>
                    <th scope="row" className={`${cell} font-medium text-stone-900`}>{l.material.name}</th>
                    <td className={`${cell} text-right`}>{kg(l.neededKg)}</td>
                    <td className={`${cell} text-right`}>{kg(l.onHandKg)}</td>
                    <td className={`${cell} text-right ${l.belowReorderAfter ? "font-medium text-red-700" : ""}`}>{kg(l.afterKg)}</td>
                    <td className={`${cell} text-right`}>{kg(l.reorderLevelKg)}</td>
                    <td className={`${cell} text-right font-semibold`}>{kg(l.toBuyKg)}</td>
                    <td className={`${cell} text-right`}>{l.cost === null ? "—" : money(l.cost)}</td>
                  </tr>
                ))}
              </tbody>
              <tfoot>
                <tr className="border-t-2 border-stone-300">
                  <th scope="row" className={`${cell} font-semibold`}>{t("total")}</th>
                  <td colSpan={4} />
                  <td className={`${cell} text-right font-semibold`} data-testid="purchase-total-kg">{kg(list.totalToBuyKg)}</td>
                  <td className={`${cell} text-right font-semibold`}>{list.cost === null ? "—" : money(list.cost)}</td>
                </tr>
              </tfoot>
            </table>
          </div>
        </Panel>
        {list.estimates.length ? (
          <Panel title={t("estimatesTitle")}>
            <ul className="space-y-1 text-sm" data-testid="purchase-estimates">
              {list.estimates.map((e) => (
                <li key={e.id}>
                  {e.name} · {e.recipeName} · {kg(e.kgNew)}
                </li>
              ))}
            </ul>
          </Panel>
        ) : null}
      </div>
    </>
  );
}
