import { sql } from "drizzle-orm";
import { check, doublePrecision, index, integer, jsonb, pgEnum, pgTable, primaryKey, smallint, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { stamps } from "./stamps";
import { users } from "./users";

// Cloth plans: a saved layout request (its borders beside it), the engine's summary of it and the geometry of the
// stamps that summary came from (for the stale flag), the library stamps it uses, and its history.

export const planArrangementEnum = pgEnum("plan_arrangement", ["straight", "half-drop", "brick", "mirror", "turnover", "half-drop-mirror", "diagonal", "rotation"]);
export const planEventKindEnum = pgEnum("plan_event_kind", ["created", "edited", "renamed", "recomputed", "duplicated"]);

/** One saved cloth plan. Lengths in mm; `version` guards against silent overwrites. */
export const plans = pgTable(
  "plans",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    name: text("name").notNull(),
    notes: text("notes"),
    /** The motif the plan lays; motifs arrive later, so no foreign key yet. */
    motifId: uuid("motif_id"),
    /** The field stamp when it is a library stamp (null for a free footprint); deleting a stamp that plans use is refused. */
    stampId: uuid("stamp_id").references(() => stamps.id, { onDelete: "restrict" }),
    /** The layout request as saved (POST /api/v1/layout's body without borders, window, impressions and preview). */
    layout: jsonb("layout").$type<Record<string, unknown>>().notNull(),
    /** The border layers (each stamp by size or by library code); [] without borders. */
    borders: jsonb("borders").$type<Record<string, unknown>[]>().notNull().default(sql`'[]'::jsonb`),
    /** Copies of layout fields, for filters and sorting. */
    arrangement: planArrangementEnum("arrangement").notNull(),
    clothWidthMm: doublePrecision("cloth_width_mm").notNull(),
    sides: smallint("sides").notNull().default(1),
    /** The engine's numbers for the saved inputs (no preview): see lib/plans/summary.ts. */
    summary: jsonb("summary").$type<Record<string, unknown>>().notNull(),
    /** Copies of summary figures, for sorting the table. */
    impressionsPerMetre: doublePrecision("impressions_per_metre").notNull(),
    waxedAreaPerMetreM2: doublePrecision("waxed_area_per_metre_m2").notNull(),
    /** The geometry of each library stamp the summary was computed from (lib/plans/stale.ts), and its fingerprint. */
    stampGeometry: jsonb("stamp_geometry").$type<Record<string, unknown>[]>().notNull().default(sql`'[]'::jsonb`),
    geometryFingerprint: text("geometry_fingerprint").notNull(),
    /** When the summary was last computed (saving or recomputing). */
    computedAt: timestamp("computed_at", { withTimezone: true }).notNull().defaultNow(),
    version: integer("version").notNull().default(1),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdByName: text("created_by_name").notNull(),
    updatedBy: uuid("updated_by").references(() => users.id, { onDelete: "set null" }),
    updatedByName: text("updated_by_name").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("plans_updated_idx").on(t.updatedAt),
    index("plans_stamp_idx").on(t.stampId),
    index("plans_arrangement_idx").on(t.arrangement),
    index("plans_motif_idx").on(t.motifId),
    check("plans_name_not_blank", sql`length(trim(${t.name})) > 0`),
    check("plans_cloth_width_positive", sql`${t.clothWidthMm} > 0`),
    check("plans_sides_range", sql`${t.sides} IN (1, 2)`),
    check("plans_version_positive", sql`${t.version} > 0`),
  ],
);

/** Every library stamp a plan uses (the field stamp and the border stamps): a stamp used here cannot be deleted. */
export const planStamps = pgTable(
  "plan_stamps",
  {
    planId: uuid("plan_id")
      .notNull()
      .references(() => plans.id, { onDelete: "cascade" }),
    stampId: uuid("stamp_id")
      .notNull()
      .references(() => stamps.id, { onDelete: "restrict" }),
    /** "field" or "border:<index>". */
    role: text("role").notNull(),
  },
  (t) => [primaryKey({ columns: [t.planId, t.role] }), index("plan_stamps_stamp_idx").on(t.stampId)],
);

/** The history of a plan: who created, changed, renamed, recomputed or copied it, and what changed. */
export const planEvents = pgTable(
  "plan_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    planId: uuid("plan_id")
      .notNull()
      .references(() => plans.id, { onDelete: "cascade" }),
    kind: planEventKindEnum("kind").notNull(),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    /** Kept beside actor_id so the history still names people whose account is gone. */
    actorName: text("actor_name").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
    /** The plan's version after this change. */
    version: integer("version").notNull(),
    details: jsonb("details").$type<Record<string, unknown>>(),
  },
  (t) => [index("plan_events_plan_at_idx").on(t.planId, t.at)],
);

export type Plan = typeof plans.$inferSelect;
export type NewPlan = typeof plans.$inferInsert;
export type PlanEvent = typeof planEvents.$inferSelect;
export type PlanEventKind = (typeof planEventKindEnum.enumValues)[number];
