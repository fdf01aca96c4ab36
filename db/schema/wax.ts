import { sql } from "drizzle-orm";
import { type AnyPgColumn, boolean, check, date, doublePrecision, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { plans } from "./plans";
import { runStages } from "./runs";
import { stamps } from "./stamps";
import { users } from "./users";

// Wax room: materials with their stock movements, recipes with their components, saved estimates, recorded
// wax uses (the one model a production run's waxing stage writes too) and the histories of materials and recipes.
// Masses in kg or g as named, temperatures in °C, areas in m², lengths in m as named.

export const waxSeasonEnum = pgEnum("wax_season", ["dry", "humid", "rainy", "any"]);
export const waxRecipeUseEnum = pgEnum("wax_recipe_use", ["stamping", "hand-drawn", "screen-paste", "blocking"]);
export const waxMovementKindEnum = pgEnum("wax_movement_kind", ["receipt", "use", "recovery", "correction"]);
export const waxChangeKindEnum = pgEnum("wax_change_kind", ["created", "edited", "duplicated", "archived", "restored"]);

/** A material of the mixes, each figure with the text of its source; `version` guards against silent overwrites. */
export const waxMaterials = pgTable(
  "wax_materials",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    /** Short lower-case key people and scripts may name it by ("paraffin"). */
    code: text("code").notNull(),
    name: text("name").notNull(),
    densityGPerCm3: doublePrecision("density_g_per_cm3").notNull(),
    meltFromC: doublePrecision("melt_from_c").notNull(),
    meltToC: doublePrecision("melt_to_c").notNull(),
    /** Null: not known; recipes using the material cannot be checked against the flash-point rule. */
    flashPointC: doublePrecision("flash_point_c"),
    discoloursAboveC: doublePrecision("discolours_above_c"),
    /** In the workshop's currency. */
    pricePerKg: doublePrecision("price_per_kg"),
    sources: jsonb("sources").$type<{ density: string; melting: string; flashPoint: string; price?: string }>().notNull(),
    /** The overview warns when stock on hand falls below this. */
    reorderLevelKg: doublePrecision("reorder_level_kg").notNull().default(0),
    version: integer("version").notNull().default(1),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("wax_materials_code_key").on(t.code),
    uniqueIndex("wax_materials_name_key").on(sql`lower(${t.name})`),
    check("wax_materials_density_range", sql`${t.densityGPerCm3} >= 0.5 AND ${t.densityGPerCm3} <= 2`),
    check("wax_materials_melt_order", sql`${t.meltFromC} <= ${t.meltToC}`),
    check("wax_materials_flash_point_range", sql`${t.flashPointC} IS NULL OR (${t.flashPointC} >= 50 AND ${t.flashPointC} <= 600)`),
    check("wax_materials_price_nonnegative", sql`${t.pricePerKg} IS NULL OR ${t.pricePerKg} >= 0`),
    check("wax_materials_reorder_nonnegative", sql`${t.reorderLevelKg} >= 0`),
    check("wax_materials_version_positive", sql`${t.version} > 0`),
  ],
);

/**
 * A mix by mass %. Its components are rows (below); that they add up to 100 % is checked where they are
 * written, in one transaction with the recipe (a sum over rows is no check constraint).
 */
export const waxRecipes = pgTable(
  "wax_recipes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    name: text("name").notNull(),
    season: waxSeasonEnum("season").notNull(),
    use: waxRecipeUseEnum("use").notNull(),
    workingMinC: doublePrecision("working_min_c").notNull(),
    workingMaxC: doublePrecision("working_max_c").notNull(),
    notes: text("notes"),
    /** The recipe this one was duplicated from (a season's variant). */
    duplicatedFromId: uuid("duplicated_from_id").references((): AnyPgColumn => waxRecipes.id, { onDelete: "set null" }),
    /** Archived recipes stay for the estimates and uses that name them, but are not offered for new ones. */
    archivedAt: timestamp("archived_at", { withTimezone: true }),
    version: integer("version").notNull().default(1),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("wax_recipes_name_key").on(sql`lower(${t.name})`),
    check("wax_recipes_working_order", sql`${t.workingMinC} <= ${t.workingMaxC}`),
    check("wax_recipes_working_range", sql`${t.workingMinC} >= 20 AND ${t.workingMaxC} <= 300`),
    check("wax_recipes_version_positive", sql`${t.version} > 0`),
  ],
);

/** One line of a recipe: a material and its share by mass; a material at most once per recipe. */
export const waxRecipeComponents = pgTable(
  "wax_recipe_components",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    recipeId: uuid("recipe_id")
      .notNull()
      .references(() => waxRecipes.id, { onDelete: "cascade" }),
    line: integer("line").notNull(),
    materialId: uuid("material_id")
      .notNull()
      .references(() => waxMaterials.id, { onDelete: "restrict" }),
    pct: doublePrecision("pct").notNull(),
  },
  (t) => [
    uniqueIndex("wax_recipe_components_line_key").on(t.recipeId, t.line),
    uniqueIndex("wax_recipe_components_material_key").on(t.recipeId, t.materialId),
    index("wax_recipe_components_material_idx").on(t.materialId),
    check("wax_recipe_components_pct_range", sql`${t.pct} > 0 AND ${t.pct} <= 100`),
  ],
);

/** What changed on a material or a recipe, by whom and when (one row per save). */
const changeColumns = () => ({
  id: uuid("id").primaryKey().defaultRandom(),
  /** The record's version this change produced. */
  version: integer("version").notNull(),
  kind: waxChangeKindEnum("kind").notNull(),
  actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
  /** Kept beside actor_id so the history still names people whose account is gone. */
  actorName: text("actor_name").notNull(),
  at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  changes: jsonb("changes").$type<{ field: string; from: unknown; to: unknown }[]>().notNull().default(sql`'[]'::jsonb`),
  note: text("note"),
});

export const waxMaterialChanges = pgTable(
  "wax_material_changes",
  {
    ...changeColumns(),
    materialId: uuid("material_id")
      .notNull()
      .references(() => waxMaterials.id, { onDelete: "cascade" }),
  },
  (t) => [index("wax_material_changes_material_idx").on(t.materialId, t.at)],
);

export const waxRecipeChanges = pgTable(
  "wax_recipe_changes",
  {
    ...changeColumns(),
    recipeId: uuid("recipe_id")
      .notNull()
      .references(() => waxRecipes.id, { onDelete: "cascade" }),
  },
  (t) => [index("wax_recipe_changes_recipe_idx").on(t.recipeId, t.at)],
);

/** An estimate of the wax for a run, as computed when it was saved, for a saved plan or a typed area. */
export const waxEstimates = pgTable(
  "wax_estimates",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    name: text("name").notNull(),
    /** The saved plan it was made for; deleting a plan that estimates point at is refused. */
    planId: uuid("plan_id").references(() => plans.id, { onDelete: "restrict" }),
    recipeId: uuid("recipe_id")
      .notNull()
      .references(() => waxRecipes.id, { onDelete: "restrict" }),
    /** The inputs as given (area per metre, run length, passes, rate and its basis, losses, recovery). */
    inputs: jsonb("inputs").$type<Record<string, unknown>>().notNull(),
    /** The results as computed then (g/m, kg gross/recovered/new, by material, cost, band). */
    results: jsonb("results").$type<Record<string, unknown>>().notNull(),
    gramsPerMetre: doublePrecision("grams_per_metre").notNull(),
    kgNew: doublePrecision("kg_new").notNull(),
    /** Counts toward the purchase list. */
    planned: boolean("planned").notNull().default(false),
    version: integer("version").notNull().default(1),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdByName: text("created_by_name").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("wax_estimates_planned_idx").on(t.planned),
    index("wax_estimates_recipe_idx").on(t.recipeId),
    index("wax_estimates_plan_idx").on(t.planId),
    check("wax_estimates_grams_nonnegative", sql`${t.gramsPerMetre} >= 0 AND ${t.kgNew} >= 0`),
    check("wax_estimates_version_positive", sql`${t.version} > 0`),
  ],
);

/**
 * What one waxing actually used: the record the calibration fits, written from the wax room and (later) by a
 * production run's waxing stage. Never edited; a mistake is withdrawn, which reverses its stock movements
 * and impressions and leaves it out of the calibration.
 */
export const waxUses = pgTable(
  "wax_uses",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    usedOn: date("used_on").notNull(),
    /** The saved plan waxed; deleting a plan that wax uses point at is refused. */
    planId: uuid("plan_id").references(() => plans.id, { onDelete: "restrict" }),
    /** The production run's waxing stage this use records; a stage that wax uses name is not deleted. */
    runStageId: uuid("run_stage_id").references((): AnyPgColumn => runStages.id, { onDelete: "restrict" }),
    recipeId: uuid("recipe_id")
      .notNull()
      .references(() => waxRecipes.id, { onDelete: "restrict" }),
    /** The cloth as people name it ("mori primissima 106 cm"); the calibration fits per cloth by this name. */
    cloth: text("cloth"),
    waxedAreaPerMetreM2: doublePrecision("waxed_area_per_metre_m2").notNull(),
    metres: doublePrecision("metres").notNull(),
    passes: integer("passes").notNull().default(1),
    gramsUsed: doublePrecision("grams_used"),
    potBeforeG: doublePrecision("pot_before_g"),
    potAfterG: doublePrecision("pot_after_g"),
    potAddedG: doublePrecision("pot_added_g"),
    /** The wax used, g: gramsUsed, or pot before + added − after. */
    grams: doublePrecision("grams").notNull(),
    note: text("note"),
    recordedBy: uuid("recorded_by").references(() => users.id, { onDelete: "set null" }),
    recordedByName: text("recorded_by_name").notNull(),
    recordedAt: timestamp("recorded_at", { withTimezone: true }).notNull().defaultNow(),
    withdrawnAt: timestamp("withdrawn_at", { withTimezone: true }),
    withdrawnBy: uuid("withdrawn_by").references(() => users.id, { onDelete: "set null" }),
    withdrawnReason: text("withdrawn_reason"),
  },
  (t) => [
    index("wax_uses_recipe_idx").on(t.recipeId),
    index("wax_uses_used_on_idx").on(t.usedOn),
    index("wax_uses_plan_idx").on(t.planId),
    index("wax_uses_run_stage_idx").on(t.runStageId),
    check("wax_uses_area_positive", sql`${t.waxedAreaPerMetreM2} > 0`),
    check("wax_uses_metres_positive", sql`${t.metres} > 0`),
    check("wax_uses_passes_positive", sql`${t.passes} >= 1`),
    check("wax_uses_grams_nonnegative", sql`${t.grams} >= 0`),
  ],
);

/** Impressions a wax use added to a stamp (a pair's back face on its twin), so a withdrawal can take them back. */
export const waxUseImpressions = pgTable(
  "wax_use_impressions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    waxUseId: uuid("wax_use_id")
      .notNull()
      .references(() => waxUses.id, { onDelete: "cascade" }),
    stampId: uuid("stamp_id").references(() => stamps.id, { onDelete: "set null" }),
    stampCode: text("stamp_code").notNull(),
    impressions: integer("impressions").notNull(),
  },
  (t) => [index("wax_use_impressions_use_idx").on(t.waxUseId), check("wax_use_impressions_positive", sql`${t.impressions} > 0`)],
);

/**
 * Stock of a material changes only by movements, never by overwriting a number: receipts and recovered wax
 * in (+), use out (−), corrections either way. On hand = the sum of a material's movements.
 */
export const waxStockMovements = pgTable(
  "wax_stock_movements",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    materialId: uuid("material_id")
      .notNull()
      .references(() => waxMaterials.id, { onDelete: "restrict" }),
    kind: waxMovementKindEnum("kind").notNull(),
    /** Signed: receipts and recovery positive, use negative, corrections either. */
    kg: doublePrecision("kg").notNull(),
    note: text("note"),
    waxUseId: uuid("wax_use_id").references(() => waxUses.id, { onDelete: "restrict" }),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    actorName: text("actor_name").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("wax_stock_movements_material_idx").on(t.materialId, t.at),
    index("wax_stock_movements_use_idx").on(t.waxUseId),
    check(
      "wax_stock_movements_sign",
      sql`(${t.kind} IN ('receipt', 'recovery') AND ${t.kg} > 0) OR (${t.kind} = 'use' AND ${t.kg} < 0) OR (${t.kind} = 'correction' AND ${t.kg} <> 0)`,
    ),
  ],
);

export type WaxMaterialRow = typeof waxMaterials.$inferSelect;
export type WaxRecipeRow = typeof waxRecipes.$inferSelect;
export type WaxRecipeComponentRow = typeof waxRecipeComponents.$inferSelect;
export type WaxEstimateRow = typeof waxEstimates.$inferSelect;
export type WaxUseRow = typeof waxUses.$inferSelect;
export type WaxStockMovementRow = typeof waxStockMovements.$inferSelect;
export type WaxMovementKind = (typeof waxMovementKindEnum.enumValues)[number];
export type WaxChangeKind = (typeof waxChangeKindEnum.enumValues)[number];
