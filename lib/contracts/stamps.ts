// The stamp shelf's contract with its clients: the shapes the API and pages answer with, and the
// URLs of its routes. Neither server-only nor React: server code, client components, SWR hooks and
// tests all import it (never lib/data, which is server-only).
import type { DamageKind, StampCondition, StampEventKind, StampFace } from "@/db/schema";
import { inchesToMm, ouncesToGrams } from "@/lib/units";
import { formChecked, formNumber, formOptional, formText } from "./form-input";

export interface LocationRef {
  id: string;
  site: string;
  code: string;
}

export interface CheckoutDto {
  id: string;
  borrowerId: string | null;
  borrowerName: string;
  borrowerEmail: string | null;
  workstation: string;
  outAt: string;
  dueOn: string;
  overdue: boolean;
  note: string | null;
  checkedOutByName: string | null;
  lastRemindedAt: string | null;
}

export interface DamageReportDto {
  id: string;
  kind: DamageKind;
  note: string | null;
  reportedAt: string;
  reportedByName: string | null;
}

/** A row of the stamp table. */
export interface StampListItem {
  id: string;
  code: string;
  name: string;
  widthMm: number;
  heightMm: number;
  face: StampFace;
  mirrored: boolean;
  maker: string | null;
  madeOn: string | null;
  condition: StampCondition;
  location: LocationRef | null;
  tags: string[];
  impressionsCount: number;
  coverageRatio: number | null;
  updatedAt: string;
  checkout: { borrowerName: string; workstation: string; dueOn: string; overdue: boolean } | null;
}

/** Everything the stamp record shows. */
export interface StampDto extends Omit<StampListItem, "checkout"> {
  motifId: string | null;
  stripDepthMm: number | null;
  weightG: number | null;
  twin: { code: string; name: string; mirrored: boolean } | null;
  outlinePath: string | null;
  notes: string | null;
  version: number;
  createdAt: string;
  checkout: CheckoutDto | null;
  openDamage: DamageReportDto[];
}

export interface StampPage {
  stamps: StampListItem[];
  total: number;
  page: number;
  pageSize: number;
}

export interface StampEventDto {
  id: string;
  kind: StampEventKind;
  at: string;
  actorName: string;
  from: string | null;
  to: string | null;
  note: string | null;
  details: Record<string, unknown> | null;
}

export interface OpenCheckoutDto extends CheckoutDto {
  stampCode: string;
  stampName: string;
  location: LocationRef | null;
}

export interface LocationDto {
  id: string;
  site: string;
  code: string;
  description: string | null;
  stampCount: number;
}

export interface StockTakeSummary {
  id: string;
  site: string;
  status: "open" | "closed";
  startedAt: string;
  endedAt: string | null;
  startedByName: string | null;
  expectedAtStart: number;
  seen: number;
}

/** Where a stamp is recorded or was seen during a count. */
export type StockTakePlace = { id: string; label: string } | null;

export interface StockTakeDto extends StockTakeSummary {
  expected: number;
  seenExpected: number;
  missing: { code: string; name: string; recorded: StockTakePlace }[];
  misplaced: { code: string; name: string; recorded: StockTakePlace; seenAt: StockTakePlace }[];
  unexpected: { code: string; name: string | null; reason: "otherSite" | "noLocation" | "checkedOut" | "unknown" | "retired"; recorded: StockTakePlace; seenAt: StockTakePlace }[];
  checkedOut: { code: string; name: string }[];
  recent: { code: string; name: string | null; seenAt: StockTakePlace; at: string; result: "found" | "misplaced" | "unexpected" }[];
  relocatable: number;
  locations: { id: string; code: string }[];
}

/** A file that was (or, on a dry run, would be) imported whole. */
export interface ImportResult {
  ok: true;
  dryRun: boolean;
  rows: number;
  created: number;
  updated: number;
}

export interface ReminderResult {
  sent: { code: string; borrowerName: string; borrowerEmail: string }[];
  withoutEmail: { code: string; borrowerName: string }[];
  failed: { code: string; borrowerName: string }[];
  /** Reminded less than `gapHours` ago: not reminded again. */
  skipped: { code: string; borrowerName: string; lastRemindedAt: string }[];
  gapHours: number;
}

// --- URLs of the shelf's routes --------------------------------------------------------------

const enc = encodeURIComponent;
const withQuery = (path: string, query: string | URLSearchParams = "") => {
  const q = String(query);
  return q ? `${path}?${q}` : path;
};

export const stampUrls = {
  list: (query: string | URLSearchParams = "") => withQuery("/api/v1/stamps", query),
  export: (query: string | URLSearchParams = "") => withQuery("/api/v1/stamps/export", query),
  import: (dryRun: boolean) => withQuery("/api/v1/stamps/import", dryRun ? "dryRun=true" : ""),
  one: (code: string) => `/api/v1/stamps/${enc(code)}`,
  history: (code: string) => `/api/v1/stamps/${enc(code)}/history`,
  checkout: (code: string) => `/api/v1/stamps/${enc(code)}/checkout`,
  return: (code: string) => `/api/v1/stamps/${enc(code)}/return`,
  damage: (code: string) => `/api/v1/stamps/${enc(code)}/damage`,
  condition: (code: string) => `/api/v1/stamps/${enc(code)}/condition`,
  checkouts: (overdue = false) => withQuery("/api/v1/checkouts", overdue ? "overdue=true" : ""),
  reminders: () => "/api/v1/checkouts/reminders",
  locations: () => "/api/v1/locations",
  location: (id: string) => `/api/v1/locations/${enc(id)}`,
  stockTakes: () => "/api/v1/stock-takes",
  stockTake: (id: string) => `/api/v1/stock-takes/${enc(id)}`,
  stockTakeAction: (id: string, action: "relocate" | "end") => `/api/v1/stock-takes/${enc(id)}/${action}`,
  sightings: (id: string) => `/api/v1/stock-takes/${enc(id)}/sightings`,
  sighting: (id: string, code: string) => `/api/v1/stock-takes/${enc(id)}/sightings/${enc(code)}`,
};

// --- form input: the shelf's forms → their schemas' input (lengths in mm, masses in g, coverage as a ratio) ---

/**
 * The stamp form in the person's units (hidden field unitSystem) and as their language writes numbers
 * (`locale`: "120,5" in Indonesian) → createStampSchema / updateStampSchema input.
 */
export function stampFormInput(form: FormData, mode: "create" | "update", locale: string): Record<string, unknown> {
  const number = (name: string) => formNumber(form, name, locale);
  const imperial = formText(form, "unitSystem") === "imperial";
  const convert = (value: number | null, toMetric: (v: number) => number) => (value === null || Number.isNaN(value) || !imperial ? value : toMetric(value));
  const required = (value: number | null) => value ?? undefined;
  const pct = number("coveragePct");
  const input: Record<string, unknown> = {
    code: formText(form, "code"),
    name: formText(form, "name"),
    widthMm: required(convert(number("widthMm"), inchesToMm)),
    heightMm: required(convert(number("heightMm"), inchesToMm)),
    stripDepthMm: convert(number("stripDepthMm"), inchesToMm),
    weightG: convert(number("weightG"), ouncesToGrams),
    face: formOptional(form, "face"),
    mirrored: formChecked(form, "mirrored"),
    twinCode: formText(form, "twinCode").trim() || null,
    maker: formText(form, "maker"),
    madeOn: formText(form, "madeOn").trim() || null,
    locationId: formText(form, "locationId") || null,
    // The form takes %, the schema a ratio 0–1.
    coverageRatio: form.get("coveragePct") !== null ? (pct === null || Number.isNaN(pct) ? pct : pct / 100) : undefined,
    outlinePath: formText(form, "outlinePath").trim() || null,
    notes: formText(form, "notes"),
    tags: formText(form, "tags")
      .split(",")
      .map((s) => s.trim())
      .filter(Boolean),
  };
  if (mode === "create") input.condition = formOptional(form, "condition");
  else input.version = Number(formText(form, "version"));
  return input;
}

/** The check-out form: a person with an account ("borrowerId"), or "other" and a typed name and e-mail. */
export function checkoutFormInput(form: FormData) {
  const who = formText(form, "borrowerId");
  const someoneElse = who === "other" || !who;
  return {
    borrowerId: someoneElse ? undefined : who,
    borrowerName: someoneElse ? formText(form, "borrowerName") : undefined,
    borrowerEmail: someoneElse ? formText(form, "borrowerEmail") : undefined,
    workstation: formText(form, "workstation"),
    dueOn: formText(form, "dueOn"),
    note: formText(form, "note"),
  };
}

/** The return form: where it goes back (empty: its recorded place) and impressions made while out ("1.200" in Indonesian). */
export function returnFormInput(form: FormData, locale: string) {
  return { note: formText(form, "note"), locationId: formOptional(form, "locationId") ?? null, impressions: formNumber(form, "impressions", locale) ?? undefined };
}

export const damageFormInput = (form: FormData) => ({ kind: formOptional(form, "kind"), note: formText(form, "note") });
export const conditionFormInput = (form: FormData) => ({ condition: formOptional(form, "condition"), note: formText(form, "note") });
