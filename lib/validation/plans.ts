import { z } from "@/lib/zod";
import { issueKey } from "@/lib/errors";
import { ARRANGEMENTS, checkArrangement, checkGap, layoutShape } from "@/lib/layout/schema";
import { idParamSchema, isoDate, optionalText, requiredText } from "./common";
import { bordersListRequestSchema, stampRequestSchema } from "./layout";
import { createStampSchema, stampCodeSchema } from "./stamps";

// Inputs of the cloth plans: a plan (its layout is POST /api/v1/layout's body, its borders beside it), the plan list's
// query, and the requests a plan sends to the keepers (stamps to check out, a new stamp to make).

const keyed = { error: (issue: z.core.$ZodRawIssue) => issueKey(issue) };
const version = z.coerce.number("validation.required").int("validation.wholeNumber").positive("validation.required");

const { borders: _borders, window: _window, impressions: _impressions, preview: _preview, ...savedShape } = layoutShape;
void _borders;
void _window;
void _impressions;
void _preview;

/**
 * The layout a plan keeps: the layout request body (the field stamp by size or by library code) without its view
 * options — window, impressions and preview are accepted and dropped — and without borders, which sit beside it.
 */
export const planLayoutSchema = z
  .object({ ...savedShape, stamp: stampRequestSchema, window: z.unknown().optional(), impressions: z.unknown().optional(), preview: z.unknown().optional() }, keyed)
  .strict()
  .superRefine((v, ctx) => {
    checkArrangement(v, ctx);
    if (!("code" in v.stamp)) checkGap({ stamp: v.stamp, gap: v.gap }, ctx);
  })
  .transform(({ window: _w, impressions: _i, preview: _p, ...layout }) => {
    void _w;
    void _i;
    void _p;
    return layout;
  });

export type PlanLayout = z.output<typeof planLayoutSchema>;

const planName = requiredText(120);
const planNotes = optionalText(4000);
const motifId = z.uuid("validation.invalidFormat").nullable().optional();

/** POST /api/v1/plans and the planner's save: `{ name, layout, borders?, notes?, motifId? }`. */
export const createPlanSchema = z
  .object({ name: planName, notes: planNotes, motifId, layout: planLayoutSchema, borders: bordersListRequestSchema.optional() })
  .strict();
export type CreatePlanInput = z.output<typeof createPlanSchema>;

/** PATCH /api/v1/plans/{id}: any of the fields, and the version the change started from (stale → 409). */
export const updatePlanSchema = z
  .object({ version, name: planName.optional(), notes: planNotes, motifId, layout: planLayoutSchema.optional(), borders: bordersListRequestSchema.optional() })
  .strict();
export type UpdatePlanInput = z.output<typeof updatePlanSchema>;

/** A rename from the plan page, or a copy's name. */
export const renamePlanSchema = z.object({ id: z.uuid("validation.notFound"), version, name: planName }).strict();
export const duplicatePlanSchema = z.object({ name: planName.optional() }).strict();
export const planVersionSchema = z.object({ version }).strict();
export const planIdParamSchema = idParamSchema;

export const planSortKeys = ["name", "updated", "impressions", "waxed", "cloth", "arrangement"] as const;
export type PlanSortKey = (typeof planSortKeys)[number];
const planSortValues = planSortKeys.flatMap((k) => [k, `-${k}`]);

export const planListQuerySchema = z
  .object({
    q: z.string().trim().max(100, "validation.tooLong").optional(),
    stamp: stampCodeSchema.optional(),
    arrangement: z.enum(ARRANGEMENTS, "validation.invalidOption").optional(),
    sort: z.enum(planSortValues as [string, ...string[]], "validation.invalidOption").default("-updated"),
    page: z.coerce.number("validation.wholeNumber").int("validation.wholeNumber").min(1).max(100_000).default(1),
    pageSize: z.coerce.number("validation.wholeNumber").int("validation.wholeNumber").min(1).max(100).default(25),
  })
  .strict();
export type PlanListQuery = z.output<typeof planListQuerySchema>;
export const planFilterKeys = ["q", "stamp", "arrangement"] as const satisfies readonly (keyof PlanListQuery)[];

/** The compare page: two to four plans. */
export const compareQuerySchema = z.object({
  ids: z
    .string("validation.required")
    .transform((v) => [...new Set(v.split(",").map((s) => s.trim()).filter(Boolean))])
    .pipe(z.array(z.uuid("validation.notFound")).min(2, "validation.compareCount").max(4, "validation.compareCount")),
});

// --- requests to the keepers ------------------------------------------------------------------

/** A check-out request: the stamps, for whom and where, from and until (YYYY-MM-DD), the plan, a note. */
export const createStampRequestSchema = z
  .object({
    planId: z.uuid("validation.notFound").nullable().optional(),
    stampCodes: z.array(stampCodeSchema, keyed).min(1, "validation.stampsRequired").max(20, keyed),
    forWhom: requiredText(120),
    workstation: requiredText(80),
    fromOn: isoDate,
    untilOn: isoDate,
    note: optionalText(1000),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.untilOn < v.fromOn) ctx.addIssue({ code: "custom", path: ["untilOn"], message: "validation.untilBeforeFrom" });
  });
export type CreateStampRequestInput = z.output<typeof createStampRequestSchema>;

export const acceptRequestSchema = z.object({ version }).strict();
export const declineRequestSchema = z.object({ version, reason: requiredText(500) }).strict();
export type DeclineRequestInput = z.output<typeof declineRequestSchema>;

export const stampRequestStates = ["open", "accepted", "checked_out", "declined"] as const;
export const stampRequestListQuerySchema = z
  .object({
    state: z.enum([...stampRequestStates, "pending"], "validation.invalidOption").optional(),
    plan: z.uuid("validation.notFound").optional(),
  })
  .strict();
export type StampRequestListQuery = z.output<typeof stampRequestListQuerySchema>;

/** A new stamp to make: its size (mm), the plan it is for, and a note for the keepers. */
/** The roles a stamp plays in a motif's set (db enum motif_stamp_role). */
export const newStampRoles = ["main", "filler", "border", "corner", "reverse_twin"] as const;

export const createNewStampRequestSchema = z
  .object({
    widthMm: z.number(keyed).min(5, keyed).max(1000, keyed),
    heightMm: z.number(keyed).min(5, keyed).max(1000, keyed),
    planId: z.uuid("validation.notFound").nullable().optional(),
    motifId: z.uuid("validation.notFound").nullable().optional(),
    role: z.enum(newStampRoles, "validation.invalidOption").nullable().optional(),
    note: optionalText(1000),
  })
  .strict()
  .refine((r) => !r.role || r.motifId, { path: ["motifId"], message: "validation.newStampMotifForRole" });
export type CreateNewStampRequestInput = z.output<typeof createNewStampRequestSchema>;

/** A keeper turns a request into the stamp record made from it: the stamp's fields, from the request's version. */
export const fulfilNewStampRequestSchema = z.object({ version, stamp: createStampSchema }).strict();
export type FulfilNewStampRequestInput = z.output<typeof fulfilNewStampRequestSchema>;

export const newStampRequestListQuerySchema = z.object({ state: z.enum(["open", "declined", "made"], "validation.invalidOption").optional() }).strict();

/** The planner's stamp search: words of a code or name, and how many to answer. */
export const planStampSearchSchema = z
  .object({
    q: z.string().trim().max(100, "validation.tooLong").optional(),
    limit: z.coerce.number("validation.wholeNumber").int("validation.wholeNumber").min(1).max(30).default(8),
  })
  .strict();
