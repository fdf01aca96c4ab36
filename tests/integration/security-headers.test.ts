import { beforeAll, describe, expect, it } from "vitest";
import { createUser } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { page, signIn, type Session } from "../helpers/http";

let keeper: Session;
beforeAll(async () => {
  const user = await createUser("keeper");
  keeper = (await signIn(user.email, user.password))!;
});

/** "a b; c d" → { a: ["b"], c: ["d"] } */
function directives(csp: string): Record<string, string[]> {
  return Object.fromEntries(
    csp
      .split(";")
      .map((d) => d.trim().split(/\s+/))
      .filter((parts) => parts[0])
      .map(([name, ...values]) => [name, values]),
  );
}

function expectBaseline(headers: Headers) {
  expect(headers.get("x-content-type-options")).toBe("nosniff");
  expect(headers.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
  expect(headers.get("permissions-policy")).toMatch(/(^|, )camera=\(self\)(,|$)/);
  expect(headers.get("permissions-policy")).toMatch(/microphone=\(\)/);
  // The test app runs on http: HSTS belongs to https origins only.
  expect(headers.get("strict-transport-security")).toBeNull();
}

/** The nonce of a page's CSP, after checking the policy itself. */
function checkedNonce(headers: Headers): string {
  const csp = headers.get("content-security-policy");
  expect(csp).toBeTruthy();
  const d = directives(csp!);
  const nonce = /'nonce-([A-Za-z0-9+/=]+)'/.exec(csp!)?.[1];
  expect(nonce).toBeTruthy();
  expect(d["script-src"]).toEqual(expect.arrayContaining(["'self'", `'nonce-${nonce}'`, "'strict-dynamic'"]));
  expect(d["script-src"]).not.toContain("'unsafe-eval'");
  expect(d["script-src"]).not.toContain("'unsafe-inline'");
  expect(d["style-src"]).toEqual(expect.arrayContaining(["'self'", `'nonce-${nonce}'`]));
  expect(d["style-src"]).not.toContain("'unsafe-inline'");
  expect(d["frame-ancestors"]).toEqual(["'none'"]);
  expect(d["object-src"]).toEqual(["'none'"]);
  expect(d["base-uri"]).toEqual(["'self'"]);
  expect(d["form-action"]).toEqual(["'self'"]);
  // Scans are PUT straight to the object store with presigned URLs.
  expect(d["connect-src"]).toEqual(expect.arrayContaining(["'self'", new URL(process.env.S3_ENDPOINT!).origin]));
  return nonce!;
}

function expectScriptsCarry(html: string, nonce: string) {
  const scripts = html.match(/<script\b[^>]*>/g) ?? [];
  expect(scripts.length).toBeGreaterThan(0);
  for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`);
}

describe("HTML pages", () => {
  it("carry a Content-Security-Policy with a fresh nonce on every script, and the other headers", async () => {
    const first = await page("/signin");
    const second = await page("/signin");
    expect(first.status).toBe(200);
    const nonce = checkedNonce(first.headers);
    expect(checkedNonce(second.headers)).not.toBe(nonce);
    expectScriptsCarry(first.html, nonce);
    expectBaseline(first.headers);
  });

  it("signed-in pages too; the print sheet's A4 page style comes from the app's stylesheet, which the CSP allows", async () => {
    const labels = await page("/stamps/labels", keeper);
    expect(labels.status).toBe(200);
    const nonce = checkedNonce(labels.headers);
    expectScriptsCarry(labels.html, nonce);
    expectBaseline(labels.headers);
    expect(labels.headers.get("cache-control")).toMatch(/no-store/);
    // No inline style element or attribute the CSP would refuse…
    expect(labels.html).not.toMatch(/<style(?![^>]*nonce=)/);
    expect(labels.html).not.toMatch(/<[a-z]+\b[^>]*\sstyle="/);
    // …the sheet is a named page, defined in the stylesheet served from the app's own origin.
    expect(labels.html).toContain('class="print-stamp-labels"');
    const stylesheets = [...labels.html.matchAll(/href="(\/_next\/static\/[^"]+\.css)"/g)].map((m) => m[1]);
    const css = (await Promise.all(stylesheets.map(async (href) => (await fetch(`${testEnv().appUrl}${href}`)).text()))).join("\n");
    expect(css).toMatch(/@page stamp-labels\s*\{[^}]*size:\s*A4/);
    expect(css).toMatch(/\.print-stamp-labels\s*\{\s*page:\s*stamp-labels/);
  });

  it("a redirect to sign-in and the not-found page carry them as well", async () => {
    const redirect = await page("/stamps");
    expect(redirect.status).toBe(307);
    expectBaseline(redirect.headers);
    const missing = await page("/no-such-page", keeper);
    expect(missing.status).toBe(404);
    expectBaseline(missing.headers);
    checkedNonce(missing.headers);
  });
});

describe("other answers", () => {
  it("API answers get nosniff and no-store, errors too", async () => {
    const { appUrl } = testEnv();
    for (const [path, cookie, status] of [
      ["/api/v1/me", keeper.cookie, 200],
      ["/api/v1/me", "", 401],
      ["/api/v1/no-such-thing", keeper.cookie, 404],
      ["/api/v1/stamps/export", keeper.cookie, 200],
    ] as const) {
      const response = await fetch(`${appUrl}${path}`, { headers: cookie ? { cookie } : {} });
      expect(response.status).toBe(status);
      expectBaseline(response.headers);
      expect(response.headers.get("cache-control")).toMatch(/no-store/);
    }
  });

  it("Auth.js's own answers carry them, and its session answer is not stored", async () => {
    const { appUrl } = testEnv();
    for (const path of ["/api/auth/csrf", "/api/auth/session"]) {
      const response = await fetch(`${appUrl}${path}`, { headers: { cookie: keeper.cookie } });
      expect(response.status).toBe(200);
      expectBaseline(response.headers);
      expect(response.headers.get("cache-control")).toMatch(/no-store/);
    }
  });

  it("static files get nosniff", async () => {
    const { appUrl } = testEnv();
    const html = (await page("/signin")).html;
    const stylesheet = /href="(\/_next\/static\/[^"]+\.css)"/.exec(html)?.[1];
    expect(stylesheet).toBeTruthy();
    const response = await fetch(`${appUrl}${stylesheet}`);
    expect(response.status).toBe(200);
    expect(response.headers.get("x-content-type-options")).toBe("nosniff");
  });

  it("session cookies are HttpOnly and SameSite=Lax, and not Secure on this http origin", async () => {
    const { appUrl } = testEnv();
    const csrf = await fetch(`${appUrl}/api/auth/csrf`);
    const cookie = csrf.headers.getSetCookie().find((c) => c.includes("authjs.csrf-token"))!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/;\s*Secure/i);
  });
});
