// The stamp shelf's contract with its clients: the shapes the API and pages answer with, and the
// URLs of its routes. Neither server-only nor React: server code, client components, SWR hooks and
// tests all import it (never lib/data, which is server-only).
import type { DamageKind, StampCondition, StampEventKind, StampFace } from "@/db/schema";

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
