import { count, eq } from "drizzle-orm";
import polygonClipping, { type MultiPolygon, type Polygon } from "polygon-clipping";
import { beforeAll, describe, expect, it } from "vitest";
import { planEvents, plans, type Role } from "@/db/schema";
import { can, roles } from "@/lib/permissions";
import { createUser, db } from "../helpers/db";
import { api, signIn, type Session } from "../helpers/http";
import { createStampRow, uniquePrefix } from "../helpers/stamps";

// The cloth plans API (SPEC sections 2, 3 and 6): every role reads plans, planners and admins save, change and
// delete them; a change from an old version is refused; a plan whose stamp changed since it was computed says so.

const sessions = {} as Record<Role, Session>;
const prefix = uniquePrefix("PL");
const FIELD = `${prefix}-F`;
const BORDER = `${prefix}-B`;

beforeAll(async () => {
  for (const role of roles) {
    const user = await createUser(role);
    sessions[role] = (await signIn(user.email, user.password))!;
  }
  await createStampRow({ code: FIELD, name: `Field ${prefix}`, widthMm: 200, heightMm: 200 });
  await createStampRow({ code: BORDER, name: `Border ${prefix}`, widthMm: 60, heightMm: 100 });
});

// 1150 mm mori, 25 mm margins → 1100 mm band; 200 × 200 mm straight (tubruk), worked by hand: 5 across (1000 mm),
// 50 mm left each side, 5 rows a metre, 25 impressions a metre, 750 in 30 m; solid footprint: 1 m² of wax a metre.
const layout = (code = FIELD, extra: Record<string, unknown> = {}) => ({
  cloth: { widthMm: 1150, lengthMm: 30_000, margins: { leftMm: 25, rightMm: 25 } },
  stamp: { code },
  gap: { xMm: 0, yMm: 0 },
  arrangement: "straight",
  ...extra,
});

const planner = () => sessions.planner;
async function savePlan(name: string, body: Record<string, unknown> = {}) {
  const res = await api("POST", "/api/v1/plans", { session: planner(), body: { name, layout: layout(), ...body } });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.plan;
}
const planCount = async () => (await db().select({ n: count() }).from(plans))[0].n;
const planRow = async (id: string) => (await db().select().from(plans).where(eq(plans.id, id)))[0];

describe("POST /api/v1/plans and GET /api/v1/plans/{id}", () => {
  it("saves the inputs with the engine's summary (no preview) and answers { plan }", async () => {
    const plan = await savePlan(`${prefix} straight`, { notes: "For the market run" });
    expect(plan).toMatchObject({ name: `${prefix} straight`, notes: "For the market run", version: 1, stale: false, motifId: null });
    expect(plan.layout).toMatchObject({ stamp: { code: FIELD }, arrangement: "straight", sides: 1 });
    expect(plan.layout.window).toBeUndefined();
    expect(plan.summary).toMatchObject({ across: 5, rowsPerMetre: 5, impressionsPerMetre: 25, impressionsTotal: 750, leftover: { leftMm: 50, rightMm: 50 }, group: "p1", pathName: "tubruk" });
    expect(plan.summary.waxedAreaPerMetreM2).toBeCloseTo(1, 9);
    expect(plan.summary.preview).toBeUndefined();
    expect(plan.summary.impressions).toBeUndefined();
    expect(plan.stamps).toEqual([expect.objectContaining({ role: "field", code: FIELD, widthMm: 200, out: false })]);
    expect(typeof plan.updatedAt).toBe("string");
    expect(plan.staleReasons).toBeUndefined();

    const read = await api("GET", `/api/v1/plans/${plan.id}`, { session: sessions.designer });
    expect(read.status).toBe(200);
    expect(read.body.plan).toMatchObject({ id: plan.id, version: 1, stale: false, summary: { impressionsTotal: 750 } });
    const history = await api("GET", `/api/v1/plans/${plan.id}/history`, { session: sessions.waxmaster });
    expect(history.body.history).toEqual([expect.objectContaining({ kind: "created", version: 1, actorName: "Test planner" })]);
  });

  it("keeps a free footprint, and a motif id without a foreign key", async () => {
    const motifId = "3f1c2b9e-7d1a-4c55-9a0e-5b2d8f3e6a11";
    const plan = await savePlan(`${prefix} free`, { motifId, layout: { ...layout(), stamp: { widthMm: 220, heightMm: 180, coverage: 0.4 } } });
    expect(plan.motifId).toBe(motifId);
    expect(plan.stamps).toEqual([]);
    // ⌊1100 / 220⌋ = 5 across; 1000 / 180 rows a metre; 0.4 × 0.0396 m² each.
    expect(plan.summary.across).toBe(5);
    expect(plan.summary.waxedAreaPerMetreM2).toBeCloseTo((5 * 1000 * 0.4 * 0.0396) / 180, 9);
  });
});

describe("validation", () => {
  const post = (body: unknown) => api("POST", "/api/v1/plans", { session: planner(), body });

  it("names each field the schema refuses (400), and saves nothing", async () => {
    const before = await planCount();
    const res = await post({ name: "  ", layout: { ...layout(), cloth: { widthMm: -5, lengthMm: 1000 } }, borders: [{ side: "sideways", stamp: { code: BORDER } }] });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("validation");
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(["name", "layout.cloth.widthMm", "borders.0.side"]));
    expect(await post({ layout: layout() })).toMatchObject({ status: 400, body: { error: { fields: { name: expect.any(Array) } } } });
    expect(await post({ name: "x", layout: layout(), extra: 1 })).toMatchObject({ status: 400 });
    expect(await planCount()).toBe(before);
  });

  it("refuses what the engine cannot lay out at the plan's own field (422)", async () => {
    const unknown = await post({ name: "unknown stamp", layout: layout(`${prefix}-NONE`) });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.fields["layout.stamp.code"]).toBeDefined();
    const wide = await post({ name: "too wide", layout: { ...layout(), cloth: { widthMm: 150, lengthMm: 30_000, margins: { leftMm: 0, rightMm: 0 } } } });
    expect(wide.status).toBe(422);
    expect(Object.keys(wide.body.error.fields)).toEqual(["layout.stamp.widthMm"]);
    const border = await post({ name: "unknown border", layout: layout(), borders: [{ side: "left", stamp: { code: `${prefix}-NOPE` } }] });
    expect(border.status).toBe(422);
    expect(border.body.error.fields["borders.0.stamp.code"]).toBeDefined();
  });

  it("refuses bad list queries and unknown plans", async () => {
    for (const q of ["sort=colour", "pageSize=1000", "page=0", "arrangement=zigzag", "colour=red"]) {
      expect((await api("GET", `/api/v1/plans?${q}`, { session: planner() })).status, q).toBe(400);
    }
    expect((await api("GET", "/api/v1/plans/0b8d9d64-0000-4000-8000-000000000000", { session: planner() })).status).toBe(404);
    expect((await api("GET", "/api/v1/plans/not-a-uuid", { session: planner() })).status).toBe(400);
    expect((await api("GET", "/api/v1/plans", {})).status).toBe(401);
  });
});

describe("GET /api/v1/plans", () => {
  it("answers { plans, total, page, pageSize } with search, filters, sort and pages", async () => {
    const a = await savePlan(`${prefix} list alpha`);
    const b = await savePlan(`${prefix} list beta`, { layout: layout(FIELD, { arrangement: "half-drop", gap: { xMm: 10, yMm: 0 } }) });
    const res = await api("GET", `/api/v1/plans?q=${encodeURIComponent(`${prefix} list`)}&sort=name`, { session: sessions.designer });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ total: 2, page: 1, pageSize: 25 });
    expect(res.body.plans.map((p: { id: string }) => p.id)).toEqual([a.id, b.id]);
    expect(res.body.plans[0]).toMatchObject({ stamp: { code: FIELD }, clothWidthMm: 1150, arrangement: "straight", pathName: "tubruk", impressionsPerMetre: 25, createdByName: "Test planner", version: 1 });
    const halfDrop = await api("GET", `/api/v1/plans?q=${encodeURIComponent(`${prefix} list`)}&arrangement=half-drop`, { session: planner() });
    expect(halfDrop.body.plans.map((p: { id: string }) => p.id)).toEqual([b.id]);
    const byStamp = await api("GET", `/api/v1/plans?stamp=${FIELD}&q=${encodeURIComponent(`${prefix} list`)}&sort=-name&pageSize=1&page=2`, { session: planner() });
    expect(byStamp.body).toMatchObject({ total: 2, page: 2, pageSize: 1 });
    expect(byStamp.body.plans.map((p: { id: string }) => p.id)).toEqual([a.id]);
  });
});

describe("versions", () => {
  it("PATCH from an old version answers 409 versionConflict and changes nothing", async () => {
    const plan = await savePlan(`${prefix} versions`);
    const first = await api("PATCH", `/api/v1/plans/${plan.id}`, { session: planner(), body: { version: 1, name: `${prefix} versions renamed` } });
    expect(first.status).toBe(200);
    expect(first.body.plan).toMatchObject({ version: 2, name: `${prefix} versions renamed` });
    const stale = await api("PATCH", `/api/v1/plans/${plan.id}`, { session: sessions.admin, body: { version: 1, layout: layout(FIELD, { arrangement: "brick" }) } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("versionConflict");
    expect(await planRow(plan.id)).toMatchObject({ version: 2, arrangement: "straight" });
    const kinds = (await db().select().from(planEvents).where(eq(planEvents.planId, plan.id))).map((e) => e.kind).sort();
    expect(kinds).toEqual(["created", "renamed"]);
  });

  it("a layout change computes the summary again; a change that changes nothing keeps the version", async () => {
    const plan = await savePlan(`${prefix} relayout`);
    const same = await api("PATCH", `/api/v1/plans/${plan.id}`, { session: planner(), body: { version: 1, name: plan.name, layout: layout() } });
    expect(same.body.plan.version).toBe(1);
    const res = await api("PATCH", `/api/v1/plans/${plan.id}`, { session: planner(), body: { version: 1, layout: layout(FIELD, { gap: { xMm: 20, yMm: 0 } }) } });
    expect(res.status).toBe(200);
    // 220 mm a repeat: ⌊(1100 + 20) / 220⌋ = 5 across still, 25 a metre; the gap changes the leftover: (1100 − 1080) / 2.
    expect(res.body.plan).toMatchObject({ version: 2, summary: { across: 5, leftover: { leftMm: 10, rightMm: 10 } } });
  });

  it("DELETE needs the version it was read at", async () => {
    const plan = await savePlan(`${prefix} delete`);
    expect((await api("DELETE", `/api/v1/plans/${plan.id}`, { session: planner() })).status).toBe(400);
    await api("PATCH", `/api/v1/plans/${plan.id}`, { session: planner(), body: { version: 1, notes: "changed" } });
    const old = await api("DELETE", `/api/v1/plans/${plan.id}?version=1`, { session: planner() });
    expect(old.status).toBe(409);
    expect(old.body.error.code).toBe("versionConflict");
    expect(await planRow(plan.id)).toBeDefined();
    expect((await api("DELETE", `/api/v1/plans/${plan.id}?version=2`, { session: planner() })).status).toBe(204);
    expect(await planRow(plan.id)).toBeUndefined();
    expect((await api("GET", `/api/v1/plans/${plan.id}`, { session: planner() })).status).toBe(404);
  });

  it("a stamp that plans use cannot be deleted; the refusal names the plans", async () => {
    const plan = await savePlan(`${prefix} keeps its stamp`);
    const res = await api("DELETE", `/api/v1/stamps/${FIELD}`, { session: sessions.keeper });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("stampInPlans");
    expect(res.body.error.plans.map((p: { id: string }) => p.id)).toContain(plan.id);
  });
});

describe("the stale flag", () => {
  it("says which stamp changed and how, and recomputing clears it", async () => {
    const code = `${prefix}-S`;
    await createStampRow({ code, widthMm: 200, heightMm: 200 });
    const plan = await savePlan(`${prefix} stale`, { layout: layout(code) });
    const keeper = sessions.keeper;
    const stamp = (await api("GET", `/api/v1/stamps/${code}`, { session: keeper })).body.stamp;
    // A new code alone is the same stamp: not stale.
    const renamed = await api("PATCH", `/api/v1/stamps/${code}`, { session: keeper, body: { version: stamp.version, code: `${code}X` } });
    expect(renamed.status, JSON.stringify(renamed.body)).toBe(200);
    let read = (await api("GET", `/api/v1/plans/${plan.id}`, { session: planner() })).body.plan;
    expect(read).toMatchObject({ stale: false, layout: { stamp: { code: `${code}X` } } });

    const resized = await api("PATCH", `/api/v1/stamps/${code}X`, { session: keeper, body: { version: renamed.body.stamp.version, widthMm: 180, coverageRatio: 0.5 } });
    expect(resized.status, JSON.stringify(resized.body)).toBe(200);
    read = (await api("GET", `/api/v1/plans/${plan.id}`, { session: sessions.designer })).body.plan;
    expect(read.stale).toBe(true);
    expect(read.staleReasons).toEqual([{ role: "field", code: `${code}X`, changes: ["size", "coverage"] }]);
    expect(read.summary.across).toBe(5);

    expect((await api("POST", `/api/v1/plans/${plan.id}/recompute`, { session: sessions.designer, body: { version: read.version } })).status).toBe(403);
    const again = await api("POST", `/api/v1/plans/${plan.id}/recompute`, { session: planner(), body: { version: read.version } });
    expect(again.status).toBe(200);
    // 180 mm across: ⌊1100 / 180⌋ = 6; half the footprint carries wax.
    expect(again.body.plan).toMatchObject({ stale: false, version: read.version + 1, summary: { across: 6 } });
    expect(again.body.plan.staleReasons).toBeUndefined();
    expect(again.body.plan.summary.waxedAreaPerMetreM2).toBeCloseTo((6 * 0.5 * 0.036 * 1000) / 200, 9);
    const old = await api("POST", `/api/v1/plans/${plan.id}/recompute`, { session: planner(), body: { version: read.version } });
    expect(old.status).toBe(409);
  });
});

describe.each(roles)("as %s", (role) => {
  const writes = can(role, "plans:write");
  const session = () => sessions[role];

  it(writes ? "reads, saves, changes, copies and deletes plans" : "reads plans; every change answers 403 and changes nothing", async () => {
    const plan = await savePlan(`${prefix} ${role}`);
    for (const path of [`/api/v1/plans?q=${prefix}`, `/api/v1/plans/${plan.id}`, `/api/v1/plans/${plan.id}/history`, `/api/v1/plans/stamps?q=${prefix}`, `/api/v1/plans/stamps/${FIELD}`]) {
      expect((await api("GET", path, { session: session() })).status, path).toBe(200);
    }
    const before = await planCount();
    const created = await api("POST", "/api/v1/plans", { session: session(), body: { name: `${prefix} by ${role}`, layout: layout() } });
    const patched = await api("PATCH", `/api/v1/plans/${plan.id}`, { session: session(), body: { version: 1, name: `${prefix} ${role} renamed` } });
    const copied = await api("POST", `/api/v1/plans/${plan.id}/duplicate`, { session: session() });
    if (writes) {
      expect(created.status).toBe(201);
      expect(patched.status).toBe(200);
      expect(copied.status).toBe(201);
      expect(copied.body.plan).toMatchObject({ name: `Copy of ${prefix} ${role} renamed`, version: 1, summary: { impressionsTotal: 750 } });
      expect(await planCount()).toBe(before + 2);
      expect((await api("DELETE", `/api/v1/plans/${copied.body.plan.id}?version=1`, { session: session() })).status).toBe(204);
    } else {
      for (const res of [created, patched, copied]) {
        expect(res.status).toBe(403);
        expect(res.body.error.code).toBe("forbidden");
      }
      expect((await api("DELETE", `/api/v1/plans/${plan.id}?version=1`, { session: session() })).status).toBe(403);
      expect(await planCount()).toBe(before);
      expect(await planRow(plan.id)).toMatchObject({ version: 1, name: `${prefix} ${role}` });
    }
  });
});

// --- borders ------------------------------------------------------------------------------------

// 1150 mm cloth, 20 mm margins: band x ∈ [20, 1130]. A 60 × 100 mm border on both edges, 10 mm apart down the length
// and 10 mm from the field; the 200 mm field stamp straight. Worked by hand: left strip [20, 80], right [1070, 1130],
// field band [90, 1060] (970 mm): ⌊970 / 200⌋ = 4 across, 20 a metre, 200 in 10 m. Each border: one every 110 mm,
// the k-th ends at 110k + 100 ≤ 10 000 → 91 a side. Together 382; wax 200 × 0.04 + 182 × 0.006 = 9.092 m².
const bordered = {
  cloth: { widthMm: 1150, lengthMm: 10_000, margins: { leftMm: 20, rightMm: 20 } },
  stamp: { code: FIELD },
  arrangement: "straight",
};
const bothBorders = [{ side: "both", stamp: { code: BORDER }, gapYMm: 10, gapToFieldMm: 10 }];

describe("border layouts", () => {
  it("POST /api/v1/layout lays library border stamps by code, worked by hand", async () => {
    const res = await api("POST", "/api/v1/layout", { session: sessions.designer, body: { ...bordered, borders: bothBorders } });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const r = res.body;
    expect(r.fieldBandMm).toEqual({ x0: 90, x1: 1060 });
    expect(r.layers.map((l: { layer: string; bandMm: unknown; impressionsTotal: number }) => [l.layer, l.bandMm, l.impressionsTotal])).toEqual([
      ["field", { x0: 90, x1: 1060 }, 200],
      ["border-left", { x0: 20, x1: 80 }, 91],
      ["border-right", { x0: 1070, x1: 1130 }, 91],
    ]);
    expect(r.impressionsTotal).toBe(382);
    expect(r.impressionsPerMetre).toBeCloseTo(20 + 2000 / 110, 9);
    expect(r.waxedAreaTotalM2).toBeCloseTo(9.092, 9);
    expect(r.overlaps).toEqual([]);
  });

  it("a plan keeps its borders beside the layout and its totals include them", async () => {
    const plan = await savePlan(`${prefix} bordered`, { layout: bordered, borders: bothBorders });
    expect(plan.borders).toEqual([expect.objectContaining({ side: "both", stamp: { code: BORDER }, gapYMm: 10, gapToFieldMm: 10, turn: 0 })]);
    expect(plan.summary.impressionsTotal).toBe(382);
    expect(plan.summary.waxedAreaTotalM2).toBeCloseTo(9.092, 9);
    expect(plan.summary.layers).toHaveLength(3);
    expect(plan.stamps.map((s: { role: string; code: string }) => [s.role, s.code])).toEqual([
      ["field", FIELD],
      ["border:0", BORDER],
    ]);
    const listed = await api("GET", `/api/v1/plans?q=${encodeURIComponent(`${prefix} bordered`)}`, { session: planner() });
    expect(listed.body.plans[0]).toMatchObject({ borders: 1 });
  });

  it("a border stamp's change makes the plan stale at its role", async () => {
    const code = `${prefix}-SB`;
    await createStampRow({ code, widthMm: 60, heightMm: 100 });
    const plan = await savePlan(`${prefix} stale border`, { layout: bordered, borders: [{ ...bothBorders[0], stamp: { code } }] });
    const stamp = (await api("GET", `/api/v1/stamps/${code}`, { session: sessions.admin })).body.stamp;
    await api("PATCH", `/api/v1/stamps/${code}`, { session: sessions.admin, body: { version: stamp.version, outlinePath: "M0 0 L60 0 L60 100 L0 100 Z" } });
    const read = (await api("GET", `/api/v1/plans/${plan.id}`, { session: planner() })).body.plan;
    expect(read.staleReasons).toEqual([{ role: "border:0", code, changes: ["outline"] }]);
  });
});

// Total waxed area of outline stamps against a full union by polygon-clipping (an independent npm library): every
// impression the API lists placed by its matrix, each layer cut to its own strip, all layers united.
const ring = (n: number, cx: number, cy: number, rx: number, ry: number, wobble: number): Array<[number, number]> =>
  Array.from({ length: n }, (_, k) => {
    const t = (2 * Math.PI * k) / n;
    const s = 1 - wobble + wobble * Math.cos(5 * t);
    return [Math.round((cx + rx * s * Math.cos(t)) * 1000) / 1000, Math.round((cy + ry * s * Math.sin(t)) * 1000) / 1000];
  });
const FIELD_RING = ring(48, 90, 90, 89, 89, 0.18);
const BORDER_RING = ring(32, 30, 50, 29.5, 49.5, 0.1);
const pathOf = (r: Array<[number, number]>) => `M${r.map(([x, y]) => `${x} ${y}`).join(" L")} Z`;

function shoelace(r: Array<[number, number]>): number {
  let s = 0;
  for (let i = 0; i < r.length; i++) {
    const [x0, y0] = r[i];
    const [x1, y1] = r[(i + 1) % r.length];
    s += x0 * y1 - x1 * y0;
  }
  return Math.abs(s) / 2;
}
const areaOf = (mp: MultiPolygon) => mp.reduce((sum, poly) => sum + shoelace(poly[0] as Array<[number, number]>) - poly.slice(1).reduce((h, r) => h + shoelace(r as Array<[number, number]>), 0), 0);
const box = (x0: number, x1: number, y1: number): Polygon => [
  [
    [x0, 0],
    [x1, 0],
    [x1, y1],
    [x0, y1],
  ],
];

describe("border layouts against a full union by polygon-clipping", () => {
  const lengthMm = 2400;
  const cases: Array<[string, Record<string, unknown>]> = [
    ["both borders under the field, clipped edges", { edges: "clip", borders: [{ side: "both", stamp: { code: `${prefix}-OB` }, gapYMm: -10, gapToFieldMm: -25 }] }],
    ["a turned, mirrored left border and a right one of its own", { align: "left", borders: [{ side: "left", stamp: { code: `${prefix}-OB` }, turn: 90, mirror: true, gapYMm: -6, gapToFieldMm: -20 }, { side: "right", stamp: { code: `${prefix}-OB` }, turn: 180, gapYMm: 4, gapToFieldMm: -30 }] }],
  ];
  beforeAll(async () => {
    await createStampRow({ code: `${prefix}-OF`, widthMm: 180, heightMm: 180, outlinePath: pathOf(FIELD_RING) });
    await createStampRow({ code: `${prefix}-OB`, widthMm: 60, heightMm: 100, outlinePath: pathOf(BORDER_RING) });
  });

  for (const [name, extra] of cases) {
    it(name, async () => {
      const body = {
        cloth: { widthMm: 1150, lengthMm, margins: { leftMm: 20, rightMm: 35 } },
        stamp: { code: `${prefix}-OF` },
        gap: { xMm: -30, yMm: -30 },
        arrangement: "half-drop",
        window: { startMm: 0, lengthMm },
        impressions: true,
        ...extra,
      };
      const res = await api("POST", "/api/v1/layout", { session: planner(), body });
      expect(res.status, JSON.stringify(res.body)).toBe(200);
      const r = res.body;
      expect(r.overlaps.length).toBeGreaterThan(0);
      const placed = (imp: { layer: string; matrix: number[] }): Polygon => {
        const [a, b, c, d, e, f] = imp.matrix;
        return [(imp.layer === "field" ? FIELD_RING : BORDER_RING).map(([u, v]) => [a * u + c * v + e, b * u + d * v + f] as [number, number])];
      };
      const layers = r.layers.map((l: { layer: string; bandMm: { x0: number; x1: number } }) => {
        const polys = r.impressions.filter((i: { layer: string; face: string }) => i.layer === l.layer && i.face === "front").map(placed);
        return polygonClipping.intersection(polygonClipping.union(polys[0], ...polys.slice(1)), box(l.bandMm.x0, l.bandMm.x1, lengthMm));
      });
      const reference = areaOf(polygonClipping.union(layers[0], ...layers.slice(1))) / 1e6;
      expect(Math.abs(r.waxedAreaTotalM2 / reference - 1)).toBeLessThan(1e-6);
      // The layers do overlap: adding them up would count the shared wax twice.
      const layerSum = r.layers.reduce((s: number, l: { waxedAreaTotalM2: number }) => s + l.waxedAreaTotalM2, 0);
      expect(layerSum - reference).toBeGreaterThan(1e-5);
    });
  }
});
