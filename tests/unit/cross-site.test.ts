import { describe, expect, it } from "vitest";
import { isCrossSite } from "@/lib/api/cross-site";

const req = (method: string, headers: Record<string, string>) => new Request("http://localhost:3000/api/v1/users", { method, headers });

describe("isCrossSite", () => {
  it("lets reads through whatever their origin", () => {
    expect(isCrossSite(req("GET", { origin: "http://evil.test", "sec-fetch-site": "cross-site" }))).toBe(false);
  });
  it("refuses a write a browser marks cross-site or same-site", () => {
    expect(isCrossSite(req("POST", { "sec-fetch-site": "cross-site" }))).toBe(true);
    expect(isCrossSite(req("DELETE", { "sec-fetch-site": "same-site" }))).toBe(true);
  });
  it("refuses a write whose Origin is another host", () => {
    expect(isCrossSite(req("POST", { origin: "http://evil.test", host: "localhost:3000" }))).toBe(true);
    expect(isCrossSite(req("POST", { origin: "http://localhost:3001", host: "localhost:3000" }))).toBe(true);
    expect(isCrossSite(req("POST", { origin: "null", host: "localhost:3000" }))).toBe(true);
  });
  it("accepts same-origin writes and scripts that send no browser headers", () => {
    expect(isCrossSite(req("POST", { origin: "http://localhost:3000", host: "localhost:3000", "sec-fetch-site": "same-origin" }))).toBe(false);
    expect(isCrossSite(req("PATCH", { authorization: "Bearer cg_x" }))).toBe(false);
  });
});
