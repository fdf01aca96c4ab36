import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import { PageHeader, Panel } from "@/components/ui/panel";
import { REMINDER_GAP_HOURS } from "@/lib/data/stamps/mail";
import type { OpenCheckoutDto } from "@/lib/contracts/stamps";
import { listCheckouts } from "@/lib/data/stamps";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { OutTable } from "./out-table";
import { RemindersButton } from "./reminders-button";

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
  const [t, out] = await Promise.all([getTranslations(), listCheckouts(actor)]);
  const overdue = out.filter((c) => c.overdue);
  const { toRemind, recentlyReminded } = reminderCounts(overdue);
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
        <OutTable checkouts={out} />
      )}
    </>
  );
}
