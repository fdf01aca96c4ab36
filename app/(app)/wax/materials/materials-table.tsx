"use client";

import Link from "next/link";
import { createColumnHelper, createSortedRowModel, rowSortingFeature, sortFn_alphanumeric, tableFeatures, useTable } from "@tanstack/react-table";
import { useFormatter, useTranslations } from "next-intl";
import { useMemo } from "react";
import { DataTable } from "@/components/ui/data-table";
import { kgText, rangeText, tempText } from "@/components/wax/measure";
import { waxPages, type Currency, type MaterialDto, type UnitSystem } from "@/lib/contracts/wax";
import { poundsToKilograms } from "@/lib/units";

const features = tableFeatures({ rowSortingFeature, sortedRowModel: createSortedRowModel(), sortFns: { alphanumeric: sortFn_alphanumeric } });
const column = createColumnHelper<typeof features, MaterialDto>();

/** Every material with its figures and stock; a row below its reorder level says so. */
export function MaterialsTable({ materials, unitSystem, currency }: { materials: MaterialDto[]; unitSystem: UnitSystem; currency: Currency }) {
  const t = useTranslations("waxRoom.materials");
  const format = useFormatter();
  const columns = useMemo(() => {
    const money = (v: number) => format.number(unitSystem === "imperial" ? v * poundsToKilograms(1) : v, { style: "currency", currency, maximumFractionDigits: currency === "IDR" ? 0 : 2 });
    return column.columns([
      column.accessor("name", {
        header: () => t("name"),
        cell: ({ row }) => (
          <Link href={waxPages.material(row.original.id)} className="font-medium text-ink-700 hover:underline">
            {row.original.name}
          </Link>
        ),
      }),
      column.accessor("densityGPerCm3", { header: () => t("density"), cell: (i) => `${format.number(i.getValue(), { maximumFractionDigits: 3 })} g/cm³` }),
      column.accessor((m) => m.meltingRangeC.fromC, { id: "melting", header: () => t("melting"), cell: ({ row }) => rangeText(row.original.meltingRangeC.fromC, row.original.meltingRangeC.toC, unitSystem, format.number) }),
      column.accessor((m) => m.flashPointC ?? -1, { id: "flash", header: () => t("flashPoint"), cell: ({ row }) => (row.original.flashPointC === null ? <span className="text-amber-800">{t("unknown")}</span> : tempText(row.original.flashPointC, unitSystem, format.number)) }),
      column.accessor((m) => m.pricePerKg ?? -1, { id: "price", header: () => t("price"), cell: ({ row }) => (row.original.pricePerKg === null ? "—" : t("perUnit", { price: money(row.original.pricePerKg), unit: unitSystem === "imperial" ? "lb" : "kg" })) }),
      column.accessor("onHandKg", {
        header: () => t("onHand"),
        cell: ({ row }) => (
          <span className={row.original.belowReorder ? "font-medium text-red-700" : undefined}>
            {kgText(row.original.onHandKg, unitSystem, format.number)}
            {row.original.belowReorder ? ` · ${t("belowReorder")}` : ""}
          </span>
        ),
      }),
      column.accessor("reorderLevelKg", { header: () => t("reorderLevel"), cell: (i) => kgText(i.getValue(), unitSystem, format.number) }),
      column.accessor("usedByRecipes", { header: () => t("usedBy"), cell: (i) => t("usedByCount", { count: i.getValue() }) }),
    ]);
  }, [t, format, unitSystem, currency]);
  const table = useTable({ features, columns, data: materials });
  return <DataTable table={table} label={t("title")} empty={t("empty")} rowProps={(m) => ({ "data-testid": `material-row-${m.code}` })} />;
}
