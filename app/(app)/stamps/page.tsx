import type { Metadata } from "next";
import Link from "next/link";
import { getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/panel";
import { listLocations } from "@/lib/data/stamps/locations";
import { stampCounts, stampFacets } from "@/lib/data/stamps";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { stampCodeSchema } from "@/lib/validation/stamps";
import { StampsTable } from "./stamps-table";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("stamps"))("title") };
}

export default async function StampShelfPage({ searchParams }: { searchParams: Promise<{ deleted?: string }> }) {
  const actor = await requirePageActor();
  const deleted = stampCodeSchema.safeParse((await searchParams).deleted);
  if (!can(actor.role, "data:read")) return <Forbidden />;
  const [t, locations, facets, counts] = await Promise.all([getTranslations(), listLocations(actor), stampFacets(actor), stampCounts(actor)]);
  const canWrite = can(actor.role, "stamps:write");
  return (
    <>
      <PageHeader
        title={t("stamps.title")}
        intro={t("stamps.intro")}
        actions={
          canWrite ? (
            <Link href="/stamps/new" className="rounded-md bg-ink-700 px-3.5 py-2 text-sm font-medium text-white hover:bg-ink-800">
              {t("stamps.actions.new")}
            </Link>
          ) : null
        }
      />
      {deleted.success ? (
        <Notice tone="success" className="mb-4">
          {t("stamps.delete.done", { code: deleted.data })}
        </Notice>
      ) : null}
      <ul className="mb-4 flex flex-wrap gap-2 text-sm" aria-label={t("stamps.counts.label")}>
        {[
          { key: "active" as const, count: counts.active, href: "/stamps?condition=sound,worn,needs_repair,in_repair" },
          { key: "out" as const, count: counts.out, href: "/stamps/out" },
          { key: "overdue" as const, count: counts.overdue, href: "/stamps?overdue=true", warn: counts.overdue > 0 },
          { key: "repair" as const, count: counts.repair, href: "/stamps?condition=needs_repair,in_repair", warn: counts.repair > 0 },
          ...(counts.lowCoverage > 0 ? [{ key: "lowCoverage" as const, count: counts.lowCoverage, href: "/stamps?lowCoverage=true", warn: true }] : []),
        ].map((c) => (
          <li key={c.key}>
            <Link href={c.href} className={c.warn ? "rounded-full bg-amber-100 px-3 py-1 text-amber-900 hover:underline" : "rounded-full bg-stone-200 px-3 py-1 text-stone-800 hover:underline"}>
              {t(`stamps.counts.${c.key}`, { count: c.count })}
            </Link>
          </li>
        ))}
      </ul>
      <StampsTable locations={locations} sites={facets.sites} unitSystem={actor.unitSystem} canWrite={canWrite} />
    </>
  );
}
