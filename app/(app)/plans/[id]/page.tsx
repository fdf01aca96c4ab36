import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { getFormatter, getLocale, getTranslations } from "next-intl/server";
import { Notice } from "@/components/ui/notice";
import { PageHeader, Panel } from "@/components/ui/panel";
import { planPages, plannerValues, type PlanDto, type PlannerStamp } from "@/lib/contracts/plans";
import { waxPages } from "@/lib/contracts/wax";
import { getPlan, getPlannerStamp, planHistory } from "@/lib/data/plans";
import { listStampRequests } from "@/lib/data/requests";
import { workshopSettings } from "@/lib/data/settings";
import { AppError } from "@/lib/errors";
import { calendarDay } from "@/lib/i18n/formats";
import { can } from "@/lib/permissions";
import { requirePageActor, type Actor } from "@/lib/session";
import { z } from "@/lib/zod";
import { PlannerWithStamps } from "../planner";
import { PlanActions, RecomputeButton } from "./plan-actions";

type Props = { params: Promise<{ id: string }>; searchParams: Promise<{ saved?: string }> };

async function load(actor: Actor, id: string): Promise<PlanDto> {
  if (!z.uuid().safeParse(id).success) notFound();
  try {
    return await getPlan(actor, id);
  } catch (error) {
    if (error instanceof AppError && error.code === "notFound") notFound();
    throw error;
  }
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const actor = await requirePageActor();
  const { id } = await params;
  if (!z.uuid().safeParse(id).success) return {};
  try {
    return { title: (await getPlan(actor, id)).name };
  } catch {
    return {};
  }
}

const savedKinds = ["created", "updated", "duplicated", "recomputed", "requested"] as const;
const changeKinds = ["size", "outline", "coverage", "missing"] as const;

/** A saved plan: the planner on its inputs (read-only for those who may not edit), its requests and history. */
export default async function PlanPage({ params, searchParams }: Props) {
  const actor = await requirePageActor();
  const plan = await load(actor, (await params).id);
  const { saved } = await searchParams;
  const canWrite = can(actor.role, "plans:write");
  const [t, format, settings, history, requests] = await Promise.all([getTranslations(), getFormatter(), workshopSettings(), planHistory(actor, plan.id), listStampRequests(actor, { plan: plan.id })]);
  const stamps = (
    await Promise.all(
      plan.stamps.map((s) =>
        getPlannerStamp(actor, s.code).catch((error) => {
          if (error instanceof AppError && error.code === "notFound") return null;
          throw error;
        }),
      ),
    )
  ).filter((s): s is PlannerStamp => s !== null);
  const units = actor.unitSystem === "imperial" ? ({ unit: "in", runUnit: "yd" } as const) : ({ unit: "mm", runUnit: "m" } as const);
  const values = { ...plannerValues(plan.layout, plan.borders, units, await getLocale()), name: plan.name, notes: plan.notes ?? "", motifId: plan.motifId ?? "" };
  const savedKind = savedKinds.find((k) => k === saved);
  const role = (r: string) => (r === "field" ? t("plans.stale.field") : t("plans.stale.border"));
  return (
    <>
      <PageHeader
        title={plan.name}
        intro={t("plans.record.updated", { who: plan.updatedByName, when: format.dateTime(new Date(plan.updatedAt), "moment"), version: plan.version })}
        actions={
          <div className="flex flex-wrap items-center gap-2 print:hidden">
            <Link href={planPages.sheet(plan.id)} className="rounded-md border border-stone-300 bg-white px-3.5 py-2 text-sm hover:bg-stone-100">
              {t("plans.record.sheet")}
            </Link>
            <Link href={waxPages.estimatesForPlan(plan.id)} className="rounded-md border border-stone-300 bg-white px-3.5 py-2 text-sm hover:bg-stone-100">
              {t("plans.record.estimateWax")}
            </Link>
            {plan.stamps.length && can(actor.role, "stamps:request") ? (
              <Link href={planPages.request(plan.id)} className="rounded-md border border-stone-300 bg-white px-3.5 py-2 text-sm hover:bg-stone-100">
                {t("plans.record.requestStamps")}
              </Link>
            ) : null}
            {canWrite ? <PlanActions id={plan.id} version={plan.version} name={plan.name} /> : null}
          </div>
        }
      />
      {savedKind ? (
        <Notice tone="success" className="mb-4">
          {t(`plans.saved.${savedKind}`)}
        </Notice>
      ) : null}
      {plan.stale ? (
        <Notice tone="warning" className="mb-4">
          <p data-testid="stale-notice">{t("plans.stale.body", { when: format.dateTime(new Date(plan.computedAt), "moment") })}</p>
          <ul className="mt-1 list-disc pl-5">
            {plan.staleReasons?.map((r) => (
              <li key={r.role}>
                {t("plans.stale.reason", { role: role(r.role), code: r.code, changes: r.changes.map((c) => t(`plans.stale.changes.${changeKinds.find((k) => k === c) ?? "missing"}`)).join(", ") })}
              </li>
            ))}
          </ul>
          {canWrite ? <RecomputeButton id={plan.id} version={plan.version} /> : <p className="mt-1">{t("plans.stale.askPlanner")}</p>}
        </Notice>
      ) : null}
      {!canWrite ? (
        <Notice className="mb-4">{t("plans.record.readOnly")}</Notice>
      ) : null}
      <PlannerWithStamps
        mode={canWrite ? "edit" : "view"}
        plan={{ id: plan.id, version: plan.version }}
        initialValues={values}
        stamps={stamps}
        presets={settings.clothPresets}
        impressionsPerHour={settings.impressionsPerHour}
        unitSystem={actor.unitSystem}
        canRequestNew={can(actor.role, "stamps:requestNew")}
      />
      <div className="mt-6 grid gap-6 lg:grid-cols-2">
        <Panel title={t("plans.record.requestsTitle")}>
          {requests.length === 0 ? (
            <p className="text-sm text-stone-600">{t("plans.record.noRequests")}</p>
          ) : (
            <ul className="space-y-2 text-sm" data-testid="plan-requests">
              {requests.map((r) => (
                <li key={r.id} data-state={r.state} className="border-b border-stone-100 pb-2 last:border-0">
                  <span className="font-medium">{t(`requests.states.${r.state}`)}</span> · {r.stamps.map((s) => s.code).join(", ")} ·{" "}
                  {t("requests.days", { from: format.dateTime(calendarDay(r.fromOn), "day"), until: format.dateTime(calendarDay(r.untilOn), "day") })}
                  {r.declineReason ? <span className="block text-stone-600">{t("requests.reason", { reason: r.declineReason })}</span> : null}
                </li>
              ))}
            </ul>
          )}
        </Panel>
        <Panel title={t("plans.record.historyTitle")}>
          <ol className="space-y-2 text-sm" data-testid="plan-history">
            {history.map((e) => (
              <li key={e.id} data-kind={e.kind} className="border-b border-stone-100 pb-2 last:border-0">
                <span className="text-stone-500">{format.dateTime(new Date(e.at), "moment")}</span> · {t(`plans.history.${e.kind}`, { who: e.actorName, version: e.version })}
              </li>
            ))}
          </ol>
        </Panel>
      </div>
    </>
  );
}
