import type { Page } from "playwright-core";
import type { Locale } from "@/lib/i18n/config";
import { catalogueFiles } from "@/lib/i18n/messages";
import { catalogueLeaves } from "./source-files";

const leaves: Record<Locale, Map<string, string>> = {
  en: catalogueLeaves(Object.assign({}, ...catalogueFiles.en)),
  id: catalogueLeaves(Object.assign({}, ...catalogueFiles.id)),
};

/**
 * A language's catalogue texts without placeholders that read differently in the other language ("Check out"
 * against "Pinjamkan", "Required." against "Wajib diisi."), so finding one on a page means a text of that
 * language is shown.
 */
function onlyIn(locale: Locale): Set<string> {
  const other = leaves[locale === "en" ? "id" : "en"];
  const otherTexts = new Set(other.values());
  return new Set(
    [...leaves[locale]].filter(([key, text]) => !/[{}<]/.test(text) && text.length >= 3 && other.get(key) !== text && !otherTexts.has(text)).map(([, text]) => text),
  );
}
const only: Record<Locale, Set<string>> = { en: onlyIn("en"), id: onlyIn("id") };

/**
 * Every catalogue text of `locale` alone that a page shows: as the whole text of an element, as an accessible
 * label, placeholder, title or alt, or as the page title (each part of "Title · Capgrid"). `textsOn(page, "en")`
 * is empty when the page speaks Indonesian throughout.
 */
export async function textsOn(page: Page, locale: Locale): Promise<string[]> {
  const shown = await page.evaluate(() => {
    const texts = new Set<string>();
    for (const el of Array.from(document.body.querySelectorAll("*"))) {
      if (el.closest("script, style, [hidden], template")) continue;
      const own = Array.from(el.childNodes)
        .filter((n) => n.nodeType === Node.TEXT_NODE)
        .map((n) => n.textContent ?? "")
        .join("")
        .trim();
      if (own) texts.add(own);
      const whole = (el as HTMLElement).innerText?.trim();
      if (whole && el.children.length <= 3) texts.add(whole);
      for (const attribute of ["aria-label", "placeholder", "title", "alt"]) {
        const value = el.getAttribute(attribute)?.trim();
        if (value) texts.add(value);
      }
    }
    texts.add(document.title);
    for (const part of document.title.split(" · ")) texts.add(part.trim());
    return [...texts];
  });
  return [...new Set(shown.filter((text) => only[locale].has(text)))].sort();
}

/** The English-only catalogue texts a page shows: empty when it speaks Indonesian throughout. */
export const englishLeftOn = (page: Page) => textsOn(page, "en");
