import { sql } from "drizzle-orm";
import { type AnyPgColumn, boolean, check, date, index, integer, jsonb, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { stamps } from "./stamps";
import { users } from "./users";

// The motif archive: motifs, the stamps that carry each, collections that group them, and colourways (the
// ordered colours of a design, each with the stage that holds it).

export const motifStampRoleEnum = pgEnum("motif_stamp_role", ["main", "filler", "border", "corner", "reverse_twin"]);
export const clothFaceEnum = pgEnum("cloth_face", ["front", "back", "both"]);
export const motifEventKindEnum = pgEnum("motif_event_kind", ["created", "edited", "copied"]);

export const motifCollections = pgTable(
  "motif_collections",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    name: text("name").notNull(),
    /** A season or a year the collection is for, as people say it ("Dry season 2025"). */
    season: text("season"),
    year: integer("year"),
    description: text("description"),
    version: integer("version").notNull().default(1),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("motif_collections_name_key").on(sql`lower(${t.name})`), check("motif_collections_year_range", sql`${t.year} IS NULL OR ${t.year} BETWEEN 1800 AND 2200`)],
);

export const motifs = pgTable(
  "motifs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    name: text("name").notNull(),
    description: text("description"),
    /** Style, subject and era words, lower case, no repeats. */
    tags: text("tags").array().notNull().default(sql`'{}'::text[]`),
    designer: text("designer"),
    firstUsedOn: date("first_used_on"),
    notes: text("notes"),
    /** "Copy as a new design" keeps the link to the motif it was copied from. */
    copiedFromId: uuid("copied_from_id").references((): AnyPgColumn => motifs.id, { onDelete: "set null" }),
    version: integer("version").notNull().default(1),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("motifs_name_idx").on(t.name), index("motifs_tags_idx").using("gin", t.tags), check("motifs_version_positive", sql`${t.version} > 0`)],
);

export const motifCollectionMembers = pgTable(
  "motif_collection_members",
  {
    motifId: uuid("motif_id")
      .notNull()
      .references(() => motifs.id, { onDelete: "cascade" }),
    collectionId: uuid("collection_id")
      .notNull()
      .references(() => motifCollections.id, { onDelete: "restrict" }),
  },
  (t) => [primaryKey({ columns: [t.motifId, t.collectionId] }), index("motif_collection_members_collection_idx").on(t.collectionId)],
);

/** The stamp set: which stamps carry the motif, in which role. At most one main stamp. */
export const motifStamps = pgTable(
  "motif_stamps",
  {
    motifId: uuid("motif_id")
      .notNull()
      .references(() => motifs.id, { onDelete: "cascade" }),
    stampId: uuid("stamp_id")
      .notNull()
      .references(() => stamps.id, { onDelete: "cascade" }),
    role: motifStampRoleEnum("role").notNull(),
    position: integer("position").notNull().default(0),
  },
  (t) => [
    primaryKey({ columns: [t.motifId, t.stampId] }),
    uniqueIndex("motif_stamps_one_main").on(t.motifId).where(sql`${t.role} = 'main'`),
    index("motif_stamps_stamp_idx").on(t.stampId),
  ],
);

export const motifColourways = pgTable(
  "motif_colourways",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    motifId: uuid("motif_id")
      .notNull()
      .references(() => motifs.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    notes: text("notes"),
    position: integer("position").notNull().default(0),
  },
  (t) => [uniqueIndex("motif_colourways_name_key").on(t.motifId, sql`lower(${t.name})`)],
);

/** One colour of a colourway, in the order of work (position 0 is dyed first), with the stage that holds it. */
export const motifColours = pgTable(
  "motif_colours",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    colourwayId: uuid("colourway_id")
      .notNull()
      .references(() => motifColourways.id, { onDelete: "cascade" }),
    position: integer("position").notNull(),
    name: text("name").notNull(),
    /** #rrggbb */
    swatch: text("swatch").notNull(),
    dyeNotes: text("dye_notes"),
    /** The stamps that wax over this colour before the next dye (from the motif's set), and on which face. */
    waxStampIds: uuid("wax_stamp_ids").array().notNull().default(sql`'{}'::uuid[]`),
    face: clothFaceEnum("face").notNull().default("front"),
    /** The colour is reached by bleaching (the ground taken back) rather than by a dye: a run gets a bleach stage for it. */
    bleach: boolean("bleach").notNull().default(false),
  },
  (t) => [uniqueIndex("motif_colours_order_key").on(t.colourwayId, t.position), check("motif_colours_swatch_hex", sql`${t.swatch} ~ '^#[0-9a-f]{6}$'`)],
);

/** A motif's history: who changed what, when. */
export const motifEvents = pgTable(
  "motif_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    motifId: uuid("motif_id")
      .notNull()
      .references(() => motifs.id, { onDelete: "cascade" }),
    kind: motifEventKindEnum("kind").notNull(),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    actorName: text("actor_name").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
    /** The fields that changed: [{ field, from, to }]. */
    changes: jsonb("changes").$type<Array<{ field: string; from: unknown; to: unknown }>>().notNull().default([]),
  },
  (t) => [index("motif_events_motif_at_idx").on(t.motifId, t.at)],
);

export type Motif = typeof motifs.$inferSelect;
export type MotifCollection = typeof motifCollections.$inferSelect;
export type MotifStampRole = (typeof motifStampRoleEnum.enumValues)[number];
export type ClothFace = (typeof clothFaceEnum.enumValues)[number];
export type MotifEventKind = (typeof motifEventKindEnum.enumValues)[number];
