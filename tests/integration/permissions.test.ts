import { count, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { users, type Role } from "@/db/schema";
import { roles } from "@/lib/permissions";
import { createUser, db, reloadUser, uniqueEmail } from "../helpers/db";
import { api, signIn, type Session } from "../helpers/http";

// SPEC section 2: only administrators manage people; everyone may read and keep their own account.
const sessions = {} as Record<Role, Session>;
let target: Awaited<ReturnType<typeof createUser>>;

beforeAll(async () => {
  for (const role of roles) {
    const user = await createUser(role);
    const session = await signIn(user.email, user.password);
    if (!session) throw new Error(`could not sign in as ${role}`);
    sessions[role] = session;
  }
  target = await createUser("designer");
});

const userCount = async () => (await db().select({ n: count() }).from(users))[0].n;

describe.each(roles)("as %s", (role) => {
  const isAdmin = role === "admin";

  it("GET /api/v1/me answers who I am", async () => {
    const res = await api("GET", "/api/v1/me", { session: sessions[role] });
    expect(res.status).toBe(200);
    expect(res.body.role).toBe(role);
    expect(res.body.permissions.includes("users:manage")).toBe(isAdmin);
  });

  it(`GET /api/v1/users is ${isAdmin ? "allowed" : "403"}`, async () => {
    const res = await api("GET", "/api/v1/users", { session: sessions[role] });
    expect(res.status).toBe(isAdmin ? 200 : 403);
    if (!isAdmin) expect(res.body.error.code).toBe("forbidden");
  });

  it(`POST /api/v1/users (invite) is ${isAdmin ? "allowed" : "403 and creates nobody"}`, async () => {
    const before = await userCount();
    const email = uniqueEmail(`invite-by-${role}`);
    const res = await api("POST", "/api/v1/users", { session: sessions[role], body: { email, name: "New Person", role: "keeper" } });
    expect(res.status).toBe(isAdmin ? 201 : 403);
    expect(await userCount()).toBe(before + (isAdmin ? 1 : 0));
  });

  it(`PATCH /api/v1/users/{id} is ${isAdmin ? "allowed" : "403 and changes nothing"}`, async () => {
    const before = await reloadUser(target.id);
    const newName = `Renamed by ${role}`;
    const res = await api("PATCH", `/api/v1/users/${target.id}`, { session: sessions[role], body: { name: newName } });
    expect(res.status).toBe(isAdmin ? 200 : 403);
    const after = await reloadUser(target.id);
    expect(after.name).toBe(isAdmin ? newName : before.name);
    expect(after.role).toBe(before.role);
  });

  it(`POST /api/v1/users/{id}/reset-link is ${isAdmin ? "allowed" : "403"}`, async () => {
    const res = await api("POST", `/api/v1/users/${target.id}/reset-link`, { session: sessions[role] });
    expect(res.status).toBe(isAdmin ? 204 : 403);
  });

  it("may create, list and revoke its own API tokens", async () => {
    const created = await api("POST", "/api/v1/tokens", { session: sessions[role], body: { name: `script of ${role}` } });
    expect(created.status).toBe(201);
    const list = await api("GET", "/api/v1/tokens", { session: sessions[role] });
    expect(list.body.tokens.map((t: { id: string }) => t.id)).toContain(created.body.token.id);
    expect(JSON.stringify(list.body)).not.toContain(created.body.token.secret);
    const revoked = await api("DELETE", `/api/v1/tokens/${created.body.token.id}`, { session: sessions[role] });
    expect(revoked.status).toBe(204);
  });
});

describe("without a session", () => {
  it("every API route answers 401 in JSON", async () => {
    for (const [method, path] of [
      ["GET", "/api/v1/me"],
      ["GET", "/api/v1/users"],
      ["POST", "/api/v1/users"],
      ["GET", "/api/v1/tokens"],
    ] as const) {
      const res = await api(method, path, method === "POST" ? { body: {} } : {});
      expect(res.status, `${method} ${path}`).toBe(401);
      expect(res.body.error.code).toBe("unauthenticated");
    }
  });

  it("an unknown API path answers a JSON 404", async () => {
    const res = await api("GET", "/api/v1/no-such-thing");
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe("notFound");
  });
});

describe("one user's tokens", () => {
  it("cannot be revoked by someone else", async () => {
    const created = await api("POST", "/api/v1/tokens", { session: sessions.keeper, body: { name: "keeper's" } });
    const res = await api("DELETE", `/api/v1/tokens/${created.body.token.id}`, { session: sessions.admin });
    expect(res.status).toBe(404);
    const still = await api("GET", "/api/v1/me", { token: created.body.token.secret });
    expect(still.status).toBe(200);
  });
});

describe("an admin", () => {
  it("cannot remove their own admin role", async () => {
    const me = await api("GET", "/api/v1/me", { session: sessions.admin });
    const res = await api("PATCH", `/api/v1/users/${me.body.id}`, { session: sessions.admin, body: { role: "keeper" } });
    expect(res.status).toBe(409);
    expect((await db().select().from(users).where(eq(users.id, me.body.id)))[0].role).toBe("admin");
  });
});
