import { randomUUID } from "node:crypto";
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import type { Database } from "@/db";
import { motifEvents, motifs, motifStamps, newStampRequests, plans, users } from "@/db/schema";
import { newObjectKey, type ObjectStore } from "@/lib/object-store";
import { defaultScanLimits, processPicture } from "@/lib/scans";
import { hashString, motifSvg, renderScan } from "./scan-art";
import { demoUsers } from "./users";

// Demo new-stamp requests (invented text): one open from a designer for a demo motif's border with a sketch, one
// open from a planner's fit helper on the demo plan, one declined, one made into a stamp already in the motif's set.
// The sketch is drawn from the demo scan art with a fixed seed and no grain, so it is the same picture every time,
// checked by the picture pipeline (lib/scans processPicture) and stored as the app would (lib/data/pictures.ts).
// Idempotent by note.

const DEMO = "Demo data";
const SKETCH_SEED = hashString("demo sketch: narrow vine border");

interface DemoRequest {
  note: string;
  widthMm: number;
  heightMm: number;
  requester: "designer" | "planner";
  withMotif?: "border" | "filler";
  withPlan?: boolean;
  sketch?: boolean;
  state: "open" | "declined" | "made";
  declineReason?: string;
}

export const demoNewStampRequests: DemoRequest[] = [
  { note: "A narrow border to run along both selvedges; the sketch shows the curl of the vine.", widthMm: 120, heightMm: 40, requester: "designer", withMotif: "border", sketch: true, state: "open" },
  { note: "The fit helper says 183 mm across fills the band without a cut column.", widthMm: 183, heightMm: 183, requester: "planner", withPlan: true, state: "open" },
  { note: "A second small star for the corners, the same as the first but turned.", widthMm: 60, heightMm: 60, requester: "designer", state: "declined", declineReason: "The shelf already has a star of this size; turn the one we have." },
  { note: "A filler leaf for the gaps between the main motifs.", widthMm: 80, heightMm: 80, requester: "designer", withMotif: "filler", state: "made" },
];

/** The demo sketch: a vine drawing from the scan art, rendered without grain at 100 DPI as a PNG. */
export async function demoSketchPng(): Promise<Buffer> {
  const svg = motifSvg({ seed: SKETCH_SEED, widthMm: 120, heightMm: 40, family: "vine", style: "print" });
  return renderScan(svg, 100, { format: "png", grain: 0 });
}

export async function seedNewStampRequests(db: Database, store: ObjectStore): Promise<number> {
  const have = new Set((await db.select({ note: newStampRequests.note }).from(newStampRequests).where(inArray(newStampRequests.note, demoNewStampRequests.map((r) => r.note)))).map((r) => r.note));
  const missing = demoNewStampRequests.filter((r) => !have.has(r.note));
  if (!missing.length) return 0;
  const emails = demoUsers.filter((u) => u.role === "designer" || u.role === "planner" || u.role === "keeper").map((u) => u.email);
  const people = await db.select({ id: users.id, name: users.name, role: users.role }).from(users).where(inArray(users.email, emails));
  const person = (role: string) => people.find((p) => p.role === role);
  const keeper = person("keeper");
  // The first demo motif (the motif seed's) that has a filler in its set: the "made" request became that filler.
  const [found] = await db
    .select({ id: motifs.id, fillerId: motifStamps.stampId })
    .from(motifs)
    .innerJoin(motifEvents, and(eq(motifEvents.motifId, motifs.id), eq(motifEvents.kind, "created"), eq(motifEvents.actorName, DEMO)))
    .innerJoin(motifStamps, and(eq(motifStamps.motifId, motifs.id), eq(motifStamps.role, "filler")))
    .orderBy(asc(motifs.name))
    .limit(1);
  const motif = found ? { id: found.id } : undefined;
  const filler = found ? { stampId: found.fillerId } : undefined;
  const [plan] = await db.select({ id: plans.id }).from(plans).where(eq(plans.name, "Market run, straight on mori 106")).limit(1);

  let added = 0;
  for (const r of missing) {
    const index = demoNewStampRequests.indexOf(r);
    const requester = person(r.requester);
    if (!requester) continue;
    // A "made" request needs the stamp it became: the motif's filler. Without one it is left out.
    if (r.state === "made" && (!motif || !filler || !keeper)) continue;
    const id = randomUUID();
    let sketch: { sketchKey: string; sketchType: string; sketchName: string } | null = null;
    if (r.sketch) {
      const picture = await processPicture(await demoSketchPng(), { ...defaultScanLimits, fileName: "vine-border-sketch.png" });
      const key = newObjectKey(`pictures/sketches/${id}`);
      await store.ensureBucket();
      await store.putObject(`${key}/original`, picture.original.bytes, { contentType: picture.original.contentType });
      await store.putObject(`${key}/thumb`, picture.thumb.bytes, { contentType: "image/webp" });
      sketch = { sketchKey: key, sketchType: picture.original.contentType, sketchName: "vine-border-sketch.png" };
    }
    const answered = r.state !== "open" && keeper ? { answeredBy: keeper.id, answeredByName: keeper.name, answeredAt: sql`now() - interval '1 day'` } : {};
    await db.insert(newStampRequests).values({
      id,
      widthMm: r.widthMm,
      heightMm: r.heightMm,
      note: r.note,
      planId: r.withPlan ? (plan?.id ?? null) : null,
      motifId: r.withMotif ? (motif?.id ?? null) : null,
      role: r.withMotif && motif ? r.withMotif : null,
      state: r.state,
      declineReason: r.declineReason ?? null,
      stampId: r.state === "made" ? filler!.stampId : null,
      requestedBy: requester.id,
      requesterName: requester.name,
      // Older first, so the queue lists them in the order they came (a day apart).
      createdAt: sql`now() - make_interval(days => ${demoNewStampRequests.length - index + 1})`,
      ...answered,
      ...(sketch ?? {}),
    });
    added++;
  }
  return added;
}
