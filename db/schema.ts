import { sql } from "drizzle-orm";
import { type AnyPgColumn, boolean, check, date, doublePrecision, index, integer, jsonb, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";

export const roleEnum = pgEnum("role", ["admin", "keeper", "planner", "waxmaster", "designer"]);
export const unitSystemEnum = pgEnum("unit_system", ["metric", "imperial"]);
export const localeEnum = pgEnum("locale", ["en", "id"]);
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

// ---------------------------------------------------------------------------------------------
// Stamp shelf: locations, stamps, check-outs, damage reports, history, stock-takes.

export const stampFaceEnum = pgEnum("stamp_face", ["single", "pair"]);
export const stampConditionEnum = pgEnum("stamp_condition", ["sound", "worn", "needs_repair", "in_repair", "retired"]);
export const damageKindEnum = pgEnum("damage_kind", ["bent_strip", "cracked_solder", "loose_handle", "worn_face", "other"]);
export const stampEventKindEnum = pgEnum("stamp_event_kind", [
  "created",
  "edited",
  "moved",
  "checked_out",
  "returned",
  "condition_changed",
  "damage_reported",
  "repaired",
  "twin_linked",
  "seen_in_stock_take",
  "scanned",
]);
export const stockTakeStatusEnum = pgEnum("stock_take_status", ["open", "closed"]);

/** A place a stamp lives: a site (building or workshop) and a rack/shelf code unique within it. */
export const locations = pgTable(
  "locations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    site: text("site").notNull(),
    code: text("code").notNull(),
    description: text("description"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("locations_site_code_key").on(t.site, t.code), index("locations_code_idx").on(t.code)],
);

/** One copper stamp. Lengths in mm, mass in g; `version` guards against silent overwrites. */
export const stamps = pgTable(
  "stamps",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    code: text("code").notNull(),
    name: text("name").notNull(),
    /** Motifs arrive later; no foreign key until their table exists. */
    motifId: uuid("motif_id"),
    widthMm: doublePrecision("width_mm").notNull(),
    heightMm: doublePrecision("height_mm").notNull(),
    stripDepthMm: doublePrecision("strip_depth_mm"),
    weightG: doublePrecision("weight_g"),
    face: stampFaceEnum("face").notNull().default("single"),
    /** The mirror-image twin that stamps the back of the cloth (face = pair). */
    twinId: uuid("twin_id").references((): AnyPgColumn => stamps.id, { onDelete: "set null" }),
    mirrored: boolean("mirrored").notNull().default(false),
    maker: text("maker"),
    madeOn: date("made_on"),
    condition: stampConditionEnum("condition").notNull().default("sound"),
    locationId: uuid("location_id").references(() => locations.id, { onDelete: "restrict" }),
    coverageRatio: doublePrecision("coverage_ratio"),
    outlinePath: text("outline_path"),
    impressionsCount: integer("impressions_count").notNull().default(0),
    notes: text("notes"),
    tags: text("tags").array().notNull().default(sql`'{}'::text[]`),
    version: integer("version").notNull().default(1),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("stamps_code_key").on(t.code),
    index("stamps_location_idx").on(t.locationId),
    index("stamps_condition_idx").on(t.condition),
    index("stamps_width_idx").on(t.widthMm),
    index("stamps_updated_idx").on(t.updatedAt),
    index("stamps_tags_idx").using("gin", t.tags),
    check("stamps_width_positive", sql`${t.widthMm} > 0`),
    check("stamps_height_positive", sql`${t.heightMm} > 0`),
    check("stamps_coverage_range", sql`${t.coverageRatio} IS NULL OR (${t.coverageRatio} >= 0 AND ${t.coverageRatio} <= 1)`),
    check("stamps_impressions_nonnegative", sql`${t.impressionsCount} >= 0`),
    check("stamps_not_own_twin", sql`${t.twinId} IS NULL OR ${t.twinId} <> ${t.id}`),
  ],
);

/** Who has a stamp out. At most one open check-out (returned_at IS NULL) per stamp: a partial unique index. */
export const checkouts = pgTable(
  "checkouts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    stampId: uuid("stamp_id")
      .notNull()
      .references(() => stamps.id, { onDelete: "cascade" }),
    /** The borrower when they have an account; name and e-mail are kept either way. */
    borrowerId: uuid("borrower_id").references(() => users.id, { onDelete: "set null" }),
    borrowerName: text("borrower_name").notNull(),
    borrowerEmail: text("borrower_email"),
    workstation: text("workstation").notNull(),
    outAt: timestamp("out_at", { withTimezone: true }).notNull().defaultNow(),
    dueOn: date("due_on").notNull(),
    returnedAt: timestamp("returned_at", { withTimezone: true }),
    checkedOutBy: uuid("checked_out_by").references(() => users.id, { onDelete: "set null" }),
    returnedBy: uuid("returned_by").references(() => users.id, { onDelete: "set null" }),
    note: text("note"),
    lastRemindedAt: timestamp("last_reminded_at", { withTimezone: true }),
  },
  (t) => [
    uniqueIndex("checkouts_one_open_per_stamp").on(t.stampId).where(sql`${t.returnedAt} IS NULL`),
    index("checkouts_stamp_idx").on(t.stampId),
    index("checkouts_open_due_idx").on(t.dueOn).where(sql`${t.returnedAt} IS NULL`),
  ],
);

/** A report of damage by anyone; resolved when a keeper records the repair (or retires the stamp). */
export const damageReports = pgTable(
  "damage_reports",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    stampId: uuid("stamp_id")
      .notNull()
      .references(() => stamps.id, { onDelete: "cascade" }),
    kind: damageKindEnum("kind").notNull(),
    note: text("note"),
    reportedBy: uuid("reported_by").references(() => users.id, { onDelete: "set null" }),
    reportedAt: timestamp("reported_at", { withTimezone: true }).notNull().defaultNow(),
    resolvedAt: timestamp("resolved_at", { withTimezone: true }),
  },
  (t) => [index("damage_reports_stamp_idx").on(t.stampId)],
);

/** The history of a stamp: one row per thing that happened to it, with who and when. */
export const stampEvents = pgTable(
  "stamp_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    stampId: uuid("stamp_id")
      .notNull()
      .references(() => stamps.id, { onDelete: "cascade" }),
    kind: stampEventKindEnum("kind").notNull(),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    /** Kept beside actor_id so the history still names people whose account is gone. */
    actorName: text("actor_name").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
    fromValue: text("from_value"),
    toValue: text("to_value"),
    note: text("note"),
    /** Extra facts of the event, e.g. the fields an edit changed. */
    details: jsonb("details").$type<Record<string, unknown>>(),
  },
  (t) => [index("stamp_events_stamp_at_idx").on(t.stampId, t.at)],
);

/** A count of the stamps at one site. */
export const stockTakes = pgTable(
  "stock_takes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    site: text("site").notNull(),
    status: stockTakeStatusEnum("status").notNull().default("open"),
    startedBy: uuid("started_by").references(() => users.id, { onDelete: "set null" }),
    startedAt: timestamp("started_at", { withTimezone: true }).notNull().defaultNow(),
    endedAt: timestamp("ended_at", { withTimezone: true }),
    /** The stamps expected at the start (recorded at the site, not retired). */
    expectedCount: integer("expected_count").notNull().default(0),
  },
  (t) => [
    index("stock_takes_site_idx").on(t.site),
    uniqueIndex("stock_takes_one_open_per_site").on(t.site).where(sql`${t.status} = 'open'`),
  ],
);

/** A stamp (or an unknown code) seen during a stock-take, and where. */
export const stockTakeSightings = pgTable(
  "stock_take_sightings",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    stockTakeId: uuid("stock_take_id")
      .notNull()
      .references(() => stockTakes.id, { onDelete: "cascade" }),
    code: text("code").notNull(),
    stampId: uuid("stamp_id").references(() => stamps.id, { onDelete: "cascade" }),
    locationId: uuid("location_id").references(() => locations.id, { onDelete: "set null" }),
    seenBy: uuid("seen_by").references(() => users.id, { onDelete: "set null" }),
    seenAt: timestamp("seen_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("stock_take_sightings_code_key").on(t.stockTakeId, t.code)],
);

export type Location = typeof locations.$inferSelect;
export type Stamp = typeof stamps.$inferSelect;
export type NewStamp = typeof stamps.$inferInsert;
export type Checkout = typeof checkouts.$inferSelect;
export type StampEvent = typeof stampEvents.$inferSelect;
export type StampCondition = (typeof stampConditionEnum.enumValues)[number];
export type StampFace = (typeof stampFaceEnum.enumValues)[number];
export type DamageKind = (typeof damageKindEnum.enumValues)[number];
export type StampEventKind = (typeof stampEventKindEnum.enumValues)[number];

// ---------------------------------------------------------------------------------------------
// Stamp scans: pictures of a stamp's face and of its wax print, kept in the object store.

export const scanKindEnum = pgEnum("scan_kind", ["face", "print"]);
export const waxPolarityEnum = pgEnum("wax_polarity", ["darkIsWax", "lightIsWax"]);
export const dpiSourceEnum = pgEnum("dpi_source", ["file", "keeper"]);

/**
 * One stored scan. The bytes live in the object store under random keys (never a name the user typed); this
 * row holds the keys and what was measured. The same file twice for one stamp is refused by a unique index.
 */
export const stampScans = pgTable(
  "stamp_scans",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    stampId: uuid("stamp_id")
      .notNull()
      .references(() => stamps.id, { onDelete: "cascade" }),
    kind: scanKindEnum("kind").notNull(),
    /** The name the file was uploaded with; only for display and download names. */
    fileName: text("file_name").notNull(),
    contentType: text("content_type").notNull(),
    objectKey: text("object_key").notNull(),
    thumbKey: text("thumb_key").notNull(),
    largeKey: text("large_key").notNull(),
    /** Grey PNG of the analysis raster, for re-thresholding without decoding the original again. */
    rasterKey: text("raster_key").notNull(),
    widthPx: integer("width_px").notNull(),
    heightPx: integer("height_px").notNull(),
    dpi: doublePrecision("dpi"),
    dpiSource: dpiSourceEnum("dpi_source"),
    sizeBytes: integer("size_bytes").notNull(),
    sha256: text("sha256").notNull(),
    polarity: waxPolarityEnum("polarity").notNull(),
    threshold: integer("threshold").notNull(),
    otsuThreshold: integer("otsu_threshold").notNull(),
    coverageRatio: doublePrecision("coverage_ratio").notNull(),
    phash: text("phash").notNull(),
    phashMirrored: text("phash_mirrored").notNull(),
    uploadedBy: uuid("uploaded_by").references(() => users.id, { onDelete: "set null" }),
    uploadedByName: text("uploaded_by_name").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("stamp_scans_stamp_sha256_key").on(t.stampId, t.sha256),
    index("stamp_scans_stamp_idx").on(t.stampId, t.createdAt),
    check("stamp_scans_size_positive", sql`${t.widthPx} > 0 AND ${t.heightPx} > 0 AND ${t.sizeBytes} > 0`),
    check("stamp_scans_dpi_positive", sql`${t.dpi} IS NULL OR ${t.dpi} > 0`),
    check("stamp_scans_dpi_source", sql`(${t.dpi} IS NULL) = (${t.dpiSource} IS NULL)`),
    check("stamp_scans_threshold_range", sql`${t.threshold} BETWEEN 0 AND 255 AND ${t.otsuThreshold} BETWEEN 0 AND 255`),
    check("stamp_scans_coverage_range", sql`${t.coverageRatio} >= 0 AND ${t.coverageRatio} <= 1`),
    check("stamp_scans_phash_hex", sql`${t.phash} ~ '^[0-9a-f]{16}$' AND ${t.phashMirrored} ~ '^[0-9a-f]{16}$'`),
  ],
);

export type StampScan = typeof stampScans.$inferSelect;
export type NewStampScan = typeof stampScans.$inferInsert;
export type ScanKind = (typeof scanKindEnum.enumValues)[number];

// ---------------------------------------------------------------------------------------------
// Workshop settings: one row holding every setting (parsed by lib/validation/settings.ts), its version, and
// a history of who changed what.

export const workshopSettings = pgTable(
  "workshop_settings",
  {
    /** Always 1: the workshop has one set of settings. */
    id: integer("id").primaryKey().default(1),
    values: jsonb("values").$type<Record<string, unknown>>().notNull().default(sql`'{}'::jsonb`),
    version: integer("version").notNull().default(1),
    updatedBy: uuid("updated_by").references(() => users.id, { onDelete: "set null" }),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [check("workshop_settings_one_row", sql`${t.id} = 1`), check("workshop_settings_version_positive", sql`${t.version} > 0`)],
);

/** One saved change of the workshop settings: the settings it changed, before and after. */
export const workshopSettingChanges = pgTable(
  "workshop_setting_changes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    /** The settings' version this change produced. */
    version: integer("version").notNull(),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    /** Kept beside actor_id so the history still names people whose account is gone. */
    actorName: text("actor_name").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
    changes: jsonb("changes").$type<{ key: string; from: unknown; to: unknown }[]>().notNull(),
  },
  (t) => [uniqueIndex("workshop_setting_changes_version_key").on(t.version), index("workshop_setting_changes_at_idx").on(t.at)],
);

export type WorkshopSettingsRow = typeof workshopSettings.$inferSelect;
