import { count, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { motifStamps, newStampRequests, stamps } from "@/db/schema";
import { can, roles, type Role } from "@/lib/permissions";
import { createUser, db } from "../helpers/db";
import { api, signIn, type Session } from "../helpers/http";
import { latestMailTo } from "../helpers/mail";
import { createStampRow, uniquePrefix } from "../helpers/stamps";

// New-stamp requests from a motif (designers) and from the fit helper (planners): who may ask, what is refused
// beside its field, the keepers' mail, and turning a request into the stamp record in one transaction.
const prefix = uniquePrefix("NS");
const sessions = {} as Record<Role, Session>;
const people = {} as Record<Role, { email: string; name: string }>;

beforeAll(async () => {
  for (const role of roles) {
    const u = await createUser(role);
    people[role] = u;
    sessions[role] = (await signIn(u.email, u.password))!;
  }
});

const requestCount = async () => (await db().select({ n: count() }).from(newStampRequests))[0].n;

async function motifWithMain(tag: string) {
  const main = await createStampRow({ code: `${prefix}-${tag}-M` });
  const res = await api("POST", "/api/v1/motifs", { session: sessions.designer, body: { name: `${prefix} ${tag}`, stamps: [{ code: main.code, role: "main" }] } });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return { motif: res.body.motif as { id: string; version: number }, main };
}

const ask = (role: Role, body: Record<string, unknown>) => api("POST", "/api/v1/new-stamp-requests", { session: sessions[role], body });

describe("asking for a new stamp from a motif", () => {
  it.each(roles)("%s: allowed only with stamps:requestNew; the keepers are e-mailed", async (role) => {
    const { motif } = await motifWithMain(`ASK${role.slice(0, 3).toUpperCase()}`);
    const before = await requestCount();
    const res = await ask(role, { widthMm: 120, heightMm: 80, motifId: motif.id, role: "border", note: `${prefix} ${role}` });
    if (!can(role, "stamps:requestNew")) {
      expect(res.status).toBe(403);
      expect(await requestCount()).toBe(before);
      return;
    }
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.request).toMatchObject({ state: "open", motif: { id: motif.id }, role: "border", widthMm: 120, heightMm: 80, stamp: null });
    const mail = await latestMailTo(people.keeper.email, new RegExp(`${people[role].name} asks for a new stamp`));
    expect(mail.text).toContain(`${prefix} ASK`);
    expect(mail.text).toContain("border");
  });

  it("refuses a role without a motif, an unknown role or motif, beside the field, and stores nothing", async () => {
    const before = await requestCount();
    const noMotif = await ask("designer", { widthMm: 100, heightMm: 100, role: "corner" });
    expect(noMotif.status).toBe(400);
    expect(noMotif.body.error.fields.motifId).toBeDefined();
    const badRole = await ask("designer", { widthMm: 100, heightMm: 100, motifId: crypto.randomUUID(), role: "centre" });
    expect(badRole.status).toBe(400);
    expect(badRole.body.error.fields.role).toBeDefined();
    const unknown = await ask("designer", { widthMm: 100, heightMm: 100, motifId: crypto.randomUUID(), role: "corner" });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.fields.motifId).toBeDefined();
    expect(await requestCount()).toBe(before);
  });

  it("a planner's request from the fit helper (size and plan only) still works", async () => {
    const res = await ask("planner", { widthMm: 183.3, heightMm: 200, note: "from the fit helper" });
    expect(res.status).toBe(201);
    expect(res.body.request).toMatchObject({ motif: null, role: null, plan: null });
  });
});

describe("turning a request into a stamp", () => {
  const stampBody = (code: string) => ({ code, name: "Border cap", widthMm: 121, heightMm: 80, maker: "Invented Coppersmith" });

  it("creates the stamp, joins the motif's set in the requested role and marks the request made; a second answer is 409", async () => {
    const { motif } = await motifWithMain("MAKE");
    const request = (await ask("designer", { widthMm: 120, heightMm: 80, motifId: motif.id, role: "border" })).body.request;
    const url = `/api/v1/new-stamp-requests/${request.id}/stamp`;
    const code = `${prefix}-MAKE-B`;
    expect((await api("POST", url, { session: sessions.designer, body: { version: 1, stamp: stampBody(code) } })).status).toBe(403);
    const res = await api("POST", url, { session: sessions.keeper, body: { version: 1, stamp: stampBody(code) } });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.request).toMatchObject({ state: "made", stamp: { code }, answeredByName: people.keeper.name, version: 2 });
    const [stamp] = await db().select().from(stamps).where(eq(stamps.code, code));
    expect(stamp).toMatchObject({ motifId: motif.id, widthMm: 121 });
    const set = await db().select().from(motifStamps).where(eq(motifStamps.motifId, motif.id));
    expect(set.map((s) => s.role).sort()).toEqual(["border", "main"]);
    const page = await api("GET", `/api/v1/motifs/${motif.id}`, { session: sessions.designer });
    expect(page.body.motif.stamps.map((s: { code: string; role: string }) => `${s.code} ${s.role}`)).toContain(`${code} border`);
    const again = await api("POST", url, { session: sessions.keeper, body: { version: 2, stamp: stampBody(`${code}2`) } });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("requestAnswered");
    expect(await db().select().from(stamps).where(eq(stamps.code, `${code}2`))).toEqual([]);
  });

  it("leaves everything as it was when the stamp cannot be made (a taken code, a second main stamp)", async () => {
    const { motif, main } = await motifWithMain("ROLL");
    const request = (await ask("designer", { widthMm: 120, heightMm: 80, motifId: motif.id, role: "filler" })).body.request;
    const url = `/api/v1/new-stamp-requests/${request.id}/stamp`;
    const taken = await api("POST", url, { session: sessions.keeper, body: { version: 1, stamp: stampBody(main.code) } });
    expect(taken.status).toBe(409);
    expect(taken.body.error.fields.code).toBeDefined();
    const invalid = await api("POST", url, { session: sessions.keeper, body: { version: 1, stamp: { ...stampBody(`${prefix}-ROLL-F`), widthMm: -1 } } });
    expect(invalid.status).toBe(400);
    expect(Object.keys(invalid.body.error.fields)).toContain("stamp.widthMm");
    const [still] = await db().select().from(newStampRequests).where(eq(newStampRequests.id, request.id));
    expect(still).toMatchObject({ state: "open", version: 1, stampId: null });
    expect((await db().select().from(motifStamps).where(eq(motifStamps.motifId, motif.id))).length).toBe(1);

    const mainRequest = (await ask("designer", { widthMm: 120, heightMm: 80, motifId: motif.id, role: "main" })).body.request;
    const second = await api("POST", `/api/v1/new-stamp-requests/${mainRequest.id}/stamp`, { session: sessions.keeper, body: { version: 1, stamp: stampBody(`${prefix}-ROLL-M2`) } });
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe("motifHasMain");
    expect(await db().select().from(stamps).where(eq(stamps.code, `${prefix}-ROLL-M2`))).toEqual([]);
  });

  it("a stale version is 409 versionConflict and a declined request cannot be made", async () => {
    const { motif } = await motifWithMain("STALE");
    const request = (await ask("designer", { widthMm: 90, heightMm: 90, motifId: motif.id, role: "corner" })).body.request;
    const url = `/api/v1/new-stamp-requests/${request.id}/stamp`;
    expect((await api("POST", url, { session: sessions.keeper, body: { version: 7, stamp: stampBody(`${prefix}-STALE-C`) } })).body.error.code).toBe("versionConflict");
    await api("POST", `/api/v1/new-stamp-requests/${request.id}/decline`, { session: sessions.keeper, body: { version: 1, reason: "One on the shelf fits" } });
    const res = await api("POST", url, { session: sessions.keeper, body: { version: 2, stamp: stampBody(`${prefix}-STALE-C`) } });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("requestAnswered");
  });
});
