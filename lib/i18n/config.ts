import { match } from "@formatjs/intl-localematcher";
import Negotiator from "negotiator";

/** The languages people can choose: English and Bahasa Indonesia. */
export const locales = ["en", "id"] as const;
export type Locale = (typeof locales)[number];
/** The workshop's default: e-mails to someone without an account, requests that name no language. */
export const defaultLocale: Locale = "en";
/** Remembers the language for pages before sign-in; follows the user's setting at sign-in and on change. */
export const localeCookie = "capgrid-locale";

/**
 * Each language named in itself, for the language switch and the setting on My account. These are the
 * same in every catalogue (a language is called by its own name), so they live here and not in the messages.
 */
export const localeNames: Record<Locale, string> = { en: "English", id: "Bahasa Indonesia" };

export const isLocale = (candidate: unknown): candidate is Locale => (locales as readonly unknown[]).includes(candidate);

export function pickLocale(candidate: string | undefined | null): Locale {
  return isLocale(candidate) ? candidate : defaultLocale;
}

/**
 * The best of our languages for an `Accept-Language` header, with its weights ("fr, id;q=0.8" → id,
 * "id-ID" → id), the way next-intl's own middleware reads it (negotiator + the Intl.LocaleMatcher
 * algorithm); null when the header names none of them.
 */
export function negotiateLocale(acceptLanguage: string | null | undefined): Locale | null {
  if (!acceptLanguage) return null;
  const asked = new Negotiator({ headers: { "accept-language": acceptLanguage } }).languages();
  if (asked.length === 0 || asked[0] === "*") return null;
  try {
    // "und" never matches a real language, so "no match" is told apart from a match of English.
    const found = match(asked, locales, "und", { algorithm: "best fit" });
    return isLocale(found) ? found : null;
  } catch {
    return null; // a malformed tag in the header
  }
}
