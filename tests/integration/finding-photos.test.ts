import { eq } from "drizzle-orm";
import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import { runEvents, runFindings } from "@/db/schema";
import { runUrls } from "@/lib/contracts/runs";
import { scanRejectedStatus } from "@/lib/errors";
import { can, roles, type Role } from "@/lib/permissions";
import type { ScanRejectedCode } from "@/lib/scans";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { hostileFiles, hostileLimits, type HostileFile } from "../helpers/hostile-files";
import { api, signIn, type Session } from "../helpers/http";
import { getPicture, keysUnder, putPicture, sketchJpeg, sketchPng } from "../helpers/pictures";
import { createStampRow, uniquePrefix } from "../helpers/stamps";

// A run finding's photo through the picture store: PUT the picture as the body (who records findings), GET it or
// its WebP thumbnail (everyone), the finding must be the run's, a history row, metadata stripped, and every hostile
// file of the scan tests refused with a 4xx and nothing stored.
const prefix = uniquePrefix("FP");
const sessions = {} as Record<Role, Session>;
let runId: string;
let otherRunId: string;
const today = new Date().toISOString().slice(0, 10);

beforeAll(async () => {
  testEnv();
  for (const role of roles) {
    const u = await createUser(role);
    sessions[role] = (await signIn(u.email, u.password))!;
  }
  await createStampRow({ code: `${prefix}-M`, widthMm: 150, heightMm: 150 });
  const motif = await api("POST", "/api/v1/motifs", {
    session: sessions.designer,
    body: { name: `${prefix} Photo motif`, stamps: [{ code: `${prefix}-M`, role: "main" }], colourways: [{ name: "Plain", colours: [{ name: "Soga", swatch: "#6b4423" }] }] },
  });
  expect(motif.status, JSON.stringify(motif.body)).toBe(201);
  const body = (name: string) => ({ name: `${prefix} ${name}`, motifId: motif.body.motif.id, colourwayId: motif.body.motif.colourways[0].id, cloth: "mori 106", metres: 10 });
  const run = await api("POST", "/api/v1/runs", { session: sessions.planner, body: body("run") });
  expect(run.status, JSON.stringify(run.body)).toBe(201);
  runId = run.body.run.id;
  otherRunId = (await api("POST", "/api/v1/runs", { session: sessions.planner, body: body("other") })).body.run.id;
});

async function finding(run = runId) {
  const res = await api("POST", `/api/v1/runs/${run}/findings`, { session: sessions.keeper, body: { foundOn: today, kind: "seeped", location: "piece 2" } });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.finding as { id: string; photoKey: string | null };
}

const photoKeys = (findingId: string, run = runId) => keysUnder(`pictures/findings/${run}/${findingId}/`);
const rowOf = async (id: string) => (await db().select().from(runFindings).where(eq(runFindings.id, id)))[0];
const expectedFor = (file: HostileFile): ScanRejectedCode => (file.claimedType === "image/tiff" ? "unsupportedType" : file.expected);

describe("a finding's photo", () => {
  it("is stored without its metadata on the finding, with a history row, and read back as original and WebP thumbnail", async () => {
    const f = await finding();
    const put = await putPicture(sessions.waxmaster, runUrls.findingPhoto(runId, f.id), await sketchJpeg(), { fileName: "seep.jpg" });
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    expect(put.body.finding.id).toBe(f.id);
    expect(put.body.finding.photoKey).toMatch(new RegExp(`^pictures/findings/${runId}/${f.id}/`));
    expect(await photoKeys(f.id)).toHaveLength(2);
    const events = await db().select().from(runEvents).where(eq(runEvents.runId, runId));
    expect(events.some((e) => e.kind === "finding" && (e.details as { findingId?: string; photo?: boolean } | null)?.photo === true && (e.details as { findingId: string }).findingId === f.id)).toBe(true);

    const original = await getPicture(sessions.designer, runUrls.findingPhoto(runId, f.id));
    expect(original.status).toBe(200);
    expect(original.contentType).toBe("image/jpeg");
    expect((await sharp(original.bytes).metadata()).exif).toBeUndefined();
    const thumb = await getPicture(sessions.designer, runUrls.findingPhoto(runId, f.id, "thumb"));
    expect(thumb.status).toBe(200);
    expect(thumb.contentType).toBe("image/webp");

    const listed = (await api("GET", `/api/v1/runs/${runId}/findings`, { session: sessions.designer })).body.findings as { id: string; photoKey: string | null }[];
    expect(listed.find((x) => x.id === f.id)?.photoKey).toBe(put.body.finding.photoKey);

    // A replacement takes the old photo's objects away.
    const again = await putPicture(sessions.keeper, runUrls.findingPhoto(runId, f.id), await sketchPng());
    expect(again.status).toBe(200);
    const now = await photoKeys(f.id);
    expect(now).toHaveLength(2);
    expect(now.every((k) => k.startsWith(`${again.body.finding.photoKey}/`))).toBe(true);
  });

  it("the finding must belong to the run: another run's finding or an unknown one is 404, nothing stored", async () => {
    const f = await finding(otherRunId);
    const png = await sketchPng();
    expect((await putPicture(sessions.keeper, runUrls.findingPhoto(runId, f.id), png)).status).toBe(404);
    expect((await putPicture(sessions.keeper, runUrls.findingPhoto(runId, crypto.randomUUID()), png)).status).toBe(404);
    expect((await putPicture(sessions.keeper, runUrls.findingPhoto(crypto.randomUUID(), f.id), png)).status).toBe(404);
    expect(await keysUnder(`pictures/findings/${runId}/${f.id}/`)).toEqual([]);
    expect(await photoKeys(f.id, otherRunId)).toEqual([]);
    expect((await getPicture(sessions.keeper, runUrls.findingPhoto(otherRunId, f.id))).status).toBe(404);
  });

  it("a photo key typed into the finding itself is never served", async () => {
    const res = await api("POST", `/api/v1/runs/${runId}/findings`, { session: sessions.keeper, body: { foundOn: today, kind: "thin", photoKey: "scans/some-stamp/some-scan/original" } });
    expect(res.status).toBe(201);
    expect((await getPicture(sessions.keeper, runUrls.findingPhoto(runId, res.body.finding.id))).status).toBe(404);
  });

  it.each(roles)("%s: attaches only with runs:recordFindings (else 403, nothing stored); every role reads", async (role) => {
    const f = await finding();
    const put = await putPicture(sessions[role], runUrls.findingPhoto(runId, f.id), await sketchPng());
    if (!can(role, "runs:recordFindings")) {
      expect(put.status).toBe(403);
      expect(await photoKeys(f.id)).toEqual([]);
      expect((await rowOf(f.id)).photoKey).toBeNull();
      return;
    }
    expect(put.status).toBe(200);
    for (const reader of roles) expect((await getPicture(sessions[reader], runUrls.findingPhoto(runId, f.id, "thumb"))).status).toBe(can(reader, "data:read") ? 200 : 403);
  });

  it("refuses every hostile file of the scan tests with a 4xx and a clear message, and stores nothing", async () => {
    const files = await hostileFiles(hostileLimits);
    expect(files.length).toBeGreaterThanOrEqual(30);
    const f = await finding();
    for (const file of files) {
      const res = await putPicture(sessions.keeper, runUrls.findingPhoto(runId, f.id), file.bytes, { fileName: file.name, contentType: file.claimedType });
      const expected = expectedFor(file);
      expect(res.status, `${file.label}: ${JSON.stringify(res.body)}`).toBe(scanRejectedStatus[expected]);
      expect(res.status).toBeLessThan(500);
      const damaged = ["truncated", "corrupt"];
      if (damaged.includes(expected)) expect(damaged, file.label).toContain(res.body.error.code);
      else expect(res.body.error.code, file.label).toBe(expected);
      expect(res.body.error.message, file.label).toMatch(/\w{3,}.*\./);
    }
    expect(await photoKeys(f.id)).toEqual([]);
    expect((await rowOf(f.id)).photoKey).toBeNull();
  });
});
