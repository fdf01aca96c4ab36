import { asc, eq, inArray } from "drizzle-orm";
import type { Database } from "@/db";
import { stampEvents, stampScans, stamps, users } from "@/db/schema";
import { newObjectKey, type ObjectStore } from "@/lib/object-store";
import { defaultScanLimits, encodeGreyRaster, processScan } from "@/lib/scans";
import { mirrorSvg, motifSvg, renderScan, type ScanStyle } from "./scan-art";
import { demoUsers } from "./users";
import { scanKeys, scanRow } from "@/lib/data/scans/rows";

// Demo scans: invented motif artwork (scripts/seed/scan-art.ts) rendered at a known DPI, run through the same
// pipeline as an upload (lib/scans), stored in the object store and recorded like a keeper's upload. A mirror
// twin gets its partner's motif mirrored, so "stamps that look like this one" finds the pair.

/** A stable seed from a stamp code, so a stamp always gets the same motif. */
function seedOf(code: string): number {
  let h = 2166136261;
  for (const c of code) h = Math.imul(h ^ c.charCodeAt(0), 16777619) >>> 0;
  return h;
}

export interface SeedScansOptions {
  /** How many stamps get scans (default 30, the first by code). */
  stamps?: number;
  /** Only these stamps (for tests); default the first `stamps` by code. */
  codes?: string[];
  /** Resolution of the rendered scans (default 100 DPI: a 200 mm stamp is 787 px). */
  dpi?: number;
}

/**
 * Adds scans to demo stamps that have none: a wax print for each, and a face photo for every third. Idempotent
 * (stamps with scans are skipped). Answers how many scans were added.
 */
export async function seedScans(db: Database, store: ObjectStore, options: SeedScansOptions = {}): Promise<number> {
  const dpi = options.dpi ?? 100;
  await store.ensureBucket();
  const keeperEmail = demoUsers.find((u) => u.role === "keeper")!.email;
  const [keeper] = await db.select({ id: users.id, name: users.name }).from(users).where(eq(users.email, keeperEmail)).limit(1);
  const all = await db
    .select({ id: stamps.id, code: stamps.code, widthMm: stamps.widthMm, heightMm: stamps.heightMm, mirrored: stamps.mirrored, twinId: stamps.twinId })
    .from(stamps)
    .where(options.codes ? inArray(stamps.code, options.codes) : undefined)
    .orderBy(asc(stamps.code))
    .limit(options.stamps ?? 30);
  if (all.length === 0) return 0;
  const scanned = new Set((await db.selectDistinct({ stampId: stampScans.stampId }).from(stampScans).where(inArray(stampScans.stampId, all.map((s) => s.id)))).map((r) => r.stampId));
  const twinIds = all.filter((s) => s.twinId).map((s) => s.twinId!);
  const twinCodes = new Map(twinIds.length ? (await db.select({ id: stamps.id, code: stamps.code }).from(stamps).where(inArray(stamps.id, twinIds))).map((r) => [r.id, r.code]) : []);

  let added = 0;
  for (const [index, stamp] of all.entries()) {
    if (scanned.has(stamp.id)) continue;
    // A mirrored twin carries its partner's motif, mirrored: the back face of the same design.
    const motifCode = stamp.mirrored && stamp.twinId ? (twinCodes.get(stamp.twinId) ?? stamp.code) : stamp.code;
    const styles: ScanStyle[] = index % 3 === 0 ? ["print", "face"] : ["print"];
    for (const style of styles) {
      let svg = motifSvg({ seed: seedOf(motifCode), widthMm: stamp.widthMm, heightMm: stamp.heightMm, style });
      if (stamp.mirrored) svg = mirrorSvg(svg, stamp.widthMm);
      const bytes = await renderScan(svg, dpi, { format: style === "print" ? "png" : "jpeg" });
      const polarity = style === "print" ? "darkIsWax" : "lightIsWax";
      const fileName = `${stamp.code.toLowerCase()}-${style}.${style === "print" ? "png" : "jpg"}`;
      const processed = await processScan(bytes, { ...defaultScanLimits, fileName, polarity });
      const root = newObjectKey(`scans/${stamp.id}`);
      const [thumb, large] = [processed.thumbnails[0], processed.thumbnails[processed.thumbnails.length - 1]];
      const keys = scanKeys(root);
      await Promise.all([
        store.putObject(keys.objectKey, processed.original.bytes, { contentType: processed.original.contentType }),
        store.putObject(keys.thumbKey, thumb.bytes, { contentType: "image/webp" }),
        store.putObject(keys.largeKey, large.bytes, { contentType: "image/webp" }),
        store.putObject(keys.rasterKey, await encodeGreyRaster(processed.analysis), { contentType: "image/png" }),
      ]);
      await db.transaction(async (tx) => {
        const [row] = await tx
          .insert(stampScans)
          .values(scanRow({ stampId: stamp.id, kind: style, fileName, processed, keys, polarity, coverage: processed.coverage, uploader: { id: keeper?.id ?? null, name: keeper?.name ?? "Demo data" } }))
          .returning({ id: stampScans.id });
        await tx.insert(stampEvents).values({
          stampId: stamp.id,
          kind: "scanned",
          actorId: keeper?.id ?? null,
          actorName: keeper?.name ?? "Demo data",
          toValue: style,
          note: fileName,
          details: { scanId: row.id, kind: style, fileName, dpi: processed.dpi, coverageRatio: processed.coverage.ratio },
        });
      });
      added++;
    }
  }
  return added;
}
