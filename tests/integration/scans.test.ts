import { ListObjectsV2Command } from "@aws-sdk/client-s3";
import { and, count, eq, inArray } from "drizzle-orm";
import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import { seedScans } from "@/scripts/seed/scans";
import { stampEvents, stampScans, stamps, type Stamp } from "@/db/schema";
import { objectStore } from "@/lib/s3";
import { motifSvg, renderScan } from "@/scripts/seed/scan-art";
import { scanRejectedStatus } from "@/lib/errors";
import { CLOSE_DISTANCE } from "@/lib/scans";
import { createUser, db } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { hostileFiles, hostileLimits } from "../helpers/hostile-files";
import { api, signIn, type Session } from "../helpers/http";
import { shapeScan } from "../helpers/scan-images";
import { createStampRow, reloadStamp, uniquePrefix } from "../helpers/stamps";

// Stamp scans over HTTP against the test stack: presigned upload to the real object store fake, the app's checks,
// storage, serving, duplicates, the size check, coverage saved to the stamp and used by the layout engine, and
// at least 30 hostile files refused with nothing left behind.
const prefix = uniquePrefix("SC");
let keeper: Session;
let planner: Session;

beforeAll(async () => {
  testEnv();
  const k = await createUser("keeper");
  const p = await createUser("planner");
  keeper = (await signIn(k.email, k.password))!;
  planner = (await signIn(p.email, p.password))!;
});

/** Every object key in the bucket under a prefix. */
async function keysUnder(keyPrefix: string): Promise<string[]> {
  const store = objectStore();
  const out = await store.client.send(new ListObjectsV2Command({ Bucket: store.bucket, Prefix: keyPrefix }));
  return (out.Contents ?? []).map((o) => o.Key!);
}

const objectsOf = async (stamp: Stamp) => [...(await keysUnder(`scans/${stamp.id}/`)), ...(await keysUnder(`uploads/${stamp.id}/`))];
const scanRows = async (stamp: Stamp) => (await db().select({ n: count() }).from(stampScans).where(eq(stampScans.stampId, stamp.id)))[0].n;

interface UploadOptions {
  session?: Session;
  fileName?: string;
  kind?: "face" | "print";
  dpi?: number;
  /** Size claimed at the presign step (default the real size). */
  claimedBytes?: number;
}

/** The browser's flow: presign, PUT the bytes to the store, complete. Answers the first step that refused. */
async function upload(stamp: Stamp, bytes: Buffer, options: UploadOptions = {}) {
  const session = options.session ?? keeper;
  const fileName = options.fileName ?? "scan.png";
  const presign = await api("POST", `/api/v1/stamps/${stamp.code}/scans/uploads`, { session, body: { fileName, sizeBytes: options.claimedBytes ?? bytes.length } });
  if (presign.status !== 201) return { step: "presign" as const, ...presign };
  const { url, method, headers } = presign.body.upload;
  const put = await fetch(url, { method, headers, body: new Uint8Array(bytes) });
  if (!put.ok) return { step: "put" as const, status: put.status, body: { error: { code: "put", message: await put.text() } } };
  const complete = await api("POST", `/api/v1/stamps/${stamp.code}/scans`, {
    session,
    body: { uploadKey: presign.body.upload.key, fileName, kind: options.kind ?? "print", ...(options.dpi ? { dpi: options.dpi } : {}) },
  });
  return { step: "complete" as const, ...complete };
}

// A 100 mm square wax print at 254 DPI (1000 px): one dark disc of radius 30 mm on white.
const discPrint = () => shapeScan({ dpi: 254, sideMm: 100, body: `<circle cx="50" cy="50" r="30"/>`, ink: "#1c1917", ground: "#ffffff" });

describe("permissions", () => {
  it("a planner may read scans but gets 403 for presign, upload and delete, and nothing changes", async () => {
    const stamp = await createStampRow({ code: `${prefix}-PERM`, widthMm: 100, heightMm: 100 });
    const { png } = await discPrint();
    const refused = await api("POST", `/api/v1/stamps/${stamp.code}/scans/uploads`, { session: planner, body: { fileName: "scan.png", sizeBytes: png.length } });
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe("forbidden");

    const done = await upload(stamp, png);
    expect(done.status).toBe(201);
    const scanId = done.body.scan.id;
    expect((await api("GET", `/api/v1/stamps/${stamp.code}/scans`, { session: planner })).body.scans).toHaveLength(1);

    const complete = await api("POST", `/api/v1/stamps/${stamp.code}/scans`, { session: planner, body: { uploadKey: `uploads/${stamp.id}/${stamp.id}/${stamp.id}`, fileName: "x.png", kind: "print" } });
    expect(complete.status).toBe(403);
    const del = await api("DELETE", `/api/v1/stamps/${stamp.code}/scans/${scanId}`, { session: planner });
    expect(del.status).toBe(403);
    const save = await api("POST", `/api/v1/stamps/${stamp.code}/scans/${scanId}/coverage`, { session: planner, body: { polarity: "darkIsWax", threshold: 128 } });
    expect(save.status).toBe(403);
    expect(await scanRows(stamp)).toBe(1);
    expect((await reloadStamp(stamp.code))!.coverageRatio).toBeNull();
    expect(await keysUnder(`scans/${stamp.id}/`)).toHaveLength(4);
  });

  it("anyone signed out gets 401", async () => {
    const res = await api("GET", `/api/v1/stamps/${prefix}-PERM/scans`);
    expect(res.status).toBe(401);
  });
});

describe("upload, serve, delete", () => {
  it("stores a scan with its measurements, serves thumbnails and the original, and deletes every object", async () => {
    const stamp = await createStampRow({ code: `${prefix}-HAPPY`, widthMm: 100, heightMm: 100 });
    const { png } = await discPrint();
    const res = await upload(stamp, png, { fileName: "disc print.png" });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const scan = res.body.scan;
    expect(scan).toMatchObject({ kind: "print", fileName: "disc print.png", contentType: "image/png", widthPx: 1000, heightPx: 1000, dpi: 254, dpiSource: "file", polarity: "darkIsWax" });
    // 1000 px at 254 DPI = 1000 / 254 × 25.4 mm = 100 mm exactly (1 in = 25.4 mm, NIST SP 811).
    expect(scan.sizeMm.widthMm).toBeCloseTo(100, 6);
    expect(scan.sizeCheck.warn).toBe(false);
    // Disc of radius 30 mm in a 100 mm square: π·30² / 100² = 0.2827 (πr²); ±1 % for the anti-aliased edge.
    expect(scan.coverageRatio).toBeGreaterThan(0.2827 - 0.01);
    expect(scan.coverageRatio).toBeLessThan(0.2827 + 0.01);
    expect(scan.sha256).toMatch(/^[0-9a-f]{64}$/);

    expect(await keysUnder(`uploads/${stamp.id}/`)).toEqual([]);
    expect(await keysUnder(`scans/${stamp.id}/`)).toHaveLength(4);
    const events = await db().select().from(stampEvents).where(eq(stampEvents.stampId, stamp.id));
    expect(events.map((e) => e.kind)).toContain("scanned");

    const { appUrl } = testEnv();
    const get = (path: string) => fetch(`${appUrl}${path}`, { headers: { cookie: keeper.cookie } });
    const thumb = await get(scan.urls.thumb);
    expect(thumb.status).toBe(200);
    expect(thumb.headers.get("content-type")).toBe("image/webp");
    const thumbMeta = await sharp(Buffer.from(await thumb.arrayBuffer())).metadata();
    expect(thumbMeta.format).toBe("webp");
    expect(Math.max(thumbMeta.width!, thumbMeta.height!)).toBe(256);
    const large = await sharp(Buffer.from(await (await get(scan.urls.large)).arrayBuffer())).metadata();
    expect(large.width).toBe(1000); // never enlarged beyond the scan

    const download = await get(scan.urls.download);
    expect(download.status).toBe(200);
    expect(download.headers.get("content-type")).toBe("image/png");
    expect(download.headers.get("content-disposition")).toMatch(/^attachment; filename="disc print\.png"/);
    const original = Buffer.from(await download.arrayBuffer());
    expect((await sharp(original).metadata()).width).toBe(1000);

    const signedOut = await fetch(`${appUrl}${scan.urls.download}`);
    expect(signedOut.status).toBe(401);

    const del = await api("DELETE", `/api/v1/stamps/${stamp.code}/scans/${scan.id}`, { session: keeper });
    expect(del.status).toBe(204);
    expect(await scanRows(stamp)).toBe(0);
    expect(await objectsOf(stamp)).toEqual([]);
    expect((await api("GET", `/api/v1/stamps/${stamp.code}/scans/${scan.id}`, { session: keeper })).status).toBe(404);
  });

  it("recognises the same file uploaded twice for a stamp (409 naming the first), but not for another stamp", async () => {
    const stamp = await createStampRow({ code: `${prefix}-DUP`, widthMm: 100, heightMm: 100 });
    const other = await createStampRow({ code: `${prefix}-DUP2`, widthMm: 100, heightMm: 100 });
    const { png } = await discPrint();
    const first = await upload(stamp, png, { fileName: "first.png" });
    expect(first.status).toBe(201);
    const again = await upload(stamp, png, { fileName: "again.png" });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe("scanDuplicate");
    expect(again.body.error.message).toContain("first.png");
    expect(again.body.error.existing.id).toBe(first.body.scan.id);
    expect(await scanRows(stamp)).toBe(1);
    expect(await keysUnder(`uploads/${stamp.id}/`)).toEqual([]);
    expect(await keysUnder(`scans/${stamp.id}/`)).toHaveLength(4);
    expect((await upload(other, png)).status).toBe(201);
  });

  it("warns when the measured size differs from the record by more than 3 %, and uses the keeper's DPI", async () => {
    // 100 mm scan against a 96 mm record: +4.17 %; against 98 mm: +2.04 %.
    const off = await createStampRow({ code: `${prefix}-SIZE1`, widthMm: 96, heightMm: 96 });
    const near = await createStampRow({ code: `${prefix}-SIZE2`, widthMm: 98, heightMm: 98 });
    const { png } = await discPrint();
    const warned = await upload(off, png);
    expect(warned.body.scan.sizeCheck.warn).toBe(true);
    expect(warned.body.scan.sizeCheck.maxDeviationPct).toBeCloseTo(((100 - 96) / 96) * 100, 6);
    const fine = await upload(near, png);
    expect(fine.body.scan.sizeCheck.warn).toBe(false);

    // The keeper says 127 DPI: 1000 px are then 200 mm, far from the 98 mm record.
    const keeperDpi = await createStampRow({ code: `${prefix}-SIZE3`, widthMm: 98, heightMm: 98 });
    const entered = await upload(keeperDpi, png, { dpi: 127 });
    expect(entered.body.scan).toMatchObject({ dpi: 127, dpiSource: "keeper" });
    expect(entered.body.scan.sizeMm.widthMm).toBeCloseTo(200, 6);
    expect(entered.body.scan.sizeCheck.warn).toBe(true);
  });

  it("refuses an upload key that is not the keeper's own, and a DPI out of range", async () => {
    const stamp = await createStampRow({ code: `${prefix}-KEY`, widthMm: 100, heightMm: 100 });
    const forged = await api("POST", `/api/v1/stamps/${stamp.code}/scans`, { session: keeper, body: { uploadKey: "scans/../../etc/passwd", fileName: "a.png", kind: "print" } });
    expect(forged.status).toBe(400);
    expect(forged.body.error.fields.uploadKey).toBeDefined();
    const foreign = await api("POST", `/api/v1/stamps/${stamp.code}/scans`, {
      session: keeper,
      body: { uploadKey: `uploads/${stamp.id}/00000000-0000-4000-8000-000000000000/00000000-0000-4000-8000-000000000001`, fileName: "a.png", kind: "print" },
    });
    expect(foreign.status).toBe(409);
    expect(foreign.body.error.code).toBe("scanUploadMissing");
    const badDpi = await api("POST", `/api/v1/stamps/${stamp.code}/scans`, { session: keeper, body: { uploadKey: `uploads/${stamp.id}/${stamp.id}/${stamp.id}`, fileName: "a.png", kind: "print", dpi: 5 } });
    expect(badDpi.status).toBe(400);
    expect(badDpi.body.error.fields.dpi[0]).toMatch(/10 and 20000/);
  });
});

describe("coverage", () => {
  it("previews at a threshold, saves the ratio to the stamp, and the layout engine uses it for { code }", async () => {
    const stamp = await createStampRow({ code: `${prefix}-COV`, widthMm: 100, heightMm: 100 });
    const { png } = await discPrint();
    const scan = (await upload(stamp, png)).body.scan;

    const otsu = await api("GET", `/api/v1/stamps/${stamp.code}/scans/${scan.id}/coverage?polarity=darkIsWax`, { session: planner });
    expect(otsu.status).toBe(200);
    expect(otsu.body.coverage.ratio).toBeCloseTo(scan.coverageRatio, 6);
    // Threshold 255 counts every pixel as dark wax; wrong polarity at the Otsu threshold counts the ground instead.
    const all = await api("GET", `/api/v1/stamps/${stamp.code}/scans/${scan.id}/coverage?polarity=darkIsWax&threshold=255`, { session: planner });
    expect(all.body.coverage.ratio).toBe(1);
    const inverse = await api("GET", `/api/v1/stamps/${stamp.code}/scans/${scan.id}/coverage?polarity=lightIsWax&threshold=${otsu.body.coverage.threshold}`, { session: planner });
    expect(inverse.body.coverage.ratio).toBeCloseTo(1 - otsu.body.coverage.ratio, 6);
    const bad = await api("GET", `/api/v1/stamps/${stamp.code}/scans/${scan.id}/coverage?polarity=darkIsWax&threshold=300`, { session: planner });
    expect(bad.status).toBe(400);

    const { appUrl } = testEnv();
    const overlay = await fetch(`${appUrl}${scan.urls.overlay}?polarity=darkIsWax&threshold=128`, { headers: { cookie: planner.cookie } });
    expect(overlay.headers.get("content-type")).toBe("image/webp");
    expect((await sharp(Buffer.from(await overlay.arrayBuffer())).metadata()).format).toBe("webp");

    const before = (await reloadStamp(stamp.code))!;
    const saved = await api("POST", `/api/v1/stamps/${stamp.code}/scans/${scan.id}/coverage`, { session: keeper, body: { polarity: "darkIsWax", threshold: otsu.body.coverage.threshold } });
    expect(saved.status).toBe(200);
    const after = (await reloadStamp(stamp.code))!;
    expect(after.coverageRatio).toBeCloseTo(otsu.body.coverage.ratio, 4);
    expect(after.version).toBe(before.version + 1);
    const edits = await db().select().from(stampEvents).where(eq(stampEvents.stampId, stamp.id));
    expect(edits.some((e) => e.kind === "edited" && JSON.stringify(e.details).includes("coverageRatio"))).toBe(true);

    // 1000 mm band, 100 mm stamp, no gaps: 10 across × 10 rows per metre = 100 impressions of 0.01 m² each,
    // so the waxed area per metre is 100 × 0.01 m² × coverage (hand-worked; no overlaps in a straight layout).
    const layout = await api("POST", "/api/v1/layout", {
      session: planner,
      body: { cloth: { widthMm: 1000, lengthMm: 10_000, margins: { leftMm: 0, rightMm: 0 } }, stamp: { code: stamp.code }, gap: { xMm: 0, yMm: 0 }, arrangement: "straight", align: "left", edges: "whole" },
    });
    expect(layout.status, JSON.stringify(layout.body)).toBe(200);
    expect(layout.body.across).toBe(10);
    expect(layout.body.waxedAreaPerMetreM2).toBeCloseTo(1 * after.coverageRatio!, 4);
  });
});

describe("similar stamps", () => {
  it("finds a mirror twin by its mirrored hash and a near copy by its own", async () => {
    const body = `<path d="M10 10 H60 V25 H25 V90 H10 Z"/><circle cx="72" cy="70" r="14"/>`;
    const mirroredBody = `<g transform="translate(100 0) scale(-1 1)">${body}</g>`;
    const a = await createStampRow({ code: `${prefix}-SIMA`, widthMm: 100, heightMm: 100 });
    const twin = await createStampRow({ code: `${prefix}-SIMB`, widthMm: 100, heightMm: 100 });
    const scanA = await shapeScan({ dpi: 127, sideMm: 100, body, ink: "#111", ground: "#fff" });
    const scanB = await shapeScan({ dpi: 127, sideMm: 100, body: mirroredBody, ink: "#111", ground: "#fff" });
    expect((await upload(a, scanA.png)).status).toBe(201);
    expect((await upload(twin, scanB.png)).status).toBe(201);
    const res = await api("GET", `/api/v1/stamps/${a.code}/similar`, { session: planner });
    expect(res.status).toBe(200);
    const match = res.body.stamps.find((s: { code: string }) => s.code === twin.code);
    expect(match).toMatchObject({ orientation: "mirrored" });
    expect(match.distance).toBeLessThanOrEqual(CLOSE_DISTANCE);
  });
});

describe("look-alikes of demo motifs", () => {
  // Invented demo art (db/seed/scan-art.ts) that a 20-bit cut-off offered as look-alikes: a vine drawing for a
  // four-petal one, labelled "mirror twin" (26 bits straight, 20 mirrored), and a vine drawing for a lotus photo
  // (18 bits). Unrelated hashes sit about 32 bits apart; only clearly closer matches count.
  const art = (family: "petals" | "vine" | "lotus", seed: number, style: "print" | "face", dpi = 60) =>
    renderScan(motifSvg({ seed, family, style, widthMm: 150, heightMm: 150 }), dpi, { format: style === "print" ? "png" : "jpeg" });
  const similarCodes = async (stamp: Stamp) => {
    const res = await api("GET", `/api/v1/stamps/${stamp.code}/similar`, { session: planner });
    expect(res.status).toBe(200);
    return res.body.stamps as { code: string; distance: number; orientation: string }[];
  };

  it("leave out unrelated motifs near the old cut-off and keep a new scan of the same motif", async () => {
    const [petals, vine, lotus, vine3, vine3Again] = await Promise.all(
      ["PET", "VIN", "LOT", "VN3", "VN3B"].map((name) => createStampRow({ code: `${prefix}-LA${name}`, widthMm: 150, heightMm: 150 })),
    );
    expect((await upload(petals, await art("petals", 2, "print"))).status).toBe(201);
    expect((await upload(vine, await art("vine", 1, "print"))).status).toBe(201);
    expect((await upload(lotus, await art("lotus", 1, "face"), { kind: "face", fileName: "lotus.jpg" })).status).toBe(201);
    expect((await upload(vine3, await art("vine", 3, "print"))).status).toBe(201);
    expect((await upload(vine3Again, await art("vine", 3, "print", 100))).status).toBe(201);

    expect((await similarCodes(petals)).map((s) => s.code)).not.toContain(vine.code);
    expect((await similarCodes(lotus)).map((s) => s.code)).not.toContain(vine3.code);
    const again = (await similarCodes(vine3)).find((s) => s.code === vine3Again.code);
    expect(again).toMatchObject({ orientation: "same" });
    expect(again!.distance).toBeLessThanOrEqual(CLOSE_DISTANCE);
  });
});

describe("demo scans", () => {
  it("renders invented motifs into stored scans at a known DPI, mirrors a twin's, and is idempotent", async () => {
    // Fixed codes: the demo motif is drawn from the code, so the pair's hashes are the same every run.
    const main = await createStampRow({ code: "DEMO-SCANS-3", widthMm: 180, heightMm: 180, face: "pair" });
    const twin = await createStampRow({ code: "DEMO-SCANS-4", widthMm: 180, heightMm: 180, face: "pair", mirrored: true, twinId: main.id });
    await db().update(stamps).set({ twinId: twin.id }).where(eq(stamps.id, main.id));
    const codes = [main.code, twin.code];
    const added = await seedScans(db(), objectStore(), { codes, dpi: 60 });
    expect(added).toBe(3); // a print each, and a face photo for the first
    expect(await seedScans(db(), objectStore(), { codes, dpi: 60 })).toBe(0);
    const list = await api("GET", `/api/v1/stamps/${main.code}/scans`, { session: planner });
    const print = list.body.scans.find((s: { kind: string }) => s.kind === "print");
    // 180 mm at 60 DPI: round(180 / 25.4 × 60) = 425 px, i.e. 179.9 mm, within 3 % of the record.
    expect(print).toMatchObject({ widthPx: 425, dpi: 60, dpiSource: "file" });
    expect(print.sizeCheck.warn).toBe(false);
    expect(await keysUnder(`scans/${main.id}/`)).toHaveLength(8);
    // The twin's print is the main print mirrored: their grey rasters agree once the main one is flipped.
    const prints = await db().select().from(stampScans).where(and(inArray(stampScans.stampId, [main.id, twin.id]), eq(stampScans.kind, "print")));
    const raster = async (stampId: string, flop: boolean) => {
      const bytes = await objectStore().getObjectBytes(prints.find((p) => p.stampId === stampId)!.rasterKey);
      return (flop ? sharp(bytes!).flop() : sharp(bytes!)).greyscale().raw().toBuffer();
    };
    const [mainFlopped, mainAsIs, twinRaster] = await Promise.all([raster(main.id, true), raster(main.id, false), raster(twin.id, false)]);
    const meanDifference = (a: Buffer) => a.reduce((sum, v, i) => sum + Math.abs(v - twinRaster[i]), 0) / twinRaster.length;
    expect(mainFlopped.length).toBe(twinRaster.length);
    expect(meanDifference(mainFlopped)).toBeLessThan(12);
    // …and closer flipped than as it is (this motif is not mirror-symmetric).
    expect(meanDifference(mainFlopped)).toBeLessThan(meanDifference(mainAsIs) / 2);
  });
});

describe("hostile uploads", () => {
  it("refuses at least 30 hostile files with a 4xx and a clear message, leaves nothing behind, and keeps serving", async () => {
    const stamp = await createStampRow({ code: `${prefix}-HOST`, widthMm: 100, heightMm: 100 });
    const files = await hostileFiles(hostileLimits);
    expect(files.length).toBeGreaterThanOrEqual(30);
    const scansBefore = (await db().select({ n: count() }).from(stampScans))[0].n;
    for (const file of files) {
      const res = await upload(stamp, file.bytes, { fileName: file.name });
      expect(res.status, `${file.label}: ${JSON.stringify(res.body)}`).toBe(scanRejectedStatus[file.expected]);
      expect(res.status).toBeGreaterThanOrEqual(400);
      expect(res.status).toBeLessThan(500);
      // The scrambled files are made from random noise: a scramble may end the image early (truncated) or
      // break it inside (corrupt); both are "damaged", 422, and either code is right.
      const damaged = ["truncated", "corrupt"];
      if (damaged.includes(file.expected)) expect(damaged, file.label).toContain(res.body.error.code);
      else expect(res.body.error.code, file.label).toBe(file.expected);
      expect(res.body.error.message, file.label).toMatch(/\w{3,}.*\./);
      expect(res.body.error.message).not.toContain(`scans.rejected`);
    }
    expect(await scanRows(stamp)).toBe(0);
    expect((await db().select({ n: count() }).from(stampScans))[0].n).toBeGreaterThanOrEqual(scansBefore);
    expect(await objectsOf(stamp)).toEqual([]);
    expect((await api("GET", "/api/v1/me", { session: keeper })).status).toBe(200);
  });

  it("a client that claims a small size and sends more is refused after the upload (413), and nothing is kept", async () => {
    const stamp = await createStampRow({ code: `${prefix}-LIE`, widthMm: 100, heightMm: 100 });
    const big = Buffer.concat([(await discPrint()).png, Buffer.alloc(hostileLimits.maxBytes)]);
    const res = await upload(stamp, big, { claimedBytes: 1000 });
    // The store may refuse the length itself (a real bucket signs it); the local fake takes it and the app refuses.
    if (res.step === "put") expect(res.status).toBeGreaterThanOrEqual(400);
    else expect(res.status).toBe(413);
    expect(await objectsOf(stamp)).toEqual([]);
    expect(await scanRows(stamp)).toBe(0);
  });

  it("the message for an oversize file names the limit in MB", async () => {
    const stamp = await createStampRow({ code: `${prefix}-BIG`, widthMm: 100, heightMm: 100 });
    const res = await api("POST", `/api/v1/stamps/${stamp.code}/scans/uploads`, { session: keeper, body: { fileName: "huge.tif", sizeBytes: hostileLimits.maxBytes + 1 } });
    expect(res.status).toBe(413);
    expect(res.body.error.message).toContain("8 MB");
  });
});
