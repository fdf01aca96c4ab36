import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { PageHeader, Panel } from "@/components/ui/panel";
import { WaxDefaultsForm } from "@/components/wax/defaults-form";
import { EstimateForm } from "@/components/wax/estimate-form";
import { getCalibration, getWaxDefaults, listEstimates, listWaxUses, planChoices, recipeChoices } from "@/lib/data/wax";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { estimateAction, updateWaxDefaultsAction } from "../actions";
import { EstimatesTable } from "./estimates-table";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("waxRoom.estimate"))("title") };
}

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

export default async function WaxEstimatesPage({ searchParams }: Props) {
  const actor = await requirePageActor();
  if (!can(actor.role, "data:read")) return <Forbidden />;
  const [t, recipes, calibration, defaults, estimates, plans, uses] = await Promise.all([
    getTranslations("waxRoom"),
    recipeChoices(actor),
    getCalibration(actor),
    getWaxDefaults(actor),
    listEstimates(actor),
    planChoices(actor),
    listWaxUses(actor, { withdrawn: false }),
  ]);
  const canWrite = can(actor.role, "wax:write");
  // ?plan=<id> (the plan page's "Estimate the wax") chooses that plan when it is one of the choices.
  const asked = (await searchParams).plan;
  const initialPlanId = typeof asked === "string" && plans.some((p) => p.id === asked) ? asked : "";
  const cloths = [...new Set(uses.map((u) => u.cloth).filter((c): c is string => !!c))].sort();
  return (
    <>
      <PageHeader title={t("estimate.title")} intro={t("estimate.intro")} />
      <div className="space-y-6">
        <Panel>
          <EstimateForm
            action={estimateAction}
            recipes={recipes.map((r) => {
              const fit = calibration.recipes.find((c) => c.recipeId === r.id);
              return { id: r.id, name: r.name, calibrated: fit?.enoughUses ? { rateGPerM2: fit.fit.rateGPerM2, uses: fit.fit.uses } : null };
            })}
            plans={plans}
            initialPlanId={initialPlanId}
            cloths={cloths}
            defaults={defaults}
            canWrite={canWrite}
            unitSystem={actor.unitSystem}
          />
        </Panel>
        <Panel title={t("estimates.title")} intro={t("estimates.intro")}>
          <EstimatesTable estimates={estimates} canWrite={canWrite} unitSystem={actor.unitSystem} />
        </Panel>
        {canWrite ? (
          <Panel title={t("defaults.title")} intro={t("defaults.intro")}>
            <WaxDefaultsForm action={updateWaxDefaultsAction} defaults={defaults} />
          </Panel>
        ) : null}
      </div>
    </>
  );
}
