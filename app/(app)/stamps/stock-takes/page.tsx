import type { Metadata } from "next";
import Link from "next/link";
import { getFormatter, getTranslations } from "next-intl/server";
import { PageHeader, Panel } from "@/components/ui/panel";
import { listLocations } from "@/lib/data/stamps/locations";
import { listStockTakes } from "@/lib/data/stamps/stock-takes";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { StartStockTake } from "./start-form";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("stockTake"))("title") };
}

export default async function StockTakesPage() {
  const actor = await requirePageActor();
  const [t, format, takes, locations] = await Promise.all([getTranslations(), getFormatter(), listStockTakes(actor), listLocations(actor)]);
  const sites = [...new Set(locations.map((l) => l.site))];
  const openAt = new Map(takes.filter((s) => s.status === "open").map((s) => [s.site, s.id]));
  return (
    <>
      <PageHeader title={t("stockTake.title")} intro={t("stockTake.intro")} />
      <div className="space-y-6">
        {can(actor.role, "stamps:write") ? (
          <Panel title={t("stockTake.startTitle")} intro={t("stockTake.startIntro")}>
            {sites.length ? <StartStockTake sites={sites.map((s) => ({ site: s, openId: openAt.get(s) ?? null }))} /> : <p className="text-sm text-stone-600">{t("stockTake.noSites")}</p>}
          </Panel>
        ) : null}
        <Panel title={t("stockTake.listTitle")}>
          {takes.length === 0 ? (
            <p className="py-4 text-center text-sm text-stone-600">{t("stockTake.none")}</p>
          ) : (
            <ul className="divide-y divide-stone-100">
              {takes.map((s) => (
                <li key={s.id} className="flex flex-wrap items-center justify-between gap-3 py-2.5 text-sm">
                  <div>
                    <Link href={`/stamps/stock-takes/${s.id}`} className="font-medium text-ink-700 hover:underline">
                      {s.site}
                    </Link>
                    <span className="ml-2 text-stone-600">
                      {t("stockTake.startedBy", { name: s.startedByName ?? "—", when: format.dateTime(new Date(s.startedAt), "moment") })}
                    </span>
                  </div>
                  <span className={s.status === "open" ? "rounded-full bg-amber-100 px-2 py-0.5 text-xs font-medium text-amber-900" : "rounded-full bg-stone-200 px-2 py-0.5 text-xs font-medium text-stone-700"}>
                    {s.status === "open" ? t("stockTake.statusOpen", { seen: s.seen }) : t("stockTake.statusClosed", { seen: s.seen })}
                  </span>
                </li>
              ))}
            </ul>
          )}
        </Panel>
      </div>
    </>
  );
}
