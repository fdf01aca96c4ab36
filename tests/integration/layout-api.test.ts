import { beforeAll, describe, expect, it } from "vitest";
import { stamps } from "@/db/schema";
import { createUser, db } from "../helpers/db";
import { api, signIn, type Session } from "../helpers/http";

let planner: Session;
let designerToken: string;
beforeAll(async () => {
  const user = await createUser("planner");
  planner = (await signIn(user.email, user.password))!;
  const designer = await createUser("designer");
  const session = (await signIn(designer.email, designer.password))!;
  designerToken = (await api("POST", "/api/v1/tokens", { session, body: { name: "layout script" } })).body.token.secret;
});

// 1150 mm mori, 25 mm margins → a 1100 mm band; a 200 × 200 mm stamp stepped straight (tubruk), worked by hand:
// 5 across (1000 mm) leaving 50 mm each side, 5 rows per metre, 25 impressions per metre, 2500 in 100 m,
// and with a solid footprint 25 × 0.04 m² = 1 m² of wax per metre.
const hundredMetres = {
  cloth: { widthMm: 1150, lengthMm: 100_000, margins: { leftMm: 25, rightMm: 25 } },
  stamp: { widthMm: 200, heightMm: 200 },
  gap: { xMm: 0, yMm: 0 },
  arrangement: "straight",
};

describe("POST /api/v1/layout", () => {
  it("answers a 100 m plan in the SPEC section 6 shape, with its defaults", async () => {
    const res = await api("POST", "/api/v1/layout", { session: planner, body: hundredMetres });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      across: 5,
      rowsPerMetre: 5,
      impressionsPerMetre: 25,
      impressionsTotal: 2500,
      leftover: { leftMm: 50, rightMm: 50 },
      group: "p1",
      pathName: "tubruk",
      edges: "whole",
      sides: 1,
    });
    expect(res.body.waxedAreaPerMetreM2).toBeCloseTo(1, 9);
    expect(res.body.waxedAreaTotalM2).toBeCloseTo(100, 6);
    expect(res.body.preview).toBeUndefined();
  });

  it("takes an API token, defaults the gap, and draws a preview when asked", async () => {
    const { gap: _gap, ...withoutGap } = hundredMetres;
    void _gap;
    const res = await api("POST", "/api/v1/layout", { token: designerToken, body: { ...withoutGap, arrangement: "half-drop", sides: 2, preview: true } });
    expect(res.status).toBe(200);
    expect(res.body.group).toBe("p1");
    expect(res.body.impressionsPerMetre).toBe(50);
    expect(res.body.preview).toMatch(/^<svg[\s>]/);
  });

  it("refuses without a session or token (401)", async () => {
    const res = await api("POST", "/api/v1/layout", { body: hundredMetres });
    expect(res.status).toBe(401);
  });

  it("names each bad field (400)", async () => {
    const res = await api("POST", "/api/v1/layout", {
      session: planner,
      body: { ...hundredMetres, cloth: { widthMm: -5, lengthMm: 100_000 }, arrangement: "zigzag", stamp: { widthMm: 0.01, heightMm: 200 } },
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["arrangement", "cloth.widthMm", "stamp.widthMm"]);
    expect(res.body.error.fields.arrangement[0]).toMatch(/half-drop/);
  });

  it("refuses a 10 km run (400, on the length)", async () => {
    const res = await api("POST", "/api/v1/layout", { session: planner, body: { ...hundredMetres, cloth: { ...hundredMetres.cloth, lengthMm: 10_000_000 } } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields["cloth.lengthMm"][0]).toMatch(/at most/);
  });

  it("explains a stamp wider than the band (422) with the numbers", async () => {
    const res = await api("POST", "/api/v1/layout", {
      session: planner,
      body: { ...hundredMetres, cloth: { widthMm: 300, lengthMm: 1000, margins: { leftMm: 60, rightMm: 60 } } },
    });
    expect(res.status).toBe(422);
    expect(res.body.error.fields["stamp.widthMm"][0]).toBe(
      "The stamp (200 mm across) is wider than the band between the margins (180 mm). Narrow the margins or use a narrower stamp.",
    );
  });

  it("refuses an outline that is not path data (422) and one without area", async () => {
    const bad = await api("POST", "/api/v1/layout", { session: planner, body: { ...hundredMetres, stamp: { widthMm: 200, heightMm: 200, outline: "M 0 0 L banana" } } });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields["stamp.outline"][0]).toMatch(/not valid SVG path data/);
    const flat = await api("POST", "/api/v1/layout", { session: planner, body: { ...hundredMetres, stamp: { widthMm: 200, heightMm: 200, outline: "M 0 0 L 100 100 Z" } } });
    expect(flat.status).toBe(422);
    expect(flat.body.error.fields["stamp.outline"][0]).toMatch(/no area/);
  });

  it("lays out a library stamp by its code, with its scan-measured coverage or its outline", async () => {
    const suffix = Date.now().toString(36).toUpperCase();
    await db().insert(stamps).values([
      { code: `LY-COV-${suffix}`, name: "Half-waxed test stamp", widthMm: 200, heightMm: 200, coverageRatio: 0.5 },
      // A 100 mm square outline in a 200 mm footprint: a quarter of the footprint carries wax.
      { code: `LY-OUT-${suffix}`, name: "Outlined test stamp", widthMm: 200, heightMm: 200, coverageRatio: 0.9, outlinePath: "M50 50 H150 V150 H50 Z" },
    ]);
    const byCoverage = await api("POST", "/api/v1/layout", { session: planner, body: { ...hundredMetres, stamp: { code: `ly-cov-${suffix}` } } });
    expect(byCoverage.status).toBe(200);
    expect(byCoverage.body.waxedAreaPerMetreM2).toBeCloseTo(0.5, 9);
    const byOutline = await api("POST", "/api/v1/layout", { session: planner, body: { ...hundredMetres, stamp: { code: `LY-OUT-${suffix}` } } });
    expect(byOutline.body.waxedAreaPerMetreM2).toBeCloseTo(0.25, 9);
  });

  it("answers 422 for a stamp code the library does not hold", async () => {
    const res = await api("POST", "/api/v1/layout", { session: planner, body: { ...hundredMetres, stamp: { code: "CP-9999" } } });
    expect(res.status).toBe(422);
    expect(res.body.error.fields["stamp.code"]).toHaveLength(1);
  });

  it("wants JSON (415)", async () => {
    const res = await api("POST", "/api/v1/layout", { session: planner, rawBody: "cloth=1", headers: { "content-type": "text/plain" } });
    expect(res.status).toBe(415);
  });
});
