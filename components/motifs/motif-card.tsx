import Link from "next/link";
import { useFormatter, useTranslations } from "next-intl";
import { calendarDay } from "@/lib/i18n/formats";
import { motifUrls, type MotifSummaryDto } from "@/lib/contracts/motifs";

/** A motif in the archive's grid: the main stamp's scan, name, tags, designer, collections, a warning when its main stamp cannot be used. */
export function MotifCard({ motif }: { motif: MotifSummaryDto }) {
  const t = useTranslations("motifs");
  const format = useFormatter();
  const thumb = motif.mainStamp?.thumb;
  return (
    <Link href={motifUrls.page(motif.id)} className="group block h-full overflow-hidden rounded-lg border border-stone-200 bg-white shadow-xs hover:border-ink-400" data-testid="motif-card">
      {thumb ? (
        // eslint-disable-next-line @next/next/no-img-element -- thumbnails come from our API
        <img src={thumb} alt="" loading="lazy" className="aspect-[4/3] w-full bg-stone-100 object-contain" />
      ) : (
        <div className="flex aspect-[4/3] w-full items-center justify-center bg-stone-100 text-xs text-stone-600">{t("card.noScan")}</div>
      )}
      <div className="space-y-1 p-3 text-sm">
        <h2 className="font-semibold text-stone-900 group-hover:underline">{motif.name}</h2>
        {motif.designer ? <p className="text-stone-600">{motif.designer}</p> : null}
        <p className="text-xs text-stone-600">
          {t("card.stamps", { count: motif.stampCount })} · {t("card.colourways", { count: motif.colourwayCount })}
          {motif.lastUsedOn ? <> · {t("card.firstUsed", { date: format.dateTime(calendarDay(motif.lastUsedOn), "day") })}</> : null}
        </p>
        {motif.tags.length ? (
          <ul className="flex flex-wrap gap-1">
            {motif.tags.map((tag) => (
              <li key={tag} className="rounded bg-stone-100 px-1.5 py-0.5 text-xs text-stone-700">
                {tag}
              </li>
            ))}
          </ul>
        ) : null}
        {motif.collections.length ? <p className="text-xs text-stone-600">{motif.collections.map((c) => c.name).join(", ")}</p> : null}
        {motif.mainStampProblem ? <p className="rounded bg-amber-50 px-1.5 py-1 text-xs text-amber-900">{t(`problem.${motif.mainStampProblem}`)}</p> : null}
      </div>
    </Link>
  );
}
