import type { Metadata } from "next";
import Link from "next/link";
import { getFormatter, getTranslations } from "next-intl/server";
import { PlanNumbers } from "@/components/plans/plan-numbers";
import { PlanPicture } from "@/components/plans/plan-picture";
import { pictureLabels } from "@/components/plans/picture-labels";
import { Notice } from "@/components/ui/notice";
import { PageHeader, Panel } from "@/components/ui/panel";
import { layerPictures, planPages, type PlanDto } from "@/lib/contracts/plans";
import type { LayoutPicture } from "@/lib/layout";
import { getPlanPicture, getPlans } from "@/lib/data/plans";
import { workshopSettings } from "@/lib/data/settings";
import { requirePageActor } from "@/lib/session";
import { compareQuerySchema } from "@/lib/validation/plans";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("plans"))("compare.title") };
}

/** Two to four plans side by side: the same numbers and a small picture of each one's first metre. */
export default async function ComparePlansPage({ searchParams }: { searchParams: Promise<{ ids?: string }> }) {
  const actor = await requirePageActor();
  const [t, format, settings] = await Promise.all([getTranslations(), getFormatter(), workshopSettings()]);
  const parsed = compareQuerySchema.safeParse({ ids: (await searchParams).ids ?? "" });
  if (!parsed.success) {
    return (
      <>
        <PageHeader title={t("plans.compare.title")} />
        <Notice tone="warning">
          {t("validation.compareCount")}{" "}
          <Link href={planPages.list()} className="underline">
            {t("plans.record.backToPlans")}
          </Link>
        </Notice>
      </>
    );
  }
  const found = await getPlans(actor, parsed.data.ids);
  const pictures = await Promise.all(found.map((p) => getPlanPicture(actor, p, 1000).catch(() => null)));
  const missing = parsed.data.ids.length - found.length;
  const labels = pictureLabels(t, format, actor.unitSystem);
  const columns = found.length >= 4 ? "lg:grid-cols-4" : found.length === 3 ? "lg:grid-cols-3" : "lg:grid-cols-2";
  return (
    <>
      <PageHeader title={t("plans.compare.title")} intro={t("plans.compare.intro")} />
      {missing > 0 ? (
        <Notice tone="warning" className="mb-4">
          {t("plans.compare.missing", { count: missing })}
        </Notice>
      ) : null}
      <div className={`grid gap-4 ${columns}`} data-testid="compare">
        {found.map((plan: PlanDto, k) => (
          <Panel key={plan.id} title={plan.name}>
            <div className="space-y-3" data-testid={`compare-${plan.id}`}>
              <p className="text-sm text-stone-600">
                {t(`plans.arrangements.${plan.layout.arrangement}`)} · {plan.stamps[0]?.code ?? t("plans.table.freeStamp")}
              </p>
              {pictures[k] ? (
                <PlanPicture
                  picture={pictures[k] as LayoutPicture}
                  face="front"
                  stampPictures={layerPictures(plan)}
                  leftover={plan.summary.leftover}
                  unitSystem={actor.unitSystem}
                  labels={{ ...labels, title: t("plans.compare.pictureOf", { name: plan.name }) }}
                  idPrefix={`cmp${k}`}
                  className="h-auto w-full rounded border border-stone-200 bg-white"
                />
              ) : null}
              <PlanNumbers summary={plan.summary} unitSystem={actor.unitSystem} impressionsPerHour={settings.impressionsPerHour} byPieces={plan.layout.cloth.lengthMm === undefined} compact />
              <Link href={planPages.one(plan.id)} className="text-sm text-ink-700 hover:underline">
                {t("plans.compare.open")}
              </Link>
            </div>
          </Panel>
        ))}
      </div>
    </>
  );
}
