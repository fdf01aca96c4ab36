import { getFormatter, getTranslations } from "next-intl/server";
import type { OverviewDto } from "@/lib/contracts/overview";
import { overviewPages } from "@/lib/contracts/overview";
import type { UnitSystem } from "@/lib/contracts/wax";
import { calendarDay } from "@/lib/i18n/formats";
import { measures } from "@/lib/i18n/measures";
import { OverviewItem, OverviewItems, OverviewPanel } from "./overview-panel";

// The keepers' panels: flagged stamps, stamp requests, new-stamp requests, overdue check-outs, the repair queue.
// i18n-keys: overview.stampRequests.open, overview.stampRequests.accepted

type Props<K extends keyof OverviewDto> = { data: NonNullable<OverviewDto[K]> };

export async function FlaggedStampsPanel({ data }: Props<"flaggedStamps">) {
  const [t, format] = await Promise.all([getTranslations(), getFormatter()]);
  return (
    <OverviewPanel section="flaggedStamps" title={t("overview.flaggedStamps.title")} intro={t("overview.flaggedStamps.intro")} total={data.total} shown={data.items.length} empty={t("overview.flaggedStamps.empty")}>
      <OverviewItems>
        {data.items.map((f) => (
          <OverviewItem
            key={`${f.code}-${f.kind}`}
            testId={`flagged-${f.code}`}
            href={overviewPages.stamp(f.code)}
            label={
              <>
                <span className="font-mono">{f.code}</span> {f.name}
              </>
            }
            detail={t("overview.flaggedStamps.line", { kind: t(`runs.findingKind.${f.kind}`), findings: f.findings, lastOn: format.dateTime(calendarDay(f.lastOn), "day") })}
          />
        ))}
      </OverviewItems>
    </OverviewPanel>
  );
}

export async function StampRequestsPanel({ data }: Props<"stampRequests">) {
  const [t, format] = await Promise.all([getTranslations("overview.stampRequests"), getFormatter()]);
  const day = (iso: string) => format.dateTime(calendarDay(iso), "day");
  return (
    <OverviewPanel section="stampRequests" title={t("title")} total={data.total} shown={data.items.length} empty={t("empty")} moreHref={overviewPages.requests()}>
      <OverviewItems>
        {data.items.map((r) => (
          <OverviewItem
            key={r.id}
            href={overviewPages.request(r.id)}
            label={<span className="font-mono">{r.stampCodes.join(", ")}</span>}
            detail={
              <>
                {t("line", { requester: r.requesterName, forWhom: r.forWhom, from: day(r.fromOn), until: day(r.untilOn) })} · {t(r.state)}
              </>
            }
          />
        ))}
      </OverviewItems>
    </OverviewPanel>
  );
}

export async function NewStampRequestsPanel({ data, unitSystem }: Props<"newStampRequests"> & { unitSystem: UnitSystem }) {
  const [t, format] = await Promise.all([getTranslations("overview.newStampRequests"), getFormatter()]);
  const m = measures(format, unitSystem);
  return (
    <OverviewPanel section="newStampRequests" title={t("title")} total={data.total} shown={data.items.length} empty={t("empty")} moreHref={overviewPages.requests()}>
      <OverviewItems>
        {data.items.map((n) => (
          <OverviewItem
            key={n.id}
            href={overviewPages.newStampRequest(n.id)}
            label={t("line", { size: m.size(n.widthMm, n.heightMm), requester: n.requesterName })}
            detail={n.motif ? t("forMotif", { motif: n.motif.name }) : undefined}
          />
        ))}
      </OverviewItems>
    </OverviewPanel>
  );
}

export async function OverdueCheckoutsPanel({ data }: Props<"overdueCheckouts">) {
  const [t, format] = await Promise.all([getTranslations("overview.overdueCheckouts"), getFormatter()]);
  return (
    <OverviewPanel section="overdueCheckouts" title={t("title")} total={data.total} shown={data.items.length} empty={t("empty")} moreHref={overviewPages.out()}>
      <OverviewItems>
        {data.items.map((c) => (
          <OverviewItem
            key={c.stampCode}
            href={overviewPages.stamp(c.stampCode)}
            label={
              <>
                <span className="font-mono">{c.stampCode}</span> {c.stampName}
              </>
            }
            detail={t("line", { borrower: c.borrowerName, dueOn: format.dateTime(calendarDay(c.dueOn), "day") })}
          />
        ))}
      </OverviewItems>
    </OverviewPanel>
  );
}

export async function RepairQueuePanel({ data }: Props<"repairQueue">) {
  const t = await getTranslations();
  return (
    <OverviewPanel section="repairQueue" title={t("overview.repairQueue.title")} total={data.total} shown={data.items.length} empty={t("overview.repairQueue.empty")} moreHref={overviewPages.repairs()}>
      <OverviewItems>
        {data.items.map((s) => (
          <OverviewItem
            key={s.code}
            href={overviewPages.stamp(s.code)}
            label={
              <>
                <span className="font-mono">{s.code}</span> {s.name}
              </>
            }
            detail={t(`stamps.conditions.${s.condition}`)}
          />
        ))}
      </OverviewItems>
    </OverviewPanel>
  );
}
