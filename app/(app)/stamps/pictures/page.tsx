import type { Metadata } from "next";
import Link from "next/link";
import { getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { ConditionBadge } from "@/components/stamps/condition-badge";
import { PictureFilters } from "@/components/stamps/picture-filters";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/panel";
import { newestThumbs } from "@/lib/data/scans";
import { listStamps, stampFacets } from "@/lib/data/stamps";
import { listLocations } from "@/lib/data/stamps/locations";
import { issueFields } from "@/lib/error-body";
import { translator } from "@/lib/i18n/translator";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { queryObject } from "@/lib/validation/common";
import { parseInput } from "@/lib/validation/parse";
import { stampListQuerySchema } from "@/lib/validation/stamps";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("motifs"))("shelfPictures.title") };
}

/** The shelf as cards with their newest scan: the table's filters, taken from the same address. */
export default async function StampPicturesPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const actor = await requirePageActor();
  if (!can(actor.role, "data:read")) return <Forbidden />;
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(await searchParams)) for (const one of Array.isArray(v) ? v : v ? [v] : []) params.append(k, one);
  const t = await getTranslations();
  const parsed = parseInput(stampListQuerySchema, { pageSize: "60", ...queryObject(params) });
  const page = parsed.success ? await listStamps(actor, parsed.data) : null;
  const [thumbs, locations, facets] = await Promise.all([page ? newestThumbs(actor, page.stamps.map((s) => s.code)) : ({} as Record<string, string>), listLocations(actor), stampFacets(actor)]);
  // A refused filter (a minimum above its maximum) says so beside its boxes, as on the table.
  const refused = parsed.success ? {} : issueFields(parsed.error.issues, translator(actor.locale));
  const query = params.toString();
  return (
    <>
      <PageHeader
        title={t("motifs.shelfPictures.title")}
        intro={t("motifs.shelfPictures.intro")}
        actions={
          <Link href={`/stamps${query ? `?${query}` : ""}`} className="rounded-md border border-stone-300 bg-white px-3.5 py-2 text-sm font-medium text-stone-800 hover:bg-stone-50">
            {t("motifs.shelfPictures.tableView")}
          </Link>
        }
      />
      <PictureFilters locations={locations} sites={facets.sites} unitSystem={actor.unitSystem} refused={refused} />
      {!page ? (
        <Notice tone="error">{t("motifs.list.refused")}</Notice>
      ) : page.stamps.length === 0 ? (
        <p className="text-sm text-stone-600" data-testid="stamp-pictures-empty">
          {t("stamps.table.noMatch")}
        </p>
      ) : (
        <ul className="grid grid-cols-2 gap-3 sm:grid-cols-4 lg:grid-cols-6" data-testid="stamp-pictures">
          {page.stamps.map((s) => (
            <li key={s.code}>
              <Link href={`/stamps/${encodeURIComponent(s.code)}`} className="group block rounded-lg border border-stone-200 bg-white p-2 text-xs hover:border-ink-400">
                {thumbs[s.code] ? (
                  // eslint-disable-next-line @next/next/no-img-element -- thumbnails come from our API
                  <img src={thumbs[s.code]} alt="" loading="lazy" className="aspect-square w-full rounded bg-stone-100 object-contain" />
                ) : (
                  <div className="flex aspect-square w-full items-center justify-center rounded bg-stone-100 text-stone-600">{t("motifs.shelfPictures.noScan")}</div>
                )}
                <span className="mt-1 block font-mono text-ink-700 group-hover:underline">{s.code}</span>
                <span className="block truncate text-stone-600">{s.name}</span>
                <ConditionBadge condition={s.condition} label={t(`stamps.conditions.${s.condition}`)} />
              </Link>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
