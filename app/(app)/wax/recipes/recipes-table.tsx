"use client";

import Link from "next/link";
import { createColumnHelper, createSortedRowModel, rowSortingFeature, sortFn_alphanumeric, tableFeatures, useTable } from "@tanstack/react-table";
import { useFormatter, useTranslations } from "next-intl";
import { useMemo } from "react";
import { DataTable } from "@/components/ui/data-table";
import { rangeText } from "@/components/wax/measure";
import { waxPages, type RecipeDto, type UnitSystem } from "@/lib/contracts/wax";

const features = tableFeatures({ rowSortingFeature, sortedRowModel: createSortedRowModel(), sortFns: { alphanumeric: sortFn_alphanumeric } });
const column = createColumnHelper<typeof features, RecipeDto>();

/** The recipes: season, purpose, mix, working range and whether the flash-point rule holds. */
export function RecipesTable({ recipes, unitSystem }: { recipes: RecipeDto[]; unitSystem: UnitSystem }) {
  const t = useTranslations("waxRoom");
  const format = useFormatter();
  const columns = useMemo(
    () =>
      column.columns([
        column.accessor("name", {
          header: () => t("recipes.name"),
          cell: ({ row }) => (
            <Link href={waxPages.recipe(row.original.id)} className="font-medium text-ink-700 hover:underline">
              {row.original.name}
            </Link>
          ),
        }),
        column.accessor("season", { header: () => t("recipes.season"), cell: (i) => t(`seasons.${i.getValue()}`) }),
        column.accessor("use", { header: () => t("recipes.use"), cell: (i) => t(`uses.${i.getValue()}`) }),
        column.display({
          id: "mix",
          header: () => t("recipes.mix"),
          cell: ({ row }) => row.original.components.map((c) => `${c.material.name} ${format.number(c.pct, { maximumFractionDigits: 2 })} %`).join(", "),
        }),
        column.accessor((r) => r.workingRangeC.maxC, { id: "working", header: () => t("recipes.working"), cell: ({ row }) => rangeText(row.original.workingRangeC.minC, row.original.workingRangeC.maxC, unitSystem, format.number) }),
        column.accessor((r) => r.temperature.status, {
          id: "check",
          header: () => t("recipes.check"),
          cell: ({ row }) => <span className={row.original.temperature.status === "ok" ? "text-emerald-800" : "font-medium text-amber-800"}>{t(`recipes.status.${row.original.temperature.status}`)}</span>,
        }),
      ]),
    [t, format, unitSystem],
  );
  const table = useTable({ features, columns, data: recipes });
  return <DataTable table={table} label={t("recipes.title")} empty={t("recipes.empty")} rowProps={(r) => ({ "data-testid": `recipe-row-${r.id}` })} />;
}
