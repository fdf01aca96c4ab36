import "server-only";
import { and, asc, eq, isNull, lt, or, sql } from "drizzle-orm";
import { db } from "@/db";
import { checkouts, stamps, users } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { damageReportMail, overdueReminderMail } from "@/lib/emails/templates";
import { env } from "@/lib/env";
import { pickLocale } from "@/lib/i18n/config";
import { dateFormat, translator } from "@/lib/i18n/translator";
import { sendMail } from "@/lib/mail";
import { stampUrl } from "@/lib/stamps/codes";
import type { ReminderResult } from "@/lib/contracts/stamps";
import { workshopTimeZone, workshopToday } from "../settings";

/**
 * E-mails every active keeper (or, with no keeper, every administrator) about a damage report.
 * The report is saved before this runs; a mail failure is logged and does not undo it.
 */
export async function notifyKeepersOfDamage(p: { code: string; name: string; kind: string; note: string | null; reporter: string; at: Date }) {
  try {
    const timeZone = await workshopTimeZone();
    let keepers = await db.select().from(users).where(and(eq(users.role, "keeper"), eq(users.disabled, false)));
    if (keepers.length === 0) keepers = await db.select().from(users).where(and(eq(users.role, "admin"), eq(users.disabled, false)));
    const link = stampUrl(env().APP_URL, p.code);
    await Promise.all(
      keepers.map((keeper) => {
        const locale = pickLocale(keeper.locale);
        const t = translator(locale);
        return sendMail({ to: keeper.email, ...damageReportMail(t, dateFormat(locale, timeZone), { ...p, kind: t(`stamps.damageKinds.${p.kind}`), link }) });
      }),
    );
  } catch (error) {
    console.error("damage report mail failed", error);
  }
}

/** The keepers' button skips a borrower reminded less than this long ago about the same check-out. */
export const REMINDER_GAP_HOURS = 24;

/**
 * Reminds each borrower whose check-out is overdue, unless they were reminded about it within `gapHours`
 * (checkouts.last_reminded_at, per check-out). Each reminder is claimed in the database before its mail goes
 * out, so two clicks (or the button and the daily job) at once send one mail; a mail that fails gives the
 * claim back. For `npm run remind` (no actor: it runs on the server by whoever operates it) and for the
 * keepers' button through sendOverdueReminders.
 */
export async function remindOverdueBorrowers(options: { gapHours?: number } = {}): Promise<ReminderResult> {
  const gapHours = options.gapHours ?? REMINDER_GAP_HOURS;
  const [today, timeZone] = [await workshopToday(), await workshopTimeZone()];
  const rows = await db
    .select({ checkout: checkouts, code: stamps.code, name: stamps.name, locale: users.locale })
    .from(checkouts)
    .innerJoin(stamps, eq(stamps.id, checkouts.stampId))
    .leftJoin(users, eq(users.id, checkouts.borrowerId))
    .where(and(isNull(checkouts.returnedAt), lt(checkouts.dueOn, today)))
    .orderBy(asc(checkouts.dueOn));
  const result: ReminderResult = { sent: [], withoutEmail: [], failed: [], skipped: [], gapHours };
  for (const { checkout: c, code, name, locale } of rows) {
    if (!c.borrowerEmail) {
      result.withoutEmail.push({ code, borrowerName: c.borrowerName });
      continue;
    }
    const [claimed] = await db
      .update(checkouts)
      .set({ lastRemindedAt: sql`now()` })
      .where(and(eq(checkouts.id, c.id), isNull(checkouts.returnedAt), or(isNull(checkouts.lastRemindedAt), lt(checkouts.lastRemindedAt, sql`now() - make_interval(hours => ${gapHours}::int)`))))
      .returning({ id: checkouts.id });
    if (!claimed) {
      const [now] = await db.select({ at: checkouts.lastRemindedAt }).from(checkouts).where(eq(checkouts.id, c.id));
      result.skipped.push({ code, borrowerName: c.borrowerName, lastRemindedAt: (now?.at ?? c.lastRemindedAt ?? new Date()).toISOString() });
      continue;
    }
    const language = pickLocale(locale);
    try {
      await sendMail({
        to: c.borrowerEmail,
        ...overdueReminderMail(translator(language), dateFormat(language, timeZone), {
          borrower: c.borrowerName,
          code,
          name,
          dueOn: c.dueOn,
          outAt: c.outAt,
          workstation: c.workstation,
          link: stampUrl(env().APP_URL, code),
        }),
      });
      result.sent.push({ code, borrowerName: c.borrowerName, borrowerEmail: c.borrowerEmail });
    } catch (error) {
      console.error(`reminder for ${code} failed`, error);
      await db.update(checkouts).set({ lastRemindedAt: c.lastRemindedAt }).where(eq(checkouts.id, c.id));
      result.failed.push({ code, borrowerName: c.borrowerName });
    }
  }
  return result;
}

export async function sendOverdueReminders(actor: Actor): Promise<ReminderResult> {
  assertCan(actor, "stamps:write");
  return remindOverdueBorrowers();
}
