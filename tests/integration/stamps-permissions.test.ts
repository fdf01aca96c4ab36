import { count, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { checkouts, damageReports, locations, stamps, type Role } from "@/db/schema";
import { can, roles } from "@/lib/permissions";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn, type Session } from "../helpers/http";
import { createLocation, createStampRow, daysFromToday, openCheckouts, reloadStamp, uniquePrefix } from "../helpers/stamps";

// SPEC section 2: keepers and admins create and edit stamps and locations, check stamps out and
// in, and move them through repairs; everyone reads and may report damage. Each write a role may
// not make answers 403 and leaves the database as it was.
const sessions = {} as Record<Role, Session>;
const prefix = uniquePrefix("PM");
const site = `Perm site ${prefix}`;
let shelf: Awaited<ReturnType<typeof createLocation>>;

beforeAll(async () => {
  for (const role of roles) {
    const user = await createUser(role);
    sessions[role] = (await signIn(user.email, user.password))!;
  }
  shelf = await createLocation(site, "R1-S1");
});

const stampCount = async () => (await db().select({ n: count() }).from(stamps))[0].n;
const locationCount = async () => (await db().select({ n: count() }).from(locations))[0].n;

describe.each(roles)("as %s", (role) => {
  const writes = can(role, "stamps:write");
  const session = () => sessions[role];
  const code = (label: string) => `${prefix}-${role.slice(0, 3).toUpperCase()}-${label}`;

  it("reads the list, a record, its history, the locations and the check-outs", async () => {
    const stamp = await createStampRow({ code: code("READ"), locationId: shelf.id });
    for (const path of [`/api/v1/stamps?q=${prefix}`, `/api/v1/stamps/${stamp.code}`, `/api/v1/stamps/${stamp.code}/history`, "/api/v1/locations", "/api/v1/checkouts"]) {
      const res = await api("GET", path, { session: session() });
      expect(res.status, path).toBe(200);
    }
  });

  it(`POST /api/v1/stamps is ${writes ? "allowed" : "403 and adds nothing"}`, async () => {
    const before = await stampCount();
    const res = await api("POST", "/api/v1/stamps", { session: session(), body: { code: code("NEW"), name: "Kawung small", widthMm: 180, heightMm: 180 } });
    expect(res.status).toBe(writes ? 201 : 403);
    expect(await stampCount()).toBe(before + (writes ? 1 : 0));
    if (writes) expect(res.body.stamp.code).toBe(code("NEW"));
    else expect(res.body.error.code).toBe("forbidden");
  });

  it(`PATCH /api/v1/stamps/{code} is ${writes ? "allowed" : "403 and changes nothing"}`, async () => {
    const stamp = await createStampRow({ code: code("EDIT") });
    const res = await api("PATCH", `/api/v1/stamps/${stamp.code}`, { session: session(), body: { name: `Renamed by ${role}`, version: stamp.version } });
    expect(res.status).toBe(writes ? 200 : 403);
    const after = await reloadStamp(stamp.code);
    expect(after!.name).toBe(writes ? `Renamed by ${role}` : stamp.name);
    expect(after!.version).toBe(stamp.version + (writes ? 1 : 0));
  });

  it(`DELETE /api/v1/stamps/{code} is ${writes ? "allowed" : "403 and keeps the stamp"}`, async () => {
    const stamp = await createStampRow({ code: code("DEL") });
    const res = await api("DELETE", `/api/v1/stamps/${stamp.code}`, { session: session() });
    expect(res.status).toBe(writes ? 204 : 403);
    expect(await reloadStamp(stamp.code)).toEqual(writes ? undefined : stamp);
  });

  it(`check-out and return are ${writes ? "allowed" : "403 and record nothing"}`, async () => {
    const stamp = await createStampRow({ code: code("OUT") });
    const out = await api("POST", `/api/v1/stamps/${stamp.code}/checkout`, {
      session: session(),
      body: { borrowerName: "Wulan", workstation: "Table 3", dueOn: daysFromToday(7) },
    });
    expect(out.status).toBe(writes ? 201 : 403);
    expect(await openCheckouts(stamp.id)).toHaveLength(writes ? 1 : 0);

    if (!writes) {
      // Put one out directly, so the return is refused for the role and not for want of a check-out.
      await db().insert(checkouts).values({ stampId: stamp.id, borrowerName: "Wulan", workstation: "Table 3", dueOn: daysFromToday(7) });
    }
    const back = await api("POST", `/api/v1/stamps/${stamp.code}/return`, { session: session(), body: {} });
    expect(back.status).toBe(writes ? 200 : 403);
    expect(await openCheckouts(stamp.id)).toHaveLength(writes ? 0 : 1);
  });

  it("may report damage", async () => {
    const stamp = await createStampRow({ code: code("DMG") });
    const res = await api("POST", `/api/v1/stamps/${stamp.code}/damage`, { session: session(), body: { kind: "loose_handle", note: `seen by ${role}` } });
    expect(res.status).toBe(201);
    const reports = await db().select().from(damageReports).where(eq(damageReports.stampId, stamp.id));
    expect(reports).toHaveLength(1);
  });

  it(`condition changes are ${writes ? "allowed" : "403 and change nothing"}`, async () => {
    const stamp = await createStampRow({ code: code("COND") });
    const res = await api("POST", `/api/v1/stamps/${stamp.code}/condition`, { session: session(), body: { condition: "needs_repair" } });
    expect(res.status).toBe(writes ? 200 : 403);
    expect((await reloadStamp(stamp.code))!.condition).toBe(writes ? "needs_repair" : "sound");
  });

  it(`locations: create, rename, delete are ${writes ? "allowed" : "403 and change nothing"}`, async () => {
    const before = await locationCount();
    const res = await api("POST", "/api/v1/locations", { session: session(), body: { site, code: `${role}-1` } });
    expect(res.status).toBe(writes ? 201 : 403);
    expect(await locationCount()).toBe(before + (writes ? 1 : 0));

    const target = await createLocation(site, `${role}-T`);
    const patch = await api("PATCH", `/api/v1/locations/${target.id}`, { session: session(), body: { description: "by the window" } });
    expect(patch.status).toBe(writes ? 200 : 403);
    const del = await api("DELETE", `/api/v1/locations/${target.id}`, { session: session() });
    expect(del.status).toBe(writes ? 204 : 403);
    const [left] = await db().select().from(locations).where(eq(locations.id, target.id));
    if (writes) expect(left).toBeUndefined();
    else expect(left.description).toBeNull();
  });

  it(`CSV: export is allowed; import is ${writes ? "allowed" : "403 and adds nothing"}`, async () => {
    const exported = await fetch(`${testEnv().appUrl}/api/v1/stamps/export?q=${prefix}`, { headers: { cookie: session().cookie } });
    expect(exported.status).toBe(200);
    const before = await stampCount();
    const imported = await fetch(`${testEnv().appUrl}/api/v1/stamps/import`, {
      method: "POST",
      headers: { cookie: session().cookie, "content-type": "text/csv" },
      body: `code,name,width_mm,height_mm\n${code("CSV")},Imported,200,200\n`,
    });
    expect(imported.status).toBe(writes ? 200 : 403);
    expect(await stampCount()).toBe(before + (writes ? 1 : 0));
  });

  it(`stock-takes: reading is allowed; starting one is ${writes ? "allowed" : "403"}`, async () => {
    expect((await api("GET", "/api/v1/stock-takes", { session: session() })).status).toBe(200);
    await createLocation(`${site} ${role}`, "C1");
    const res = await api("POST", "/api/v1/stock-takes", { session: session(), body: { site: `${site} ${role}` } });
    expect(res.status).toBe(writes ? 201 : 403);
    if (writes) expect((await api("GET", `/api/v1/stock-takes/${res.body.stockTake.id}`, { session: sessions.planner })).status).toBe(200);
  });

  it(`overdue reminders are ${writes ? "sent" : "403"}`, async () => {
    const res = await api("POST", "/api/v1/checkouts/reminders", { session: session() });
    expect(res.status).toBe(writes ? 200 : 403);
  });
});

describe("without a session", () => {
  it("every stamp route answers 401 in JSON and changes nothing", async () => {
    const stamp = await createStampRow({ code: `${prefix}-ANON` });
    const before = await stampCount();
    for (const [method, path, body] of [
      ["GET", "/api/v1/stamps", undefined],
      ["POST", "/api/v1/stamps", { code: `${prefix}-ANON2`, name: "x", widthMm: 100, heightMm: 100 }],
      ["GET", `/api/v1/stamps/${stamp.code}`, undefined],
      ["PATCH", `/api/v1/stamps/${stamp.code}`, { name: "x", version: 1 }],
      ["DELETE", `/api/v1/stamps/${stamp.code}`, undefined],
      ["GET", `/api/v1/stamps/${stamp.code}/history`, undefined],
      ["POST", `/api/v1/stamps/${stamp.code}/checkout`, { borrowerName: "x", workstation: "y", dueOn: daysFromToday(1) }],
      ["POST", `/api/v1/stamps/${stamp.code}/return`, {}],
      ["POST", `/api/v1/stamps/${stamp.code}/damage`, { kind: "other", note: "x" }],
      ["POST", `/api/v1/stamps/${stamp.code}/condition`, { condition: "retired" }],
      ["GET", "/api/v1/locations", undefined],
      ["POST", "/api/v1/locations", { site: "x", code: "y" }],
      ["GET", "/api/v1/checkouts", undefined],
      ["POST", "/api/v1/checkouts/reminders", undefined],
      ["GET", "/api/v1/stamps/export", undefined],
      ["POST", "/api/v1/stamps/import", undefined],
      ["GET", "/api/v1/stock-takes", undefined],
      ["POST", "/api/v1/stock-takes", { site }],
    ] as const) {
      const res = await api(method, path, body === undefined ? {} : { body });
      expect(res.status, `${method} ${path}`).toBe(401);
      expect(res.body.error.code).toBe("unauthenticated");
    }
    expect(await stampCount()).toBe(before);
    expect(await reloadStamp(stamp.code)).toEqual(stamp);
  });

  it("a revoked or unknown API token is refused too, and a valid one acts with its owner's role", async () => {
    const created = await api("POST", "/api/v1/tokens", { session: sessions.planner, body: { name: "planner script" } });
    const token = created.body.token.secret as string;
    expect((await api("GET", "/api/v1/stamps", { token })).status).toBe(200);
    expect((await api("POST", "/api/v1/stamps", { token, body: { code: `${prefix}-TOK`, name: "x", widthMm: 100, heightMm: 100 } })).status).toBe(403);
    expect((await api("GET", "/api/v1/stamps", { token: "cg_not-a-real-token" })).status).toBe(401);
  });
});
