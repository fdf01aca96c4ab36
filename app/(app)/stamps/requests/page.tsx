import type { Metadata } from "next";
import Link from "next/link";
import { getFormatter, getTranslations } from "next-intl/server";
import { RequestAnswer } from "@/components/plans/request-answer";
import { measures } from "@/lib/i18n/measures";
import { PageHeader, Panel } from "@/components/ui/panel";
import { planPages } from "@/lib/contracts/plans";
import { checkOutDueRequests, listNewStampRequests, listStampRequests } from "@/lib/data/requests";
import { calendarDay } from "@/lib/i18n/formats";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { locationLabel } from "@/lib/stamps/format";
import { acceptRequestAction, declineNewStampAction, declineRequestAction } from "./actions";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("requests"))("queue.title") };
}

/** The keepers' queue: stamp requests to accept or decline, and new stamps asked for. Everyone may look. */
export default async function RequestQueuePage() {
  const actor = await requirePageActor();
  const keeper = can(actor.role, "stamps:write");
  // Accepted requests whose first day has come go out when a keeper opens the queue (and by the daily job).
  if (keeper) await checkOutDueRequests();
  const [t, format, requests, newStamps] = await Promise.all([getTranslations(), getFormatter(), listStampRequests(actor, {}), listNewStampRequests(actor, {})]);
  const pending = requests.filter((r) => r.state === "open" || r.state === "accepted");
  const answered = requests.filter((r) => r.state !== "open" && r.state !== "accepted").slice(0, 30);
  const day = (iso: string) => format.dateTime(calendarDay(iso), "day");
  return (
    <>
      <PageHeader title={t("requests.queue.title")} intro={t("requests.queue.intro")} />
      <div className="space-y-6">
        <Panel title={t("requests.queue.pendingTitle")}>
          {pending.length === 0 ? (
            <p className="text-sm text-stone-600">{t("requests.queue.nonePending")}</p>
          ) : (
            <ul className="divide-y divide-stone-100" data-testid="request-queue">
              {pending.map((r) => (
                <li key={r.id} id={`request-${r.id}`} className="space-y-2 py-3" data-state={r.state} data-testid={`request-${r.id}`}>
                  <p className="text-sm">
                    <span className="font-medium">{t(`requests.states.${r.state}`)}</span> · {t("requests.queue.asked", { who: r.requesterName, when: format.dateTime(new Date(r.createdAt), "moment") })}
                  </p>
                  <p className="text-sm text-stone-800">
                    {t("requests.queue.forLine", { forWhom: r.forWhom, workstation: r.workstation })} · {t("requests.days", { from: day(r.fromOn), until: day(r.untilOn) })}
                    {r.plan ? (
                      <>
                        {" · "}
                        <Link href={planPages.one(r.plan.id)} className="text-ink-700 underline">
                          {r.plan.name}
                        </Link>
                      </>
                    ) : null}
                  </p>
                  <ul className="text-sm">
                    {r.stamps.map((s) => (
                      <li key={s.code}>
                        <span className="font-mono font-medium">{s.code}</span> · {s.name} · {s.location ? locationLabel(s.location) : t("plans.sheet.noLocation")}
                        {s.out ? <span className="ml-1 rounded-full bg-ink-100 px-2 text-xs text-ink-800">{t("requests.outNow")}</span> : null}
                      </li>
                    ))}
                  </ul>
                  {r.note ? <p className="text-sm text-stone-600">{t("requests.queue.note", { note: r.note })}</p> : null}
                  {r.checkoutProblem ? <p className="text-sm text-amber-800">{t("requests.queue.problem", { stamps: r.checkoutProblem })}</p> : null}
                  {keeper ? <RequestAnswer id={r.id} version={r.version} canAccept={r.state === "open"} accept={acceptRequestAction} decline={declineRequestAction} /> : null}
                </li>
              ))}
            </ul>
          )}
        </Panel>
        <Panel title={t("requests.queue.newStampsTitle")}>
          {newStamps.filter((n) => n.state === "open").length === 0 ? (
            <p className="text-sm text-stone-600">{t("requests.queue.noneNewStamps")}</p>
          ) : (
            <ul className="divide-y divide-stone-100" data-testid="new-stamp-queue">
              {newStamps
                .filter((n) => n.state === "open")
                .map((n) => (
                  <li key={n.id} id={`new-stamp-${n.id}`} className="space-y-2 py-3" data-testid={`new-stamp-${n.id}`}>
                    <p className="text-sm">
                      <span className="font-medium">{measures(format, actor.unitSystem).size(n.widthMm, n.heightMm)}</span> · {t("requests.queue.asked", { who: n.requesterName, when: format.dateTime(new Date(n.createdAt), "moment") })}
                      {n.plan ? (
                        <>
                          {" · "}
                          <Link href={planPages.one(n.plan.id)} className="text-ink-700 underline">
                            {n.plan.name}
                          </Link>
                        </>
                      ) : null}
                    </p>
                    {n.motif ? (
                      <p className="text-sm">
                        <Link href={`/motifs/${n.motif.id}`} className="text-ink-700 underline">
                          {t("requests.forMotif", { motif: n.motif.name, role: t(`motifs.roles.${n.role ?? "filler"}`) })}
                        </Link>
                      </p>
                    ) : null}
                    {n.note ? <p className="text-sm text-stone-600">{t("requests.queue.note", { note: n.note })}</p> : null}
                    {n.sketch ? (
                      <a href={n.sketch.urls.original} target="_blank" rel="noreferrer" className="inline-block" data-testid="sketch" aria-label={t("requests.queue.openSketch")}>
                        {/* eslint-disable-next-line @next/next/no-img-element -- the sketch streams from our API with the session cookie */}
                        <img src={n.sketch.urls.thumb} alt={t("requests.queue.sketchAlt")} loading="lazy" className="h-28 w-28 rounded border border-stone-200 bg-white object-contain" />
                      </a>
                    ) : null}
                    {keeper ? (
                      <Link href={`/stamps/requests/${n.id}/stamp`} className="inline-block rounded-md bg-ink-700 px-3 py-1.5 text-sm font-medium text-white hover:bg-ink-800" data-testid="make-stamp">
                        {t("requests.make.action")}
                      </Link>
                    ) : null}
                    {keeper ? <RequestAnswer id={n.id} version={n.version} canAccept={false} decline={declineNewStampAction} /> : null}
                  </li>
                ))}
            </ul>
          )}
        </Panel>
        <Panel title={t("requests.queue.answeredTitle")}>
          {answered.length === 0 ? (
            <p className="text-sm text-stone-600">{t("requests.queue.noneAnswered")}</p>
          ) : (
            <ul className="space-y-1 text-sm" data-testid="answered-requests">
              {answered.map((r) => (
                <li key={r.id} data-state={r.state}>
                  <span className="font-medium">{t(`requests.states.${r.state}`)}</span> · {r.stamps.map((s) => s.code).join(", ")} · {r.requesterName} · {t("requests.days", { from: day(r.fromOn), until: day(r.untilOn) })}
                  {r.answeredByName ? ` · ${r.answeredByName}` : ""}
                  {r.declineReason ? ` · ${t("requests.reason", { reason: r.declineReason })}` : ""}
                </li>
              ))}
            </ul>
          )}
        </Panel>
      </div>
    </>
  );
}
