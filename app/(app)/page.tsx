import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import { ColourwaysInWorkPanel } from "@/components/overview/design-panels";
import { RunsWaitingForPlanPanel, StalePlansPanel } from "@/components/overview/plan-panels";
import { FlaggedStampsPanel, NewStampRequestsPanel, OverdueCheckoutsPanel, RepairQueuePanel, StampRequestsPanel } from "@/components/overview/shelf-panels";
import { PotWarningsPanel, WaxingRunsPanel, WaxNeedPanel } from "@/components/overview/wax-panels";
import { PageHeader } from "@/components/ui/panel";
import { overviewGroups, type OverviewDto, type OverviewSection } from "@/lib/contracts/overview";
import { overviewFor } from "@/lib/data/overview";
import { permissionsOf } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("home"))("title") };
}

/** What needs each role today, panel by panel, each line leading to where the work is done; the role's permissions folded away below. */
export default async function OverviewPage() {
  const actor = await requirePageActor();
  const [t, overview] = await Promise.all([getTranslations(), overviewFor(actor)]);
  const units = actor.unitSystem;
  const panel = (section: OverviewSection, o: OverviewDto) => {
    switch (section) {
      case "flaggedStamps":
        return o.flaggedStamps && <FlaggedStampsPanel data={o.flaggedStamps} />;
      case "stampRequests":
        return o.stampRequests && <StampRequestsPanel data={o.stampRequests} />;
      case "newStampRequests":
        return o.newStampRequests && <NewStampRequestsPanel data={o.newStampRequests} unitSystem={units} />;
      case "overdueCheckouts":
        return o.overdueCheckouts && <OverdueCheckoutsPanel data={o.overdueCheckouts} />;
      case "repairQueue":
        return o.repairQueue && <RepairQueuePanel data={o.repairQueue} />;
      case "runsWaitingForPlan":
        return o.runsWaitingForPlan && <RunsWaitingForPlanPanel data={o.runsWaitingForPlan} />;
      case "stalePlans":
        return o.stalePlans && <StalePlansPanel data={o.stalePlans} />;
      case "waxingRuns":
        return o.waxingRuns && <WaxingRunsPanel data={o.waxingRuns} />;
      case "waxNeed":
        return o.waxNeed && <WaxNeedPanel data={o.waxNeed} unitSystem={units} />;
      case "potWarnings":
        return o.potWarnings && <PotWarningsPanel data={o.potWarnings} unitSystem={units} />;
      case "colourwaysInWork":
        return o.colourwaysInWork && <ColourwaysInWorkPanel data={o.colourwaysInWork} />;
    }
  };
  const groups = (Object.keys(overviewGroups) as (keyof typeof overviewGroups)[])
    .map((g) => ({ key: g, sections: overviewGroups[g].filter((s) => overview[s] !== undefined) as OverviewSection[] }))
    .filter((g) => g.sections.length > 0);
  return (
    <>
      <PageHeader title={t("home.welcome", { name: actor.name })} intro={t("overview.intro", { role: t(`roles.${actor.role}.name`) })} />
      <div className="space-y-8">
        {groups.length === 0 ? <p className="text-sm text-stone-700">{t("overview.nothingAtAll")}</p> : null}
        {groups.map((g) => (
          <section key={g.key} aria-labelledby={`overview-group-${g.key}`} data-testid={`overview-group-${g.key}`}>
            <h2 id={`overview-group-${g.key}`} className="mb-3 text-lg font-semibold text-stone-900">
              {t(`overview.groups.${g.key}`)}
            </h2>
            <div className="grid gap-4 md:grid-cols-2 xl:grid-cols-3">
              {g.sections.map((s) => (
                <div key={s}>{panel(s, overview)}</div>
              ))}
            </div>
          </section>
        ))}
        <details className="rounded-lg border border-stone-200 bg-white px-5 py-3 text-sm" data-testid="role-permissions">
          <summary className="cursor-pointer font-medium text-stone-900">{t("home.canDo")}</summary>
          <p className="mt-2 text-stone-600">{t(`roles.${actor.role}.summary`)}</p>
          <ul className="mt-2 list-disc space-y-1 pl-5 text-stone-700" data-testid="permissions">
            {permissionsOf(actor.role).map((p) => (
              <li key={p}>{t(`permissions.${p}`)}</li>
            ))}
          </ul>
        </details>
      </div>
    </>
  );
}
