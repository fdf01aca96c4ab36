import { describe, expect, it } from "vitest";
import { numberInput, numberSymbols, readNumber } from "@/lib/contracts/form-input";
import { locales } from "@/lib/i18n/config";
import { seededUniform } from "@/scripts/lib/seeded-random";

// Numbers in forms are read as the person's language writes them. The signs come from Intl (the CLDR data of
// the JavaScript engine), and the round trips below check readNumber against Intl.NumberFormat's own output.

describe("numbers typed in a form", () => {
  it("uses the signs CLDR gives each language: Indonesian writes 1.200,5, English 1,200.5", () => {
    expect(numberSymbols("id")).toEqual({ decimal: ",", group: "." });
    expect(numberSymbols("en")).toEqual({ decimal: ".", group: "," });
  });

  it.each([
    ["id", "120,5", 120.5],
    ["id", "1.200,5", 1200.5],
    ["id", "1.200", 1200],
    ["id", "12.345.678,25", 12345678.25],
    ["id", "0,125", 0.125],
    ["id", ",5", 0.5],
    ["id", "-3,5", -3.5],
    ["id", "−3,5", -3.5],
    ["id", "1 200,5", 1200.5],
    ["id", "1\u00a0200,5", 1200.5],
    ["id", " 42 ", 42],
    ["en", "120.5", 120.5],
    ["en", "1,200.5", 1200.5],
    ["en", "1,200", 1200],
    ["en", "1.200", 1.2],
    ["en", "0.125", 0.125],
    ["en", ".5", 0.5],
    ["en", "+7", 7],
  ] as const)("%s reads %j as %d", (locale, typed, value) => {
    expect(readNumber(typed, locale)).toBe(value);
  });

  it.each([
    // The other language's decimal sign where no thousands group can stand: refused, not read ten times too big.
    ["id", "120.5"],
    ["id", "1.20"],
    ["id", "1.2345"],
    ["en", "120,5"],
    ["en", "1,20"],
    // Thousands signs only between whole groups of three, the decimal sign once.
    ["id", "0.125"],
    ["id", "12.34.567"],
    ["id", "1,2,3"],
    ["id", "1..200"],
    ["en", "1,200,5"],
    ["en", "1.2.3"],
    ["id", "12,"],
    ["en", "1e3"],
    ["en", "Infinity"],
    ["en", "0x10"],
    ["id", "wide"],
    ["id", "-"],
    ["en", ","],
  ] as const)("%s refuses %j", (locale, typed) => {
    expect(readNumber(typed, locale)).toBeNaN();
  });

  it("gives null for an empty field", () => {
    expect(readNumber("", "id")).toBeNull();
    expect(readNumber("   ", "en")).toBeNull();
  });

  it("reads back exactly what Intl.NumberFormat writes, with and without thousands signs, in every language", () => {
    const random = seededUniform(12);
    for (const locale of locales) {
      for (let i = 0; i < 500; i++) {
        const value = Math.round((random() - 0.3) * 10 ** (1 + Math.floor(random() * 7)) * 1000) / 1000;
        for (const useGrouping of [true, false]) {
          const written = new Intl.NumberFormat(locale, { useGrouping, maximumFractionDigits: 3 }).format(value);
          expect(readNumber(written, locale), `${locale} ${written}`).toBe(value);
        }
      }
    }
  });

  it("shows a number for editing in the person's language, so readNumber reads it back", () => {
    expect(numberInput(120.5, "id")).toBe("120,5");
    expect(numberInput(1200.5, "id")).toBe("1200,5");
    expect(numberInput(1200.5, "en")).toBe("1200.5");
    expect(numberInput(8.2677, "id", 2)).toBe("8,27");
    expect(numberInput(null, "id")).toBe("");
    for (const v of [0.1, 205.5, 12345.6789]) for (const locale of locales) expect(readNumber(numberInput(v, locale), locale)).toBe(v);
  });
});
