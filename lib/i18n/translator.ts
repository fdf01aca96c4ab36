import { createFormatter, createTranslator, type AbstractIntlMessages } from "next-intl";
import { type Locale, defaultLocale } from "./config";
import { messagesFor } from "./messages";
import { calendarDay, dateTimeFormats, numberFormats } from "./formats";
import type { NumberFormatter } from "./measures";

type Values = Record<string, string | number | Date>;

/** A translator for code outside React (route handlers, e-mails); keys are checked by the catalogue tests. */
export interface Translator {
  (key: string, values?: Values): string;
  has(key: string): boolean;
  /** The language it speaks (an e-mail's `lang`). */
  locale: Locale;
}

export function translator(locale: Locale = defaultLocale): Translator {
  const t = createTranslator({ locale, messages: messagesFor(locale) as AbstractIntlMessages, formats: { number: numberFormats } });
  const translate = ((key: string, values?: Values) => t(key as never, values as never)) as Translator;
  translate.has = (key: string) => t.has(key as never);
  translate.locale = locale;
  return translate;
}

/** Dates for code outside React (e-mails), in the workshop's time zone (lib/data/settings.ts workshopTimeZone). */
export interface DateFormat {
  timeZone: string;
  /** A moment, e.g. when a link expires: date and time in the zone. */
  instant(at: Date): string;
  /** A calendar date kept as YYYY-MM-DD (a due date): the same day in every zone. */
  day(iso: string): string;
}

export function dateFormat(locale: Locale, timeZone: string): DateFormat {
  const format = createFormatter({ locale, timeZone, formats: { dateTime: dateTimeFormats } });
  return {
    timeZone,
    instant: (at) => format.dateTime(at, "moment"),
    day: (iso) => format.dateTime(calendarDay(iso), "day"),
  };
}

/** Numbers for code outside React (e-mails, scripts), with the app's named formats; `measures(numberFormatter(locale), units)` for lengths. */
export function numberFormatter(locale: Locale): NumberFormatter {
  const format = createFormatter({ locale, formats: { number: numberFormats } });
  return { number: (value, formatOrOptions) => format.number(value, formatOrOptions as never) };
}
