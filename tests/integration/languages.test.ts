import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { checkouts, users } from "@/db/schema";
import { translator } from "@/lib/i18n/translator";
import { createUser, db, reloadUser, uniqueEmail } from "../helpers/db";
import { api, signIn, type Session } from "../helpers/http";
import { latestMailTo } from "../helpers/mail";
import { createStampRow, daysFromToday, uniquePrefix } from "../helpers/stamps";

// Which language each answer and each mail speaks: the person's setting for a session, Accept-Language for a
// token and for anyone not signed in, English by default; mail in the recipient's language, never the sender's.

const en = translator("en");
const id = translator("id");
const prefix = uniquePrefix("LANG");

describe("API error messages", () => {
  it("GET /api/v1/me without a session, with Accept-Language: id, answers its 401 in Indonesian", async () => {
    const res = await api("GET", "/api/v1/me", { headers: { "accept-language": "id" } });
    expect(res.status).toBe(401);
    expect(res.body.error).toEqual({ code: "unauthenticated", message: id("errors.unauthenticated") });
    expect(res.body.error.message).toBe("Masuk dulu, atau kirim token API yang berlaku, untuk memakai ini.");
  });

  it("weighs Accept-Language the way browsers send it, and answers English when it names none of ours", async () => {
    expect((await api("GET", "/api/v1/me", { headers: { "accept-language": "id-ID,id;q=0.9,en-US;q=0.8" } })).body.error.message).toBe(id("errors.unauthenticated"));
    expect((await api("GET", "/api/v1/me", { headers: { "accept-language": "fr, id;q=0.5" } })).body.error.message).toBe(id("errors.unauthenticated"));
    expect((await api("GET", "/api/v1/me", { headers: { "accept-language": "fr" } })).body.error.message).toBe(en("errors.unauthenticated"));
    expect((await api("GET", "/api/v1/me")).body.error.message).toBe(en("errors.unauthenticated"));
    expect((await api("GET", "/api/v1/me", { headers: { "accept-language": "%%%;q=x" } })).body.error.message).toBe(en("errors.unauthenticated"));
  });

  it("a session answers in the person's setting, whatever the browser asks for", async () => {
    const planner = await createUser("planner", undefined, { locale: "id", localeSource: "person" });
    const session = (await signIn(planner.email, planner.password, { acceptLanguage: "en-US" }))!;
    const res = await api("POST", "/api/v1/locations", { session, headers: { "accept-language": "en-US" }, body: { site: "x", code: "y" } });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toBe(id("errors.forbidden"));
    const me = await api("GET", "/api/v1/me", { session });
    expect(me.body.locale).toBe("id");
  });

  it("a token answers in the language its request asks for, English without one", async () => {
    const planner = await createUser("planner", undefined, { locale: "id", localeSource: "person" });
    const session = (await signIn(planner.email, planner.password))!;
    const token = (await api("POST", "/api/v1/tokens", { session, body: { name: "Sheet export" } })).body.token.secret as string;
    const asked = await api("POST", "/api/v1/locations", { token, headers: { "accept-language": "id" }, body: { site: "x", code: "y" } });
    expect(asked.body.error.message).toBe(id("errors.forbidden"));
    const plain = await api("POST", "/api/v1/locations", { token, body: { site: "x", code: "y" } });
    expect(plain.body.error.message).toBe(en("errors.forbidden"));
  });

  it("numbers in a message come in the reader's language: 1.200 in Indonesian", async () => {
    const keeper = await createUser("keeper");
    const token = (await api("POST", "/api/v1/tokens", { session: (await signIn(keeper.email, keeper.password))!, body: { name: "Import" } })).body.token.secret as string;
    const res = await api("GET", "/api/v1/stamps?minWidthMm=20000", { token, headers: { "accept-language": "id" } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.minWidthMm).toEqual([id("validation.tooBig", { max: 10_000 })]);
    expect(res.body.error.fields.minWidthMm[0]).toContain("10.000");
    const inEnglish = await api("GET", "/api/v1/stamps?minWidthMm=20000", { token });
    expect(inEnglish.body.error.fields.minWidthMm[0]).toContain("10,000");
  });
});

describe("the language of a person", () => {
  it("comes from the browser at the first sign-in, and stays when they later sign in from another browser", async () => {
    const user = await createUser("designer");
    expect(user.localeSource).toBe("default");
    const first = (await signIn(user.email, user.password, { acceptLanguage: "id-ID,id;q=0.9" }))!;
    expect(first.locale).toBe("id");
    expect(await reloadUser(user.id)).toMatchObject({ locale: "id", localeSource: "browser" });

    const later = (await signIn(user.email, user.password, { acceptLanguage: "en-GB,en;q=0.9" }))!;
    expect(later.locale).toBe("id");
    expect((await reloadUser(user.id)).locale).toBe("id");
  });

  it("takes the language the browser's pages were showing, when it was switched before the first sign-in", async () => {
    const user = await createUser("designer");
    const session = (await signIn(user.email, user.password, { acceptLanguage: "en-US", cookies: ["capgrid-locale=id"] }))!;
    expect(session.locale).toBe("id");
    expect(await reloadUser(user.id)).toMatchObject({ locale: "id", localeSource: "browser" });
  });

  it("is not taken from the browser once chosen, and the sign-in sets the cookie to it", async () => {
    const user = await createUser("designer", undefined, { locale: "en", localeSource: "person" });
    const session = (await signIn(user.email, user.password, { acceptLanguage: "id" }))!;
    expect(session.locale).toBe("en");
    expect((await reloadUser(user.id)).locale).toBe("en");
  });

  it("keeps the workshop's default when the first browser names none of our languages", async () => {
    const user = await createUser("designer");
    const session = (await signIn(user.email, user.password, { acceptLanguage: "fr-FR,fr;q=0.9" }))!;
    expect(session.locale).toBe("en");
    expect(await reloadUser(user.id)).toMatchObject({ locale: "en", localeSource: "browser" });
  });
});

describe("mail in the recipient's language", () => {
  let admin: Session;
  beforeAll(async () => {
    const a = await createUser("admin", undefined, { locale: "en", localeSource: "person" });
    admin = (await signIn(a.email, a.password))!;
  });

  it("an invitation in the language the inviter chose for the person, English without a choice", async () => {
    const email = uniqueEmail("undangan");
    const res = await api("POST", "/api/v1/users", { session: admin, body: { email, name: "Laras Pinilih", role: "keeper", locale: "id" } });
    expect(res.status).toBe(201);
    expect(res.body.user.locale).toBe("id");
    const mail = await latestMailTo(email, /Capgrid/);
    expect(mail.subject).toBe(id("emails.invite.subject"));
    expect(mail.text).toContain("Halo Laras Pinilih,");
    expect(mail.html).toContain('lang="id"');
    expect(mail.headers?.["content-language"]).toBe("id");

    const plain = uniqueEmail("invite");
    await api("POST", "/api/v1/users", { session: admin, body: { email: plain, name: "Wening Asri", role: "planner" } });
    expect((await latestMailTo(plain, /Capgrid/)).subject).toBe(en("emails.invite.subject"));
  });

  it("an invitation's language is kept: the browser is not asked at the first sign-in", async () => {
    const email = uniqueEmail("undangan");
    const res = await api("POST", "/api/v1/users", { session: admin, body: { email, name: "Sekar Wangi", role: "designer", locale: "id" } });
    const [row] = await db().select().from(users).where(eq(users.id, res.body.user.id));
    expect(row).toMatchObject({ locale: "id", localeSource: "invitation" });
  });

  it("a reset link in the person's language, though an English administrator sends it", async () => {
    const person = await createUser("keeper", undefined, { locale: "id", localeSource: "person" });
    const res = await api("POST", `/api/v1/users/${person.id}/reset-link`, { session: admin });
    expect(res.status).toBeLessThan(300);
    const mail = await latestMailTo(person.email, /Capgrid/);
    expect(mail.subject).toBe(id("emails.reset.subject"));
  });

  it("the damage mail reaches each keeper in the keeper's own language, whoever reports it", async () => {
    const [keeperId, keeperEn] = [
      await createUser("keeper", undefined, { locale: "id", localeSource: "person" }),
      await createUser("keeper", undefined, { locale: "en", localeSource: "person" }),
    ];
    const reporter = await createUser("planner", undefined, { locale: "en", localeSource: "person" });
    const stamp = await createStampRow({ code: `${prefix}-DMG` });
    const res = await api("POST", `/api/v1/stamps/${stamp.code}/damage`, { session: (await signIn(reporter.email, reporter.password))!, body: { kind: "cracked_solder", note: "corner strip loose" } });
    expect(res.status).toBe(201);
    const toId = await latestMailTo(keeperId.email, new RegExp(stamp.code));
    expect(toId.subject).toBe(id("stampEmails.damage.subject", { code: stamp.code }));
    expect(toId.text).toContain("Patrian retak");
    expect(toId.text).toContain("Catatannya: corner strip loose");
    const toEn = await latestMailTo(keeperEn.email, new RegExp(stamp.code));
    expect(toEn.subject).toBe(en("stampEmails.damage.subject", { code: stamp.code }));
    expect(toEn.text).toContain("Cracked solder");
  });

  it("an overdue reminder in the borrower's language; someone without an account gets the workshop's default, English", async () => {
    const keeper = await createUser("keeper", undefined, { locale: "id", localeSource: "person" });
    const borrower = await createUser("designer", undefined, { locale: "id", localeSource: "person" });
    const [withAccount, without] = [await createStampRow({ code: `${prefix}-OD1` }), await createStampRow({ code: `${prefix}-OD2` })];
    const outsider = uniqueEmail("outsider");
    await db().insert(checkouts).values([
      { stampId: withAccount.id, borrowerId: borrower.id, borrowerName: borrower.name, borrowerEmail: borrower.email, workstation: "Meja 3", dueOn: daysFromToday(-2) },
      { stampId: without.id, borrowerName: "Tamu", borrowerEmail: outsider, workstation: "Table 4", dueOn: daysFromToday(-2) },
    ]);
    const res = await api("POST", "/api/v1/checkouts/reminders", { session: (await signIn(keeper.email, keeper.password))! });
    expect(res.status).toBe(200);
    expect((await latestMailTo(borrower.email, new RegExp(withAccount.code))).subject).toBe(id("stampEmails.overdue.subject", { code: withAccount.code }));
    expect((await latestMailTo(outsider, new RegExp(without.code))).subject).toBe(en("stampEmails.overdue.subject", { code: without.code }));
  });
});
