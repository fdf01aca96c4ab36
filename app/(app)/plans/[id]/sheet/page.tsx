import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { getFormatter, getTranslations } from "next-intl/server";
import { PrintSheetButton } from "@/components/plans/print-sheet-button";
import { PlanPicture, pictureBox } from "@/components/plans/plan-picture";
import { pictureLabels } from "@/components/plans/picture-labels";
import { measures } from "@/lib/i18n/measures";
import { layerPictures, planPages, type PlanDto } from "@/lib/contracts/plans";
import { getPlan, getPlanPicture } from "@/lib/data/plans";
import { workshopSettings } from "@/lib/data/settings";
import { AppError } from "@/lib/errors";
import { runSize, stampingTime } from "@/lib/plans";
import { requirePageActor, type Actor } from "@/lib/session";
import { locationLabel } from "@/lib/stamps/format";
import { z } from "@/lib/zod";

/** The first metre is drawn at 1:10, so a 115 cm cloth takes 115 mm of the sheet and a metre 100 mm. */
const SCALE = 10;

type Props = { params: Promise<{ id: string }>; searchParams: Promise<{ paper?: string }> };

async function load(actor: Actor, id: string): Promise<PlanDto> {
  if (!z.uuid().safeParse(id).success) notFound();
  try {
    return await getPlan(actor, id);
  } catch (error) {
    if (error instanceof AppError && error.code === "notFound") notFound();
    throw error;
  }
}

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("plans"))("sheet.title") };
}

/** The stamping sheet: a print view (A4 or Letter) for the stamping table. */
export default async function StampingSheetPage({ params, searchParams }: Props) {
  const actor = await requirePageActor();
  const plan = await load(actor, (await params).id);
  const paper = (await searchParams).paper === "letter" ? "letter" : "a4";
  const [t, format, settings, picture] = await Promise.all([getTranslations(), getFormatter(), workshopSettings(), getPlanPicture(actor, plan, 1000)]);
  const s = plan.summary;
  const len = (mm: number) => measures(format, actor.unitSystem).length(mm);
  const num = (v: number, digits = 1) => format.number(v, { maximumFractionDigits: digits });
  const run = runSize(s, plan.layout.cloth.lengthMm === undefined);
  const time = stampingTime(s, settings.impressionsPerHour);
  const box = pictureBox(picture);
  const labels = pictureLabels(t, format, actor.unitSystem);
  const front = picture.impressions.filter((i) => i.face === "front");
  const firstRow = front.filter((i) => i.layer === "field" && Math.abs(i.yMm - Math.min(...front.filter((f) => f.layer === "field").map((f) => f.yMm))) < 0.01);
  const twins = plan.stamps.filter((st) => st.twin);
  return (
    <div className={paper === "letter" ? "print-plan-sheet-letter" : "print-plan-sheet-a4"} data-testid="stamping-sheet" data-paper={paper}>
      <div className="mb-4 flex flex-wrap items-center gap-3 print:hidden">
        <Link href={planPages.one(plan.id)} className="text-sm text-ink-700 hover:underline">
          {t("plans.sheet.back")}
        </Link>
        <nav aria-label={t("plans.sheet.paper")} className="flex gap-2 text-sm">
          <Link href={planPages.sheet(plan.id, "a4")} aria-current={paper === "a4" ? "page" : undefined} className="rounded border border-stone-300 px-2 py-1 aria-[current=page]:bg-stone-200">
            {t("plans.sheet.paperA4")}
          </Link>
          <Link href={planPages.sheet(plan.id, "letter")} aria-current={paper === "letter" ? "page" : undefined} className="rounded border border-stone-300 px-2 py-1 aria-[current=page]:bg-stone-200">
            {t("plans.sheet.paperLetter")}
          </Link>
        </nav>
        <PrintSheetButton label={t("plans.sheet.print")} />
      </div>
      <header className="mb-3 border-b border-stone-300 pb-2">
        <h1 className="text-xl font-semibold text-stone-900">{t("plans.sheet.heading", { name: plan.name })}</h1>
        <p className="text-sm text-stone-700">
          {t(`plans.arrangements.${plan.layout.arrangement}`)} · {t("plans.sheet.cloth", { width: len(plan.layout.cloth.widthMm), left: len(plan.layout.cloth.margins.leftMm), right: len(plan.layout.cloth.margins.rightMm) })} ·{" "}
          {s.sides === 2 ? t("plans.numbers.bothFaces") : t("plans.numbers.oneFace")}
        </p>
      </header>
      <div className="grid gap-4 sm:grid-cols-[auto_1fr] print:grid-cols-[auto_1fr]">
        <figure className="space-y-1">
          <PlanPicture
            picture={picture}
            face="front"
            stampPictures={layerPictures(plan)}
            leftover={s.leftover}
            unitSystem={actor.unitSystem}
            labels={{ ...labels, title: t("plans.sheet.pictureTitle") }}
            idPrefix="sheet"
            numbered
            width={`${Math.round(box.widthMm / SCALE)}mm`}
            height={`${Math.round(box.heightMm / SCALE)}mm`}
          />
          <figcaption className="text-xs text-stone-700">{t("plans.sheet.scale", { scale: SCALE })}</figcaption>
        </figure>
        <div className="space-y-3 text-sm">
          <section>
            <h2 className="font-semibold text-stone-900">{t("plans.sheet.orderTitle")}</h2>
            <p>{t("plans.sheet.order", { count: firstRow.length })}</p>
            <ul className="list-disc pl-5">
              {s.rows.map((r) => (
                <li key={r.row}>{t("plans.numbers.rowType", { row: r.row + 1, whole: r.whole, clipped: r.clipped, left: len(r.leftover.leftMm), right: len(r.leftover.rightMm) })}</li>
              ))}
            </ul>
          </section>
          <section>
            <h2 className="font-semibold text-stone-900">{t("plans.sheet.countsTitle")}</h2>
            <dl className="grid grid-cols-[auto_1fr] gap-x-3" data-testid="sheet-counts">
              <dt>{t("plans.sheet.perPiece")}</dt>
              <dd className="tabular-nums">{num(time.impressionsPerPiece, 0)}</dd>
              <dt>{t("plans.sheet.perRun")}</dt>
              <dd className="tabular-nums">{num(s.impressionsTotal, 0)}</dd>
              <dt>{t("plans.numbers.run")}</dt>
              <dd>{t("plans.numbers.runValue", { metres: num(run.metres, 2), yards: num(run.yards, 2), pieces: run.pieces, kodi: num(run.kodi, 2), pieceLength: len(run.pieceLengthMm) })}</dd>
              <dt>{t("plans.numbers.impressionsPerMetre")}</dt>
              <dd className="tabular-nums">{num(s.impressionsPerMetre, 2)}</dd>
              <dt>{t("plans.numbers.hours")}</dt>
              <dd>{t("plans.numbers.hoursValue", { hours: num(time.hoursTotal, 1), perPiece: num(time.hoursPerPiece, 2), perPieceImpressions: num(time.impressionsPerPiece, 0) })}</dd>
            </dl>
          </section>
          <section>
            <h2 className="font-semibold text-stone-900">{t("plans.sheet.stampsTitle")}</h2>
            {plan.stamps.length === 0 ? <p>{t("plans.sheet.freeStamp")}</p> : null}
            <ul className="space-y-1" data-testid="sheet-stamps">
              {plan.stamps.map((st) => (
                <li key={st.role}>
                  <span className="font-mono font-semibold">{st.code}</span> · {st.name} · {st.role === "field" ? t("plans.stale.field") : t("plans.stale.border")} ·{" "}
                  {st.location ? locationLabel(st.location) : t("plans.sheet.noLocation")}
                </li>
              ))}
            </ul>
          </section>
          {s.sides === 2 ? (
            <section data-testid="sheet-back">
              <h2 className="font-semibold text-stone-900">{t("plans.sheet.backTitle")}</h2>
              {twins.length ? (
                <ul>
                  {twins.map((st) => (
                    <li key={st.role}>{t("plans.sheet.twin", { code: st.code, twin: st.twin!.code, name: st.twin!.name })}</li>
                  ))}
                </ul>
              ) : (
                <p>{t("plans.sheet.noTwin")}</p>
              )}
            </section>
          ) : null}
        </div>
      </div>
      <section className="mt-4 break-inside-avoid">
        <h2 className="text-sm font-semibold text-stone-900">{t("plans.sheet.notesTitle")}</h2>
        {plan.notes ? <p className="text-sm text-stone-700">{plan.notes}</p> : null}
        <div className="mt-1 h-[45mm] rounded border border-stone-400 bg-[repeating-linear-gradient(transparent,transparent_7mm,var(--color-stone-300)_7mm,var(--color-stone-300)_7.2mm)]" aria-label={t("plans.sheet.notesSpace")} role="img" />
      </section>
    </div>
  );
}
