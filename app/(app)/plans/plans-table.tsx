"use client";

import { createColumnHelper, rowPaginationFeature, rowSortingFeature, tableFeatures, useTable, type PaginationState, type SortingState, type Updater } from "@tanstack/react-table";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useFormatter, useTranslations } from "next-intl";
import { useMemo, useState } from "react";
import { measures } from "@/lib/i18n/measures";
import { Button } from "@/components/ui/button";
import { DataTable } from "@/components/ui/data-table";
import { Notice } from "@/components/ui/notice";
import { useDebouncedParam, useUrlParams } from "@/components/ui/use-url-params";
import { planPages, type PlanListItem } from "@/lib/contracts/plans";
import { ARRANGEMENTS } from "@/lib/layout";
import type { UnitSystem } from "@/lib/stamps/format";
import { usePlans } from "@/lib/swr/use-plans";
import { planFilterKeys, type PlanSortKey } from "@/lib/validation/plans";

const features = tableFeatures({ rowSortingFeature, rowPaginationFeature });
const column = createColumnHelper<typeof features, PlanListItem>();
const emptyRows: PlanListItem[] = [];
const PAGE_SIZE = 25;
const MAX_COMPARE = 4;

type ColumnId = "select" | "name" | "stamp" | "cloth" | "arrangement" | "impressions" | "waxed" | "author" | "updated";
const sortKeyOf: Partial<Record<ColumnId, PlanSortKey>> = { name: "name", cloth: "cloth", arrangement: "arrangement", impressions: "impressions", waxed: "waxed", updated: "updated" };
const columnOf = Object.fromEntries(Object.entries(sortKeyOf).map(([c, k]) => [k, c])) as Partial<Record<PlanSortKey, ColumnId>>;

/** The saved plans: search, filters and sort in the address; tick two to four to compare them. */
export function PlansTable({ unitSystem, canWrite }: { unitSystem: UnitSystem; canWrite: boolean }) {
  const t = useTranslations();
  const format = useFormatter();
  const router = useRouter();
  const url = useUrlParams();
  const [search, setSearch] = useDebouncedParam(url, "q");
  const [stampFilter, setStampFilter] = useDebouncedParam(url, "stamp");
  const [chosen, setChosen] = useState<string[]>([]);
  const sort = url.params.get("sort") ?? "-updated";
  const page = Math.max(1, Number(url.params.get("page") ?? 1) || 1);
  const query = useMemo(() => {
    const q = new URLSearchParams();
    for (const key of planFilterKeys) {
      const value = url.params.get(key);
      if (value) q.set(key, value);
    }
    q.set("sort", sort);
    q.set("page", String(page));
    q.set("pageSize", String(PAGE_SIZE));
    return q.toString();
  }, [url.params, sort, page]);
  const { data: answer, error, isLoading, isValidating, mutate } = usePlans(query);
  const data = error ? undefined : answer;
  const filtered = planFilterKeys.some((k) => url.params.get(k));

  const toggle = (id: string) => setChosen((old) => (old.includes(id) ? old.filter((x) => x !== id) : old.length >= MAX_COMPARE ? old : [...old, id]));
  const columns = useMemo(
    () =>
      column.columns([
        column.display({
          id: "select",
          header: () => <span className="sr-only">{t("plans.table.compareColumn")}</span>,
          cell: ({ row }) => (
            <input
              type="checkbox"
              checked={chosen.includes(row.original.id)}
              disabled={!chosen.includes(row.original.id) && chosen.length >= MAX_COMPARE}
              onChange={() => toggle(row.original.id)}
              aria-label={t("plans.table.choose", { name: row.original.name })}
            />
          ),
        }),
        column.accessor("name", {
          header: () => t("plans.table.name"),
          cell: ({ row }) => (
            <Link href={planPages.one(row.original.id)} className="font-medium text-ink-700 hover:underline">
              {row.original.name}
            </Link>
          ),
        }),
        column.display({
          id: "stamp",
          header: () => t("plans.table.stamp"),
          cell: ({ row }) =>
            row.original.stamp ? (
              <span className="flex items-center gap-2">
                {row.original.stamp.thumbUrl ? (
                  // eslint-disable-next-line @next/next/no-img-element -- scan thumbnails stream from the API with the session cookie
                  <img src={row.original.stamp.thumbUrl} alt="" className="h-8 w-8 rounded border border-stone-200 bg-white object-contain" />
                ) : (
                  <span className="h-8 w-8 rounded border border-dashed border-stone-300" aria-hidden="true" />
                )}
                <span>
                  <span className="font-mono">{row.original.stamp.code}</span>
                  <span className="block text-xs text-stone-500">{row.original.stamp.name}</span>
                </span>
              </span>
            ) : (
              <span className="text-stone-500">{t("plans.table.freeStamp")}</span>
            ),
        }),
        column.accessor("clothWidthMm", { id: "cloth", header: () => t("plans.table.cloth"), cell: (info) => <span className="whitespace-nowrap tabular-nums">{measures(format, unitSystem).length(info.getValue())}</span> }),
        column.accessor("arrangement", {
          header: () => t("plans.table.arrangement"),
          cell: ({ row }) => (
            <span>
              {t(`plans.arrangements.${row.original.arrangement}`)}
              {row.original.borders ? <span className="block text-xs text-stone-500">{t("plans.table.withBorders", { count: row.original.borders })}</span> : null}
              {row.original.sides === 2 ? <span className="block text-xs text-stone-500">{t("plans.table.bothFaces")}</span> : null}
            </span>
          ),
        }),
        column.accessor("impressionsPerMetre", { id: "impressions", header: () => t("plans.table.impressionsPerMetre"), cell: (info) => <span className="tabular-nums">{format.number(info.getValue(), { maximumFractionDigits: 1 })}</span> }),
        column.accessor("waxedAreaPerMetreM2", { id: "waxed", header: () => t("plans.table.waxedPerMetre"), cell: (info) => <span className="tabular-nums">{format.number(info.getValue(), { maximumFractionDigits: 3 })}</span> }),
        column.accessor("createdByName", { id: "author", header: () => t("plans.table.author"), enableSorting: false }),
        column.accessor("updatedAt", { id: "updated", header: () => t("plans.table.updated"), cell: (info) => <span className="whitespace-nowrap">{format.dateTime(new Date(info.getValue()), "date")}</span> }),
      ]),
    [t, format, unitSystem, chosen],
  );
  const sorting: SortingState = useMemo(() => {
    const desc = sort.startsWith("-");
    const key = (desc ? sort.slice(1) : sort) as PlanSortKey;
    return [{ id: columnOf[key] ?? "updated", desc }];
  }, [sort]);
  const pagination: PaginationState = { pageIndex: page - 1, pageSize: PAGE_SIZE };
  const table = useTable({
    features,
    columns,
    data: data?.plans ?? emptyRows,
    rowCount: data?.total ?? 0,
    state: { sorting, pagination },
    onSortingChange: (updater: Updater<SortingState>) => {
      const next = (typeof updater === "function" ? updater(sorting) : updater)[0];
      url.set({ sort: next ? `${next.desc ? "-" : ""}${sortKeyOf[next.id as ColumnId] ?? "updated"}` : null });
    },
    onPaginationChange: (updater: Updater<PaginationState>) => {
      const next = typeof updater === "function" ? updater(pagination) : updater;
      url.set({ page: next.pageIndex > 0 ? String(next.pageIndex + 1) : null }, false);
    },
    manualSorting: true,
    manualPagination: true,
    enableMultiSort: false,
    enableSortingRemoval: false,
  });
  const total = data?.total ?? 0;
  const refused = error && "fields" in error ? Object.values((error as { fields?: Record<string, string[]> }).fields ?? {}).flat().join(" ") : "";

  return (
    <div className="space-y-3">
      <form role="search" className="flex flex-wrap items-end gap-3" aria-label={t("plans.table.filters")} onSubmit={(e) => e.preventDefault()}>
        <label className="space-y-1 text-sm">
          <span className="block font-medium text-stone-800">{t("plans.table.search")}</span>
          <input type="search" value={search} onChange={(e) => setSearch(e.target.value)} className="w-64 rounded-md border border-stone-300 bg-white px-3 py-2 text-sm" placeholder={t("plans.table.searchPlaceholder")} />
        </label>
        <label className="space-y-1 text-sm">
          <span className="block font-medium text-stone-800">{t("plans.table.stamp")}</span>
          <input value={stampFilter} onChange={(e) => setStampFilter(e.target.value)} className="w-36 rounded-md border border-stone-300 bg-white px-3 py-2 font-mono text-sm uppercase" placeholder={t("plans.table.stampFilterExample")} />
        </label>
        <label className="space-y-1 text-sm">
          <span className="block font-medium text-stone-800">{t("plans.table.arrangement")}</span>
          <select value={url.params.get("arrangement") ?? ""} onChange={(e) => url.set({ arrangement: e.target.value || null })} className="rounded-md border border-stone-300 bg-white px-3 py-2 text-sm">
            <option value="">{t("plans.table.anyArrangement")}</option>
            {ARRANGEMENTS.map((a) => (
              <option key={a} value={a}>
                {t(`plans.arrangements.${a}`)}
              </option>
            ))}
          </select>
        </label>
        {filtered ? (
          <Button type="button" variant="ghost" onClick={url.clear}>
            {t("plans.table.clear")}
          </Button>
        ) : null}
        <div className="ml-auto flex items-center gap-2">
          <span className="text-sm text-stone-600" aria-live="polite">
            {t("plans.table.chosen", { count: chosen.length })}
          </span>
          <Button type="button" disabled={chosen.length < 2} onClick={() => router.push(planPages.compare(chosen))}>
            {t("plans.table.compare")}
          </Button>
        </div>
      </form>
      <p className="text-sm text-stone-600" aria-live="polite" data-testid="plan-count">
        {isLoading ? t("common.loading") : error ? t("plans.table.refused") : t("plans.table.count", { total })}
      </p>
      {error ? (
        <Notice tone="error">
          {refused || error.message}{" "}
          <button type="button" className="underline" onClick={() => mutate()}>
            {t("common.retry")}
          </button>
        </Notice>
      ) : null}
      <DataTable
        table={table}
        label={t("plans.table.label")}
        loading={isLoading}
        busy={isValidating}
        problem={error ? t("plans.table.refused") : undefined}
        rowProps={(p) => ({ "data-testid": `plan-row-${p.id}` })}
        empty={
          <div className="space-y-2">
            <p className="font-medium text-stone-800">{filtered ? t("plans.table.noMatch") : t("plans.table.empty")}</p>
            {!filtered && canWrite ? (
              <Link href={planPages.new()} className="inline-block rounded-md bg-ink-700 px-3 py-1.5 text-sm font-medium text-white hover:bg-ink-800">
                {t("plans.actions.new")}
              </Link>
            ) : null}
          </div>
        }
      />
      <nav className="flex items-center justify-end gap-2" aria-label={t("plans.table.pages")}>
        <Button type="button" variant="secondary" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
          {t("stamps.table.previous")}
        </Button>
        <span className="text-sm text-stone-600">{t("stamps.table.pageOf", { page, pages: Math.max(1, table.getPageCount()) })}</span>
        <Button type="button" variant="secondary" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
          {t("stamps.table.next")}
        </Button>
      </nav>
    </div>
  );
}
