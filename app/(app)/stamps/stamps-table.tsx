"use client";

import { useTable, type ColumnVisibilityState, type PaginationState, type SortingState, type Updater } from "@tanstack/react-table";
import Link from "next/link";
import { useTranslations } from "next-intl";
import { useMemo, useSyncExternalStore } from "react";
import { columnOfSortKey, hiddenColumns, sortKeyOfColumn, stampTableFeatures, useStampColumns, type StampColumnId } from "@/components/stamps/stamp-columns";
import { StampFilters } from "@/components/stamps/stamp-filters";
import { Button } from "@/components/ui/button";
import { DataTable } from "@/components/ui/data-table";
import { Notice } from "@/components/ui/notice";
import { useDebouncedParam, useUrlParams } from "@/components/ui/use-url-params";
import { stampUrls, type LocationDto, type StampListItem } from "@/lib/contracts/stamps";
import type { UnitSystem } from "@/lib/stamps/format";
import { ApiError } from "@/lib/swr/fetcher";
import { useStamps } from "@/lib/swr/use-stamps";
import { stampFilterKeys, type StampSortKey } from "@/lib/validation/stamps";

const emptyRows: StampListItem[] = [];
const pageSizes = [25, 50, 100];

// Column choice lives in the browser (per person and device), read without a hydration mismatch.
const columnsKey = "capgrid.stamps.columns";
const columnListeners = new Set<() => void>();
const columnsStore = {
  subscribe(listener: () => void) {
    columnListeners.add(listener);
    window.addEventListener("storage", listener);
    return () => {
      columnListeners.delete(listener);
      window.removeEventListener("storage", listener);
    };
  },
  get: () => window.localStorage.getItem(columnsKey) ?? "",
  server: () => "",
  set(value: ColumnVisibilityState) {
    window.localStorage.setItem(columnsKey, JSON.stringify(value));
    columnListeners.forEach((l) => l());
  },
};

function resolve<T>(updater: Updater<T>, old: T): T {
  return typeof updater === "function" ? (updater as (o: T) => T)(old) : updater;
}

/** The stamp shelf's table: filters, sort and page in the address, one page at a time from the list API. */
export function StampsTable({ locations, sites, unitSystem, canWrite }: { locations: LocationDto[]; sites: string[]; unitSystem: UnitSystem; canWrite: boolean }) {
  const t = useTranslations();
  const url = useUrlParams();
  const { params } = url;
  const [search, setSearch] = useDebouncedParam(url, "q");

  const sort = params.get("sort") ?? "code";
  const page = Math.max(1, Number(params.get("page") ?? 1) || 1);
  const pageSize = pageSizes.includes(Number(params.get("pageSize"))) ? Number(params.get("pageSize")) : 50;
  const apiQuery = useMemo(() => {
    const query = new URLSearchParams();
    for (const key of stampFilterKeys) {
      const value = params.get(key);
      if (value) query.set(key, value);
    }
    query.set("sort", sort);
    query.set("page", String(page));
    query.set("pageSize", String(pageSize));
    return query.toString();
  }, [params, sort, page, pageSize]);
  const filterQuery = useMemo(() => {
    const query = new URLSearchParams(apiQuery);
    query.delete("page");
    query.delete("pageSize");
    return query.toString();
  }, [apiQuery]);

  const { data: answer, error, isLoading, isValidating, mutate } = useStamps(apiQuery);
  // Refused filters show no rows: the rows of the last good answer would look like the result.
  const data = error ? undefined : answer;
  const refused: Record<string, string[]> = error instanceof ApiError ? (error.fields ?? {}) : {};
  const filtered = stampFilterKeys.some((k) => params.get(k));

  const sorting: SortingState = useMemo(() => {
    const desc = sort.startsWith("-");
    const key = (desc ? sort.slice(1) : sort) as StampSortKey;
    return [{ id: columnOfSortKey[key] ?? "code", desc }];
  }, [sort]);
  const onSortingChange = (updater: Updater<SortingState>) => {
    const next = resolve(updater, sorting)[0];
    url.set({ sort: next ? `${next.desc ? "-" : ""}${sortKeyOfColumn[next.id as StampColumnId] ?? "code"}` : null });
  };
  const pagination: PaginationState = { pageIndex: page - 1, pageSize };
  const onPaginationChange = (updater: Updater<PaginationState>) => {
    const next = resolve(updater, pagination);
    url.set({ page: next.pageIndex > 0 ? String(next.pageIndex + 1) : null, pageSize: next.pageSize !== 50 ? String(next.pageSize) : null }, next.pageSize !== pageSize);
  };
  const storedColumns = useSyncExternalStore(columnsStore.subscribe, columnsStore.get, columnsStore.server);
  const lowCoverage = params.get("lowCoverage") === "true";
  const columnVisibility: ColumnVisibilityState = useMemo(() => {
    let chosen = hiddenColumns;
    try {
      if (storedColumns) chosen = { ...hiddenColumns, ...JSON.parse(storedColumns) };
    } catch {
      // an unreadable choice falls back to the default columns
    }
    // Checking low coverage needs the value in view.
    return lowCoverage ? { ...chosen, coverage: true } : chosen;
  }, [storedColumns, lowCoverage]);

  const columns = useStampColumns(unitSystem);
  const table = useTable({
    features: stampTableFeatures,
    columns,
    data: data?.stamps ?? emptyRows,
    rowCount: data?.total ?? 0,
    state: { sorting, columnVisibility, pagination },
    onSortingChange,
    onColumnVisibilityChange: (updater: Updater<ColumnVisibilityState>) => columnsStore.set(resolve(updater, columnVisibility)),
    onPaginationChange,
    manualSorting: true,
    manualPagination: true,
    enableMultiSort: false,
    enableSortingRemoval: false,
  });

  const total = data?.total ?? 0;
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  const filterLabels: Record<string, string> = {
    q: t("stamps.filters.search"),
    condition: t("stamps.filters.condition"),
    site: t("stamps.filters.site"),
    location: t("stamps.filters.location"),
    face: t("stamps.filters.face"),
    out: t("stamps.filters.out"),
    overdue: t("stamps.filters.out"),
    tag: t("stamps.columns.tags"),
    lowCoverage: t("stamps.table.lowCoverageFilter"),
    minWidthMm: t("stamps.filters.width", { unit: unitSystem === "imperial" ? "in" : "mm" }),
    maxWidthMm: t("stamps.filters.width", { unit: unitSystem === "imperial" ? "in" : "mm" }),
    minHeightMm: t("stamps.filters.height", { unit: unitSystem === "imperial" ? "in" : "mm" }),
    maxHeightMm: t("stamps.filters.height", { unit: unitSystem === "imperial" ? "in" : "mm" }),
  };
  const refusedText = Object.entries(refused).map(([field, messages]) => t("stamps.filters.fieldProblem", { field: filterLabels[field] ?? field, problem: messages.join(" ") }));

  return (
    <div className="space-y-3">
      <StampFilters url={url} search={search} setSearch={setSearch} locations={locations} sites={sites} unitSystem={unitSystem} refused={refused} filtered={filtered} />

      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-sm text-stone-600" data-testid="stamp-count" aria-live="polite">
          {isLoading ? t("common.loading") : error ? t("stamps.table.refused") : t("stamps.table.count", { first, last, total })}
          {lowCoverage ? (
            <span className="ml-2 rounded bg-amber-100 px-1.5 text-xs text-amber-900">
              {t("stamps.table.lowCoverageFilter")}{" "}
              <button type="button" className="underline" onClick={() => url.set({ lowCoverage: null })}>
                {t("stamps.filters.remove")}
              </button>
            </span>
          ) : null}
          {url.params.get("tag") ? (
            <span className="ml-2 rounded bg-soga-50 px-1.5 text-xs text-soga-700">
              {t("stamps.table.tagFilter", { tag: url.params.get("tag")! })}{" "}
              <button type="button" className="underline" onClick={() => url.set({ tag: null })}>
                {t("stamps.filters.remove")}
              </button>
            </span>
          ) : null}
          {isValidating && !isLoading ? <span className="ml-2 text-xs text-stone-500">{t("stamps.table.updating")}</span> : null}
        </p>
        <div className="flex flex-wrap items-center gap-2">
          <details className="relative">
            <summary className="cursor-pointer list-none rounded-md border border-stone-300 bg-white px-3 py-1.5 text-sm">{t("stamps.table.columns")} ▾</summary>
            <fieldset className="absolute right-0 z-10 mt-1 w-56 space-y-1 rounded-md border border-stone-200 bg-white p-3 shadow-lg">
              <legend className="sr-only">{t("stamps.table.columns")}</legend>
              {table
                .getAllLeafColumns()
                .filter((c) => c.getCanHide())
                .map((c) => (
                  <label key={c.id} className="flex items-center gap-2 text-sm">
                    <input type="checkbox" checked={c.getIsVisible()} onChange={c.getToggleVisibilityHandler()} />
                    {t(`stamps.columns.${c.id as StampColumnId}`)}
                  </label>
                ))}
            </fieldset>
          </details>
          <a href={stampUrls.export(filterQuery)} className="rounded-md border border-stone-300 bg-white px-3 py-1.5 text-sm hover:bg-stone-100" download>
            {t("stamps.table.export")}
          </a>
          <Link href={`/stamps/labels?${filterQuery}`} className="rounded-md border border-stone-300 bg-white px-3 py-1.5 text-sm hover:bg-stone-100">
            {t("stamps.table.labels")}
          </Link>
        </div>
      </div>

      {error ? (
        <Notice tone="error">
          {refusedText.length ? refusedText.join(" ") : error.message}{" "}
          <button type="button" className="underline" onClick={() => mutate()}>
            {t("common.retry")}
          </button>
        </Notice>
      ) : null}


      <DataTable
        table={table}
        label={t("stamps.table.label")}
        loading={isLoading}
        busy={isValidating}
        problem={error ? t("stamps.table.refusedRows") : undefined}
        rowProps={(stamp) => ({ "data-testid": `stamp-row-${stamp.code}` })}
        empty={
          filtered ? (
          <div className="space-y-2">
            <p className="font-medium text-stone-800">{t("stamps.table.noMatch")}</p>
            <Button type="button" variant="secondary" onClick={url.clear}>
              {t("stamps.filters.clear")}
            </Button>
          </div>
        ) : (
          <div className="space-y-2">
            <p className="font-medium text-stone-800">{t("stamps.table.empty")}</p>
            <p className="text-stone-600">{canWrite ? t("stamps.table.emptyKeeper") : t("stamps.table.emptyReader")}</p>
            {canWrite ? (
              <div className="flex justify-center gap-2">
                <Link href="/stamps/new" className="rounded-md bg-ink-700 px-3 py-1.5 text-sm font-medium text-white hover:bg-ink-800">
                  {t("stamps.actions.new")}
                </Link>
                <Link href="/stamps/import" className="rounded-md border border-stone-300 px-3 py-1.5 text-sm hover:bg-stone-100">
                  {t("stamps.tabs.import")}
                </Link>
              </div>
            ) : null}
          </div>
        )
        }
      />

      <nav className="flex flex-wrap items-center justify-between gap-3" aria-label={t("stamps.table.pages")}>
        <label className="flex items-center gap-2 text-sm text-stone-600">
          {t("stamps.table.pageSize")}
          <select aria-label={t("stamps.table.pageSize")} value={pageSize} onChange={(e) => table.setPageSize(Number(e.target.value))} className="rounded-md border border-stone-300 bg-white px-2 py-1 text-sm">
            {pageSizes.map((n) => (
              <option key={n} value={n}>
                {n}
              </option>
            ))}
          </select>
        </label>
        <div className="flex items-center gap-2">
          <Button type="button" variant="secondary" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
            {t("stamps.table.previous")}
          </Button>
          <span className="text-sm text-stone-600" data-testid="page-of">
            {t("stamps.table.pageOf", { page, pages: Math.max(1, table.getPageCount()) })}
          </span>
          <Button type="button" variant="secondary" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
            {t("stamps.table.next")}
          </Button>
        </div>
      </nav>
    </div>
  );
}
