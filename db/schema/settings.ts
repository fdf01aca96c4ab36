import { sql } from "drizzle-orm";
import { check, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { users } from "./users";

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
