import { describe, expect, it } from "vitest";
import { baselineHeaders, contentSecurityPolicy, newNonce, permissionsPolicy, type SecurityConfig } from "@/lib/security-headers";
import { uploadOrigin } from "@/lib/upload-origin";

const local: SecurityConfig = { appUrl: "http://localhost:3000", uploadOrigin: "http://127.0.0.1:4568", dev: false };
const deployed: SecurityConfig = { appUrl: "https://capgrid.example", uploadOrigin: "https://capgrid-scans.s3.eu-west-1.amazonaws.com", dev: false };

describe("the Content-Security-Policy", () => {
  it("allows scripts and style elements only with the nonce, and no eval outside next dev", () => {
    const csp = contentSecurityPolicy("abc123", local);
    expect(csp).toContain("script-src 'self' 'nonce-abc123' 'strict-dynamic'");
    expect(csp).toContain("style-src 'self' 'nonce-abc123'");
    expect(csp).not.toContain("unsafe-eval");
    expect(csp).not.toContain("unsafe-inline");
    expect(contentSecurityPolicy("abc123", { ...local, dev: true })).toContain("'unsafe-eval'");
  });

  it("lets the page start workers from its own origin only (the planner's layout worker)", () => {
    expect(contentSecurityPolicy("n", local)).toContain("worker-src 'self';");
  });

  it("lets pages reach the object store for presigned uploads, and nothing else outside", () => {
    expect(contentSecurityPolicy("n", deployed)).toContain("connect-src 'self' https://capgrid-scans.s3.eu-west-1.amazonaws.com;");
  });

  it("forbids framing and plugins, and upgrades insecure requests on an https deployment only", () => {
    for (const config of [local, deployed]) {
      const csp = contentSecurityPolicy("n", config);
      expect(csp).toContain("frame-ancestors 'none'");
      expect(csp).toContain("object-src 'none'");
      expect(csp).toContain("base-uri 'self'");
    }
    expect(contentSecurityPolicy("n", local)).not.toContain("upgrade-insecure-requests");
    expect(contentSecurityPolicy("n", deployed)).toContain("upgrade-insecure-requests");
  });

  it("gets a different, unguessable nonce each time", () => {
    const nonces = new Set(Array.from({ length: 100 }, () => newNonce()));
    expect(nonces.size).toBe(100);
    for (const nonce of nonces) expect(nonce).toMatch(/^[A-Za-z0-9+/]{24}$/);
  });
});

describe("the other headers", () => {
  it("are the same on every answer; HSTS only when APP_URL is https", () => {
    expect(baselineHeaders(local)).toEqual({
      "x-content-type-options": "nosniff",
      "referrer-policy": "strict-origin-when-cross-origin",
      "permissions-policy": permissionsPolicy,
      "x-frame-options": "DENY",
    });
    expect(baselineHeaders(deployed)["strict-transport-security"]).toBe("max-age=31536000");
  });

  it("allow the camera to the app itself and no other device", () => {
    const features = Object.fromEntries(permissionsPolicy.split(", ").map((f) => f.split("=")));
    expect(features.camera).toBe("(self)");
    for (const [name, allow] of Object.entries(features)) if (name !== "camera") expect(allow, name).toBe("()");
  });
});

describe("the upload origin", () => {
  it("is the endpoint's origin with path-style addressing", () => {
    expect(uploadOrigin({ endpoint: "http://127.0.0.1:4568/", region: "us-east-1", bucket: "capgrid-scans", forcePathStyle: true })).toBe("http://127.0.0.1:4568");
  });
  it("puts the bucket in the host name otherwise, and is AWS's regional endpoint when none is set", () => {
    expect(uploadOrigin({ endpoint: "", region: "eu-west-1", bucket: "capgrid-scans", forcePathStyle: false })).toBe("https://capgrid-scans.s3.eu-west-1.amazonaws.com");
    expect(uploadOrigin({ endpoint: undefined, region: "eu-west-1", bucket: "capgrid-scans", forcePathStyle: true })).toBe("https://s3.eu-west-1.amazonaws.com");
  });
});
