import type { Metadata } from "next";
import Link from "next/link";
import { getLocale, getTranslations } from "next-intl/server";
import { pickLocale } from "@/lib/i18n/config";
import { translator } from "@/lib/i18n/translator";
import { Forbidden } from "@/components/shell/forbidden";
import { MotifCard } from "@/components/motifs/motif-card";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/panel";
import { availabilityValues, type MotifListDto } from "@/lib/contracts/motifs";
import { listCollections, listMotifs } from "@/lib/data/motifs";
import { issueFields } from "@/lib/error-body";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { queryObject } from "@/lib/validation/common";
import { motifListQuerySchema, motifSortKeys } from "@/lib/validation/motifs";
import { parseInput } from "@/lib/validation/parse";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("motifs"))("title") };
}

const link = "rounded-md bg-ink-700 px-3.5 py-2 text-sm font-medium text-white hover:bg-ink-800";

export default async function MotifArchivePage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const actor = await requirePageActor();
  if (!can(actor.role, "data:read")) return <Forbidden />;
  const raw = await searchParams;
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(raw)) for (const one of Array.isArray(v) ? v : v ? [v] : []) params.append(k, one);
  const deleted = params.get("deleted");
  params.delete("deleted");
  const given = queryObject(params);
  const [t, collections] = await Promise.all([getTranslations(), listCollections(actor)]);
  const parsed = parseInput(motifListQuerySchema, given);
  const errors = parsed.success ? {} : issueFields(parsed.error.issues, translator(pickLocale(await getLocale())));
  const result: MotifListDto | null = parsed.success ? await listMotifs(actor, parsed.data) : null;
  const pages = result ? Math.max(1, Math.ceil(result.total / result.pageSize)) : 1;
  const pageHref = (page: number) => {
    const next = new URLSearchParams(given);
    next.set("page", String(page));
    return `/motifs?${next.toString()}`;
  };
  const filtered = Object.keys(given).some((k) => k !== "page" && k !== "sort");
  return (
    <>
      <PageHeader
        title={t("motifs.title")}
        intro={t("motifs.intro")}
        actions={
          <div className="flex gap-2">
            <Link href="/motifs/search" className="rounded-md border border-stone-300 bg-white px-3.5 py-2 text-sm font-medium text-stone-800 hover:bg-stone-50">
              {t("motifs.actions.searchByPicture")}
            </Link>
            {can(actor.role, "motifs:write") ? (
              <Link href="/motifs/new" className={link}>
                {t("motifs.actions.new")}
              </Link>
            ) : null}
          </div>
        }
      />
      {deleted ? (
        <Notice tone="success" className="mb-4">
          {t("motifs.delete.done", { name: deleted })}
        </Notice>
      ) : null}
      <form method="get" action="/motifs" aria-label={t("motifs.filters.label")} className="mb-6 grid gap-3 rounded-lg border border-stone-200 bg-white p-4 sm:grid-cols-2 lg:grid-cols-4">
        <Field id="q" label={t("motifs.filters.q")} errors={errors.q}>
          {(a) => <input {...a} name="q" type="search" defaultValue={given.q ?? ""} />}
        </Field>
        <Field id="tag" label={t("motifs.filters.tag")} errors={errors.tag}>
          {(a) => <input {...a} name="tag" defaultValue={given.tag ?? ""} />}
        </Field>
        <Field id="designer" label={t("motifs.filters.designer")} errors={errors.designer}>
          {(a) => <input {...a} name="designer" defaultValue={given.designer ?? ""} />}
        </Field>
        <Field id="collection" label={t("motifs.filters.collection")} errors={errors.collection}>
          {(a) => (
            <select {...a} name="collection" defaultValue={given.collection ?? ""}>
              <option value="">{t("motifs.filters.anyCollection")}</option>
              {collections.map((c) => (
                <option key={c.id} value={c.id}>
                  {c.name}
                </option>
              ))}
            </select>
          )}
        </Field>
        <Field id="availability" label={t("motifs.filters.availability")} errors={errors.availability}>
          {(a) => (
            <select {...a} name="availability" defaultValue={given.availability ?? ""}>
              <option value="">{t("motifs.filters.anyAvailability")}</option>
              {availabilityValues.map((v) => (
                <option key={v} value={v}>
                  {t(`motifs.availability.${v}`)}
                </option>
              ))}
            </select>
          )}
        </Field>
        <Field id="minWidthMm" label={t("motifs.filters.minWidthMm")} errors={errors.minWidthMm}>
          {(a) => <input {...a} name="minWidthMm" inputMode="decimal" defaultValue={given.minWidthMm ?? ""} />}
        </Field>
        <Field id="maxWidthMm" label={t("motifs.filters.maxWidthMm")} errors={errors.maxWidthMm}>
          {(a) => <input {...a} name="maxWidthMm" inputMode="decimal" defaultValue={given.maxWidthMm ?? ""} />}
        </Field>
        <Field id="sort" label={t("motifs.filters.sort")} errors={errors.sort}>
          {(a) => (
            <select {...a} name="sort" defaultValue={given.sort ?? "lastUsed"}>
              {motifSortKeys.map((k) => (
                <option key={k} value={k}>
                  {t(`motifs.sort.${k}`)}
                </option>
              ))}
            </select>
          )}
        </Field>
        <div className="flex items-end gap-2 sm:col-span-2 lg:col-span-4">
          <button type="submit" className={link}>
            {t("motifs.filters.submit")}
          </button>
          {filtered ? (
            <Link href="/motifs" className="px-2 py-2 text-sm text-ink-700 hover:underline">
              {t("motifs.filters.clear")}
            </Link>
          ) : null}
        </div>
      </form>
      {!result ? (
        <Notice tone="error">{t("motifs.list.refused")}</Notice>
      ) : (
        <>
          <p className="mb-3 text-sm text-stone-600" aria-live="polite">
            {t("motifs.list.count", { total: result.total })}
          </p>
          {result.motifs.length === 0 ? (
            <p className="rounded-lg border border-dashed border-stone-300 p-8 text-center text-sm text-stone-600">{filtered ? t("motifs.list.empty") : t("motifs.list.emptyArchive")}</p>
          ) : (
            <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3 xl:grid-cols-4" aria-label={t("motifs.title")}>
              {result.motifs.map((m) => (
                <li key={m.id}>
                  <MotifCard motif={m} />
                </li>
              ))}
            </ul>
          )}
          {pages > 1 ? (
            <nav className="mt-6 flex items-center gap-4 text-sm" aria-label={t("motifs.list.page", { page: result.page, pages })}>
              {result.page > 1 ? <Link href={pageHref(result.page - 1)} className="text-ink-700 hover:underline">{t("motifs.list.previous")}</Link> : null}
              <span className="text-stone-600">{t("motifs.list.page", { page: result.page, pages })}</span>
              {result.page < pages ? <Link href={pageHref(result.page + 1)} className="text-ink-700 hover:underline">{t("motifs.list.next")}</Link> : null}
            </nav>
          ) : null}
        </>
      )}
    </>
  );
}
