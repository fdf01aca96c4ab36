/**
 * Unit conversions for display (values are stored in mm and g). The factors are exact by definition
 * (NIST SP 811, Appendix B; NIST Handbook 44, Appendix C): 1 in = 25.4 mm, 1 yd = 0.9144 m,
 * 1 lb (avoirdupois) = 453.592 37 g, 1 oz = 1/16 lb; °F = °C × 9/5 + 32; a temperature interval of
 * 1 °F = 5/9 °C (no offset: margins and spreads convert without the 32).
 * Lengths are scaled through integer ratios (254/10, 9144/10) so that decimal results such as
 * 17.5 yd = 16.002 m come out as the nearest double to the exact value.
 */

export const MM_PER_INCH = 25.4;
export const MM_PER_YARD = 914.4;
export const M_PER_YARD = 0.9144;
export const INCHES_PER_YARD = 36;
export const G_PER_POUND = 453.59237;
export const OUNCES_PER_POUND = 16;
export const G_PER_OUNCE = G_PER_POUND / OUNCES_PER_POUND;

/** Inches → mm: in × 25.4 (exact). */
export function inchesToMm(inches: number): number {
  return (inches * 254) / 10;
}

/** mm → inches: mm / 25.4. */
export function mmToInches(mm: number): number {
  return (mm * 10) / 254;
}

/** Yards → mm: yd × 914.4 (exact). */
export function yardsToMm(yards: number): number {
  return (yards * 9144) / 10;
}

/** mm → yards: mm / 914.4. */
export function mmToYards(mm: number): number {
  return (mm * 10) / 9144;
}

/** Yards → metres: yd × 0.9144 (exact). */
export function yardsToMetres(yards: number): number {
  return (yards * 9144) / 10000;
}

/** Metres → yards: m / 0.9144. */
export function metresToYards(metres: number): number {
  return (metres * 10000) / 9144;
}

/** °C → °F: °C × 9/5 + 32. */
export function celsiusToFahrenheit(celsius: number): number {
  return (celsius * 9) / 5 + 32;
}

/** °F → °C: (°F − 32) × 5/9. */
export function fahrenheitToCelsius(fahrenheit: number): number {
  return ((fahrenheit - 32) * 5) / 9;
}

/** Temperature interval °C → °F: Δ°C × 9/5 (a difference, so no 32 offset). */
export function celsiusIntervalToFahrenheit(celsius: number): number {
  return (celsius * 9) / 5;
}

/** Temperature interval °F → °C: Δ°F × 5/9 (a difference, so no 32 offset). */
export function fahrenheitIntervalToCelsius(fahrenheit: number): number {
  return (fahrenheit * 5) / 9;
}

/** Kilograms → avoirdupois pounds: kg × 1000 / 453.592 37. */
export function kilogramsToPounds(kilograms: number): number {
  return (kilograms * 1000) / G_PER_POUND;
}

/** Avoirdupois pounds → kilograms: lb × 0.453 592 37 (exact). */
export function poundsToKilograms(pounds: number): number {
  return (pounds * G_PER_POUND) / 1000;
}

/** Grams → avoirdupois ounces: g / 28.349 523 125. */
export function gramsToOunces(grams: number): number {
  return (grams * OUNCES_PER_POUND) / G_PER_POUND;
}

/** Avoirdupois ounces → grams: oz × 28.349 523 125 (exact). */
export function ouncesToGrams(ounces: number): number {
  return (ounces * G_PER_POUND) / OUNCES_PER_POUND;
}

/** Grams → avoirdupois pounds: g / 453.592 37. */
export function gramsToPounds(grams: number): number {
  return grams / G_PER_POUND;
}

/** Avoirdupois pounds → grams: lb × 453.592 37 (exact). */
export function poundsToGrams(pounds: number): number {
  return pounds * G_PER_POUND;
}
