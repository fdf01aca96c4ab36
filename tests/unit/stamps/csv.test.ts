import { describe, expect, it } from "vitest";
import { parseStampCsv, stampsToCsv, type CsvStamp } from "@/lib/stamps/csv";

const header = "code,name,width_mm,height_mm,tags,notes,mirrored,condition";

describe("reading a stamp CSV", () => {
  it("follows RFC 4180: quoted fields hold commas, doubled quotes and line breaks (RFC 4180, section 2, rules 5–7)", () => {
    const text = `${header}\r\nCP-1,"Kawung, large",200,200,a;b,"said ""mind the handle""\nsecond line",yes,needs repair\r\n`;
    const { rows, problems } = parseStampCsv(text, 100);
    expect(problems).toEqual([]);
    expect(rows).toHaveLength(1);
    expect(rows[0].fields).toMatchObject({
      code: "CP-1",
      name: "Kawung, large",
      widthMm: 200,
      tags: ["a", "b"],
      notes: 'said "mind the handle"\nsecond line',
      mirrored: true,
      condition: "needs_repair",
    });
  });

  it("reads a decimal comma, a byte-order mark and upper-case headers", () => {
    const { rows } = parseStampCsv(`\uFEFFCODE,Name,WIDTH_MM,height_mm\nCP-2,Truntum,"210,5",200\n`, 100);
    expect(rows[0].fields.widthMm).toBe(210.5);
  });

  it("keeps a cell that is not a number as NaN, for the schema to name", () => {
    const { rows } = parseStampCsv(`${header}\nCP-3,x,wide,200,,,,\n`, 100);
    expect(Number.isNaN(rows[0].fields.widthMm)).toBe(true);
  });

  it("names unknown and missing columns on line 1", () => {
    const { problems } = parseStampCsv("code,name,colour\nCP-1,x,red\n", 100);
    expect(problems.map((p) => [p.line, p.key, p.values?.column])).toEqual([
      [1, "validation.csvHeader", "colour"],
      [1, "validation.csvMissingColumn", "width_mm"],
      [1, "validation.csvMissingColumn", "height_mm"],
    ]);
  });

  it("refuses an empty file and too many rows", () => {
    expect(parseStampCsv(`${header}\n`, 10).problems[0].key).toBe("validation.csvEmpty");
    const many = `${header}\n${Array.from({ length: 11 }, (_, i) => `C-${i},x,100,100,,,,`).join("\n")}`;
    expect(parseStampCsv(many, 10).problems[0]).toMatchObject({ key: "validation.csvTooManyRows", values: { max: 10 } });
  });

  it("counts lines from the header, so row errors point at the spreadsheet's own row numbers", () => {
    const { rows } = parseStampCsv(`${header}\nA,x,1,1,,,,\n\nB,y,2,2,,,,\n`, 100);
    expect(rows.map((r) => [r.fields.code, r.line])).toEqual([
      ["A", 2],
      ["B", 3],
    ]);
  });
});

const sample: CsvStamp = {
  code: "CP-9",
  name: "=HYPERLINK(\"x\")",
  widthMm: 200,
  heightMm: 180.5,
  stripDepthMm: null,
  weightG: 900,
  face: "pair",
  mirrored: true,
  twinCode: "CP-10",
  maker: "Bengkel Sido",
  madeOn: "1988-04-01",
  condition: "worn",
  site: "North",
  location: "R1-S2",
  coverageRatio: 0.35,
  impressionsCount: 1200,
  tags: ["border", "kawung"],
  notes: "bent corner, fixed",
  outlinePath: null,
  checkedOutTo: null,
  workstation: null,
  dueOn: null,
  updatedAt: "2026-01-01T00:00:00.000Z",
};

describe("writing a stamp CSV", () => {
  it("round-trips through the reader", () => {
    const { rows, problems } = parseStampCsv(stampsToCsv([sample]), 10);
    expect(problems).toEqual([]);
    expect(rows[0]).toMatchObject({
      site: "North",
      location: "R1-S2",
      fields: { code: "CP-9", name: sample.name, heightMm: 180.5, mirrored: true, twinCode: "CP-10", tags: ["border", "kawung"], notes: "bent corner, fixed", coverageRatio: 0.35 },
    });
  });

  it("defuses cells a spreadsheet would run as formulas (OWASP: CSV injection)", () => {
    const text = stampsToCsv([sample]);
    expect(text).toContain(`"'=HYPERLINK(""x"")"`);
    expect(text.split("\r\n")[0]).toMatch(/^code,name,width_mm,height_mm/);
  });
});
