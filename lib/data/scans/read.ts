import "server-only";
import { desc, eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import { stampScans, stamps } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { downloadFileName, scanTypeOfContent } from "@/lib/scans";
import { getObjectStream } from "@/lib/s3";
import { scanUrls, type ScanDto } from "@/lib/contracts/scans";
import { findScan, findStamp, toDto } from "./shared";

// Reading scans: the list, one scan, and its pictures streamed from the object store.

export async function listScans(actor: Actor, code: string): Promise<ScanDto[]> {
  assertCan(actor, "data:read");
  const stamp = await findStamp(code);
  const rows = await db.select().from(stampScans).where(eq(stampScans.stampId, stamp.id)).orderBy(desc(stampScans.createdAt), desc(stampScans.id));
  return rows.map((r) => toDto(r, stamp));
}

export async function getScan(actor: Actor, code: string, id: string): Promise<ScanDto> {
  assertCan(actor, "data:read");
  const { stamp, scan } = await findScan(code, id);
  return toDto(scan, stamp);
}

export interface ObjectStream {
  body: ReadableStream<Uint8Array>;
  sizeBytes: number | null;
  contentType: string;
  fileName: string;
}


/** A thumbnail (256 px) or the large view (1024 px), WebP. */
export async function scanImage(actor: Actor, code: string, id: string, size: "thumb" | "large"): Promise<ObjectStream> {
  assertCan(actor, "data:read");
  const { scan } = await findScan(code, id);
  const stream = await getObjectStream(size === "thumb" ? scan.thumbKey : scan.largeKey);
  if (!stream) throw new AppError("notFound");
  return { ...stream, contentType: "image/webp", fileName: `${scan.id}-${size}.webp` };
}

/** The stored original (metadata stripped), with a safe download name and the type of its content. */
export async function scanOriginal(actor: Actor, code: string, id: string): Promise<ObjectStream> {
  assertCan(actor, "data:read");
  const { stamp, scan } = await findScan(code, id);
  const stream = await getObjectStream(scan.objectKey);
  if (!stream) throw new AppError("notFound");
  const type = scanTypeOfContent(scan.contentType);
  return { ...stream, contentType: scan.contentType, fileName: downloadFileName(scan.fileName, type, `${stamp.code}-${scan.kind}`) };
}

/** The newest scan's thumbnail of each stamp named, by code (the shelf's picture view). */
export async function newestThumbs(actor: Actor, codes: string[]): Promise<Record<string, string>> {
  assertCan(actor, "data:read");
  if (codes.length === 0) return {};
  const rows = await db
    .selectDistinctOn([stampScans.stampId], { code: stamps.code, id: stampScans.id })
    .from(stampScans)
    .innerJoin(stamps, eq(stamps.id, stampScans.stampId))
    .where(inArray(stamps.code, codes))
    .orderBy(stampScans.stampId, desc(stampScans.createdAt));
  return Object.fromEntries(rows.map((r) => [r.code, scanUrls.image(r.code, r.id, "thumb")]));
}
