import { describe, expect, it } from "vitest";
import {
  G_PER_OUNCE,
  G_PER_POUND,
  MM_PER_INCH,
  M_PER_YARD,
  celsiusIntervalToFahrenheit,
  celsiusToFahrenheit,
  fahrenheitIntervalToCelsius,
  fahrenheitToCelsius,
  gramsToOunces,
  gramsToPounds,
  inchesToMm,
  kilogramsToPounds,
  metresToYards,
  mmToInches,
  mmToYards,
  ouncesToGrams,
  poundsToGrams,
  poundsToKilograms,
  yardsToMetres,
  yardsToMm,
} from "@/lib/units";

describe("unit conversions", () => {
  it("uses the exact defined factors (NIST SP 811 App. B; NIST Handbook 44 App. C)", () => {
    expect(MM_PER_INCH).toBe(25.4);
    expect(M_PER_YARD).toBe(0.9144);
    expect(G_PER_POUND).toBe(453.59237);
    expect(G_PER_OUNCE).toBe(28.349523125);
  });

  it("converts cloth widths: 44 in = 1117.6 mm full width, 42 in = 1066.8 mm usable (NIST SP 811 factor; 44/42 in is common practice for quilting cotton)", () => {
    expect(inchesToMm(44)).toBe(1117.6);
    expect(inchesToMm(42)).toBe(1066.8);
    expect(inchesToMm(1)).toBe(25.4);
    expect(mmToInches(1117.6)).toBeCloseTo(44, 12);
  });

  it("converts 17.5 yd to exactly 16.002 m (NIST Handbook 44: 1 yd = 0.9144 m)", () => {
    expect(yardsToMetres(17.5)).toBe(16.002);
    expect(yardsToMm(17.5)).toBe(16002);
    expect(yardsToMm(1)).toBe(inchesToMm(36));
    expect(metresToYards(16.002)).toBeCloseTo(17.5, 12);
    expect(mmToYards(914.4)).toBeCloseTo(1, 12);
  });

  it("converts temperatures by °F = °C × 9/5 + 32 (NIST SP 811)", () => {
    expect(celsiusToFahrenheit(0)).toBe(32);
    expect(celsiusToFahrenheit(100)).toBe(212);
    expect(celsiusToFahrenheit(-40)).toBe(-40);
    expect(celsiusToFahrenheit(60)).toBe(140);
    expect(fahrenheitToCelsius(212)).toBe(100);
    expect(fahrenheitToCelsius(250)).toBeCloseTo(121.111111, 5);
    for (const c of [-17.5, 37, 82.2, 204]) expect(fahrenheitToCelsius(celsiusToFahrenheit(c))).toBeCloseTo(c, 10);
  });

  it("converts masses with 1 lb = 453.59237 g and 1 oz = 1/16 lb (NIST Handbook 44 App. C)", () => {
    expect(poundsToGrams(1)).toBe(453.59237);
    expect(ouncesToGrams(16)).toBe(453.59237);
    expect(ouncesToGrams(1)).toBe(28.349523125);
    expect(gramsToPounds(453.59237)).toBe(1);
    expect(gramsToOunces(28.349523125)).toBeCloseTo(1, 12);
    // 1 kg = 1000 / 28.349 523 125 oz = 35.273 96… oz, from the exact avoirdupois ounce (NIST Handbook 44, Appendix C).
    expect(gramsToOunces(1000)).toBeCloseTo(35.274, 3);
  });

  it("converts temperature intervals by 1 °F = 5/9 K = 5/9 °C, without the 32 offset (NIST SP 811, Appendix B: degree Fahrenheit as a temperature interval = 5/9 K)", () => {
    expect(celsiusIntervalToFahrenheit(50)).toBe(90);
    expect(celsiusIntervalToFahrenheit(1)).toBe(1.8);
    expect(fahrenheitIntervalToCelsius(90)).toBe(50);
    expect(fahrenheitIntervalToCelsius(1)).toBeCloseTo(0.5555556, 7);
    // An interval is the difference of two readings: 212 °F − 122 °F = 90 °F = 100 °C − 50 °C.
    expect(celsiusIntervalToFahrenheit(100 - 50)).toBe(celsiusToFahrenheit(100) - celsiusToFahrenheit(50));
  });

  it("converts kilograms and pounds with 1 lb = 0.45359237 kg (NIST Handbook 44 App. C)", () => {
    expect(poundsToKilograms(1)).toBe(0.45359237);
    expect(poundsToKilograms(100)).toBeCloseTo(45.359237, 12);
    expect(kilogramsToPounds(0.45359237)).toBe(1);
    // 1 kg ≈ 2.20462 lb (from memory; the usual conversion-table figure).
    expect(kilogramsToPounds(1)).toBeCloseTo(2.20462, 5);
  });
});
