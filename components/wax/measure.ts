import { numberInput } from "@/lib/contracts/form-input";
import { celsiusToFahrenheit, gramsToOunces, kilogramsToPounds } from "@/lib/units";
import type { UnitSystem } from "@/lib/contracts/wax";

// The wax room's numbers in the person's units: masses in kg or lb and g or oz, temperatures in °C or °F
// (exact factors, lib/units.ts). Rates (g/m², g/m), areas (m²) and densities (g/cm³) stay metric: the published
// band and the calibration are in those units.

type FormatNumber = (value: number, options: { maximumFractionDigits: number; minimumFractionDigits?: number }) => string;

export const massUnit = (system: UnitSystem) => (system === "imperial" ? "lb" : "kg");
export const smallMassUnit = (system: UnitSystem) => (system === "imperial" ? "oz" : "g");
export const tempUnit = (system: UnitSystem) => (system === "imperial" ? "°F" : "°C");

export const kgIn = (kg: number, system: UnitSystem) => (system === "imperial" ? kilogramsToPounds(kg) : kg);
export const gIn = (g: number, system: UnitSystem) => (system === "imperial" ? gramsToOunces(g) : g);
export const tempIn = (c: number, system: UnitSystem) => (system === "imperial" ? celsiusToFahrenheit(c) : c);

/** "12.35 kg" or "27.23 lb". */
export const kgText = (kg: number, system: UnitSystem, number: FormatNumber, digits = 2) => `${number(kgIn(kg, system), { maximumFractionDigits: digits })} ${massUnit(system)}`;
/** "1 500 g" or "52.9 oz". */
export const gText = (g: number, system: UnitSystem, number: FormatNumber) => `${number(gIn(g, system), { maximumFractionDigits: system === "imperial" ? 1 : 0 })} ${smallMassUnit(system)}`;
/** "72 °C" or "161.6 °F". */
export const tempText = (c: number, system: UnitSystem, number: FormatNumber) => `${number(tempIn(c, system), { maximumFractionDigits: 1 })} ${tempUnit(system)}`;
/** "60–72 °C" or "140–161.6 °F". */
export const rangeText = (minC: number, maxC: number, system: UnitSystem, number: FormatNumber) =>
  `${number(tempIn(minC, system), { maximumFractionDigits: 1 })}–${number(tempIn(maxC, system), { maximumFractionDigits: 1 })} ${tempUnit(system)}`;

/** What a form field shows for a stored value in the person's units (a plain number the form reads back). */
/** A figure as an edit form shows it: in the person's unit, written as their language writes numbers (numberInput). */
export const inputOf = (value: number | null | undefined, convert: (v: number, s: UnitSystem) => number, system: UnitSystem, locale: string, digits = 4) =>
  value === null || value === undefined ? "" : numberInput(convert(value, system), locale, digits);
