import { count } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { users } from "@/db/schema";
import { createUser, db, uniqueEmail } from "../helpers/db";
import { api, signIn, type Session } from "../helpers/http";

let admin: Session;
beforeAll(async () => {
  const user = await createUser("admin");
  admin = (await signIn(user.email, user.password))!;
});
const userCount = async () => (await db().select({ n: count() }).from(users))[0].n;

describe("bad input", () => {
  it("gets 400 with a message per field", async () => {
    const res = await api("POST", "/api/v1/users", { session: admin, body: { email: "not-an-address", name: "", role: "emperor" } });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("validation");
    expect(res.body.error.fields.email[0]).toMatch(/e-mail address/i);
    expect(res.body.error.fields.name[0]).toMatch(/required/i);
    expect(res.body.error.fields.role[0]).toMatch(/choose one of/i);
  });

  it("names a missing field as required", async () => {
    const res = await api("POST", "/api/v1/users", { session: admin, body: { name: "Someone" } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.email).toEqual(["Required."]);
  });

  it("gets 400 for broken JSON and 415 for another content type", async () => {
    expect((await api("POST", "/api/v1/users", { session: admin, rawBody: "{ nope", headers: { "content-type": "application/json" } })).status).toBe(400);
    expect((await api("POST", "/api/v1/users", { session: admin, rawBody: "email=x", headers: { "content-type": "application/x-www-form-urlencoded" } })).status).toBe(415);
  });

  it("gets 400 for a malformed id and 404 for an unknown one", async () => {
    expect((await api("PATCH", "/api/v1/users/123", { session: admin, body: { name: "x" } })).status).toBe(400);
    expect((await api("PATCH", "/api/v1/users/00000000-0000-4000-8000-000000000000", { session: admin, body: { name: "x" } })).status).toBe(404);
  });

  it("a duplicate e-mail gets 409 naming the field, whatever its case", async () => {
    const email = uniqueEmail("dupe");
    expect((await api("POST", "/api/v1/users", { session: admin, body: { email, name: "One", role: "keeper" } })).status).toBe(201);
    const res = await api("POST", "/api/v1/users", { session: admin, body: { email: email.toUpperCase(), name: "Two", role: "keeper" } });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.email).toHaveLength(1);
  });
});

describe("cross-site requests", () => {
  it("a POST with another site's Origin is refused and changes nothing", async () => {
    const before = await userCount();
    const res = await api("POST", "/api/v1/users", {
      session: admin,
      headers: { origin: "http://evil.test" },
      body: { email: uniqueEmail("csrf"), name: "Sneaky", role: "admin" },
    });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("crossSite");
    expect(await userCount()).toBe(before);
  });

  it("a browser's Sec-Fetch-Site: cross-site is refused", async () => {
    const res = await api("POST", "/api/v1/tokens", { session: admin, headers: { "sec-fetch-site": "cross-site" }, body: { name: "x" } });
    expect(res.status).toBe(403);
  });

  it("a same-origin POST passes", async () => {
    const { appUrl } = await import("../helpers/env").then((m) => m.testEnv());
    const res = await api("POST", "/api/v1/tokens", { session: admin, headers: { origin: appUrl, "sec-fetch-site": "same-origin" }, body: { name: "same site" } });
    expect(res.status).toBe(201);
  });
});
