import { testEnv } from "./env";

interface CapturedMail {
  id: string;
  subject: string;
  text?: string;
  html?: string;
  to: { address: string }[];
  time?: string;
  /** Header names in lower case. */
  headers?: Record<string, string>;
}

/** The newest mail the catcher holds for an address (and subject), waiting for it to arrive. */
export async function latestMailTo(address: string, subject?: RegExp, timeoutMs = 10_000): Promise<CapturedMail> {
  const { mailUrl } = testEnv();
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const response = await fetch(`${mailUrl}/api/email?sort=desc`);
    const list = ((await response.json()) as CapturedMail[])
      .filter((m) => m.to?.some((to) => to.address.toLowerCase() === address.toLowerCase()) && (!subject || subject.test(m.subject)))
      .sort((a, b) => (b.time ?? "").localeCompare(a.time ?? ""));
    const found = list[0];
    if (found) return found;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`no mail to ${address} within ${timeoutMs} ms`);
}

/** The set-password link in a mail's text. */
export function linkIn(mail: CapturedMail): string {
  const match = /(https?:\/\/\S+\/set-password\?token=[\w%-]+)/.exec(mail.text ?? mail.html ?? "");
  if (!match) throw new Error(`no set-password link in "${mail.subject}"`);
  return match[1];
}

export const tokenOf = (link: string) => decodeURIComponent(new URL(link).searchParams.get("token") ?? "");
