import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { userTokens } from "@/db/schema";
import { setPasswordWithToken } from "@/lib/data/users";
import { AppError } from "@/lib/errors";
import { createUser, db, reloadUser } from "../helpers/db";
import { api, signIn } from "../helpers/http";
import { latestMailTo, linkIn, tokenOf } from "../helpers/mail";

async function adminSession() {
  const admin = await createUser("admin");
  return (await signIn(admin.email, admin.password))!;
}

describe("sessions end when the account changes", () => {
  it("a disabled user's old session is refused, and they cannot sign in again", async () => {
    const admin = await adminSession();
    const user = await createUser("keeper");
    const session = (await signIn(user.email, user.password))!;
    expect((await api("GET", "/api/v1/me", { session })).status).toBe(200);

    expect((await api("PATCH", `/api/v1/users/${user.id}`, { session: admin, body: { disabled: true } })).status).toBe(200);
    expect((await api("GET", "/api/v1/me", { session })).status).toBe(401);
    expect(await signIn(user.email, user.password)).toBeNull();
  });

  it("a role change ends the old session; a new sign-in carries the new role", async () => {
    const admin = await adminSession();
    const user = await createUser("designer");
    const session = (await signIn(user.email, user.password))!;
    await api("PATCH", `/api/v1/users/${user.id}`, { session: admin, body: { role: "planner" } });
    expect((await api("GET", "/api/v1/me", { session })).status).toBe(401);
    const fresh = (await signIn(user.email, user.password))!;
    expect((await api("GET", "/api/v1/me", { session: fresh })).body.role).toBe("planner");
  });

  it("a password changed through a reset link ends the old session", async () => {
    const admin = await adminSession();
    const user = await createUser("waxmaster");
    const session = (await signIn(user.email, user.password))!;
    expect((await api("POST", `/api/v1/users/${user.id}/reset-link`, { session: admin })).status).toBe(204);
    const token = tokenOf(linkIn(await latestMailTo(user.email, /reset/i)));

    await setPasswordWithToken(token, "a brand new passphrase");
    expect((await api("GET", "/api/v1/me", { session })).status).toBe(401);
    expect(await signIn(user.email, user.password)).toBeNull();
    expect(await signIn(user.email, "a brand new passphrase")).not.toBeNull();
  });
});

describe("reset links", () => {
  it("work once", async () => {
    const admin = await adminSession();
    const user = await createUser("planner");
    await api("POST", `/api/v1/users/${user.id}/reset-link`, { session: admin });
    const token = tokenOf(linkIn(await latestMailTo(user.email, /reset/i)));
    await expect(setPasswordWithToken(token, "first new password")).resolves.toEqual({ email: user.email });
    await expect(setPasswordWithToken(token, "second new password")).rejects.toMatchObject({ code: "tokenInvalid" });
    expect(await signIn(user.email, "first new password")).not.toBeNull();
  });

  it("expire", async () => {
    const admin = await adminSession();
    const user = await createUser("planner");
    await api("POST", `/api/v1/users/${user.id}/reset-link`, { session: admin });
    const token = tokenOf(linkIn(await latestMailTo(user.email, /reset/i)));
    await db().update(userTokens).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(userTokens.userId, user.id));
    const error = await setPasswordWithToken(token, "too late password").catch((e) => e);
    expect(error).toBeInstanceOf(AppError);
    expect(error.code).toBe("tokenInvalid");
    expect((await reloadUser(user.id)).passwordHash).toBe(user.passwordHash);
  });

  it("are stored only as a hash", async () => {
    const admin = await adminSession();
    const user = await createUser("keeper");
    await api("POST", `/api/v1/users/${user.id}/reset-link`, { session: admin });
    const token = tokenOf(linkIn(await latestMailTo(user.email, /reset/i)));
    const rows = await db().select().from(userTokens).where(eq(userTokens.userId, user.id));
    expect(rows).toHaveLength(1);
    expect(rows[0].tokenHash).not.toContain(token);
    expect(rows[0].tokenHash).toMatch(/^[0-9a-f]{64}$/);
  });
});

describe("API tokens", () => {
  it("authenticate with the owner's role; a revoked one does not", async () => {
    const user = await createUser("keeper");
    const session = (await signIn(user.email, user.password))!;
    const created = await api("POST", "/api/v1/tokens", { session, body: { name: "stock export" } });
    const secret = created.body.token.secret as string;
    expect(secret).toMatch(/^cg_/);

    const me = await api("GET", "/api/v1/me", { token: secret });
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ email: user.email, role: "keeper", via: "token" });
    expect((await api("GET", "/api/v1/users", { token: secret })).status).toBe(403);

    await api("DELETE", `/api/v1/tokens/${created.body.token.id}`, { session });
    expect((await api("GET", "/api/v1/me", { token: secret })).status).toBe(401);
  });

  it("a made-up or malformed token is refused", async () => {
    expect((await api("GET", "/api/v1/me", { token: "cg_not-a-real-token-at-all" })).status).toBe(401);
    expect((await api("GET", "/api/v1/me", { headers: { authorization: "Basic abc" } })).status).toBe(401);
  });

  it("stop working when the owner is disabled", async () => {
    const admin = await adminSession();
    const user = await createUser("designer");
    const session = (await signIn(user.email, user.password))!;
    const secret = (await api("POST", "/api/v1/tokens", { session, body: { name: "x" } })).body.token.secret;
    await api("PATCH", `/api/v1/users/${user.id}`, { session: admin, body: { disabled: true } });
    expect((await api("GET", "/api/v1/me", { token: secret })).status).toBe(401);
  });

  it("cannot mint more tokens", async () => {
    const user = await createUser("designer");
    const session = (await signIn(user.email, user.password))!;
    const secret = (await api("POST", "/api/v1/tokens", { session, body: { name: "x" } })).body.token.secret;
    expect((await api("POST", "/api/v1/tokens", { token: secret, body: { name: "y" } })).status).toBe(403);
  });
});

describe("failed sign-ins", () => {
  it("are slowed down after 10 in 15 minutes, even with the right password then", async () => {
    const user = await createUser("keeper");
    for (let i = 0; i < 10; i++) expect(await signIn(user.email, `wrong guess ${i}`)).toBeNull();
    expect(await signIn(user.email, user.password)).toBeNull();
  });

  it("of one account do not block another", async () => {
    const other = await createUser("keeper");
    expect(await signIn(other.email, other.password)).not.toBeNull();
  });
});
