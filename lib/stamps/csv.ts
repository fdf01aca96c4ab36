import Papa from "papaparse";

/**
 * The CSV form of the stamp library: one stamp per row, lengths in mm, masses in g, dates
 * YYYY-MM-DD, tags separated by semicolons, the location as site + location code.
 * Pure: text in, plain objects out (the data layer validates and stores).
 */

/** Columns the import reads, in the order the export writes them, with the field each fills. */
export const csvColumns = [
  ["code", "code"],
  ["name", "name"],
  ["width_mm", "widthMm"],
  ["height_mm", "heightMm"],
  ["strip_depth_mm", "stripDepthMm"],
  ["weight_g", "weightG"],
  ["face", "face"],
  ["mirrored", "mirrored"],
  ["twin_code", "twinCode"],
  ["maker", "maker"],
  ["made_on", "madeOn"],
  ["condition", "condition"],
  ["site", "site"],
  ["location", "location"],
  ["coverage_ratio", "coverageRatio"],
  ["impressions_count", "impressionsCount"],
  ["tags", "tags"],
  ["notes", "notes"],
  ["outline_path", "outlinePath"],
] as const;

/** Written by the export for people to read; the import accepts and ignores them. */
export const csvReadOnlyColumns = ["checked_out_to", "workstation", "due_on", "updated_at"] as const;
export const csvRequiredColumns = ["code", "name", "width_mm", "height_mm"] as const;

const fieldToColumn = new Map<string, string>(csvColumns.map(([column, field]) => [field, column]));
const columnToField = new Map<string, string>(csvColumns.map(([column, field]) => [column, field]));
export const columnOfField = (field: string) => fieldToColumn.get(field) ?? (field === "locationId" ? "location" : field);

const numberFields = new Set(["widthMm", "heightMm", "stripDepthMm", "weightG", "coverageRatio", "impressionsCount"]);
const textFields = new Set(["name", "maker", "notes", "tags", "twinCode", "site", "location"]);

export interface CsvRowProblem {
  /** The line in the file (the header is line 1). */
  line: number;
  column: string | null;
  key: string;
  values?: Record<string, string | number>;
}

export interface ParsedCsvRow {
  line: number;
  /** Values typed for the stamp schema; site and location stay as text for the data layer. */
  fields: Record<string, unknown>;
  site: string | null;
  location: string | null;
}

/** Spreadsheets run cells that start with these as formulas; the export defuses them with a quote (OWASP: CSV injection). */
const formulaStart = /^[=+\-@\t\r]/;
const defuse = (text: string) => (formulaStart.test(text) ? `'${text}` : text);
const undefuse = (text: string) => (/^'[=+\-@\t\r]/.test(text) ? text.slice(1) : text);

function parseNumber(cell: string): number | null {
  if (cell === "") return null;
  // A decimal comma, as Indonesian and many European spreadsheets write it.
  const normal = /^-?\d+,\d+$/.test(cell) ? cell.replace(",", ".") : cell;
  return /^-?(\d+\.?\d*|\.\d+)(e-?\d+)?$/i.test(normal) ? Number(normal) : Number.NaN;
}

function parseBoolean(cell: string): boolean | string {
  const v = cell.toLowerCase();
  if (v === "" || ["no", "false", "0", "n"].includes(v)) return false;
  if (["yes", "true", "1", "y"].includes(v)) return true;
  return cell;
}

const enumValue = (cell: string) => cell.trim().toLowerCase().replace(/[\s-]+/g, "_");

/** Reads the file. Header and structure problems come back as problems; rows as typed fields. */
export function parseStampCsv(text: string, maxRows: number): { rows: ParsedCsvRow[]; problems: CsvRowProblem[]; columns: string[] } {
  const problems: CsvRowProblem[] = [];
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ""), {
    header: true,
    skipEmptyLines: "greedy",
    transformHeader: (h) => h.trim().toLowerCase(),
  });
  const header = parsed.meta.fields ?? [];
  const known = new Set<string>([...columnToField.keys(), ...csvReadOnlyColumns]);
  for (const column of header) if (column && !known.has(column)) problems.push({ line: 1, column, key: "validation.csvHeader", values: { column } });
  for (const column of csvRequiredColumns) if (!header.includes(column)) problems.push({ line: 1, column, key: "validation.csvMissingColumn", values: { column } });
  if (problems.length) return { rows: [], problems, columns: header };
  if (parsed.data.length === 0) return { rows: [], problems: [{ line: 1, column: null, key: "validation.csvEmpty" }], columns: header };
  if (parsed.data.length > maxRows) return { rows: [], problems: [{ line: 1, column: null, key: "validation.csvTooManyRows", values: { max: maxRows } }], columns: header };

  // Papaparse counts data rows from 0; a quoted cell may span lines, so keep its own row index.
  const broken = new Map<number, string>();
  for (const error of parsed.errors) if (error.row !== undefined) broken.set(error.row, error.message);

  const rows: ParsedCsvRow[] = [];
  parsed.data.forEach((record, index) => {
    const line = index + 2;
    if (broken.has(index)) {
      problems.push({ line, column: null, key: "validation.csvBroken", values: { reason: broken.get(index)! } });
      return;
    }
    const fields: Record<string, unknown> = {};
    let site: string | null = null;
    let location: string | null = null;
    for (const [column, field] of csvColumns) {
      if (!(column in record)) continue;
      const raw = undefuse((record[column] ?? "").trim());
      if (field === "site") site = raw || null;
      else if (field === "location") location = raw || null;
      else if (numberFields.has(field)) {
        const n = parseNumber(raw);
        if (n !== null || !["widthMm", "heightMm"].includes(field)) fields[field] = n;
        if (n === null && field === "impressionsCount") fields[field] = 0;
      } else if (field === "mirrored") fields[field] = parseBoolean(raw);
      else if (field === "tags") fields[field] = raw.split(/[;|]/).map((t) => t.trim()).filter(Boolean);
      else if (field === "face" || field === "condition") {
        if (raw !== "") fields[field] = enumValue(raw);
      } else if (field === "code" || field === "name") fields[field] = raw;
      else fields[field] = raw === "" ? null : raw;
    }
    rows.push({ line, fields, site, location });
  });
  return { rows, problems, columns: header };
}

export interface CsvStamp {
  code: string;
  name: string;
  widthMm: number;
  heightMm: number;
  stripDepthMm: number | null;
  weightG: number | null;
  face: string;
  mirrored: boolean;
  twinCode: string | null;
  maker: string | null;
  madeOn: string | null;
  condition: string;
  site: string | null;
  location: string | null;
  coverageRatio: number | null;
  impressionsCount: number;
  tags: string[];
  notes: string | null;
  outlinePath: string | null;
  checkedOutTo: string | null;
  workstation: string | null;
  dueOn: string | null;
  updatedAt: string;
}

/** The export: every column the import reads, then the read-only ones. */
export function stampsToCsv(stamps: CsvStamp[]): string {
  const fields = [...csvColumns.map(([column]) => column), ...csvReadOnlyColumns];
  const data = stamps.map((s) => {
    const values: Record<string, unknown> = { ...s, tags: s.tags.join(";"), mirrored: s.mirrored ? "yes" : "no" };
    const row: string[] = [];
    for (const [, field] of csvColumns) {
      const value = values[field];
      const text = value === null || value === undefined ? "" : String(value);
      row.push(textFields.has(field) ? defuse(text) : text);
    }
    row.push(defuse(s.checkedOutTo ?? ""), defuse(s.workstation ?? ""), s.dueOn ?? "", s.updatedAt);
    return row;
  });
  return Papa.unparse({ fields, data }, { newline: "\r\n" });
}
