// Reading a form's fields for its zod schema, the same for every form: text as typed, numbers as the
// person's language writes them, empty as "not given". Neither server-only nor React.

/** A text field as typed; "" when absent. */
export function formText(form: FormData, name: string): string {
  const value = form.get(name);
  return typeof value === "string" ? value : "";
}

/** A text field trimmed; undefined when blank (the schema then applies its default or says it is required). */
export function formOptional(form: FormData, name: string): string | undefined {
  return formText(form, name).trim() || undefined;
}

interface NumberSymbols {
  decimal: string;
  group: string;
}

const symbolCache = new Map<string, NumberSymbols>();

/** The decimal and thousands signs of a language, as Intl writes them (en: "." and ","; id: "," and "."). */
export function numberSymbols(locale: string): NumberSymbols {
  let symbols = symbolCache.get(locale);
  if (!symbols) {
    const parts = new Intl.NumberFormat(locale).formatToParts(12345.6);
    symbols = { decimal: parts.find((p) => p.type === "decimal")?.value ?? ".", group: parts.find((p) => p.type === "group")?.value ?? "," };
    symbolCache.set(locale, symbols);
  }
  return symbols;
}

const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
/** Spaces people and Intl put between groups of thousands (space, no-break space, narrow no-break space). */
const SPACES = "[ \\u00a0\\u202f]";

/**
 * A number as someone writing `locale` types it: "120,5" and "1.200,5" in Indonesian, "120.5" and
 * "1,200.5" in English; thousands may also be set apart by spaces. null when empty; NaN when it is not a
 * number in that language, so the schema names the field. The thousands sign counts only between whole
 * groups of three digits, and the decimal sign only once: "120.5" in Indonesian, "120,5" in English and
 * "1.20" in Indonesian are refused rather than guessed. (A general parser such as
 * @internationalized/number drops a thousands sign wherever it stands and reads "120.5" in Indonesian as
 * 1205: a tenfold error on a stamp's size, silently saved.)
 */
export function readNumber(text: string, locale: string): number | null {
  const value = text.trim().replace(/^[−–]/, "-");
  if (value === "") return null;
  const { decimal, group } = numberSymbols(locale);
  const groupSign = `(?:${escape(group)}|${SPACES})`;
  const whole = `(?:\\d+|[1-9]\\d{0,2}(?:${groupSign}\\d{3})+)`;
  const pattern = new RegExp(`^([+-]?)(${whole})?(?:${escape(decimal)}(\\d+))?$`);
  const match = pattern.exec(value);
  if (!match || (match[2] === undefined && match[3] === undefined)) return Number.NaN;
  const digits = (match[2] ?? "0").replace(new RegExp(groupSign, "g"), "");
  return Number(`${match[1]}${digits}${match[3] !== undefined ? `.${match[3]}` : ""}`);
}

/** A number field read as its language writes it (readNumber). */
export function formNumber(form: FormData, name: string, locale: string): number | null {
  return readNumber(formText(form, name), locale);
}

/**
 * A number as a form shows it for editing: the language's decimal sign, no thousands sign (so what the form
 * shows, readNumber reads back exactly), at most `digits` decimals.
 */
export function numberInput(value: number | null | undefined, locale: string, digits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "";
  return new Intl.NumberFormat(locale, { useGrouping: false, maximumFractionDigits: digits }).format(value);
}

/** A checkbox: checked or not. */
export const formChecked = (form: FormData, name: string): boolean => form.get(name) === "on";
