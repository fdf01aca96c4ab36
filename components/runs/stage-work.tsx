"use client";

// A stage's work on the run page: its progress, pot readings and boil-off records, and the forms that add them
// (the stage's own records only; findings are the run's, in run-findings.tsx).
import { useFormatter, useNow, useTimeZone, useTranslations } from "next-intl";
import { tempText } from "@/components/wax/measure";
import { stageNumber, type RunDto, type RunProgressDto, type RunStageDto } from "@/lib/contracts/runs";
import type { UnitSystem } from "@/lib/contracts/wax";
import { calendarDay } from "@/lib/i18n/formats";
import { measures } from "@/lib/i18n/measures";
import { isoDateIn } from "@/lib/time-zone";
import { ProgressForm } from "./progress-form";
import { ReadingForm } from "./reading-form";

export interface RunAbilities {
  write: boolean;
  recordWaxing: boolean;
  recordFindings: boolean;
}

const hot = (stage: RunStageDto) => stage.kind === "wax" || stage.kind === "boil_off";

/** Who may record progress at this stage: waxing and the boil-off are the wax masters', dye and bleach the planners'. */
const mayRecordProgress = (stage: RunStageDto, can: RunAbilities) => (hot(stage) ? can.recordWaxing : can.write);

export function StageWork({ run, stage, can, unitSystem }: { run: RunDto; stage: RunStageDto; can: RunAbilities; unitSystem: UnitSystem }) {
  const t = useTranslations("runs.work");
  const format = useFormatter();
  const now = useNow();
  const timeZone = useTimeZone();
  const today = isoDateIn(timeZone ?? "UTC", now);
  const m = measures(format, unitSystem);
  const closed = run.state === "complete" || run.state === "halted";
  const progressForm = !closed && mayRecordProgress(stage, can);
  const readingForm = !closed && hot(stage) && can.recordWaxing;
  const n = stageNumber(stage);
  const sectionId = `stage-work-${stage.id}`;
  const grams = (g: number | null) => (g === null ? "—" : m.mass(g));

  return (
    <section aria-labelledby={sectionId} className="space-y-4" data-testid="stage-work" data-stage={n}>
      <h3 id={sectionId} className="text-sm font-semibold text-stone-900">
        {t("title", { n })}
      </h3>

      {stage.kind === "wax" ? (
        <p className="text-sm text-stone-700" data-testid="stage-wax-used">
          {t("waxUsed", { used: m.mass(stage.done.waxUsedG), estimated: m.mass(stage.estimate.kg * 1000) })}
        </p>
      ) : null}
      {stage.kind === "boil_off" && stage.done.recoveredG > 0 ? (
        <p className="text-sm text-stone-700" data-testid="stage-recovered">
          {t("recoveredTotal", { recovered: m.mass(stage.done.recoveredG) })}
        </p>
      ) : null}

      {stage.progress.length ? (
        <div className="overflow-x-auto">
          <table className="min-w-full text-left text-sm" data-testid="stage-progress">
            <caption className="sr-only">{t("progressCaption", { n })}</caption>
            <thead className="border-b border-stone-200 text-xs text-stone-600">
              <tr>
                <th scope="col" className="py-1.5 pr-3 font-medium">{t("col.day")}</th>
                {stage.kind === "boil_off" ? null : <th scope="col" className="py-1.5 pr-3 font-medium">{t("col.amount")}</th>}
                {stage.kind === "wax" ? (
                  <>
                    <th scope="col" className="py-1.5 pr-3 font-medium">{t("col.impressions")}</th>
                    <th scope="col" className="py-1.5 pr-3 font-medium">{t("col.pot")}</th>
                    <th scope="col" className="py-1.5 pr-3 font-medium">{t("col.waxUsed")}</th>
                  </>
                ) : null}
                {stage.kind === "boil_off" ? <th scope="col" className="py-1.5 pr-3 font-medium">{t("col.recovered")}</th> : null}
                <th scope="col" className="py-1.5 pr-3 font-medium">{t("col.note")}</th>
                <th scope="col" className="py-1.5 font-medium">{t("col.who")}</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-stone-100">
              {stage.progress.map((p) => (
                <ProgressRow key={p.id} p={p} stage={stage} grams={grams} />
              ))}
            </tbody>
          </table>
        </div>
      ) : (
        <p className="text-sm text-stone-600">{t("noProgress")}</p>
      )}

      {hot(stage) ? (
        stage.readings.length ? (
          <div>
            <h4 className="text-xs font-semibold text-stone-700">{t("readingsTitle")}</h4>
            <ul className="mt-1 space-y-1 text-sm" data-testid="stage-readings">
              {stage.readings.map((r) => (
                <li key={r.id} data-warns={r.warnings.length ? "true" : undefined} className={r.warnings.length ? "text-red-900" : "text-stone-700"}>
                  <span className="font-medium">{tempText(r.tempC, unitSystem, format.number)}</span> · {format.dateTime(new Date(r.at), "moment")} · {r.recordedByName}
                  {r.note ? ` · ${r.note}` : null}
                  {r.warnings.length ? (
                    <ul className="list-disc pl-5 text-xs">
                      {r.warnings.map((w) => (
                        <li key={w}>
                          <ReadingWarningText warning={w} maxC={stage.recipe?.workingMaxC ?? 0} />
                        </li>
                      ))}
                    </ul>
                  ) : null}
                </li>
              ))}
            </ul>
          </div>
        ) : (
          <p className="text-sm text-stone-600">{t("noReadings")}</p>
        )
      ) : null}

      {closed ? <p className="text-sm text-stone-600">{t("closed")}</p> : null}
      {stage.state === "done" && (progressForm || readingForm) ? (
        // A done stage keeps its forms for a late record, folded away: a record there puts the stage back in work.
        <details className="rounded-md border border-stone-200 bg-stone-50 p-4">
          <summary className="cursor-pointer text-sm font-semibold text-stone-900">{t("lateRecord")}</summary>
          <p className="mt-2 text-sm text-stone-600">{t("lateRecordHint")}</p>
          <div className="mt-3 space-y-4">
            {progressForm ? <ProgressForm run={run} stage={stage} today={today} /> : null}
            {readingForm ? <ReadingForm run={run} stage={stage} unitSystem={unitSystem} /> : null}
          </div>
        </details>
      ) : null}
      {stage.state !== "done" && progressForm ? (
        <div className="rounded-md border border-stone-200 bg-stone-50 p-4">
          <h4 className="mb-3 text-sm font-semibold text-stone-900">{t("progressFormTitle")}</h4>
          <ProgressForm run={run} stage={stage} today={today} />
        </div>
      ) : null}
      {stage.state !== "done" && readingForm ? (
        <div className="rounded-md border border-stone-200 bg-stone-50 p-4">
          <h4 className="mb-3 text-sm font-semibold text-stone-900">{t("readingFormTitle")}</h4>
          <ReadingForm run={run} stage={stage} unitSystem={unitSystem} />
        </div>
      ) : null}
    </section>
  );
}

function ReadingWarningText({ warning, maxC }: { warning: "aboveRange" | "fumes"; maxC: number }) {
  const t = useTranslations("runs.readingWarning");
  return <>{t(warning, { maxC })}</>;
}

function ProgressRow({ p, stage, grams }: { p: RunProgressDto; stage: RunStageDto; grams: (g: number | null) => string }) {
  const t = useTranslations("runs.work");
  const format = useFormatter();
  const amount = [p.metres !== null ? t("metresValue", { n: p.metres }) : null, p.pieces !== null ? t("piecesValue", { n: p.pieces }) : null].filter(Boolean).join(" · ") || "—";
  const pot =
    p.potBeforeG !== null && p.potAfterG !== null
      ? p.potAddedG
        ? t("potBeforeAfterAdded", { before: grams(p.potBeforeG), after: grams(p.potAfterG), added: grams(p.potAddedG) })
        : t("potBeforeAfter", { before: grams(p.potBeforeG), after: grams(p.potAfterG) })
      : "—";
  return (
    <tr data-testid="progress-row">
      <td className="py-1.5 pr-3 whitespace-nowrap">{format.dateTime(calendarDay(p.doneOn), "day")}</td>
      {stage.kind === "boil_off" ? null : <td className="py-1.5 pr-3">{amount}</td>}
      {stage.kind === "wax" ? (
        <>
          <td className="py-1.5 pr-3">{p.impressions === null ? "—" : format.number(p.impressions, "count")}</td>
          <td className="py-1.5 pr-3">{pot}</td>
          <td className="py-1.5 pr-3">{grams(p.waxUsedG)}</td>
        </>
      ) : null}
      {stage.kind === "boil_off" ? <td className="py-1.5 pr-3">{grams(p.recoveredG)}</td> : null}
      <td className="py-1.5 pr-3">{p.note ?? ""}</td>
      <td className="py-1.5">{p.recordedByName}</td>
    </tr>
  );
}
