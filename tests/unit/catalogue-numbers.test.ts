import { parse, TYPE, type MessageFormatElement } from "@formatjs/icu-messageformat-parser";
import { describe, expect, it } from "vitest";
import { catalogueFiles } from "@/lib/i18n/messages";
import { translator } from "@/lib/i18n/translator";
import { catalogueLeaves } from "../helpers/source-files";

// ICU shows a number given to a plain argument `{n}` as JavaScript writes it (String(n): "1200.5"), not as the
// reader's language does. So an argument that carries a number is written `{n, number}` (or a plural's `#`),
// and then next-intl's formatter writes 1.200,5 in Indonesian. The arguments below carry text (names, codes,
// dates and sizes the code has already formatted); any other plain argument is taken for a number and refused.
const textArguments = new Set([
  "actor", "borrower", "code", "codes", "column", "condition", "due", "dueOn", "email", "expected", "field", "fileName",
  "from", "inviter", "keys", "kind", "location", "material", "materials", "message", "method", "name", "names", "note",
  "now", "options", "outAt", "owner", "place", "seenAt", "problem", "ratio", "reason", "recorded", "reporter", "role", "roles",
  "setting", "site", "size", "source", "status", "tag", "timeZone", "to", "type", "typed", "newWax", "perMetre", "unit", "until", "url", "when",
  "workstation",
  // the wax room's quantities, written by format.number and the unit helpers before they reach the message
  // the plans' lengths, names and dates, written before they reach the message
  "area", "band", "changes", "fromOn", "forWhom", "group", "hours", "keeper", "kodi", "left", "length", "path", "perPiece", "perPieceImpressions",
  "pieceLength", "motif", "plan", "plans", "requester", "right", "state", "stamps", "today", "twin", "untilOn", "who", "width", "yards", "gap",
  // the motif archive's names, dates and lists
  "date", "face", "fields", "file", "uses",
  // the overview: a day, a temperature and a colour written before they reach the message
  "lastOn", "temp", "colour",
  // production runs: the stage numbers a refusal lists ("2, 4")
  "stages",
  // production runs' screens: masses written by the unit helpers, a stage's label
  "estimated", "used", "wax", "label", "runs",
  // a run's stage work: masses written by measures() before they reach the message, and a colour's name
  "recovered", "before", "after", "added", "colour",
  "amount", "cloth", "currency", "day", "density", "flash", "grams", "level", "limit", "metres", "onHand", "price", "rate", "recipe", "se",
]);

function plainArguments(elements: MessageFormatElement[], out: string[] = []): string[] {
  for (const el of elements) {
    if (el.type === TYPE.argument) out.push(el.value);
    if (el.type === TYPE.select || el.type === TYPE.plural) for (const option of Object.values(el.options)) plainArguments(option.value, out);
    if (el.type === TYPE.tag) plainArguments(el.children, out);
  }
  return out;
}

/**
 * Text that reads ", number": a branch of a plural or select is text already, so `one {is, number}` shows
 * "is, number" on screen. Such a word wants no number format.
 */
function wordsTakenForNumbers(elements: MessageFormatElement[], out: string[] = []): string[] {
  for (const el of elements) {
    if (el.type === TYPE.literal) for (const m of el.value.matchAll(/([\p{L}\p{N}_-]+), number\b/gu)) out.push(m[1]);
    if (el.type === TYPE.select || el.type === TYPE.plural) for (const option of Object.values(el.options)) wordsTakenForNumbers(option.value, out);
    if (el.type === TYPE.tag) wordsTakenForNumbers(el.children, out);
  }
  return out;
}

describe("numbers in messages", () => {
  it.each(["en", "id"] as const)("go through the number format in %s", (language) => {
    const problems: string[] = [];
    for (const [key, message] of catalogueLeaves(Object.assign({}, ...catalogueFiles[language]))) {
      for (const name of plainArguments(parse(message))) if (!textArguments.has(name)) problems.push(`${key}: {${name}} → {${name}, number}, or add "${name}" to the text arguments`);
    }
    expect(problems).toEqual([]);
  });

  it.each(["en", "id"] as const)("keep the words of plural branches as words in %s", (language) => {
    const problems: string[] = [];
    for (const [key, message] of catalogueLeaves(Object.assign({}, ...catalogueFiles[language]))) {
      for (const name of wordsTakenForNumbers(parse(message))) problems.push(`${key}: "${name}, number" is text in a branch: write "${name}"`);
    }
    expect(problems).toEqual([]);
  });

  it("come out in the reader's language", () => {
    // CLDR: Indonesian writes a decimal comma and a dot for thousands.
    expect(translator("id")("validation.tooSmall", { min: 1200.5 })).toContain("1.200,5");
    expect(translator("en")("validation.tooSmall", { min: 1200.5 })).toContain("1,200.5");
    expect(translator("id")("validation.numberAsWritten", { example: 1200.5 })).toContain("1.200,5");
  });

  it("catch a branch's word written as a number argument", () => {
    expect(wordsTakenForNumbers(parse("{count, plural, one {is, number} other {# are}}"))).toEqual(["is"]);
    expect(wordsTakenForNumbers(parse("{count, plural, one {# is} other {{total, number} are}}, {n, number}"))).toEqual([]);
  });

  it("are caught when written as a plain argument", () => {
    expect(plainArguments(parse("At least {min} mm, {count, plural, other {# stamps of {name}}}"))).toEqual(["min", "name"]);
  });
});
