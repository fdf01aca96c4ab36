import "server-only";
import { randomUUID } from "node:crypto";
import { and, desc, eq, inArray, sql } from "drizzle-orm";
import { db } from "@/db";
import { motifEvents, motifs, motifStamps, newStampRequests, plans, stamps, type NewStampRequest } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { requestUrls, type NewStampRequestDto } from "@/lib/contracts/plans";
import type { CreateNewStampRequestInput, DeclineRequestInput, FulfilNewStampRequestInput } from "@/lib/validation/plans";
import { createStamp } from "../stamps";
import { deletePictureQuietly, pictureResponse, storePicture, type PictureVariant } from "../pictures";
import { mailKeepersAboutNewStamp } from "./mail";

/** A sketch as it arrives: the picture's bytes and the name it came with. */
export interface SketchUpload {
  bytes: Uint8Array;
  fileName?: string;
}

// New-stamp requests: "make a stamp W × H mm" from a plan's fit helper, for the keepers' queue on the shelf. The
// motif archive extends them (sketches, roles, motifs, and turning a request into a stamp: state `made`).

async function toDtos(rows: NewStampRequest[]): Promise<NewStampRequestDto[]> {
  const ids = rows.flatMap((r) => (r.planId ? [r.planId] : []));
  const planRows = ids.length ? await db.select({ id: plans.id, name: plans.name }).from(plans).where(inArray(plans.id, ids)) : [];
  const name = new Map(planRows.map((p) => [p.id, p.name]));
  const motifIds = rows.flatMap((r) => (r.motifId ? [r.motifId] : []));
  const motifRows = motifIds.length ? await db.select({ id: motifs.id, name: motifs.name }).from(motifs).where(inArray(motifs.id, motifIds)) : [];
  const motifName = new Map(motifRows.map((m) => [m.id, m.name]));
  const stampIds = rows.flatMap((r) => (r.stampId ? [r.stampId] : []));
  const stampRows = stampIds.length ? await db.select({ id: stamps.id, code: stamps.code }).from(stamps).where(inArray(stamps.id, stampIds)) : [];
  const stampCode = new Map(stampRows.map((m) => [m.id, m.code]));
  return rows.map((r) => ({
    id: r.id,
    widthMm: r.widthMm,
    heightMm: r.heightMm,
    plan: r.planId && name.has(r.planId) ? { id: r.planId, name: name.get(r.planId)! } : null,
    motif: r.motifId && motifName.has(r.motifId) ? { id: r.motifId, name: motifName.get(r.motifId)! } : null,
    role: r.role,
    note: r.note,
    state: r.state,
    stamp: r.stampId && stampCode.has(r.stampId) ? { id: r.stampId, code: stampCode.get(r.stampId)! } : null,
    sketch: r.sketchKey && r.sketchType ? { fileName: r.sketchName, contentType: r.sketchType, urls: { original: requestUrls.sketch(r.id), thumb: requestUrls.sketch(r.id, "thumb") } } : null,
    requesterName: r.requesterName,
    answeredByName: r.answeredByName,
    answeredAt: r.answeredAt?.toISOString() ?? null,
    declineReason: r.declineReason,
    version: r.version,
    createdAt: r.createdAt.toISOString(),
  }));
}

/**
 * Files a new-stamp request, with its sketch when one comes along: the sketch is checked (like a scan) and stored
 * before the row is written, so a refused picture (ScanRejected) leaves neither a request nor an object behind.
 */
export async function createNewStampRequest(actor: Actor, input: CreateNewStampRequestInput, sketch?: SketchUpload): Promise<NewStampRequestDto> {
  assertCan(actor, "stamps:requestNew");
  if (input.planId) {
    const [plan] = await db.select({ id: plans.id }).from(plans).where(eq(plans.id, input.planId));
    if (!plan) throw new AppError("unprocessable", {}, { planId: ["validation.planUnknown"] });
  }
  if (input.motifId) {
    const [motif] = await db.select({ id: motifs.id }).from(motifs).where(eq(motifs.id, input.motifId));
    if (!motif) throw new AppError("unprocessable", {}, { motifId: ["validation.motifUnknown"] });
  }
  const id = randomUUID();
  const picture = sketch ? await storePicture("sketches", id, sketch.bytes, sketch.fileName) : null;
  let row: NewStampRequest;
  try {
    [row] = await db
      .insert(newStampRequests)
      .values({
        id,
        widthMm: input.widthMm,
        heightMm: input.heightMm,
        planId: input.planId ?? null,
        motifId: input.motifId ?? null,
        role: input.motifId ? (input.role ?? null) : null,
        note: input.note ?? null,
        ...(picture ? { sketchKey: picture.key, sketchType: picture.contentType, sketchName: sketch?.fileName ?? null } : {}),
        requestedBy: actor.id,
        requesterName: actor.name,
      })
      .returning();
  } catch (error) {
    await deletePictureQuietly(picture?.key);
    throw error;
  }
  const [dto] = await toDtos([row]);
  await mailKeepersAboutNewStamp(dto);
  return dto;
}

/**
 * Attaches (or replaces) the sketch of an open request: whoever may ask for new stamps. The picture is checked
 * and stored first, then the row takes its key in a locked update (version + 1); the old sketch's objects go
 * after the change is saved, the new ones when it is refused (answered, or a request that is gone).
 */
export async function attachNewStampSketch(actor: Actor, id: string, sketch: SketchUpload): Promise<NewStampRequestDto> {
  assertCan(actor, "stamps:requestNew");
  const [existing] = await db.select({ id: newStampRequests.id, state: newStampRequests.state }).from(newStampRequests).where(eq(newStampRequests.id, id));
  if (!existing) throw new AppError("notFound");
  if (existing.state !== "open") throw new AppError("requestAnswered", { state: existing.state });
  const picture = await storePicture("sketches", id, sketch.bytes, sketch.fileName);
  let previous: string | null = null;
  try {
    const row = await db.transaction(async (tx) => {
      const [r] = await tx.select().from(newStampRequests).where(eq(newStampRequests.id, id)).for("update");
      if (!r) throw new AppError("notFound");
      if (r.state !== "open") throw new AppError("requestAnswered", { state: r.state });
      previous = r.sketchKey;
      const [updated] = await tx
        .update(newStampRequests)
        .set({ sketchKey: picture.key, sketchType: picture.contentType, sketchName: sketch.fileName ?? null, version: sql`${newStampRequests.version} + 1`, updatedAt: sql`now()` })
        .where(eq(newStampRequests.id, id))
        .returning();
      return updated;
    });
    await deletePictureQuietly(previous);
    return (await toDtos([row]))[0];
  } catch (error) {
    await deletePictureQuietly(picture.key);
    throw error;
  }
}

/** A request's sketch (or its WebP thumbnail), streamed; everyone signed in may look, as at the queue. */
export async function newStampSketch(actor: Actor, id: string, variant: PictureVariant): Promise<Response> {
  assertCan(actor, "data:read");
  const [r] = await db.select({ key: newStampRequests.sketchKey, type: newStampRequests.sketchType }).from(newStampRequests).where(eq(newStampRequests.id, id));
  if (!r?.key) throw new AppError("notFound");
  return pictureResponse("sketches", id, r.key, variant, { contentType: r.type });
}

/** The request a stamp was made from, when it had a sketch: the stamp record links to it. */
export async function sketchOfStamp(actor: Actor, stampId: string): Promise<{ requestId: string; urls: { original: string; thumb: string } } | null> {
  assertCan(actor, "data:read");
  const [r] = await db
    .select({ id: newStampRequests.id })
    .from(newStampRequests)
    .where(and(eq(newStampRequests.stampId, stampId), sql`${newStampRequests.sketchKey} is not null`))
    .orderBy(desc(newStampRequests.createdAt))
    .limit(1);
  return r ? { requestId: r.id, urls: { original: requestUrls.sketch(r.id), thumb: requestUrls.sketch(r.id, "thumb") } } : null;
}

export async function getNewStampRequest(actor: Actor, id: string): Promise<NewStampRequestDto> {
  assertCan(actor, "data:read");
  const [row] = await db.select().from(newStampRequests).where(eq(newStampRequests.id, id));
  if (!row) throw new AppError("notFound");
  return (await toDtos([row]))[0];
}

/**
 * A keeper turns an open request into the stamp record made from it: the stamp is created, joins the motif's set in
 * the requested role (and links its motif), and the request is marked made — all in one transaction, or nothing.
 */
export async function fulfilNewStampRequest(actor: Actor, id: string, input: FulfilNewStampRequestInput): Promise<NewStampRequestDto> {
  assertCan(actor, "stamps:write");
  const row = await db.transaction(async (tx) => {
    const [r] = await tx.select().from(newStampRequests).where(eq(newStampRequests.id, id)).for("update");
    if (!r) throw new AppError("notFound");
    if (r.state !== "open") throw new AppError("requestAnswered", { state: r.state });
    if (r.version !== input.version) throw new AppError("versionConflict");
    const motif = r.motifId ? (await tx.select({ id: motifs.id }).from(motifs).where(eq(motifs.id, r.motifId)).for("update"))[0] : undefined;
    if (motif && r.role === "main") {
      const [main] = await tx
        .select({ code: stamps.code })
        .from(motifStamps)
        .innerJoin(stamps, eq(stamps.id, motifStamps.stampId))
        .where(and(eq(motifStamps.motifId, motif.id), eq(motifStamps.role, "main")));
      if (main) throw new AppError("motifHasMain", { code: main.code });
    }
    const made = await createStamp(actor, { ...input.stamp, motifId: motif ? motif.id : (input.stamp.motifId ?? null) }, tx);
    if (motif) {
      const [last] = await tx.select({ n: sql<number>`coalesce(max(${motifStamps.position}) + 1, 0)::int` }).from(motifStamps).where(eq(motifStamps.motifId, motif.id));
      await tx.insert(motifStamps).values({ motifId: motif.id, stampId: made.id, role: r.role ?? "filler", position: last?.n ?? 0 });
      await tx.update(motifs).set({ version: sql`${motifs.version} + 1`, updatedAt: sql`now()` }).where(eq(motifs.id, motif.id));
      await tx.insert(motifEvents).values({ motifId: motif.id, kind: "edited", actorId: actor.id, actorName: actor.name, changes: [{ field: "stamps", from: null, to: `${made.code} ${r.role ?? "filler"}` }] });
    }
    const [updated] = await tx
      .update(newStampRequests)
      .set({ state: "made", stampId: made.id, answeredBy: actor.id, answeredByName: actor.name, answeredAt: sql`now()`, version: sql`${newStampRequests.version} + 1`, updatedAt: sql`now()` })
      .where(eq(newStampRequests.id, id))
      .returning();
    return updated;
  });
  return (await toDtos([row]))[0];
}

/** New-stamp requests, open ones first, newest first. */
export async function listNewStampRequests(actor: Actor, query: { state?: NewStampRequest["state"] } = {}): Promise<NewStampRequestDto[]> {
  assertCan(actor, "data:read");
  const rows = await db
    .select()
    .from(newStampRequests)
    .where(query.state ? eq(newStampRequests.state, query.state) : undefined)
    .orderBy(sql`(${newStampRequests.state} = 'open') DESC`, desc(newStampRequests.createdAt))
    .limit(300);
  return toDtos(rows);
}

/** Keepers decline an open new-stamp request with a reason. */
export async function declineNewStampRequest(actor: Actor, id: string, input: DeclineRequestInput): Promise<NewStampRequestDto> {
  assertCan(actor, "stamps:write");
  const row = await db.transaction(async (tx) => {
    const [r] = await tx.select().from(newStampRequests).where(eq(newStampRequests.id, id)).for("update");
    if (!r) throw new AppError("notFound");
    if (r.version !== input.version) throw new AppError("versionConflict");
    if (r.state !== "open") throw new AppError("requestAnswered", { state: r.state });
    const [updated] = await tx
      .update(newStampRequests)
      .set({ state: "declined", declineReason: input.reason, answeredBy: actor.id, answeredByName: actor.name, answeredAt: sql`now()`, version: sql`${newStampRequests.version} + 1`, updatedAt: sql`now()` })
      .where(eq(newStampRequests.id, id))
      .returning();
    return updated;
  });
  return (await toDtos([row]))[0];
}
