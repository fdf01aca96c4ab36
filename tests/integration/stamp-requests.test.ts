import { count, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { newStampRequests, stampRequests, type Role } from "@/db/schema";
import { can, roles } from "@/lib/permissions";
import { createUser, db } from "../helpers/db";
import { api, signIn, type Session } from "../helpers/http";
import { latestMailTo } from "../helpers/mail";
import { createStampRow, eventsOf, openCheckouts, uniquePrefix } from "../helpers/stamps";

// Stamp requests (SPEC section 2: any role may ask for stamps): the keepers accept a request — all its stamps
// checked out in one transaction, or on its first day when it starts later — or decline it with a reason; both
// sides get an e-mail. New-stamp requests from the fit helper wait in the same queue.

const sessions = {} as Record<Role, Session>;
const people = {} as Record<Role, { email: string; name: string }>;
const prefix = uniquePrefix("RQ");
/** Today in the workshop's zone (the default, Asia/Jakarta), and n days on. */
const today = (n = 0) => new Intl.DateTimeFormat("en-CA", { timeZone: "Asia/Jakarta" }).format(new Date(Date.now() + n * 86_400_000));
const requestCount = async () => (await db().select({ n: count() }).from(stampRequests))[0].n;

beforeAll(async () => {
  for (const role of roles) {
    const user = await createUser(role);
    people[role] = user;
    sessions[role] = (await signIn(user.email, user.password))!;
  }
});

const ask = (role: Role, codes: string[], extra: Record<string, unknown> = {}) =>
  api("POST", "/api/v1/stamp-requests", { session: sessions[role], body: { stampCodes: codes, forWhom: people[role].name, workstation: "Table 3", fromOn: today(), untilOn: today(3), ...extra } });

describe("asking for stamps", () => {
  it.each(roles)("%s may ask; the keepers get an e-mail", async (role) => {
    const stamp = await createStampRow({ code: `${prefix}-${role.slice(0, 3).toUpperCase()}` });
    const res = await ask(role, [stamp.code], { note: `for ${role}` });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.request).toMatchObject({ state: "open", stamps: [{ code: stamp.code }], workstation: "Table 3", version: 1 });
    const mail = await latestMailTo(people.keeper.email, new RegExp(`${people[role].name} asks for stamps`));
    expect(mail.text).toContain(stamp.code);
  });

  it("refuses what makes no sense, naming the field, and saves nothing", async () => {
    const stamp = await createStampRow({ code: `${prefix}-VAL` });
    const before = await requestCount();
    const none = await ask("planner", []);
    expect(none.status).toBe(400);
    expect(none.body.error.fields.stampCodes).toBeDefined();
    const backwards = await ask("planner", [stamp.code], { fromOn: today(3), untilOn: today(1) });
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.fields.untilOn).toBeDefined();
    const past = await ask("planner", [stamp.code], { fromOn: today(-2) });
    expect(past.status).toBe(422);
    expect(past.body.error.fields.fromOn).toBeDefined();
    const unknown = await ask("planner", [stamp.code, `${prefix}-NONE`]);
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.fields.stampCodes[0]).toContain(`${prefix}-NONE`);
    expect(await requestCount()).toBe(before);
  });
});

describe("answering a request", () => {
  it("accepting checks every stamp out in one go, and mails the requester", async () => {
    const a = await createStampRow({ code: `${prefix}-A1` });
    const b = await createStampRow({ code: `${prefix}-A2` });
    const request = (await ask("planner", [a.code, b.code])).body.request;
    expect((await api("POST", `/api/v1/stamp-requests/${request.id}/accept`, { session: sessions.planner, body: { version: 1 } })).status).toBe(403);
    const res = await api("POST", `/api/v1/stamp-requests/${request.id}/accept`, { session: sessions.keeper, body: { version: 1 } });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.request).toMatchObject({ state: "checked_out", version: 2, answeredByName: "Test keeper" });
    for (const s of [a, b]) {
      const [checkout] = await openCheckouts(s.id);
      expect(checkout).toMatchObject({ borrowerName: people.planner.name, workstation: "Table 3", dueOn: today(3) });
      expect((await eventsOf(s.id)).map((e) => e.kind)).toContain("checked_out");
    }
    const mail = await latestMailTo(people.planner.email, /checked out/);
    expect(mail.text).toContain(a.code);
    const again = await api("POST", `/api/v1/stamp-requests/${request.id}/accept`, { session: sessions.keeper, body: { version: 2 } });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("requestAnswered");
  });

  it("when one stamp is out, nothing is checked out (409 naming it)", async () => {
    const free = await createStampRow({ code: `${prefix}-B1` });
    const busy = await createStampRow({ code: `${prefix}-B2` });
    const first = (await ask("designer", [busy.code])).body.request;
    await api("POST", `/api/v1/stamp-requests/${first.id}/accept`, { session: sessions.keeper, body: { version: 1 } });
    const second = (await ask("waxmaster", [free.code, busy.code])).body.request;
    const res = await api("POST", `/api/v1/stamp-requests/${second.id}/accept`, { session: sessions.admin, body: { version: 1 } });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("requestStampsUnavailable");
    expect(res.body.error.message).toContain(busy.code);
    expect(await openCheckouts(free.id)).toEqual([]);
    expect((await db().select().from(stampRequests).where(eq(stampRequests.id, second.id)))[0]).toMatchObject({ state: "open", version: 1 });
  });

  it("a request for later days is accepted now and checked out on its first day", async () => {
    const s = await createStampRow({ code: `${prefix}-L1` });
    const request = (await ask("planner", [s.code], { fromOn: today(2), untilOn: today(4) })).body.request;
    const res = await api("POST", `/api/v1/stamp-requests/${request.id}/accept`, { session: sessions.keeper, body: { version: 1 } });
    expect(res.body.request.state).toBe("accepted");
    expect(await openCheckouts(s.id)).toEqual([]);
    // Another request for overlapping days cannot be promised the same stamp.
    const rival = (await ask("designer", [s.code], { fromOn: today(3), untilOn: today(5) })).body.request;
    const refused = await api("POST", `/api/v1/stamp-requests/${rival.id}/accept`, { session: sessions.keeper, body: { version: 1 } });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe("requestStampsReserved");
  });

  it("declining needs a reason; the requester reads it in the e-mail", async () => {
    const s = await createStampRow({ code: `${prefix}-D1` });
    const request = (await ask("designer", [s.code])).body.request;
    const blank = await api("POST", `/api/v1/stamp-requests/${request.id}/decline`, { session: sessions.keeper, body: { version: 1, reason: " " } });
    expect(blank.status).toBe(400);
    expect(blank.body.error.fields.reason).toBeDefined();
    const stale = await api("POST", `/api/v1/stamp-requests/${request.id}/decline`, { session: sessions.keeper, body: { version: 7, reason: "Being repaired" } });
    expect(stale.status).toBe(409);
    const res = await api("POST", `/api/v1/stamp-requests/${request.id}/decline`, { session: sessions.keeper, body: { version: 1, reason: "Being repaired this week" } });
    expect(res.body.request).toMatchObject({ state: "declined", declineReason: "Being repaired this week" });
    const mail = await latestMailTo(people.designer.email, /declined/);
    expect(mail.text).toContain("Being repaired this week");
    expect(await openCheckouts(s.id)).toEqual([]);
  });

  it("the queue lists pending requests for everyone who reads", async () => {
    const s = await createStampRow({ code: `${prefix}-Q1` });
    const request = (await ask("waxmaster", [s.code])).body.request;
    const res = await api("GET", "/api/v1/stamp-requests?state=pending", { session: sessions.designer });
    expect(res.status).toBe(200);
    expect(res.body.requests.map((r: { id: string }) => r.id)).toContain(request.id);
    expect((await api("GET", `/api/v1/stamp-requests/${request.id}`, { session: sessions.planner })).body.request.stamps[0].code).toBe(s.code);
    expect((await api("GET", "/api/v1/stamp-requests?state=lost", { session: sessions.keeper })).status).toBe(400);
  });
});

describe("new-stamp requests", () => {
  it.each(roles)("%s: asking for a stamp to be made follows the permission table", async (role) => {
    const before = (await db().select({ n: count() }).from(newStampRequests))[0].n;
    const res = await api("POST", "/api/v1/new-stamp-requests", { session: sessions[role], body: { widthMm: 183.3, heightMm: 200, note: `${prefix} ${role}` } });
    const after = (await db().select({ n: count() }).from(newStampRequests))[0].n;
    if (can(role, "stamps:requestNew")) {
      expect(res.status).toBe(201);
      expect(res.body.request).toMatchObject({ widthMm: 183.3, heightMm: 200, state: "open", requesterName: `Test ${role}` });
      expect(after).toBe(before + 1);
    } else {
      expect(res.status).toBe(403);
      expect(after).toBe(before);
    }
  });

  it("refuses sizes out of range and lets keepers decline with a reason", async () => {
    const bad = await api("POST", "/api/v1/new-stamp-requests", { session: sessions.planner, body: { widthMm: 0, heightMm: 5000 } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["heightMm", "widthMm"]);
    const made = (await api("POST", "/api/v1/new-stamp-requests", { session: sessions.planner, body: { widthMm: 150, heightMm: 150 } })).body.request;
    expect((await api("POST", `/api/v1/new-stamp-requests/${made.id}/decline`, { session: sessions.planner, body: { version: 1, reason: "no" } })).status).toBe(403);
    const res = await api("POST", `/api/v1/new-stamp-requests/${made.id}/decline`, { session: sessions.keeper, body: { version: 1, reason: "We have one that size" } });
    expect(res.body.request).toMatchObject({ state: "declined", declineReason: "We have one that size" });
    const list = await api("GET", "/api/v1/new-stamp-requests?state=declined", { session: sessions.designer });
    expect(list.body.requests.map((r: { id: string }) => r.id)).toContain(made.id);
  });
});
