import { randomUUID } from "node:crypto";
import { DeleteBucketCommand } from "@aws-sdk/client-s3";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { processScan } from "@/lib/scans";
import {
  createObjectStore,
  deleteObject,
  deleteObjects,
  ensureBucket,
  getObjectBytes,
  headObject,
  newObjectKey,
  objectStore,
  ObjectTooLarge,
  presignGet,
  presignPut,
  putObject,
  s3ConfigFromEnv,
} from "@/lib/s3";
import { testEnv } from "../helpers/env";
import { seededNoisePng } from "../helpers/scan-images";

// Against the object store of the test stack (the local S3-compatible fake), configured by S3_* as the app is.
beforeAll(async () => {
  testEnv();
  await ensureBucket();
});

describe("lib/s3 against the test stack's object store", () => {
  it("puts, heads, gets and deletes an object", async () => {
    const key = newObjectKey("test/round-trip");
    const body = Buffer.from("wax and copper ".repeat(100));
    await putObject(key, body, { contentType: "text/plain" });
    expect(await headObject(key)).toMatchObject({ sizeBytes: body.length, contentType: "text/plain" });
    expect(await getObjectBytes(key)).toEqual(body);
    await deleteObject(key);
    expect(await headObject(key)).toBeNull();
    expect(await getObjectBytes(key)).toBeNull();
  });

  it("refuses to read an object past maxBytes", async () => {
    const key = newObjectKey("test/limit");
    await putObject(key, Buffer.alloc(5000, 1));
    await expect(getObjectBytes(key, { maxBytes: 4999 })).rejects.toBeInstanceOf(ObjectTooLarge);
    expect((await getObjectBytes(key, { maxBytes: 5000 }))!.length).toBe(5000);
    await deleteObject(key);
  });

  it("deletes many objects at once, missing ones included", async () => {
    const keys = Array.from({ length: 5 }, () => newObjectKey("test/many"));
    for (const key of keys) await putObject(key, Buffer.from(key));
    await deleteObjects([...keys, newObjectKey("test/never-there")]);
    for (const key of keys) expect(await headObject(key)).toBeNull();
    await deleteObjects([]);
  });

  it("a presigned PUT takes the browser's upload; HEAD then shows its size and type", async () => {
    const key = newObjectKey("test/presigned");
    const png = await sharp({ create: { width: 120, height: 90, channels: 3, background: "#7a5230" } }).png().toBuffer();
    const put = await presignPut(key, png.length, "image/png", 60);
    expect(put.method).toBe("PUT");
    expect(put.url).toContain("X-Amz-Signature=");
    expect(put.url).toMatch(/X-Amz-SignedHeaders=[^&]*content-length/);
    expect(put.expiresAt.getTime()).toBeGreaterThan(Date.now());
    const res = await fetch(put.url, { method: "PUT", headers: put.headers, body: png });
    expect(res.status).toBe(200);
    expect(await headObject(key)).toMatchObject({ sizeBytes: png.length, contentType: "image/png" });
    await deleteObject(key);
  });

  it("a presigned GET downloads as an attachment under the given name", async () => {
    const key = newObjectKey("test/download");
    const body = Buffer.from("scan bytes");
    await putObject(key, body, { contentType: "application/octet-stream" });
    const url = await presignGet(key, { filename: "CP-0142 face, 600 dpi.png", contentType: "image/png" });
    const res = await fetch(url);
    expect(res.status).toBe(200);
    const disposition = res.headers.get("content-disposition") ?? "";
    expect(disposition).toMatch(/^attachment;/);
    expect(disposition).toContain('filename="CP-0142 face, 600 dpi.png"');
    expect(disposition).toContain("filename*=UTF-8''CP-0142%20face%2C%20600%20dpi.png");
    expect(res.headers.get("content-type")).toBe("image/png");
    expect(Buffer.from(await res.arrayBuffer())).toEqual(body);
    await deleteObject(key);
  });

  it("stores a processed scan's original and thumbnails and reads them back intact", async () => {
    const png = await seededNoisePng(400, 300, { mean: 128, sigma: 30 });
    const scan = await processScan(png, { maxBytes: 10_000_000, maxPixels: 10_000_000 });
    const originalKey = newObjectKey("test/scans");
    const thumbKeys = scan.thumbnails.map(() => newObjectKey("test/thumbs"));
    await putObject(originalKey, scan.original.bytes, { contentType: scan.original.contentType });
    await Promise.all(scan.thumbnails.map((t, i) => putObject(thumbKeys[i], t.bytes, { contentType: t.contentType })));
    expect(await getObjectBytes(originalKey)).toEqual(scan.original.bytes);
    expect((await headObject(thumbKeys[0]))?.contentType).toBe("image/webp");
    await deleteObjects([originalKey, ...thumbKeys]);
    expect(await headObject(originalKey)).toBeNull();
  });
});

describe("ensureBucket", () => {
  const bucket = `capgrid-check-${randomUUID().slice(0, 8)}`;
  const store = () => createObjectStore({ ...s3ConfigFromEnv(), bucket });

  afterAll(async () => {
    await store().deleteObjects(["probe"]);
    await store().client.send(new DeleteBucketCommand({ Bucket: bucket }));
  });

  it("creates a missing bucket and leaves an existing one alone", async () => {
    expect(objectStore().bucket).not.toBe(bucket);
    await store().ensureBucket();
    await store().ensureBucket();
    await store().putObject("probe", Buffer.from("here"));
    expect((await store().headObject("probe"))?.sizeBytes).toBe(4);
  });
});
