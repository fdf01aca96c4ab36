import type { Metadata } from "next";
import Link from "next/link";
import { getTranslations } from "next-intl/server";
import { Notice } from "@/components/ui/notice";
import { PageHeader, Panel } from "@/components/ui/panel";
import { listLocations } from "@/lib/data/stamps/locations";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { LocationForm, LocationRow } from "./location-forms";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("locations"))("title") };
}

export default async function LocationsPage({ searchParams }: { searchParams: Promise<{ deleted?: string }> }) {
  const actor = await requirePageActor();
  const deleted = (await searchParams).deleted?.slice(0, 130);
  const [t, locations] = await Promise.all([getTranslations(), listLocations(actor)]);
  const canWrite = can(actor.role, "stamps:write");
  const sites = [...new Set(locations.map((l) => l.site))];
  return (
    <>
      <PageHeader
        title={t("locations.title")}
        intro={t("locations.intro")}
        actions={
          locations.length ? (
            <Link href="/stamps/labels?kind=shelf" className="rounded-md border border-stone-300 bg-white px-3.5 py-2 text-sm hover:bg-stone-100">
              {t("locations.printLabels")}
            </Link>
          ) : null
        }
      />
      <div className="space-y-6">
        {deleted ? <Notice tone="success">{t("locations.deletedOne", { location: deleted })}</Notice> : null}
        {canWrite ? (
          <Panel title={t("locations.addTitle")} intro={t("locations.addIntro")}>
            <LocationForm sites={sites} />
          </Panel>
        ) : null}
        {sites.length === 0 ? (
          <Panel>
            <p className="py-6 text-center text-sm text-stone-600">{canWrite ? t("locations.emptyKeeper") : t("locations.empty")}</p>
          </Panel>
        ) : (
          sites.map((site) => {
            const here = locations.filter((l) => l.site === site);
            return (
              <Panel key={site} title={site} intro={t("locations.siteSummary", { locations: here.length, stamps: here.reduce((n, l) => n + l.stampCount, 0) })}>
                <ul className="divide-y divide-stone-100" data-testid={`site-${site}`}>
                  {here.map((l) => (
                    <LocationRow key={l.id} location={l} canWrite={canWrite} />
                  ))}
                </ul>
              </Panel>
            );
          })
        )}
      </div>
    </>
  );
}
