import type { Metadata } from "next";
import Link from "next/link";
import { getFormatter, getTranslations } from "next-intl/server";
import { OutBadge } from "@/components/stamps/condition-badge";
import { PageHeader, Panel } from "@/components/ui/panel";
import { REMINDER_GAP_HOURS } from "@/lib/data/stamps/mail";
import type { OpenCheckoutDto } from "@/lib/contracts/stamps";
import { listCheckouts } from "@/lib/data/stamps";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { RemindersButton } from "./reminders-button";
import { calendarDay } from "@/lib/i18n/formats";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("overdue"))("title") };
}

/** Overdue check-outs with an address: how many the button would remind now, and how many it skips as reminded lately. */
function reminderCounts(overdue: OpenCheckoutDto[], at = Date.now()) {
  const withEmail = overdue.filter((c) => c.borrowerEmail);
  const recentlyReminded = withEmail.filter((c) => c.lastRemindedAt && at - Date.parse(c.lastRemindedAt) < REMINDER_GAP_HOURS * 3_600_000).length;
  return { toRemind: withEmail.length - recentlyReminded, recentlyReminded };
}

export default async function OutPage() {
  const actor = await requirePageActor();
  const [t, format, out] = await Promise.all([getTranslations(), getFormatter(), listCheckouts(actor)]);
  const overdue = out.filter((c) => c.overdue);
  const { toRemind, recentlyReminded } = reminderCounts(overdue);
  const day = (iso: string) => format.dateTime(calendarDay(iso), "day");
  return (
    <>
      <PageHeader title={t("overdue.title")} intro={t("overdue.intro", { out: out.length, overdue: overdue.length })} />
      {can(actor.role, "stamps:write") && overdue.length ? (
        <Panel title={t("overdue.remindTitle")} intro={t("overdue.remindIntro")} className="mb-6">
          <RemindersButton due={toRemind} recent={recentlyReminded} hours={REMINDER_GAP_HOURS} />
        </Panel>
      ) : null}
      {out.length === 0 ? (
        <Panel>
          <p className="py-6 text-center text-sm text-stone-600">{t("overdue.empty")}</p>
        </Panel>
      ) : (
        <div className="overflow-x-auto rounded-lg border border-stone-200 bg-white">
          <table className="min-w-full divide-y divide-stone-200 text-sm" aria-label={t("overdue.title")}>
            <thead className="bg-stone-50 text-left text-stone-700">
              <tr>
                <th scope="col" className="px-3 py-2.5 font-semibold">{t("stamps.columns.code")}</th>
                <th scope="col" className="px-3 py-2.5 font-semibold">{t("stamps.checkout.borrower")}</th>
                <th scope="col" className="px-3 py-2.5 font-semibold">{t("stamps.checkout.workstation")}</th>
                <th scope="col" className="px-3 py-2.5 font-semibold">{t("stamps.checkout.since")}</th>
                <th scope="col" className="px-3 py-2.5 font-semibold">{t("stamps.checkout.due")}</th>
                <th scope="col" className="px-3 py-2.5 font-semibold">{t("overdue.reminded")}</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-stone-100">
              {out.map((c) => (
                <tr key={c.id} data-testid={`out-row-${c.stampCode}`} className={c.overdue ? "bg-red-50/50" : undefined}>
                  <td className="px-3 py-2">
                    <Link href={`/stamps/${encodeURIComponent(c.stampCode)}`} className="font-mono font-medium text-ink-700 hover:underline">
                      {c.stampCode}
                    </Link>
                    <span className="block text-xs text-stone-500">{c.stampName}</span>
                  </td>
                  <td className="px-3 py-2">
                    {c.borrowerName}
                    <span className="block text-xs text-stone-500">{c.borrowerEmail ?? t("overdue.noEmail")}</span>
                  </td>
                  <td className="px-3 py-2">{c.workstation}</td>
                  <td className="px-3 py-2">{format.dateTime(new Date(c.outAt), "date")}</td>
                  <td className="px-3 py-2">
                    <span className="flex items-center gap-2">
                      {day(c.dueOn)}
                      {c.overdue ? <OutBadge overdue label={t("stamps.table.overdue")} /> : null}
                    </span>
                  </td>
                  <td className="px-3 py-2 text-stone-600">{c.lastRemindedAt ? format.dateTime(new Date(c.lastRemindedAt), "moment") : "—"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </>
  );
}
