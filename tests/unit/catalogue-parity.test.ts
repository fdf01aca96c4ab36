import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { parse, TYPE, type MessageFormatElement } from "@formatjs/icu-messageformat-parser";
import { describe, expect, it } from "vitest";
import { catalogueFiles } from "@/lib/i18n/messages";

// The Indonesian catalogue must mirror the English one file by file and key by key, and every
// message must take the same arguments, so code that formats a key works in both languages.
// Messages are parsed with the ICU MessageFormat parser that next-intl's formatter uses.

const root = "lib/i18n/messages";
type Language = "en" | "id";

const jsonFiles = (language: Language) =>
  readdirSync(join(root, language))
    .filter((name) => name.endsWith(".json"))
    .sort();
const load = (language: Language, file: string): unknown => JSON.parse(readFileSync(join(root, language, file), "utf8"));

/** Every leaf of a catalogue tree by its dotted key. */
function leaves(tree: unknown, prefix = "", out = new Map<string, unknown>()): Map<string, unknown> {
  if (tree !== null && typeof tree === "object" && !Array.isArray(tree)) {
    for (const [key, value] of Object.entries(tree)) leaves(value, prefix ? `${prefix}.${key}` : key, out);
  } else out.set(prefix, tree);
  return out;
}

interface Shape {
  /** Argument names, rich-text tag names marked "<tag>". */
  names: Set<string>;
  /** Arguments whose value appears in the text (plain, number, date, or `#` in a plural's `other`). */
  shown: Set<string>;
  /** Arguments shown through a number format (`{n, number}` or a plural's `#`). */
  asNumber: Set<string>;
  /** Arguments formatted as a date or time. */
  asDate: Set<string>;
  /** Select arguments and their option keys. */
  selects: Map<string, string[]>;
  /** Plural arguments and the selectors of each of their occurrences. */
  plurals: { name: string; ordinal: boolean; selectors: string[] }[];
}

/** Whether a plural's branch shows its own number (`#` not inside a nested plural). */
function hasPound(elements: MessageFormatElement[]): boolean {
  return elements.some(
    (el) =>
      el.type === TYPE.pound ||
      (el.type === TYPE.select && Object.values(el.options).some((o) => hasPound(o.value))) ||
      (el.type === TYPE.tag && hasPound(el.children)),
  );
}

function shapeOf(elements: MessageFormatElement[], shape: Shape = { names: new Set(), shown: new Set(), asNumber: new Set(), asDate: new Set(), selects: new Map(), plurals: [] }): Shape {
  for (const el of elements) {
    switch (el.type) {
      case TYPE.argument:
        shape.names.add(el.value);
        shape.shown.add(el.value);
        break;
      case TYPE.number:
        shape.names.add(el.value);
        shape.shown.add(el.value);
        shape.asNumber.add(el.value);
        break;
      case TYPE.date:
      case TYPE.time:
        shape.names.add(el.value);
        shape.shown.add(el.value);
        shape.asDate.add(el.value);
        break;
      case TYPE.select:
        shape.names.add(el.value);
        shape.selects.set(el.value, Object.keys(el.options).sort());
        for (const option of Object.values(el.options)) shapeOf(option.value, shape);
        break;
      case TYPE.plural:
        shape.names.add(el.value);
        shape.plurals.push({ name: el.value, ordinal: el.pluralType === "ordinal", selectors: Object.keys(el.options) });
        if (el.options.other && hasPound(el.options.other.value)) {
          shape.shown.add(el.value);
          shape.asNumber.add(el.value);
        }
        for (const option of Object.values(el.options)) shapeOf(option.value, shape);
        break;
      case TYPE.tag:
        shape.names.add(`<${el.value}>`);
        shapeOf(el.children, shape);
        break;
      default:
        break;
    }
  }
  return shape;
}

const sorted = (set: Iterable<string>) => [...set].sort();
const minus = (a: Iterable<string>, b: Set<string>) => [...a].filter((x) => !b.has(x)).sort();
const pluralCategories = (language: Language, ordinal: boolean) =>
  new Set<string>(new Intl.PluralRules(language, { type: ordinal ? "ordinal" : "cardinal" }).resolvedOptions().pluralCategories);

/** What differs between the English and the Indonesian form of one message (empty when they agree). */
function compareShapes(en: Shape, id: Shape): string[] {
  const problems: string[] = [];
  if (sorted(en.names).join() !== sorted(id.names).join()) {
    problems.push(`placeholders differ: en {${sorted(en.names).join(", ")}}, id {${sorted(id.names).join(", ")}}`);
  }
  for (const name of minus(en.shown, id.shown)) problems.push(`English shows {${name}}, Indonesian does not`);
  for (const name of minus(en.asNumber, id.asNumber)) problems.push(`{${name}} is a formatted number in English (number or plural with #), not in Indonesian`);
  for (const name of minus(en.asDate, id.asDate)) problems.push(`{${name}} is a date or time in English, not in Indonesian`);
  for (const name of new Set([...en.selects.keys(), ...id.selects.keys()])) {
    const a = en.selects.get(name)?.join(", ");
    const b = id.selects.get(name)?.join(", ");
    if (a !== b) problems.push(`select {${name}} options differ: en [${a ?? "not a select"}], id [${b ?? "not a select"}]`);
  }
  return problems;
}

/** Plural selectors the language's plural rules never choose (an `one` branch in Indonesian, a typo). */
function unreachableSelectors(shape: Shape, language: Language): string[] {
  return shape.plurals.flatMap(({ name, ordinal, selectors }) => {
    const categories = pluralCategories(language, ordinal);
    return selectors.filter((s) => !/^=\d+$/.test(s) && !categories.has(s)).map((s) => `{${name}, plural} branch "${s}" is never chosen in ${language}`);
  });
}

const enFiles = jsonFiles("en");

describe("Indonesian catalogue beside the English one", () => {
  it("has the same files", () => {
    expect({ missingInId: minus(enFiles, new Set(jsonFiles("id"))), extraInId: minus(jsonFiles("id"), new Set(enFiles)) }).toEqual({ missingInId: [], extraInId: [] });
  });

  it("registers both languages' files in the same order in messages.ts", () => {
    expect(catalogueFiles.id).toHaveLength(catalogueFiles.en.length);
    catalogueFiles.en.forEach((file, index) => expect(Object.keys(catalogueFiles.id[index]), `file ${index}`).toEqual(Object.keys(file)));
  });

  describe.each(enFiles)("%s", (file) => {
    const en = leaves(load("en", file));
    const id = leaves(load("id", file));

    it("has exactly the English keys", () => {
      expect({ missing: minus(en.keys(), new Set(id.keys())), extra: minus(id.keys(), new Set(en.keys())) }).toEqual({ missing: [], extra: [] });
    });

    it("holds only strings", () => {
      const notText = (m: Map<string, unknown>, language: Language) => [...m].filter(([, v]) => typeof v !== "string").map(([k]) => `${language} ${k}`);
      expect([...notText(en, "en"), ...notText(id, "id")]).toEqual([]);
    });

    it("is valid ICU MessageFormat in both languages, with the same placeholders", () => {
      const problems: string[] = [];
      const parsed = (language: Language, key: string, message: unknown): Shape | null => {
        if (typeof message !== "string") return null;
        try {
          return shapeOf(parse(message));
        } catch (error) {
          problems.push(`${language} ${key}: ${error instanceof Error ? error.message : String(error)}`);
          return null;
        }
      };
      for (const [key, enMessage] of en) {
        const enShape = parsed("en", key, enMessage);
        const idShape = id.has(key) ? parsed("id", key, id.get(key)) : null;
        if (enShape) problems.push(...unreachableSelectors(enShape, "en").map((p) => `en ${key}: ${p}`));
        if (idShape) problems.push(...unreachableSelectors(idShape, "id").map((p) => `id ${key}: ${p}`));
        if (enShape && idShape) problems.push(...compareShapes(enShape, idShape).map((p) => `${key}: ${p}`));
      }
      for (const [key, idMessage] of id) if (!en.has(key)) parsed("id", key, idMessage);
      expect(problems).toEqual([]);
    });
  });
});

describe("the parity checks themselves", () => {
  const shape = (message: string) => shapeOf(parse(message));

  it("find a renamed, dropped or added placeholder", () => {
    expect(compareShapes(shape("Hello {name}"), shape("Halo {nama}"))[0]).toMatch(/placeholders differ/);
    expect(compareShapes(shape("{a} and {b}"), shape("{a}"))[0]).toMatch(/placeholders differ/);
    expect(compareShapes(shape("Saved."), shape("Tersimpan {when}."))[0]).toMatch(/placeholders differ/);
  });

  it("find a number that Indonesian no longer shows or formats", () => {
    expect(compareShapes(shape("{count, plural, one {# row} other {# rows}}"), shape("{count, plural, other {baris}}"))).toContain("English shows {count}, Indonesian does not");
    expect(compareShapes(shape("Coverage {r, number, ::percent}"), shape("Tutupan {r}"))).toEqual(["{r} is a formatted number in English (number or plural with #), not in Indonesian"]);
    expect(compareShapes(shape("{count, plural, one {# stamp} other {# stamps}}"), shape("{count, plural, other {# cap}}"))).toEqual([]);
    expect(compareShapes(shape("{n} new {n, plural, one {stamp} other {stamps}}"), shape("{n} cap baru"))).toEqual([]);
  });

  it("find select options that differ", () => {
    expect(compareShapes(shape("{kind, select, print {Print} face {Face} other {Scan}}"), shape("{kind, select, print {Cetakan} other {Pindaian}}"))[0]).toMatch(/select \{kind\} options differ/);
  });

  it("find plural branches a language never chooses", () => {
    expect(unreachableSelectors(shape("{n, plural, one {# cap} other {# cap}}"), "id")).toEqual(['{n, plural} branch "one" is never chosen in id']);
    expect(unreachableSelectors(shape("{n, plural, =0 {kosong} =1 {satu} other {# cap}}"), "id")).toEqual([]);
    expect(unreachableSelectors(shape("{n, plural, one {# stamp} ones {# stamps} other {# stamps}}"), "en")).toEqual(['{n, plural} branch "ones" is never chosen in en']);
  });

  it("refuse broken ICU syntax", () => {
    expect(() => parse("{count, plural, one {# row}}")).toThrow();
    expect(() => parse("Unclosed {name")).toThrow();
  });
});
