import Link from "next/link";
import { useFormatter, useTranslations } from "next-intl";
import type { FormState } from "@/lib/actions/form-state";
import { planPages } from "@/lib/contracts/plans";
import { stageNumber, type RunDto, type RunStageDto, type RunStageStampBusyDto } from "@/lib/contracts/runs";
import { calendarDay } from "@/lib/i18n/formats";
import { measures } from "@/lib/i18n/measures";
import type { UnitSystem } from "@/lib/stamps/format";
import { StageEditForm } from "./stage-edit-form";
import { StageStampRequestForm } from "./stage-stamp-request-form";

type Action = (prev: FormState, form: FormData) => Promise<FormState>;

/** What stands in the way of a stamp on the stage's days, in words. */
function BusyText({ busy }: { busy: RunStageStampBusyDto }) {
  const t = useTranslations();
  const format = useFormatter();
  const day = (iso: string | null) => (iso ? format.dateTime(calendarDay(iso), "day") : "—");
  if (busy.reason === "condition") return <>{t("runs.stampDays.condition", { condition: t(`stamps.conditions.${(busy.condition ?? "retired") as "retired"}`) })}</>;
  if (busy.reason === "out") return <>{t("runs.stampDays.out", { who: busy.who ?? "—", until: day(busy.untilOn) })}</>;
  return <>{t("runs.stampDays.requested", { who: busy.who ?? "—", from: day(busy.fromOn), until: day(busy.untilOn) })}</>;
}

/**
 * One stage of a run before and during work: its days, plan, recipe and faces, what it needs (wax, stamper hours,
 * impressions), its stamps and whether they are free on its days, the stamp requests it sent, the edit form, and
 * (as children) the work recorded on it.
 */
export function StageCard({
  run,
  stage,
  unitSystem,
  canEdit,
  canRequest,
  recipes,
  plans,
  actions,
  children,
}: {
  run: RunDto;
  stage: RunStageDto;
  unitSystem: UnitSystem;
  canEdit: boolean;
  canRequest: boolean;
  recipes: { id: string; name: string }[];
  plans: { id: string; name: string }[];
  actions: { requestStamps: Action; updateStage: Action };
  children?: React.ReactNode;
}) {
  const t = useTranslations();
  const format = useFormatter();
  const m = measures(format, unitSystem);
  const day = (iso: string) => format.dateTime(calendarDay(iso), "day");
  const asked = new Set(stage.stampRequests.filter((r) => r.state === "open" || r.state === "accepted").flatMap((r) => r.codes));
  const toAsk = stage.stamps.filter((s) => !asked.has(s.code));
  const headingId = `stage-${stage.id}-heading`;
  return (
    <article aria-labelledby={headingId} className="rounded-lg border border-stone-200 bg-white p-4 shadow-xs">
      <header className="flex flex-wrap items-center gap-3">
        {stage.swatch ? (
          <svg width="22" height="22" viewBox="0 0 22 22" aria-hidden="true">
            <rect x="0.5" y="0.5" width="21" height="21" rx="4" fill={stage.swatch} stroke="#a8a29e" />
          </svg>
        ) : null}
        <h3 id={headingId} className="text-base font-semibold text-stone-900">
          {t("runs.stage.heading", { n: stageNumber(stage), kind: t(`runs.stageKind.${stage.kind}`) })}
          {stage.colourName ? <span className="font-normal text-stone-600"> · {stage.colourName}</span> : null}
        </h3>
        <span className="rounded-full bg-stone-100 px-2 py-0.5 text-xs font-medium text-stone-700" data-testid="stage-state">
          {t(`runs.stageState.${stage.state}`)}
        </span>
        <span className="text-sm text-stone-600">
          {stage.plannedStartOn && stage.plannedEndOn
            ? t("runs.stage.days", { from: day(stage.plannedStartOn), until: day(stage.plannedEndOn) })
            : stage.plannedStartOn || stage.plannedEndOn
              ? day((stage.plannedStartOn ?? stage.plannedEndOn)!)
              : t("runs.stage.noDays")}
        </span>
      </header>

      {stage.kind === "wax" ? (
        <div className="mt-3 grid gap-4 md:grid-cols-2">
          <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
            <dt className="text-stone-600">{t("runs.stage.method")}</dt>
            <dd>{stage.waxMethod ? t(`runs.waxMethod.${stage.waxMethod}`) : "—"}</dd>
            <dt className="text-stone-600">{t("runs.stage.plan")}</dt>
            <dd>
              {stage.plan ? (
                <Link href={planPages.one(stage.plan.id)} className="text-ink-700 hover:underline">
                  {stage.plan.name}
                </Link>
              ) : (
                <span className="text-amber-800">{t("runs.stage.noPlan")}</span>
              )}
            </dd>
            <dt className="text-stone-600">{t("runs.stage.recipe")}</dt>
            <dd>
              {stage.recipe ? (
                <>
                  {stage.recipe.name}{" "}
                  <span className="text-xs text-stone-500">{t("runs.stage.range", { minC: stage.recipe.workingMinC, maxC: stage.recipe.workingMaxC })}</span>
                </>
              ) : (
                <span className="text-amber-800">{t("runs.stage.noRecipe")}</span>
              )}
            </dd>
            <dt className="text-stone-600">{t("runs.stage.faces")}</dt>
            <dd>{stage.faces ? t(`motifs.faces.${stage.faces}`) : "—"}</dd>
            {stage.passes > 1 ? (
              <>
                <dt className="text-stone-600">{t("runs.stage.passes")}</dt>
                <dd>{format.number(stage.passes)}</dd>
              </>
            ) : null}
          </dl>
          <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 rounded-md bg-amber-50 p-3 text-sm" data-testid="stage-need">
            <dt className="text-stone-700">{t("runs.stage.wax")}</dt>
            <dd className="tabular-nums" data-testid="stage-wax">
              {stage.estimate.kg > 0 ? m.mass(stage.estimate.kg * 1000) : t("runs.stage.needsPlanAndRecipe")}
              {stage.estimate.gramsPerMetre ? <span className="block text-xs text-stone-600">{t("runs.stage.perMetre", { grams: stage.estimate.gramsPerMetre })}</span> : null}
            </dd>
            <dt className="text-stone-700">{t("runs.stage.hours")}</dt>
            <dd className="tabular-nums" data-testid="stage-hours">{t("runs.page.hoursValue", { hours: stage.estimate.hours })}</dd>
            <dt className="text-stone-700">{t("runs.stage.impressions")}</dt>
            <dd className="tabular-nums">{m.count(stage.estimate.impressions)}</dd>
          </dl>
        </div>
      ) : stage.kind === "dye" ? (
        <p className="mt-2 text-sm text-stone-700">{stage.dyeMethod ? t(`runs.dyeMethod.${stage.dyeMethod}`) : null}</p>
      ) : null}
      {stage.notes ? <p className="mt-2 whitespace-pre-line text-sm text-stone-700">{stage.notes}</p> : null}

      {stage.kind === "wax" && stage.stamps.length ? (
        <div className="mt-4">
          <h4 className="text-sm font-semibold text-stone-800">{t("runs.stage.stamps")}</h4>
          <ul className="mt-1 divide-y divide-stone-100 text-sm" data-testid="stage-stamps">
            {stage.stamps.map((s) => (
              <li key={s.id} className="flex flex-wrap items-center gap-x-3 gap-y-0.5 py-1.5" data-testid="stage-stamp" data-free={s.freeOnDays ? "yes" : "no"}>
                <Link href={`/stamps/${encodeURIComponent(s.code)}`} className="font-mono text-ink-700 hover:underline">
                  {s.code}
                </Link>
                <span>{s.name}</span>
                <span className="text-xs text-stone-500">{t(`motifs.faces.${s.face}`)}</span>
                {s.freeOnDays ? (
                  <span className="rounded-full bg-emerald-100 px-2 py-0.5 text-xs font-medium text-emerald-900">{stage.plannedStartOn ? t("runs.stampDays.free") : t("runs.stampDays.freeNow")}</span>
                ) : (
                  <span className="rounded-full bg-red-100 px-2 py-0.5 text-xs font-medium text-red-900">{t("runs.stampDays.busy")}</span>
                )}
                {s.flagged ? <span className="rounded-full bg-orange-100 px-2 py-0.5 text-xs font-medium text-orange-900">{t("runs.stampDays.flagged")}</span> : null}
                {s.busy.map((b, i) => (
                  <span key={i} className="block w-full text-xs text-red-800">
                    <BusyText busy={b} />
                  </span>
                ))}
              </li>
            ))}
          </ul>
          {stage.stampRequests.length ? (
            <ul className="mt-2 space-y-0.5 text-xs text-stone-600" data-testid="stage-requests">
              {stage.stampRequests.map((r) => (
                <li key={r.id}>
                  {t("runs.stampRequest.sent", { codes: r.codes.join(", "), from: day(r.fromOn), until: day(r.untilOn), state: t(`requests.states.${r.state}`) })}
                </li>
              ))}
            </ul>
          ) : null}
          {canRequest && toAsk.length ? <StageStampRequestForm action={actions.requestStamps} runId={run.id} stageId={stage.id} codes={toAsk.map((s) => s.code)} /> : null}
        </div>
      ) : null}

      {canEdit ? <StageEditForm action={actions.updateStage} run={run} stage={stage} recipes={recipes} plans={plans} /> : null}
      {children}
    </article>
  );
}
