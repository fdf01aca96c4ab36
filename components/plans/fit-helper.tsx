"use client";

import { useFormatter, useTranslations } from "next-intl";
import { measures } from "@/lib/i18n/measures";
import { Button } from "@/components/ui/button";
import type { FitRow } from "@/lib/layout";
import type { UnitSystem } from "@/lib/stamps/format";

/**
 * The engine's N−1 / N / N+1 table: the gap that makes N stamps fill the field band exactly (one click applies it),
 * or the stamp width that would at the current gap (one click asks the keepers for such a stamp).
 */
export function FitHelper({ rows, unitSystem, onApplyGap, onAskStamp, canEdit, canAskStamp }: { rows: FitRow[]; unitSystem: UnitSystem; onApplyGap: (gapMm: number) => void; onAskStamp: (widthMm: number) => void; canEdit: boolean; canAskStamp: boolean }) {
  const t = useTranslations("plans.fit");
  const format = useFormatter();
  const len = (mm: number) => measures(format, unitSystem).length(mm);
  return (
    <table className="w-full text-left text-sm" data-testid="fit-helper">
      <caption className="sr-only">{t("caption")}</caption>
      <thead className="text-xs text-stone-600">
        <tr>
          <th scope="col" className="py-1 pr-2 font-medium">{t("across")}</th>
          <th scope="col" className="py-1 pr-2 font-medium">{t("gap")}</th>
          <th scope="col" className="py-1 font-medium">{t("stampWidth")}</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.across} className="border-t border-stone-100 align-top" data-across={r.across} data-current={r.current ? "true" : undefined}>
            <th scope="row" className="py-2 pr-2 font-medium tabular-nums">
              {r.across}
              {r.current ? <span className="ml-1 text-xs font-normal text-stone-500">{t("now")}</span> : null}
            </th>
            <td className="py-2 pr-2">
              {r.gapXMm === null ? (
                <span className="text-stone-500">—</span>
              ) : (
                <div className="space-y-1">
                  <span className="tabular-nums">{len(r.gapXMm)}</span>
                  {!r.gapFeasible ? (
                    <span className="block text-xs text-amber-800">{t("gapTooTight")}</span>
                  ) : canEdit ? (
                    <Button type="button" variant="secondary" className="block px-2 py-1 text-xs" onClick={() => onApplyGap(r.gapXMm!)} aria-label={t("applyGapLabel", { across: r.across, gap: len(r.gapXMm) })}>
                      {t("applyGap")}
                    </Button>
                  ) : null}
                </div>
              )}
            </td>
            <td className="py-2">
              {r.stampWidthMm === null ? (
                <span className="text-stone-500">—</span>
              ) : (
                <div className="space-y-1">
                  <span className="tabular-nums">{len(r.stampWidthMm)}</span>
                  {r.stampWidthFeasible && canAskStamp && !r.current ? (
                    <Button type="button" variant="ghost" className="block px-2 py-1 text-xs" onClick={() => onAskStamp(r.stampWidthMm!)} aria-label={t("askStampLabel", { width: len(r.stampWidthMm) })}>
                      {t("askStamp")}
                    </Button>
                  ) : null}
                </div>
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
