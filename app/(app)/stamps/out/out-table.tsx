"use client";

import { createColumnHelper, createSortedRowModel, rowSortingFeature, sortFn_alphanumeric, tableFeatures, useTable } from "@tanstack/react-table";
import Link from "next/link";
import { useFormatter, useTranslations } from "next-intl";
import { useMemo } from "react";
import { OutBadge } from "@/components/stamps/condition-badge";
import { DataTable } from "@/components/ui/data-table";
import type { OpenCheckoutDto } from "@/lib/contracts/stamps";
import { calendarDay } from "@/lib/i18n/formats";

const features = tableFeatures({ rowSortingFeature, sortedRowModel: createSortedRowModel(), sortFns: { alphanumeric: sortFn_alphanumeric } });
const column = createColumnHelper<typeof features, OpenCheckoutDto>();

/** Stamps that are out, the longest overdue first (the list's order); each column sorts on a click. */
export function OutTable({ checkouts }: { checkouts: OpenCheckoutDto[] }) {
  const t = useTranslations();
  const format = useFormatter();
  const columns = useMemo(
    () =>
      column.columns([
        column.accessor("stampCode", {
          header: () => t("stamps.columns.code"),
          cell: ({ row }) => (
            <>
              <Link href={`/stamps/${encodeURIComponent(row.original.stampCode)}`} className="font-mono font-medium text-ink-700 hover:underline">
                {row.original.stampCode}
              </Link>
              <span className="block text-xs text-stone-500">{row.original.stampName}</span>
            </>
          ),
        }),
        column.accessor("borrowerName", {
          header: () => t("stamps.checkout.borrower"),
          cell: ({ row }) => (
            <>
              {row.original.borrowerName}
              <span className="block text-xs text-stone-500">{row.original.borrowerEmail ?? t("overdue.noEmail")}</span>
            </>
          ),
        }),
        column.accessor("workstation", { header: () => t("stamps.checkout.workstation") }),
        column.accessor("outAt", { header: () => t("stamps.checkout.since"), cell: (info) => format.dateTime(new Date(info.getValue()), "date") }),
        column.accessor("dueOn", {
          header: () => t("stamps.checkout.due"),
          cell: ({ row }) => (
            <span className="flex items-center gap-2">
              {format.dateTime(calendarDay(row.original.dueOn), "day")}
              {row.original.overdue ? <OutBadge overdue label={t("stamps.table.overdue")} /> : null}
            </span>
          ),
        }),
        column.accessor((c) => c.lastRemindedAt ?? "", {
          id: "reminded",
          header: () => t("overdue.reminded"),
          cell: ({ row }) => <span className="text-stone-600">{row.original.lastRemindedAt ? format.dateTime(new Date(row.original.lastRemindedAt), "moment") : "—"}</span>,
        }),
      ]),
    [t, format],
  );
  const table = useTable({ features, columns, data: checkouts });
  return (
    <DataTable
      table={table}
      label={t("overdue.title")}
      empty={t("overdue.empty")}
      rowProps={(c) => ({ "data-testid": `out-row-${c.stampCode}`, className: c.overdue ? "bg-red-50/50" : undefined })}
    />
  );
}
