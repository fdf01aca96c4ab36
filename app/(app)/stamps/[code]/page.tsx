import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Suspense } from "react";
import { getFormatter, getTranslations } from "next-intl/server";
import { LoadingState } from "@/components/shell/loading-state";
import { ConditionBadge, OutBadge } from "@/components/stamps/condition-badge";
import { Footprint } from "@/components/stamps/footprint";
import { StampHistory } from "@/components/stamps/history";
import { Notice } from "@/components/ui/notice";
import { PageHeader, Panel } from "@/components/ui/panel";
import { listLocations } from "@/lib/data/stamps/locations";
import { getStamp, listBorrowers, stampHistory } from "@/lib/data/stamps";
import { sketchOfStamp } from "@/lib/data/requests";
import type { StampDto } from "@/lib/contracts/stamps";
import { AppError } from "@/lib/errors";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { isoDateAfter } from "@/lib/stamps/codes";
import { isLowCoverage } from "@/lib/stamps/coverage";
import { nextConditions } from "@/lib/stamps/condition";
import { stampCodeSchema } from "@/lib/validation/stamps";
import { CheckoutForm, ConditionForm, DamageForm, DeleteStamp, ReturnForm } from "./stamp-panels";
import { ScansSection } from "./scans-section";
import { measures } from "@/lib/i18n/measures";
import { calendarDay } from "@/lib/i18n/formats";
import { locationLabel } from "@/lib/stamps/format";

type Props = { params: Promise<{ code: string }>; searchParams: Promise<{ saved?: string }> };

async function load(code: string, load: () => Promise<StampDto>) {
  if (!stampCodeSchema.safeParse(code).success) notFound();
  try {
    return await load();
  } catch (error) {
    if (error instanceof AppError && error.code === "notFound") notFound();
    throw error;
  }
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { code } = await params;
  return { title: decodeURIComponent(code).toUpperCase() };
}

export default async function StampPage({ params, searchParams }: Props) {
  const actor = await requirePageActor();
  const code = decodeURIComponent((await params).code).toUpperCase();
  const { saved } = await searchParams;
  const stamp = await load(code, () => getStamp(actor, stampCodeSchema.parse(code)));
  const canWrite = can(actor.role, "stamps:write");
  const [t, format, history, locations, borrowers, sketch] = await Promise.all([
    getTranslations(),
    getFormatter(),
    stampHistory(actor, stamp.code),
    canWrite ? listLocations(actor) : [],
    canWrite ? listBorrowers(actor) : [],
    sketchOfStamp(actor, stamp.id),
  ]);
  const units = actor.unitSystem;
  const measure = measures(format, units);
  const none = <span className="text-stone-500">{t("stamps.record.notRecorded")}</span>;
  const day = (iso: string) => format.dateTime(calendarDay(iso), "day");
  const defaultDue = isoDateAfter(new Date(), 7);
  const checkout = stamp.checkout;
  const next = nextConditions(stamp.condition);

  const facts: [string, React.ReactNode][] = [
    [t("stamps.fields.size"), measure.size(stamp.widthMm, stamp.heightMm)],
    [t("stamps.fields.stripDepthMm"), stamp.stripDepthMm !== null ? measure.length(stamp.stripDepthMm) : none],
    [t("stamps.fields.weightG"), stamp.weightG !== null ? measure.mass(stamp.weightG) : none],
    [t("stamps.fields.face"), `${t(`stamps.faces.${stamp.face}`)}${stamp.mirrored ? ` · ${t("stamps.fields.mirroredShort")}` : ""}`],
    [
      t("stamps.fields.twin"),
      stamp.twin ? (
        <Link href={`/stamps/${encodeURIComponent(stamp.twin.code)}`} className="text-ink-700 hover:underline">
          <span className="font-mono">{stamp.twin.code}</span> · {stamp.twin.name}
        </Link>
      ) : stamp.face === "pair" ? (
        <span className="text-amber-800">{t("stamps.record.twinMissing")}</span>
      ) : (
        <span className="text-stone-500">{t("stamps.record.noTwin")}</span>
      ),
    ],
    [
      t("stamps.fields.motif"),
      stamp.motifId ? (
        <Link key="motif" href={`/motifs/${stamp.motifId}`} className="text-ink-700 hover:underline">
          {t("stamps.record.openMotif")}
        </Link>
      ) : (
        <span key="motif" className="text-stone-500">
          {t("stamps.record.noMotif")}
        </span>
      ),
    ],
    ...(sketch
      ? ([
          [
            t("requests.madeFromSketch"),
            <a key="sketch" href={sketch.urls.original} target="_blank" rel="noreferrer" className="text-ink-700 hover:underline" data-testid="made-from-sketch">
              {t("requests.queue.openSketch")}
            </a>,
          ],
        ] as [string, React.ReactNode][])
      : []),
    [t("stamps.fields.maker"), stamp.maker ?? none],
    [t("stamps.fields.madeOn"), stamp.madeOn ? day(stamp.madeOn) : none],
    [
      t("stamps.fields.location"),
      stamp.location ? (
        <Link href={`/stamps?location=${stamp.location.id}`} className="text-ink-700 hover:underline">
          {stamp.location.site} · <span className="font-mono">{stamp.location.code}</span>
        </Link>
      ) : (
        <span className="text-amber-800">{t("stamps.record.noLocation")}</span>
      ),
    ],
    [
      t("stamps.fields.coverageRatio"),
      stamp.coverageRatio === null ? (
        none
      ) : isLowCoverage(stamp.coverageRatio) ? (
        <span className="text-amber-800" data-testid="coverage-low">
          {measure.percent(stamp.coverageRatio, true)} · {t("stamps.record.coverageLow")}
        </span>
      ) : (
        measure.percent(stamp.coverageRatio)
      ),
    ],
    [t("stamps.fields.impressionsCount"), measure.count(stamp.impressionsCount)],
    [
      t("stamps.fields.tags"),
      stamp.tags.length ? (
        <span className="flex flex-wrap gap-1">
          {stamp.tags.map((tag) => (
            <Link key={tag} href={`/stamps?tag=${encodeURIComponent(tag)}`} className="rounded bg-soga-50 px-1.5 text-xs text-soga-700 hover:underline">
              {tag}
            </Link>
          ))}
        </span>
      ) : (
        none
      ),
    ],
  ];

  return (
    <>
      <PageHeader
        title={`${stamp.code} · ${stamp.name}`}
        intro={
          <span className="flex flex-wrap items-center gap-2">
            <ConditionBadge condition={stamp.condition} label={t(`stamps.conditions.${stamp.condition}`)} />
            {checkout ? <OutBadge overdue={checkout.overdue} label={checkout.overdue ? t("stamps.table.overdue") : t("stamps.table.out")} /> : null}
            <span>{t("stamps.record.updated", { when: format.dateTime(new Date(stamp.updatedAt), "moment") })}</span>
          </span>
        }
        actions={
          <div className="flex flex-wrap items-center gap-2 print:hidden">
            <Link href={`/stamps/labels?codes=${encodeURIComponent(stamp.code)}`} className="rounded-md border border-stone-300 bg-white px-3.5 py-2 text-sm hover:bg-stone-100">
              {t("stamps.record.printLabel")}
            </Link>
            {canWrite ? (
              <>
                <Link href={`/stamps/${encodeURIComponent(stamp.code)}/edit`} className="rounded-md bg-ink-700 px-3.5 py-2 text-sm font-medium text-white hover:bg-ink-800">
                  {t("stamps.actions.edit")}
                </Link>
                <DeleteStamp code={stamp.code} version={stamp.version} />
              </>
            ) : null}
          </div>
        }
      />
      {saved === "created" || saved === "updated" ? <Notice tone="success" className="mb-4">{t(`stamps.record.saved.${saved}`)}</Notice> : null}
      {saved === "checkedOut" && checkout ? (
        <Notice tone="success" className="mb-4">
          {t("stamps.record.saved.checkedOut", { name: checkout.borrowerName, workstation: checkout.workstation, due: day(checkout.dueOn) })}
        </Notice>
      ) : null}
      {saved === "returned" && !checkout ? (
        <Notice tone="success" className="mb-4">
          {stamp.location ? t("stamps.record.saved.returnedTo", { place: locationLabel(stamp.location) }) : t("stamps.record.saved.returned")}
        </Notice>
      ) : null}

      <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
        <div className="space-y-6">
          <Panel title={t("stamps.record.facts")}>
            <div className="grid gap-6 sm:grid-cols-[1fr_12rem]">
              <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 text-sm" data-testid="facts">
                {facts.map(([label, value]) => (
                  <div key={label} className="contents">
                    <dt className="text-stone-500">{label}</dt>
                    <dd className="text-stone-900">{value}</dd>
                  </div>
                ))}
              </dl>
              <Footprint
                widthMm={stamp.widthMm}
                heightMm={stamp.heightMm}
                outlinePath={stamp.outlinePath}
                mirrored={false}
                widthLabel={measure.length(stamp.widthMm)}
                heightLabel={measure.length(stamp.heightMm)}
                title={t("stamps.record.footprint", { size: measure.size(stamp.widthMm, stamp.heightMm) })}
                className="w-full"
              />
            </div>
            {stamp.notes ? <p className="mt-4 whitespace-pre-line border-t border-stone-100 pt-3 text-sm text-stone-700">{stamp.notes}</p> : null}
          </Panel>

          {/* Below the lookup: an unknown code has answered 404 before anything streams. */}
          <Suspense fallback={<LoadingState />}>
            <ScansSection actor={actor} code={stamp.code} coverageRatio={stamp.coverageRatio} hasOutline={stamp.outlinePath !== null} />
          </Suspense>

          <Panel title={t("stamps.history.title")}>
            <StampHistory events={history} unitSystem={units} />
          </Panel>
        </div>

        <div className="space-y-6">
          <Panel title={checkout ? t("stamps.record.outTitle") : t("stamps.record.shelfTitle")}>
            {checkout ? (
              <div className="space-y-4">
                <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1.5 text-sm" data-testid="checkout">
                  <dt className="text-stone-500">{t("stamps.checkout.borrower")}</dt>
                  <dd>
                    {checkout.borrowerName}
                    {checkout.borrowerEmail ? <span className="text-stone-500"> · {checkout.borrowerEmail}</span> : null}
                  </dd>
                  <dt className="text-stone-500">{t("stamps.checkout.workstation")}</dt>
                  <dd>{checkout.workstation}</dd>
                  <dt className="text-stone-500">{t("stamps.checkout.since")}</dt>
                  <dd>{format.dateTime(new Date(checkout.outAt), "moment")}</dd>
                  <dt className="text-stone-500">{t("stamps.checkout.due")}</dt>
                  <dd className={checkout.overdue ? "font-medium text-red-700" : undefined}>
                    {day(checkout.dueOn)}
                    {checkout.overdue ? ` · ${t("stamps.table.overdue")}` : ""}
                  </dd>
                  {checkout.note ? (
                    <>
                      <dt className="text-stone-500">{t("stamps.checkout.note")}</dt>
                      <dd>{checkout.note}</dd>
                    </>
                  ) : null}
                </dl>
                {canWrite ? (
                  <ReturnForm code={stamp.code} currentLocationId={stamp.location?.id ?? null} locations={locations.map((l) => ({ id: l.id, label: locationLabel(l) }))} />
                ) : null}
              </div>
            ) : canWrite ? (
              ["sound", "worn"].includes(stamp.condition) ? (
                <CheckoutForm code={stamp.code} borrowers={borrowers} defaultDue={defaultDue} />
              ) : (
                <p className="text-sm text-stone-600">{t("stamps.record.cannotGoOut")}</p>
              )
            ) : (
              <p className="text-sm text-stone-600">{stamp.location ? t("stamps.record.onShelfAt", { place: locationLabel(stamp.location) }) : t("stamps.record.onShelf")}</p>
            )}
          </Panel>

          <Panel title={t("stamps.record.conditionTitle")} intro={t(`stamps.conditionHelp.${stamp.condition}`)}>
            <div className="space-y-4">
              {stamp.openDamage.length ? (
                <div className="space-y-2" data-testid="open-damage">
                  <h3 className="text-sm font-medium text-stone-800">{t("stamps.damage.open", { count: stamp.openDamage.length })}</h3>
                  <ul className="space-y-1.5 text-sm">
                    {stamp.openDamage.map((d) => (
                      <li key={d.id} className="rounded-md border border-red-200 bg-red-50 px-3 py-2 text-red-900">
                        <span className="font-medium">{t(`stamps.damageKinds.${d.kind}`)}</span>
                        {d.note ? ` — ${d.note}` : ""}
                        <span className="block text-xs text-red-800">
                          {t("stamps.damage.reportedBy", { name: d.reportedByName ?? t("stamps.history.none"), when: format.dateTime(new Date(d.reportedAt), "date") })}
                        </span>
                      </li>
                    ))}
                  </ul>
                </div>
              ) : null}
              {canWrite ? <ConditionForm code={stamp.code} next={[...next]} /> : null}
              <details className="rounded-md border border-stone-200 p-3" open={!canWrite}>
                <summary className="cursor-pointer text-sm font-medium text-stone-800">{t("stamps.damage.title")}</summary>
                <div className="mt-3">
                  <DamageForm code={stamp.code} />
                </div>
              </details>
            </div>
          </Panel>
        </div>
      </div>
    </>
  );
}
