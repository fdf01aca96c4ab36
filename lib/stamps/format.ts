import { gramsToOunces, mmToInches } from "@/lib/units";

/**
 * Numbers for display in the user's unit system. Stored values are mm and g; imperial shows
 * inches (1 in = 25.4 mm exactly) and ounces (1 oz = 28.349 523 125 g). Pure.
 */
export type UnitSystem = "metric" | "imperial";

export interface Shown {
  value: number;
  unit: "mm" | "cm" | "in" | "g" | "kg" | "oz";
  /** Digits after the decimal point worth showing. */
  digits: number;
}

export function lengthFor(mm: number, system: UnitSystem): Shown {
  return system === "imperial" ? { value: mmToInches(mm), unit: "in", digits: 2 } : { value: mm, unit: "mm", digits: 1 };
}

export function massFor(g: number, system: UnitSystem): Shown {
  if (system === "imperial") return { value: gramsToOunces(g), unit: "oz", digits: 1 };
  return g >= 1000 ? { value: g / 1000, unit: "kg", digits: 2 } : { value: g, unit: "g", digits: 0 };
}

/**
 * The number a form shows in a length field, in the person's units (4 decimals in inches, so 0.1 mm
 * survives a round trip); the form writes it in the person's language (numberInput in lib/contracts/form-input.ts).
 */
export function lengthInput(mm: number | null | undefined, system: UnitSystem): number | null {
  if (mm === null || mm === undefined) return null;
  return system === "imperial" ? Number(mmToInches(mm).toFixed(4)) : mm;
}

export function massInput(g: number | null | undefined, system: UnitSystem): number | null {
  if (g === null || g === undefined) return null;
  return system === "imperial" ? Number(gramsToOunces(g).toFixed(2)) : g;
}

/** A location as people read it: "site · code" (history entries, pickers, labels and the record). */
export function locationLabel(location: { site: string; code: string }): string;
export function locationLabel(location: { site: string; code: string } | null | undefined): string | null;
export function locationLabel(location: { site: string; code: string } | null | undefined): string | null {
  return location ? `${location.site} · ${location.code}` : null;
}
