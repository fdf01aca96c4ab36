"use client";

import { columnVisibilityFeature, createColumnHelper, rowPaginationFeature, rowSortingFeature, tableFeatures, type ColumnVisibilityState } from "@tanstack/react-table";
import Link from "next/link";
import { useFormatter, useTranslations } from "next-intl";
import { useMemo } from "react";
import { ConditionBadge, OutBadge } from "@/components/stamps/condition-badge";
import { cn } from "@/components/ui/cn";
import type { StampListItem } from "@/lib/contracts/stamps";
import { calendarDay } from "@/lib/i18n/formats";
import { measures } from "@/lib/i18n/measures";
import { isLowCoverage } from "@/lib/stamps/coverage";
import type { UnitSystem } from "@/lib/stamps/format";
import type { StampSortKey } from "@/lib/validation/stamps";

// The columns of the stamp table: what each shows, which API sort key it stands for, and which are hidden
// until a person asks for them.

export const stampTableFeatures = tableFeatures({ rowSortingFeature, columnVisibilityFeature, rowPaginationFeature });
const column = createColumnHelper<typeof stampTableFeatures, StampListItem>();

/** The table's columns, each with its heading at stamps.columns.<id>. */
export type StampColumnId = "code" | "name" | "size" | "face" | "condition" | "location" | "out" | "maker" | "madeOn" | "tags" | "coverage" | "impressions" | "updated";

/** Column → the list API's sort key (lib/validation/stamps.ts stampSortKeys); columns without one do not sort. */
export const sortKeyOfColumn: Partial<Record<StampColumnId, StampSortKey>> = {
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
export const columnOfSortKey = Object.fromEntries(Object.entries(sortKeyOfColumn).map(([c, k]) => [k, c])) as Partial<Record<StampSortKey, StampColumnId>>;

export const hiddenColumns: ColumnVisibilityState = { maker: false, madeOn: false, tags: false, impressions: false, updated: false, face: false, coverage: false };

/** The column definitions, in the person's language and units. */
export function useStampColumns(unitSystem: UnitSystem) {
  const t = useTranslations();
  const format = useFormatter();
  return useMemo(() => stampColumns(t, format, unitSystem), [t, format, unitSystem]);
}

function stampColumns(t: ReturnType<typeof useTranslations<never>>, format: ReturnType<typeof useFormatter>, unitSystem: UnitSystem) {
  return column.columns([
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
      cell: ({ row }) => <span className="whitespace-nowrap tabular-nums">{measures(format, unitSystem).size(row.original.widthMm, row.original.heightMm)}</span>,
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
            {measures(format, unitSystem).percent(row.original.coverageRatio, true)}
          </span>
        ),
    }),
    column.accessor("impressionsCount", {
      id: "impressions",
      header: () => t("stamps.columns.impressions"),
      cell: (info) => <span className="tabular-nums">{format.number(info.getValue(), "count")}</span>,
    }),
    column.accessor("updatedAt", {
      id: "updated",
      header: () => t("stamps.columns.updated"),
      cell: (info) => format.dateTime(new Date(info.getValue()), "date"),
    }),
  ]);
}
