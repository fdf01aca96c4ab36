// Pictures over HTTP (a new-stamp request's sketch, a finding's photo) and the object store's keys, for the
// integration tests of the picture store (lib/data/pictures.ts).
import { ListObjectsV2Command } from "@aws-sdk/client-s3";
import sharp from "sharp";
import { objectStore } from "@/lib/s3";
import { testEnv } from "./env";
import type { Session } from "./http";

/** Every object key in the bucket under a prefix. */
export async function keysUnder(keyPrefix: string): Promise<string[]> {
  const store = objectStore();
  const out = await store.client.send(new ListObjectsV2Command({ Bucket: store.bucket, Prefix: keyPrefix }));
  return (out.Contents ?? []).map((o) => o.Key!);
}

/** PUTs a picture as the body; answers status and the parsed JSON. */
export async function putPicture(session: Session, path: string, bytes: Uint8Array, options: { fileName?: string; contentType?: string } = {}) {
  const url = new URL(path, testEnv().appUrl);
  if (options.fileName !== undefined) url.searchParams.set("fileName", options.fileName);
  const response = await fetch(url, { method: "PUT", headers: { cookie: session.cookie, accept: "application/json", "content-type": options.contentType ?? "application/octet-stream" }, body: new Uint8Array(bytes) });
  const text = await response.text();
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- tests read whatever the API answered
  let body: any = null;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    body = { raw: text };
  }
  return { status: response.status, body };
}

/** GETs a picture: status, content type and bytes. */
export async function getPicture(session: Session, path: string) {
  const response = await fetch(new URL(path, testEnv().appUrl), { headers: { cookie: session.cookie } });
  return { status: response.status, contentType: response.headers.get("content-type"), bytes: Buffer.from(await response.arrayBuffer()) };
}

/** A 240 × 160 JPEG of a drawn motif with EXIF and a comment, which the store must strip. */
export async function sketchJpeg(): Promise<Buffer> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="240" height="160"><rect width="240" height="160" fill="#f6f1e7"/><circle cx="120" cy="80" r="52" fill="none" stroke="#3b2a1a" stroke-width="9"/><path d="M70 80 L170 80 M120 30 L120 130" stroke="#3b2a1a" stroke-width="7"/></svg>`;
  return sharp(Buffer.from(svg))
    .jpeg({ quality: 90 })
    .withMetadata({ exif: { IFD0: { Artist: "Someone Invented", Copyright: "secret place" } } })
    .toBuffer();
}

/** A 200 × 200 PNG. */
export async function sketchPng(): Promise<Buffer> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="200" height="200"><rect width="200" height="200" fill="#ffffff"/><rect x="40" y="40" width="120" height="120" fill="#1c1917"/></svg>`;
  return sharp(Buffer.from(svg)).png().toBuffer();
}
