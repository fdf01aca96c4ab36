import { getFormatter, getTranslations } from "next-intl/server";
import type { OverviewDto } from "@/lib/contracts/overview";
import { planPages } from "@/lib/contracts/plans";
import { runPages } from "@/lib/contracts/runs";
import { OverviewItem, OverviewItems, OverviewPanel } from "./overview-panel";
import { RunLine } from "./run-line";

// The planners' panels: runs whose waxing by stamps has no plan yet, and plans whose stamps changed since.

type Props<K extends keyof OverviewDto> = { data: NonNullable<OverviewDto[K]> };

export async function RunsWaitingForPlanPanel({ data }: Props<"runsWaitingForPlan">) {
  const t = await getTranslations("overview.runsWaitingForPlan");
  return (
    <OverviewPanel section="runsWaitingForPlan" title={t("title")} intro={t("intro")} total={data.total} shown={data.items.length} empty={t("empty")} moreHref={runPages.list()}>
      <OverviewItems>
        {data.items.map((r) => (
          <RunLine key={r.id} run={r} testId={`waiting-${r.id}`} />
        ))}
      </OverviewItems>
    </OverviewPanel>
  );
}

export async function StalePlansPanel({ data }: Props<"stalePlans">) {
  const [t, format] = await Promise.all([getTranslations("overview.stalePlans"), getFormatter()]);
  return (
    <OverviewPanel section="stalePlans" title={t("title")} intro={t("intro")} total={data.total} shown={data.items.length} empty={t("empty")} moreHref={planPages.list()}>
      <OverviewItems>
        {data.items.map((p) => (
          <OverviewItem
            key={p.id}
            testId={`stale-${p.id}`}
            href={planPages.one(p.id)}
            label={p.name}
            detail={
              <>
                {t("line", { codes: p.codes.join(", ") })} · {format.dateTime(new Date(p.computedAt), "moment")}
              </>
            }
          />
        ))}
      </OverviewItems>
    </OverviewPanel>
  );
}
