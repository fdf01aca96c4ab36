// Production runs' contract with their clients: the shapes the run routes answer with, the URLs of those routes
// and pages, and the form-input adapters. Neither server-only nor React: server code, client components, SWR
// hooks and tests import it (never lib/data). Labels: `runs.state.<state>`, `runs.stageKind.<kind>`,
// `runs.findingKind.<kind>`, `runs.repair.<repair>`, `runs.waxMethod.<m>`, `runs.dyeMethod.<m>`,
// `runs.stageState.<s>` and `runs.readingWarning.<w>` in lib/i18n/messages/<locale>/runs.json.
// i18n-keys: runs.state.*, runs.stageState.*, runs.stageKind.*, runs.waxMethod.*, runs.dyeMethod.*, runs.findingKind.*, runs.repair.*, runs.readingWarning.*
import type { DyeMethod, Face, FindingKind, ReadingWarning, Repair, RunState, StageKind, StageState, WaxMethod } from "@/lib/runs";
import type { CreateRunInput, RecordFindingInput, RecordProgressInput, RecordReadingInput, UpdateRunInput } from "@/lib/validation/runs";
import { formNumber, formOptional, formText } from "./form-input";

export type { DyeMethod, Face, FindingKind, ReadingWarning, Repair, RunState, StageKind, StageState, WaxMethod } from "@/lib/runs";
export { findingKinds, repairs, runStates, stageKinds, FLAG_FINDINGS, FLAG_WINDOW_DAYS, READING_FUME_ABOVE_C } from "@/lib/runs";
export type { CreateRunInput, RecordFindingInput, RecordProgressInput, RecordReadingInput, UpdateRunInput } from "@/lib/validation/runs";

/** Wax totals, kg: estimated over the stages, used at the waxings, recovered at the boil-off. */
export interface RunWaxTotals {
  kgEstimated: number;
  kgUsed: number;
  kgRecovered: number;
}

/** A run's totals: the sums of its stages. */
export interface RunTotalsDto {
  wax: RunWaxTotals;
  /** Stamper hours estimated (impressions ÷ the workshop's impressions per hour). */
  hours: number;
  impressions: { estimated: number; done: number };
}

/** A run's size: metres, or pieces of a length; `totalMetres` either way. */
export interface RunSizeDto {
  metres: number | null;
  pieces: number | null;
  pieceLengthMm: number | null;
  totalMetres: number;
}

/** One row of GET /api/v1/runs. */
export interface RunSummaryDto {
  id: string;
  name: string;
  motif: { id: string; name: string };
  colourway: { id: string; name: string };
  cloth: string;
  size: RunSizeDto;
  /** YYYY-MM-DD, the workshop's calendar day. */
  dueOn: string | null;
  state: RunState;
  /** The first stage not done (in work at stage N: `position + 1`), null when all are done. */
  currentStage: { id: string; position: number; kind: StageKind } | null;
  stageCount: number;
  /** True when a waxing stage by stamps has no plan yet ("waiting for a plan"). */
  waitingForPlan: boolean;
  totals: RunTotalsDto;
  version: number;
  updatedAt: string;
}

export interface RunListDto {
  runs: RunSummaryDto[];
  total: number;
  page: number;
  pageSize: number;
}

/** Why a stamp is not free on a stage's planned days: its condition, out (due back `untilOn`), or asked for by someone else. */
export interface RunStageStampBusyDto {
  reason: "condition" | "out" | "requested";
  condition: string | null;
  fromOn: string | null;
  untilOn: string | null;
  who: string | null;
}

/** A stamp request a stage sent to the keepers. */
export interface RunStageStampRequestDto {
  id: string;
  state: "open" | "accepted" | "checked_out" | "declined";
  fromOn: string;
  untilOn: string;
  codes: string[];
}

/** A stamp a waxing stage needs, whether it is free now (not out, not in repair, not retired) and on the stage's days. */
export interface RunStageStampDto {
  id: string;
  code: string;
  name: string;
  face: Face;
  available: boolean;
  /** Free on the stage's planned days (today when it has none): see `busy` for what stands in the way. */
  freeOnDays: boolean;
  busy: RunStageStampBusyDto[];
  /** Flagged by the quality findings rule (3 of one kind within 30 days). */
  flagged: boolean;
}

export interface RunProgressDto {
  id: string;
  doneOn: string;
  metres: number | null;
  pieces: number | null;
  impressions: number | null;
  potBeforeG: number | null;
  potAfterG: number | null;
  potAddedG: number | null;
  waxUsedG: number | null;
  recoveredG: number | null;
  /** The wax room's wax use this waxing wrote (its calibration point, stock movements and impressions). */
  waxUseId: string | null;
  note: string | null;
  recordedByName: string;
  recordedAt: string;
}

export interface RunReadingDto {
  id: string;
  stageId: string;
  at: string;
  tempC: number;
  /** The cautions this reading calls for at once (show the fume and fire cautions when not empty). */
  warnings: ReadingWarning[];
  note: string | null;
  recordedByName: string;
}

export interface RunFindingDto {
  id: string;
  stageId: string | null;
  foundOn: string;
  kind: FindingKind;
  location: string | null;
  count: number;
  stamp: { id: string | null; code: string } | null;
  photoKey: string | null;
  repair: Repair;
  repairNote: string | null;
  recordedByName: string;
  recordedAt: string;
}

/** One stage with its plan, recipe, stamps, estimates, what was done and its records. */
export interface RunStageDto {
  id: string;
  position: number;
  kind: StageKind;
  state: StageState;
  colourPosition: number | null;
  colourName: string | null;
  swatch: string | null;
  plannedStartOn: string | null;
  plannedEndOn: string | null;
  waxMethod: WaxMethod | null;
  plan: { id: string; name: string } | null;
  recipe: { id: string; name: string; workingMinC: number; workingMaxC: number } | null;
  faces: Face | null;
  passes: number;
  dyeMethod: DyeMethod | null;
  notes: string | null;
  stamps: RunStageStampDto[];
  /** The stamp requests this stage sent to the keepers, newest first. */
  stampRequests: RunStageStampRequestDto[];
  /** As estimated when the stage was last saved: wax (gross, kg; by material id), impressions, stamper hours. */
  estimate: { kg: number; impressions: number; hours: number; gramsPerMetre: number | null; rateGPerM2: number | null; byMaterial: { material: string; kg: number }[] };
  done: { metres: number; pieces: number; impressions: number; waxUsedG: number; recoveredG: number };
  progress: RunProgressDto[];
  readings: RunReadingDto[];
}

export interface RunHistoryEntryDto {
  kind: "created" | "edited" | "state" | "progress" | "reading" | "finding";
  actorName: string;
  at: string;
  version: number;
  changes: { field: string; from: unknown; to: unknown }[];
}

/** One run as GET /api/v1/runs/{id} answers it (`{ run }`). */
export interface RunDto extends RunSummaryDto {
  plans: { id: string; name: string }[];
  notes: string | null;
  stateNote: string | null;
  stages: RunStageDto[];
  findings: RunFindingDto[];
  history: RunHistoryEntryDto[];
  createdByName: string;
  createdAt: string;
  updatedByName: string;
}

/** A stamp flagged by the findings rule, for the keepers (GET /api/v1/runs/flagged-stamps). */
export interface FlaggedStampDto {
  stamp: { id: string; code: string; name: string };
  kind: FindingKind;
  findings: number;
  firstOn: string;
  lastOn: string;
}

/** What recording a reading answers: the reading with its cautions. */
export interface RecordedReadingDto {
  reading: RunReadingDto;
}

const q = (params: Record<string, string | number | undefined>) => {
  const s = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== "") s.set(k, String(v));
  const text = s.toString();
  return text ? `?${text}` : "";
};

/** The run routes of the JSON API. */
export const runUrls = {
  list: (query: { q?: string; state?: RunState[]; motif?: string; sort?: string; page?: number; pageSize?: number } = {}) =>
    `/api/v1/runs${q({ ...query, state: query.state?.join(",") })}`,
  one: (id: string) => `/api/v1/runs/${encodeURIComponent(id)}`,
  progress: (id: string, stageId: string) => `/api/v1/runs/${encodeURIComponent(id)}/stages/${encodeURIComponent(stageId)}/progress`,
  readings: (id: string, stageId: string) => `/api/v1/runs/${encodeURIComponent(id)}/stages/${encodeURIComponent(stageId)}/readings`,
  findings: (id: string) => `/api/v1/runs/${encodeURIComponent(id)}/findings`,
  /** POST: ask the keepers for the stamps of a waxing stage, for its planned days. */
  stageStampRequest: (id: string, stageId: string) => `/api/v1/runs/${encodeURIComponent(id)}/stages/${encodeURIComponent(stageId)}/stamp-request`,
  /** A finding's photo (PUT the image as the body; GET it, or `thumb`). */
  findingPhoto: (id: string, findingId: string, variant: "original" | "thumb" = "original") =>
    `/api/v1/runs/${encodeURIComponent(id)}/findings/${encodeURIComponent(findingId)}/photo${variant === "thumb" ? "?variant=thumb" : ""}`,
  flaggedStamps: () => "/api/v1/runs/flagged-stamps",
};

/** The run pages (built by the screens; the addresses are fixed here so links can be made now). */
export const runPages = {
  list: () => "/runs",
  new: (from: { motif?: string; colourway?: string; plan?: string } = {}) => `/runs/new${q(from)}`,
  one: (id: string) => `/runs/${encodeURIComponent(id)}`,
  ticket: (id: string) => `/runs/${encodeURIComponent(id)}/ticket`,
};

/** The "in work at stage N" number people read: position + 1. */
export const stageNumber = (stage: { position: number }) => stage.position + 1;

// Form-input adapters: form fields → the API's input, numbers in the person's writing (formNumber).

const num = (form: FormData, name: string, locale: string) => formNumber(form, name, locale) ?? undefined;

/** The new-run form: name, motif, colourway, cloth, metres or pieces + piece length (cm on the form → mm), due date, plan, recipe. */
export function runFormInput(form: FormData, locale: string): Partial<Record<keyof CreateRunInput, unknown>> {
  const pieceLengthCm = num(form, "pieceLengthCm", locale);
  const plan = formOptional(form, "planId");
  return {
    name: formText(form, "name"),
    motifId: formText(form, "motifId"),
    colourwayId: formText(form, "colourwayId"),
    cloth: formText(form, "cloth"),
    metres: num(form, "metres", locale),
    pieces: num(form, "pieces", locale),
    pieceLengthMm: pieceLengthCm === undefined ? undefined : pieceLengthCm * 10,
    dueOn: formOptional(form, "dueOn") ?? null,
    startOn: formOptional(form, "startOn") ?? null,
    planIds: plan ? [plan] : undefined,
    recipeId: formOptional(form, "recipeId"),
    notes: formOptional(form, "notes"),
  };
}

/** A waxing's or other stage's progress form: the day, metres, pieces, impressions, pot before/after/added in g, recovered g, done. */
export function progressFormInput(form: FormData, locale: string): Partial<Record<keyof RecordProgressInput, unknown>> {
  return {
    doneOn: formText(form, "doneOn"),
    metres: num(form, "metres", locale),
    pieces: num(form, "pieces", locale),
    impressions: num(form, "impressions", locale),
    gramsUsed: num(form, "gramsUsed", locale),
    potBeforeG: num(form, "potBeforeG", locale),
    potAfterG: num(form, "potAfterG", locale),
    potAddedG: num(form, "potAddedG", locale),
    recoveredG: num(form, "recoveredG", locale),
    finished: form.get("finished") === "on" ? true : undefined,
    note: formOptional(form, "note"),
  };
}

/** A pot reading form: °C (°F converted by the caller's unit system: `tempF`). */
export function readingFormInput(form: FormData, locale: string): Partial<Record<keyof RecordReadingInput, unknown>> {
  const f = num(form, "tempF", locale);
  return { tempC: f !== undefined ? ((f - 32) * 5) / 9 : num(form, "tempC", locale), note: formOptional(form, "note") };
}

/** A finding form: day, kind, stage, where, how many, stamp code, repair and its note. */
export function findingFormInput(form: FormData, locale: string): Partial<Record<keyof RecordFindingInput, unknown>> {
  return {
    foundOn: formText(form, "foundOn"),
    kind: formText(form, "kind"),
    stageId: formOptional(form, "stageId"),
    location: formOptional(form, "location"),
    count: num(form, "count", locale),
    stampCode: formOptional(form, "stampCode")?.toUpperCase(),
    repair: formOptional(form, "repair"),
    repairNote: formOptional(form, "repairNote"),
  };
}

/** A stage as the update's `stages` list takes it back: what the stage holds now, kept by its id. */
export function stageInputOf(s: RunStageDto) {
  return {
    id: s.id,
    kind: s.kind,
    colourPosition: s.colourPosition,
    colourName: s.colourName,
    swatch: s.swatch,
    plannedStartOn: s.plannedStartOn,
    plannedEndOn: s.plannedEndOn,
    waxMethod: s.kind === "wax" ? s.waxMethod : null,
    planId: s.kind === "wax" ? (s.plan?.id ?? null) : null,
    recipeId: s.kind === "wax" ? (s.recipe?.id ?? null) : null,
    faces: s.kind === "wax" ? s.faces : null,
    passes: s.passes,
    stamps: s.kind === "wax" ? s.stamps.map((x) => ({ code: x.code, face: x.face })) : [],
    dyeMethod: s.kind === "dye" ? s.dyeMethod : null,
    notes: s.notes,
  };
}

/**
 * The stage edit form → the update's whole stage list: the stage edited from the form (days, plan, recipe, faces,
 * passes, method, stamp codes one per line or comma, notes), every other stage as it is.
 */
export function stageFormInput(form: FormData, locale: string, run: Pick<RunDto, "version" | "stages">, stageId: string) {
  return {
    version: run.version,
    stages: run.stages.map((s) => {
      const kept = stageInputOf(s);
      if (s.id !== stageId) return kept;
      const edited: Record<string, unknown> = {
        ...kept,
        plannedStartOn: formOptional(form, "plannedStartOn") ?? null,
        plannedEndOn: formOptional(form, "plannedEndOn") ?? null,
        passes: num(form, "passes", locale),
        notes: formOptional(form, "notes") ?? null,
      };
      if (s.kind === "wax") {
        const face = formText(form, "faces") || kept.faces || "front";
        edited.waxMethod = formText(form, "waxMethod") || kept.waxMethod;
        edited.planId = formOptional(form, "planId") ?? null;
        edited.recipeId = formOptional(form, "recipeId") ?? null;
        edited.faces = face;
        const codes = formText(form, "stampCodes")
          .split(/[\s,;]+/)
          .map((c) => c.trim().toUpperCase())
          .filter(Boolean);
        const faceOf = new Map(s.stamps.map((x) => [x.code, x.face]));
        edited.stamps = [...new Set(codes)].map((code) => ({ code, face: faceOf.get(code) ?? (face === "both" ? "both" : face) }));
      }
      if (s.kind === "dye") edited.dyeMethod = formText(form, "dyeMethod") || kept.dyeMethod;
      return edited;
    }),
  };
}

/** The edit form's top fields (the stage list is edited as JSON-able rows by the screen and sent as `stages`). */
export type RunEditFields = Omit<UpdateRunInput, "stages">;
