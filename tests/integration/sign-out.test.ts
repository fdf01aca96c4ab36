import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { locations } from "@/db/schema";
import { createUser, db } from "../helpers/db";
import { actionIdOfForm, api, page, postAction, signIn, signOut, type Session } from "../helpers/http";
import { uniquePrefix } from "../helpers/stamps";

const me = async (session: Session) => (await api("GET", "/api/v1/me", { session })).status;

async function expectEnded(session: Session) {
  expect(await me(session)).toBe(401);
  const site = `Signed-out site ${uniquePrefix("SO")}`;
  const write = await api("POST", "/api/v1/locations", { session, body: { site, code: "R1" } });
  expect(write.status).toBe(401);
  expect(await db().select().from(locations).where(eq(locations.site, site))).toHaveLength(0);
  const shelf = await page("/stamps", session);
  expect(shelf.status).toBe(307);
  expect(shelf.headers.get("location")).toMatch(/\/signin/);
}

describe("signing out ends the session", () => {
  it("a cookie copied before POST /api/auth/signout gets 401 on reads and writes, and pages send it to sign-in", async () => {
    const user = await createUser("keeper");
    const session = (await signIn(user.email, user.password))!;
    const copied: Session = { cookie: session.cookie };
    expect(await me(copied)).toBe(200);

    expect(await signOut(session)).toBe(302);
    await expectEnded(copied);
  });

  it("the header's Sign out button ends the session the same way", async () => {
    const user = await createUser("planner");
    const session = (await signIn(user.email, user.password))!;
    const home = await page("/", session);
    expect(home.status).toBe(200);
    const answer = await postAction("/", actionIdOfForm(home.html, "Sign out"), session);
    expect(answer.status).toBe(303);
    expect(answer.headers.get("location")).toMatch(/\/signin/);
    await expectEnded(session);
  });

  it("ends only that session: the same person signed in elsewhere stays signed in", async () => {
    const user = await createUser("designer");
    const laptop = (await signIn(user.email, user.password))!;
    const workshop = (await signIn(user.email, user.password))!;
    await signOut(laptop);
    expect(await me(laptop)).toBe(401);
    expect(await me(workshop)).toBe(200);
  });

  it("Sign out everywhere on My account ends every session of that person, and only theirs; API tokens keep working", async () => {
    const user = await createUser("waxmaster");
    const other = await createUser("waxmaster");
    const here = (await signIn(user.email, user.password))!;
    const there = (await signIn(user.email, user.password))!;
    const someoneElse = (await signIn(other.email, other.password))!;
    const token = (await api("POST", "/api/v1/tokens", { session: here, body: { name: "nightly export" } })).body.token.secret as string;

    const account = await page("/account", here);
    expect(account.html).toContain("You have 2 active sessions");
    const answer = await postAction("/account", actionIdOfForm(account.html, "Sign out everywhere"), here);
    expect(answer.status).toBe(303);
    expect(answer.headers.get("location")).toMatch(/\/signin\?notice=signed-out-everywhere/);

    await expectEnded(here);
    await expectEnded(there);
    expect(await me(someoneElse)).toBe(200);
    expect((await api("GET", "/api/v1/me", { token })).status).toBe(200);
    // A fresh sign-in works as before.
    expect(await me((await signIn(user.email, user.password))!)).toBe(200);
  });
});
