/** Languages with a complete catalogue. Indonesian ("id") joins when its catalogue is written. */
export const locales = ["en"] as const;
export type Locale = (typeof locales)[number];
export const defaultLocale: Locale = "en";
export const localeCookie = "capgrid-locale";

export function pickLocale(candidate: string | undefined | null): Locale {
  return (locales as readonly string[]).includes(candidate ?? "") ? (candidate as Locale) : defaultLocale;
}
