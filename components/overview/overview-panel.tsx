import Link from "next/link";
import { getFormatter, getTranslations } from "next-intl/server";
import type { OverviewSection } from "@/lib/contracts/overview";

/**
 * One panel of the overview: its title with how many are waiting, an intro, the first items (or the empty state
 * "nothing waiting"), and "and N more" pointing at the full list where the work is done.
 */
export async function OverviewPanel({
  section,
  title,
  intro,
  total,
  shown,
  empty,
  moreHref,
  moreLabel,
  children,
}: {
  section: OverviewSection;
  title: string;
  intro?: string;
  total: number;
  shown: number;
  empty: string;
  moreHref?: string;
  /** The link's words instead of "Open the list" (when all are shown). */
  moreLabel?: string;
  children: React.ReactNode;
}) {
  const [t, format] = await Promise.all([getTranslations("overview"), getFormatter()]);
  const headingId = `overview-${section}-title`;
  return (
    <section aria-labelledby={headingId} data-testid={`overview-${section}`} data-count={total} className="rounded-lg border border-stone-200 bg-white p-5 shadow-xs">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={headingId} className="text-base font-semibold text-stone-900">
          {title}
        </h3>
        <span className={total > 0 ? "rounded-full bg-amber-100 px-2 py-0.5 text-xs font-semibold text-amber-900" : "text-xs text-stone-600"} data-testid="overview-count">
          {total > 0 ? format.number(total, "count") : t("count", { count: 0 })}
        </span>
      </div>
      {intro ? <p className="mt-1 text-sm text-stone-600">{intro}</p> : null}
      <div className="mt-3 text-sm">
        {total === 0 ? (
          <p className="text-stone-600" data-testid="overview-empty">
            {empty}
          </p>
        ) : (
          children
        )}
      </div>
      {moreHref && total > 0 ? (
        <p className="mt-3 text-sm">
          <Link href={moreHref} className="font-medium text-ink-700 hover:underline">
            {total > shown ? t("more", { count: total - shown }) : (moreLabel ?? t("openAll"))}
          </Link>
        </p>
      ) : null}
    </section>
  );
}

/** The list inside a panel: one line per item. */
export function OverviewItems({ children }: { children: React.ReactNode }) {
  return <ul className="divide-y divide-stone-100">{children}</ul>;
}

export function OverviewItem({ href, label, detail, testId }: { href: string; label: React.ReactNode; detail?: React.ReactNode; testId?: string }) {
  return (
    <li className="py-2" data-testid={testId}>
      <Link href={href} className="font-medium text-ink-700 hover:underline">
        {label}
      </Link>
      {detail ? <div className="text-stone-700">{detail}</div> : null}
    </li>
  );
}
