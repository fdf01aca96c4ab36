import { randomBytes } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { userTokens } from "@/db/schema";
import { hashSecret } from "@/lib/auth/secrets";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn, type Session } from "../helpers/http";
import { createStampRow, uniquePrefix } from "../helpers/stamps";

let planner: Session;
let keeper: Session;
const prefix = uniquePrefix("PG");

beforeAll(async () => {
  const p = await createUser("planner");
  planner = (await signIn(p.email, p.password))!;
  const k = await createUser("keeper");
  keeper = (await signIn(k.email, k.password))!;
});

async function page(path: string, session?: Session) {
  const response = await fetch(`${testEnv().appUrl}${path}`, { headers: session ? { cookie: session.cookie } : {}, redirect: "manual" });
  return { status: response.status, html: await response.text() };
}

// For notFound() in a nested page Next answers an HTML shell and the browser draws the page from the flight
// data in it (tests/e2e/shelf-forms.test.ts sees the result); either way the main navigation is in the answer.
const hasNavigation = (html: string) => /<nav[^>]*aria-label="Main"/.test(html) || html.includes('aria-label\\":\\"Main\\"');

describe("pages that do not exist", () => {
  it("an unknown stamp code answers 404 (not 200 with a message), with the header and navigation", async () => {
    const res = await page(`/stamps/${prefix}-NONE`, planner);
    expect(res.status).toBe(404);
    expect(res.html).toContain("No such stamp");
    expect(hasNavigation(res.html)).toBe(true);
    const known = await createStampRow({ code: `${prefix}-HERE` });
    expect((await page(`/stamps/${known.code}`, planner)).status).toBe(200);
  });

  it("so does every other lookup by address: an edit form, a count, an address no route knows", async () => {
    for (const path of [`/stamps/${prefix}-NONE/edit`, "/stamps/stock-takes/00000000-0000-4000-8000-000000000000", "/stamps/stock-takes/not-an-id", "/nothing/here"]) {
      const res = await page(path, keeper);
      expect(res.status, path).toBe(404);
      expect(hasNavigation(res.html), path).toBe(true);
    }
  });

  it("a favicon is served from public/", async () => {
    const ico = await fetch(`${testEnv().appUrl}/favicon.ico`);
    expect(ico.status).toBe(200);
    expect(ico.headers.get("content-type")).toMatch(/icon/);
    const bytes = Buffer.from(await ico.arrayBuffer());
    expect(bytes.readUInt16LE(2)).toBe(1); // ICO header: type 1 = icon
    expect((await fetch(`${testEnv().appUrl}/favicon.svg`)).status).toBe(200);
    expect((await page("/stamps", planner)).html).toMatch(/<link rel="icon" href="\/favicon\.(ico|svg)/);
  });
});

describe("the set-password page", () => {
  const linkWith = async (values: { usedAt?: Date; expiresAt: Date }) => {
    const user = await createUser("designer");
    const secret = randomBytes(32).toString("base64url");
    await db().insert(userTokens).values({ userId: user.id, kind: "invite", tokenHash: hashSecret(secret), ...values });
    return `/set-password?token=${encodeURIComponent(secret)}`;
  };

  it("checks the link before showing the form: used, expired and unknown links say so and offer no password field", async () => {
    const later = new Date(Date.now() + 3_600_000);
    const used = await page(await linkWith({ usedAt: new Date(), expiresAt: later }));
    expect(used.html).toContain("This link was used already");
    const expired = await page(await linkWith({ expiresAt: new Date(Date.now() - 1000) }));
    expect(expired.html).toContain("This link has expired");
    const unknown = await page(`/set-password?token=${"x".repeat(43)}`);
    expect(unknown.html).toContain("This link is not valid");
    for (const html of [used.html, expired.html, unknown.html]) expect(html).not.toContain('type="password"');
    const valid = await page(await linkWith({ expiresAt: later }));
    expect(valid.html).toContain('type="password"');
  });
});

describe("stamps with coverage under 1 %", () => {
  it("are listed by ?lowCoverage=true for the keepers to check, and nothing is rewritten", async () => {
    const low = await createStampRow({ code: `${prefix}-LOW`, coverageRatio: 0.0035 });
    const fine = await createStampRow({ code: `${prefix}-OK`, coverageRatio: 0.35 });
    const none = await createStampRow({ code: `${prefix}-NULL` });
    const res = await api("GET", `/api/v1/stamps?lowCoverage=true&q=${prefix}&pageSize=200`, { session: planner });
    expect(res.status).toBe(200);
    const codes = res.body.stamps.map((s: { code: string }) => s.code);
    expect(codes).toContain(low.code);
    expect(codes).not.toContain(fine.code);
    expect(codes).not.toContain(none.code);
    expect(res.body.stamps.find((s: { code: string }) => s.code === low.code).coverageRatio).toBe(0.0035);
    const rest = await api("GET", `/api/v1/stamps?lowCoverage=false&q=${prefix}&pageSize=200`, { session: planner });
    expect(rest.body.stamps.map((s: { code: string }) => s.code)).toEqual(expect.arrayContaining([fine.code, none.code]));
    expect(rest.body.stamps.map((s: { code: string }) => s.code)).not.toContain(low.code);
  });
});
