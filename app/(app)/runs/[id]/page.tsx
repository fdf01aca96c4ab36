import type { Metadata } from "next";
import Link from "next/link";
import { getFormatter, getTranslations } from "next-intl/server";
import { RunFindings } from "@/components/runs/run-findings";
import { RunStateBadge } from "@/components/runs/run-state-badge";
import { RunTimeline } from "@/components/runs/run-timeline";
import { runSizeText } from "@/components/runs/run-size";
import { StageCard } from "@/components/runs/stage-card";
import { StageWork, type RunAbilities } from "@/components/runs/stage-work";
import { Notice } from "@/components/ui/notice";
import { SafetyCautions } from "@/components/wax/safety-cautions";
import { PageHeader, Panel } from "@/components/ui/panel";
import { motifUrls } from "@/lib/contracts/motifs";
import { runPages, stageNumber } from "@/lib/contracts/runs";
import { getRun } from "@/lib/data/runs";
import { listMaterials, listRecipes, planChoices } from "@/lib/data/wax";
import { calendarDay } from "@/lib/i18n/formats";
import { measures } from "@/lib/i18n/measures";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { z } from "@/lib/zod";
import { requestStageStampsAction, updateStageAction } from "../actions";
import { loadRun } from "./load";

type Props = { params: Promise<{ id: string }>; searchParams: Promise<{ saved?: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const actor = await requirePageActor();
  const { id } = await params;
  if (!z.uuid().safeParse(id).success) return {};
  try {
    return { title: (await getRun(actor, id)).name };
  } catch {
    return {};
  }
}

// i18n-keys: runs.saved.*, runs.history.*
const savedKinds = ["created", "saved", "stage", "requested"] as const;

/** One run: its figures, its stages on a time line, each stage's need and work, its findings and history. */
export default async function RunPage({ params, searchParams }: Props) {
  const actor = await requirePageActor();
  const run = await loadRun(actor, (await params).id);
  const { saved } = await searchParams;
  const can_: RunAbilities = { write: can(actor.role, "runs:write"), recordWaxing: can(actor.role, "runs:recordWaxing"), recordFindings: can(actor.role, "runs:recordFindings") };
  const canRequest = can(actor.role, "stamps:request");
  const [t, format, materials, recipes, plans] = await Promise.all([
    getTranslations(),
    getFormatter(),
    listMaterials(actor),
    can_.write ? listRecipes(actor) : Promise.resolve([]),
    can_.write ? planChoices(actor) : Promise.resolve([]),
  ]);
  const m = measures(format, actor.unitSystem);
  const kg = (v: number) => m.mass(v * 1000);
  const need = new Map<string, number>();
  for (const s of run.stages) for (const b of s.estimate.byMaterial) need.set(b.material, (need.get(b.material) ?? 0) + b.kg);
  const savedKind = savedKinds.find((k) => k === saved);
  const open = run.state === "setup" || run.state === "underway";
  return (
    <>
      <PageHeader
        title={run.name}
        intro={
          <span className="flex flex-wrap items-center gap-2">
            <RunStateBadge state={run.state} />
            {run.state === "underway" && run.currentStage ? <span>{t("runs.list.atStage", { n: stageNumber(run.currentStage), of: run.stageCount, kind: t(`runs.stageKind.${run.currentStage.kind}`) })}</span> : null}
            <span>
              <Link href={motifUrls.page(run.motif.id)} className="text-ink-700 underline">
                {run.motif.name}
              </Link>{" "}
              · {run.colourway.name} · {run.cloth} · {runSizeText(t, m, run.size, actor.unitSystem)}
              {run.dueOn ? ` · ${t("runs.page.due", { day: format.dateTime(calendarDay(run.dueOn), "day") })}` : ""}
            </span>
          </span>
        }
        actions={
          <div className="flex flex-wrap gap-2">
            <Link href={runPages.ticket(run.id)} className="rounded-md border border-stone-300 bg-white px-3.5 py-2 text-sm font-medium text-stone-800 hover:bg-stone-50" data-testid="run-ticket-link">
              {t("runs.page.ticket")}
            </Link>
            {can_.write ? (
              <Link href={`${runPages.one(run.id)}/edit`} className="rounded-md bg-ink-700 px-3.5 py-2 text-sm font-medium text-white hover:bg-ink-800">
                {t("runs.page.edit")}
              </Link>
            ) : null}
          </div>
        }
      />
      {savedKind ? (
        <Notice tone="success" className="mb-4">
          {t(`runs.saved.${savedKind}`)}
        </Notice>
      ) : null}
      {run.state === "halted" ? (
        <Notice tone="warning" className="mb-4">
          {t("runs.page.halted", { note: run.stateNote ?? "—" })}
        </Notice>
      ) : null}
      {run.stages.some((s) => s.kind === "wax" || s.kind === "boil_off") ? <SafetyCautions headingId="run-wax-safety" /> : null}
      {run.waitingForPlan ? (
        <Notice tone="warning" className="mb-4">
          {t("runs.page.waitingForPlan")}
        </Notice>
      ) : null}

      <div className="grid gap-6 lg:grid-cols-3">
        <Panel title={t("runs.page.totals")} className="lg:col-span-1">
          <dl className="grid grid-cols-2 gap-x-3 gap-y-1.5 text-sm" data-testid="run-totals">
            <dt className="text-stone-600">{t("runs.page.waxEstimated")}</dt>
            <dd className="tabular-nums" data-testid="total-wax-estimated">{kg(run.totals.wax.kgEstimated)}</dd>
            <dt className="text-stone-600">{t("runs.page.waxUsed")}</dt>
            <dd className="tabular-nums" data-testid="total-wax-used">{kg(run.totals.wax.kgUsed)}</dd>
            <dt className="text-stone-600">{t("runs.page.waxRecovered")}</dt>
            <dd className="tabular-nums">{kg(run.totals.wax.kgRecovered)}</dd>
            <dt className="text-stone-600">{t("runs.page.hours")}</dt>
            <dd className="tabular-nums" data-testid="total-hours">{t("runs.page.hoursValue", { hours: run.totals.hours })}</dd>
            <dt className="text-stone-600">{t("runs.page.impressions")}</dt>
            <dd className="tabular-nums">{t("runs.page.impressionsValue", { done: run.totals.impressions.done, estimated: run.totals.impressions.estimated })}</dd>
          </dl>
          {need.size ? (
            <table className="mt-4 w-full text-sm" data-testid="run-stock">
              <caption className="mb-1 text-left text-xs font-medium uppercase tracking-wide text-stone-600">{t("runs.page.againstStock")}</caption>
              <thead className="text-left text-xs text-stone-500">
                <tr>
                  <th scope="col">{t("runs.page.material")}</th>
                  <th scope="col">{t("runs.page.needed")}</th>
                  <th scope="col">{t("runs.page.onHand")}</th>
                </tr>
              </thead>
              <tbody>
                {[...need].map(([id, amount]) => {
                  const material = materials.find((x) => x.id === id);
                  const short = material ? material.onHandKg < amount : false;
                  return (
                    <tr key={id} className={short ? "text-red-800" : undefined}>
                      <td>{material?.name ?? id}</td>
                      <td className="tabular-nums">{kg(amount)}</td>
                      <td className="tabular-nums">
                        {material ? kg(material.onHandKg) : "—"}
                        {short ? <span className="block text-xs">{t("runs.page.short")}</span> : null}
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          ) : null}
        </Panel>
        <Panel title={t("runs.page.timeline")} intro={t("runs.page.timelineIntro")} className="lg:col-span-2">
          <RunTimeline run={run} unitSystem={actor.unitSystem} />
        </Panel>
      </div>

      <section aria-labelledby="stages-heading" className="mt-8 space-y-4">
        <h2 id="stages-heading" className="text-lg font-semibold text-stone-900">
          {t("runs.page.stages")}
        </h2>
        <ol className="space-y-4" data-testid="run-stages">
          {run.stages.map((stage) => (
            <li key={stage.id} id={`stage-${stage.position + 1}`} data-testid="run-stage" data-kind={stage.kind} data-position={stage.position + 1}>
              <StageCard
                run={run}
                stage={stage}
                unitSystem={actor.unitSystem}
                canEdit={can_.write && open}
                canRequest={canRequest && open}
                recipes={recipes.map((r) => ({ id: r.id, name: r.name }))}
                plans={plans}
                actions={{ requestStamps: requestStageStampsAction, updateStage: updateStageAction }}
              >
                <StageWork run={run} stage={stage} can={can_} unitSystem={actor.unitSystem} />
              </StageCard>
            </li>
          ))}
        </ol>
      </section>

      <section className="mt-8">
        <RunFindings run={run} can={can_} />
      </section>

      <Panel title={t("runs.page.history")} className="mt-8">
        <ol className="space-y-1 text-sm" data-testid="run-history">
          {[...run.history].reverse().map((h, i) => (
            <li key={i}>
              <span className="text-stone-500">{format.dateTime(new Date(h.at), "moment")}</span> · {h.actorName} · {t(`runs.history.${h.kind}`)}
              {h.changes.length ? <span className="text-stone-600"> ({h.changes.map((c) => c.field).join(", ")})</span> : null}
            </li>
          ))}
        </ol>
      </Panel>
    </>
  );
}
