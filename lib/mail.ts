import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { env } from "@/lib/env";

let transport: Transporter | undefined;

function mailer(): Transporter {
  const e = env();
  transport ??= nodemailer.createTransport({
    host: e.SMTP_HOST,
    port: e.SMTP_PORT,
    secure: e.SMTP_SECURE,
    auth: e.SMTP_USER ? { user: e.SMTP_USER, pass: e.SMTP_PASSWORD } : undefined,
  });
  return transport;
}

export interface Mail {
  to: string;
  subject: string;
  text: string;
  html: string;
  /** The recipient's language (the templates set it): sent as Content-Language. */
  language?: string;
}

export async function sendMail({ language, ...mail }: Mail) {
  await mailer().sendMail({ from: env().MAIL_FROM, ...mail, ...(language ? { headers: { "Content-Language": language } } : {}) });
}
