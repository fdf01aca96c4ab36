import en from "./messages/en.json";
import type { Locale } from "./config";

export type Messages = typeof en;

const catalogues: Record<Locale, Messages> = { en };

export function messagesFor(locale: Locale): Messages {
  return catalogues[locale];
}
