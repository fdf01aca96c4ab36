import { describe, expect, it } from "vitest";
import { testEnv } from "../helpers/env";

// The load balancer's check: no sign-in, no caching, both dependencies reported; other methods are not offered.
describe("GET /api/health", () => {
  it("answers 200 with the database and the object store reachable, without a session", async () => {
    const res = await fetch(`${testEnv().appUrl}/api/health`);
    expect(res.status).toBe(200);
    expect(res.headers.get("cache-control")).toBe("no-store");
    expect(await res.json()).toEqual({ ok: true, database: "ok", objectStore: "ok" });
  });

  it("does not take writes", async () => {
    const res = await fetch(`${testEnv().appUrl}/api/health`, { method: "POST" });
    expect(res.status).toBe(405);
  });
});
