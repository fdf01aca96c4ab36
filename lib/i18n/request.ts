import type { AbstractIntlMessages } from "next-intl";
import { unstable_rethrow } from "next/navigation";
import { getRequestConfig } from "next-intl/server";
import { workshopTimeZone } from "@/lib/data/settings";
import { defaultTimeZone } from "@/lib/validation/settings";
import { dateTimeFormats, numberFormats } from "./formats";
import { messagesFor } from "./messages";
import { requestLocale } from "./request-locale";

/** The workshop's time zone (admin settings); the default one if the settings cannot be read, so pages still render. */
async function timeZone(): Promise<string> {
  try {
    return await workshopTimeZone();
  } catch (error) {
    unstable_rethrow(error);
    console.error("workshop settings could not be read; showing times in the default zone", error);
    return defaultTimeZone;
  }
}

// No locale in the URL: the language follows the signed-in person's setting, then the cookie, then the
// browser (request-locale.ts). The time zone is the workshop's, for every page and
// (through NextIntlClientProvider) every client component: the one place dates get their zone and
// their "now".
export default getRequestConfig(async () => {
  const locale = await requestLocale();
  // `now` too: relative times ("5 seconds ago") then read the same on the server and while the page hydrates.
  return { locale, messages: messagesFor(locale) as AbstractIntlMessages, timeZone: await timeZone(), now: new Date(), formats: { dateTime: dateTimeFormats, number: numberFormats } };
});
