import { eq } from "drizzle-orm";
import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import { newStampRequests } from "@/db/schema";
import { scanRejectedStatus } from "@/lib/errors";
import { can, roles, type Role } from "@/lib/permissions";
import type { ScanRejectedCode } from "@/lib/scans";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { hostileFiles, hostileLimits, type HostileFile } from "../helpers/hostile-files";
import { api, signIn, type Session } from "../helpers/http";
import { getPicture, keysUnder, putPicture, sketchJpeg, sketchPng } from "../helpers/pictures";

// Sketches on new-stamp requests through the picture store: PUT the picture as the body, GET it back streamed (or
// its WebP thumbnail), who may do which, metadata stripped, and every hostile file of the scan tests refused with
// a 4xx and nothing stored (the store takes PNG, JPEG and WebP only, so a TIFF is refused as unsupported).
const sessions = {} as Record<Role, Session>;

beforeAll(async () => {
  testEnv();
  for (const role of roles) {
    const u = await createUser(role);
    sessions[role] = (await signIn(u.email, u.password))!;
  }
});

async function openRequest(note = "sketch test") {
  const res = await api("POST", "/api/v1/new-stamp-requests", { session: sessions.designer, body: { widthMm: 90, heightMm: 60, note } });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.request as { id: string; version: number; sketch: unknown };
}

const sketchUrl = (id: string, variant?: "thumb") => `/api/v1/new-stamp-requests/${id}/sketch${variant ? "?variant=thumb" : ""}`;
const sketchKeys = (id: string) => keysUnder(`pictures/sketches/${id}/`);
const rowOf = async (id: string) => (await db().select().from(newStampRequests).where(eq(newStampRequests.id, id)))[0];

/** What the picture store must answer: the scan refusal, except that it takes no TIFF at all. */
const expectedFor = (file: HostileFile): ScanRejectedCode => (file.claimedType === "image/tiff" ? "unsupportedType" : file.expected);

describe("a sketch on a new-stamp request", () => {
  it("is stored without its metadata, read back streamed with its type, and as a WebP thumbnail; the request lists it", async () => {
    const request = await openRequest();
    expect(request.sketch).toBeNull();
    const jpeg = await sketchJpeg();
    expect((await sharp(jpeg).metadata()).exif).toBeDefined();
    const put = await putPicture(sessions.designer, sketchUrl(request.id), jpeg, { fileName: "lotus sketch.jpg" });
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    expect(put.body.request).toMatchObject({
      id: request.id,
      version: request.version + 1,
      sketch: { fileName: "lotus sketch.jpg", contentType: "image/jpeg", urls: { original: sketchUrl(request.id), thumb: sketchUrl(request.id, "thumb") } },
    });
    expect(await sketchKeys(request.id)).toHaveLength(2);

    const original = await getPicture(sessions.waxmaster, sketchUrl(request.id));
    expect(original.status).toBe(200);
    expect(original.contentType).toBe("image/jpeg");
    const meta = await sharp(original.bytes).metadata();
    expect([meta.width, meta.height]).toEqual([240, 160]);
    expect(meta.exif).toBeUndefined();
    expect(original.bytes.includes(Buffer.from("secret place"))).toBe(false);

    const thumb = await getPicture(sessions.designer, sketchUrl(request.id, "thumb"));
    expect(thumb.status).toBe(200);
    expect(thumb.contentType).toBe("image/webp");
    expect((await sharp(thumb.bytes).metadata()).format).toBe("webp");

    const listed = (await api("GET", "/api/v1/new-stamp-requests", { session: sessions.keeper })).body.requests as { id: string; sketch: { contentType: string } | null }[];
    expect(listed.find((r) => r.id === request.id)?.sketch?.contentType).toBe("image/jpeg");
  });

  it("a second sketch replaces the first, whose objects are gone", async () => {
    const request = await openRequest();
    await putPicture(sessions.designer, sketchUrl(request.id), await sketchJpeg());
    const first = await sketchKeys(request.id);
    const second = await putPicture(sessions.planner, sketchUrl(request.id), await sketchPng(), { fileName: "square.png" });
    expect(second.status).toBe(200);
    expect(second.body.request.sketch.contentType).toBe("image/png");
    const now = await sketchKeys(request.id);
    expect(now).toHaveLength(2);
    expect(now.some((k) => first.includes(k))).toBe(false);
    expect((await getPicture(sessions.designer, sketchUrl(request.id))).contentType).toBe("image/png");
  });

  it.each(roles)("%s: attaches only with stamps:requestNew (else 403, nothing stored); every role reads", async (role) => {
    const request = await openRequest(`by ${role}`);
    const put = await putPicture(sessions[role], sketchUrl(request.id), await sketchPng());
    if (!can(role, "stamps:requestNew")) {
      expect(put.status).toBe(403);
      expect(put.body.error.code).toBe("forbidden");
      expect(await sketchKeys(request.id)).toEqual([]);
      expect((await rowOf(request.id)).sketchKey).toBeNull();
      expect((await getPicture(sessions[role], sketchUrl(request.id))).status).toBe(404);
      return;
    }
    expect(put.status).toBe(200);
    expect((await getPicture(sessions[role], sketchUrl(request.id, "thumb"))).status).toBe(200);
  });

  it("refuses an unknown request (404), an answered one (409), a bad variant (400) and a reader without a session (401)", async () => {
    const png = await sketchPng();
    expect((await putPicture(sessions.designer, sketchUrl(crypto.randomUUID()), png)).status).toBe(404);
    const request = await openRequest();
    const declined = await api("POST", `/api/v1/new-stamp-requests/${request.id}/decline`, { session: sessions.keeper, body: { version: request.version, reason: "We have one" } });
    expect(declined.status).toBe(200);
    const late = await putPicture(sessions.designer, sketchUrl(request.id), png);
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe("requestAnswered");
    expect(await sketchKeys(request.id)).toEqual([]);
    expect((await api("GET", `${sketchUrl(request.id)}?variant=large`, { session: sessions.designer })).status).toBe(400);
    expect((await fetch(new URL(sketchUrl(request.id), testEnv().appUrl))).status).toBe(401);
  });

  it("refuses every hostile file of the scan tests with a 4xx and a clear message, and stores nothing", async () => {
    const files = await hostileFiles(hostileLimits);
    expect(files.length).toBeGreaterThanOrEqual(30);
    const request = await openRequest("hostile");
    for (const file of files) {
      const res = await putPicture(sessions.designer, sketchUrl(request.id), file.bytes, { fileName: file.name, contentType: file.claimedType });
      const expected = expectedFor(file);
      expect(res.status, `${file.label}: ${JSON.stringify(res.body)}`).toBe(scanRejectedStatus[expected]);
      expect(res.status).toBeLessThan(500);
      // The scrambled files may end early (truncated) or break inside (corrupt): both are "damaged", 422.
      const damaged = ["truncated", "corrupt"];
      if (damaged.includes(expected)) expect(damaged, file.label).toContain(res.body.error.code);
      else expect(res.body.error.code, file.label).toBe(expected);
      expect(res.body.error.message, file.label).toMatch(/\w{3,}.*\./);
    }
    expect(await sketchKeys(request.id)).toEqual([]);
    const row = await rowOf(request.id);
    expect([row.sketchKey, row.sketchType, row.sketchName, row.version]).toEqual([null, null, null, request.version]);
    expect((await api("GET", "/api/v1/me", { session: sessions.designer })).status).toBe(200);
  });
});
