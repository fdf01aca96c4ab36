import { count, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { apiTokens } from "@/db/schema";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { actionIdOfForm, api, page, postAction, signIn, type Session } from "../helpers/http";

let session: Session;
let userId: string;
beforeAll(async () => {
  const user = await createUser("designer");
  userId = user.id;
  session = (await signIn(user.email, user.password))!;
});
const tokenCount = async () => (await db().select({ n: count() }).from(apiTokens).where(eq(apiTokens.userId, userId)))[0].n;
const appOrigin = () => new URL(testEnv().appUrl);

describe("writes must come from the app's own origin", () => {
  it.each([
    ["another scheme on the same host and port", () => `https://${appOrigin().host}`],
    ["another port on the same host", () => `http://${appOrigin().hostname}:${Number(appOrigin().port) + 1}`],
    ["another host name for the same machine", () => `http://127.0.0.1:${appOrigin().port}`],
    ["an opaque origin", () => "null"],
  ])("%s is refused and changes nothing", async (_label, origin) => {
    const before = await tokenCount();
    const res = await api("POST", "/api/v1/tokens", { session, headers: { origin: origin() }, body: { name: "cross" } });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("crossSite");
    expect(await tokenCount()).toBe(before);
  });

  it("a spoofed X-Forwarded-Host with a matching Origin is refused", async () => {
    const before = await tokenCount();
    const res = await api("POST", "/api/v1/tokens", { session, headers: { origin: "http://evil.test", "x-forwarded-host": "evil.test", "x-forwarded-proto": "http" }, body: { name: "forwarded" } });
    expect(res.status).toBe(403);
    expect(await tokenCount()).toBe(before);
  });

  it("the app's own origin passes", async () => {
    const res = await api("POST", "/api/v1/tokens", { session, headers: { origin: appOrigin().origin, "sec-fetch-site": "same-origin" }, body: { name: "same origin" } });
    expect(res.status).toBe(201);
  });
});

describe("JSON bodies", () => {
  it.each(["text/plain; charset=application/json", "application/jsonx", "text/json-ish; x=application/json", "multipart/form-data; boundary=application/json"])(
    "%s is not JSON: 415, nothing stored",
    async (type) => {
      const before = await tokenCount();
      const res = await api("POST", "/api/v1/tokens", { session, rawBody: JSON.stringify({ name: "typed" }), headers: { "content-type": type } });
      expect(res.status).toBe(415);
      expect(await tokenCount()).toBe(before);
    },
  );

  it.each(["application/json", "Application/JSON; charset=utf-8", "application/vnd.capgrid+json"])("%s is JSON", async (type) => {
    const res = await api("POST", "/api/v1/tokens", { session, rawBody: JSON.stringify({ name: "typed" }), headers: { "content-type": type } });
    expect(res.status).toBe(201);
  });
});

describe("server actions posted from another origin", () => {
  it("a fetch-style action call gets 403 and the error page, not a 500", async () => {
    const { appUrl } = testEnv();
    const response = await fetch(`${appUrl}/account`, {
      method: "POST",
      redirect: "manual",
      headers: { cookie: session.cookie, origin: "http://evil.test", "next-action": "0123456789abcdef0123456789abcdef01234567", "content-type": "text/plain;charset=UTF-8" },
      body: "[]",
    });
    expect(response.status).toBe(403);
    expect(response.headers.get("content-type")).toMatch(/text\/html/);
    const html = await response.text();
    expect(html).toContain("This request came from another site");
  });

  it("a real form's action posted from another site does nothing: the session survives the forged sign-out", async () => {
    const home = await page("/", session);
    const signOutId = actionIdOfForm(home.html, "Sign out");
    const forged = await postAction("/", signOutId, session, { origin: "http://evil.test", "sec-fetch-site": "cross-site" });
    expect(forged.status).toBe(403);
    expect(forged.html).toContain("This request came from another site");
    expect((await api("GET", "/api/v1/me", { session })).status).toBe(200);
  });
});
