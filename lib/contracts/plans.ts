// The cloth plans' contract with their clients: the shapes the plan routes answer with, the URLs of those routes
// and pages, and the planner form's adapter. Neither server-only nor React: server code, client components, SWR
// hooks and tests import it (never lib/data). The wax room reads a plan's `summary`; the motif archive links to
// `planPages.new({ stamp, borderStamp, arrangement, motif })`.
import type { StampCondition, StampFace } from "@/db/schema";
import type { Arrangement, PathName, StampSize } from "@/lib/layout";
import type { PlanSummary, StaleReason } from "@/lib/plans";
import { inchesToMm, yardsToMm } from "@/lib/units";
import type { BorderRequest, StampRef } from "@/lib/validation/layout";
import type { PlanLayout } from "@/lib/validation/plans";
import { formChecked, formNumber, formOptional, formText, numberInput, readNumber } from "./form-input";
import type { LocationRef } from "./stamps";

export type { PlanSummary, StaleReason } from "@/lib/plans";
export type { PlanLayout } from "@/lib/validation/plans";
export type { BorderRequest, StampRef } from "@/lib/validation/layout";

/** A library stamp as a plan shows it: what it is, where it lives, whether it is out, and its picture. */
export interface PlanStampDto {
  /** "field" or "border:<index>". */
  role: string;
  code: string;
  name: string;
  widthMm: number;
  heightMm: number;
  condition: StampCondition;
  location: LocationRef | null;
  out: boolean;
  /** The mirror twin that stamps the back face, when the stamp has one. */
  twin: { code: string; name: string } | null;
  picture: StampPicture | null;
}

/**
 * A stamp's own image for drawing impressions: its newest wax-print scan (thumbnail), placed centred on the
 * footprint at its physical size when the scan has a DPI, else stretched over the footprint.
 */
export interface StampPicture {
  href: string;
  widthMm: number;
  heightMm: number;
}

/** One plan as GET /api/v1/plans/{id} answers it (`{ plan }`). */
export interface PlanDto {
  id: string;
  name: string;
  notes: string | null;
  motifId: string | null;
  /** The layout request as saved (stamp by size or by library code). */
  layout: PlanLayout;
  /** The border layers, when the plan has any. */
  borders?: BorderRequest[];
  /** The engine's numbers for the saved inputs (no preview); totals include every layer and face. */
  summary: PlanSummary;
  /** The library stamps the plan uses, field first. */
  stamps: PlanStampDto[];
  version: number;
  /** True when a library stamp's size, outline or coverage changed after the summary was computed. */
  stale: boolean;
  staleReasons?: StaleReason[];
  computedAt: string;
  createdAt: string;
  createdByName: string;
  updatedAt: string;
  updatedByName: string;
}

/** A row of the plan table. */
export interface PlanListItem {
  id: string;
  name: string;
  stamp: { code: string; name: string; thumbUrl: string | null } | null;
  clothWidthMm: number;
  arrangement: Arrangement;
  pathName: PathName | null;
  sides: 1 | 2;
  borders: number;
  impressionsPerMetre: number;
  waxedAreaPerMetreM2: number;
  createdByName: string;
  updatedAt: string;
  version: number;
}

export interface PlanPage {
  plans: PlanListItem[];
  total: number;
  page: number;
  pageSize: number;
}

export interface PlanEventDto {
  id: string;
  kind: "created" | "edited" | "renamed" | "recomputed" | "duplicated";
  at: string;
  actorName: string;
  version: number;
  details: Record<string, unknown> | null;
}

/** A library stamp the planner may pick: GET /api/v1/plans/stamps?q= answers `{ stamps }`. */
export interface StampChoice {
  code: string;
  name: string;
  widthMm: number;
  heightMm: number;
  condition: StampCondition;
  face: StampFace;
  out: boolean;
  coverageRatio: number | null;
  hasOutline: boolean;
  thumbUrl: string | null;
}

/** One library stamp with what the planner computes and draws with: GET /api/v1/plans/stamps/{code} (`{ stamp }`). */
export interface PlannerStamp extends StampChoice {
  /** The stamp as the engine takes it (outline, else coverage, else footprint). */
  geometry: StampSize;
  picture: StampPicture | null;
  location: LocationRef | null;
  twin: { code: string; name: string } | null;
}

// --- URLs ---------------------------------------------------------------------------------------

const enc = encodeURIComponent;
const withQuery = (path: string, query: string | URLSearchParams = "") => {
  const q = String(query);
  return q ? `${path}?${q}` : path;
};

export const planUrls = {
  list: (query: string | URLSearchParams = "") => withQuery("/api/v1/plans", query),
  one: (id: string) => `/api/v1/plans/${enc(id)}`,
  remove: (id: string, version: number) => `/api/v1/plans/${enc(id)}?version=${version}`,
  duplicate: (id: string) => `/api/v1/plans/${enc(id)}/duplicate`,
  recompute: (id: string) => `/api/v1/plans/${enc(id)}/recompute`,
  history: (id: string) => `/api/v1/plans/${enc(id)}/history`,
  stamps: (q: string) => withQuery("/api/v1/plans/stamps", new URLSearchParams({ q })),
  stamp: (code: string) => `/api/v1/plans/stamps/${enc(code)}`,
  layout: () => "/api/v1/layout",
};

/** What the planner opens prefilled with (the motif archive links here). */
export interface NewPlanParams {
  stamp?: string;
  borderStamp?: string;
  arrangement?: Arrangement;
  motif?: string;
}

export const planPages = {
  list: (query: string | URLSearchParams = "") => withQuery("/plans", query),
  /** `/plans/new?stamp=<code>&borderStamp=<code>&arrangement=<arrangement>&motif=<id>` */
  new: (params: NewPlanParams = {}) => {
    const q = new URLSearchParams();
    for (const key of ["stamp", "borderStamp", "arrangement", "motif"] as const) if (params[key]) q.set(key, params[key]!);
    return withQuery("/plans/new", q);
  },
  one: (id: string) => `/plans/${enc(id)}`,
  sheet: (id: string, paper: "a4" | "letter" = "a4") => `/plans/${enc(id)}/sheet${paper === "letter" ? "?paper=letter" : ""}`,
  compare: (ids: string[]) => `/plans/compare?ids=${ids.map(enc).join(",")}`,
  request: (id: string) => `/plans/${enc(id)}/request`,
};

// --- the planner form → createPlanSchema input ---------------------------------------------------

/** How the planner's form gives the run: one length, pieces of a length, or kodi (20 pieces) of a length. */
export type RunBy = "length" | "pieces" | "kodi";

/** A typed number in the form's units → mm (undefined when blank, NaN stays NaN so the schema names the field). */
function lengthMm(form: FormData, name: string, unit: "mm" | "in" | "m" | "yd", locale: string): number | undefined {
  const v = formNumber(form, name, locale);
  if (v === null) return undefined;
  if (Number.isNaN(v)) return v;
  switch (unit) {
    case "in":
      return inchesToMm(v);
    case "m":
      return v * 1000;
    case "yd":
      return yardsToMm(v);
    default:
      return v;
  }
}

/** "1/3", or a decimal as the person's language writes it ("0.25", "0,25" in Indonesian) → a fraction; undefined when blank. */
export function fractionInput(text: string, locale: string): number | undefined {
  const t = text.trim();
  if (!t) return undefined;
  const m = /^(\d+)\s*\/\s*(\d+)$/.exec(t);
  if (m) return Number(m[2]) === 0 ? Number.NaN : Number(m[1]) / Number(m[2]);
  return readNumber(t, locale) ?? undefined;
}

/** The stamp part of the form (prefix "" for the field stamp, "border" for the border's). */
function stampInput(form: FormData, prefix: string, unit: "mm" | "in", locale: string): StampRef | Record<string, unknown> {
  const field = (name: string) => (prefix ? `${prefix}${name[0].toUpperCase()}${name.slice(1)}` : name);
  if (formText(form, field("stampMode")) !== "free") return { code: formText(form, field("stampCode")).trim() };
  const pct = formNumber(form, field("coveragePct"), locale);
  return {
    widthMm: lengthMm(form, field("stampWidth"), unit, locale),
    heightMm: lengthMm(form, field("stampHeight"), unit, locale),
    ...(pct === null ? {} : { coverage: Number.isNaN(pct) ? pct : pct / 100 }),
  };
}

/**
 * The planner's form in the person's units → `{ name, notes, motifId, layout, borders }` for createPlanSchema
 * (and, without name and notes, the live layout). Lengths across in mm or in (`unit`), the run in m or yd
 * (`runUnit`), coverage in %.
 */
export function planFormInput(form: FormData, locale: string) {
  const unit = formText(form, "unit") === "in" ? "in" : "mm";
  const runUnit = formText(form, "runUnit") === "yd" ? "yd" : "m";
  const runBy = (formText(form, "runBy") || "length") as RunBy;
  const count = formNumber(form, runBy === "kodi" ? "kodi" : "pieces", locale);
  const cloth: Record<string, unknown> = {
    widthMm: lengthMm(form, "clothWidth", unit, locale),
    margins: { leftMm: lengthMm(form, "marginLeft", unit, locale) ?? 0, rightMm: lengthMm(form, "marginRight", unit, locale) ?? 0 },
  };
  if (runBy === "length") cloth.lengthMm = lengthMm(form, "runLength", runUnit, locale);
  else {
    cloth.pieces = count === null ? undefined : runBy === "kodi" && !Number.isNaN(count) ? count * 20 : count;
    cloth.pieceLengthMm = lengthMm(form, "pieceLength", runUnit, locale);
  }
  const arrangement = formText(form, "arrangement");
  const layout: Record<string, unknown> = {
    cloth,
    stamp: stampInput(form, "", unit, locale),
    gap: { xMm: lengthMm(form, "gapX", unit, locale) ?? 0, yMm: lengthMm(form, "gapY", unit, locale) ?? 0 },
    arrangement,
    align: formOptional(form, "align"),
    edges: formOptional(form, "edges"),
    sides: formText(form, "sides") === "2" ? 2 : 1,
  };
  if (arrangement === "diagonal") layout.diagonalStep = fractionInput(formText(form, "diagonalStep"), locale);
  if (arrangement === "rotation") layout.rotationOrder = Number(formText(form, "rotationOrder") || 4);

  const side = formText(form, "borderSide");
  const borders =
    side === "left" || side === "right" || side === "both"
      ? [
          {
            side,
            stamp: stampInput(form, "border", unit, locale),
            turn: Number(formText(form, "borderTurn") || 0),
            mirror: formChecked(form, "borderMirror"),
            ...(side === "both" ? { rightCopy: formOptional(form, "borderRightCopy") ?? "mirror" } : {}),
            gapYMm: lengthMm(form, "borderGapY", unit, locale) ?? 0,
            gapToFieldMm: lengthMm(form, "borderGapToField", unit, locale) ?? 0,
            offsetMm: lengthMm(form, "borderOffset", unit, locale) ?? 0,
            startMm: lengthMm(form, "borderStart", unit, locale) ?? 0,
          },
        ]
      : [];
  return {
    name: formText(form, "name"),
    notes: formText(form, "notes"),
    motifId: formOptional(form, "motifId") ?? null,
    layout,
    borders,
  };
}

/**
 * Which form field shows the message for a path of the plan input ("layout.cloth.widthMm", "borders.0.gapYMm"),
 * so a refusal from the schema, the engine or the server stands beside what the person typed.
 */
export const planFieldOfPath: Record<string, string> = {
  name: "name",
  notes: "notes",
  "layout.cloth.widthMm": "clothWidth",
  "layout.cloth.lengthMm": "runLength",
  "layout.cloth.pieces": "pieces",
  "layout.cloth.pieceLengthMm": "pieceLength",
  "layout.cloth.margins.leftMm": "marginLeft",
  "layout.cloth.margins.rightMm": "marginRight",
  "layout.cloth.margins": "marginRight",
  "layout.stamp.code": "stampCode",
  "layout.stamp.widthMm": "stampWidth",
  "layout.stamp.heightMm": "stampHeight",
  "layout.stamp.coverage": "coveragePct",
  "layout.stamp.outline": "stampCode",
  "layout.gap.xMm": "gapX",
  "layout.gap.yMm": "gapY",
  "layout.diagonalStep": "diagonalStep",
  "layout.rotationOrder": "rotationOrder",
  "layout.arrangement": "arrangement",
  "layout.window.startMm": "runLength",
  borders: "borderSide",
  "borders.0.side": "borderSide",
  "borders.0.stamp.code": "borderStampCode",
  "borders.0.stamp.widthMm": "borderStampWidth",
  "borders.0.stamp.heightMm": "borderStampHeight",
  "borders.0.stamp.coverage": "borderCoveragePct",
  "borders.0.stamp.outline": "borderStampCode",
  "borders.0.turn": "borderTurn",
  "borders.0.gapYMm": "borderGapY",
  "borders.0.gapToFieldMm": "borderGapToField",
  "borders.0.offsetMm": "borderOffset",
  "borders.0.startMm": "borderStart",
};

/** Field messages keyed by path → keyed by the form field that shows them (unknown paths go to the form). */
export function planFieldErrors(errors: Record<string, string[]> | undefined): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const [path, messages] of Object.entries(errors ?? {})) {
    const field = planFieldOfPath[path] ?? (path.startsWith("layout.cloth") ? "clothWidth" : path.startsWith("borders") ? "borderSide" : "_form");
    out[field] = [...new Set([...(out[field] ?? []), ...messages])];
  }
  return out;
}

// --- requests to the keepers ---------------------------------------------------------------------

export interface StampRequestDto {
  id: string;
  plan: { id: string; name: string } | null;
  requesterName: string;
  requesterEmail: string | null;
  forWhom: string;
  workstation: string;
  fromOn: string;
  untilOn: string;
  note: string | null;
  state: "open" | "accepted" | "checked_out" | "declined";
  stamps: { code: string; name: string; location: LocationRef | null; out: boolean }[];
  answeredByName: string | null;
  answeredAt: string | null;
  declineReason: string | null;
  checkoutProblem: string | null;
  version: number;
  createdAt: string;
}

export interface NewStampRequestDto {
  id: string;
  widthMm: number;
  heightMm: number;
  plan: { id: string; name: string } | null;
  motif: { id: string; name: string } | null;
  role: "main" | "filler" | "border" | "corner" | "reverse_twin" | null;
  note: string | null;
  state: "open" | "declined" | "made";
  /** The stamp made from the request (state `made`), while it exists. */
  stamp: { id: string; code: string } | null;
  /** The sketch of the stamp to make (a picture checked like a scan), with its addresses. */
  sketch: { fileName: string | null; contentType: string; urls: { original: string; thumb: string } } | null;
  requesterName: string;
  answeredByName: string | null;
  answeredAt: string | null;
  declineReason: string | null;
  version: number;
  createdAt: string;
}

export const requestUrls = {
  stampRequests: (query: string | URLSearchParams = "") => withQuery("/api/v1/stamp-requests", query),
  stampRequest: (id: string) => `/api/v1/stamp-requests/${enc(id)}`,
  /** A new-stamp request's sketch (PUT the picture as the body; GET it, or its thumbnail). */
  sketch: (id: string, variant: "original" | "thumb" = "original") => `/api/v1/new-stamp-requests/${enc(id)}/sketch${variant === "thumb" ? "?variant=thumb" : ""}`,
  accept: (id: string) => `/api/v1/stamp-requests/${enc(id)}/accept`,
  decline: (id: string) => `/api/v1/stamp-requests/${enc(id)}/decline`,
  newStampRequests: (query: string | URLSearchParams = "") => withQuery("/api/v1/new-stamp-requests", query),
  declineNewStamp: (id: string) => `/api/v1/new-stamp-requests/${enc(id)}/decline`,
  fulfilNewStamp: (id: string) => `/api/v1/new-stamp-requests/${enc(id)}/stamp`,
  /** The keepers' queue on the shelf. */
  queue: () => "/stamps/requests",
};

/** The check-out request form: the stamps (one code per box, ticked), for whom, where, from, until, note. */
export function stampRequestFormInput(form: FormData) {
  return {
    planId: formOptional(form, "planId") ?? null,
    stampCodes: form.getAll("stampCodes").map(String).map((c) => c.trim()).filter(Boolean),
    forWhom: formText(form, "forWhom"),
    workstation: formText(form, "workstation"),
    fromOn: formText(form, "fromOn"),
    untilOn: formText(form, "untilOn"),
    note: formText(form, "note"),
  };
}

/** The new-stamp request form: the size in the person's units (hidden `unit`), the plan, a note. */
/**
 * A new-stamp request as typed, from the planner's fit helper or a motif's page: width and height in the person's
 * unit (`unit` = in for imperial people, else mm), the plan or the motif and its role in the set, a note.
 */
export function newStampRequestFormInput(form: FormData, locale: string) {
  const unit = formText(form, "unit") === "in" ? "in" : "mm";
  const size = (name: string) => {
    const text = formText(form, name).trim();
    if (text === "") return undefined;
    const mm = lengthMm(form, name, unit, locale);
    // an unreadable number goes to the schema as typed, so its message is the schema's
    return mm === undefined || Number.isNaN(mm) ? text : mm;
  };
  return {
    widthMm: size("width"),
    heightMm: size("height"),
    planId: formOptional(form, "planId") ?? null,
    motifId: formOptional(form, "motifId") ?? null,
    role: formOptional(form, "role") ?? null,
    note: formText(form, "note"),
  };
}

export const declineFormInput = (form: FormData) => ({ version: formText(form, "version"), reason: formText(form, "reason") });

// --- a saved plan → the planner form's values (the inverse of planFormInput) ---------------------------

/** The planner's form values, as typed (strings), for a layout and borders in mm. */
export type PlannerValues = Record<string, string>;

const shownIn = (mm: number | undefined, unit: "mm" | "in" | "m" | "yd", locale: string, digits = 4) => {
  if (mm === undefined || mm === null) return "";
  const v = unit === "in" ? mm / 25.4 : unit === "m" ? mm / 1000 : unit === "yd" ? mm / 914.4 : mm;
  return numberInput(v, locale, digits);
};

/** "1/3" for a simple fraction (denominator ≤ 12), else the decimal. */
export function fractionText(f: number | undefined, locale: string): string {
  if (f === undefined) return "";
  for (let q = 2; q <= 12; q++) {
    const p = Math.round(f * q);
    if (Math.abs(p / q - f) < 1e-9) return `${p}/${q}`;
  }
  return numberInput(f, locale);
}

export function plannerValues(layout: PlanLayout, borders: BorderRequest[] | undefined, units: { unit: "mm" | "in"; runUnit: "m" | "yd" }, locale: string): PlannerValues {
  const { unit, runUnit } = units;
  const shown = (mm: number | undefined, u: "mm" | "in" | "m" | "yd") => shownIn(mm, u, locale);
  const c = layout.cloth;
  const byPieces = c.lengthMm === undefined;
  const kodi = byPieces && c.pieces !== undefined && c.pieces % 20 === 0;
  const stamp = (prefix: string, ref: StampRef): PlannerValues => {
    const key = (name: string) => (prefix ? `${prefix}${name[0].toUpperCase()}${name.slice(1)}` : name);
    if ("code" in ref) return { [key("stampMode")]: "library", [key("stampCode")]: ref.code };
    return {
      [key("stampMode")]: "free",
      [key("stampWidth")]: shown(ref.widthMm, unit),
      [key("stampHeight")]: shown(ref.heightMm, unit),
      [key("coveragePct")]: ref.coverage !== undefined ? numberInput(ref.coverage * 100, locale, 2) : "",
    };
  };
  const b = borders?.[0];
  return {
    unit,
    runUnit,
    ...stamp("", layout.stamp),
    clothWidth: shown(c.widthMm, unit),
    marginLeft: shown(c.margins.leftMm, unit),
    marginRight: shown(c.margins.rightMm, unit),
    runBy: !byPieces ? "length" : kodi ? "kodi" : "pieces",
    runLength: shown(c.lengthMm, runUnit),
    pieces: byPieces && !kodi ? String(c.pieces ?? "") : "",
    kodi: kodi ? String((c.pieces ?? 0) / 20) : "",
    pieceLength: shown(c.pieceLengthMm, runUnit),
    gapX: shown(layout.gap.xMm, unit),
    gapY: shown(layout.gap.yMm, unit),
    arrangement: layout.arrangement,
    diagonalStep: fractionText(layout.diagonalStep, locale) || "1/2",
    rotationOrder: String(layout.rotationOrder ?? 4),
    align: layout.align,
    edges: layout.edges,
    sides: String(layout.sides),
    borderSide: b ? b.side : "none",
    ...(b
      ? {
          ...stamp("border", b.stamp),
          borderTurn: String(b.turn),
          borderMirror: b.mirror ? "on" : "",
          borderRightCopy: b.rightCopy ?? "mirror",
          borderGapY: shown(b.gapYMm, unit),
          borderGapToField: shown(b.gapToFieldMm, unit),
          borderOffset: shown(b.offsetMm, unit),
          borderStart: shown(b.startMm, unit),
        }
      : {}),
  };
}

/** The planner's values for a new plan: the first cloth preset, 30 m of cloth, straight, whole edges, one face. */
export function newPlannerValues(p: {
  unitSystem: "metric" | "imperial";
  preset?: { widthMm: number; marginMm: number };
  stampCode?: string;
  borderStamp?: { code: string; turn: number };
  arrangement?: string;
  motifId?: string;
}, locale: string): PlannerValues {
  const unit = p.unitSystem === "imperial" ? "in" : "mm";
  const runUnit = p.unitSystem === "imperial" ? "yd" : "m";
  const shown = (mm: number | undefined, u: "mm" | "in" | "m" | "yd", digits = 4) => shownIn(mm, u, locale, digits);
  const preset = p.preset ?? { widthMm: 1060, marginMm: 0 };
  return {
    unit,
    runUnit,
    name: "",
    notes: "",
    motifId: p.motifId ?? "",
    stampMode: "library",
    stampCode: p.stampCode ?? "",
    clothWidth: shown(preset.widthMm, unit),
    marginLeft: shown(preset.marginMm, unit),
    marginRight: shown(preset.marginMm, unit),
    runBy: "length",
    runLength: shown(30_000, runUnit, 2),
    pieces: "",
    kodi: "",
    pieceLength: shown(2650, runUnit, 2),
    gapX: "0",
    gapY: "0",
    arrangement: p.arrangement ?? "straight",
    diagonalStep: "1/2",
    rotationOrder: "4",
    align: "centre",
    edges: "whole",
    sides: "1",
    borderSide: p.borderStamp ? "both" : "none",
    borderStampMode: "library",
    borderStampCode: p.borderStamp?.code ?? "",
    borderTurn: String(p.borderStamp?.turn ?? 0),
    borderMirror: "",
    borderRightCopy: "mirror",
    borderGapY: "0",
    borderGapToField: "0",
    borderOffset: "0",
    borderStart: "0",
  };
}

/** Each layer's stamp picture for drawing a saved plan: the field stamp's, and each border's on its edges. */
export function layerPictures(plan: Pick<PlanDto, "stamps" | "borders">): Partial<Record<"field" | "border-left" | "border-right", StampPicture | null>> {
  const byRole = new Map(plan.stamps.map((s) => [s.role, s.picture]));
  const out: Partial<Record<"field" | "border-left" | "border-right", StampPicture | null>> = { field: byRole.get("field") ?? null };
  (plan.borders ?? []).forEach((b, k) => {
    const picture = byRole.get(`border:${k}`) ?? null;
    if (b.side !== "right") out["border-left"] = picture;
    if (b.side !== "left") out["border-right"] = picture;
  });
  return out;
}

