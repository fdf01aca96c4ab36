import "server-only";
import { and, asc, eq, isNotNull, isNull, lt } from "drizzle-orm";
import { db } from "@/db";
import { checkouts, stamps, users } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { damageReportMail, overdueReminderMail } from "@/lib/emails/templates";
import { env } from "@/lib/env";
import { pickLocale } from "@/lib/i18n/config";
import { translator } from "@/lib/i18n/translator";
import { sendMail } from "@/lib/mail";
import { stampUrl } from "@/lib/stamps/codes";
import { todayIso } from "@/lib/dates";
import type { ReminderResult } from "@/lib/contracts/stamps";

/**
 * E-mails every active keeper (or, with no keeper, every administrator) about a damage report.
 * The report is saved before this runs; a mail failure is logged and does not undo it.
 */
export async function notifyKeepersOfDamage(p: { code: string; name: string; kind: string; note: string | null; reporter: string }) {
  try {
    let keepers = await db.select().from(users).where(and(eq(users.role, "keeper"), eq(users.disabled, false)));
    if (keepers.length === 0) keepers = await db.select().from(users).where(and(eq(users.role, "admin"), eq(users.disabled, false)));
    const link = stampUrl(env().APP_URL, p.code);
    await Promise.all(
      keepers.map((keeper) => {
        const t = translator(pickLocale(keeper.locale));
        return sendMail({ to: keeper.email, ...damageReportMail(t, { ...p, kind: t(`stamps.damageKinds.${p.kind}`), link }) });
      }),
    );
  } catch (error) {
    console.error("damage report mail failed", error);
  }
}

/**
 * Reminds each borrower whose check-out is overdue. For `npm run remind` (no actor: it runs on the
 * server by whoever operates it) and for the keepers' button through sendOverdueReminders.
 */
export async function remindOverdueBorrowers(): Promise<ReminderResult> {
  const today = todayIso();
  const rows = await db
    .select({ checkout: checkouts, code: stamps.code, name: stamps.name, locale: users.locale })
    .from(checkouts)
    .innerJoin(stamps, eq(stamps.id, checkouts.stampId))
    .leftJoin(users, eq(users.id, checkouts.borrowerId))
    .where(and(isNull(checkouts.returnedAt), lt(checkouts.dueOn, today)))
    .orderBy(asc(checkouts.dueOn));
  const result: ReminderResult = { sent: [], withoutEmail: [], failed: [] };
  for (const { checkout: c, code, name, locale } of rows) {
    if (!c.borrowerEmail) {
      result.withoutEmail.push({ code, borrowerName: c.borrowerName });
      continue;
    }
    const t = translator(pickLocale(locale));
    try {
      await sendMail({
        to: c.borrowerEmail,
        ...overdueReminderMail(t, { borrower: c.borrowerName, code, name, dueOn: c.dueOn, workstation: c.workstation, link: stampUrl(env().APP_URL, code) }),
      });
      await db.update(checkouts).set({ lastRemindedAt: new Date() }).where(and(eq(checkouts.id, c.id), isNotNull(checkouts.borrowerEmail)));
      result.sent.push({ code, borrowerName: c.borrowerName, borrowerEmail: c.borrowerEmail });
    } catch (error) {
      console.error(`reminder for ${code} failed`, error);
      result.failed.push({ code, borrowerName: c.borrowerName });
    }
  }
  return result;
}

export async function sendOverdueReminders(actor: Actor): Promise<ReminderResult> {
  assertCan(actor, "stamps:write");
  return remindOverdueBorrowers();
}
