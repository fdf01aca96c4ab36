import { beforeAll, describe, expect, it } from "vitest";
import { createUser } from "../helpers/db";
import { api, rawRequest, signIn, type Session } from "../helpers/http";

let planner: Session;
let keeper: Session;
beforeAll(async () => {
  const p = await createUser("planner");
  planner = (await signIn(p.email, p.password))!;
  const k = await createUser("keeper");
  keeper = (await signIn(k.email, k.password))!;
});

const plan = (outline: string) => ({
  cloth: { widthMm: 1150, lengthMm: 10_000 },
  stamp: { widthMm: 200, heightMm: 200, outline },
  arrangement: "straight",
});

/** A closed zigzag of `n` line segments inside a 200 mm footprint. */
function zigzag(n: number): string {
  let d = "M0 0";
  for (let i = 0; i < n; i++) d += ` L${(i % 200).toFixed(3)} ${((i * 7) % 200).toFixed(3)}`;
  return `${d} Z`;
}

describe("the outline's size is capped before it is parsed", () => {
  it("a 480 KB outline gets 400 naming the byte limit", async () => {
    const outline = zigzag(30_000).padEnd(480_000, " ");
    expect(outline.length).toBeGreaterThanOrEqual(480_000);
    const res = await api("POST", "/api/v1/layout", { session: planner, body: plan(outline) });
    expect(res.status).toBe(400);
    expect(res.body.error.fields["stamp.outline"].join(" ")).toMatch(/200,000 bytes/);
  });

  it("an outline under the byte limit with too many path segments gets 422 naming the segment limit", async () => {
    const outline = zigzag(6_000);
    expect(outline.length).toBeLessThan(200_000);
    const res = await api("POST", "/api/v1/layout", { session: planner, body: plan(outline) });
    expect(res.status).toBe(422);
    expect(res.body.error.fields["stamp.outline"].join(" ")).toMatch(/5,000 path segments/);
  });

  it("an outline whose curves would flatten to too many points is refused with the point limit", async () => {
    let outline = "M100 100";
    for (let i = 0; i < 2000; i++) outline += ` A90 90 0 1 1 ${i % 2 ? 101 : 99} 100`;
    const res = await api("POST", "/api/v1/layout", { session: planner, body: plan(`${outline} Z`) });
    expect(res.status).toBe(422);
    expect(res.body.error.fields["stamp.outline"].join(" ")).toMatch(/more than 100,000 points/);
  });
});

describe("JSON bodies are limited to 1 MiB", () => {
  const big = () => JSON.stringify({ code: "BIG-1", name: "Big", widthMm: 200, heightMm: 200, notes: "x".repeat(1_500_000) });

  it("a body over the limit gets 413", async () => {
    const res = await rawRequest("/api/v1/stamps", { method: "POST", headers: { cookie: keeper.cookie, "content-type": "application/json" }, body: big() });
    expect(res.status).toBe(413);
    expect(JSON.parse(res.text).error.code).toBe("payloadTooLarge");
  });

  it("also when it arrives in chunks without a Content-Length", async () => {
    const res = await rawRequest("/api/v1/stamps", { method: "POST", chunked: true, headers: { cookie: keeper.cookie, "content-type": "application/json" }, body: big() });
    expect(res.status).toBe(413);
  });

  it("on every JSON route, e.g. the layout and a check-out", async () => {
    for (const path of ["/api/v1/layout", "/api/v1/stamps/ANY-1/checkout", "/api/v1/tokens"]) {
      const res = await rawRequest(path, { method: "POST", chunked: true, headers: { cookie: keeper.cookie, "content-type": "application/json" }, body: big() });
      expect(res.status).toBe(413);
    }
  });

  it("a CSV import over its 5 MB limit sent in chunks gets 413", async () => {
    const csv = `code,name,width_mm,height_mm\n${"A,B,1,1\n".repeat(800_000)}`;
    const res = await rawRequest("/api/v1/stamps/import", { method: "POST", chunked: true, headers: { cookie: keeper.cookie, "content-type": "text/csv" }, body: csv });
    expect(res.status).toBe(413);
  });
});
