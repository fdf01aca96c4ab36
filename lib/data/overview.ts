import "server-only";
import { asc, desc, eq, gte, inArray } from "drizzle-orm";
import { db } from "@/db";
import { runReadings, runs, runStages, stamps, waxRecipes } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import {
  OVERVIEW_ITEMS,
  overviewSections,
  POT_WARNING_DAYS,
  WAX_NEED_DAYS,
  type OverviewColourway,
  type OverviewDto,
  type OverviewList,
  type OverviewPotWarning,
  type OverviewRun,
  type OverviewSection,
  type OverviewWaxNeed,
} from "@/lib/contracts/overview";
import type { RunSummaryDto } from "@/lib/contracts/runs";
import { can } from "@/lib/permissions";
import { readingWarnings } from "@/lib/runs";
import { listStalePlans } from "./plans/stale";
import { listNewStampRequests, listStampRequests } from "./requests";
import { listFlaggedStamps } from "./runs";
import { openRunWaxNeeds } from "./runs/purchase";
import { runSummaries } from "./runs/shared";
import { workshopToday } from "./settings";
import { listCheckouts } from "./stamps";
import { loadMaterials, onHandByMaterial } from "./wax/shared";

// The overview (`/`): what needs each role today. Each section is read only for the roles whose work it is
// (overviewSections in the contract names the permission of that work); everyone who reads gets their own.

const addDays = (iso: string, days: number) => new Date(Date.parse(`${iso}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);

/** The sections this actor's role sees (any one of a section's permissions shows it). */
export function overviewSectionsFor(actor: Pick<Actor, "role">): OverviewSection[] {
  return (Object.keys(overviewSections) as OverviewSection[]).filter((s) => overviewSections[s].some((p) => can(actor.role, p)));
}

/** The actor's sections, each with its first `items` lines (OVERVIEW_ITEMS on the page) and its total. */
export async function overviewFor(actor: Actor, options: { items?: number } = {}): Promise<OverviewDto> {
  assertCan(actor, "data:read");
  const shown = options.items ?? OVERVIEW_ITEMS;
  const first = <T>(all: T[]): OverviewList<T> => ({ items: all.slice(0, shown), total: all.length });
  const wanted = new Set(overviewSectionsFor(actor));
  const wants = (...sections: OverviewSection[]) => sections.some((s) => wanted.has(s));
  const today = await workshopToday();
  const out: OverviewDto = {};
  const runsNeeded = wants("runsWaitingForPlan", "waxingRuns", "colourwaysInWork", "waxNeed");
  const openRuns = runsNeeded ? await openRunSummaries() : [];

  await Promise.all([
    wants("stampRequests") &&
      listStampRequests(actor, { state: "pending" }).then((all) => {
        out.stampRequests = first(
          all.flatMap((r) =>
            r.state === "open" || r.state === "accepted"
              ? [{ id: r.id, requesterName: r.requesterName, forWhom: r.forWhom, fromOn: r.fromOn, untilOn: r.untilOn, state: r.state, stampCodes: r.stamps.map((s) => s.code) }]
              : [],
          ),
        );
      }),
    wants("newStampRequests") &&
      listNewStampRequests(actor, { state: "open" }).then((all) => {
        out.newStampRequests = first(all.map((n) => ({ id: n.id, widthMm: n.widthMm, heightMm: n.heightMm, motif: n.motif, requesterName: n.requesterName, createdAt: n.createdAt })));
      }),
    wants("overdueCheckouts") &&
      listCheckouts(actor, { overdue: true }).then((all) => {
        out.overdueCheckouts = first(all.map((c) => ({ stampCode: c.stampCode, stampName: c.stampName, borrowerName: c.borrowerName, dueOn: c.dueOn })));
      }),
    wants("repairQueue") &&
      db
        .select({ code: stamps.code, name: stamps.name, condition: stamps.condition })
        .from(stamps)
        .where(inArray(stamps.condition, ["needs_repair", "in_repair"]))
        .orderBy(asc(stamps.code))
        .then((rows) => {
          out.repairQueue = first(rows.map((r) => ({ code: r.code, name: r.name, condition: r.condition as "needs_repair" | "in_repair" })));
        }),
    wants("flaggedStamps") &&
      listFlaggedStamps(actor).then((all) => {
        out.flaggedStamps = first(
          all.sort((a, b) => b.lastOn.localeCompare(a.lastOn) || a.stamp.code.localeCompare(b.stamp.code)).map((f) => ({ code: f.stamp.code, name: f.stamp.name, kind: f.kind, findings: f.findings, lastOn: f.lastOn })),
        );
      }),
    wants("stalePlans") &&
      listStalePlans(actor).then((all) => {
        out.stalePlans = first(all.map((p) => ({ id: p.id, name: p.name, codes: [...new Set(p.reasons.map((r) => r.code))], computedAt: p.computedAt.toISOString() })));
      }),
    wants("waxNeed") &&
      waxNeed(today, openRuns).then((need) => {
        out.waxNeed = need;
      }),
    wants("potWarnings") &&
      potWarnings().then((all) => {
        out.potWarnings = first(all);
      }),
  ]);

  if (wants("runsWaitingForPlan") || wants("waxingRuns")) {
    const stageRows = openRuns.some((r) => r.currentStage)
      ? await db
          .select({ id: runStages.id, colourName: runStages.colourName })
          .from(runStages)
          .where(inArray(runStages.id, openRuns.flatMap((r) => (r.currentStage ? [r.currentStage.id] : []))))
      : [];
    const colourOf = new Map(stageRows.map((s) => [s.id, s.colourName]));
    const toRun = (r: RunSummaryDto): OverviewRun => ({
      id: r.id,
      name: r.name,
      state: r.state,
      dueOn: r.dueOn,
      motifName: r.motif.name,
      colourwayName: r.colourway.name,
      stage: r.currentStage ? { position: r.currentStage.position, kind: r.currentStage.kind, colourName: colourOf.get(r.currentStage.id) ?? null } : null,
    });
    if (wants("runsWaitingForPlan")) out.runsWaitingForPlan = first(openRuns.filter((r) => r.waitingForPlan).map(toRun));
    if (wants("waxingRuns")) out.waxingRuns = first(openRuns.filter((r) => r.currentStage?.kind === "wax" || r.currentStage?.kind === "boil_off").map(toRun));
  }
  if (wants("colourwaysInWork")) out.colourwaysInWork = first(colourwaysOf(openRuns));
  return out;
}

/** Runs being prepared or in work, the soonest due first (those without a due date last). */
async function openRunSummaries(): Promise<RunSummaryDto[]> {
  const rows = await db.select().from(runs).where(inArray(runs.state, ["setup", "underway"]));
  rows.sort((a, b) => (a.dueOn ?? "9999-12-31").localeCompare(b.dueOn ?? "9999-12-31") || a.name.localeCompare(b.name));
  return runSummaries(db, rows);
}

/** Open runs by motif colourway, in the order of their soonest run. */
function colourwaysOf(openRuns: RunSummaryDto[]): OverviewColourway[] {
  const byColourway = new Map<string, OverviewColourway>();
  for (const r of openRuns) {
    const way = byColourway.get(r.colourway.id) ?? { motif: r.motif, colourway: r.colourway, runs: [] };
    way.runs.push({ id: r.id, name: r.name, state: r.state });
    byColourway.set(r.colourway.id, way);
  }
  return [...byColourway.values()];
}

/**
 * The wax the coming week's waxings still need, by material, against stock on hand: the waxing stages of open
 * runs planned to start by the week's last day (late ones too), and the waxing a run is at now whatever its
 * dates — the same remaining estimates (estimate − used) the purchase list counts.
 */
async function waxNeed(today: string, openRuns: RunSummaryDto[]): Promise<OverviewWaxNeed> {
  const untilOn = addDays(today, WAX_NEED_DAYS - 1);
  const current = new Set(openRuns.flatMap((r) => (r.currentStage ? [r.currentStage.id] : [])));
  const [{ stages }, materials, onHand] = await Promise.all([openRunWaxNeeds(), loadMaterials(db), onHandByMaterial(db)]);
  const week = stages.filter((s) => current.has(s.stageId) || (s.plannedStartOn !== null && s.plannedStartOn <= untilOn));
  const needed = new Map<string, number>();
  for (const s of week) for (const m of s.byMaterial) needed.set(m.material, (needed.get(m.material) ?? 0) + m.kg);
  const lines = materials
    .filter((m) => (needed.get(m.id) ?? 0) > 0)
    .map((m) => {
      const neededKg = needed.get(m.id)!;
      const onHandKg = onHand.get(m.id) ?? 0;
      return { material: { id: m.id, name: m.name }, neededKg, onHandKg, shortKg: Math.max(0, neededKg - onHandKg) };
    })
    .sort((a, b) => b.shortKg - a.shortKg || b.neededKg - a.neededKg);
  return { fromOn: today, untilOn, stages: week.length, lines, totalKg: lines.reduce((a, l) => a + l.neededKg, 0), shortKg: lines.reduce((a, l) => a + l.shortKg, 0) };
}

/** Pot readings of the last days that called for a caution (above the recipe's range, or fumes), newest first. */
async function potWarnings(): Promise<OverviewPotWarning[]> {
  const since = new Date(Date.now() - POT_WARNING_DAYS * 86_400_000);
  const rows = await db
    .select({
      runId: runs.id,
      runName: runs.name,
      position: runStages.position,
      kind: runStages.kind,
      at: runReadings.at,
      tempC: runReadings.tempC,
      minC: waxRecipes.workingMinC,
      maxC: waxRecipes.workingMaxC,
    })
    .from(runReadings)
    .innerJoin(runStages, eq(runStages.id, runReadings.stageId))
    .innerJoin(runs, eq(runs.id, runStages.runId))
    .leftJoin(waxRecipes, eq(waxRecipes.id, runStages.recipeId))
    .where(gte(runReadings.at, since))
    .orderBy(desc(runReadings.at))
    .limit(500);
  return rows.flatMap((r) => {
    const range = r.minC !== null && r.maxC !== null ? { minC: r.minC, maxC: r.maxC } : null;
    const warnings = readingWarnings(r.tempC, range);
    return warnings.length
      ? [{ runId: r.runId, runName: r.runName, stagePosition: r.position, stageKind: r.kind, at: r.at.toISOString(), tempC: r.tempC, maxC: range?.maxC ?? null, warnings }]
      : [];
  });
}
