import { expect } from "vitest";
import { api, type Session } from "./http";

/** The browser's upload flow over HTTP (presign, PUT to the store, complete); expects each step to succeed. */
export async function uploadScan(session: Session, code: string, bytes: Buffer, kind: "print" | "face" = "print") {
  const fileName = kind === "print" ? "print.png" : "face.jpg";
  const presign = await api("POST", `/api/v1/stamps/${code}/scans/uploads`, { session, body: { fileName, sizeBytes: bytes.length } });
  expect(presign.status).toBe(201);
  const { url, method, headers } = presign.body.upload;
  expect((await fetch(url, { method, headers, body: new Uint8Array(bytes) })).ok).toBe(true);
  const done = await api("POST", `/api/v1/stamps/${code}/scans`, { session, body: { uploadKey: presign.body.upload.key, fileName, kind } });
  expect(done.status, JSON.stringify(done.body)).toBe(201);
  return done.body;
}
