import { lengthFor, massFor, type UnitSystem } from "@/lib/stamps/format";
import type { NumberFormatName } from "./formats";

/** What measures needs of next-intl's formatter (`useFormatter()`, `getFormatter()`, `numberFormatter(locale)`). */
export interface NumberFormatter {
  number(value: number, formatOrOptions?: NumberFormatName | Intl.NumberFormatOptions): string;
}

export interface Measures {
  /** "210 × 200 mm", "8,27 × 7,87 in" in Indonesian. */
  size(widthMm: number, heightMm: number): string;
  /** "120,5 mm" / "4,74 in". */
  length(mm: number): string;
  /** "850 g", "1,25 kg", "1,2 oz". */
  mass(g: number): string;
  /** A ratio 0–1 as a percentage ("35,2 %"); `fine` to two decimals, for coverage under 1 %. */
  percent(ratio: number, fine?: boolean): string;
  /** A count ("1.200"). */
  count(n: number): string;
}

/**
 * The one place lengths, masses, percentages and counts become text: in the person's unit system
 * (stored values are mm and g) and through next-intl's number formatter, so the language decides the
 * decimal and thousands signs. Neither React nor server-only: pages, client components, print sheets and
 * e-mails all use it.
 */
export function measures(format: NumberFormatter, system: UnitSystem): Measures {
  const shown = (s: { value: number; unit: string; digits: number }) => `${format.number(s.value, { maximumFractionDigits: s.digits })} ${s.unit}`;
  return {
    size(widthMm, heightMm) {
      const w = lengthFor(widthMm, system);
      const h = lengthFor(heightMm, system);
      return `${format.number(w.value, { maximumFractionDigits: w.digits })} × ${format.number(h.value, { maximumFractionDigits: h.digits })} ${w.unit}`;
    },
    length: (mm) => shown(lengthFor(mm, system)),
    mass: (g) => shown(massFor(g, system)),
    percent: (ratio, fine = false) => format.number(ratio, fine ? "percentFine" : "percent"),
    count: (n) => format.number(n, "count"),
  };
}
