import "server-only";
import { objectResponse } from "@/lib/api/object-response";
import { AppError } from "@/lib/errors";
import { pictureTypes, processPicture, scanContentTypes, scanLimiter } from "@/lib/scans";
import { deleteObjects, getObjectStream, newObjectKey, putObject } from "@/lib/s3";
import { scanLimits } from "./scans/shared";

// The one store for uploaded pictures that are not stamp scans (a new-stamp request's sketch, a run finding's
// photo). Bytes are checked exactly like a scan upload (lib/scans: magic bytes, container, pixel limit before
// decoding; PNG, JPEG or WebP), refusals are ScanRejected (4xx through the one error pipeline), and nothing is
// stored until the picture passed. A picture is two objects under one key: `<key>/original` (metadata stripped)
// and `<key>/thumb` (WebP). Rows keep the key; the key is made here, never typed by anyone.

export type PictureVariant = "original" | "thumb";
export const pictureVariants = ["original", "thumb"] as const satisfies readonly PictureVariant[];

/** Where each kind of picture lives; a key read back must start with its kind's prefix (and the owner's id). */
export type PictureKind = "sketches" | "findings";

export interface StoredPicture {
  /** The picture's key: its objects are `<key>/original` and `<key>/thumb`. */
  key: string;
  /** The original's media type (image/png, image/jpeg or image/webp). */
  contentType: string;
  widthPx: number;
  heightPx: number;
  sizeBytes: number;
}

const allowedTypes = new Set<string>(pictureTypes.map((t) => scanContentTypes[t]));

/** The object of one variant of a stored picture. */
export const pictureObjectKey = (key: string, variant: PictureVariant) => `${key}/${variant}`;

/** The prefix of one owner's pictures of a kind: `pictures/<kind>/<owner id>`. */
export const picturePrefix = (kind: PictureKind, ownerId: string) => `pictures/${kind}/${ownerId.toLowerCase()}`;

/**
 * Checks the bytes (inside the scan limiter, with this server's scan limits) and stores the original and its
 * thumbnail under a fresh key below `picturePrefix(kind, ownerId)`. Throws ScanRejected for a refused picture,
 * with nothing stored; when the second write fails the first is removed again.
 */
export async function storePicture(kind: PictureKind, ownerId: string, bytes: Uint8Array, fileName?: string): Promise<StoredPicture> {
  const limits = scanLimits();
  const data = Buffer.isBuffer(bytes) ? bytes : Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const picture = await scanLimiter.run(() => processPicture(data, { ...limits, ...(fileName !== undefined ? { fileName } : {}) }));
  const key = newObjectKey(picturePrefix(kind, ownerId));
  try {
    await Promise.all([
      putObject(pictureObjectKey(key, "original"), picture.original.bytes, { contentType: picture.original.contentType }),
      putObject(pictureObjectKey(key, "thumb"), picture.thumb.bytes, { contentType: "image/webp" }),
    ]);
  } catch (error) {
    await deletePictureQuietly(key);
    throw error;
  }
  return { key, contentType: picture.original.contentType, widthPx: picture.widthPx, heightPx: picture.heightPx, sizeBytes: picture.original.bytes.length };
}

/**
 * One variant of a stored picture as a streamed answer. The key must lie below the owner's prefix (a key that
 * came from elsewhere is answered as not found), the thumbnail is WebP, the original its own stored type.
 */
export async function pictureResponse(
  kind: PictureKind,
  ownerId: string,
  key: string,
  variant: PictureVariant,
  options: { contentType?: string | null } = {},
): Promise<Response> {
  if (!key.startsWith(`${picturePrefix(kind, ownerId)}/`)) throw new AppError("notFound");
  const stream = await getObjectStream(pictureObjectKey(key, variant));
  if (!stream) throw new AppError("notFound");
  const stored = variant === "thumb" ? "image/webp" : (options.contentType ?? stream.contentType ?? "");
  // Only the types the store accepts are ever answered as images; anything else downloads as bytes.
  const contentType = allowedTypes.has(stored) || stored === "image/webp" ? stored : "application/octet-stream";
  return objectResponse({ body: stream.body, sizeBytes: stream.sizeBytes, contentType });
}

/** Deletes both objects of a picture (missing ones are no error). */
export async function deletePicture(key: string): Promise<void> {
  await deleteObjects(pictureVariants.map((v) => pictureObjectKey(key, v)));
}

/** Deletes a picture without letting a store hiccup hide the error (or the answer) that got us here. */
export async function deletePictureQuietly(key: string | null | undefined): Promise<void> {
  if (!key) return;
  try {
    await deletePicture(key);
  } catch (error) {
    console.error("could not delete picture objects", key, error);
  }
}
