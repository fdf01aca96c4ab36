import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { checkouts, stampEvents } from "@/db/schema";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn, type Session } from "../helpers/http";
import { createLocation, createStampRow, daysFromToday, reloadStamp, uniquePrefix } from "../helpers/stamps";

let keeper: Session;
let planner: Session;
const prefix = uniquePrefix("ST");
const site = `Count site ${prefix}`;
const otherSite = `Other site ${prefix}`;
let a: Awaited<ReturnType<typeof createLocation>>;
let b: Awaited<ReturnType<typeof createLocation>>;

beforeAll(async () => {
  const k = await createUser("keeper");
  keeper = (await signIn(k.email, k.password))!;
  const p = await createUser("planner");
  planner = (await signIn(p.email, p.password))!;
  a = await createLocation(site, "A");
  b = await createLocation(site, "B");
  const far = await createLocation(otherSite, "Z");
  await createStampRow({ code: `${prefix}-1`, locationId: a.id });
  await createStampRow({ code: `${prefix}-2`, locationId: a.id });
  await createStampRow({ code: `${prefix}-3`, locationId: b.id });
  await createStampRow({ code: `${prefix}-4`, locationId: b.id, condition: "retired" });
  const out = await createStampRow({ code: `${prefix}-5`, locationId: b.id });
  await db().insert(checkouts).values({ stampId: out.id, borrowerName: "Sari", workstation: "T1", dueOn: daysFromToday(2) });
  await createStampRow({ code: `${prefix}-6`, locationId: far.id });
});

describe("a stock-take", () => {
  let id: string;

  it("starts once per site; planners may watch but not count", async () => {
    expect((await api("POST", "/api/v1/stock-takes", { session: planner, body: { site } })).status).toBe(403);
    const started = await api("POST", "/api/v1/stock-takes", { session: keeper, body: { site } });
    expect(started.status).toBe(201);
    expect(started.body.stockTake).toMatchObject({ site, status: "open", expectedAtStart: 3 });
    id = started.body.stockTake.id;
    const again = await api("POST", "/api/v1/stock-takes", { session: keeper, body: { site } });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("stockTakeOpen");
    expect((await api("POST", "/api/v1/stock-takes", { session: keeper, body: { site: "No such site" } })).status).toBe(422);
  });

  it("takes typed codes and scanned label addresses, and reports progress, misplaced and unexpected stamps", async () => {
    const see = (code: string, locationId: string, session = keeper) => api("POST", `/api/v1/stock-takes/${id}/sightings`, { session, body: { code, locationId } });
    expect((await see(`${prefix}-1`, a.id, planner)).status).toBe(403);
    expect((await see(`${prefix.toLowerCase()}-1`, a.id)).status).toBe(201);
    expect((await see(`${testEnv().appUrl}/stamps/${prefix}-3`, a.id)).status).toBe(201); // recorded at B
    expect((await see(`${prefix}-6`, b.id)).status).toBe(201); // from the other site
    const unknown = await see("NO-SUCH-9", b.id);
    expect(unknown.status).toBe(201);
    expect(unknown.body.sighting).toMatchObject({ code: "NO-SUCH-9", known: false });
    expect((await see("not a code!", a.id)).status).toBe(400);

    const report = (await api("GET", `/api/v1/stock-takes/${id}`, { session: planner })).body.stockTake;
    expect(report).toMatchObject({ expected: 3, seenExpected: 2, seen: 4, relocatable: 2 });
    expect(report.missing.map((m: { code: string }) => m.code)).toEqual([`${prefix}-2`]);
    expect(report.misplaced).toEqual([expect.objectContaining({ code: `${prefix}-3`, recorded: { id: b.id, label: `${site} · B` }, seenAt: { id: a.id, label: `${site} · A` } })]);
    const unexpected = report.unexpected.map((u: { code: string; reason: string }) => `${u.code}:${u.reason}`).sort();
    expect(unexpected).toEqual([`${prefix}-6:otherSite`, "NO-SUCH-9:unknown"].sort());
    expect(report.checkedOut.map((c: { code: string }) => c.code)).toEqual([`${prefix}-5`]);
  });

  it("moves the found stamps to where they were seen in one action, with a history entry each", async () => {
    expect((await api("POST", `/api/v1/stock-takes/${id}/relocate`, { session: planner })).status).toBe(403);
    const res = await api("POST", `/api/v1/stock-takes/${id}/relocate`, { session: keeper });
    expect(res.status).toBe(200);
    expect(res.body.moved.sort()).toEqual([`${prefix}-3`, `${prefix}-6`]);
    const three = (await reloadStamp(`${prefix}-3`))!;
    expect(three.locationId).toBe(a.id);
    expect((await reloadStamp(`${prefix}-6`))!.locationId).toBe(b.id);
    const [moved] = await db().select().from(stampEvents).where(eq(stampEvents.stampId, three.id));
    expect(moved).toMatchObject({ kind: "moved", fromValue: `${site} · B`, toValue: `${site} · A`, details: { stockTakeSite: site, stockTakeId: id } });
    const report = (await api("GET", `/api/v1/stock-takes/${id}`, { session: keeper })).body.stockTake;
    expect(report).toMatchObject({ relocatable: 0, misplaced: [], seenExpected: 3, expected: 4 });
  });

  it("ends; afterwards nothing more can be marked", async () => {
    expect((await api("POST", `/api/v1/stock-takes/${id}/end`, { session: planner })).status).toBe(403);
    expect((await api("POST", `/api/v1/stock-takes/${id}/end`, { session: keeper })).status).toBe(200);
    const late = await api("POST", `/api/v1/stock-takes/${id}/sightings`, { session: keeper, body: { code: `${prefix}-2`, locationId: a.id } });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe("stockTakeClosed");
    expect((await api("POST", `/api/v1/stock-takes/${id}/end`, { session: keeper })).status).toBe(409);
    expect((await api("POST", "/api/v1/stock-takes", { session: keeper, body: { site } })).status).toBe(201);
  });
});
