"use client";

import { createColumnHelper, createSortedRowModel, rowSortingFeature, sortFn_alphanumeric, tableFeatures, useTable } from "@tanstack/react-table";
import { useFormatter, useTranslations } from "next-intl";
import { useActionState, useMemo } from "react";
import { Button } from "@/components/ui/button";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { DataTable } from "@/components/ui/data-table";
import { kgText } from "@/components/wax/measure";
import { initialFormState } from "@/lib/actions/form-state";
import type { EstimateDto, UnitSystem } from "@/lib/contracts/wax";
import { deleteEstimateAction, planEstimateAction } from "../actions";

const features = tableFeatures({ rowSortingFeature, sortedRowModel: createSortedRowModel(), sortFns: { alphanumeric: sortFn_alphanumeric } });
const column = createColumnHelper<typeof features, EstimateDto>();

function RowActions({ estimate }: { estimate: EstimateDto }) {
  const t = useTranslations("waxRoom.estimates");
  const [planState, planAction, planning] = useActionState(planEstimateAction, initialFormState);
  const [deleteState, deleteAction, deleting] = useActionState(deleteEstimateAction, initialFormState);
  const problem = planState.status === "error" ? planState.message : deleteState.status === "error" ? deleteState.message : null;
  return (
    <div className="flex flex-wrap items-center gap-2">
      <form action={planAction}>
        <input type="hidden" name="id" value={estimate.id} />
        <input type="hidden" name="version" value={estimate.version} />
        <input type="hidden" name="planned" value={String(!estimate.planned)} />
        <Button type="submit" variant="secondary" className="px-2 py-1 text-xs" disabled={planning}>
          {estimate.planned ? t("unplan") : t("plan")}
        </Button>
      </form>
      <form action={deleteAction}>
        <input type="hidden" name="id" value={estimate.id} />
        <input type="hidden" name="version" value={estimate.version} />
        <ConfirmButton variant="danger" className="px-2 py-1 text-xs" disabled={deleting} question={t("deleteConfirm", { name: estimate.name })} aria-label={t("deleteOf", { name: estimate.name })}>
          {t("delete")}
        </ConfirmButton>
      </form>
      {problem ? (
        <p role="alert" className="text-xs text-red-700">
          {problem}
        </p>
      ) : null}
    </div>
  );
}

/** The saved estimates, newest first; planned ones count toward the purchase list. */
export function EstimatesTable({ estimates, canWrite, unitSystem }: { estimates: EstimateDto[]; canWrite: boolean; unitSystem: UnitSystem }) {
  const t = useTranslations("waxRoom.estimates");
  const format = useFormatter();
  const columns = useMemo(
    () =>
      column.columns([
        column.accessor("name", { header: () => t("name"), cell: ({ row }) => <span className="font-medium text-stone-900">{row.original.name}</span> }),
        column.accessor((e) => e.recipe.name, { id: "recipe", header: () => t("recipe") }),
        column.accessor((e) => e.results.gramsPerMetre, { id: "gramsPerMetre", header: () => t("gramsPerMetre"), cell: (info) => format.number(info.getValue(), { maximumFractionDigits: 1 }) }),
        column.accessor((e) => e.inputs.metres, { id: "metres", header: () => t("metres"), cell: (info) => format.number(info.getValue(), { maximumFractionDigits: 2 }) }),
        column.accessor((e) => e.results.kgNew, { id: "kgNew", header: () => t("kgNew"), cell: (info) => kgText(info.getValue(), unitSystem, format.number, 2) }),
        column.accessor((e) => e.results.cost ?? -1, {
          id: "cost",
          header: () => t("cost"),
          cell: ({ row }) =>
            row.original.results.cost === null ? "—" : format.number(row.original.results.cost, { style: "currency", currency: row.original.results.currency, maximumFractionDigits: row.original.results.currency === "IDR" ? 0 : 2 }),
        }),
        column.accessor("planned", { header: () => t("planned"), cell: (info) => (info.getValue() ? t("yes") : t("no")) }),
        column.accessor("createdAt", { header: () => t("saved"), cell: ({ row }) => `${format.dateTime(new Date(row.original.createdAt), "date")} · ${row.original.createdByName}` }),
        ...(canWrite ? [column.display({ id: "actions", header: () => t("actions"), cell: ({ row }) => <RowActions estimate={row.original} /> })] : []),
      ]),
    [t, format, canWrite, unitSystem],
  );
  const table = useTable({ features, columns, data: estimates });
  return <DataTable table={table} label={t("title")} empty={t("empty")} rowProps={(e) => ({ "data-testid": `estimate-row-${e.id}` })} />;
}
