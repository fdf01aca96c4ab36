import "server-only";
import { and, asc, eq, gt, isNull, sql } from "drizzle-orm";
import { db } from "@/db";
import { users, userTokens, type User } from "@/db/schema";
import { invitationMail, passwordResetMail } from "@/lib/emails/templates";
import { hashPassword } from "@/lib/auth/passwords";
import { hashSecret, newSecret } from "@/lib/auth/secrets";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { isLocale, negotiateLocale, pickLocale, type Locale } from "@/lib/i18n/config";
import { dateFormat, translator } from "@/lib/i18n/translator";
import { sendMail } from "@/lib/mail";
import { clearSignInLimits } from "./sign-in";
import { assertCan, type Actor } from "@/lib/authz";
import type { InviteUserInput, UpdateUserInput } from "@/lib/validation/users";
import type { UserDto } from "@/lib/contracts/people";
import { workshopTimeZone } from "./settings";

export const linkLifetime = { inviteHours: 72, resetMinutes: 60 } as const;

export const toUserDto = (u: User): UserDto => ({
  id: u.id,
  email: u.email,
  name: u.name,
  role: u.role,
  disabled: u.disabled,
  invited: u.passwordHash === null,
  unitSystem: u.unitSystem,
  locale: u.locale,
  createdAt: u.createdAt.toISOString(),
});

export async function listUsers(actor: Actor): Promise<UserDto[]> {
  assertCan(actor, "users:manage");
  const rows = await db.select().from(users).orderBy(asc(users.name));
  return rows.map(toUserDto);
}

async function findUser(id: string): Promise<User> {
  const [user] = await db.select().from(users).where(eq(users.id, id)).limit(1);
  if (!user) throw new AppError("notFound");
  return user;
}

async function issueLink(userId: string, kind: "invite" | "reset") {
  const secret = newSecret();
  const lifetimeMs = kind === "invite" ? linkLifetime.inviteHours * 3_600_000 : linkLifetime.resetMinutes * 60_000;
  const expiresAt = new Date(Date.now() + lifetimeMs);
  // A new link replaces any older unused one of the same kind.
  await db.delete(userTokens).where(and(eq(userTokens.userId, userId), eq(userTokens.kind, kind), isNull(userTokens.usedAt)));
  await db.insert(userTokens).values({ userId, kind, tokenHash: hashSecret(secret), expiresAt });
  return { link: `${env().APP_URL.replace(/\/$/, "")}/set-password?token=${encodeURIComponent(secret)}`, expiresAt };
}

/** The invitation mail for a user, with a new link. */
async function sendInvitation(user: User, inviter: string) {
  const locale = pickLocale(user.locale);
  const t = translator(locale);
  const { link, expiresAt } = await issueLink(user.id, "invite");
  const mail = invitationMail(t, dateFormat(locale, await workshopTimeZone()), { name: user.name, inviter, role: t(`roles.${user.role}.name`), link, hours: linkLifetime.inviteHours, expiresAt });
  await sendMail({ to: user.email, ...mail });
}

export async function inviteUser(actor: Actor, input: InviteUserInput): Promise<UserDto> {
  assertCan(actor, "users:manage");
  const [existing] = await db.select({ id: users.id }).from(users).where(eq(sql`lower(${users.email})`, input.email)).limit(1);
  if (existing) throw new AppError("emailTaken", {}, { email: ["validation.emailTaken"] });
  const language = input.locale ? { locale: input.locale, localeSource: "invitation" as const } : {};
  const [user] = await db.insert(users).values({ email: input.email, name: input.name, role: input.role, ...language }).returning();
  await sendInvitation(user, actor.name);
  return toUserDto(user);
}

export async function resendInvitation(actor: Actor, id: string) {
  assertCan(actor, "users:manage");
  const user = await findUser(id);
  if (user.passwordHash) throw new AppError("conflict");
  await sendInvitation(user, actor.name);
}

/**
 * Changes a user. A change that takes an active administrator away (another role, or disabled) is refused
 * when no other active administrator would remain: someone must always be able to manage people. The active
 * administrators are locked first, in one order, so two admins demoting each other at once queue and the
 * second sees that only one is left. Administrators never remove their own role or disable themselves
 * (another administrator can), so the one acting can always undo a mistake.
 */
export async function updateUser(actor: Actor, id: string, patch: UpdateUserInput): Promise<UserDto> {
  assertCan(actor, "users:manage");
  return db.transaction(async (tx) => {
    const mayRemoveAdmin = (patch.role !== undefined && patch.role !== "admin") || patch.disabled === true;
    const activeAdmins = mayRemoveAdmin
      ? await tx.select({ id: users.id }).from(users).where(and(eq(users.role, "admin"), eq(users.disabled, false))).orderBy(asc(users.id)).for("update")
      : [];
    const [user] = await tx.select().from(users).where(eq(users.id, id)).limit(1).for("update");
    if (!user) throw new AppError("notFound");
    const removesAdmin = user.role === "admin" && !user.disabled && mayRemoveAdmin;
    if (removesAdmin && !activeAdmins.some((a) => a.id !== user.id)) throw new AppError("lastAdmin");
    if (user.id === actor.id && mayRemoveAdmin) throw new AppError("conflict", {}, { role: ["validation.cannotDemoteSelf"] });
    const endsSessions = (patch.role !== undefined && patch.role !== user.role) || (patch.disabled !== undefined && patch.disabled !== user.disabled);
    const [updated] = await tx
      .update(users)
      .set({ ...patch, updatedAt: new Date(), ...(endsSessions ? { sessionVersion: sql`${users.sessionVersion} + 1` } : {}) })
      .where(eq(users.id, id))
      .returning();
    return toUserDto(updated);
  });
}

/** Sends a reset link if the address belongs to an active user; answers the same either way. */
export async function requestPasswordReset(email: string) {
  const [user] = await db.select().from(users).where(eq(sql`lower(${users.email})`, email.toLowerCase())).limit(1);
  if (!user || user.disabled) return;
  const locale = pickLocale(user.locale);
  const { link, expiresAt } = await issueLink(user.id, "reset");
  const mail = passwordResetMail(translator(locale), dateFormat(locale, await workshopTimeZone()), { name: user.name, link, minutes: linkLifetime.resetMinutes, expiresAt });
  await sendMail({ to: user.email, ...mail });
}

export async function sendPasswordResetFor(actor: Actor, id: string) {
  assertCan(actor, "users:manage");
  const user = await findUser(id);
  await requestPasswordReset(user.email);
}

export type PasswordLinkStatus = "valid" | "used" | "expired" | "unknown";

/**
 * What an invitation or reset link is worth before anyone types a password: unknown (never issued,
 * replaced by a newer link, or its account is disabled), used, expired, or valid. Public: the secret is the proof.
 */
export async function passwordLinkStatus(secret: string): Promise<PasswordLinkStatus> {
  if (secret.length < 20 || secret.length > 200) return "unknown";
  const [row] = await db
    .select({ usedAt: userTokens.usedAt, expiresAt: userTokens.expiresAt, disabled: users.disabled })
    .from(userTokens)
    .innerJoin(users, eq(users.id, userTokens.userId))
    .where(eq(userTokens.tokenHash, hashSecret(secret)))
    .limit(1);
  if (!row || row.disabled) return "unknown";
  if (row.usedAt) return "used";
  if (row.expiresAt.getTime() <= Date.now()) return "expired";
  return "valid";
}

/** Uses an invitation or reset link once: sets the password and ends every older session. */
export async function setPasswordWithToken(secret: string, password: string): Promise<{ email: string }> {
  const passwordHash = await hashPassword(password);
  return db.transaction(async (tx) => {
    const [token] = await tx
      .update(userTokens)
      .set({ usedAt: new Date() })
      .where(and(eq(userTokens.tokenHash, hashSecret(secret)), isNull(userTokens.usedAt), gt(userTokens.expiresAt, new Date())))
      .returning();
    if (!token) throw new AppError("tokenInvalid");
    const [user] = await tx
      .update(users)
      .set({ passwordHash, sessionVersion: sql`${users.sessionVersion} + 1`, updatedAt: new Date() })
      .where(and(eq(users.id, token.userId), eq(users.disabled, false)))
      .returning();
    if (!user) throw new AppError("tokenInvalid");
    // Whoever could read the mail has proved the account is theirs: its sign-in limits are lifted.
    await clearSignInLimits(user.email, tx);
    return { email: user.email };
  });
}

/** Name, units and language from My account; the language then counts as the person's own choice. */
export async function updateProfile(actor: Actor, patch: { name: string; unitSystem: User["unitSystem"]; locale: Locale }) {
  assertCan(actor, "account:self");
  const [user] = await db
    .update(users)
    .set({ ...patch, localeSource: "person", updatedAt: new Date() })
    .where(eq(users.id, actor.id))
    .returning();
  return toUserDto(user);
}

/** The header's language switch: the person's choice, kept on their account for every device. */
export async function chooseLocale(actor: Actor, locale: Locale): Promise<Locale> {
  assertCan(actor, "account:self");
  await db.update(users).set({ locale, localeSource: "person", updatedAt: new Date() }).where(eq(users.id, actor.id));
  return locale;
}

/**
 * The language of someone signing in. Until anyone has set it (source "default"), the first sign-in takes this
 * browser's: the language its pages were showing (the cookie, e.g. switched on the sign-in page), else its
 * Accept-Language, else the workshop's default; and keeps it from then on. A later sign-in on another device
 * does not change it; the person's own choice does.
 */
export async function localeAtSignIn(userId: string, browser: { cookie: string | undefined; acceptLanguage: string | null }): Promise<Locale> {
  const fromBrowser = isLocale(browser.cookie) ? browser.cookie : negotiateLocale(browser.acceptLanguage);
  const [settled] = await db
    .update(users)
    .set({ locale: fromBrowser ?? sql`${users.locale}`, localeSource: "browser" })
    .where(and(eq(users.id, userId), eq(users.localeSource, "default")))
    .returning({ locale: users.locale });
  if (settled) return settled.locale;
  const [user] = await db.select({ locale: users.locale }).from(users).where(eq(users.id, userId)).limit(1);
  return user?.locale ?? pickLocale(null);
}
