"use client";

import { columnFilteringFeature, createColumnHelper, createFilteredRowModel, createSortedRowModel, filterFn_includesString, globalFilteringFeature, rowSortingFeature, sortFn_alphanumeric, sortFn_text, tableFeatures, useTable } from "@tanstack/react-table";
import { useTranslations } from "next-intl";
import { useActionState, useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { cn } from "@/components/ui/cn";
import { ConfirmDialog, type ConfirmRequest } from "@/components/ui/confirm-dialog";
import { Notice } from "@/components/ui/notice";
import { DataTable } from "@/components/ui/data-table";
import { initialFormState, type FormState } from "@/lib/actions/form-state";
import type { UserDto } from "@/lib/contracts/people";
import { roles, type Role } from "@/lib/permissions";
import { userRowAction } from "./actions";

const features = tableFeatures({
  rowSortingFeature,
  columnFilteringFeature,
  globalFilteringFeature,
  sortedRowModel: createSortedRowModel(),
  filteredRowModel: createFilteredRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, text: sortFn_text },
  filterFns: { includesString: filterFn_includesString },
});
const column = createColumnHelper<typeof features, UserDto>();

/** A row form waiting for the administrator's answer in the dialog. */
interface Pending {
  form: HTMLFormElement;
  request: ConfirmRequest;
  /** Puts the row back as it was when the answer is no. */
  undo?: () => void;
}

export function UsersTable({ users, selfId }: { users: UserDto[]; selfId: string }) {
  const t = useTranslations();
  // Each answer is stamped, so a refused row can start over from the saved role (see the role form's key).
  const [state, action, pending] = useActionState(async (previous: FormState, formData: FormData) => {
    const answer = await userRowAction(previous, formData);
    return { ...answer, data: { ...answer.data, answeredAt: String(Date.now()) } };
  }, initialFormState);
  const [filter, setFilter] = useState("");
  const [asking, setAsking] = useState<Pending | null>(null);

  /** Stops a role change or disable until the dialog is answered; a confirmed form is marked and submitted again. */
  const askFirst = (event: React.FormEvent<HTMLFormElement>, request: ConfirmRequest, undo?: () => void) => {
    const form = event.currentTarget;
    if (form.hasAttribute("data-confirmed")) {
      form.removeAttribute("data-confirmed");
      return;
    }
    event.preventDefault();
    setAsking({ form, request, undo });
  };

  const columns = useMemo(
    () =>
      column.columns([
        column.accessor("name", {
          header: () => t("admin.columns.name"),
          cell: (info) => (
            <span className="font-medium text-stone-900">
              {info.getValue()}
              {info.row.original.id === selfId ? <span className="ml-1 text-xs text-stone-500">({t("admin.you")})</span> : null}
            </span>
          ),
        }),
        column.accessor("email", { header: () => t("admin.columns.email") }),
        column.accessor("role", {
          header: () => t("admin.columns.role"),
          cell: (info) => {
            const user = info.row.original;
            const self = user.id === selfId;
            // A refused role change or disable shows its message beside this row's role.
            const refusedHere = state.status === "error" && state.values?.id === user.id;
            return (
              <form
                key={`${user.role}-${refusedHere ? state.data?.answeredAt : ""}`}
                action={action}
                className="flex items-center gap-2"
                onSubmit={(e) => {
                  const select = e.currentTarget.elements.namedItem("role") as HTMLSelectElement;
                  const role = t(`roles.${select.value as Role}.name`);
                  askFirst(
                    e,
                    {
                      title: t("admin.confirm.roleTitle", { name: user.name }),
                      body: t("admin.confirm.roleBody", { name: user.name, from: t(`roles.${user.role}.name`), role }),
                      confirmLabel: t("admin.confirm.roleConfirm", { role }),
                      tone: select.value === "admin" ? "danger" : "primary",
                    },
                    () => (select.value = user.role),
                  );
                }}
              >
                <input type="hidden" name="id" value={user.id} />
                <input type="hidden" name="intent" value="role" />
                <select
                  name="role"
                  aria-label={t("admin.changeRole", { name: user.name })}
                  aria-invalid={refusedHere ? true : undefined}
                  aria-describedby={[self ? `role-${user.id}-hint` : null, refusedHere ? `role-${user.id}-error` : null].filter(Boolean).join(" ") || undefined}
                  defaultValue={user.role}
                  disabled={pending || self}
                  onChange={(e) => e.currentTarget.form?.requestSubmit()}
                  className="rounded-md border border-stone-300 bg-white px-2 py-1 text-sm"
                >
                  {roles.map((role) => (
                    <option key={role} value={role}>
                      {t(`roles.${role}.name`)}
                    </option>
                  ))}
                </select>
                {self ? (
                  <p id={`role-${user.id}-hint`} className="max-w-48 text-xs text-stone-500">
                    {t("admin.ownRole")}
                  </p>
                ) : null}
                {refusedHere ? (
                  <p id={`role-${user.id}-error`} className="max-w-56 text-xs text-red-700">
                    {state.fieldErrors?.role?.join(" ") ?? state.message}
                  </p>
                ) : null}
              </form>
            );
          },
        }),
        column.display({
          id: "status",
          header: () => t("admin.columns.status"),
          cell: ({ row }) => {
            const u = row.original;
            const status = u.disabled ? "disabled" : u.invited ? "invited" : "active";
            const tone = { active: "bg-emerald-100 text-emerald-900", disabled: "bg-stone-200 text-stone-700", invited: "bg-amber-100 text-amber-900" }[status];
            return <span className={cn("rounded-full px-2 py-0.5 text-xs font-medium", tone)}>{t(`admin.status.${status}`)}</span>;
          },
        }),
        column.display({
          id: "actions",
          header: () => <span className="sr-only">{t("admin.columns.actions")}</span>,
          cell: ({ row }) => {
            const u = row.original;
            const button = (intent: string, label: string, variant: "secondary" | "danger" = "secondary") => (
              <form
                action={action}
                onSubmit={
                  intent === "disable"
                    ? (e) => askFirst(e, { title: t("admin.confirm.disableTitle", { name: u.name }), body: t("admin.confirm.disableBody", { name: u.name }), confirmLabel: t("admin.disable"), tone: "danger" })
                    : undefined
                }
              >
                <input type="hidden" name="id" value={u.id} />
                <input type="hidden" name="email" value={u.email} />
                <input type="hidden" name="intent" value={intent} />
                <Button type="submit" variant={variant} className="px-2.5 py-1 text-xs" disabled={pending}>
                  {label}
                </Button>
              </form>
            );
            return (
              <div className="flex flex-wrap justify-end gap-2">
                {u.invited ? button("invite", t("admin.resendInvite")) : button("reset", t("admin.sendReset"))}
                {u.id === selfId ? null : u.disabled ? button("enable", t("admin.enable")) : button("disable", t("admin.disable"), "danger")}
              </div>
            );
          },
        }),
      ]),
    [t, action, pending, selfId, state],
  );

  const table = useTable({
    features,
    columns,
    data: users,
    state: { globalFilter: filter },
    onGlobalFilterChange: setFilter,
    globalFilterFn: "includesString",
    initialState: { sorting: [{ id: "name", desc: false }] },
  });
  const rows = table.getRowModel().rows;

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <input
          type="search"
          value={filter}
          onChange={(e) => setFilter(e.target.value)}
          placeholder={t("admin.search")}
          aria-label={t("admin.search")}
          className="w-72 rounded-md border border-stone-300 bg-white px-3 py-1.5 text-sm"
        />
        <p className="text-sm text-stone-600">{t("admin.count", { count: rows.length })}</p>
      </div>
      {state.message ? <Notice tone={state.status === "success" ? "success" : "error"}>{state.message}</Notice> : null}
      <ConfirmDialog
        request={asking?.request ?? null}
        cancelLabel={t("admin.confirm.cancel")}
        onCancel={() => {
          asking?.undo?.();
          setAsking(null);
        }}
        onConfirm={() => {
          if (!asking) return;
          const { form } = asking;
          form.setAttribute("data-confirmed", "yes");
          form.requestSubmit();
          setAsking(null);
        }}
      />
      <DataTable
        table={table}
        label={t("admin.title")}
        empty={t("admin.empty")}
        rowProps={(u) => ({ "data-testid": `user-row-${u.email}` })}
        cellClassName="px-4 py-2.5"
      />
    </div>
  );
}
