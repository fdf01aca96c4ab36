import clsx from "clsx";
import { getLocale, getTranslations } from "next-intl/server";
import { chooseLocaleAction } from "@/lib/actions/choose-locale";
import { localeNames, locales, pickLocale } from "@/lib/i18n/config";

/**
 * Both languages, each named in itself, as buttons of one small form: it works without JavaScript and from
 * the keyboard, and the one in use is marked pressed. On the dark header or on the light sign-in pages.
 */
export async function LanguageSwitch({ tone }: { tone: "dark" | "light" }) {
  const t = await getTranslations("language");
  const current = pickLocale(await getLocale());
  return (
    <form action={chooseLocaleAction} aria-label={t("label")} className="flex items-center gap-1 text-sm">
      {locales.map((locale) => (
        <button
          key={locale}
          type="submit"
          name="locale"
          value={locale}
          lang={locale}
          aria-pressed={locale === current}
          className={clsx(
            "rounded-md px-2 py-1",
            tone === "dark"
              ? locale === current
                ? "bg-ink-700 font-medium text-white"
                : "text-ink-100 hover:bg-ink-800 hover:text-white"
              : locale === current
                ? "bg-stone-200 font-medium text-stone-900"
                : "text-stone-700 hover:bg-stone-100 hover:text-stone-950",
          )}
        >
          {localeNames[locale]}
        </button>
      ))}
    </form>
  );
}
