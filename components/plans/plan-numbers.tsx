"use client";

import { useFormatter, useTranslations } from "next-intl";
import { measures } from "@/lib/i18n/measures";
import type { LayerName, LayoutResult } from "@/lib/layout";
import { runSize, stampingTime, type PlanSummary } from "@/lib/plans";
import type { UnitSystem } from "@/lib/stamps/format";

type Figures = PlanSummary | LayoutResult;

/** The engine's numbers beside the picture (or on a saved plan, the compare page and the sheet). */
export function PlanNumbers({ summary, unitSystem, impressionsPerHour, byPieces, compact = false }: { summary: Figures; unitSystem: UnitSystem; impressionsPerHour: number; byPieces: boolean; compact?: boolean }) {
  const t = useTranslations("plans.numbers");
  const tl = useTranslations("plans.layers");
  const format = useFormatter();
  const num = (v: number, digits = 1) => format.number(v, { maximumFractionDigits: digits });
  const len = (mm: number) => measures(format, unitSystem).length(mm);
  const run = runSize(summary, byPieces);
  const time = stampingTime(summary, impressionsPerHour);
  const rows: { key: string; label: string; value: React.ReactNode }[] = [
    {
      key: "across",
      label: t("across"),
      value: (
        <ul className="space-y-0.5">
          {summary.rows.map((r) => (
            <li key={r.row}>{t("rowType", { row: r.row + 1, whole: r.whole, clipped: r.clipped, left: len(r.leftover.leftMm), right: len(r.leftover.rightMm) })}</li>
          ))}
        </ul>
      ),
    },
    { key: "rowsPerMetre", label: t("rowsPerMetre"), value: num(summary.rowsPerMetre, 2) },
    { key: "impressionsPerMetre", label: t("impressionsPerMetre"), value: num(summary.impressionsPerMetre, 2) },
    { key: "impressionsTotal", label: t("impressionsTotal"), value: t("impressionsTotalValue", { total: summary.impressionsTotal, whole: summary.impressionsWholeTotal, cut: summary.impressionsClippedTotal }) },
    { key: "waxedAreaPerMetre", label: t("waxedAreaPerMetre", { sides: summary.sides }), value: `${num(summary.waxedAreaPerMetreM2, 3)} m²` },
    { key: "waxedAreaTotal", label: t("waxedAreaTotal"), value: `${num(summary.waxedAreaTotalM2, 2)} m²` },
    { key: "coverageOfBand", label: t("coverageOfBand"), value: format.number(summary.coverageOfBand, { style: "percent", maximumFractionDigits: 1 }) },
    { key: "group", label: t("group"), value: summary.pathName ? t("groupWithPath", { group: summary.group, path: summary.pathName }) : summary.group },
    { key: "leftover", label: t("leftover"), value: t("leftoverValue", { left: len(summary.leftover.leftMm), right: len(summary.leftover.rightMm) }) },
    { key: "band", label: t("band"), value: t("bandValue", { band: len(summary.bandWidthMm), field: len(summary.fieldBandMm.x1 - summary.fieldBandMm.x0) }) },
    {
      key: "run",
      label: t("run"),
      value: t("runValue", { metres: num(run.metres, 2), yards: num(run.yards, 2), pieces: run.pieces, kodi: num(run.kodi, 2), pieceLength: len(run.pieceLengthMm) }),
    },
    { key: "faces", label: t("faces"), value: summary.sides === 2 ? t("bothFaces") : t("oneFace") },
    {
      key: "hours",
      label: t("hours"),
      value: (
        <>
          {t("hoursValue", { hours: num(time.hoursTotal, 1), perPiece: num(time.hoursPerPiece, 2), perPieceImpressions: num(time.impressionsPerPiece, 0) })}
          <span className="block text-xs text-stone-500">{t("hoursRate", { rate: impressionsPerHour })}</span>
        </>
      ),
    },
  ];
  // i18n-keys: plans.layers.*
  const layerName = (layer: LayerName) => tl(layer);
  return (
    <div className="space-y-3" data-testid="plan-numbers">
      <dl className={compact ? "grid gap-x-4 gap-y-1 text-sm" : "grid gap-x-4 gap-y-2 text-sm sm:grid-cols-[auto_1fr]"}>
        {rows.map((r) => (
          <div key={r.key} className="contents" data-testid={`number-${r.key}`}>
            <dt className="text-stone-600">{r.label}</dt>
            <dd className="font-medium tabular-nums text-stone-900">{r.value}</dd>
          </div>
        ))}
      </dl>
      {summary.layers.length > 1 ? (
        <table className="w-full text-left text-sm" data-testid="plan-layers">
          <caption className="mb-1 text-left text-sm font-semibold text-stone-900">{tl("title")}</caption>
          <thead className="text-xs text-stone-600">
            <tr>
              <th scope="col" className="py-1 pr-2 font-medium">{tl("layer")}</th>
              <th scope="col" className="py-1 pr-2 font-medium">{tl("strip")}</th>
              <th scope="col" className="py-1 pr-2 font-medium">{tl("impressionsPerMetre")}</th>
              <th scope="col" className="py-1 font-medium">{tl("waxedAreaPerMetre")}</th>
            </tr>
          </thead>
          <tbody className="tabular-nums">
            {summary.layers.map((l) => (
              <tr key={l.layer} className="border-t border-stone-100" data-layer={l.layer}>
                <th scope="row" className="py-1 pr-2 font-normal">{layerName(l.layer)}</th>
                <td className="py-1 pr-2">{t("bandRange", { from: len(l.bandMm.x0), to: len(l.bandMm.x1) })}</td>
                <td className="py-1 pr-2">{num(l.impressionsPerMetre, 2)}</td>
                <td className="py-1">{num(l.waxedAreaPerMetreM2, 3)} m²</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      {summary.overlaps.length ? (
        <p className="text-xs text-stone-600">{tl("overlaps", { area: num(summary.overlaps.reduce((s, o) => s + o.perMetreM2, 0), 4) })}</p>
      ) : null}
    </div>
  );
}
