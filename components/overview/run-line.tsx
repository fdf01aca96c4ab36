import { getFormatter, getTranslations } from "next-intl/server";
import type { OverviewRun } from "@/lib/contracts/overview";
import { runPages, stageNumber } from "@/lib/contracts/runs";
import { calendarDay } from "@/lib/i18n/formats";
import { OverviewItem } from "./overview-panel";

/** One run on the overview: its name (to the run's page), motif and colourway, the stage it is at, its due date. */
export async function RunLine({ run, testId }: { run: OverviewRun; testId?: string }) {
  const [t, format] = await Promise.all([getTranslations(), getFormatter()]);
  const stage = run.stage
    ? run.stage.colourName
      ? t("overview.run.stageColour", { number: stageNumber(run.stage), kind: t(`runs.stageKind.${run.stage.kind}`), colour: run.stage.colourName })
      : t("overview.run.stage", { number: stageNumber(run.stage), kind: t(`runs.stageKind.${run.stage.kind}`) })
    : t("overview.run.allDone");
  return (
    <OverviewItem
      testId={testId}
      href={runPages.one(run.id)}
      label={run.name}
      detail={
        <>
          {run.motifName} · {run.colourwayName} · {t(`runs.state.${run.state}`)} · {stage}
          {run.dueOn ? <> · {t("overview.run.due", { dueOn: format.dateTime(calendarDay(run.dueOn), "day") })}</> : null}
        </>
      }
    />
  );
}
