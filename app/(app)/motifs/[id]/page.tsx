import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { getFormatter, getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { MotifActions } from "@/components/motifs/motif-actions";
import { Notice } from "@/components/ui/notice";
import { PageHeader, Panel } from "@/components/ui/panel";
import { startPlanUrl, type MotifEventDto } from "@/lib/contracts/motifs";
import { runPages } from "@/lib/contracts/runs";
import { measures } from "@/lib/i18n/measures";
import type { Arrangement } from "@/lib/layout";
import { getMotif, motifHistory, plansOfMotif, similarMotifs } from "@/lib/data/motifs";
import { calendarDay } from "@/lib/i18n/formats";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { motifIdParamSchema } from "@/lib/validation/motifs";
import { parseInput } from "@/lib/validation/parse";
import { copyMotifAction, deleteMotifAction } from "../actions";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("motifs"))("title") };
}

const savedKinds = ["saved", "created", "copied", "stampMade"] as const;
const availabilityTone = { onShelf: "bg-emerald-50 text-emerald-900", out: "bg-ink-50 text-ink-800", inRepair: "bg-amber-50 text-amber-900", retired: "bg-stone-200 text-stone-800" } as const;
const eventKinds = ["created", "copied", "edited"] as const;

export default async function MotifPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ saved?: string }> }) {
  const actor = await requirePageActor();
  if (!can(actor.role, "data:read")) return <Forbidden />;
  const parsed = parseInput(motifIdParamSchema, await params);
  if (!parsed.success) notFound();
  const motif = await getMotif(actor, parsed.data.id).catch(() => null);
  if (!motif) notFound();
  const [t, format, history, plans, similar] = await Promise.all([getTranslations(), getFormatter(), motifHistory(actor, motif.id), plansOfMotif(actor, motif.id), similarMotifs(actor, motif.id)]);
  const savedParam = (await searchParams).saved;
  const saved = savedKinds.find((k) => k === savedParam);
  const canWrite = can(actor.role, "motifs:write");
  const canStartRun = can(actor.role, "runs:write");
  const lastArrangement = plans[0]?.arrangement ?? null;
  const day = (iso: string) => format.dateTime(calendarDay(iso), "day");
  const eventLine = (e: MotifEventDto) => {
    const kind = eventKinds.find((k) => k === e.kind) ?? "edited";
    return kind === "edited" ? t("motifs.timeline.edited", { name: e.actorName, fields: e.changes.map((c) => c.field).join(", ") }) : t(`motifs.timeline.${kind}`, { name: e.actorName });
  };
  return (
    <>
      <PageHeader
        title={motif.name}
        intro={motif.description ?? undefined}
        actions={
          <div className="flex flex-wrap gap-2">
            <Link href={startPlanUrl(motif, lastArrangement)} className="rounded-md bg-ink-700 px-3.5 py-2 text-sm font-medium text-white hover:bg-ink-800" data-testid="start-plan">
              {t("motifs.actions.startPlan")}
            </Link>
            {can(actor.role, "stamps:requestNew") ? (
              <Link href={`/motifs/${motif.id}/request-stamp`} className="rounded-md border border-stone-300 bg-white px-3.5 py-2 text-sm font-medium text-stone-800 hover:bg-stone-50" data-testid="request-stamp">
                {t("requests.ask.open")}
              </Link>
            ) : null}
            {canWrite ? (
              <Link href={`/motifs/${motif.id}/edit`} className="rounded-md border border-stone-300 bg-white px-3.5 py-2 text-sm font-medium text-stone-800 hover:bg-stone-50">
                {t("motifs.actions.edit")}
              </Link>
            ) : null}
          </div>
        }
      />
      {saved ? (
        <Notice tone="success" className="mb-4">
          {t(`motifs.page.${saved}`)}
        </Notice>
      ) : null}
      {motif.mainStampProblem ? (
        <Notice tone="warning" className="mb-4">
          {t(`motifs.problem.${motif.mainStampProblem}`)}
        </Notice>
      ) : null}
      <div className="grid gap-6 lg:grid-cols-3">
        <div className="space-y-6 lg:col-span-2">
          <Panel title={t("motifs.page.stamps")} intro={t("motifs.page.stampsIntro")}>
            {motif.stamps.length === 0 ? (
              <p className="text-sm text-stone-500">{t("motifs.page.noStamps")}</p>
            ) : (
              <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3" data-testid="motif-stamps">
                {motif.stamps.map((s) => (
                  <li key={s.code}>
                    <Link href={`/stamps/${encodeURIComponent(s.code)}`} className="group block text-sm">
                      {s.thumb ? (
                        // eslint-disable-next-line @next/next/no-img-element -- thumbnails come from our API
                        <img src={s.thumb} alt="" loading="lazy" className="aspect-square w-full rounded border border-stone-200 bg-stone-100 object-contain group-hover:border-ink-400" />
                      ) : (
                        <div className="flex aspect-square w-full items-center justify-center rounded border border-stone-200 bg-stone-100 text-xs text-stone-600">{t("motifs.card.noScan")}</div>
                      )}
                      <span className="mt-1 block font-mono text-ink-700 group-hover:underline">{s.code}</span>
                      <span className="block text-stone-600">
                        {t(`motifs.roles.${s.role}`)} · {s.widthMm} × {s.heightMm} mm
                      </span>
                      <span className={`mt-0.5 inline-block rounded px-1.5 py-0.5 text-xs ${availabilityTone[s.availability]}`}>{t(`motifs.availability.${s.availability}`)}</span>
                    </Link>
                  </li>
                ))}
              </ul>
            )}
          </Panel>
          <Panel title={t("motifs.page.colourways")} intro={t("motifs.page.colourwaysIntro")}>
            {motif.colourways.length === 0 ? (
              <p className="text-sm text-stone-500">{t("motifs.page.noColourways")}</p>
            ) : (
              <div className="space-y-4" data-testid="motif-colourways">
                {motif.colourways.map((w) => (
                  <section key={w.id}>
                    <div className="flex flex-wrap items-center justify-between gap-2">
                      <h3 className="text-sm font-semibold text-stone-900">{w.name}</h3>
                      {canStartRun ? (
                        <Link href={runPages.new({ motif: motif.id, colourway: w.id })} className="text-xs font-medium text-ink-700 hover:underline" data-testid="start-run">
                          {t("motifs.page.startRun")}
                        </Link>
                      ) : null}
                    </div>
                    {w.notes ? <p className="text-xs text-stone-600">{w.notes}</p> : null}
                    <ol className="mt-2 space-y-1.5">
                      {w.colours.map((c, i) => (
                        <li key={i} className="flex items-start gap-2 text-sm">
                          <span className="w-5 text-right text-stone-500">{i + 1}.</span>
                          <svg width="20" height="20" viewBox="0 0 20 20" aria-hidden="true" className="mt-0.5 shrink-0">
                            <rect x="0.5" y="0.5" width="19" height="19" rx="3" fill={c.swatch} stroke="#a8a29e" />
                          </svg>
                          <span>
                            <span className="font-medium text-stone-900">{c.name}</span> <span className="font-mono text-xs text-stone-500">{c.swatch}</span>
                            <span className="block text-xs text-stone-600">
                              {c.waxStamps.length ? t("motifs.page.waxedBy", { stamps: c.waxStamps.join(", "), face: t(`motifs.faces.${c.face}`) }) : t("motifs.page.notWaxed")}
                              {c.bleach ? <> · {t("motifs.page.bleached")}</> : null}
                              {c.dyeNotes ? ` · ${c.dyeNotes}` : ""}
                            </span>
                          </span>
                        </li>
                      ))}
                    </ol>
                  </section>
                ))}
              </div>
            )}
          </Panel>
          <Panel title={t("motifs.page.plans")} intro={t("motifs.page.plansIntro")}>
            {plans.length === 0 ? (
              <p className="text-sm text-stone-500" data-testid="motif-plans">
                {t("motifs.page.noPlans")}
              </p>
            ) : (
              <ul className="space-y-1 text-sm" data-testid="motif-plans">
                {plans.map((p) => (
                  <li key={p.id}>
                    <Link href={`/plans/${p.id}`} className="text-ink-700 hover:underline">
                      {p.name}
                    </Link>{" "}
                    · {t(`plans.arrangements.${p.arrangement as Arrangement}`)} · {measures(format, actor.unitSystem).length(p.clothWidthMm)}
                    {p.estimates.length ? (
                      <ul className="ml-4 mt-0.5 list-disc text-xs text-stone-600" data-testid="plan-estimates">
                        {p.estimates.map((e) => (
                          <li key={e.id}>
                            {t("motifs.page.estimateLine", {
                              name: e.name,
                              perMetre: measures(format, actor.unitSystem).mass(e.gramsPerMetre),
                              newWax: measures(format, actor.unitSystem).mass(e.kgNew * 1000),
                              when: format.dateTime(new Date(e.createdAt), "date"),
                            })}
                            {e.planned ? ` · ${t("motifs.page.estimatePlanned")}` : ""}
                          </li>
                        ))}
                      </ul>
                    ) : null}
                  </li>
                ))}
              </ul>
            )}
          </Panel>
          <Panel title={t("motifs.page.similar")} intro={t("motifs.page.similarIntro")}>
            {similar.length === 0 ? (
              <p className="text-sm text-stone-500">{t("motifs.page.noSimilar")}</p>
            ) : (
              <ul className="grid grid-cols-3 gap-3 sm:grid-cols-4">
                {similar.map((m) => (
                  <li key={m.id}>
                    <Link href={`/motifs/${m.id}`} className="group block text-xs">
                      {/* eslint-disable-next-line @next/next/no-img-element -- thumbnails come from our API */}
                      <img src={m.thumb} alt="" loading="lazy" className="aspect-square w-full rounded border border-stone-200 bg-stone-100 object-contain group-hover:border-ink-400" />
                      <span className="mt-1 block font-medium text-ink-700 group-hover:underline">{m.name}</span>
                      <span className="block text-stone-600">
                        {t("motifs.picture.alike", { alike: 1 - m.distance })}
                        {m.mirrored ? ` · ${t("motifs.picture.mirror")}` : ""}
                      </span>
                    </Link>
                  </li>
                ))}
              </ul>
            )}
          </Panel>
        </div>
        <div className="space-y-6">
          <Panel title={t("motifs.page.facts")}>
            <dl className="space-y-2 text-sm">
              {(
                [
                  ["designer", motif.designer],
                  ["firstUsedOn", motif.firstUsedOn ? day(motif.firstUsedOn) : null],
                  ["tags", motif.tags.join(", ") || null],
                  ["collections", motif.collections.map((c) => c.name).join(", ") || null],
                  ["notes", motif.notes],
                ] as const
              ).map(([key, value]) => (
                <div key={key}>
                  <dt className="text-xs text-stone-500">{t(`motifs.page.${key}`)}</dt>
                  <dd className="text-stone-900">{value ?? t("motifs.page.none")}</dd>
                </div>
              ))}
              {motif.copiedFrom ? (
                <div>
                  <dt className="text-xs text-stone-500">{t("motifs.page.copiedFrom")}</dt>
                  <dd>
                    <Link href={`/motifs/${motif.copiedFrom.id}`} className="text-ink-700 hover:underline">
                      {motif.copiedFrom.name}
                    </Link>
                  </dd>
                </div>
              ) : null}
            </dl>
          </Panel>
          <Panel title={t("motifs.page.timeline")}>
            <ol className="space-y-2 text-sm" data-testid="motif-timeline">
              {history.map((e, i) => (
                <li key={i}>
                  <span className="block text-xs text-stone-500">{format.dateTime(new Date(e.at), "moment")}</span>
                  {eventLine(e)}
                </li>
              ))}
              {motif.firstUsedOn ? (
                <li>
                  <span className="block text-xs text-stone-500">{day(motif.firstUsedOn)}</span>
                  {t("motifs.timeline.firstUsed")}
                </li>
              ) : null}
            </ol>
          </Panel>
          {canWrite ? (
            <Panel>
              <MotifActions motif={{ id: motif.id, name: motif.name, version: motif.version }} copyAction={copyMotifAction} deleteAction={deleteMotifAction} />
            </Panel>
          ) : null}
        </div>
      </div>
    </>
  );
}
