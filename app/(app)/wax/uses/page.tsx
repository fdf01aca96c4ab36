import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import { PageHeader, Panel } from "@/components/ui/panel";
import { CalibrationChart } from "@/components/wax/calibration-chart";
import { WaxUseForm } from "@/components/wax/wax-use-form";
import { workshopToday } from "@/lib/data/settings";
import { getCalibration, listWaxUses, planChoices, recipeChoices } from "@/lib/data/wax";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { recordWaxUseAction, withdrawWaxUseAction } from "../actions";
import { UsesTable } from "./uses-table";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("waxRoom.use"))("title") };
}

/** Wax uses: record one, see the rate fitted from them per recipe (and per cloth) on the chart, and the list. */
export default async function WaxUsesPage() {
  const actor = await requirePageActor();
  const [t, tc, uses, calibration, recipes, plans, today] = await Promise.all([
    getTranslations("waxRoom.use"),
    getTranslations("waxRoom.calibration"),
    listWaxUses(actor, { withdrawn: false }),
    getCalibration(actor),
    recipeChoices(actor),
    planChoices(actor),
    workshopToday(),
  ]);
  const units = actor.unitSystem;
  const canWrite = can(actor.role, "wax:write");
  const cloths = [...new Set(uses.map((u) => u.cloth).filter((c): c is string => !!c))].sort();
  return (
    <>
      <PageHeader title={t("title")} intro={t("intro")} />
      <div className="space-y-6">
        <Panel title={tc("title")} intro={tc("intro")}>
          <CalibrationChart recipes={calibration.recipes} defaultRateGPerM2={calibration.defaultRateGPerM2} minUses={calibration.minUses} />
        </Panel>
        {canWrite ? (
          <Panel title={t("formTitle")}>
            <WaxUseForm action={recordWaxUseAction} recipes={recipes} plans={plans} cloths={cloths} today={today} unitSystem={units} />
          </Panel>
        ) : null}
        <Panel title={t("tableTitle")}>
          <UsesTable uses={uses} unitSystem={units} withdrawAction={canWrite ? withdrawWaxUseAction : null} />
        </Panel>
      </div>
    </>
  );
}
