"use client";

import { flexRender, type Cell, type Column, type Row, type RowData, type Table, type TableFeatures } from "@tanstack/react-table";
import type { ReactNode } from "react";
import { cn } from "./cn";
import { SortableTableHead } from "./sortable-table-head";

interface Props<TFeatures extends TableFeatures, TData extends RowData> {
  table: Table<TFeatures, TData>;
  /** The table's accessible name. */
  label?: string;
  /** The rows are being fetched for the first time: placeholder rows. */
  loading?: boolean;
  /** A newer answer is on its way: the old rows stay, dimmed. */
  busy?: boolean;
  /** Shown instead of the rows (e.g. a refused filter). */
  problem?: ReactNode;
  /** Shown when there are no rows. */
  empty: ReactNode;
  rowProps?: (row: TData) => { "data-testid"?: string; className?: string };
  cellClassName?: string;
}

// The feature set decides which of these a table has; tables without column visibility show every column.
type Visible<TFeatures extends TableFeatures, TData extends RowData> = { getVisibleLeafColumns?: () => Column<TFeatures, TData>[] };
type VisibleCells<TFeatures extends TableFeatures, TData extends RowData> = { getVisibleCells?: () => Cell<TFeatures, TData, unknown>[] };

/** The one table shell: sortable head, placeholder rows while loading, a problem or empty row, and the rows. */
export function DataTable<TFeatures extends TableFeatures, TData extends RowData>({ table, label, loading, busy, problem, empty, rowProps, cellClassName = "px-3 py-2" }: Props<TFeatures, TData>) {
  const columns = (table as Visible<TFeatures, TData>).getVisibleLeafColumns?.() ?? table.getAllLeafColumns();
  const rows: Row<TFeatures, TData>[] = table.getRowModel().rows;
  const wide = (content: ReactNode, className = "px-4 py-12 text-center text-stone-600") => (
    <tr>
      <td colSpan={columns.length} className={className}>
        {content}
      </td>
    </tr>
  );
  return (
    <div className={cn("overflow-x-auto rounded-lg border border-stone-200 bg-white transition-opacity", busy && !loading && "opacity-70")}>
      <table className="min-w-full divide-y divide-stone-200 text-sm" aria-label={label} aria-busy={busy || loading || undefined}>
        <SortableTableHead headerGroups={table.getHeaderGroups()} cellClassName={cn(cellClassName, "py-2.5")} />
        <tbody className="divide-y divide-stone-100">
          {loading
            ? Array.from({ length: 6 }, (_, i) => (
                <tr key={i} aria-hidden="true">
                  {columns.map((c) => (
                    <td key={c.id} className="px-3 py-3">
                      <span className="block h-3 w-20 animate-pulse rounded bg-stone-200" />
                    </td>
                  ))}
                </tr>
              ))
            : problem
              ? wide(problem)
              : rows.length === 0
                ? wide(empty)
                : rows.map((row) => {
                    const extra = rowProps?.(row.original) ?? {};
                    const cells = (row as VisibleCells<TFeatures, TData>).getVisibleCells?.() ?? row.getAllCells();
                    return (
                      <tr key={row.id} data-testid={extra["data-testid"]} className={cn("hover:bg-stone-50", extra.className)}>
                        {cells.map((cell) => (
                          <td key={cell.id} className={cn(cellClassName, "align-middle text-stone-700")}>
                            {flexRender(cell.column.columnDef.cell, cell.getContext())}
                          </td>
                        ))}
                      </tr>
                    );
                  })}
        </tbody>
      </table>
    </div>
  );
}
