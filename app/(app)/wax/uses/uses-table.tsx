"use client";

import { useFormatter, useTranslations } from "next-intl";
import { useActionState } from "react";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { gText } from "@/components/wax/measure";
import { initialFormState, type FormState } from "@/lib/actions/form-state";
import type { UnitSystem, WaxUseDto } from "@/lib/contracts/wax";
import { calendarDay } from "@/lib/i18n/formats";

type Action = (state: FormState, formData: FormData) => Promise<FormState>;

/** Withdraws a mistaken use (a reason is required): its wax goes back into stock, its impressions back, out of the fit. */
function WithdrawForm({ action, use }: { action: Action; use: WaxUseDto }) {
  const t = useTranslations("waxRoom.use");
  const format = useFormatter();
  const [state, formAction, pending] = useActionState(action, initialFormState);
  const day = format.dateTime(calendarDay(use.usedOn), "day");
  const errorId = `withdraw-${use.id}-error`;
  const errors = state.fieldErrors?.reason;
  return (
    <form action={formAction} className="flex flex-wrap items-start gap-2" aria-label={t("withdrawOf", { day })}>
      <input type="hidden" name="id" value={use.id} />
      <div>
        <input
          name="reason"
          aria-label={t("reasonOf", { day })}
          placeholder={t("reason")}
          aria-invalid={errors?.length ? true : undefined}
          aria-describedby={errors?.length ? errorId : undefined}
          defaultValue={state.status === "error" ? (state.values?.reason ?? "") : ""}
          className="w-40 rounded-md border border-stone-300 px-2 py-1 text-xs aria-invalid:border-red-500"
        />
        <p id={errorId} className={errors?.length ? "text-xs text-red-700" : "sr-only"} aria-live="polite">
          {errors?.join(" ")}
        </p>
      </div>
      <ConfirmButton variant="secondary" className="px-2 py-1 text-xs" disabled={pending} question={t("withdrawConfirm")}>
        {t("withdraw")}
      </ConfirmButton>
      {state.status === "error" && !errors?.length && state.message ? (
        <p role="alert" className="text-xs text-red-700">
          {state.message}
        </p>
      ) : null}
    </form>
  );
}

/** The recorded uses, newest first, with the rate each one shows; wax masters may withdraw a mistaken one. */
export function UsesTable({ uses, unitSystem, withdrawAction }: { uses: WaxUseDto[]; unitSystem: UnitSystem; withdrawAction: Action | null }) {
  const t = useTranslations("waxRoom.use");
  const format = useFormatter();
  const n = (v: number, digits = 1) => format.number(v, { maximumFractionDigits: digits });
  if (!uses.length) return <p className="text-sm text-stone-600">{t("empty")}</p>;
  return (
    <div className="overflow-x-auto">
      <table className="min-w-full text-left text-sm" data-testid="wax-uses">
        <thead className="text-xs text-stone-600">
          <tr>
            <th scope="col" className="py-1 pr-3 font-medium">{t("usedOn")}</th>
            <th scope="col" className="py-1 pr-3 font-medium">{t("recipe")}</th>
            <th scope="col" className="py-1 pr-3 font-medium">{t("cloth")}</th>
            <th scope="col" className="py-1 pr-3 text-right font-medium">{t("area")}</th>
            <th scope="col" className="py-1 pr-3 text-right font-medium">{t("grams")}</th>
            <th scope="col" className="py-1 pr-3 text-right font-medium">{t("rate")}</th>
            <th scope="col" className="py-1 pr-3 font-medium">{t("recordedBy")}</th>
            {withdrawAction ? <th scope="col" className="py-1 font-medium">{t("withdraw")}</th> : null}
          </tr>
        </thead>
        <tbody>
          {uses.map((u) => (
            <tr key={u.id} className="border-t border-stone-200 align-top" data-testid={`wax-use-${u.id}`}>
              <td className="py-1 pr-3">{format.dateTime(calendarDay(u.usedOn), "day")}</td>
              <td className="py-1 pr-3">{u.recipe.name}</td>
              <td className="py-1 pr-3">{u.cloth ?? "—"}</td>
              <td className="py-1 pr-3 text-right">{n(u.areaM2, 2)} m²</td>
              <td className="py-1 pr-3 text-right">{gText(u.grams, unitSystem, format.number)}</td>
              <td className="py-1 pr-3 text-right">{n(u.rateGPerM2)}</td>
              <td className="py-1 pr-3 text-stone-600">{u.recordedByName}</td>
              {withdrawAction ? (
                <td className="py-1">
                  <WithdrawForm action={withdrawAction} use={u} />
                </td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
