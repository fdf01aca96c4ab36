import { sql } from "drizzle-orm";
import { check, date, doublePrecision, index, integer, jsonb, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { clothFaceEnum, motifColourways, motifs } from "./motifs";
import { plans } from "./plans";
import { stamps } from "./stamps";
import { users } from "./users";
import { waxRecipes, waxUses } from "./wax";

// Production runs: one batch of cloth taken through its stages in the colourway's order (wax over what must keep
// a colour, dye, bleach, and the boil-off last), with what was done at each stage, pot temperatures and quality
// findings. A waxing stage's actual wax is a wax room wax use (wax_uses.run_stage_id points here), so the
// calibration, the stock movements and the stamps' impression counts come from the one record.
// Masses in g unless named kg, temperatures in °C, lengths in m or mm as named.

/** setup: being prepared; underway: in work (the stage is the first one not done); complete: finished; halted: stopped. */
export const runStateEnum = pgEnum("run_state", ["setup", "underway", "complete", "halted"]);
export const runStageKindEnum = pgEnum("run_stage_kind", ["wax", "dye", "bleach", "boil_off"]);
export const runStageStateEnum = pgEnum("run_stage_state", ["planned", "underway", "done"]);
/** stamp: copper stamps; screen: a paste wax pushed through a screen (a very large motif). */
export const runWaxMethodEnum = pgEnum("run_wax_method", ["stamp", "screen"]);
export const runDyeMethodEnum = pgEnum("run_dye_method", ["bath", "brush"]);
/**
 * seeped: wax ran beyond the line where the colour should hold; thin: wax missing or too thin, dye crept in;
 * cracked: unwanted cracks; pooled: wax pooled from a stamp left down too long; smudged: smudges.
 */
export const runFindingKindEnum = pgEnum("run_finding_kind", ["seeped", "thin", "cracked", "pooled", "smudged"]);
/** lifted: wax lifted with a hot tool; filled: filled in by hand; none: left as it is. */
export const runRepairEnum = pgEnum("run_repair", ["none", "lifted", "filled"]);
export const runEventKindEnum = pgEnum("run_event_kind", ["created", "edited", "state", "progress", "reading", "finding"]);

/** One run. Exactly one size: metres, or pieces of a length. `version` guards against silent overwrites. */
export const runs = pgTable(
  "runs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    name: text("name").notNull(),
    /** A motif or colourway a run names is not deleted (restrict). */
    motifId: uuid("motif_id")
      .notNull()
      .references(() => motifs.id, { onDelete: "restrict" }),
    colourwayId: uuid("colourway_id")
      .notNull()
      .references(() => motifColourways.id, { onDelete: "restrict" }),
    /** The cloth as people name it ("mori primissima 106 cm"); the calibration fits per cloth by this name. */
    cloth: text("cloth").notNull(),
    metres: doublePrecision("metres"),
    pieces: integer("pieces"),
    pieceLengthMm: doublePrecision("piece_length_mm"),
    dueOn: date("due_on"),
    state: runStateEnum("state").notNull().default("setup"),
    /** Why a run was halted. */
    stateNote: text("state_note"),
    notes: text("notes"),
    version: integer("version").notNull().default(1),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdByName: text("created_by_name").notNull(),
    updatedBy: uuid("updated_by").references(() => users.id, { onDelete: "set null" }),
    updatedByName: text("updated_by_name").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("runs_state_idx").on(t.state),
    index("runs_motif_idx").on(t.motifId),
    index("runs_updated_idx").on(t.updatedAt),
    check("runs_name_not_blank", sql`length(trim(${t.name})) > 0`),
    check("runs_cloth_not_blank", sql`length(trim(${t.cloth})) > 0`),
    check(
      "runs_one_size",
      sql`(${t.metres} IS NOT NULL AND ${t.metres} > 0 AND ${t.pieces} IS NULL AND ${t.pieceLengthMm} IS NULL) OR (${t.metres} IS NULL AND ${t.pieces} IS NOT NULL AND ${t.pieces} > 0 AND ${t.pieceLengthMm} IS NOT NULL AND ${t.pieceLengthMm} > 0)`,
    ),
    check("runs_version_positive", sql`${t.version} > 0`),
  ],
);

/** The plans a run stamps; a plan a run names is not deleted (restrict). */
export const runPlans = pgTable(
  "run_plans",
  {
    runId: uuid("run_id")
      .notNull()
      .references(() => runs.id, { onDelete: "cascade" }),
    planId: uuid("plan_id")
      .notNull()
      .references(() => plans.id, { onDelete: "restrict" }),
    position: integer("position").notNull().default(0),
  },
  (t) => [primaryKey({ columns: [t.runId, t.planId] }), index("run_plans_plan_idx").on(t.planId)],
);

/**
 * One stage of a run, in order (position). A waxing stage names its method and, stamping, its plan, recipe and
 * faces; a dye stage its colour and method. What the estimator said when the stage was saved is kept beside it
 * (`estimate`, and `kgEstimated`, `impressionsEstimated`, `hoursEstimated` for the totals and the purchase list).
 */
export const runStages = pgTable(
  "run_stages",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    runId: uuid("run_id")
      .notNull()
      .references(() => runs.id, { onDelete: "cascade" }),
    position: integer("position").notNull(),
    kind: runStageKindEnum("kind").notNull(),
    state: runStageStateEnum("state").notNull().default("planned"),
    /** The colourway's colour this stage puts on (dye) or keeps (wax), by its position in the colourway. */
    colourPosition: integer("colour_position"),
    colourName: text("colour_name"),
    swatch: text("swatch"),
    plannedStartOn: date("planned_start_on"),
    plannedEndOn: date("planned_end_on"),
    waxMethod: runWaxMethodEnum("wax_method"),
    planId: uuid("plan_id").references(() => plans.id, { onDelete: "restrict" }),
    recipeId: uuid("recipe_id").references(() => waxRecipes.id, { onDelete: "restrict" }),
    faces: clothFaceEnum("faces"),
    passes: integer("passes").notNull().default(1),
    dyeMethod: runDyeMethodEnum("dye_method"),
    notes: text("notes"),
    estimate: jsonb("estimate").$type<Record<string, unknown>>(),
    kgEstimated: doublePrecision("kg_estimated").notNull().default(0),
    impressionsEstimated: integer("impressions_estimated").notNull().default(0),
    hoursEstimated: doublePrecision("hours_estimated").notNull().default(0),
  },
  (t) => [
    uniqueIndex("run_stages_order_key").on(t.runId, t.position),
    index("run_stages_plan_idx").on(t.planId),
    index("run_stages_recipe_idx").on(t.recipeId),
    check("run_stages_position_nonnegative", sql`${t.position} >= 0`),
    check("run_stages_dates_order", sql`${t.plannedStartOn} IS NULL OR ${t.plannedEndOn} IS NULL OR ${t.plannedStartOn} <= ${t.plannedEndOn}`),
    check("run_stages_wax_has_method", sql`(${t.kind} = 'wax') = (${t.waxMethod} IS NOT NULL)`),
    check("run_stages_only_wax_names_wax", sql`${t.kind} = 'wax' OR (${t.planId} IS NULL AND ${t.recipeId} IS NULL AND ${t.faces} IS NULL)`),
    check("run_stages_dye_method", sql`${t.dyeMethod} IS NULL OR ${t.kind} = 'dye'`),
    check("run_stages_swatch_hex", sql`${t.swatch} IS NULL OR ${t.swatch} ~ '^#[0-9a-f]{6}$'`),
    check("run_stages_passes_positive", sql`${t.passes} >= 1`),
    check("run_stages_estimates_nonnegative", sql`${t.kgEstimated} >= 0 AND ${t.impressionsEstimated} >= 0 AND ${t.hoursEstimated} >= 0`),
  ],
);

/** The stamps a waxing stage needs, on which face; a stamp a stage names is not deleted (restrict). */
export const runStageStamps = pgTable(
  "run_stage_stamps",
  {
    stageId: uuid("stage_id")
      .notNull()
      .references(() => runStages.id, { onDelete: "cascade" }),
    stampId: uuid("stamp_id")
      .notNull()
      .references(() => stamps.id, { onDelete: "restrict" }),
    face: clothFaceEnum("face").notNull().default("front"),
  },
  (t) => [primaryKey({ columns: [t.stageId, t.stampId] }), index("run_stage_stamps_stamp_idx").on(t.stampId)],
);

/**
 * Work done at a stage on one day: metres or pieces, impressions, the pot weighed before and after (a waxing
 * stage; the wax use it wrote is `wax_use_id`, which carries the grams, the stock movements and the impressions),
 * and the wax recovered at the boil-off.
 */
export const runProgress = pgTable(
  "run_progress",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    stageId: uuid("stage_id")
      .notNull()
      .references(() => runStages.id, { onDelete: "cascade" }),
    doneOn: date("done_on").notNull(),
    metres: doublePrecision("metres"),
    pieces: integer("pieces"),
    impressions: integer("impressions"),
    /** The wax use this waxing wrote (the same record the calibration fits); one progress row per wax use. */
    waxUseId: uuid("wax_use_id").references(() => waxUses.id, { onDelete: "restrict" }),
    potBeforeG: doublePrecision("pot_before_g"),
    potAfterG: doublePrecision("pot_after_g"),
    potAddedG: doublePrecision("pot_added_g"),
    /** The wax used, g (a waxing): pot before + added − after, or as weighed. */
    waxUsedG: doublePrecision("wax_used_g"),
    /** Wax recovered at the boil-off, g. */
    recoveredG: doublePrecision("recovered_g"),
    note: text("note"),
    recordedBy: uuid("recorded_by").references(() => users.id, { onDelete: "set null" }),
    recordedByName: text("recorded_by_name").notNull(),
    recordedAt: timestamp("recorded_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("run_progress_stage_idx").on(t.stageId, t.doneOn),
    uniqueIndex("run_progress_wax_use_key").on(t.waxUseId),
    check("run_progress_metres_nonnegative", sql`${t.metres} IS NULL OR ${t.metres} >= 0`),
    check("run_progress_pieces_nonnegative", sql`${t.pieces} IS NULL OR ${t.pieces} >= 0`),
    check("run_progress_impressions_nonnegative", sql`${t.impressions} IS NULL OR ${t.impressions} >= 0`),
    check(
      "run_progress_masses_nonnegative",
      sql`(${t.potBeforeG} IS NULL OR ${t.potBeforeG} >= 0) AND (${t.potAfterG} IS NULL OR ${t.potAfterG} >= 0) AND (${t.potAddedG} IS NULL OR ${t.potAddedG} >= 0) AND (${t.waxUsedG} IS NULL OR ${t.waxUsedG} >= 0) AND (${t.recoveredG} IS NULL OR ${t.recoveredG} >= 0)`,
    ),
  ],
);

/** A pot temperature reading during a stage. */
export const runReadings = pgTable(
  "run_readings",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    stageId: uuid("stage_id")
      .notNull()
      .references(() => runStages.id, { onDelete: "cascade" }),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
    tempC: doublePrecision("temp_c").notNull(),
    note: text("note"),
    recordedBy: uuid("recorded_by").references(() => users.id, { onDelete: "set null" }),
    recordedByName: text("recorded_by_name").notNull(),
  },
  (t) => [index("run_readings_stage_idx").on(t.stageId, t.at), check("run_readings_temp_range", sql`${t.tempC} >= -20 AND ${t.tempC} <= 400`)],
);

/**
 * A quality finding: its kind, where and how many, the stamp that caused it (the code copied, so it survives the
 * stamp), a photo's object key, and the repair made. Three of one kind from one stamp within 30 days flag the stamp.
 */
export const runFindings = pgTable(
  "run_findings",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    runId: uuid("run_id")
      .notNull()
      .references(() => runs.id, { onDelete: "cascade" }),
    stageId: uuid("stage_id").references(() => runStages.id, { onDelete: "set null" }),
    foundOn: date("found_on").notNull(),
    kind: runFindingKindEnum("kind").notNull(),
    location: text("location"),
    count: integer("count").notNull().default(1),
    stampId: uuid("stamp_id").references(() => stamps.id, { onDelete: "set null" }),
    stampCode: text("stamp_code"),
    photoKey: text("photo_key"),
    repair: runRepairEnum("repair").notNull().default("none"),
    repairNote: text("repair_note"),
    recordedBy: uuid("recorded_by").references(() => users.id, { onDelete: "set null" }),
    recordedByName: text("recorded_by_name").notNull(),
    recordedAt: timestamp("recorded_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("run_findings_run_idx").on(t.runId),
    index("run_findings_stamp_idx").on(t.stampId, t.foundOn),
    check("run_findings_count_positive", sql`${t.count} >= 1`),
    check("run_findings_stamp_code", sql`${t.stampId} IS NULL OR ${t.stampCode} IS NOT NULL`),
  ],
);

/** The history of a run: who created, changed or recorded what, and when. */
export const runEvents = pgTable(
  "run_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    runId: uuid("run_id")
      .notNull()
      .references(() => runs.id, { onDelete: "cascade" }),
    kind: runEventKindEnum("kind").notNull(),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    /** Kept beside actor_id so the history still names people whose account is gone. */
    actorName: text("actor_name").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
    /** The run's version after this change. */
    version: integer("version").notNull(),
    changes: jsonb("changes").$type<{ field: string; from: unknown; to: unknown }[]>().notNull().default(sql`'[]'::jsonb`),
    details: jsonb("details").$type<Record<string, unknown>>(),
  },
  (t) => [index("run_events_run_at_idx").on(t.runId, t.at)],
);

export type RunRow = typeof runs.$inferSelect;
export type RunStageRow = typeof runStages.$inferSelect;
export type RunProgressRow = typeof runProgress.$inferSelect;
export type RunReadingRow = typeof runReadings.$inferSelect;
export type RunFindingRow = typeof runFindings.$inferSelect;
export type RunEventRow = typeof runEvents.$inferSelect;
export type RunState = (typeof runStateEnum.enumValues)[number];
export type RunStageKind = (typeof runStageKindEnum.enumValues)[number];
export type RunStageState = (typeof runStageStateEnum.enumValues)[number];
export type RunFindingKind = (typeof runFindingKindEnum.enumValues)[number];
export type RunRepair = (typeof runRepairEnum.enumValues)[number];
export type RunEventKind = (typeof runEventKindEnum.enumValues)[number];
