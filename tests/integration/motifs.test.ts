import { count, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { motifs, stamps } from "@/db/schema";
import { roles, can, type Role } from "@/lib/permissions";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn, type Session } from "../helpers/http";
import { createStampRow, uniquePrefix } from "../helpers/stamps";

// The motif archive over HTTP: permissions for every role, the stamp set and colourways, stale edits, a retired
// main stamp reported, deletion refused while a copy points at a motif, collections.
const prefix = uniquePrefix("MO");
const sessions = {} as Record<Role, Session>;

beforeAll(async () => {
  testEnv();
  for (const role of roles) {
    const u = await createUser(role);
    sessions[role] = (await signIn(u.email, u.password))!;
  }
});

const motifCount = async () => (await db().select({ n: count() }).from(motifs))[0].n;

async function stampsFor(tag: string, condition: "sound" | "retired" | "in_repair" = "sound") {
  const main = await createStampRow({ code: `${prefix}-${tag}-M`, condition });
  const border = await createStampRow({ code: `${prefix}-${tag}-B`, widthMm: 300, heightMm: 80 });
  return { main, border };
}

const body = (name: string, codes: { main: string; border: string }) => ({
  name,
  tags: ["Floral", "lotus", "floral"],
  designer: "Invented Designer",
  stamps: [
    { code: codes.main, role: "main" },
    { code: codes.border, role: "border" },
  ],
  colourways: [
    {
      name: "Brown and indigo",
      colours: [
        { name: "Undyed", swatch: "#F4EFE6", waxStamps: [codes.main], face: "both" },
        { name: "Indigo", swatch: "#1f3a5f" },
      ],
    },
  ],
});

describe("motif permissions", () => {
  it("lets admins, keepers and designers add a motif; planners and wax masters get 403 and nothing is stored", async () => {
    const { main, border } = await stampsFor("PERM");
    for (const role of roles) {
      const before = await motifCount();
      const res = await api("POST", "/api/v1/motifs", { session: sessions[role], body: body(`${prefix} ${role}`, { main: main.code, border: border.code }) });
      if (can(role, "motifs:write")) {
        expect(res.status, role).toBe(201);
        expect(res.body.motif.tags).toEqual(["floral", "lotus"]);
        expect(res.body.motif.stamps.map((s: { code: string; role: string }) => `${s.code} ${s.role}`)).toEqual([`${main.code} main`, `${border.code} border`]);
        expect(res.body.motif.colourways[0].colours.map((c: { swatch: string }) => c.swatch)).toEqual(["#f4efe6", "#1f3a5f"]);
      } else {
        expect(res.status, role).toBe(403);
        expect(await motifCount()).toBe(before);
      }
    }
    expect(["admin", "keeper", "designer"].every((r) => can(r as Role, "motifs:write"))).toBe(true);
  });

  it("lets every role read the archive and a motif; only writers change or delete", async () => {
    const { main, border } = await stampsFor("READ");
    const made = await api("POST", "/api/v1/motifs", { session: sessions.designer, body: body(`${prefix} readable`, { main: main.code, border: border.code }) });
    const id = made.body.motif.id;
    for (const role of roles) {
      const list = await api("GET", `/api/v1/motifs?q=${encodeURIComponent(`${prefix} readable`)}`, { session: sessions[role] });
      expect(list.status, role).toBe(200);
      expect(list.body).toMatchObject({ total: 1, page: 1, pageSize: 24 });
      const one = await api("GET", `/api/v1/motifs/${id}`, { session: sessions[role] });
      expect(one.status, role).toBe(200);
      expect(one.body.plans).toEqual([]);
      const current = one.body.motif.version;
      const patch = await api("PATCH", `/api/v1/motifs/${id}`, { session: sessions[role], body: { notes: `seen by ${role}`, version: current } });
      expect(patch.status, role).toBe(can(role, "motifs:write") ? 200 : 403);
    }
    for (const role of roles.filter((r) => !can(r, "motifs:write"))) expect((await api("DELETE", `/api/v1/motifs/${id}`, { session: sessions[role] })).status).toBe(403);
    const history = await api("GET", `/api/v1/motifs/${id}`, { session: sessions.planner });
    expect(history.body.history.filter((e: { kind: string }) => e.kind === "edited").length).toBe(3);
    expect(history.body.history.at(-1).kind).toBe("created");
    expect((await api("DELETE", `/api/v1/motifs/${id}`, { session: sessions.keeper })).status).toBe(204);
    expect((await api("GET", `/api/v1/motifs/${id}`, { session: sessions.keeper })).status).toBe(404);
    expect((await db().select().from(stamps).where(eq(stamps.id, main.id)))[0].motifId).toBeNull();
  });
});

describe("motifs", () => {
  it("refuses a stale edit with 409 and keeps the other save", async () => {
    const { main, border } = await stampsFor("STALE");
    const made = await api("POST", "/api/v1/motifs", { session: sessions.designer, body: body(`${prefix} stale`, { main: main.code, border: border.code }) });
    const { id, version } = made.body.motif;
    expect((await api("PATCH", `/api/v1/motifs/${id}`, { session: sessions.designer, body: { name: `${prefix} first`, version } })).status).toBe(200);
    const stale = await api("PATCH", `/api/v1/motifs/${id}`, { session: sessions.keeper, body: { name: `${prefix} second`, version } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("versionConflict");
    expect((await api("GET", `/api/v1/motifs/${id}`, { session: sessions.keeper })).body.motif.name).toBe(`${prefix} first`);
    // The shelf's stamp points at its motif.
    expect((await db().select().from(stamps).where(eq(stamps.id, main.id)))[0].motifId).toBe(id);
  });

  it("reports a retired main stamp and one in repair, and filters by availability", async () => {
    const retired = await stampsFor("RET", "retired");
    const repair = await stampsFor("REP", "in_repair");
    const a = await api("POST", "/api/v1/motifs", { session: sessions.admin, body: body(`${prefix} retired main`, { main: retired.main.code, border: retired.border.code }) });
    const b = await api("POST", "/api/v1/motifs", { session: sessions.admin, body: body(`${prefix} repair main`, { main: repair.main.code, border: repair.border.code }) });
    expect(a.body.motif).toMatchObject({ mainStampProblem: "retired", mainStamp: { code: retired.main.code, availability: "retired" } });
    expect(b.body.motif).toMatchObject({ mainStampProblem: "inRepair" });
    const list = await api("GET", `/api/v1/motifs?q=${encodeURIComponent(prefix)}&availability=retired`, { session: sessions.planner });
    expect(list.status).toBe(200);
    expect(list.body.motifs.map((m: { name: string }) => m.name)).toEqual([`${prefix} retired main`]);
    expect(list.body.motifs[0].mainStampProblem).toBe("retired");
  });

  it("finds motifs by tag and designer and sorts by last use", async () => {
    const { main, border } = await stampsFor("TAG");
    const tag = `tag${prefix.toLowerCase().replace(/[^a-z0-9]/g, "")}`;
    for (const [name, day] of [["older", "2001-01-01"], ["newer", "2020-05-05"]] as const) {
      const res = await api("POST", "/api/v1/motifs", { session: sessions.designer, body: { ...body(`${prefix} ${name}`, { main: main.code, border: border.code }), stamps: [], colourways: [], tags: [tag], firstUsedOn: day, designer: `Designer ${prefix}` } });
      expect(res.status).toBe(201);
    }
    const byTag = await api("GET", `/api/v1/motifs?tag=${tag}`, { session: sessions.planner });
    expect(byTag.body.motifs.map((m: { name: string }) => m.name)).toEqual([`${prefix} newer`, `${prefix} older`]);
    const byDesigner = await api("GET", `/api/v1/motifs?designer=${encodeURIComponent(`Designer ${prefix}`)}&sort=name`, { session: sessions.planner });
    expect(byDesigner.body.motifs.map((m: { name: string }) => m.name)).toEqual([`${prefix} newer`, `${prefix} older`]);
    expect((await api("GET", "/api/v1/motifs?sort=colour", { session: sessions.planner })).status).toBe(400);
    expect((await api("GET", "/api/v1/motifs?minWidthMm=300&maxWidthMm=100", { session: sessions.planner })).body.error.fields.minWidthMm).toBeTruthy();
  });

  it("refuses bad input beside its field: unknown stamp, two mains, a colour waxed by a stamp outside the set, a bad swatch", async () => {
    const { main, border } = await stampsFor("BAD");
    const base = body(`${prefix} bad`, { main: main.code, border: border.code });
    const unknown = await api("POST", "/api/v1/motifs", { session: sessions.designer, body: { ...base, stamps: [{ code: `${prefix}-NOPE`, role: "main" }], colourways: [] } });
    expect(unknown.status).toBe(400);
    expect(Object.keys(unknown.body.error.fields)).toContain("stamps.0.code");
    const twoMains = await api("POST", "/api/v1/motifs", { session: sessions.designer, body: { ...base, stamps: [{ code: main.code, role: "main" }, { code: border.code, role: "main" }], colourways: [] } });
    expect(twoMains.body.error.fields.stamps).toBeTruthy();
    const outside = await api("POST", "/api/v1/motifs", { session: sessions.designer, body: { ...base, stamps: [{ code: border.code, role: "border" }] } });
    expect(Object.keys(outside.body.error.fields)).toContain("colourways.0.colours.0.waxStamps.0");
    const swatch = await api("POST", "/api/v1/motifs", { session: sessions.designer, body: { ...base, colourways: [{ name: "x", colours: [{ name: "Red", swatch: "red" }] }] } });
    expect(Object.keys(swatch.body.error.fields)).toContain("colourways.0.colours.0.swatch");
  });

  it("copies as a new design linked to the original; the original cannot be deleted while the copy points at it", async () => {
    const { main, border } = await stampsFor("COPY");
    const made = await api("POST", "/api/v1/motifs", { session: sessions.designer, body: body(`${prefix} original`, { main: main.code, border: border.code }) });
    const copy = await api("POST", `/api/v1/motifs/${made.body.motif.id}/copy`, { session: sessions.designer, body: { name: `${prefix} copy` } });
    expect(copy.status).toBe(201);
    expect(copy.body.motif).toMatchObject({ copiedFrom: { id: made.body.motif.id }, stampCount: 2, colourwayCount: 1 });
    const refused = await api("DELETE", `/api/v1/motifs/${made.body.motif.id}`, { session: sessions.designer });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe("motifInUse");
    expect(refused.body.error.message).toContain(`${prefix} copy`);
  });
});

describe("collections", () => {
  it("writers add and rename, others 403; a collection holding motifs is not deleted", async () => {
    const created = await api("POST", "/api/v1/collections", { session: sessions.designer, body: { name: `${prefix} Monsoon`, year: 2027 } });
    expect(created.status).toBe(201);
    const id = created.body.collection.id;
    for (const role of roles) {
      expect((await api("GET", "/api/v1/collections", { session: sessions[role] })).status).toBe(200);
      if (!can(role, "motifs:write")) expect((await api("POST", "/api/v1/collections", { session: sessions[role], body: { name: `${prefix} ${role}` } })).status).toBe(403);
    }
    expect((await api("POST", "/api/v1/collections", { session: sessions.keeper, body: { name: `${prefix} monsoon` } })).status).toBe(409);
    const renamed = await api("PATCH", `/api/v1/collections/${id}`, { session: sessions.keeper, body: { name: `${prefix} Monsoon II`, version: 1 } });
    expect(renamed.status).toBe(200);
    expect((await api("PATCH", `/api/v1/collections/${id}`, { session: sessions.keeper, body: { name: "x", version: 1 } })).status).toBe(409);
    const motif = await api("POST", "/api/v1/motifs", { session: sessions.designer, body: { name: `${prefix} in collection`, collectionIds: [id] } });
    expect(motif.body.motif.collections).toEqual([{ id, name: `${prefix} Monsoon II` }]);
    const inUse = await api("DELETE", `/api/v1/collections/${id}`, { session: sessions.admin });
    expect(inUse.status).toBe(409);
    expect(inUse.body.error.code).toBe("collectionInUse");
    const inList = await api("GET", `/api/v1/motifs?collection=${id}`, { session: sessions.waxmaster });
    expect(inList.body.total).toBe(1);
  });
});
