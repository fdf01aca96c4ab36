import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { checkouts, damageReports } from "@/db/schema";
import { createUser, db } from "../helpers/db";
import { api, signIn, type Session } from "../helpers/http";
import { latestMailTo } from "../helpers/mail";
import { createLocation, createStampRow, daysFromToday, eventsOf, openCheckouts, reloadStamp, uniquePrefix } from "../helpers/stamps";

let keeper: Session;
let planner: Session;
let keeperEmail: string;
const prefix = uniquePrefix("RL");
const site = `Rules site ${prefix}`;

beforeAll(async () => {
  const k = await createUser("keeper");
  keeperEmail = k.email;
  keeper = (await signIn(k.email, k.password))!;
  const p = await createUser("planner");
  planner = (await signIn(p.email, p.password))!;
});

describe("one open check-out per stamp", () => {
  it("20 simultaneous check-outs of one stamp: exactly one succeeds, 19 get 409", async () => {
    const stamp = await createStampRow({ code: `${prefix}-RACE` });
    const results = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        api("POST", `/api/v1/stamps/${stamp.code}/checkout`, { session: keeper, body: { borrowerName: `Stamper ${i}`, workstation: `Table ${i}`, dueOn: daysFromToday(3) } }),
      ),
    );
    const statuses = results.map((r) => r.status).sort();
    expect(statuses.filter((s) => s === 201)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(19);
    expect(results.filter((r) => r.status === 409).every((r) => r.body.error.code === "alreadyCheckedOut")).toBe(true);
    expect(await openCheckouts(stamp.id)).toHaveLength(1);
    expect((await eventsOf(stamp.id)).filter((e) => e.kind === "checked_out")).toHaveLength(1);
  });

  it("the database itself refuses a second open check-out (partial unique index)", async () => {
    const stamp = await createStampRow({ code: `${prefix}-IDX` });
    await db().insert(checkouts).values({ stampId: stamp.id, borrowerName: "A", workstation: "1", dueOn: daysFromToday(1) });
    await expect(db().insert(checkouts).values({ stampId: stamp.id, borrowerName: "B", workstation: "2", dueOn: daysFromToday(1) })).rejects.toThrow();
    // A returned check-out does not count: the next one may open.
    await db().update(checkouts).set({ returnedAt: new Date() }).where(eq(checkouts.stampId, stamp.id));
    await db().insert(checkouts).values({ stampId: stamp.id, borrowerName: "B", workstation: "2", dueOn: daysFromToday(1) });
    expect(await openCheckouts(stamp.id)).toHaveLength(1);
  });

  it("a returned stamp can go out again; returning twice is a 409", async () => {
    const stamp = await createStampRow({ code: `${prefix}-AGAIN` });
    const body = { borrowerName: "Ratri", workstation: "Table 1", dueOn: daysFromToday(2) };
    expect((await api("POST", `/api/v1/stamps/${stamp.code}/checkout`, { session: keeper, body })).status).toBe(201);
    expect((await api("POST", `/api/v1/stamps/${stamp.code}/return`, { session: keeper, body: { impressions: 120 } })).status).toBe(200);
    const second = await api("POST", `/api/v1/stamps/${stamp.code}/return`, { session: keeper, body: {} });
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe("notCheckedOut");
    expect((await api("POST", `/api/v1/stamps/${stamp.code}/checkout`, { session: keeper, body })).status).toBe(201);
    expect((await reloadStamp(stamp.code))!.impressionsCount).toBe(120);
  });

  it("a stamp in repair or retired cannot go out", async () => {
    const stamp = await createStampRow({ code: `${prefix}-BENCH`, condition: "in_repair" });
    const res = await api("POST", `/api/v1/stamps/${stamp.code}/checkout`, { session: keeper, body: { borrowerName: "Ratri", workstation: "T1", dueOn: daysFromToday(2) } });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("stampUnavailable");
  });

  it("a past due date and a missing borrower are refused with field messages", async () => {
    const stamp = await createStampRow({ code: `${prefix}-DUE` });
    const res = await api("POST", `/api/v1/stamps/${stamp.code}/checkout`, { session: keeper, body: { workstation: "T1", dueOn: daysFromToday(-1) } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.dueOn[0]).toMatch(/past/);
    expect(res.body.error.fields.borrowerName[0]).toMatch(/person/);
    expect(await openCheckouts(stamp.id)).toHaveLength(0);
  });
});

describe("edits carry the version they start from", () => {
  it("the second of two edits from the same version gets 409 and the first one stays", async () => {
    const stamp = await createStampRow({ code: `${prefix}-VER` });
    const first = await api("PATCH", `/api/v1/stamps/${stamp.code}`, { session: keeper, body: { name: "Parang rusak", version: stamp.version } });
    expect(first.status).toBe(200);
    expect(first.body.stamp.version).toBe(stamp.version + 1);
    const second = await api("PATCH", `/api/v1/stamps/${stamp.code}`, { session: keeper, body: { name: "Truntum", version: stamp.version } });
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe("versionConflict");
    expect(second.body.error.message).toMatch(/Reload/);
    expect((await reloadStamp(stamp.code))!.name).toBe("Parang rusak");
  });

  it("of 10 simultaneous edits from one version exactly one wins", async () => {
    const stamp = await createStampRow({ code: `${prefix}-VER10` });
    const results = await Promise.all(
      Array.from({ length: 10 }, (_, i) => api("PATCH", `/api/v1/stamps/${stamp.code}`, { session: keeper, body: { notes: `edit ${i}`, version: stamp.version } })),
    );
    expect(results.filter((r) => r.status === 200)).toHaveLength(1);
    expect(results.filter((r) => r.status === 409)).toHaveLength(9);
    expect((await reloadStamp(stamp.code))!.version).toBe(stamp.version + 1);
  });

  it("a delete from an old version is a 409 too", async () => {
    const stamp = await createStampRow({ code: `${prefix}-VERDEL`, version: 3 });
    expect((await api("DELETE", `/api/v1/stamps/${stamp.code}?version=2`, { session: keeper })).status).toBe(409);
    expect(await reloadStamp(stamp.code)).toBeDefined();
  });
});

describe("bad input", () => {
  it("gets 400 with a message per field and adds nothing", async () => {
    const res = await api("POST", "/api/v1/stamps", {
      session: keeper,
      body: { code: "no spaces allowed", name: "", widthMm: -3, heightMm: "wide", coverageRatio: 1.5, face: "triple", madeOn: "2999-01-01" },
    });
    expect(res.status).toBe(400);
    const f = res.body.error.fields;
    expect(f.code[0]).toMatch(/letters, digits/);
    expect(f.name[0]).toBe("Required.");
    expect(f.widthMm[0]).toMatch(/between 5 mm and 1500 mm/);
    expect(f.heightMm[0]).toMatch(/number/i);
    expect(f.coverageRatio[0]).toMatch(/between 0 and 1/);
    expect(f.face[0]).toMatch(/Choose one of/);
    expect(f.madeOn[0]).toMatch(/future/);
  });

  it("refuses unknown fields, a duplicate code (409) and an unknown twin or location (422)", async () => {
    const stamp = await createStampRow({ code: `${prefix}-DUP` });
    const unknown = await api("POST", "/api/v1/stamps", { session: keeper, body: { code: `${prefix}-X1`, name: "x", widthMm: 100, heightMm: 100, colour: "red" } });
    expect(unknown.status).toBe(400);
    const dup = await api("POST", "/api/v1/stamps", { session: keeper, body: { code: stamp.code.toLowerCase(), name: "x", widthMm: 100, heightMm: 100 } });
    expect(dup.status).toBe(409);
    expect(dup.body.error.code).toBe("codeTaken");
    expect(dup.body.error.fields.code).toHaveLength(1);
    const twin = await api("POST", "/api/v1/stamps", { session: keeper, body: { code: `${prefix}-X2`, name: "x", widthMm: 100, heightMm: 100, face: "pair", twinCode: "NO-SUCH-STAMP" } });
    expect(twin.status).toBe(422);
    expect(twin.body.error.fields.twinCode[0]).toMatch(/No stamp/);
    const location = await api("POST", "/api/v1/stamps", { session: keeper, body: { code: `${prefix}-X3`, name: "x", widthMm: 100, heightMm: 100, locationId: "00000000-0000-4000-8000-000000000000" } });
    expect(location.status).toBe(422);
    expect(await reloadStamp(`${prefix}-X2`)).toBeUndefined();
    expect(await reloadStamp(`${prefix}-X3`)).toBeUndefined();
  });

  it("answers 404 for an unknown stamp and 400 for a malformed code or query", async () => {
    expect((await api("GET", `/api/v1/stamps/${prefix}-NONE`, { session: keeper })).status).toBe(404);
    expect((await api("GET", "/api/v1/stamps/bad%20code!", { session: keeper })).status).toBe(400);
    const bad = await api("GET", "/api/v1/stamps?pageSize=5000&sort=colour&condition=shiny", { session: keeper });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["condition", "pageSize", "sort"]);
  });

  it("a duplicate location code within one site is a 409; another site may reuse it", async () => {
    const body = { site, code: "R9-S9" };
    expect((await api("POST", "/api/v1/locations", { session: keeper, body })).status).toBe(201);
    const again = await api("POST", "/api/v1/locations", { session: keeper, body: { ...body, code: "r9-s9" } });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("locationTaken");
    expect((await api("POST", "/api/v1/locations", { session: keeper, body: { site: `${site} annex`, code: "R9-S9" } })).status).toBe(201);
  });

  it("a location with stamps cannot be deleted", async () => {
    const location = await createLocation(site, "FULL-1");
    await createStampRow({ code: `${prefix}-LIVES`, locationId: location.id });
    const res = await api("DELETE", `/api/v1/locations/${location.id}`, { session: keeper });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("locationInUse");
  });
});

describe("the list", () => {
  const tag = `list-${prefix.toLowerCase()}`;
  beforeAll(async () => {
    const a = await createLocation(site, "L-A");
    const b = await createLocation(`${site} annex`, "L-B");
    const sizes = [120, 180, 200, 210, 240, 300];
    for (const [i, w] of sizes.entries()) {
      await createStampRow({
        code: `${prefix}-L${i}`,
        name: i % 2 ? `Sekar jagad ${i}` : `Kawung ${i}`,
        widthMm: w,
        heightMm: w + 10,
        tags: [tag],
        condition: i === 5 ? "worn" : "sound",
        face: i < 2 ? "pair" : "single",
        locationId: i < 3 ? a.id : b.id,
        maker: i === 4 ? "Pak Darmo" : null,
      });
    }
    await db().insert(checkouts).values({ stampId: (await reloadStamp(`${prefix}-L1`))!.id, borrowerName: "Sari", workstation: "T4", dueOn: daysFromToday(-2) });
  });
  const list = (query: string) => api("GET", `/api/v1/stamps?tag=${tag}&${query}`, { session: planner });

  it("searches code, name, tags and maker", async () => {
    expect((await list("q=kawung")).body.total).toBe(3);
    expect((await list("q=darmo")).body.stamps.map((s: { code: string }) => s.code)).toEqual([`${prefix}-L4`]);
    expect((await list(`q=${prefix}-L5`)).body.total).toBe(1);
    expect((await api("GET", `/api/v1/stamps?q=${tag}`, { session: planner })).body.total).toBe(6);
  });

  it("filters by condition, site, location, face, size and check-out", async () => {
    expect((await list("condition=worn")).body.total).toBe(1);
    expect((await list("condition=worn,sound")).body.total).toBe(6);
    expect((await list(`site=${encodeURIComponent(`${site} annex`)}`)).body.total).toBe(3);
    const byLocation = await list("sort=code");
    const locationId = byLocation.body.stamps[0].location.id;
    expect((await list(`location=${locationId}`)).body.total).toBe(3);
    expect((await list("face=pair")).body.total).toBe(2);
    expect((await list("minWidthMm=180&maxWidthMm=240")).body.total).toBe(4);
    expect((await list("minHeightMm=250")).body.total).toBe(2);
    const out = await list("out=true");
    expect(out.body.stamps.map((s: { code: string }) => s.code)).toEqual([`${prefix}-L1`]);
    expect(out.body.stamps[0].checkout).toMatchObject({ borrowerName: "Sari", overdue: true });
    expect((await list("overdue=true")).body.total).toBe(1);
    expect((await list("out=false")).body.total).toBe(5);
  });

  it("sorts and pages", async () => {
    const desc = await list("sort=-width&pageSize=4&page=1");
    expect(desc.body.total).toBe(6);
    expect(desc.body.stamps.map((s: { widthMm: number }) => s.widthMm)).toEqual([300, 240, 210, 200]);
    const page2 = await list("sort=-width&pageSize=4&page=2");
    expect(page2.body.stamps.map((s: { widthMm: number }) => s.widthMm)).toEqual([180, 120]);
    const byName = await list("sort=name&pageSize=2");
    expect(byName.body.stamps.map((s: { name: string }) => s.name)).toEqual(["Kawung 0", "Kawung 2"]);
    const beyond = await list("page=9");
    expect(beyond.body).toMatchObject({ total: 6, stamps: [] });
  });
});

describe("twins", () => {
  it("linking a mirror twin links both ways, and relinking frees the former partner", async () => {
    const a = await createStampRow({ code: `${prefix}-TA`, face: "pair" });
    const b = await createStampRow({ code: `${prefix}-TB`, mirrored: true });
    const c = await createStampRow({ code: `${prefix}-TC`, mirrored: true });
    const link = await api("PATCH", `/api/v1/stamps/${a.code}`, { session: keeper, body: { twinCode: b.code, version: a.version } });
    expect(link.status).toBe(200);
    expect(link.body.stamp.twin.code).toBe(b.code);
    const bAfter = await api("GET", `/api/v1/stamps/${b.code}`, { session: keeper });
    expect(bAfter.body.stamp).toMatchObject({ face: "pair", twin: { code: a.code } });

    const relink = await api("PATCH", `/api/v1/stamps/${a.code}`, { session: keeper, body: { twinCode: c.code, version: link.body.stamp.version } });
    expect(relink.status).toBe(200);
    expect((await reloadStamp(b.code))!.twinId).toBeNull();
    expect((await reloadStamp(c.code))!.twinId).toBe(a.id);
  });

  it("a single stamp cannot have a twin", async () => {
    const a = await createStampRow({ code: `${prefix}-TS` });
    const b = await createStampRow({ code: `${prefix}-TT` });
    const res = await api("PATCH", `/api/v1/stamps/${a.code}`, { session: keeper, body: { twinCode: b.code, version: a.version } });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.twinCode[0]).toMatch(/pair/);
  });
});

describe("damage and repair", () => {
  it("a report reaches the keepers by e-mail; the repair path is recorded step by step and closes the report", async () => {
    const stamp = await createStampRow({ code: `${prefix}-REP` });
    const report = await api("POST", `/api/v1/stamps/${stamp.code}/damage`, { session: planner, body: { kind: "cracked_solder", note: "corner strip loose" } });
    expect(report.status).toBe(201);
    const mail = await latestMailTo(keeperEmail, new RegExp(stamp.code));
    expect(mail.text).toContain("Cracked solder");
    expect(mail.text).toContain(`/stamps/${stamp.code}`);

    for (const condition of ["needs_repair", "in_repair", "sound"]) {
      const res = await api("POST", `/api/v1/stamps/${stamp.code}/condition`, { session: keeper, body: { condition } });
      expect(res.status, condition).toBe(200);
    }
    const history = await api("GET", `/api/v1/stamps/${stamp.code}/history`, { session: planner });
    const kinds = history.body.events.map((e: { kind: string }) => e.kind).reverse();
    expect(kinds).toEqual(["damage_reported", "condition_changed", "condition_changed", "repaired"]);
    const open = await db().select().from(damageReports).where(eq(damageReports.stampId, stamp.id));
    expect(open[0].resolvedAt).not.toBeNull();
  });

  it("refuses a step the path does not allow (422) and a stamp that is out going to repair (409)", async () => {
    const stamp = await createStampRow({ code: `${prefix}-REP2` });
    const skip = await api("POST", `/api/v1/stamps/${stamp.code}/condition`, { session: keeper, body: { condition: "in_repair" } });
    expect(skip.status).toBe(422);
    expect(skip.body.error.code).toBe("conditionChange");

    const out = await createStampRow({ code: `${prefix}-REP3`, condition: "needs_repair" });
    await db().insert(checkouts).values({ stampId: out.id, borrowerName: "Sari", workstation: "T2", dueOn: daysFromToday(1) });
    const busy = await api("POST", `/api/v1/stamps/${out.code}/condition`, { session: keeper, body: { condition: "in_repair" } });
    expect(busy.status).toBe(409);
    expect(busy.body.error.code).toBe("stampCheckedOut");
  });
});

describe("overdue check-outs", () => {
  it("are listed, and each borrower with an e-mail gets a reminder", async () => {
    const stamp = await createStampRow({ code: `${prefix}-LATE` });
    const email = `late-${prefix.toLowerCase()}@capgrid.test`;
    await db().insert(checkouts).values({ stampId: stamp.id, borrowerName: "Gendhis", borrowerEmail: email, workstation: "Table 7", dueOn: daysFromToday(-3) });
    const listed = await api("GET", "/api/v1/checkouts?overdue=true", { session: planner });
    expect(listed.body.checkouts.some((c: { stampCode: string; overdue: boolean }) => c.stampCode === stamp.code && c.overdue)).toBe(true);

    const sent = await api("POST", "/api/v1/checkouts/reminders", { session: keeper });
    expect(sent.status).toBe(200);
    expect(sent.body.reminders.sent.some((s: { code: string }) => s.code === stamp.code)).toBe(true);
    const mail = await latestMailTo(email, /overdue/i);
    expect(mail.text).toContain(stamp.code);
    expect(mail.text).toContain("Table 7");
  });
});

describe("history", () => {
  it("records create, edit, move and check-out with who did it", async () => {
    const from = await createLocation(site, "H-1");
    const to = await createLocation(site, "H-2");
    const created = await api("POST", "/api/v1/stamps", {
      session: keeper,
      body: { code: `${prefix}-HIST`, name: "Ceplok", widthMm: 200, heightMm: 200, locationId: from.id, tags: ["Ceplok", "ceplok", "border"] },
    });
    expect(created.status).toBe(201);
    expect(created.body.stamp.tags).toEqual(["ceplok", "border"]);
    const moved = await api("PATCH", `/api/v1/stamps/${prefix}-HIST`, { session: keeper, body: { locationId: to.id, widthMm: 201.04, version: 1 } });
    expect(moved.status).toBe(200);
    expect(moved.body.stamp.widthMm).toBe(201);
    const events = (await api("GET", `/api/v1/stamps/${prefix}-HIST/history`, { session: keeper })).body.events;
    expect(events.map((e: { kind: string }) => e.kind).sort()).toEqual(["created", "edited", "moved"]);
    const move = events.find((e: { kind: string }) => e.kind === "moved");
    expect(move).toMatchObject({ from: `${site} · H-1`, to: `${site} · H-2`, actorName: "Test keeper" });
    const edit = events.find((e: { kind: string }) => e.kind === "edited");
    expect(edit.details.changes).toEqual([{ field: "widthMm", from: 200, to: 201 }]);
  });
});
