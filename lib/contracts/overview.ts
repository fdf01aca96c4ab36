// The overview's contract (`/`): what needs each role today, section by section. Neither server-only nor React:
// the page, its panels (components/overview/) and the tests import it. Each section is present only for the roles
// whose work it is (`overviewSections` below; lib/data/overview.ts decides through lib/permissions.ts).
import type { FindingKind, ReadingWarning, RunState, StageKind } from "@/lib/runs";
import type { Permission } from "@/lib/permissions";

/** A section's first items (at most `OVERVIEW_ITEMS`) and how many there are in all. */
export interface OverviewList<T> {
  items: T[];
  total: number;
}

export const OVERVIEW_ITEMS = 6;

/** How far ahead the wax need looks: today and the six days after it. */
export const WAX_NEED_DAYS = 7;

/** How far back the pot readings with warnings are shown. */
export const POT_WARNING_DAYS = 7;

export interface OverviewStampRequest {
  id: string;
  requesterName: string;
  forWhom: string;
  fromOn: string;
  untilOn: string;
  state: "open" | "accepted";
  stampCodes: string[];
}

export interface OverviewNewStampRequest {
  id: string;
  widthMm: number;
  heightMm: number;
  motif: { id: string; name: string } | null;
  requesterName: string;
  createdAt: string;
}

export interface OverviewCheckout {
  stampCode: string;
  stampName: string;
  borrowerName: string;
  dueOn: string;
}

export interface OverviewRepair {
  code: string;
  name: string;
  condition: "needs_repair" | "in_repair";
}

export interface OverviewFlaggedStamp {
  code: string;
  name: string;
  kind: FindingKind;
  findings: number;
  lastOn: string;
}

export interface OverviewRun {
  id: string;
  name: string;
  state: RunState;
  dueOn: string | null;
  motifName: string;
  colourwayName: string;
  /** The stage the run is at (position + 1 is the number people read). */
  stage: { position: number; kind: StageKind; colourName: string | null } | null;
}

export interface OverviewStalePlan {
  id: string;
  name: string;
  /** The stamp codes whose size, outline or coverage changed since the plan was computed. */
  codes: string[];
  computedAt: string;
}

export interface OverviewWaxLine {
  material: { id: string; name: string };
  /** Wax the waxing stages of the week still need, kg gross. */
  neededKg: number;
  onHandKg: number;
  /** What stock lacks for the week's need (0 when there is enough). */
  shortKg: number;
}

export interface OverviewWaxNeed {
  /** The first and last day counted (YYYY-MM-DD, the workshop's calendar). */
  fromOn: string;
  untilOn: string;
  /** The waxing stages counted: planned to start by `untilOn`, or the stage an open run is at. */
  stages: number;
  lines: OverviewWaxLine[];
  totalKg: number;
  shortKg: number;
}

export interface OverviewPotWarning {
  runId: string;
  runName: string;
  stagePosition: number;
  stageKind: StageKind;
  at: string;
  tempC: number;
  /** The top of the stage recipe's working range, °C (the "above the range" caution names it). */
  maxC: number | null;
  warnings: ReadingWarning[];
}

export interface OverviewColourway {
  motif: { id: string; name: string };
  colourway: { id: string; name: string };
  runs: { id: string; name: string; state: RunState }[];
}

/** What `overviewFor(actor)` answers: only the sections for the actor's role are present. */
export interface OverviewDto {
  stampRequests?: OverviewList<OverviewStampRequest>;
  newStampRequests?: OverviewList<OverviewNewStampRequest>;
  overdueCheckouts?: OverviewList<OverviewCheckout>;
  repairQueue?: OverviewList<OverviewRepair>;
  flaggedStamps?: OverviewList<OverviewFlaggedStamp>;
  runsWaitingForPlan?: OverviewList<OverviewRun>;
  stalePlans?: OverviewList<OverviewStalePlan>;
  waxNeed?: OverviewWaxNeed;
  waxingRuns?: OverviewList<OverviewRun>;
  potWarnings?: OverviewList<OverviewPotWarning>;
  colourwaysInWork?: OverviewList<OverviewColourway>;
}

export type OverviewSection = keyof OverviewDto;

/**
 * Whose each section is: the permission of the work it leads to (any one of them shows it). Keepers fulfil
 * requests and look after the shelf; planners plan runs; wax masters record the waxing; designers (and keepers,
 * who may edit motifs too) follow their colourways through the runs and the new stamps they asked for.
 */
export const overviewSections: Record<OverviewSection, readonly Permission[]> = {
  stampRequests: ["stamps:write"],
  newStampRequests: ["stamps:write", "motifs:write"],
  overdueCheckouts: ["stamps:write"],
  repairQueue: ["stamps:write"],
  flaggedStamps: ["stamps:write"],
  runsWaitingForPlan: ["plans:write"],
  stalePlans: ["plans:write"],
  waxNeed: ["runs:recordWaxing"],
  waxingRuns: ["runs:recordWaxing"],
  potWarnings: ["runs:recordWaxing"],
  colourwaysInWork: ["motifs:write"],
};

/** The panels grouped the way the page shows them, each group under its own heading. */
export const overviewGroups = {
  shelf: ["flaggedStamps", "stampRequests", "newStampRequests", "overdueCheckouts", "repairQueue"],
  plans: ["runsWaitingForPlan", "stalePlans"],
  wax: ["waxingRuns", "waxNeed", "potWarnings"],
  designs: ["colourwaysInWork"],
} as const satisfies Record<string, readonly OverviewSection[]>;

const enc = encodeURIComponent;

/** Where the overview's lines lead: the pages where the work is done (runs: runPages, plans: planPages, wax: waxPages). */
export const overviewPages = {
  stamp: (code: string) => `/stamps/${enc(code)}`,
  out: () => "/stamps/out",
  repairs: () => "/stamps?condition=needs_repair,in_repair",
  requests: () => "/stamps/requests",
  /** A request in the keepers' queue (the queue's items carry these ids). */
  request: (id: string) => `/stamps/requests#request-${enc(id)}`,
  newStampRequest: (id: string) => `/stamps/requests#new-stamp-${enc(id)}`,
};
