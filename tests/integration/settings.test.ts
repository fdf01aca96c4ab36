import { desc, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { userTokens, workshopSettingChanges, workshopSettings } from "@/db/schema";
import { roles } from "@/lib/permissions";
import { createUser, db, uniqueEmail } from "../helpers/db";
import { api, signIn, type Session } from "../helpers/http";
import { latestMailTo } from "../helpers/mail";

const sessions = {} as Record<(typeof roles)[number], Session>;
let adminName = "";

beforeAll(async () => {
  for (const role of roles) {
    const user = await createUser(role);
    if (role === "admin") adminName = user.name;
    sessions[role] = (await signIn(user.email, user.password))!;
  }
});

// Other suites expect the default zone: leave it as found.
afterAll(async () => {
  const current = await api("GET", "/api/v1/settings", { session: sessions.admin });
  if (current.body.settings.timeZone !== "Asia/Jakarta") await api("PATCH", "/api/v1/settings", { session: sessions.admin, body: { version: current.body.version, timeZone: "Asia/Jakarta" } });
});

describe("workshop settings", () => {
  it("start at the default time zone, Asia/Jakarta", async () => {
    const res = await api("GET", "/api/v1/settings", { session: sessions.admin });
    expect(res.status).toBe(200);
    expect(res.body.settings).toMatchObject({ timeZone: "Asia/Jakarta", currency: "IDR", impressionsPerHour: 26 });
    // The planner's cloths by default: mori 106 and 115 cm, 44 in cotton with 1 in margins (SPEC section 1).
    expect(res.body.settings.clothPresets.map((p: { widthMm: number }) => p.widthMm)).toEqual([1060, 1150, 1117.6]);
    expect(res.body.version).toBeGreaterThanOrEqual(1);
  });

  it.each(roles.filter((r) => r !== "admin"))("are refused to a %s (403), and nothing changes", async (role) => {
    const before = await api("GET", "/api/v1/settings", { session: sessions.admin });
    expect((await api("GET", "/api/v1/settings", { session: sessions[role] })).status).toBe(403);
    const res = await api("PATCH", "/api/v1/settings", { session: sessions[role], body: { version: before.body.version, timeZone: "Europe/Amsterdam" } });
    expect(res.status).toBe(403);
    expect((await api("GET", "/api/v1/settings", { session: sessions.admin })).body).toMatchObject({ settings: before.body.settings, version: before.body.version });
  });

  it("refuse a time zone that does not exist, with a message for the field", async () => {
    const { body } = await api("GET", "/api/v1/settings", { session: sessions.admin });
    const res = await api("PATCH", "/api/v1/settings", { session: sessions.admin, body: { version: body.version, timeZone: "Atlantis/Capital" } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.timeZone[0]).toMatch(/Choose a time zone/);
    const unknown = await api("PATCH", "/api/v1/settings", { session: sessions.admin, body: { version: body.version, colour: "blue" } });
    expect(unknown.status).toBe(400);
    const currency = await api("PATCH", "/api/v1/settings", { session: sessions.admin, body: { version: body.version, currency: "EUR" } });
    expect(currency.status).toBe(400);
    expect(currency.body.error.fields.currency[0]).toMatch(/IDR, USD/);
  });

  it("save a change with who and what in the history, refuse a stale version with 409, and keep the version when nothing changes", async () => {
    const { body } = await api("GET", "/api/v1/settings", { session: sessions.admin });
    const saved = await api("PATCH", "/api/v1/settings", { session: sessions.admin, body: { version: body.version, timeZone: "Asia/Makassar" } });
    expect(saved.status).toBe(200);
    expect(saved.body).toMatchObject({ settings: { timeZone: "Asia/Makassar" }, version: body.version + 1 });
    expect(saved.body.history[0]).toMatchObject({ version: body.version + 1, actorName: adminName, changes: [{ key: "timeZone", from: "Asia/Jakarta", to: "Asia/Makassar" }] });
    const [row] = await db().select().from(workshopSettingChanges).orderBy(desc(workshopSettingChanges.version)).limit(1);
    expect(row.version).toBe(body.version + 1);

    const stale = await api("PATCH", "/api/v1/settings", { session: sessions.admin, body: { version: body.version, timeZone: "Europe/Amsterdam" } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("settingsConflict");

    const same = await api("PATCH", "/api/v1/settings", { session: sessions.admin, body: { version: body.version + 1, timeZone: "Asia/Makassar" } });
    expect(same.body.version).toBe(body.version + 1);
    const [stored] = await db().select().from(workshopSettings);
    expect(stored.values).toMatchObject({ timeZone: "Asia/Makassar", currency: "IDR" });
  });

  it("keep the planner's cloth presets and stamping rate, refusing names twice and rates out of range", async () => {
    const { body } = await api("GET", "/api/v1/settings", { session: sessions.admin });
    const presets = [
      { name: "Mori 106 cm", widthMm: 1060, marginMm: 0 },
      { name: "Primissima 110 cm", widthMm: 1100, marginMm: 15 },
    ];
    const saved = await api("PATCH", "/api/v1/settings", { session: sessions.admin, body: { version: body.version, clothPresets: presets, impressionsPerHour: 40 } });
    expect(saved.status).toBe(200);
    expect(saved.body.settings).toMatchObject({ clothPresets: presets, impressionsPerHour: 40 });
    const twice = await api("PATCH", "/api/v1/settings", { session: sessions.admin, body: { version: saved.body.version, clothPresets: [presets[0], { ...presets[1], name: "mori 106 CM" }], impressionsPerHour: 0 } });
    expect(twice.status).toBe(400);
    expect(Object.keys(twice.body.error.fields).sort()).toEqual(["clothPresets.1.name", "impressionsPerHour"]);
    const back = await api("PATCH", "/api/v1/settings", { session: sessions.admin, body: { version: saved.body.version, clothPresets: [{ name: "Mori 106 cm", widthMm: 1060, marginMm: 0 }, { name: "Mori 115 cm", widthMm: 1150, marginMm: 0 }, { name: "Cotton 44 in", widthMm: 1117.6, marginMm: 25.4 }], impressionsPerHour: 26 } });
    expect(back.status).toBe(200);
  });

  it("format the times in e-mails in the workshop's zone", async () => {
    const { body } = await api("GET", "/api/v1/settings", { session: sessions.admin });
    await api("PATCH", "/api/v1/settings", { session: sessions.admin, body: { version: body.version, timeZone: "America/Sao_Paulo" } });
    const email = uniqueEmail("tz-invite");
    const invited = await api("POST", "/api/v1/users", { session: sessions.admin, body: { email, name: "Tz Invitee", role: "designer" } });
    expect(invited.status).toBe(201);
    const mail = await latestMailTo(email, /invited/i);
    const [token] = await db().select().from(userTokens).where(eq(userTokens.userId, invited.body.user.id));
    // The reference: the platform's own Intl formatter, in the zone the admin chose.
    const until = new Intl.DateTimeFormat("en", { dateStyle: "medium", timeStyle: "short", timeZone: "America/Sao_Paulo" }).format(token.expiresAt);
    expect(mail.text).toContain(`until ${until} (America/Sao_Paulo)`);
  });
});
