import { sql } from "drizzle-orm";
import { boolean, check, index, integer, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";

// People: accounts, one-time links, personal API tokens, sign-in counters and sessions.

export const roleEnum = pgEnum("role", ["admin", "keeper", "planner", "waxmaster", "designer"]);
export const unitSystemEnum = pgEnum("unit_system", ["metric", "imperial"]);
export const localeEnum = pgEnum("locale", ["en", "id"]);
/**
 * Where a user's language came from: nobody set it yet (the workshop default), the inviter chose it, the
 * browser's language at the first sign-in, or the person chose it. The browser is asked only while "default".
 */
export const localeSourceEnum = pgEnum("locale_source", ["default", "invitation", "browser", "person"]);
export const userTokenKindEnum = pgEnum("user_token_kind", ["invite", "reset"]);

export const users = pgTable(
  "users",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    email: text("email").notNull(),
    name: text("name").notNull(),
    /** argon2id; null until an invited user sets a password. */
    passwordHash: text("password_hash"),
    role: roleEnum("role").notNull(),
    disabled: boolean("disabled").notNull().default(false),
    unitSystem: unitSystemEnum("unit_system").notNull().default("metric"),
    locale: localeEnum("locale").notNull().default("en"),
    localeSource: localeSourceEnum("locale_source").notNull().default("default"),
    /** Bumped when role, password or disabled changes: older sessions carry a lower number and are refused. */
    sessionVersion: integer("session_version").notNull().default(1),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("users_email_key").on(sql`lower(${t.email})`)],
);

/** One-time links for invitations and password resets; only a SHA-256 of the secret is stored. */
export const userTokens = pgTable(
  "user_tokens",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    kind: userTokenKindEnum("kind").notNull(),
    tokenHash: text("token_hash").notNull(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("user_tokens_hash_key").on(t.tokenHash), index("user_tokens_user_idx").on(t.userId)],
);

/** Personal API tokens for scripts; the secret is shown once and only its SHA-256 is kept. */
export const apiTokens = pgTable(
  "api_tokens",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    tokenHash: text("token_hash").notNull(),
    /** First characters of the secret, so people can tell their tokens apart. */
    prefix: text("prefix").notNull(),
    lastUsedAt: timestamp("last_used_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("api_tokens_hash_key").on(t.tokenHash), index("api_tokens_user_idx").on(t.userId)],
);

/** Every password check that failed, with the client's address: the record of guessing (lib/data/sign-in.ts). */
export const signInFailures = pgTable(
  "sign_in_failures",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    email: text("email").notNull(),
    /** The client's address (scripts/server.ts), null when the app runs without it. */
    address: text("address"),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("sign_in_failures_email_at_idx").on(t.email, t.at)],
);

/**
 * Sign-in attempts counted per window, bumped in one statement before any password is checked: per
 * account and client address (`scope` = the address key), and per account across all addresses
 * (`scope` = "*"). lib/data/sign-in.ts reads the returned count to refuse or slow down.
 */
export const signInCounters = pgTable(
  "sign_in_counters",
  {
    email: text("email").notNull(),
    scope: text("scope").notNull(),
    windowStartedAt: timestamp("window_started_at", { withTimezone: true }).notNull().defaultNow(),
    attempts: integer("attempts").notNull(),
  },
  (t) => [primaryKey({ columns: [t.email, t.scope] }), check("sign_in_counters_attempts_check", sql`${t.attempts} >= 0`)],
);

/**
 * One row per sign-in: its id travels in the session cookie (JWT `sid`). Signing out revokes the row,
 * "sign out everywhere" all of a user's rows; lib/session.ts refuses a cookie whose row is revoked,
 * expired or missing.
 */
export const userSessions = pgTable(
  "user_sessions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
  },
  (t) => [index("user_sessions_user_idx").on(t.userId), check("user_sessions_expiry_check", sql`${t.expiresAt} > ${t.createdAt}`)],
);

export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;
export type ApiToken = typeof apiTokens.$inferSelect;
export type Role = (typeof roleEnum.enumValues)[number];
