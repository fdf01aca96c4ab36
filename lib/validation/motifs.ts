import { z } from "@/lib/zod";
import { idParamSchema, isoDate, optionalText, requiredText } from "./common";
import { stampCodeSchema } from "./stamps";

// Inputs of the motif archive: motifs (with their stamp set and colourways), collections, the list query.

export const motifStampRoles = ["main", "filler", "border", "corner", "reverse_twin"] as const;
export const clothFaces = ["front", "back", "both"] as const;
export const motifAvailabilities = ["onShelf", "out", "inRepair", "retired"] as const;
export const motifSortKeys = ["lastUsed", "name", "updated"] as const;

const tag = z.string().trim().toLowerCase().min(1, "validation.required").max(40, "validation.tooLong");
const tags = z
  .array(tag, "validation.invalidOption")
  .max(30, "validation.tooMany")
  .transform((list) => [...new Set(list)]);

const stampLink = z.object({ code: stampCodeSchema, role: z.enum(motifStampRoles, "validation.invalidOption") }).strict();

const colour = z
  .object({
    name: requiredText(80),
    swatch: z
      .string("validation.required")
      .trim()
      .toLowerCase()
      .regex(/^#[0-9a-f]{6}$/, "validation.swatch"),
    dyeNotes: optionalText(500),
    /** Codes of stamps of the motif's set that wax over this colour. */
    waxStamps: z.array(stampCodeSchema).max(20, "validation.tooMany").default([]),
    face: z.enum(clothFaces, "validation.invalidOption").default("front"),
    /** Reached by bleaching, not by a dye: a run's default stages bleach for it. */
    bleach: z.boolean("validation.invalidOption").default(false),
  })
  .strict();

const colourway = z
  .object({
    name: requiredText(80),
    notes: optionalText(1000),
    colours: z.array(colour).min(1, "validation.colourwayNeedsColour").max(12, "validation.tooMany"),
  })
  .strict();

const motifShape = {
  name: requiredText(120),
  description: optionalText(2000),
  tags: tags.default([]),
  designer: optionalText(120),
  firstUsedOn: isoDate.nullable().optional(),
  notes: optionalText(4000),
  collectionIds: z.array(z.uuid("validation.notFound")).max(20, "validation.tooMany").default([]),
  stamps: z.array(stampLink).max(40, "validation.tooMany").default([]),
  colourways: z.array(colourway).max(12, "validation.tooMany").default([]),
};

function checkSet(value: { stamps?: { code: string; role: string }[]; colourways?: { colours: { waxStamps: string[] }[] }[] }, ctx: z.RefinementCtx) {
  const codes = new Set<string>();
  let mains = 0;
  for (const [i, s] of (value.stamps ?? []).entries()) {
    if (codes.has(s.code)) ctx.addIssue({ code: "custom", path: ["stamps", i, "code"], message: "validation.motifStampTwice" });
    codes.add(s.code);
    if (s.role === "main") mains++;
  }
  if (mains > 1) ctx.addIssue({ code: "custom", path: ["stamps"], message: "validation.motifOneMain" });
  if (value.stamps !== undefined && value.colourways !== undefined) {
    value.colourways.forEach((cw, i) =>
      cw.colours.forEach((c, j) =>
        c.waxStamps.forEach((code, k) => {
          if (!codes.has(code)) ctx.addIssue({ code: "custom", path: ["colourways", i, "colours", j, "waxStamps", k], message: "validation.colourStampNotInSet" });
        }),
      ),
    );
  }
}

export const createMotifSchema = z.object(motifShape).strict().superRefine(checkSet);

/** A PATCH changes only what it names; `version` is the one the edit started from. */
export const updateMotifSchema = z
  .object({
    name: motifShape.name.optional(),
    description: motifShape.description,
    tags: tags.optional(),
    designer: motifShape.designer,
    firstUsedOn: motifShape.firstUsedOn,
    notes: motifShape.notes,
    collectionIds: z.array(z.uuid("validation.notFound")).max(20, "validation.tooMany").optional(),
    stamps: z.array(stampLink).max(40, "validation.tooMany").optional(),
    colourways: z.array(colourway).max(12, "validation.tooMany").optional(),
    version: z.number("validation.number").int("validation.wholeNumber").min(1, "validation.number"),
  })
  .strict()
  .superRefine(checkSet);

export const copyMotifSchema = z.object({ name: requiredText(120) }).strict();

const list = (values: readonly string[]) =>
  z
    .string()
    .transform((v) => v.split(",").map((s) => s.trim()).filter(Boolean))
    .pipe(z.array(z.enum(values as [string, ...string[]], "validation.invalidOption")));

export const motifListQuerySchema = z
  .object({
    q: z.string().trim().max(120, "validation.tooLong").optional(),
    tag: z.string().trim().toLowerCase().max(40, "validation.tooLong").optional(),
    designer: z.string().trim().max(120, "validation.tooLong").optional(),
    collection: z.uuid("validation.notFound").optional(),
    availability: list(motifAvailabilities).optional(),
    minWidthMm: z.coerce.number("validation.number").min(0, "validation.number").optional(),
    maxWidthMm: z.coerce.number("validation.number").min(0, "validation.number").optional(),
    arrangement: z.string().trim().max(40, "validation.tooLong").optional(),
    sort: z.enum(motifSortKeys, "validation.invalidOption").default("lastUsed"),
    page: z.coerce.number("validation.number").int("validation.wholeNumber").min(1, "validation.number").default(1),
    pageSize: z.coerce.number("validation.number").int("validation.wholeNumber").min(1, "validation.number").max(200, "validation.tooBig").default(24),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.minWidthMm !== undefined && v.maxWidthMm !== undefined && v.minWidthMm > v.maxWidthMm) ctx.addIssue({ code: "custom", path: ["minWidthMm"], message: "validation.rangeOrder" });
  });

export const collectionSchema = z
  .object({
    name: requiredText(120),
    season: optionalText(80),
    year: z.number("validation.number").int("validation.wholeNumber").min(1800, "validation.invalid").max(2200, "validation.invalid").nullable().optional(),
    description: optionalText(2000),
  })
  .strict();
export const updateCollectionSchema = collectionSchema.partial().extend({ version: z.number("validation.number").int("validation.wholeNumber").min(1, "validation.number") }).strict();

export const motifIdParamSchema = idParamSchema;
export const deleteQuerySchema = z.object({ version: z.coerce.number("validation.number").int("validation.wholeNumber").optional() }).strict();

export type CreateMotifInput = z.infer<typeof createMotifSchema>;
export type UpdateMotifInput = z.infer<typeof updateMotifSchema>;
export type MotifListQuery = z.infer<typeof motifListQuerySchema>;
export type CollectionInput = z.infer<typeof collectionSchema>;
export type UpdateCollectionInput = z.infer<typeof updateCollectionSchema>;
