import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { messagesFor } from "@/lib/i18n/messages";

// lib/i18n/glossary.md is the list of words both catalogues follow. These checks keep it usable
// (well-formed rows, one row per term) and keep the catalogues to it (no avoided synonym in the
// Indonesian text; condition, role and damage names exactly as the glossary gives them).

interface Row {
  line: number;
  term: string;
  indonesian: string;
  english: string;
  note: string;
}

const glossary = readFileSync("lib/i18n/glossary.md", "utf8");
const header = "| term | Indonesian | English | note |";

function tableRows(text: string): { rows: Row[]; malformed: string[] } {
  const rows: Row[] = [];
  const malformed: string[] = [];
  text.split("\n").forEach((raw, index) => {
    const line = raw.trim();
    if (!line.startsWith("|") || line === header || /^\|[-| ]+\|$/.test(line)) return;
    const cells = line.slice(1, -1).split("|").map((c) => c.trim());
    if (cells.length !== 4 || !cells[0] || !cells[1] || !cells[2]) malformed.push(`line ${index + 1}: ${line}`);
    else rows.push({ line: index + 1, term: cells[0], indonesian: cells[1], english: cells[2], note: cells[3] });
  });
  return { rows, malformed };
}

const { rows, malformed } = tableRows(glossary);

/** The backticked words after "Avoid:" in a note. */
const avoided = (note: string) => [...(note.match(/Avoid:(.*)$/)?.[1] ?? "").matchAll(/`([^`]+)`/g)].map((m) => m[1]);

/** Indonesian words of a row: the cell itself and each " / " alternative, without parenthesised glosses. */
const indonesianTerms = (row: Row) => {
  const plain = row.indonesian.replace(/\s*\([^)]*\)/g, "").trim();
  return [plain, ...plain.split(" / ")].map((t) => t.trim().toLowerCase()).filter(Boolean);
};

function strings(tree: unknown, prefix = ""): [string, string][] {
  if (typeof tree === "string") return [[prefix, tree]];
  if (tree && typeof tree === "object") return Object.entries(tree).flatMap(([k, v]) => strings(v, prefix ? `${prefix}.${k}` : k));
  return [];
}

const wholeWord = (word: string) => new RegExp(`(?<![\\p{L}\\p{N}_-])${word.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}(?![\\p{L}\\p{N}_-])`, "iu");

/**
 * A finder for the avoided words in a text. It leaves out URL paths and, for each word, the
 * glossary terms that contain it (`lilin` is avoided, `lilin lebah` is a term).
 */
function avoidedFinder(words: string[], terms: string[]): (text: string) => string[] {
  const checks = words.map((word) => {
    const pattern = wholeWord(word);
    const containing = terms.filter((t) => t !== word.toLowerCase() && pattern.test(t)).map((t) => new RegExp(wholeWord(t).source, "giu"));
    return { word, pattern, containing };
  });
  return (text) => {
    const plain = text.toLowerCase().replace(/(^|\s)\/[\w/.-]+/g, " ");
    return checks.filter(({ pattern, containing }) => pattern.test(containing.reduce((rest, term) => rest.replace(term, " "), plain))).map((c) => c.word);
  };
}

const avoidedIn = (text: string, words: string[], terms: string[]) => avoidedFinder(words, terms)(text);

const byLength = (a: string, b: string) => b.length - a.length;
const allTerms = [...new Set(rows.flatMap(indonesianTerms))].sort(byLength);
const avoidList = [...new Set(rows.flatMap((r) => avoided(r.note)))];

describe("glossary", () => {
  it("is a set of well-formed four-column tables", () => {
    expect(rows.length).toBeGreaterThan(150);
    expect(malformed).toEqual([]);
    expect(glossary.split("\n").filter((l) => l.trim().startsWith("| term")).every((l) => l.trim() === header)).toBe(true);
  });

  it("names each term once", () => {
    const seen = new Map<string, number>();
    const twice = rows.filter((r) => (seen.has(r.term) ? true : (seen.set(r.term, r.line), false))).map((r) => `${r.term} (lines ${seen.get(r.term)} and ${r.line})`);
    expect(twice).toEqual([]);
  });

  it("keeps the trade's own words", () => {
    const indonesian = new Set(rows.flatMap(indonesianTerms));
    for (const word of ["cap", "canting", "malam", "mori", "kodi", "tubruk", "ondo-ende", "parang", "mubeng", "lorod", "pinggiran", "tukang cap", "isen-isen"]) {
      expect(indonesian.has(word), word).toBe(true);
    }
  });

  it("never avoids a word that is itself a glossary term", () => {
    const terms = new Set(allTerms);
    expect(avoidList.filter((w) => terms.has(w.toLowerCase()))).toEqual([]);
  });

  it("finds an avoided word, but not inside a longer glossary term", () => {
    expect(avoidedIn("Masukkan lilin ke wajan.", ["lilin"], allTerms)).toEqual(["lilin"]);
    expect(avoidedIn("Campur lilin lebah dan parafin.", ["lilin"], allTerms)).toEqual([]);
    expect(avoidedIn("Lewat API (POST /api/v1/layout).", ["layout"], allTerms)).toEqual([]);
    expect(avoidedIn("Buka sandi.", ["sandi"], allTerms)).toEqual(["sandi"]);
    expect(avoidedIn("Kata sandi baru", ["sandi"], allTerms)).toEqual([]);
    // Shorter terms inside an avoided phrase do not hide it.
    expect(avoidedIn("Buka Ruang malam.", ["ruang malam"], allTerms)).toEqual(["ruang malam"]);
    expect(avoidedIn("Tanya pengecap.", ["pengecap"], allTerms)).toEqual(["pengecap"]);
    expect(avoidedIn("Isi lembar kerja.", ["lembar kerja"], allTerms)).toEqual(["lembar kerja"]);
    expect(avoidedIn("Cetak lembar kerja cap.", ["lembar kerja"], allTerms)).toEqual([]);
  });
});

describe("Indonesian catalogue follows the glossary", () => {
  const id = strings(messagesFor("id"));
  const en = strings(messagesFor("en"));

  it("uses none of the avoided synonyms", () => {
    expect(avoidList.length).toBeGreaterThan(40);
    const find = avoidedFinder(avoidList, allTerms);
    const found = id.flatMap(([key, text]) => find(text).map((w) => `${key}: "${w}"`));
    expect(found).toEqual([]);
  });

  it("names conditions, roles and damage kinds as the glossary does, in both languages", () => {
    const lookup = (pairs: [string, string][]) => new Map(pairs);
    const idText = lookup(id);
    const enText = lookup(en);
    const keysFor = (term: string) => [`stamps.conditions.${term}`, `roles.${term}.name`, `stamps.damageKinds.${term}`];
    const checked: string[] = [];
    const wrong: string[] = [];
    for (const row of rows) {
      const code = row.term.match(/^`([a-z_]+)`$/)?.[1];
      if (!code) continue;
      for (const key of keysFor(code).filter((k) => idText.has(k))) {
        checked.push(key);
        if (idText.get(key) !== row.indonesian) wrong.push(`${key}: id "${idText.get(key)}", glossary "${row.indonesian}"`);
        if (enText.get(key) !== row.english) wrong.push(`${key}: en "${enText.get(key)}", glossary "${row.english}"`);
      }
    }
    expect(wrong).toEqual([]);
    // 5 conditions, 5 roles, 5 damage kinds.
    expect(checked).toHaveLength(15);
  });
});
