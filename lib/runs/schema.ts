import { z } from "@/lib/zod";
import { keyed } from "./errors";
import { NOTE_MAX_CHARS, POT_MAX_G, PROGRESS_MAX_IMPRESSIONS, PROGRESS_MAX_METRES, PROGRESS_MAX_PIECES, READING_MAX_C, READING_MIN_C, STAGE_STAMPS_MAX, FINDING_MAX_COUNT } from "./limits";

// The run domain's own input schemas; lib/validation/runs.ts extends them for the API and the forms.

export const stageKinds = ["wax", "dye", "bleach", "boil_off"] as const;
export const waxMethods = ["stamp", "screen"] as const;
export const dyeMethods = ["bath", "brush"] as const;
export const faces = ["front", "back", "both"] as const;
export const runStates = ["setup", "underway", "complete", "halted"] as const;
export const stageStates = ["planned", "underway", "done"] as const;
export const findingKinds = ["seeped", "thin", "cracked", "pooled", "smudged"] as const;
export const repairs = ["none", "lifted", "filled"] as const;

export type StageKind = (typeof stageKinds)[number];
export type WaxMethod = (typeof waxMethods)[number];
export type DyeMethod = (typeof dyeMethods)[number];
export type Face = (typeof faces)[number];
export type RunState = (typeof runStates)[number];
export type StageState = (typeof stageStates)[number];
export type FindingKind = (typeof findingKinds)[number];
export type Repair = (typeof repairs)[number];

const isoDate = z.string(keyed).regex(/^\d{4}-\d{2}-\d{2}$/, { error: "validation.date" });
const note = z.string(keyed).trim().max(NOTE_MAX_CHARS, keyed);
const id = z.string(keyed).trim().min(1, keyed).max(80, keyed);
const stampCode = z.string(keyed).trim().min(1, keyed).max(40, keyed);
const grams = z.number(keyed).min(0, keyed).max(POT_MAX_G, keyed);

/**
 * One stage as people edit it. A waxing stage names its method and (when known) its plan, recipe, faces and
 * stamps — a stage may wait for its plan or recipe, which recording its wax then asks for; only a waxing names
 * them. A dye stage names its method. Dates in order.
 */
export const stageInputSchema = z
  .object(
    {
      kind: z.enum(stageKinds, keyed),
      colourPosition: z.number(keyed).int(keyed).min(0, keyed).max(40, keyed).nullable().optional(),
      colourName: z.string(keyed).trim().max(80, keyed).nullable().optional(),
      swatch: z.string(keyed).regex(/^#[0-9a-f]{6}$/, { error: "validation.swatch" }).nullable().optional(),
      plannedStartOn: isoDate.nullable().optional(),
      plannedEndOn: isoDate.nullable().optional(),
      waxMethod: z.enum(waxMethods, keyed).nullable().optional(),
      planId: id.nullable().optional(),
      recipeId: id.nullable().optional(),
      faces: z.enum(faces, keyed).nullable().optional(),
      passes: z.number(keyed).int(keyed).min(1, keyed).max(10, keyed).optional(),
      stamps: z.array(z.object({ code: stampCode, face: z.enum(faces, keyed).default("front") }, keyed), keyed).max(STAGE_STAMPS_MAX, keyed).optional(),
      dyeMethod: z.enum(dyeMethods, keyed).nullable().optional(),
      notes: note.nullable().optional(),
    },
    keyed,
  )
  .superRefine((s, ctx) => {
    if (s.kind === "wax") {
      if (!s.waxMethod) ctx.addIssue({ code: "custom", path: ["waxMethod"], message: "validation.required" });
    } else {
      for (const field of ["waxMethod", "planId", "recipeId", "faces"] as const) {
        if (s[field]) ctx.addIssue({ code: "custom", path: [field], message: "runs.onlyWaxing" });
      }
      if (s.stamps?.length) ctx.addIssue({ code: "custom", path: ["stamps"], message: "runs.onlyWaxing" });
    }
    if (s.kind === "dye" && !s.dyeMethod) ctx.addIssue({ code: "custom", path: ["dyeMethod"], message: "validation.required" });
    if (s.kind !== "dye" && s.dyeMethod) ctx.addIssue({ code: "custom", path: ["dyeMethod"], message: "runs.onlyDyeing" });
    if (s.plannedStartOn && s.plannedEndOn && s.plannedStartOn > s.plannedEndOn) {
      ctx.addIssue({ code: "custom", path: ["plannedEndOn"], message: "runs.datesOrder" });
    }
  });

export type StageInput = z.input<typeof stageInputSchema>;
export type StageSpec = z.output<typeof stageInputSchema>;

/**
 * A day's work at a stage. A waxing gives the wax used (grams, or the pot before and after); the boil-off the wax
 * recovered. Which fields a stage's kind takes is checked by `checkProgressForKind`.
 */
export const progressInputSchema = z
  .object(
    {
      doneOn: isoDate,
      metres: z.number(keyed).min(0, keyed).max(PROGRESS_MAX_METRES, keyed).optional(),
      pieces: z.number(keyed).int(keyed).min(0, keyed).max(PROGRESS_MAX_PIECES, keyed).optional(),
      impressions: z.number(keyed).int(keyed).min(0, keyed).max(PROGRESS_MAX_IMPRESSIONS, keyed).optional(),
      gramsUsed: grams.optional(),
      potBeforeG: grams.optional(),
      potAfterG: grams.optional(),
      potAddedG: grams.optional(),
      recoveredG: grams.optional(),
      /** Marks the stage done with this record. */
      finished: z.boolean(keyed).optional(),
      note: note.optional(),
    },
    keyed,
  )
  .superRefine((p, ctx) => {
    if (p.metres === undefined && p.pieces === undefined && p.recoveredG === undefined) {
      ctx.addIssue({ code: "custom", path: ["metres"], message: "runs.progressNeedsAmount" });
    }
    const weighed = p.potBeforeG !== undefined || p.potAfterG !== undefined;
    if (p.gramsUsed !== undefined && weighed) ctx.addIssue({ code: "custom", path: ["gramsUsed"], message: "wax.gramsOrPot" });
    if (weighed) {
      if (p.potBeforeG === undefined) ctx.addIssue({ code: "custom", path: ["potBeforeG"], message: "validation.required" });
      if (p.potAfterG === undefined) ctx.addIssue({ code: "custom", path: ["potAfterG"], message: "validation.required" });
      if (p.potBeforeG !== undefined && p.potAfterG !== undefined && p.potAfterG > p.potBeforeG + (p.potAddedG ?? 0)) {
        ctx.addIssue({ code: "custom", path: ["potAfterG"], message: "wax.potGained", params: { beforeG: p.potBeforeG } });
      }
    }
  });

export type ProgressInput = z.input<typeof progressInputSchema>;
export type ProgressSpec = z.output<typeof progressInputSchema>;

/** The wax used by a progress record, g: as weighed, or pot before + added − after; null when not given. */
export function progressGrams(p: { gramsUsed?: number; potBeforeG?: number; potAfterG?: number; potAddedG?: number }): number | null {
  if (p.gramsUsed !== undefined) return p.gramsUsed;
  if (p.potBeforeG !== undefined && p.potAfterG !== undefined) return p.potBeforeG + (p.potAddedG ?? 0) - p.potAfterG;
  return null;
}

/**
 * What a stage's kind allows of a progress record: wax used and impressions only on a waxing (which must say
 * its wax and metres), the wax recovered only at the boil-off. Answers the issues (field, catalogue key).
 */
export function progressIssuesForKind(kind: StageKind, p: ProgressSpec): { field: string; code: string }[] {
  const issues: { field: string; code: string }[] = [];
  const waxFields = ["gramsUsed", "potBeforeG", "potAfterG", "potAddedG", "impressions"] as const;
  if (kind === "wax") {
    if (progressGrams(p) === null) issues.push({ field: "gramsUsed", code: "validation.required" });
    if (!(p.metres !== undefined && p.metres > 0)) issues.push({ field: "metres", code: "runs.waxingNeedsMetres" });
  } else {
    for (const f of waxFields) if (p[f] !== undefined) issues.push({ field: f, code: "runs.onlyWaxing" });
  }
  if (kind !== "boil_off" && p.recoveredG !== undefined) issues.push({ field: "recoveredG", code: "runs.onlyBoilOff" });
  return issues;
}

/** A pot temperature reading. */
export const readingInputSchema = z.object(
  {
    tempC: z.number(keyed).min(READING_MIN_C, keyed).max(READING_MAX_C, keyed),
    at: z.iso.datetime({ offset: true, error: "validation.date" }).optional(),
    note: note.optional(),
  },
  keyed,
);
export type ReadingInput = z.input<typeof readingInputSchema>;

/** A quality finding: kind, where, how many, the stamp it came from, a photo's object key, the repair. */
export const findingInputSchema = z.object(
  {
    foundOn: isoDate,
    kind: z.enum(findingKinds, keyed),
    stageId: id.optional(),
    location: z.string(keyed).trim().max(200, keyed).optional(),
    count: z.number(keyed).int(keyed).min(1, keyed).max(FINDING_MAX_COUNT, keyed).default(1),
    stampCode: stampCode.optional(),
    photoKey: z.string(keyed).trim().max(300, keyed).optional(),
    repair: z.enum(repairs, keyed).default("none"),
    repairNote: note.optional(),
  },
  keyed,
);
export type FindingInput = z.input<typeof findingInputSchema>;
export type FindingSpec = z.output<typeof findingInputSchema>;
