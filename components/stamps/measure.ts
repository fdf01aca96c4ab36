import { lengthFor, massFor, type UnitSystem } from "@/lib/stamps/format";

type FormatNumber = (value: number, options: { maximumFractionDigits: number }) => string;

/** "210 × 200 mm" or "8.27 × 7.87 in", with the locale's number format. */
export function sizeText(widthMm: number, heightMm: number, system: UnitSystem, number: FormatNumber): string {
  const w = lengthFor(widthMm, system);
  const h = lengthFor(heightMm, system);
  const f = (v: number, digits: number) => number(v, { maximumFractionDigits: digits });
  return `${f(w.value, w.digits)} × ${f(h.value, h.digits)} ${w.unit}`;
}

export function lengthText(mm: number, system: UnitSystem, number: FormatNumber): string {
  const l = lengthFor(mm, system);
  return `${number(l.value, { maximumFractionDigits: l.digits })} ${l.unit}`;
}

export function massText(g: number, system: UnitSystem, number: FormatNumber): string {
  const m = massFor(g, system);
  return `${number(m.value, { maximumFractionDigits: m.digits })} ${m.unit}`;
}
