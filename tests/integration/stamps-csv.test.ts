import { count, eq, inArray, like } from "drizzle-orm";
import Papa from "papaparse";
import { beforeAll, describe, expect, it } from "vitest";
import { stampEvents, stamps } from "@/db/schema";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { type Session, signIn } from "../helpers/http";
import { createLocation, createStampRow, reloadStamp, uniquePrefix } from "../helpers/stamps";

let keeper: Session;
let planner: Session;
const prefix = uniquePrefix("CSV");
const site = `Csv site ${prefix}`;

beforeAll(async () => {
  const k = await createUser("keeper");
  keeper = (await signIn(k.email, k.password))!;
  const p = await createUser("planner");
  planner = (await signIn(p.email, p.password))!;
  await createLocation(site, "R1-S1");
  await createLocation(site, "R1-S2");
});

async function send(session: Session, csv: string, options: { dryRun?: boolean; type?: string } = {}) {
  const response = await fetch(`${testEnv().appUrl}/api/v1/stamps/import${options.dryRun ? "?dryRun=true" : ""}`, {
    method: "POST",
    headers: { cookie: session.cookie, "content-type": options.type ?? "text/csv", accept: "application/json" },
    body: csv,
  });
  return { status: response.status, body: await response.json() };
}

const ours = async () => (await db().select({ n: count() }).from(stamps).where(like(stamps.code, `${prefix}%`)))[0].n;
const header = "code,name,width_mm,height_mm,face,twin_code,mirrored,condition,site,location,tags";

describe("CSV import", () => {
  it("reports every bad row with its line and column, and imports nothing", async () => {
    const existing = await createStampRow({ code: `${prefix}-OLD`, name: "Untouched" });
    const before = await ours();
    const csv = [
      header,
      `${prefix}-A1,Kawung,200,200,single,,no,sound,${site},R1-S1,kawung`,
      `${prefix}-A2,,200,wide,single,,no,sound,${site},R1-S1,`,
      `${prefix}-A3,Parang,200,200,single,,maybe,shiny,${site},R9-S9,`,
      `${prefix}-A1,Again,200,200,single,,no,sound,,,`,
      `${prefix}-OLD,Renamed,200,200,pair,NO-SUCH-TWIN,no,sound,,,`,
    ].join("\n");
    const res = await send(keeper, csv);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe("importInvalid");
    expect(res.body.error.message).toMatch(/4 rows have errors.*Nothing was changed/);
    const problems = res.body.error.rows.map((r: { line: number; column: string }) => `${r.line}:${r.column}`);
    expect(problems).toEqual(expect.arrayContaining(["3:name", "3:height_mm", "4:mirrored", "4:condition", "4:location", "5:code", "6:twin_code"]));
    expect(res.body.error.rows.find((r: { line: number; column: string }) => r.line === 5).message).toMatch(/appears twice.*row 2/);
    expect(await ours()).toBe(before);
    expect((await reloadStamp(existing.code))!.name).toBe("Untouched");
  });

  it("rolls back every row when one fails while being stored", async () => {
    // The file is well-formed, but the existing stamp may not jump from sound to in repair:
    // that is found only while storing, after the first row was already added.
    const existing = await createStampRow({ code: `${prefix}-PATH` });
    const before = await ours();
    const csv = [header, `${prefix}-B1,Ceplok,200,200,single,,no,sound,${site},R1-S1,`, `${existing.code},Ceplok old,200,200,single,,no,in repair,${site},R1-S1,`].join("\n");
    const res = await send(keeper, csv);
    expect(res.status).toBe(422);
    expect(res.body.error.rows).toEqual([expect.objectContaining({ line: 3, column: "condition" })]);
    expect(await ours()).toBe(before);
    expect(await reloadStamp(`${prefix}-B1`)).toBeUndefined();
    const after = await reloadStamp(existing.code);
    expect(after).toMatchObject({ name: existing.name, condition: "sound", version: existing.version });
  });

  it("checks without storing on a dry run, then adds and updates; a pair may arrive in one file", async () => {
    const existing = await createStampRow({ code: `${prefix}-UPD`, name: "Old name", tags: ["keep"], condition: "worn" });
    const csv = [
      header,
      `${prefix}-C1,Truntum front,210,210,pair,${prefix}-C2,no,sound,${site},R1-S1,truntum;main`,
      `${prefix}-C2,Truntum back,210,210,pair,${prefix}-C1,yes,sound,${site},R1-S2,truntum;main`,
      `${existing.code},New name,200,200,single,,no,worn,${site},R1-S2,keep`,
    ].join("\r\n");
    const dry = await send(keeper, csv, { dryRun: true });
    expect(dry.status).toBe(200);
    expect(dry.body.import).toEqual({ ok: true, dryRun: true, rows: 3, created: 2, updated: 1 });
    expect(await reloadStamp(`${prefix}-C1`)).toBeUndefined();

    const res = await send(keeper, csv);
    expect(res.status).toBe(200);
    expect(res.body.import).toMatchObject({ created: 2, updated: 1 });
    const c1 = (await reloadStamp(`${prefix}-C1`))!;
    const c2 = (await reloadStamp(`${prefix}-C2`))!;
    expect(c1.twinId).toBe(c2.id);
    expect(c2.twinId).toBe(c1.id);
    expect(c2.mirrored).toBe(true);
    expect(c1.tags).toEqual(["truntum", "main"]);
    const updated = (await reloadStamp(existing.code))!;
    expect(updated).toMatchObject({ name: "New name", condition: "worn", tags: ["keep"] });
    const kinds = (await db().select().from(stampEvents).where(eq(stampEvents.stampId, updated.id))).map((e) => e.kind).sort();
    expect(kinds).toEqual(["edited", "moved"]);
  });

  it("an update touches only the columns the file has", async () => {
    const existing = await createStampRow({ code: `${prefix}-PART`, name: "Kept", maker: "Pak Harjo", condition: "worn", tags: ["a"] });
    const res = await send(keeper, `code,name,width_mm,height_mm\n${existing.code},Kept,250,250\n`);
    expect(res.status).toBe(200);
    expect(await reloadStamp(existing.code)).toMatchObject({ widthMm: 250, maker: "Pak Harjo", condition: "worn", tags: ["a"] });
  });

  it("refuses another content type (415), an oversized body (413) and a planner (403)", async () => {
    expect((await send(keeper, `${header}\n`, { type: "application/json" })).status).toBe(415);
    const big = `${header}\n${"x".repeat(5 * 1024 * 1024 + 10)}`;
    expect((await send(keeper, big)).status).toBe(413);
    const before = await ours();
    expect((await send(planner, `${header}\n${prefix}-P1,x,100,100,single,,no,sound,,,\n`)).status).toBe(403);
    expect(await ours()).toBe(before);
  });
});

describe("CSV export", () => {
  it("respects the filters and reads back unchanged", async () => {
    const tag = `exp-${prefix.toLowerCase()}`;
    await createStampRow({ code: `${prefix}-E1`, name: "=cmd()", tags: [tag], widthMm: 180.5 });
    await createStampRow({ code: `${prefix}-E2`, name: "Lereng", tags: [tag], condition: "retired" });
    await createStampRow({ code: `${prefix}-E3`, name: "Other", tags: ["other"] });
    const response = await fetch(`${testEnv().appUrl}/api/v1/stamps/export?tag=${tag}&condition=sound`, { headers: { cookie: planner.cookie } });
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toMatch(/text\/csv/);
    expect(response.headers.get("content-disposition")).toMatch(/attachment; filename="stamps-\d{4}-\d{2}-\d{2}\.csv"/);
    const text = await response.text();
    const rows = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ""), { header: true, skipEmptyLines: true }).data;
    expect(rows.map((r) => r.code)).toEqual([`${prefix}-E1`]);
    expect(rows[0]).toMatchObject({ name: "'=cmd()", width_mm: "180.5", condition: "sound", tags: tag });

    // Importing the export again changes nothing (no history entries beyond what was there).
    const ids = (await db().select({ id: stamps.id }).from(stamps).where(eq(stamps.code, `${prefix}-E1`))).map((r) => r.id);
    const back = await send(keeper, text);
    expect(back.status).toBe(200);
    expect(back.body.import).toMatchObject({ created: 0, updated: 1 });
    expect(await db().select().from(stampEvents).where(inArray(stampEvents.stampId, ids))).toHaveLength(0);
    expect((await reloadStamp(`${prefix}-E1`))!.name).toBe("=cmd()");
  });
});
