import { sql } from "drizzle-orm";
import { type AnyPgColumn, boolean, check, date, doublePrecision, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { users } from "./users";

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
  "impressions_added",
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
