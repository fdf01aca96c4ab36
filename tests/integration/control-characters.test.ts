import { count, like } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { stamps } from "@/db/schema";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn, type Session } from "../helpers/http";
import { createLocation, createStampRow, daysFromToday, uniquePrefix } from "../helpers/stamps";

// PostgreSQL text cannot hold NUL, and other control characters are junk in every field people
// read back: each text input refuses them with 400 naming the field, before anything is stored.
const NUL = "\u0000";
const prefix = uniquePrefix("CTL");
const site = `Control site ${prefix}`;
let keeper: Session;
let admin: Session;
let locationId: string;
let stockTakeId: string;

beforeAll(async () => {
  const k = await createUser("keeper");
  keeper = (await signIn(k.email, k.password))!;
  const a = await createUser("admin");
  admin = (await signIn(a.email, a.password))!;
  locationId = (await createLocation(site, "R1-S1")).id;
  await createStampRow({ code: `${prefix}-1`, version: 1 });
  await createStampRow({ code: `${prefix}-OUT`, version: 1 });
  const taken = await api("POST", `/api/v1/stamps/${prefix}-OUT/checkout`, { session: keeper, body: { borrowerName: "Bu Sari", workstation: "Table 2", dueOn: daysFromToday(3) } });
  expect(taken.status).toBe(201);
  stockTakeId = (await api("POST", "/api/v1/stock-takes", { session: keeper, body: { site } })).body.stockTake.id;
});

const newStamp = (extra: Record<string, unknown>) => ({ code: `${prefix}-N${Math.random().toString(36).slice(2, 6)}`, name: "Kawung", widthMm: 200, heightMm: 200, ...extra });
const ours = async () => (await db().select({ n: count() }).from(stamps).where(like(stamps.code, `${prefix}%`)))[0].n;

type Case = [label: string, method: string, path: () => string, body: (() => unknown) | undefined, field: string, who?: () => Session];
const cases: Case[] = [
  ["stamp name", "POST", () => "/api/v1/stamps", () => newStamp({ name: `Kawung${NUL}` }), "name"],
  ["stamp notes", "POST", () => "/api/v1/stamps", () => newStamp({ notes: `a${NUL}b` }), "notes"],
  ["stamp maker", "POST", () => "/api/v1/stamps", () => newStamp({ maker: `Pak${NUL}` }), "maker"],
  ["stamp tags", "POST", () => "/api/v1/stamps", () => newStamp({ tags: ["ok", `bad${NUL}`] }), "tags.1"],
  ["stamp name (an escape character)", "POST", () => "/api/v1/stamps", () => newStamp({ name: "Kawung\u001b[31m" }), "name"],
  ["stamp notes on PATCH", "PATCH", () => `/api/v1/stamps/${prefix}-1`, () => ({ version: 1, notes: `x${NUL}` }), "notes"],
  ["list q", "GET", () => `/api/v1/stamps?q=ka%00wung`, undefined, "q"],
  ["list site", "GET", () => `/api/v1/stamps?site=%00`, undefined, "site"],
  ["list tag", "GET", () => `/api/v1/stamps?tag=a%00`, undefined, "tag"],
  ["export q", "GET", () => `/api/v1/stamps/export?q=%00`, undefined, "q"],
  ["export site", "GET", () => `/api/v1/stamps/export?site=a%00b`, undefined, "site"],
  ["export tag", "GET", () => `/api/v1/stamps/export?tag=%00`, undefined, "tag"],
  ["stamp code in the path", "GET", () => `/api/v1/stamps/AB%00CD`, undefined, "code"],
  ["check-out borrower", "POST", () => `/api/v1/stamps/${prefix}-1/checkout`, () => ({ borrowerName: `Bu${NUL}`, workstation: "T1", dueOn: daysFromToday(2) }), "borrowerName"],
  ["check-out workstation", "POST", () => `/api/v1/stamps/${prefix}-1/checkout`, () => ({ borrowerName: "Bu Sari", workstation: `T${NUL}1`, dueOn: daysFromToday(2) }), "workstation"],
  ["return note", "POST", () => `/api/v1/stamps/${prefix}-OUT/return`, () => ({ note: `ok${NUL}` }), "note"],
  ["damage note", "POST", () => `/api/v1/stamps/${prefix}-1/damage`, () => ({ kind: "other", note: `bent${NUL}` }), "note"],
  ["condition note", "POST", () => `/api/v1/stamps/${prefix}-1/condition`, () => ({ condition: "worn", note: `${NUL}` }), "note"],
  ["location site", "POST", () => "/api/v1/locations", () => ({ site: `Hall${NUL}`, code: "R9" }), "site"],
  ["location description", "POST", () => "/api/v1/locations", () => ({ site, code: "R9", description: `top${NUL}` }), "description"],
  ["location description on PATCH", "PATCH", () => `/api/v1/locations/${locationId}`, () => ({ description: `top${NUL}` }), "description"],
  ["stock-take site", "POST", () => "/api/v1/stock-takes", () => ({ site: `Hall${NUL}` }), "site"],
  ["sighting code", "POST", () => `/api/v1/stock-takes/${stockTakeId}/sightings`, () => ({ code: `${prefix}-1${NUL}`, locationId }), "code"],
  ["token name", "POST", () => "/api/v1/tokens", () => ({ name: `export${NUL}` }), "name"],
  ["invite name", "POST", () => "/api/v1/users", () => ({ email: `ctl-${prefix.toLowerCase()}@capgrid.test`, name: `New${NUL}`, role: "keeper" }), "name", () => admin],
  ["user name on PATCH", "PATCH", () => "/api/v1/users/00000000-0000-4000-8000-000000000000", () => ({ name: `x${NUL}` }), "name", () => admin],
  ["stamp code in the layout body", "POST", () => "/api/v1/layout", () => ({ cloth: { widthMm: 1150, lengthMm: 1000 }, stamp: { code: `AB${NUL}` }, arrangement: "straight" }), "stamp.code"],
  ["outline in the layout body", "POST", () => "/api/v1/layout", () => ({ cloth: { widthMm: 1150, lengthMm: 1000 }, stamp: { widthMm: 200, heightMm: 200, outline: `M0 0${NUL}L1 1Z` }, arrangement: "straight" }), "stamp.outline"],
];

describe("control characters in any text input", () => {
  it.each(cases)("%s: 400 naming the field, nothing stored", async (_label, method, path, body, field, who) => {
    const before = await ours();
    const res = await api(method, path(), { session: who?.() ?? keeper, body: body?.() });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("validation");
    expect(Object.keys(res.body.error.fields)).toContain(field);
    expect(res.body.error.fields[field].join(" ")).toMatch(/control character/i);
    expect(await ours()).toBe(before);
  });

  it("a scan's file name is refused as the scan checks refuse every hidden character in a name (400 badFileName)", async () => {
    for (const path of [`/api/v1/stamps/${prefix}-1/scans/uploads`, `/api/v1/stamps/${prefix}-1/scans`]) {
      const body = path.endsWith("uploads") ? { fileName: `scan${NUL}.png`, sizeBytes: 10 } : { uploadKey: `uploads/${"0".repeat(8)}-0000-4000-8000-${"0".repeat(12)}/${"0".repeat(8)}-0000-4000-8000-${"0".repeat(12)}/${"0".repeat(8)}-0000-4000-8000-${"0".repeat(12)}`, fileName: `scan${NUL}.png`, kind: "print" };
      const res = await api("POST", path, { session: keeper, body });
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe("badFileName");
      expect(res.body.error.message).toMatch(/hidden characters/);
    }
  });

  it("tab, line breaks and ordinary Unicode still pass", async () => {
    const res = await api("POST", "/api/v1/stamps", { session: keeper, body: newStamp({ notes: "Line one\r\nLine two\tindented · ꦧꦠꦶꦏ꧀" }) });
    expect(res.status).toBe(201);
    expect(res.body.stamp.notes).toBe("Line one\r\nLine two\tindented · ꦧꦠꦶꦏ꧀");
  });

  it("a CSV import with a NUL in a cell answers 422 naming the row and column, and imports nothing", async () => {
    const before = await ours();
    const csv = ["code,name,width_mm,height_mm,notes,site,location", `${prefix}-C1,Kawung,200,200,fine,,`, `${prefix}-C2,Parang,200,200,bad${NUL}note,,`, `${prefix}-C3,Truntum,200,200,,${site}${NUL},R1-S1`].join("\n");
    const response = await fetch(`${testEnv().appUrl}/api/v1/stamps/import`, {
      method: "POST",
      headers: { cookie: keeper.cookie, "content-type": "text/csv", accept: "application/json" },
      body: csv,
    });
    expect(response.status).toBe(422);
    const body = await response.json();
    const problems = body.error.rows.map((r: { line: number; column: string; message: string }) => [`${r.line}:${r.column}`, r.message]);
    expect(problems).toEqual(expect.arrayContaining([["3:notes", expect.stringMatching(/control character/i)], ["4:site", expect.stringMatching(/control character/i)]]));
    expect(await ours()).toBe(before);
  });
});
