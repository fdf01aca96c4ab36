import { cookies, headers } from "next/headers";
import type { AbstractIntlMessages } from "next-intl";
import { getRequestConfig } from "next-intl/server";
import { localeCookie, pickLocale } from "./config";
import { messagesFor } from "./messages";

// No locale in the URL: the language follows the user's choice (a cookie set from their
// profile), then the browser's first language.
export default getRequestConfig(async () => {
  const fromCookie = (await cookies()).get(localeCookie)?.value;
  const fromBrowser = (await headers()).get("accept-language")?.split(",")[0]?.split("-")[0];
  const locale = pickLocale(fromCookie ?? fromBrowser);
  return { locale, messages: messagesFor(locale) as AbstractIntlMessages, timeZone: "Asia/Jakarta" };
});
