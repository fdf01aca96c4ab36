import "server-only";
import { desc, eq } from "drizzle-orm";
import { db } from "@/db";
import { stampScans } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { downloadFileName, scanTypeOfContent } from "@/lib/scans";
import { getObjectStream } from "@/lib/s3";
import { type ScanDto } from "@/lib/contracts/scans";
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
