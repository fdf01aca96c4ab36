import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import { roles } from "@/lib/permissions";
import { mirrorSvg, motifSvg, renderScan } from "@/scripts/seed/scan-art";
import { CLOSE_DISTANCE } from "@/lib/scans";
import { createUser } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn, type Session } from "../helpers/http";
import { uploadScan } from "../helpers/scan-upload";
import { createStampRow, uniquePrefix } from "../helpers/stamps";

// POST /api/v1/similar over HTTP: pictures against the stored signatures of uploaded scans.
const prefix = uniquePrefix("SM");
let keeper: Session;
const sessions: Record<string, Session> = {};

beforeAll(async () => {
  testEnv();
  for (const role of roles) {
    const u = await createUser(role);
    sessions[role] = (await signIn(u.email, u.password))!;
  }
  keeper = sessions.keeper;
});

const upload = (code: string, bytes: Buffer, kind: "print" | "face" = "print") => uploadScan(keeper, code, bytes, kind);

const search = (bytes: Uint8Array, session: Session, query = "", contentType = "image/png") =>
  api("POST", `/api/v1/similar${query}`, { session, rawBody: bytes, headers: { "content-type": contentType } });

describe("search by picture", () => {
  // A front and its back-face twin (the front's art mirrored), each with a wax print on record.
  const seed = 777_001;
  const size = { widthMm: 200, heightMm: 200 };
  const front = motifSvg({ seed, ...size, style: "print", family: "lotus" });
  const codes = { front: `${prefix}-FRONT`, twin: `${prefix}-TWIN` };

  beforeAll(async () => {
    await createStampRow({ code: codes.front, ...size });
    await createStampRow({ code: codes.twin, ...size, mirrored: true });
    await upload(codes.front, await renderScan(front, 100));
    await upload(codes.twin, await renderScan(mirrorSvg(front, size.widthMm), 100));
  });

  it("answers every role with matches, the stamp itself first for a rescan", async () => {
    const rescan = await renderScan(front, 75, { format: "jpeg", grain: 0.6 });
    for (const role of roles) {
      const res = await search(rescan, sessions[role], "", "image/jpeg");
      expect(res.status, role).toBe(200);
      expect(res.body.matches[0]).toMatchObject({ stampCode: codes.front, mirrored: false, motifId: null });
      expect(res.body.matches[0].distance).toBeLessThanOrEqual(CLOSE_DISTANCE);
    }
  });

  it("puts the twin first for a mirrored copy, and calls the front a mirror", async () => {
    const mirrored = await sharp(await renderScan(front, 100)).flop().webp().toBuffer();
    const res = await search(mirrored, keeper, "?kind=print", "image/webp");
    expect(res.status).toBe(200);
    const [first, second] = res.body.matches.filter((m: { stampCode: string }) => Object.values(codes).includes(m.stampCode));
    expect(first).toMatchObject({ stampCode: codes.twin, mirrored: false });
    expect(second).toMatchObject({ stampCode: codes.front, mirrored: true });
  });

  it("takes a face photo (light on dark, the print's mirror image) for its print", async () => {
    const face = await renderScan(motifSvg({ seed, ...size, style: "face", family: "lotus" }), 90, { format: "jpeg" });
    const res = await search(face, keeper, "?kind=face", "image/jpeg");
    expect(res.status).toBe(200);
    expect(res.body.matches[0]).toMatchObject({ stampCode: codes.front, mirrored: false });
  });

  it("refuses what is not a picture, a TIFF, an unknown kind and no session, with JSON errors", async () => {
    const text = await search(new TextEncoder().encode("hello"), keeper, "", "text/plain");
    expect(text.status).toBe(415);
    expect(text.body.error.code).toBe("notAnImage");
    const tiff = await search(await sharp(await renderScan(front, 40)).tiff().toBuffer(), keeper, "", "image/tiff");
    expect(tiff.status).toBe(415);
    expect(tiff.body.error.code).toBe("unsupportedType");
    const empty = await search(new Uint8Array(0), keeper);
    expect(empty.status).toBe(400);
    const kind = await search(await renderScan(front, 40), keeper, "?kind=photo");
    expect(kind.status).toBe(400);
    expect(kind.body.error.fields.kind).toBeTruthy();
    const anonymous = await api("POST", "/api/v1/similar", { rawBody: await renderScan(front, 40), headers: { "content-type": "image/png" } });
    expect(anonymous.status).toBe(401);
  });

  it("refuses a body over the scan limit with 413", async () => {
    const big = new Uint8Array(Number(process.env.SCAN_MAX_BYTES) + 1024);
    big.set([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    const res = await search(big, keeper);
    expect(res.status).toBe(413);
  });
});
