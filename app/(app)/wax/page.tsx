import type { Metadata } from "next";
import Link from "next/link";
import { getFormatter, getTranslations } from "next-intl/server";
import { Notice } from "@/components/ui/notice";
import { PageHeader, Panel } from "@/components/ui/panel";
import { kgText } from "@/components/wax/measure";
import { waxPages } from "@/lib/contracts/wax";
import { getCalibration, getPurchaseList, listEstimates, listMaterials, listRecipes } from "@/lib/data/wax";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("waxRoom.overview"))("title") };
}

/** The wax room at a glance: stock below its reorder level, the season's recipes, planned work and what to buy. */
export default async function WaxOverviewPage() {
  const actor = await requirePageActor();
  const [t, format, materials, recipes, estimates, purchase, calibration] = await Promise.all([
    getTranslations("waxRoom.overview"),
    getFormatter(),
    listMaterials(actor),
    listRecipes(actor),
    listEstimates(actor),
    getPurchaseList(actor),
    getCalibration(actor),
  ]);
  const units = actor.unitSystem;
  const low = materials.filter((m) => m.belowReorder);
  const canWrite = can(actor.role, "wax:write");
  const links = [
    { href: waxPages.estimates, label: t("newEstimate") },
    ...(canWrite ? [{ href: waxPages.uses, label: t("recordUse") }, { href: waxPages.newRecipe, label: t("newRecipe") }] : []),
    { href: waxPages.purchase, label: t("purchaseList") },
  ];
  return (
    <>
      <PageHeader title={t("title")} intro={t("intro")} />
      <div className="grid gap-6 lg:grid-cols-2">
        <Panel title={t("reorderTitle")}>
          {low.length ? (
            <ul className="space-y-2" data-testid="reorder-warnings">
              {low.map((m) => (
                <li key={m.id}>
                  <Notice tone="warning">
                    <Link href={waxPages.material(m.id)} className="font-medium underline">
                      {t("reorderLine", { material: m.name, onHand: kgText(m.onHandKg, units, format.number), level: kgText(m.reorderLevelKg, units, format.number) })}
                    </Link>
                  </Notice>
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-sm text-stone-600" data-testid="reorder-warnings">
              {t("reorderNone")}
            </p>
          )}
        </Panel>
        <Panel title={t("next")}>
          <ul className="space-y-1 text-sm text-stone-800">
            <li>{t("recipes", { count: recipes.length })}</li>
            <li>{t("planned", { count: estimates.filter((e) => e.planned).length })}</li>
            <li>{t("toBuy", { amount: kgText(purchase.totalToBuyKg, units, format.number) })}</li>
            <li>{t("calibrated", { count: calibration.recipes.filter((r) => r.enoughUses).length })}</li>
          </ul>
          <ul className="mt-4 flex flex-wrap gap-3 text-sm">
            {links.map((l) => (
              <li key={l.href}>
                <Link href={l.href} className="font-medium text-ink-700 hover:underline">
                  {l.label}
                </Link>
              </li>
            ))}
          </ul>
        </Panel>
      </div>
    </>
  );
}
