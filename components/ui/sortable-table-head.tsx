"use client";

import { flexRender, type HeaderGroup, type RowData, type TableFeatures } from "@tanstack/react-table";
import { cn } from "./cn";

/** The head of a TanStack table: each sortable column is a button with aria-sort and an arrow. */
export function SortableTableHead<TFeatures extends TableFeatures, TData extends RowData>({
  headerGroups,
  cellClassName = "px-4 py-2.5",
}: {
  headerGroups: HeaderGroup<TFeatures, TData>[];
  cellClassName?: string;
}) {
  return (
    <thead className="bg-stone-50">
      {headerGroups.map((group) => (
        <tr key={group.id}>
          {group.headers.map((header) => {
            // The sorting feature adds these to columns; a table without it has no sortable columns.
            const column = header.column as typeof header.column & { getCanSort?: () => boolean; getIsSorted?: () => false | "asc" | "desc"; getToggleSortingHandler?: () => ((event: unknown) => void) | undefined };
            const sorted = column.getIsSorted?.() ?? false;
            const content = flexRender(header.column.columnDef.header, header.getContext());
            return (
              <th
                key={header.id}
                scope="col"
                aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}
                className={cn("whitespace-nowrap text-left font-semibold text-stone-700", cellClassName)}
              >
                {column.getCanSort?.() ? (
                  <button type="button" onClick={column.getToggleSortingHandler?.()} className="inline-flex items-center gap-1 hover:text-ink-700">
                    {content}
                    <span aria-hidden="true" className="text-xs">
                      {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}
                    </span>
                  </button>
                ) : (
                  content
                )}
              </th>
            );
          })}
        </tr>
      ))}
    </thead>
  );
}
