import "server-only";
import { and, asc, desc, eq, inArray, isNull, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { checkouts, motifCollectionMembers, motifCollections, motifColours, motifColourways, motifEvents, motifs, motifStamps, plans, runs, stampScans, stamps, waxEstimates, type Motif } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import {
  availabilityOf,
  type CollectionDto,
  type ColourwayDto,
  type MotifDto,
  type MotifEventDto,
  type MotifListDto,
  type MotifPlanDto,
  type MotifStampDto,
  type MotifSummaryDto,
} from "@/lib/contracts/motifs";
import { scanUrls } from "@/lib/contracts/scans";
import { isUniqueViolation } from "@/lib/data/stamps/events";
import { similarToStamp } from "@/lib/data/scans/similar";
import type { CollectionInput, CreateMotifInput, MotifListQuery, UpdateCollectionInput, UpdateMotifInput } from "@/lib/validation/motifs";
import { audit } from "@/lib/log";

// The motif archive's data layer: motifs with their stamp sets, colourways and collections, their history,
// and the seam to the plans that used them.

type Db = Transaction | typeof db;

/**
 * Plans that used the motif, newest first (plans carry a nullable motif_id; the planner sets it when a plan is
 * started from a motif). The cloth is named by its width, since a plan keeps the width rather than a preset's name.
 */
export async function plansOfMotif(actor: Actor, motifId: string): Promise<MotifPlanDto[]> {
  assertCan(actor, "data:read");
  const rows = await db
    .select({ id: plans.id, name: plans.name, arrangement: plans.arrangement, clothWidthMm: plans.clothWidthMm, updatedAt: plans.updatedAt })
    .from(plans)
    .where(eq(plans.motifId, motifId))
    .orderBy(desc(plans.updatedAt));
  const estimates = rows.length
    ? await db
        .select({ id: waxEstimates.id, planId: waxEstimates.planId, name: waxEstimates.name, gramsPerMetre: waxEstimates.gramsPerMetre, kgNew: waxEstimates.kgNew, planned: waxEstimates.planned, createdAt: waxEstimates.createdAt })
        .from(waxEstimates)
        .where(inArray(waxEstimates.planId, rows.map((r) => r.id)))
        .orderBy(desc(waxEstimates.createdAt))
    : [];
  const estimatesOf = (planId: string) =>
    estimates.filter((e) => e.planId === planId).map((e) => ({ id: e.id, name: e.name, gramsPerMetre: e.gramsPerMetre, kgNew: e.kgNew, planned: e.planned, createdAt: e.createdAt.toISOString() }));
  return rows.map((r) => ({ id: r.id, name: r.name, arrangement: r.arrangement, clothName: null, clothWidthMm: r.clothWidthMm, updatedAt: r.updatedAt.toISOString(), estimates: estimatesOf(r.id) }));
}

async function stampSets(tx: Db, motifIds: string[]): Promise<Map<string, MotifStampDto[]>> {
  const out = new Map<string, MotifStampDto[]>();
  if (motifIds.length === 0) return out;
  const rows = await tx
    .select({ motifId: motifStamps.motifId, role: motifStamps.role, position: motifStamps.position, id: stamps.id, code: stamps.code, name: stamps.name, widthMm: stamps.widthMm, heightMm: stamps.heightMm, condition: stamps.condition })
    .from(motifStamps)
    .innerJoin(stamps, eq(stamps.id, motifStamps.stampId))
    .where(inArray(motifStamps.motifId, motifIds))
    .orderBy(asc(motifStamps.position));
  const stampIds = [...new Set(rows.map((r) => r.id))];
  const out_ = stampIds.length ? await tx.select({ stampId: checkouts.stampId }).from(checkouts).where(and(inArray(checkouts.stampId, stampIds), isNull(checkouts.returnedAt))) : [];
  const outSet = new Set(out_.map((r) => r.stampId));
  const scans = stampIds.length
    ? await tx
        .selectDistinctOn([stampScans.stampId], { stampId: stampScans.stampId, id: stampScans.id })
        .from(stampScans)
        .where(inArray(stampScans.stampId, stampIds))
        .orderBy(stampScans.stampId, desc(stampScans.createdAt))
    : [];
  const scanOf = new Map(scans.map((s) => [s.stampId, s.id]));
  const roleOrder = ["main", "reverse_twin", "border", "corner", "filler"];
  for (const r of rows) {
    const list = out.get(r.motifId) ?? [];
    const scanId = scanOf.get(r.id);
    list.push({
      code: r.code,
      name: r.name,
      role: r.role,
      widthMm: r.widthMm,
      heightMm: r.heightMm,
      condition: r.condition,
      availability: availabilityOf(r.condition, outSet.has(r.id)),
      thumb: scanId ? scanUrls.image(r.code, scanId, "thumb") : null,
    });
    out.set(r.motifId, list);
  }
  for (const list of out.values()) list.sort((a, b) => roleOrder.indexOf(a.role) - roleOrder.indexOf(b.role));
  return out;
}

async function collectionsOf(tx: Db, motifIds: string[]) {
  const out = new Map<string, { id: string; name: string }[]>();
  if (motifIds.length === 0) return out;
  const rows = await tx
    .select({ motifId: motifCollectionMembers.motifId, id: motifCollections.id, name: motifCollections.name })
    .from(motifCollectionMembers)
    .innerJoin(motifCollections, eq(motifCollections.id, motifCollectionMembers.collectionId))
    .where(inArray(motifCollectionMembers.motifId, motifIds))
    .orderBy(asc(motifCollections.name));
  for (const r of rows) out.set(r.motifId, [...(out.get(r.motifId) ?? []), { id: r.id, name: r.name }]);
  return out;
}

function mainProblem(set: MotifStampDto[]): MotifSummaryDto["mainStampProblem"] {
  const main = set.find((s) => s.role === "main");
  if (!main) return "missing";
  if (main.availability === "retired") return "retired";
  if (main.availability === "inRepair") return "inRepair";
  return null;
}

function summaryOf(m: Motif, set: MotifStampDto[], collections: { id: string; name: string }[], colourwayCount: number): MotifSummaryDto {
  return {
    id: m.id,
    name: m.name,
    tags: m.tags,
    designer: m.designer,
    collections,
    mainStamp: set.find((s) => s.role === "main") ?? null,
    stampCount: set.length,
    colourwayCount,
    mainStampProblem: mainProblem(set),
    lastUsedOn: m.firstUsedOn,
    updatedAt: m.updatedAt.toISOString(),
  };
}

async function colourwayCounts(tx: Db, motifIds: string[]) {
  if (motifIds.length === 0) return new Map<string, number>();
  const rows = await tx
    .select({ motifId: motifColourways.motifId, n: sql<number>`count(*)::int` })
    .from(motifColourways)
    .where(inArray(motifColourways.motifId, motifIds))
    .groupBy(motifColourways.motifId);
  return new Map(rows.map((r) => [r.motifId, r.n]));
}

/** The archive: filtered by words, tag, designer, collection, the main stamp's availability and size; sorted by last use. */
export async function listMotifs(actor: Actor, query: MotifListQuery): Promise<MotifListDto> {
  assertCan(actor, "data:read");
  const where = [];
  if (query.q) {
    const like = `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    where.push(sql`(${motifs.name} ILIKE ${like} OR ${motifs.description} ILIKE ${like} OR ${motifs.designer} ILIKE ${like} OR EXISTS (SELECT 1 FROM unnest(${motifs.tags}) t WHERE t ILIKE ${like}))`);
  }
  if (query.tag) where.push(sql`${query.tag} = ANY(${motifs.tags})`);
  if (query.designer) where.push(sql`${motifs.designer} ILIKE ${`%${query.designer.replace(/[\\%_]/g, (c) => `\\${c}`)}%`}`);
  if (query.collection) where.push(sql`EXISTS (SELECT 1 FROM ${motifCollectionMembers} WHERE ${motifCollectionMembers.motifId} = ${motifs.id} AND ${motifCollectionMembers.collectionId} = ${query.collection})`);
  const rows = await db
    .select()
    .from(motifs)
    .where(where.length ? and(...where) : undefined);
  const ids = rows.map((r) => r.id);
  const [sets, cols, counts] = await Promise.all([stampSets(db, ids), collectionsOf(db, ids), colourwayCounts(db, ids)]);
  // The arrangement used before: motifs with a plan in that arrangement.
  const used = query.arrangement
    ? new Set((await db.selectDistinct({ motifId: plans.motifId }).from(plans).where(eq(plans.arrangement, query.arrangement as (typeof plans.arrangement.enumValues)[number]))).map((r) => r.motifId))
    : null;
  let list = rows.map((m) => summaryOf(m, sets.get(m.id) ?? [], cols.get(m.id) ?? [], counts.get(m.id) ?? 0));
  if (used) list = list.filter((m) => used.has(m.id));
  if (query.availability?.length) list = list.filter((m) => m.mainStamp && query.availability!.includes(m.mainStamp.availability));
  if (query.minWidthMm !== undefined) list = list.filter((m) => m.mainStamp && m.mainStamp.widthMm >= query.minWidthMm!);
  if (query.maxWidthMm !== undefined) list = list.filter((m) => m.mainStamp && m.mainStamp.widthMm <= query.maxWidthMm!);
  const byName = (a: MotifSummaryDto, b: MotifSummaryDto) => a.name.localeCompare(b.name);
  if (query.sort === "name") list.sort(byName);
  else if (query.sort === "updated") list.sort((a, b) => b.updatedAt.localeCompare(a.updatedAt) || byName(a, b));
  else list.sort((a, b) => (b.lastUsedOn ?? "").localeCompare(a.lastUsedOn ?? "") || byName(a, b));
  const start = (query.page - 1) * query.pageSize;
  return { motifs: list.slice(start, start + query.pageSize), total: list.length, page: query.page, pageSize: query.pageSize };
}

async function findMotif(tx: Db, id: string, lock = false): Promise<Motif> {
  const q = tx.select().from(motifs).where(eq(motifs.id, id));
  const [row] = lock ? await q.for("update") : await q;
  if (!row) throw new AppError("notFound");
  return row;
}

async function colourwaysOf(tx: Db, motifId: string): Promise<ColourwayDto[]> {
  const ways = await tx.select().from(motifColourways).where(eq(motifColourways.motifId, motifId)).orderBy(asc(motifColourways.position));
  if (ways.length === 0) return [];
  const colours = await tx
    .select()
    .from(motifColours)
    .where(inArray(motifColours.colourwayId, ways.map((w) => w.id)))
    .orderBy(asc(motifColours.position));
  const stampIds = [...new Set(colours.flatMap((c) => c.waxStampIds))];
  const codes = stampIds.length ? new Map((await tx.select({ id: stamps.id, code: stamps.code }).from(stamps).where(inArray(stamps.id, stampIds))).map((s) => [s.id, s.code])) : new Map<string, string>();
  return ways.map((w) => ({
    id: w.id,
    name: w.name,
    notes: w.notes,
    colours: colours
      .filter((c) => c.colourwayId === w.id)
      .map((c) => ({ name: c.name, swatch: c.swatch, dyeNotes: c.dyeNotes, face: c.face, bleach: c.bleach, waxStamps: c.waxStampIds.flatMap((id) => (codes.has(id) ? [codes.get(id)!] : [])) })),
  }));
}

async function motifDto(tx: Db, m: Motif): Promise<MotifDto> {
  const [sets, cols, colourways] = await Promise.all([stampSets(tx, [m.id]), collectionsOf(tx, [m.id]), colourwaysOf(tx, m.id)]);
  const set = sets.get(m.id) ?? [];
  const copiedFrom = m.copiedFromId ? ((await tx.select({ id: motifs.id, name: motifs.name }).from(motifs).where(eq(motifs.id, m.copiedFromId)))[0] ?? null) : null;
  return {
    ...summaryOf(m, set, cols.get(m.id) ?? [], colourways.length),
    description: m.description,
    firstUsedOn: m.firstUsedOn,
    notes: m.notes,
    copiedFrom,
    stamps: set,
    colourways,
    version: m.version,
    createdAt: m.createdAt.toISOString(),
  };
}

export async function getMotif(actor: Actor, id: string): Promise<MotifDto> {
  assertCan(actor, "data:read");
  return motifDto(db, await findMotif(db, id));
}

export async function motifHistory(actor: Actor, id: string): Promise<MotifEventDto[]> {
  assertCan(actor, "data:read");
  await findMotif(db, id);
  const rows = await db.select().from(motifEvents).where(eq(motifEvents.motifId, id)).orderBy(desc(motifEvents.at));
  return rows.map((r) => ({ kind: r.kind, actorName: r.actorName, at: r.at.toISOString(), changes: r.changes }));
}

/** Stamp codes → ids, refusing unknown codes on the field that named them. */
async function stampIdsOf(tx: Db, codes: string[], field: (i: number) => string): Promise<Map<string, string>> {
  if (codes.length === 0) return new Map();
  const rows = await tx.select({ id: stamps.id, code: stamps.code }).from(stamps).where(inArray(stamps.code, codes));
  const map = new Map(rows.map((r) => [r.code, r.id]));
  const fields: Record<string, string[]> = {};
  codes.forEach((c, i) => {
    if (!map.has(c)) fields[field(i)] = ["validation.stampNotFound"];
  });
  if (Object.keys(fields).length) throw new AppError("validation", {}, fields);
  return map;
}

async function checkCollections(tx: Db, ids: string[]) {
  if (ids.length === 0) return;
  const rows = await tx.select({ id: motifCollections.id }).from(motifCollections).where(inArray(motifCollections.id, ids));
  if (rows.length !== new Set(ids).size) throw new AppError("validation", {}, { collectionIds: ["validation.notFound"] });
}

async function writeSet(tx: Transaction, motifId: string, input: { stamps?: CreateMotifInput["stamps"]; colourways?: CreateMotifInput["colourways"]; collectionIds?: string[] }) {
  if (input.collectionIds !== undefined) {
    await checkCollections(tx, input.collectionIds);
    await tx.delete(motifCollectionMembers).where(eq(motifCollectionMembers.motifId, motifId));
    const unique = [...new Set(input.collectionIds)];
    if (unique.length) await tx.insert(motifCollectionMembers).values(unique.map((collectionId) => ({ motifId, collectionId })));
  }
  let ids: Map<string, string> | null = null;
  if (input.stamps !== undefined) {
    ids = await stampIdsOf(tx, input.stamps.map((s) => s.code), (i) => `stamps.${i}.code`);
    const before = await tx.select({ stampId: motifStamps.stampId }).from(motifStamps).where(eq(motifStamps.motifId, motifId));
    await tx.delete(motifStamps).where(eq(motifStamps.motifId, motifId));
    if (input.stamps.length) await tx.insert(motifStamps).values(input.stamps.map((s, position) => ({ motifId, stampId: ids!.get(s.code)!, role: s.role, position })));
    // The shelf's "Motif:" line: a stamp points at the motif it belongs to (the first that took it).
    const now = [...ids.values()];
    const removed = before.map((b) => b.stampId).filter((id) => !now.includes(id));
    if (removed.length) await tx.update(stamps).set({ motifId: null }).where(and(inArray(stamps.id, removed), eq(stamps.motifId, motifId)));
    if (now.length) await tx.update(stamps).set({ motifId }).where(and(inArray(stamps.id, now), isNull(stamps.motifId)));
  }
  if (input.colourways !== undefined) {
    if (!ids) {
      const set = await tx.select({ id: stamps.id, code: stamps.code }).from(motifStamps).innerJoin(stamps, eq(stamps.id, motifStamps.stampId)).where(eq(motifStamps.motifId, motifId));
      ids = new Map(set.map((s) => [s.code, s.id]));
      const fields: Record<string, string[]> = {};
      input.colourways.forEach((cw, i) => cw.colours.forEach((c, j) => c.waxStamps.forEach((code, k) => (ids!.has(code) ? null : (fields[`colourways.${i}.colours.${j}.waxStamps.${k}`] = ["validation.colourStampNotInSet"])))));
      if (Object.keys(fields).length) throw new AppError("validation", {}, fields);
    }
    // A colourway keeps its row (and id) while its name stays: production runs point at it. One left out is
    // deleted, unless a run follows it (409 colourwayInRuns, naming the runs).
    const before = await tx.select({ id: motifColourways.id, name: motifColourways.name }).from(motifColourways).where(eq(motifColourways.motifId, motifId));
    const byName = new Map(before.map((w) => [w.name.toLowerCase(), w.id]));
    const kept = new Set(input.colourways.flatMap((cw) => (byName.has(cw.name.toLowerCase()) ? [byName.get(cw.name.toLowerCase())!] : [])));
    const dropped = before.filter((w) => !kept.has(w.id));
    if (dropped.length) {
      const following = await tx.select({ name: runs.name }).from(runs).where(inArray(runs.colourwayId, dropped.map((w) => w.id)));
      if (following.length) throw new AppError("colourwayInRuns", { runs: [...new Set(following.map((r) => r.name))].join(", ") });
      await tx.delete(motifColourways).where(inArray(motifColourways.id, dropped.map((w) => w.id)));
    }
    for (const [position, cw] of input.colourways.entries()) {
      let wayId = byName.get(cw.name.toLowerCase());
      if (wayId) {
        await tx.update(motifColourways).set({ name: cw.name, notes: cw.notes ?? null, position }).where(eq(motifColourways.id, wayId));
        await tx.delete(motifColours).where(eq(motifColours.colourwayId, wayId));
      } else [{ id: wayId }] = await tx.insert(motifColourways).values({ motifId, name: cw.name, notes: cw.notes ?? null, position }).returning({ id: motifColourways.id });
      await tx.insert(motifColours).values(
        cw.colours.map((c, i) => ({ colourwayId: wayId!, position: i, name: c.name, swatch: c.swatch, dyeNotes: c.dyeNotes ?? null, face: c.face, bleach: c.bleach ?? false, waxStampIds: c.waxStamps.map((code) => ids!.get(code)!) })),
      );
    }
  }
}

const colourwayNamesTwice = (ways: CreateMotifInput["colourways"] | undefined) => {
  const seen = new Set<string>();
  return (ways ?? []).findIndex((w) => {
    const k = w.name.toLowerCase();
    if (seen.has(k)) return true;
    seen.add(k);
    return false;
  });
};

function refuseTwiceNamed(ways: CreateMotifInput["colourways"] | undefined) {
  const i = colourwayNamesTwice(ways);
  if (i >= 0) throw new AppError("validation", {}, { [`colourways.${i}.name`]: ["validation.nameTwice"] });
}

export async function createMotif(actor: Actor, input: CreateMotifInput, options: { copiedFromId?: string } = {}): Promise<MotifDto> {
  assertCan(actor, "motifs:write");
  refuseTwiceNamed(input.colourways);
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(motifs)
      .values({ name: input.name, description: input.description ?? null, tags: input.tags, designer: input.designer ?? null, firstUsedOn: input.firstUsedOn ?? null, notes: input.notes ?? null, copiedFromId: options.copiedFromId ?? null })
      .returning();
    await writeSet(tx, row.id, input);
    await tx.insert(motifEvents).values({ motifId: row.id, kind: options.copiedFromId ? "copied" : "created", actorId: actor.id, actorName: actor.name, changes: options.copiedFromId ? [{ field: "copiedFrom", from: null, to: options.copiedFromId }] : [] });
    return motifDto(tx, row);
  });
}

const plainFields = ["name", "description", "tags", "designer", "firstUsedOn", "notes"] as const;

/** Applies an edit made from `input.version`; someone else's save in between → 409 versionConflict. */
export async function updateMotif(actor: Actor, id: string, input: UpdateMotifInput): Promise<MotifDto> {
  assertCan(actor, "motifs:write");
  refuseTwiceNamed(input.colourways);
  return db.transaction(async (tx) => {
    const current = await findMotif(tx, id, true);
    if (current.version !== input.version) throw new AppError("versionConflict");
    const before = await motifDto(tx, current);
    const changes: { field: string; from: unknown; to: unknown }[] = [];
    const set: Partial<typeof motifs.$inferInsert> = {};
    for (const field of plainFields) {
      const value = input[field];
      if (value === undefined) continue;
      if (JSON.stringify(value) !== JSON.stringify(current[field])) {
        changes.push({ field, from: current[field], to: value });
        (set as Record<string, unknown>)[field] = value;
      }
    }
    await writeSet(tx, id, input);
    const after = await motifDto(tx, current);
    const compare = (field: string, a: unknown, b: unknown) => JSON.stringify(a) !== JSON.stringify(b) && changes.push({ field, from: a, to: b });
    if (input.stamps !== undefined) compare("stamps", before.stamps.map((s) => `${s.code} ${s.role}`), after.stamps.map((s) => `${s.code} ${s.role}`));
    if (input.colourways !== undefined) compare("colourways", before.colourways.map((c) => c.name), after.colourways.map((c) => c.name));
    if (input.collectionIds !== undefined) compare("collections", before.collections.map((c) => c.name), after.collections.map((c) => c.name));
    const colourContent = (ways: ColourwayDto[]) => JSON.stringify(ways.map((w) => [w.name, w.notes, w.colours]));
    if (input.colourways !== undefined && changes.every((c) => c.field !== "colourways") && colourContent(before.colourways) !== colourContent(after.colourways)) {
      changes.push({ field: "colourways", from: before.colourways.map((c) => c.name), to: after.colourways.map((c) => c.name) });
    }
    if (changes.length === 0) return before;
    const [row] = await tx
      .update(motifs)
      .set({ ...set, version: sql`${motifs.version} + 1`, updatedAt: sql`now()` })
      .where(eq(motifs.id, id))
      .returning();
    await tx.insert(motifEvents).values({ motifId: id, kind: "edited", actorId: actor.id, actorName: actor.name, changes });
    return motifDto(tx, row);
  });
}

/** "Copy as a new design": the same stamp set, colourways and collections under a new name, linked to the original. */
export async function copyMotif(actor: Actor, id: string, name: string): Promise<MotifDto> {
  assertCan(actor, "motifs:write");
  const source = await getMotif(actor, id);
  return createMotif(
    actor,
    {
      name,
      description: source.description,
      tags: source.tags,
      designer: source.designer,
      firstUsedOn: null,
      notes: source.notes,
      collectionIds: source.collections.map((c) => c.id),
      stamps: source.stamps.map((s) => ({ code: s.code, role: s.role })),
      colourways: source.colourways.map((c) => ({ name: c.name, notes: c.notes, colours: c.colours.map((k) => ({ ...k })) })),
    },
    { copiedFromId: id },
  );
}

/** Deletes a motif no plan and no copy points at; otherwise 409 motifInUse naming what does. */
export async function deleteMotif(actor: Actor, id: string, version?: number): Promise<void> {
  assertCan(actor, "motifs:write");
  const plans = await plansOfMotif(actor, id);
  await db.transaction(async (tx) => {
    const current = await findMotif(tx, id, true);
    if (version !== undefined && version !== current.version) throw new AppError("versionConflict");
    const copies = await tx.select({ id: motifs.id, name: motifs.name }).from(motifs).where(eq(motifs.copiedFromId, id));
    if (copies.length || plans.length) {
      const uses = [...copies.map((c) => c.name), ...plans.map((p) => p.name)].join(", ");
      throw new AppError("motifInUse", { uses }, undefined, { copies, plans: plans.map((p) => ({ id: p.id, name: p.name })) });
    }
    await tx.update(stamps).set({ motifId: null }).where(eq(stamps.motifId, id));
    await tx.delete(motifs).where(eq(motifs.id, id));
  });
  audit("record.deleted", actor, { kind: "motif", id });
}

// Collections.

async function collectionDto(tx: Db, id: string): Promise<CollectionDto> {
  const [row] = await tx
    .select({ c: motifCollections, n: sql<number>`(SELECT count(*)::int FROM ${motifCollectionMembers} WHERE ${motifCollectionMembers.collectionId} = ${motifCollections.id})` })
    .from(motifCollections)
    .where(eq(motifCollections.id, id));
  if (!row) throw new AppError("notFound");
  return { id: row.c.id, name: row.c.name, season: row.c.season, year: row.c.year, description: row.c.description, motifCount: row.n, version: row.c.version };
}

export async function listCollections(actor: Actor): Promise<CollectionDto[]> {
  assertCan(actor, "data:read");
  const rows = await db
    .select({ c: motifCollections, n: sql<number>`(SELECT count(*)::int FROM ${motifCollectionMembers} WHERE ${motifCollectionMembers.collectionId} = ${motifCollections.id})` })
    .from(motifCollections)
    .orderBy(desc(motifCollections.year), asc(motifCollections.name));
  return rows.map((r) => ({ id: r.c.id, name: r.c.name, season: r.c.season, year: r.c.year, description: r.c.description, motifCount: r.n, version: r.c.version }));
}

export async function getCollection(actor: Actor, id: string): Promise<CollectionDto> {
  assertCan(actor, "data:read");
  return collectionDto(db, id);
}

const taken = (error: unknown) => (isUniqueViolation(error, "motif_collections_name_key") ? new AppError("collectionTaken", {}, { name: ["errors.collectionTaken"] }) : error);

export async function createCollection(actor: Actor, input: CollectionInput): Promise<CollectionDto> {
  assertCan(actor, "motifs:write");
  try {
    const [row] = await db.insert(motifCollections).values({ name: input.name, season: input.season ?? null, year: input.year ?? null, description: input.description ?? null }).returning({ id: motifCollections.id });
    return collectionDto(db, row.id);
  } catch (error) {
    throw taken(error);
  }
}

export async function updateCollection(actor: Actor, id: string, input: UpdateCollectionInput): Promise<CollectionDto> {
  assertCan(actor, "motifs:write");
  try {
    return await db.transaction(async (tx) => {
      const [current] = await tx.select().from(motifCollections).where(eq(motifCollections.id, id)).for("update");
      if (!current) throw new AppError("notFound");
      if (current.version !== input.version) throw new AppError("versionConflict");
      const fields = { name: input.name, season: input.season, year: input.year, description: input.description };
      await tx.update(motifCollections).set({ ...fields, version: sql`${motifCollections.version} + 1`, updatedAt: sql`now()` }).where(eq(motifCollections.id, id));
      return collectionDto(tx, id);
    });
  } catch (error) {
    throw taken(error);
  }
}

/** Deletes an empty collection; one that still holds motifs → 409 collectionInUse. */
export async function deleteCollection(actor: Actor, id: string): Promise<void> {
  assertCan(actor, "motifs:write");
  await db.transaction(async (tx) => {
    const current = await collectionDto(tx, id);
    if (current.motifCount > 0) throw new AppError("collectionInUse", { count: current.motifCount });
    await tx.delete(motifCollections).where(eq(motifCollections.id, id));
  });
  audit("record.deleted", actor, { kind: "collection", id });
}

/** Other motifs whose stamps look like this motif's main stamp, nearest first (search by picture on its scans). */
export async function similarMotifs(actor: Actor, motifId: string, limit = 6): Promise<Array<{ id: string; name: string; distance: number; mirrored: boolean; stampCode: string; thumb: string }>> {
  assertCan(actor, "data:read");
  const [main] = await db.select({ stampId: motifStamps.stampId }).from(motifStamps).where(and(eq(motifStamps.motifId, motifId), eq(motifStamps.role, "main")));
  if (!main) return [];
  const own = new Set((await db.select({ stampId: motifStamps.stampId }).from(motifStamps).where(eq(motifStamps.motifId, motifId))).map((r) => r.stampId));
  const matches = await similarToStamp(actor, main.stampId, 24);
  const codes = matches.map((m) => m.stampCode);
  if (codes.length === 0) return [];
  const rows = await db
    .select({ code: stamps.code, stampId: stamps.id, id: motifs.id, name: motifs.name })
    .from(motifStamps)
    .innerJoin(stamps, eq(stamps.id, motifStamps.stampId))
    .innerJoin(motifs, eq(motifs.id, motifStamps.motifId))
    .where(inArray(stamps.code, codes));
  const seen = new Set<string>([motifId]);
  const out = [];
  for (const m of matches) {
    for (const r of rows.filter((x) => x.code === m.stampCode && !own.has(x.stampId))) {
      if (seen.has(r.id)) continue;
      seen.add(r.id);
      out.push({ id: r.id, name: r.name, distance: m.distance, mirrored: m.mirrored, stampCode: m.stampCode, thumb: m.urls.thumb });
    }
  }
  return out.slice(0, limit);
}

/** Every motif's name by id (the picture search names the motif a matched stamp belongs to). */
export async function motifNames(actor: Actor): Promise<Record<string, string>> {
  assertCan(actor, "data:read");
  const rows = await db.select({ id: motifs.id, name: motifs.name }).from(motifs);
  return Object.fromEntries(rows.map((r) => [r.id, r.name]));
}
