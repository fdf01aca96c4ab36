"use client";

import {
  columnVisibilityFeature,
  createColumnHelper,
  flexRender,
  rowPaginationFeature,
  rowSortingFeature,
  tableFeatures,
  useTable,
  type ColumnVisibilityState,
  type PaginationState,
  type SortingState,
  type Updater,
} from "@tanstack/react-table";
import Link from "next/link";
import { usePathname, useSearchParams } from "next/navigation";
import { useFormatter, useTranslations } from "next-intl";
import { useEffect, useMemo, useState, useSyncExternalStore } from "react";
import { ConditionBadge, OutBadge } from "@/components/stamps/condition-badge";
import { sizeText } from "@/components/stamps/measure";
import { Button } from "@/components/ui/button";
import { cn } from "@/components/ui/cn";
import { Notice } from "@/components/ui/notice";
import { SortableTableHead } from "@/components/ui/sortable-table-head";
import { stampUrls, type LocationDto } from "@/lib/contracts/stamps";
import type { StampListItem } from "@/lib/contracts/stamps";
import { isLowCoverage } from "@/lib/stamps/coverage";
import type { UnitSystem } from "@/lib/stamps/format";
import { ApiError } from "@/lib/swr/fetcher";
import { useStamps } from "@/lib/swr/use-stamps";
import { inchesToMm, mmToInches } from "@/lib/units";
import { stampConditions } from "@/lib/validation/stamps";
import { calendarDay } from "@/lib/i18n/formats";
import { locationLabel } from "@/lib/stamps/format";

const features = tableFeatures({ rowSortingFeature, columnVisibilityFeature, rowPaginationFeature });
const column = createColumnHelper<typeof features, StampListItem>();
const emptyRows: StampListItem[] = [];

/** Table column → the API's sort key. */
const sortKeyOf: Record<string, string> = {
  code: "code",
  name: "name",
  size: "width",
  condition: "condition",
  location: "location",
  maker: "maker",
  madeOn: "madeOn",
  impressions: "impressions",
  updated: "updated",
};
const columnOfSortKey = Object.fromEntries(Object.entries(sortKeyOf).map(([c, k]) => [k, c]));

const defaultHidden: ColumnVisibilityState = { maker: false, madeOn: false, tags: false, impressions: false, updated: false, face: false, coverage: false };
const filterKeys = ["q", "condition", "site", "location", "face", "out", "overdue", "tag", "lowCoverage", "minWidthMm", "maxWidthMm", "minHeightMm", "maxHeightMm"];

// Column choice lives in the browser (per person and device), read without a hydration mismatch.
const columnsKey = "capgrid.stamps.columns";
/** The table's columns, each with its heading at stamps.columns.<id>. */
type ColumnId = "code" | "name" | "size" | "face" | "condition" | "location" | "out" | "maker" | "madeOn" | "tags" | "impressions" | "updated";
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

export function StampsTable({
  locations,
  sites,
  unitSystem,
  canWrite,
}: {
  locations: LocationDto[];
  sites: string[];
  unitSystem: UnitSystem;
  canWrite: boolean;
}) {
  const t = useTranslations();
  const format = useFormatter();
  // The filters live in the address; replacing it through the History API updates
  // useSearchParams without asking the server to render the page again.
  const go = (url: string) => window.history.replaceState(null, "", url);
  const pathname = usePathname();
  const params = useSearchParams();

  const setParams = (changes: Record<string, string | null>, resetPage = true) => {
    const next = new URLSearchParams(params.toString());
    for (const [key, value] of Object.entries(changes)) {
      if (value === null || value === "") next.delete(key);
      else next.set(key, value);
    }
    if (resetPage) next.delete("page");
    const qs = next.toString();
    go(qs ? `${pathname}?${qs}` : pathname);
  };

  // The search box updates the address a moment after typing stops.
  const q = params.get("q") ?? "";
  const [search, setSearch] = useState(q);
  const [lastQ, setLastQ] = useState(q);
  if (q !== lastQ) {
    setLastQ(q);
    setSearch(q);
  }
  useEffect(() => {
    if (search === q) return;
    const timer = setTimeout(() => setParams({ q: search.trim() || null }), 300);
    return () => clearTimeout(timer);
    // eslint-disable-next-line react-hooks/exhaustive-deps -- setParams is rebuilt each render; search drives this
  }, [search]);

  const sort = params.get("sort") ?? "code";
  const page = Math.max(1, Number(params.get("page") ?? 1) || 1);
  const pageSize = [25, 50, 100].includes(Number(params.get("pageSize"))) ? Number(params.get("pageSize")) : 50;
  const apiQuery = useMemo(() => {
    const query = new URLSearchParams();
    for (const key of filterKeys) {
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
  const filtered = filterKeys.some((k) => params.get(k));

  const sorting: SortingState = useMemo(() => {
    const desc = sort.startsWith("-");
    const key = desc ? sort.slice(1) : sort;
    return [{ id: columnOfSortKey[key] ?? "code", desc }];
  }, [sort]);
  const onSortingChange = (updater: Updater<SortingState>) => {
    const next = resolve(updater, sorting)[0];
    setParams({ sort: next ? `${next.desc ? "-" : ""}${sortKeyOf[next.id] ?? "code"}` : null });
  };
  const pagination: PaginationState = { pageIndex: page - 1, pageSize };
  const onPaginationChange = (updater: Updater<PaginationState>) => {
    const next = resolve(updater, pagination);
    setParams({ page: next.pageIndex > 0 ? String(next.pageIndex + 1) : null, pageSize: next.pageSize !== 50 ? String(next.pageSize) : null }, next.pageSize !== pageSize);
  };
  const storedColumns = useSyncExternalStore(columnsStore.subscribe, columnsStore.get, columnsStore.server);
  const lowCoverage = params.get("lowCoverage") === "true";
  const columnVisibility: ColumnVisibilityState = useMemo(() => {
    let chosen = defaultHidden;
    try {
      if (storedColumns) chosen = { ...defaultHidden, ...JSON.parse(storedColumns) };
    } catch {
      // an unreadable choice falls back to the default columns
    }
    // Checking low coverage needs the value in view.
    return lowCoverage ? { ...chosen, coverage: true } : chosen;
  }, [storedColumns, lowCoverage]);

  const columns = useMemo(
    () =>
      column.columns([
        column.accessor("code", {
          header: () => t("stamps.columns.code"),
          enableHiding: false,
          cell: (info) => (
            <Link href={`/stamps/${encodeURIComponent(info.getValue())}`} className="font-mono font-medium text-ink-700 hover:underline">
              {info.getValue()}
            </Link>
          ),
        }),
        column.accessor("name", { header: () => t("stamps.columns.name"), cell: (info) => <span className="text-stone-900">{info.getValue()}</span> }),
        column.accessor("widthMm", {
          id: "size",
          header: () => t("stamps.columns.size"),
          cell: ({ row }) => <span className="whitespace-nowrap tabular-nums">{sizeText(row.original.widthMm, row.original.heightMm, unitSystem, format.number)}</span>,
        }),
        column.accessor("face", {
          header: () => t("stamps.columns.face"),
          enableSorting: false,
          cell: ({ row }) => t(`stamps.faces.${row.original.face}`) + (row.original.mirrored ? ` · ${t("stamps.fields.mirroredShort")}` : ""),
        }),
        column.accessor("condition", {
          header: () => t("stamps.columns.condition"),
          cell: (info) => <ConditionBadge condition={info.getValue()} label={t(`stamps.conditions.${info.getValue()}`)} />,
        }),
        column.accessor((row) => (row.location ? `${row.location.site} ${row.location.code}` : ""), {
          id: "location",
          header: () => t("stamps.columns.location"),
          cell: ({ row }) =>
            row.original.location ? (
              <Link href={`/stamps?location=${row.original.location.id}`} className="whitespace-nowrap text-ink-700 hover:underline" title={t("stamps.table.showLocation")}>
                {row.original.location.site} · <span className="font-mono">{row.original.location.code}</span>
              </Link>
            ) : (
              <span className="text-stone-500">{t("stamps.table.noLocation")}</span>
            ),
        }),
        column.accessor((row) => row.checkout?.borrowerName ?? "", {
          id: "out",
          header: () => t("stamps.columns.out"),
          enableSorting: false,
          cell: ({ row }) => {
            const c = row.original.checkout;
            if (!c) return <span className="text-stone-500">{t("stamps.table.onShelf")}</span>;
            return (
              <span className="flex flex-col gap-0.5">
                <OutBadge overdue={c.overdue} label={c.overdue ? t("stamps.table.overdue") : t("stamps.table.out")} />
                <span className="text-xs text-stone-600">
                  {t("stamps.table.outTo", { name: c.borrowerName, due: format.dateTime(calendarDay(c.dueOn), "day") })}
                </span>
              </span>
            );
          },
        }),
        column.accessor((row) => row.maker ?? "", { id: "maker", header: () => t("stamps.columns.maker") }),
        column.accessor((row) => row.madeOn ?? "", {
          id: "madeOn",
          header: () => t("stamps.columns.madeOn"),
          cell: ({ row }) => (row.original.madeOn ? format.dateTime(calendarDay(row.original.madeOn), "day") : ""),
        }),
        column.accessor((row) => row.tags.join(" "), {
          id: "tags",
          header: () => t("stamps.columns.tags"),
          enableSorting: false,
          cell: ({ row }) => (
            <span className="flex flex-wrap gap-1">
              {row.original.tags.map((tag) => (
                <Link key={tag} href={`/stamps?tag=${encodeURIComponent(tag)}`} className="rounded bg-soga-50 px-1.5 text-xs text-soga-700 hover:underline">
                  {tag}
                </Link>
              ))}
            </span>
          ),
        }),
        column.accessor((row) => row.coverageRatio ?? -1, {
          id: "coverage",
          header: () => t("stamps.columns.coverage"),
          enableSorting: false,
          cell: ({ row }) =>
            row.original.coverageRatio === null ? (
              <span className="text-stone-400">—</span>
            ) : (
              <span className={cn("tabular-nums", isLowCoverage(row.original.coverageRatio) && "font-medium text-amber-800")}>
                {format.number(row.original.coverageRatio, { style: "percent", maximumFractionDigits: 2 })}
              </span>
            ),
        }),
        column.accessor("impressionsCount", {
          id: "impressions",
          header: () => t("stamps.columns.impressions"),
          cell: (info) => <span className="tabular-nums">{format.number(info.getValue())}</span>,
        }),
        column.accessor("updatedAt", {
          id: "updated",
          header: () => t("stamps.columns.updated"),
          cell: (info) => format.dateTime(new Date(info.getValue()), "date"),
        }),
      ]),
    [t, format, unitSystem],
  );

  const table = useTable({
    features,
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
  const rows = table.getRowModel().rows;
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  const visibleColumns = table.getVisibleLeafColumns();
  const conditions = (params.get("condition") ?? "").split(",").filter(Boolean);
  const site = params.get("site") ?? "";
  const toUnits = (mm: string | null) => (mm ? String(unitSystem === "imperial" ? Number(mmToInches(Number(mm)).toFixed(2)) : Number(mm)) : "");
  const fromUnits = (value: string) => (value === "" || Number.isNaN(Number(value)) ? null : String(Math.round((unitSystem === "imperial" ? inchesToMm(Number(value)) : Number(value)) * 10) / 10));
  const unit = unitSystem === "imperial" ? "in" : "mm";
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
    minWidthMm: t("stamps.filters.width", { unit }),
    maxWidthMm: t("stamps.filters.width", { unit }),
    minHeightMm: t("stamps.filters.height", { unit }),
    maxHeightMm: t("stamps.filters.height", { unit }),
  };
  const refusedText = Object.entries(refused).map(([field, messages]) => t("stamps.filters.fieldProblem", { field: filterLabels[field] ?? field, problem: messages.join(" ") }));
  const rangeErrors = (a: string, b: string) => [...(refused[a] ?? []), ...(refused[b] ?? [])];
  const widthErrors = rangeErrors("minWidthMm", "maxWidthMm");
  const heightErrors = rangeErrors("minHeightMm", "maxHeightMm");
  const outValue = params.get("overdue") === "true" ? "overdue" : params.get("out") ?? "";

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3 rounded-lg border border-stone-200 bg-white p-3" role="search" aria-label={t("stamps.filters.label")}>
        <label className="flex min-w-56 flex-1 flex-col gap-1 text-xs font-medium text-stone-700">
          {t("stamps.filters.search")}
          <input
            type="search"
            aria-label={t("stamps.filters.search")}
            value={search}
            onChange={(e) => setSearch(e.target.value)}
            placeholder={t("stamps.filters.searchPlaceholder")}
            className="rounded-md border border-stone-300 px-3 py-1.5 text-sm font-normal"
          />
        </label>
        <details className="relative">
          <summary className="cursor-pointer list-none rounded-md border border-stone-300 bg-white px-3 py-1.5 text-sm">
            {t("stamps.filters.condition")}
            {conditions.length ? ` (${conditions.length})` : ""} ▾
          </summary>
          <fieldset className="absolute z-10 mt-1 w-56 space-y-1 rounded-md border border-stone-200 bg-white p-3 shadow-lg">
            <legend className="sr-only">{t("stamps.filters.condition")}</legend>
            {stampConditions.map((c) => (
              <label key={c} className="flex items-center gap-2 text-sm">
                <input
                  type="checkbox"
                  checked={conditions.includes(c)}
                  onChange={(e) => {
                    const next = e.target.checked ? [...conditions, c] : conditions.filter((x) => x !== c);
                    setParams({ condition: next.join(",") || null });
                  }}
                />
                {t(`stamps.conditions.${c}`)}
              </label>
            ))}
          </fieldset>
        </details>
        <label className="flex flex-col gap-1 text-xs font-medium text-stone-700">
          {t("stamps.filters.site")}
          <select aria-label={t("stamps.filters.site")} value={site} onChange={(e) => setParams({ site: e.target.value || null, location: null })} className="rounded-md border border-stone-300 bg-white px-2 py-1.5 text-sm font-normal">
            <option value="">{t("stamps.filters.anySite")}</option>
            {sites.map((s) => (
              <option key={s} value={s}>
                {s}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-xs font-medium text-stone-700">
          {t("stamps.filters.location")}
          <select aria-label={t("stamps.filters.location")} value={params.get("location") ?? ""} onChange={(e) => setParams({ location: e.target.value || null })} className="rounded-md border border-stone-300 bg-white px-2 py-1.5 text-sm font-normal">
            <option value="">{t("stamps.filters.anyLocation")}</option>
            {locations
              .filter((l) => !site || l.site === site)
              .map((l) => (
                <option key={l.id} value={l.id}>
                  {locationLabel(l)}
                </option>
              ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-xs font-medium text-stone-700">
          {t("stamps.filters.face")}
          <select aria-label={t("stamps.filters.face")} value={params.get("face") ?? ""} onChange={(e) => setParams({ face: e.target.value || null })} className="rounded-md border border-stone-300 bg-white px-2 py-1.5 text-sm font-normal">
            <option value="">{t("stamps.filters.anyFace")}</option>
            <option value="single">{t("stamps.faces.single")}</option>
            <option value="pair">{t("stamps.faces.pair")}</option>
          </select>
        </label>
        <label className="flex flex-col gap-1 text-xs font-medium text-stone-700">
          {t("stamps.filters.out")}
          <select
            aria-label={t("stamps.filters.out")}
            value={outValue}
            onChange={(e) => {
              const v = e.target.value;
              setParams({ out: v === "true" || v === "false" ? v : null, overdue: v === "overdue" ? "true" : null });
            }}
            className="rounded-md border border-stone-300 bg-white px-2 py-1.5 text-sm font-normal"
          >
            <option value="">{t("stamps.filters.outAny")}</option>
            <option value="false">{t("stamps.filters.outNo")}</option>
            <option value="true">{t("stamps.filters.outYes")}</option>
            <option value="overdue">{t("stamps.filters.outOverdue")}</option>
          </select>
        </label>
        <fieldset className="flex flex-col gap-1 text-xs font-medium text-stone-700">
          <legend className="mb-1">{t("stamps.filters.width", { unit })}</legend>
          <span className="flex items-center gap-1">
            <RangeInput label={t("stamps.filters.widthFrom", { unit })} value={toUnits(params.get("minWidthMm"))} onCommit={(v) => setParams({ minWidthMm: fromUnits(v) })} errorId={widthErrors.length ? "filter-width-error" : undefined} />–
            <RangeInput label={t("stamps.filters.widthTo", { unit })} value={toUnits(params.get("maxWidthMm"))} onCommit={(v) => setParams({ maxWidthMm: fromUnits(v) })} errorId={widthErrors.length ? "filter-width-error" : undefined} />
          </span>
          <RangeError id="filter-width-error" messages={widthErrors} />
        </fieldset>
        <fieldset className="flex flex-col gap-1 text-xs font-medium text-stone-700">
          <legend className="mb-1">{t("stamps.filters.height", { unit })}</legend>
          <span className="flex items-center gap-1">
            <RangeInput label={t("stamps.filters.heightFrom", { unit })} value={toUnits(params.get("minHeightMm"))} onCommit={(v) => setParams({ minHeightMm: fromUnits(v) })} errorId={heightErrors.length ? "filter-height-error" : undefined} />–
            <RangeInput label={t("stamps.filters.heightTo", { unit })} value={toUnits(params.get("maxHeightMm"))} onCommit={(v) => setParams({ maxHeightMm: fromUnits(v) })} errorId={heightErrors.length ? "filter-height-error" : undefined} />
          </span>
          <RangeError id="filter-height-error" messages={heightErrors} />
        </fieldset>
        {filtered ? (
          <Button type="button" variant="ghost" onClick={() => go(pathname)}>
            {t("stamps.filters.clear")}
          </Button>
        ) : null}
      </div>

      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-sm text-stone-600" data-testid="stamp-count" aria-live="polite">
          {isLoading ? t("common.loading") : error ? t("stamps.table.refused") : t("stamps.table.count", { first, last, total })}
          {lowCoverage ? (
            <span className="ml-2 rounded bg-amber-100 px-1.5 text-xs text-amber-900">
              {t("stamps.table.lowCoverageFilter")}{" "}
              <button type="button" className="underline" onClick={() => setParams({ lowCoverage: null })}>
                {t("stamps.filters.remove")}
              </button>
            </span>
          ) : null}
          {params.get("tag") ? (
            <span className="ml-2 rounded bg-soga-50 px-1.5 text-xs text-soga-700">
              {t("stamps.table.tagFilter", { tag: params.get("tag")! })}{" "}
              <button type="button" className="underline" onClick={() => setParams({ tag: null })}>
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
                    {t(`stamps.columns.${c.id as ColumnId}`)}
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

      <div className={cn("overflow-x-auto rounded-lg border border-stone-200 bg-white transition-opacity", isValidating && !isLoading && "opacity-70")}>
        <table className="min-w-full divide-y divide-stone-200 text-sm" aria-label={t("stamps.table.label")} aria-busy={isValidating}>
          <SortableTableHead headerGroups={table.getHeaderGroups()} cellClassName="px-3 py-2.5" />
          <tbody className="divide-y divide-stone-100">
            {isLoading ? (
              Array.from({ length: 6 }, (_, i) => (
                <tr key={i} aria-hidden="true">
                  {visibleColumns.map((c) => (
                    <td key={c.id} className="px-3 py-3">
                      <span className="block h-3 w-20 animate-pulse rounded bg-stone-200" />
                    </td>
                  ))}
                </tr>
              ))
            ) : error ? (
              <tr>
                <td colSpan={visibleColumns.length} className="px-4 py-12 text-center text-stone-600">
                  {t("stamps.table.refusedRows")}
                </td>
              </tr>
            ) : rows.length === 0 ? (
              <tr>
                <td colSpan={visibleColumns.length} className="px-4 py-12 text-center">
                  {filtered ? (
                    <div className="space-y-2">
                      <p className="font-medium text-stone-800">{t("stamps.table.noMatch")}</p>
                      <Button type="button" variant="secondary" onClick={() => go(pathname)}>
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
                  )}
                </td>
              </tr>
            ) : (
              rows.map((row) => (
                <tr key={row.id} data-testid={`stamp-row-${row.original.code}`} className="hover:bg-stone-50">
                  {row.getVisibleCells().map((cell) => (
                    <td key={cell.id} className="px-3 py-2 align-middle text-stone-700">
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  ))}
                </tr>
              ))
            )}
          </tbody>
        </table>
      </div>

      <nav className="flex flex-wrap items-center justify-between gap-3" aria-label={t("stamps.table.pages")}>
        <label className="flex items-center gap-2 text-sm text-stone-600">
          {t("stamps.table.pageSize")}
          <select aria-label={t("stamps.table.pageSize")} value={pageSize} onChange={(e) => table.setPageSize(Number(e.target.value))} className="rounded-md border border-stone-300 bg-white px-2 py-1 text-sm">
            {[25, 50, 100].map((n) => (
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

/** The message under a from–to pair of filter boxes; both boxes point at it. */
function RangeError({ id, messages }: { id: string; messages: string[] }) {
  return (
    <p id={id} className={cn("max-w-48 text-xs font-normal text-red-700", !messages.length && "sr-only")} aria-live="polite">
      {messages.join(" ")}
    </p>
  );
}

/** A number box that applies its value when the person leaves it or presses Enter. */
function RangeInput({ label, value, onCommit, errorId }: { label: string; value: string; onCommit: (value: string) => void; errorId?: string }) {
  const [draft, setDraft] = useState(value);
  const [last, setLast] = useState(value);
  if (value !== last) {
    setLast(value);
    setDraft(value);
  }
  return (
    <input
      type="number"
      inputMode="decimal"
      min={0}
      step="any"
      aria-label={label}
      aria-invalid={errorId ? true : undefined}
      aria-describedby={errorId}
      value={draft}
      onChange={(e) => setDraft(e.target.value)}
      onBlur={() => draft !== value && onCommit(draft)}
      onKeyDown={(e) => e.key === "Enter" && onCommit(draft)}
      className="w-20 rounded-md border border-stone-300 px-2 py-1.5 text-sm font-normal aria-invalid:border-red-500"
    />
  );
}
