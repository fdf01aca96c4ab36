import { sql } from "drizzle-orm";
import { check, date, doublePrecision, index, integer, pgEnum, pgTable, primaryKey, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { motifs, motifStampRoleEnum } from "./motifs";
import { plans } from "./plans";
import { runStages } from "./runs";
import { checkouts, stamps } from "./stamps";
import { users } from "./users";

// Requests to the stamp keepers: stamps to check out for a while (from a plan, by anyone), and new stamps to be made
// (from the fit helper; the motif archive adds sketches, roles, motifs and the stamp made from a request).

export const stampRequestStateEnum = pgEnum("stamp_request_state", ["open", "accepted", "checked_out", "declined"]);
export const newStampRequestStateEnum = pgEnum("new_stamp_request_state", ["open", "declined", "made"]);

/**
 * A check-out request: these stamps, for whom, where, from and until when, for which plan. Keepers accept it (every
 * stamp checked out in one transaction; a request for later days waits as `accepted` and is checked out on its first
 * day) or decline it with a reason.
 */
export const stampRequests = pgTable(
  "stamp_requests",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    planId: uuid("plan_id").references(() => plans.id, { onDelete: "set null" }),
    /** The production run's waxing stage the stamps are asked for (one click on the run page), or null. */
    runStageId: uuid("run_stage_id").references(() => runStages.id, { onDelete: "set null" }),
    requestedBy: uuid("requested_by").references(() => users.id, { onDelete: "set null" }),
    /** Kept beside requested_by so the queue still names people whose account is gone. */
    requesterName: text("requester_name").notNull(),
    requesterEmail: text("requester_email"),
    /** Who will use the stamps (the borrower on the check-outs). */
    forWhom: text("for_whom").notNull(),
    workstation: text("workstation").notNull(),
    fromOn: date("from_on").notNull(),
    untilOn: date("until_on").notNull(),
    note: text("note"),
    state: stampRequestStateEnum("state").notNull().default("open"),
    answeredBy: uuid("answered_by").references(() => users.id, { onDelete: "set null" }),
    answeredByName: text("answered_by_name"),
    answeredAt: timestamp("answered_at", { withTimezone: true }),
    /** The keeper's reason for declining. */
    declineReason: text("decline_reason"),
    /** Why an accepted request could not be checked out on its first day (a stamp out or under repair), or null. */
    checkoutProblem: text("checkout_problem"),
    checkedOutAt: timestamp("checked_out_at", { withTimezone: true }),
    version: integer("version").notNull().default(1),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("stamp_requests_state_idx").on(t.state, t.fromOn),
    index("stamp_requests_plan_idx").on(t.planId),
    index("stamp_requests_run_stage_idx").on(t.runStageId),
    check("stamp_requests_dates", sql`${t.untilOn} >= ${t.fromOn}`),
    check("stamp_requests_declined_reason", sql`${t.state} <> 'declined' OR ${t.declineReason} IS NOT NULL`),
  ],
);

/** The stamps of a request, and the check-out each became. */
export const stampRequestItems = pgTable(
  "stamp_request_items",
  {
    requestId: uuid("request_id")
      .notNull()
      .references(() => stampRequests.id, { onDelete: "cascade" }),
    stampId: uuid("stamp_id")
      .notNull()
      .references(() => stamps.id, { onDelete: "cascade" }),
    checkoutId: uuid("checkout_id").references(() => checkouts.id, { onDelete: "set null" }),
  },
  (t) => [primaryKey({ columns: [t.requestId, t.stampId] }), index("stamp_request_items_stamp_idx").on(t.stampId)],
);

/** A request to make a new stamp of a size (from a plan's fit helper); keepers see the open ones on the shelf. */
export const newStampRequests = pgTable(
  "new_stamp_requests",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    widthMm: doublePrecision("width_mm").notNull(),
    heightMm: doublePrecision("height_mm").notNull(),
    planId: uuid("plan_id").references(() => plans.id, { onDelete: "set null" }),
    note: text("note"),
    /** The motif the stamp is for and its role in the motif's set (a designer's request), or null (a planner's size). */
    motifId: uuid("motif_id").references(() => motifs.id, { onDelete: "set null" }),
    role: motifStampRoleEnum("role"),
    /** A sketch of the stamp in the object store (checked like a scan), its media type and file name. */
    sketchKey: text("sketch_key"),
    sketchType: text("sketch_type"),
    sketchName: text("sketch_name"),
    state: newStampRequestStateEnum("state").notNull().default("open"),
    /** The stamp record made from the request when it arrived from the maker. */
    stampId: uuid("stamp_id").references(() => stamps.id, { onDelete: "set null" }),
    requestedBy: uuid("requested_by").references(() => users.id, { onDelete: "set null" }),
    requesterName: text("requester_name").notNull(),
    answeredBy: uuid("answered_by").references(() => users.id, { onDelete: "set null" }),
    answeredByName: text("answered_by_name"),
    answeredAt: timestamp("answered_at", { withTimezone: true }),
    declineReason: text("decline_reason"),
    version: integer("version").notNull().default(1),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("new_stamp_requests_state_idx").on(t.state, t.createdAt),
    check("new_stamp_requests_size_positive", sql`${t.widthMm} > 0 AND ${t.heightMm} > 0`),
    check("new_stamp_requests_declined_reason", sql`${t.state} <> 'declined' OR ${t.declineReason} IS NOT NULL`),
    check("new_stamp_requests_made_answered", sql`${t.state} <> 'made' OR ${t.answeredAt} IS NOT NULL`),
    index("new_stamp_requests_motif_idx").on(t.motifId),
  ],
);

export type StampRequest = typeof stampRequests.$inferSelect;
export type StampRequestState = (typeof stampRequestStateEnum.enumValues)[number];
export type NewStampRequest = typeof newStampRequests.$inferSelect;
export type NewStampRequestState = (typeof newStampRequestStateEnum.enumValues)[number];
