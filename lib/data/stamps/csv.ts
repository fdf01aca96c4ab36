import "server-only";
import { inArray } from "drizzle-orm";
import { db } from "@/db";
import { locations, stamps } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { columnOfField, parseStampCsv, stampsToCsv, type CsvRowProblem } from "@/lib/stamps/csv";
import { AppError, issueMessage, type MessageRef } from "@/lib/errors";
import { controlCharacterIssues, parseInput } from "@/lib/validation/parse";
import { createStampSchema, type CreateStampInput, type StampListQuery, type UpdateStampInput } from "@/lib/validation/stamps";
import { listCheckouts } from "./checkouts";
import { createStamp, updateStamp } from "./edit";
import { listAllStamps } from "./list";
import type { ImportResult } from "@/lib/contracts/stamps";

export const importLimits = { maxRows: 20_000, maxBytes: 5 * 1024 * 1024 } as const;

/** The stamps the list filters select, as CSV (columns in lib/stamps/csv.ts). */
export async function exportStampsCsv(actor: Actor, query: Partial<StampListQuery>): Promise<string> {
  assertCan(actor, "data:read");
  const [rows, out] = await Promise.all([listAllStamps(actor, query), listCheckouts(actor)]);
  const outByCode = new Map(out.map((c) => [c.stampCode, c]));
  return stampsToCsv(
    rows.map((s) => ({
      code: s.code,
      name: s.name,
      widthMm: s.widthMm,
      heightMm: s.heightMm,
      stripDepthMm: s.stripDepthMm,
      weightG: s.weightG,
      face: s.face,
      mirrored: s.mirrored,
      twinCode: s.twinCode,
      maker: s.maker,
      madeOn: s.madeOn,
      condition: s.condition,
      site: s.location?.site ?? null,
      location: s.location?.code ?? null,
      coverageRatio: s.coverageRatio,
      impressionsCount: s.impressionsCount,
      tags: s.tags,
      notes: s.notes,
      outlinePath: s.outlinePath,
      checkedOutTo: outByCode.get(s.code)?.borrowerName ?? null,
      workstation: outByCode.get(s.code)?.workstation ?? null,
      dueOn: outByCode.get(s.code)?.dueOn ?? null,
      updatedAt: s.updatedAt,
    })),
  );
}

/** One problem of a file, before translation: the error body (lib/error-body.ts) translates it. */
export interface ImportProblem {
  line: number;
  column: string | null;
  message: MessageRef;
}

/** The file's problems as one 422: nothing was stored; `error.rows` lists them by line. */
function importInvalid(problems: ImportProblem[]): AppError {
  const rows = [...problems].sort((a, b) => a.line - b.line);
  return new AppError("importInvalid", { count: new Set(rows.map((p) => p.line)).size }, undefined, { rows });
}

interface ReadyRow {
  line: number;
  input: CreateStampInput;
  /** The fields the file's columns carry: an update changes only these. */
  present: Set<string>;
}

/**
 * Imports stamps from CSV: a row whose code exists updates that stamp (only the columns the file
 * has), any other row adds a stamp. Every row is checked first; one bad row and nothing is stored.
 * All changes run in one transaction, so a failure while storing also leaves everything as it was.
 */
export async function importStampsCsv(actor: Actor, text: string, options: { dryRun: boolean }): Promise<ImportResult> {
  assertCan(actor, "stamps:write");
  const problems: ImportProblem[] = [];
  const report = (p: CsvRowProblem) => problems.push({ line: p.line, column: p.column, message: { key: p.key, values: p.values ?? {} } });

  const parsed = parseStampCsv(text, importLimits.maxRows);
  parsed.problems.forEach(report);
  if (problems.length) throw importInvalid(problems);

  const locationRows = await db.select().from(locations);
  const locationKey = (site: string, code: string) => `${site.trim().toLowerCase()}\u0000${code.trim().toUpperCase()}`;
  const locationByKey = new Map(locationRows.map((l) => [locationKey(l.site, l.code), l]));

  const ready: ReadyRow[] = [];
  const lineOfCode = new Map<string, number>();
  for (const row of parsed.rows) {
    const raw: Record<string, unknown> = { ...row.fields };
    const present = new Set(Object.keys(row.fields));
    let rowOk = true;
    // site and location are looked up, not parsed by the schema: their cells get the same control-character rule.
    const cells = controlCharacterIssues({ site: row.site, location: row.location });
    if (parsed.columns.includes("location") && cells.length === 0) {
      present.add("locationId");
      raw.locationId = null;
      if (row.location && !row.site) {
        report({ line: row.line, column: "site", key: "validation.siteRequired" });
        rowOk = false;
      } else if (row.location && row.site) {
        const location = locationByKey.get(locationKey(row.site, row.location));
        if (location) raw.locationId = location.id;
        else {
          report({ line: row.line, column: "location", key: "validation.locationUnknown" });
          rowOk = false;
        }
      }
    }
    delete raw.site;
    delete raw.location;
    const result = parseInput(createStampSchema, raw);
    if (!result.success || cells.length) {
      for (const issue of [...cells, ...(result.success ? [] : result.error.issues)]) {
        const field = issue.path.length ? String(issue.path[0]) : null;
        problems.push({ line: row.line, column: field ? columnOfField(field) : null, message: issueMessage(issue) });
      }
      continue;
    }
    if (!rowOk) continue;
    const earlier = lineOfCode.get(result.data.code);
    if (earlier !== undefined) {
      report({ line: row.line, column: "code", key: "validation.csvDuplicateCode", values: { row: earlier } });
      continue;
    }
    lineOfCode.set(result.data.code, row.line);
    ready.push({ line: row.line, input: result.data, present });
  }

  const codes = ready.map((r) => r.input.code);
  const twinCodes = [...new Set(ready.map((r) => r.input.twinCode).filter((c): c is string => !!c && !lineOfCode.has(c)))];
  const [existingRows, twinRows] = await Promise.all([
    codes.length ? db.select({ code: stamps.code }).from(stamps).where(inArray(stamps.code, codes)) : [],
    twinCodes.length ? db.select({ code: stamps.code }).from(stamps).where(inArray(stamps.code, twinCodes)) : [],
  ]);
  const existing = new Set(existingRows.map((r) => r.code));
  const knownTwins = new Set(twinRows.map((r) => r.code));
  for (const row of ready) {
    const twin = row.input.twinCode;
    if (twin && !lineOfCode.has(twin) && !knownTwins.has(twin)) report({ line: row.line, column: "twin_code", key: "validation.twinUnknown" });
  }
  if (problems.length) throw importInvalid(problems);

  const created = ready.filter((r) => !existing.has(r.input.code)).length;
  if (options.dryRun) return { ok: true, dryRun: true, rows: ready.length, created, updated: ready.length - created };

  // Throwing inside the transaction rolls every stored row back.
  await db.transaction(async (tx) => {
    const apply = async (row: ReadyRow, work: () => Promise<unknown>) => {
      try {
        await work();
      } catch (error) {
        if (!(error instanceof AppError)) throw error;
        // Our own checks fail before any statement runs, so the transaction is still usable.
        const fields = Object.entries(error.fields ?? {});
        const message = { key: `errors.${error.code}`, values: error.params };
        if (fields.length) for (const [field] of fields) problems.push({ line: row.line, column: columnOfField(field), message });
        else problems.push({ line: row.line, column: null, message });
      }
    };
    // First every stamp exists, then twins link, so a pair may arrive in the same file.
    for (const row of ready) {
      const { twinCode: _twin, ...input } = row.input;
      void _twin;
      if (existing.has(row.input.code)) {
        // An import names a starting count for new stamps only: an existing stamp's count grows by the work it does.
        const patch = Object.fromEntries(Object.entries(input).filter(([k]) => row.present.has(k) && k !== "impressionsCount")) as Partial<UpdateStampInput>;
        await apply(row, () => updateStamp(actor, row.input.code, { ...patch, version: 0 }, { ignoreVersion: true, tx }));
      } else {
        await apply(row, () => createStamp(actor, { ...input, twinCode: null }, tx));
      }
    }
    // A pair named from one side only stays linked: the other row's empty twin_code does not undo it.
    const namedAsTwin = new Set(ready.map((r) => r.input.twinCode).filter(Boolean));
    for (const row of ready) {
      if (!row.present.has("twinCode") || (!row.input.twinCode && namedAsTwin.has(row.input.code))) continue;
      await apply(row, () => updateStamp(actor, row.input.code, { twinCode: row.input.twinCode ?? null, version: 0 }, { ignoreVersion: true, tx }));
    }
    if (problems.length) throw importInvalid(problems);
  });
  return { ok: true, dryRun: false, rows: ready.length, created, updated: ready.length - created };
}
