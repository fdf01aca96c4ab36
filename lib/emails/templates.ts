import type { DateFormat, Translator } from "@/lib/i18n/translator";

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

/**
 * Every mail is written in its recipient's language: the caller passes a translator for it (the recipient's
 * setting; the workshop's default, English, for someone without an account), never the sender's.
 */
function layout(t: Translator, paragraphs: string[], link: { href: string; label: string }, footer: string) {
  const body = paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join("");
  const html =
    `<div lang="${t.locale}" style="font-family:system-ui,sans-serif;max-width:560px;color:#1c1917">${body}` +
    `<p><a href="${escapeHtml(link.href)}" style="display:inline-block;background:#7c2d12;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">${escapeHtml(link.label)}</a></p>` +
    `<p style="font-size:13px;color:#57534e">${escapeHtml(link.href)}</p>` +
    `<p style="font-size:13px;color:#57534e">${escapeHtml(footer)}</p></div>`;
  const text = [...paragraphs, "", `${link.label}: ${link.href}`, "", footer].join("\n");
  return { html, text, language: t.locale };
}

/** Invitation with a set-password link (subject, text and HTML from the catalogue); times in the workshop's zone. */
export function invitationMail(t: Translator, d: DateFormat, p: { name: string; inviter: string; role: string; link: string; hours: number; expiresAt: Date }) {
  return {
    subject: t("emails.invite.subject"),
    ...layout(
      t,
      [t("emails.invite.greeting", { name: p.name }), t("emails.invite.body", { inviter: p.inviter, role: p.role })],
      { href: p.link, label: t("emails.invite.action") },
      t("emails.invite.expiry", { hours: p.hours, until: d.instant(p.expiresAt), timeZone: d.timeZone }),
    ),
  };
}

export function passwordResetMail(t: Translator, d: DateFormat, p: { name: string; link: string; minutes: number; expiresAt: Date }) {
  return {
    subject: t("emails.reset.subject"),
    ...layout(
      t,
      [t("emails.reset.greeting", { name: p.name }), t("emails.reset.body")],
      { href: p.link, label: t("emails.reset.action") },
      t("emails.reset.expiry", { minutes: p.minutes, until: d.instant(p.expiresAt), timeZone: d.timeZone }),
    ),
  };
}

/** To the stamp keepers: someone reported damage to a stamp. */
export function damageReportMail(t: Translator, d: DateFormat, p: { code: string; name: string; kind: string; note: string | null; reporter: string; link: string; at: Date }) {
  return {
    subject: t("stampEmails.damage.subject", { code: p.code }),
    ...layout(
      t,
      [
        t("stampEmails.damage.greeting"),
        t("stampEmails.damage.body", { reporter: p.reporter, code: p.code, name: p.name, kind: p.kind, when: d.instant(p.at), timeZone: d.timeZone }),
        ...(p.note ? [t("stampEmails.damage.note", { note: p.note })] : []),
      ],
      { href: p.link, label: t("stampEmails.damage.action") },
      t("stampEmails.damage.footer"),
    ),
  };
}

/** To a borrower whose check-out is past its due date. */
export function overdueReminderMail(t: Translator, d: DateFormat, p: { borrower: string; code: string; name: string; dueOn: string; outAt: Date; workstation: string; link: string }) {
  return {
    subject: t("stampEmails.overdue.subject", { code: p.code }),
    ...layout(
      t,
      [
        t("stampEmails.overdue.greeting", { name: p.borrower }),
        t("stampEmails.overdue.body", { code: p.code, name: p.name, dueOn: d.day(p.dueOn), outAt: d.instant(p.outAt), timeZone: d.timeZone, workstation: p.workstation }),
      ],
      { href: p.link, label: t("stampEmails.overdue.action") },
      t("stampEmails.overdue.footer"),
    ),
  };
}

/** To the stamp keepers: someone asks for stamps (for a plan) from one day until another. */
export function stampRequestMail(
  t: Translator,
  d: DateFormat,
  p: { requester: string; forWhom: string; workstation: string; codes: string; fromOn: string; untilOn: string; plan: string | null; note: string | null; link: string },
) {
  return {
    subject: t("requestEmails.new.subject", { requester: p.requester }),
    ...layout(
      t,
      [
        t("requestEmails.new.greeting"),
        t("requestEmails.new.body", { requester: p.requester, codes: p.codes, forWhom: p.forWhom, workstation: p.workstation, fromOn: d.day(p.fromOn), untilOn: d.day(p.untilOn) }),
        ...(p.plan ? [t("requestEmails.new.plan", { plan: p.plan })] : []),
        ...(p.note ? [t("requestEmails.new.note", { note: p.note })] : []),
      ],
      { href: p.link, label: t("requestEmails.new.action") },
      t("requestEmails.new.footer"),
    ),
  };
}

/** To a keeper: someone asks for a new stamp to be made (a size; for a motif, its role in the set). */
export function newStampRequestMail(t: Translator, p: { requester: string; widthMm: number; heightMm: number; motif: string | null; role: string | null; plan: string | null; note: string | null; sketch: boolean; link: string }) {
  return {
    subject: t("requestEmails.newStamp.subject", { requester: p.requester }),
    ...layout(
      t,
      [
        t("requestEmails.newStamp.greeting"),
        t("requestEmails.newStamp.body", { requester: p.requester, width: p.widthMm, height: p.heightMm }),
        ...(p.motif ? [t("requestEmails.newStamp.motif", { motif: p.motif, role: p.role ?? "" })] : []),
        ...(p.plan ? [t("requestEmails.newStamp.plan", { plan: p.plan })] : []),
        ...(p.note ? [t("requestEmails.newStamp.note", { note: p.note })] : []),
        ...(p.sketch ? [t("requestEmails.newStamp.sketch")] : []),
      ],
      { href: p.link, label: t("requestEmails.newStamp.action") },
      t("requestEmails.newStamp.footer"),
    ),
  };
}

/** To whoever asked: the keepers accepted (the stamps are out now, or will be on the first day) or declined. */
export function stampRequestAnswerMail(
  t: Translator,
  d: DateFormat,
  p: { requester: string; answer: "checkedOut" | "accepted" | "declined"; keeper: string; codes: string; fromOn: string; untilOn: string; workstation: string; reason: string | null; link: string },
) {
  return {
    subject: t(`requestEmails.${p.answer}.subject`, { codes: p.codes }),
    ...layout(
      t,
      [
        t("requestEmails.greeting", { name: p.requester }),
        t(`requestEmails.${p.answer}.body`, { keeper: p.keeper, codes: p.codes, fromOn: d.day(p.fromOn), untilOn: d.day(p.untilOn), workstation: p.workstation }),
        ...(p.reason ? [t("requestEmails.declined.reason", { reason: p.reason })] : []),
      ],
      { href: p.link, label: t("requestEmails.action") },
      t("requestEmails.footer"),
    ),
  };
}
