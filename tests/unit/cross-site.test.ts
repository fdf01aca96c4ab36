import { describe, expect, it } from "vitest";
import { isCrossSite, originOf } from "@/lib/api/cross-site";

const req = (method: string, headers: Record<string, string>) => new Request("http://localhost:3000/api/v1/users", { method, headers });
const app = new Set(["http://localhost:3000"]);
const isCross = (request: Request) => isCrossSite(request, app);

describe("isCrossSite", () => {
  it("lets reads through whatever their origin", () => {
    expect(isCross(req("GET", { origin: "http://evil.test", "sec-fetch-site": "cross-site" }))).toBe(false);
  });
  it("refuses a write a browser marks cross-site or same-site", () => {
    expect(isCross(req("POST", { "sec-fetch-site": "cross-site" }))).toBe(true);
    expect(isCross(req("DELETE", { "sec-fetch-site": "same-site" }))).toBe(true);
  });
  it("refuses a write whose Origin is another host", () => {
    expect(isCross(req("POST", { origin: "http://evil.test", host: "localhost:3000" }))).toBe(true);
    expect(isCross(req("POST", { origin: "http://localhost:3001", host: "localhost:3000" }))).toBe(true);
    expect(isCross(req("POST", { origin: "null", host: "localhost:3000" }))).toBe(true);
  });
  it("accepts same-origin writes and scripts that send no browser headers", () => {
    expect(isCross(req("POST", { origin: "http://localhost:3000", host: "localhost:3000", "sec-fetch-site": "same-origin" }))).toBe(false);
    expect(isCross(req("PATCH", { authorization: "Bearer cg_x" }))).toBe(false);
  });
  it("compares scheme and port too, not the host name alone", () => {
    expect(isCross(req("POST", { origin: "https://localhost:3000", host: "localhost:3000" }))).toBe(true);
    expect(isCross(req("POST", { origin: "http://localhost", host: "localhost" }))).toBe(true);
  });
  it("ignores Host and X-Forwarded-Host: a spoofed pair cannot make a foreign origin look like ours", () => {
    expect(isCross(req("POST", { origin: "http://evil.test", host: "evil.test", "x-forwarded-host": "evil.test" }))).toBe(true);
  });
  it("accepts each configured origin, compared in normal form", () => {
    const two = new Set(["https://capgrid.example", "https://office.example:8443"]);
    expect(isCrossSite(req("POST", { origin: "https://CAPGRID.example:443" }), two)).toBe(false);
    expect(isCrossSite(req("POST", { origin: "https://office.example:8443" }), two)).toBe(false);
    expect(isCrossSite(req("POST", { origin: "https://office.example" }), two)).toBe(true);
  });
  it("normalizes origins and refuses opaque ones", () => {
    expect(originOf("HTTP://LocalHost:80/path")).toBe("http://localhost");
    expect(originOf("null")).toBeNull();
    expect(originOf("file:///etc/passwd")).toBeNull();
  });
});
