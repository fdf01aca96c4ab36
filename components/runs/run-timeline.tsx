import { useFormatter, useTranslations } from "next-intl";
import type { RunDto, StageKind } from "@/lib/contracts/runs";
import { calendarDay } from "@/lib/i18n/formats";
import { measures } from "@/lib/i18n/measures";
import type { UnitSystem } from "@/lib/stamps/format";

const DAY = 86_400_000;
const fill: Record<StageKind, string> = { wax: "#b45309", dye: "#1d4ed8", bleach: "#a8a29e", boil_off: "#7c2d12" };

const dayNumber = (iso: string) => Math.round(calendarDay(iso).getTime() / DAY);

/**
 * The run's stages on a time line: one row per stage over its planned days, the part done filled in (metres done
 * over the run's metres; a stage marked done is full), and beside it the wax estimated against used. Stages without
 * planned days are listed with "no days planned". Drawn as SVG so it prints.
 */
export function RunTimeline({ run, unitSystem }: { run: RunDto; unitSystem: UnitSystem }) {
  const t = useTranslations();
  const format = useFormatter();
  const m = measures(format, unitSystem);
  const planned = run.stages.filter((s) => s.plannedStartOn || s.plannedEndOn);
  const days = planned.flatMap((s) => [s.plannedStartOn ?? s.plannedEndOn!, s.plannedEndOn ?? s.plannedStartOn!]).map(dayNumber);
  if (run.dueOn) days.push(dayNumber(run.dueOn));
  const first = days.length ? Math.min(...days) : 0;
  const last = days.length ? Math.max(...days) : 0;
  const span = Math.max(1, last - first + 1);
  const rowH = 26;
  const labelW = 150;
  const chartW = 420;
  const waxW = 130;
  const width = labelW + chartW + waxW + 10;
  const height = run.stages.length * rowH + 34;
  const x = (day: number) => labelW + ((day - first) / span) * chartW;
  const maxKg = Math.max(0.001, ...run.stages.map((s) => Math.max(s.estimate.kg, s.done.waxUsedG / 1000)));
  const total = run.size.totalMetres || 1;
  return (
    <figure className="overflow-x-auto">
      <svg role="img" aria-labelledby="run-timeline-title" viewBox={`0 0 ${width} ${height}`} className="w-full min-w-[560px]" data-testid="run-timeline">
        <title id="run-timeline-title">{t("runs.timeline.title", { name: run.name })}</title>
        {days.length ? (
          <>
            <text x={labelW} y={12} fontSize="10" fill="#57534e">
              {format.dateTime(calendarDay(new Date(first * DAY).toISOString().slice(0, 10)), "day")}
            </text>
            <text x={labelW + chartW} y={12} fontSize="10" fill="#57534e" textAnchor="end">
              {format.dateTime(calendarDay(new Date(last * DAY).toISOString().slice(0, 10)), "day")}
            </text>
          </>
        ) : null}
        <text x={labelW + chartW + 10} y={12} fontSize="10" fill="#57534e">
          {t("runs.timeline.waxHeading")}
        </text>
        {run.dueOn ? (
          <line x1={x(dayNumber(run.dueOn) + 1)} x2={x(dayNumber(run.dueOn) + 1)} y1={16} y2={height - 14} stroke="#dc2626" strokeDasharray="3 3">
            <title>{t("runs.timeline.due")}</title>
          </line>
        ) : null}
        {run.stages.map((s, i) => {
          const y = 20 + i * rowH;
          const from = s.plannedStartOn ?? s.plannedEndOn;
          const until = s.plannedEndOn ?? s.plannedStartOn;
          const doneShare = s.state === "done" ? 1 : Math.min(1, (s.kind === "boil_off" ? (s.done.recoveredG > 0 ? 1 : 0) : s.done.metres / total) || 0);
          const label = `${s.position + 1}. ${t(`runs.stageKind.${s.kind}`)}${s.colourName ? ` · ${s.colourName}` : ""}`;
          const x0 = from ? x(dayNumber(from)) : 0;
          const w = from && until ? Math.max(4, x(dayNumber(until) + 1) - x0) : 0;
          const estW = (s.estimate.kg / maxKg) * (waxW - 20);
          const usedW = (s.done.waxUsedG / 1000 / maxKg) * (waxW - 20);
          return (
            <g key={s.id} data-testid="timeline-stage">
              <text x={0} y={y + 14} fontSize="11" fill="#1c1917">
                {label.length > 26 ? `${label.slice(0, 25)}…` : label}
              </text>
              {from && until ? (
                <>
                  <rect x={x0} y={y + 3} width={w} height={rowH - 8} rx={3} fill={fill[s.kind]} fillOpacity={0.25} stroke={fill[s.kind]} />
                  <rect x={x0} y={y + 3} width={w * doneShare} height={rowH - 8} rx={3} fill={fill[s.kind]} />
                  <title>
                    {t("runs.timeline.stageTip", {
                      label,
                      from: format.dateTime(calendarDay(from), "day"),
                      until: format.dateTime(calendarDay(until), "day"),
                      state: t(`runs.stageState.${s.state}`),
                    })}
                  </title>
                </>
              ) : (
                <text x={labelW} y={y + 14} fontSize="10" fill="#78716c">
                  {t("runs.timeline.noDays")}
                </text>
              )}
              {s.kind === "wax" ? (
                <g>
                  <rect x={labelW + chartW + 10} y={y + 4} width={estW} height={7} fill="#d6d3d1" />
                  <rect x={labelW + chartW + 10} y={y + 12} width={usedW} height={7} fill="#b45309" />
                  <title>{t("runs.timeline.waxTip", { estimated: m.mass(s.estimate.kg * 1000), used: m.mass(s.done.waxUsedG) })}</title>
                </g>
              ) : null}
            </g>
          );
        })}
      </svg>
      <figcaption className="mt-2 flex flex-wrap gap-4 text-xs text-stone-600">
        <span className="flex items-center gap-1">
          <span className="inline-block h-2.5 w-4 rounded-sm bg-amber-700" aria-hidden="true" /> {t("runs.timeline.legendDone")}
        </span>
        <span className="flex items-center gap-1">
          <span className="inline-block h-2.5 w-4 rounded-sm border border-amber-700 bg-amber-700/25" aria-hidden="true" /> {t("runs.timeline.legendPlanned")}
        </span>
        <span className="flex items-center gap-1">
          <span className="inline-block h-2.5 w-4 bg-stone-300" aria-hidden="true" /> {t("runs.timeline.legendWaxEstimated")}
        </span>
        <span className="flex items-center gap-1">
          <span className="inline-block h-2.5 w-4 bg-amber-700" aria-hidden="true" /> {t("runs.timeline.legendWaxUsed")}
        </span>
        {run.dueOn ? (
          <span className="flex items-center gap-1">
            <span className="inline-block h-0 w-4 border-t border-dashed border-red-600" aria-hidden="true" /> {t("runs.timeline.due")}
          </span>
        ) : null}
      </figcaption>
    </figure>
  );
}
