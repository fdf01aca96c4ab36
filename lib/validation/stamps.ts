import { z } from "@/lib/zod";
import { latestTodayIso, todayIso } from "@/lib/dates";
import { boolParam, idParamSchema, isoDate, optionalText, requiredText } from "./common";

// One schema per input of the stamp shelf, shared by forms, server actions, route handlers,
// the CSV import and the tests. Lengths in mm, masses in g, dates as YYYY-MM-DD.

export const stampConditions = ["sound", "worn", "needs_repair", "in_repair", "retired"] as const;
export const stampFaces = ["single", "pair"] as const;
export const damageKinds = ["bent_strip", "cracked_solder", "loose_handle", "worn_face", "other"] as const;
export type StampConditionValue = (typeof stampConditions)[number];

export const stampCodeSchema = z
  .string("validation.required")
  .trim()
  .toUpperCase()
  .regex(/^[A-Z0-9][A-Z0-9._-]{0,31}$/, "validation.stampCode");

export const locationCodeSchema = z
  .string("validation.required")
  .trim()
  .toUpperCase()
  .regex(/^[A-Z0-9][A-Z0-9._/-]{0,39}$/, "validation.locationCode");


/** Rounded to 0.1 mm: finer than any stamp is measured, and it keeps inch round trips stable. */
const mm = (min: number, max: number, message: string) =>
  z
    .number("validation.number")
    .min(min, message)
    .max(max, message)
    .transform((v) => Math.round(v * 10) / 10);


const tag = z.string().trim().toLowerCase().min(1, "validation.tag").max(40, "validation.tag");
const tags = z
  .array(tag, "validation.tag")
  .max(20, "validation.tag")
  .transform((list) => [...new Set(list)]);

const svgPath = z
  .string()
  .trim()
  .max(100_000, "validation.tooLong")
  .regex(/^[MmLlHhVvCcSsQqTtAaZz0-9eE\s,.+-]*$/, "validation.outlinePath")
  .refine((v) => v === "" || /^\s*[Mm]/.test(v), "validation.outlinePath")
  .transform((v) => (v === "" ? null : v));

/** Every field of a stamp that people set; the server adds id, version, timestamps. No defaults here: a change leaves out what it does not change. */
const fieldShape = {
  code: stampCodeSchema,
  name: requiredText(120),
  widthMm: mm(5, 1500, "validation.stampSide"),
  heightMm: mm(5, 1500, "validation.stampSide"),
  stripDepthMm: mm(0.5, 100, "validation.stripDepth").nullable(),
  weightG: z.number("validation.number").min(1, "validation.stampWeight").max(50_000, "validation.stampWeight").transform(Math.round).nullable(),
  face: z.enum(stampFaces, "validation.invalidOption"),
  mirrored: z.boolean("validation.yesNo"),
  /** The mirror twin, by its code; only for face = pair. */
  twinCode: stampCodeSchema.nullable(),
  maker: optionalText(120),
  madeOn: isoDate.refine((v) => v <= latestTodayIso(), "validation.dateInFuture").nullable(),
  condition: z.enum(stampConditions, "validation.invalidOption"),
  locationId: z.uuid("validation.locationUnknown").nullable(),
  coverageRatio: z.number("validation.number").min(0, "validation.coverageRatio").max(1, "validation.coverageRatio").nullable(),
  outlinePath: svgPath.nullable(),
  impressionsCount: z.number("validation.impressions").int("validation.impressions").min(0, "validation.impressions").max(100_000_000, "validation.impressions"),
  notes: optionalText(4000),
  tags,
  motifId: z.uuid("validation.invalid").nullable(),
};

export const stampFields = z.object({
  ...fieldShape,
  stripDepthMm: fieldShape.stripDepthMm.optional(),
  weightG: fieldShape.weightG.optional(),
  face: fieldShape.face.default("single"),
  mirrored: fieldShape.mirrored.default(false),
  twinCode: fieldShape.twinCode.optional(),
  madeOn: fieldShape.madeOn.optional(),
  condition: fieldShape.condition.default("sound"),
  locationId: fieldShape.locationId.optional(),
  coverageRatio: fieldShape.coverageRatio.optional(),
  outlinePath: fieldShape.outlinePath.optional(),
  impressionsCount: fieldShape.impressionsCount.default(0),
  tags: fieldShape.tags.default([]),
  motifId: fieldShape.motifId.optional(),
});

type TwinShape = { code?: string; face?: string; twinCode?: string | null };
function checkTwin(value: TwinShape, ctx: z.RefinementCtx) {
  if (!value.twinCode) return;
  if (value.face !== undefined && value.face !== "pair") ctx.addIssue({ code: "custom", path: ["twinCode"], message: "validation.twinNeedsPair" });
  if (value.code && value.twinCode === value.code) ctx.addIssue({ code: "custom", path: ["twinCode"], message: "validation.twinSelf" });
}

export const createStampSchema = stampFields.strict().superRefine(checkTwin);

const { impressionsCount: _impressionsCount, ...editableShape } = fieldShape;
void _impressionsCount;

/**
 * A change: any subset of the fields plus the version the editor started from. The impression count is not
 * among them: only the work that made impressions adds to it (lib/data/stamps/impressions.ts).
 */
export const updateStampSchema = z
  .object(editableShape)
  .partial()
  .extend({ version: z.number("validation.required").int().positive(), impressionsCount: z.unknown().optional() })
  .strict()
  .superRefine((value, ctx) => {
    if (value.impressionsCount !== undefined) ctx.addIssue({ code: "custom", path: ["impressionsCount"], message: "validation.impressionsReadOnly" });
    if (Object.keys(value).filter((k) => k !== "version").length === 0) ctx.addIssue({ code: "custom", path: [], message: "validation.nothingToChange" });
    checkTwin(value, ctx);
  })
  .transform((value) => {
    const { impressionsCount, ...rest } = value;
    void impressionsCount;
    return rest;
  });

export type CreateStampInput = z.output<typeof createStampSchema>;
export type UpdateStampInput = z.output<typeof updateStampSchema>;

export const stampCodeParamSchema = z.object({ code: stampCodeSchema });

// --- list query ---------------------------------------------------------------------------

export const stampSortKeys = ["code", "name", "width", "height", "condition", "location", "maker", "madeOn", "updated", "impressions"] as const;
export type StampSortKey = (typeof stampSortKeys)[number];
const sortValues = stampSortKeys.flatMap((k) => [k, `-${k}`] as const);

/** "a,b" or a repeated key (joined by queryObject) → a list of allowed values; one message for the field. */
const commaList = <T extends readonly [string, ...string[]]>(values: T) =>
  z.string().transform((v, ctx) => {
    const list = [...new Set(v.split(",").map((s) => s.trim()).filter(Boolean))];
    if (list.some((item) => !values.includes(item))) {
      ctx.addIssue({ code: "custom", message: "validation.invalidOption", params: { options: values.join(", ") } });
      return z.NEVER;
    }
    return list as T[number][];
  });

const sizeParam = z.coerce.number("validation.number").positive("validation.tooSmall").max(10_000, "validation.tooBig");

/** GET /api/v1/stamps query string (also the export's and the table's). */
export const stampListQuerySchema = z
  .object({
    q: z.string().trim().max(100, "validation.tooLong").optional(),
    condition: commaList(stampConditions).optional(),
    location: z.uuid("validation.locationUnknown").optional(),
    site: z.string().trim().max(80, "validation.tooLong").optional(),
    face: z.enum(stampFaces, "validation.invalidOption").optional(),
    out: boolParam.optional(),
    overdue: boolParam.optional(),
    tag: tag.optional(),
    /** Only stamps whose coverage is under 1 % (see lib/stamps/coverage.ts), for keepers to check. */
    lowCoverage: boolParam.optional(),
    minWidthMm: sizeParam.optional(),
    maxWidthMm: sizeParam.optional(),
    minHeightMm: sizeParam.optional(),
    maxHeightMm: sizeParam.optional(),
    sort: z.enum(sortValues as unknown as [string, ...string[]], "validation.invalidOption").default("code"),
    page: z.coerce.number("validation.wholeNumber").int("validation.wholeNumber").min(1).max(100_000).default(1),
    pageSize: z.coerce.number("validation.wholeNumber").int("validation.wholeNumber").min(1).max(200).default(50),
  })
  .superRefine((v, ctx) => {
    if (v.minWidthMm !== undefined && v.maxWidthMm !== undefined && v.minWidthMm > v.maxWidthMm) ctx.addIssue({ code: "custom", path: ["maxWidthMm"], message: "validation.rangeOrder" });
    if (v.minHeightMm !== undefined && v.maxHeightMm !== undefined && v.minHeightMm > v.maxHeightMm) ctx.addIssue({ code: "custom", path: ["maxHeightMm"], message: "validation.rangeOrder" });
  });

export type StampListQuery = z.output<typeof stampListQuerySchema>;

/** The list query's filters (all but sort and page): the table keeps exactly these in the address. */
export const stampFilterKeys = Object.keys(stampListQuerySchema.shape).filter((key) => !["sort", "page", "pageSize"].includes(key)) as (keyof StampListQuery)[];


// --- locations -----------------------------------------------------------------------------

export const locationSchema = z
  .object({
    site: requiredText(80),
    code: locationCodeSchema,
    description: optionalText(300),
  })
  .strict();
export const updateLocationSchema = locationSchema
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, "validation.nothingToChange");
export type LocationInput = z.output<typeof locationSchema>;
export const locationIdParamSchema = idParamSchema;

// --- check-out, return, condition, damage ---------------------------------------------------

export const checkoutSchema = z
  .object({
    /** A user with an account, or a name (and e-mail for reminders) of someone without one. */
    borrowerId: z.uuid("validation.borrowerUnknown").optional(),
    borrowerName: optionalText(120),
    borrowerEmail: z
      .string()
      .trim()
      .toLowerCase()
      .max(254, "validation.tooLong")
      .transform((v) => (v === "" ? null : v))
      .pipe(z.email("validation.email").nullable())
      .nullable()
      .optional(),
    workstation: requiredText(80),
    dueOn: isoDate.refine((v) => v >= todayIso(), "validation.dueDatePast"),
    note: optionalText(500),
  })
  .strict()
  .refine((v) => v.borrowerId || v.borrowerName, { message: "validation.borrowerNeeded", path: ["borrowerName"] });
export type CheckoutInput = z.output<typeof checkoutSchema>;

export const returnSchema = z
  .object({
    note: optionalText(500),
    /** Where the stamp is put back; by default it goes back to its recorded location. */
    locationId: z.uuid("validation.locationUnknown").nullable().optional(),
    impressions: z.number("validation.impressions").int("validation.impressions").min(0, "validation.impressions").max(1_000_000, "validation.impressions").optional(),
  })
  .strict();
export type ReturnInput = z.output<typeof returnSchema>;

export const damageReportSchema = z
  .object({
    kind: z.enum(damageKinds, "validation.invalidOption"),
    note: optionalText(1000),
  })
  .strict()
  .refine((v) => v.kind !== "other" || !!v.note, { message: "validation.required", path: ["note"] });
export type DamageReportInput = z.output<typeof damageReportSchema>;

export const conditionChangeSchema = z
  .object({
    condition: z.enum(stampConditions, "validation.invalidOption"),
    note: optionalText(1000),
  })
  .strict();
export type ConditionChangeInput = z.output<typeof conditionChangeSchema>;

export const deleteStampSchema = z.object({ version: z.coerce.number().int().positive().optional() });

/** GET /api/v1/checkouts: `?overdue=true` lists only check-outs past their due date. */
export const checkoutListQuerySchema = z.object({ overdue: boolParam.optional() });

/** POST /api/v1/stamps/import: `?dryRun=true` only checks the file. */
export const importQuerySchema = z.object({ dryRun: boolParam.optional() });

// --- stock-take -----------------------------------------------------------------------------

export const startStockTakeSchema = z.object({ site: requiredText(80) }).strict();
export const sightingSchema = z
  .object({
    /** A typed code or the text of a scanned label (the stamp's address). */
    code: z.string("validation.scanCode").trim().min(1, "validation.scanCode").max(300, "validation.tooLong"),
    locationId: z.uuid("validation.locationUnknown"),
  })
  .strict();

export const stockTakeIdParamSchema = idParamSchema;
export const sightingParamSchema = stockTakeIdParamSchema.extend({ code: stampCodeSchema });
