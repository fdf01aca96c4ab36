import { and, eq, inArray, ne } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { users } from "@/db/schema";
import { createUser, db, reloadUser } from "../helpers/db";
import { api, signIn, type Session } from "../helpers/http";

describe("the last active administrator", () => {
  // Other suites' admins are set aside while this runs, so the admins made here are the only active ones.
  let setAside: string[] = [];
  beforeAll(async () => {
    setAside = (await db().update(users).set({ disabled: true }).where(and(eq(users.role, "admin"), eq(users.disabled, false))).returning({ id: users.id })).map((u) => u.id);
  });
  afterAll(async () => {
    if (setAside.length) await db().update(users).set({ disabled: false }).where(inArray(users.id, setAside));
  });

  it("cannot demote or disable themselves (409 lastAdmin, nothing changes); with a second admin, that one may demote them", async () => {
    const only = await createUser("admin");
    const session = (await signIn(only.email, only.password))!;
    for (const patch of [{ role: "keeper" }, { disabled: true }, { role: "planner", disabled: false }]) {
      const res = await api("PATCH", `/api/v1/users/${only.id}`, { session, body: patch });
      expect(res.status, JSON.stringify(patch)).toBe(409);
      expect(res.body.error.code).toBe("lastAdmin");
      expect(res.body.error.message).toMatch(/last active administrator/);
    }
    expect(await reloadUser(only.id)).toMatchObject({ role: "admin", disabled: false, sessionVersion: only.sessionVersion });
    // Changing the name is fine.
    expect((await api("PATCH", `/api/v1/users/${only.id}`, { session, body: { name: "Sole Admin" } })).status).toBe(200);

    const second = await createUser("admin");
    // Still not themselves (another administrator can, so the one acting can always undo a mistake)…
    const self = await api("PATCH", `/api/v1/users/${only.id}`, { session, body: { role: "keeper" } });
    expect(self.status).toBe(409);
    expect(self.body.error.fields.role[0]).toMatch(/another administrator can/);
    // …but the second administrator may.
    const secondSession = (await signIn(second.email, second.password))!;
    const res = await api("PATCH", `/api/v1/users/${only.id}`, { session: secondSession, body: { role: "keeper" } });
    expect(res.status).toBe(200);
    expect((await reloadUser(only.id)).role).toBe("keeper");
    // The one left is now the last: they cannot go either.
    expect((await api("PATCH", `/api/v1/users/${second.id}`, { session: secondSession, body: { disabled: true } })).status).toBe(409);
    await db().update(users).set({ disabled: true }).where(inArray(users.id, [second.id]));
  });

  it("two administrators demoting each other at once leave one of them", async () => {
    const [a, b] = [await createUser("admin"), await createUser("admin")];
    const [sa, sb] = [(await signIn(a.email, a.password))!, (await signIn(b.email, b.password))!];
    const answers = await Promise.all([
      api("PATCH", `/api/v1/users/${b.id}`, { session: sa, body: { role: "designer" } }),
      api("PATCH", `/api/v1/users/${a.id}`, { session: sb, body: { role: "designer" } }),
    ]);
    // One goes through; the other is refused: 409 lastAdmin, or 401 when its sender's session had already
    // ended with the role.
    const statuses = answers.map((r) => r.status).sort();
    expect(statuses[0]).toBe(200);
    expect([401, 409]).toContain(statuses[1]);
    const left = await db().select().from(users).where(and(eq(users.role, "admin"), eq(users.disabled, false), inArray(users.id, [a.id, b.id])));
    expect(left).toHaveLength(1);
    await db().update(users).set({ disabled: true }).where(and(inArray(users.id, [a.id, b.id]), ne(users.role, "designer")));
  });
});

describe("everyone's API tokens", () => {
  let admin: Session;
  let keeper: Session;
  let keeperUser: Awaited<ReturnType<typeof createUser>>;
  beforeAll(async () => {
    const a = await createUser("admin");
    admin = (await signIn(a.email, a.password))!;
    keeperUser = await createUser("keeper");
    keeper = (await signIn(keeperUser.email, keeperUser.password))!;
  });

  it("are listed for administrators with owner, created and last used; other roles get 403", async () => {
    const { body } = await api("POST", "/api/v1/tokens", { session: keeper, body: { name: "Label printer" } });
    expect((await api("GET", "/api/v1/me", { token: body.token.secret })).status).toBe(200);
    const list = await api("GET", "/api/v1/admin/tokens", { session: admin });
    expect(list.status).toBe(200);
    const row = list.body.tokens.find((t: { id: string }) => t.id === body.token.id);
    expect(row).toMatchObject({ name: "Label printer", owner: { id: keeperUser.id, email: keeperUser.email } });
    expect(row.createdAt).toEqual(expect.any(String));
    expect(row.lastUsedAt).toEqual(expect.any(String));
    expect(row).not.toHaveProperty("secret");
    expect((await api("GET", "/api/v1/admin/tokens", { session: keeper })).status).toBe(403);
  });

  it("an administrator revokes anyone's token; a keeper cannot revoke another's, and the token keeps working until then", async () => {
    const other = await createUser("planner");
    const otherSession = (await signIn(other.email, other.password))!;
    const { body } = await api("POST", "/api/v1/tokens", { session: otherSession, body: { name: "Plan sync" } });
    expect((await api("DELETE", `/api/v1/admin/tokens/${body.token.id}`, { session: keeper })).status).toBe(403);
    expect((await api("DELETE", `/api/v1/tokens/${body.token.id}`, { session: keeper })).status).toBe(404);
    expect((await api("GET", "/api/v1/me", { token: body.token.secret })).status).toBe(200);
    expect((await api("DELETE", `/api/v1/admin/tokens/${body.token.id}`, { session: admin })).status).toBe(204);
    expect((await api("GET", "/api/v1/me", { token: body.token.secret })).status).toBe(401);
    expect((await api("DELETE", `/api/v1/admin/tokens/${body.token.id}`, { session: admin })).status).toBe(404);
  });
});
