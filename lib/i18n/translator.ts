import { createTranslator, type AbstractIntlMessages } from "next-intl";
import { type Locale, defaultLocale } from "./config";
import { messagesFor } from "./messages";

type Values = Record<string, string | number | Date>;

/** A translator for code outside React (route handlers, e-mails); keys are checked by the catalogue tests. */
export interface Translator {
  (key: string, values?: Values): string;
  has(key: string): boolean;
}

export function translator(locale: Locale = defaultLocale): Translator {
  const t = createTranslator({ locale, messages: messagesFor(locale) as AbstractIntlMessages });
  const translate = ((key: string, values?: Values) => t(key as never, values as never)) as Translator;
  translate.has = (key: string) => t.has(key as never);
  return translate;
}
