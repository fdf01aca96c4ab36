import "server-only";
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { users } from "@/db/schema";
import type { NewStampRequestDto } from "@/lib/contracts/plans";
import { newStampRequestMail, stampRequestAnswerMail, stampRequestMail } from "@/lib/emails/templates";
import { env } from "@/lib/env";
import { pickLocale } from "@/lib/i18n/config";
import { dateFormat, translator } from "@/lib/i18n/translator";
import { sendMail } from "@/lib/mail";
import { workshopTimeZone } from "../settings";

// The e-mails of stamp requests, each in its recipient's language. A request is saved before its mail goes out;
// a mail that fails is logged and undoes nothing.

const appLink = (path: string) => `${env().APP_URL.replace(/\/$/, "")}${path}`;

export interface RequestMailFacts {
  id: string;
  requesterId: string | null;
  requesterName: string;
  requesterEmail: string | null;
  forWhom: string;
  workstation: string;
  codes: string[];
  fromOn: string;
  untilOn: string;
  plan: { id: string; name: string } | null;
  note: string | null;
}

/** To every active keeper (or, with none, every administrator): a new request waits in the queue. */
export async function mailKeepersAboutRequest(r: RequestMailFacts) {
  try {
    const timeZone = await workshopTimeZone();
    let keepers = await db.select().from(users).where(and(eq(users.role, "keeper"), eq(users.disabled, false)));
    if (keepers.length === 0) keepers = await db.select().from(users).where(and(eq(users.role, "admin"), eq(users.disabled, false)));
    await Promise.all(
      keepers.map((keeper) => {
        const locale = pickLocale(keeper.locale);
        return sendMail({
          to: keeper.email,
          ...stampRequestMail(translator(locale), dateFormat(locale, timeZone), {
            requester: r.requesterName,
            forWhom: r.forWhom,
            workstation: r.workstation,
            codes: r.codes.join(", "),
            fromOn: r.fromOn,
            untilOn: r.untilOn,
            plan: r.plan?.name ?? null,
            note: r.note,
            link: appLink(`/stamps/requests#request-${r.id}`),
          }),
        });
      }),
    );
  } catch (error) {
    console.error("stamp request mail failed", error);
  }
}

async function activeKeepers() {
  const keepers = await db.select().from(users).where(and(eq(users.role, "keeper"), eq(users.disabled, false)));
  return keepers.length ? keepers : db.select().from(users).where(and(eq(users.role, "admin"), eq(users.disabled, false)));
}

/** To every active keeper (or, with none, every administrator), each in their language: a new stamp is asked for. */
export async function mailKeepersAboutNewStamp(r: NewStampRequestDto & { hasSketch?: boolean }) {
  try {
    const keepers = await activeKeepers();
    await Promise.all(
      keepers.map((keeper) => {
        const t = translator(pickLocale(keeper.locale));
        return sendMail({
          to: keeper.email,
          ...newStampRequestMail(t, {
            requester: r.requesterName,
            widthMm: r.widthMm,
            heightMm: r.heightMm,
            motif: r.motif?.name ?? null,
            role: r.role ? t(`motifs.roles.${r.role}`) : null,
            plan: r.plan?.name ?? null,
            note: r.note,
            sketch: Boolean(r.hasSketch),
            link: appLink(`/stamps/requests#new-stamp-${r.id}`),
          }),
        });
      }),
    );
  } catch (error) {
    console.error("new-stamp request mail failed", error);
  }
}

/** To whoever asked: the keepers' answer, in their language. */
export async function mailRequesterAnswer(r: RequestMailFacts, answer: "checkedOut" | "accepted" | "declined", keeper: string, reason: string | null) {
  if (!r.requesterEmail) return;
  try {
    const [user] = r.requesterId ? await db.select({ locale: users.locale }).from(users).where(eq(users.id, r.requesterId)) : [];
    const locale = pickLocale(user?.locale);
    await sendMail({
      to: r.requesterEmail,
      ...stampRequestAnswerMail(translator(locale), dateFormat(locale, await workshopTimeZone()), {
        requester: r.requesterName,
        answer,
        keeper,
        codes: r.codes.join(", "),
        fromOn: r.fromOn,
        untilOn: r.untilOn,
        workstation: r.workstation,
        reason,
        link: appLink(r.plan ? `/plans/${r.plan.id}` : "/stamps/requests"),
      }),
    });
  } catch (error) {
    console.error("stamp request answer mail failed", error);
  }
}
