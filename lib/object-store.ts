// S3-compatible object store client with explicit configuration, usable from scripts and tests that run outside
// Next. The app uses the environment-configured instance in lib/s3.ts.
import { randomUUID } from "node:crypto";
import {
  CreateBucketCommand,
  DeleteObjectCommand,
  DeleteObjectsCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  PutObjectCommand,
  S3Client,
  type BucketLocationConstraint,
} from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";

export interface S3Config {
  /** Omit for AWS itself; set for S3-compatible stores (the local fake, MinIO, R2, …). */
  endpoint?: string;
  region: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
  /** Path-style addressing (http://host/bucket/key), which the local fake and most self-hosted stores need. */
  forcePathStyle: boolean;
}

/** An S3Client for the configuration. Checksums only where the API requires them: the local fake stores chunk framing otherwise. */
export function createS3Client(config: S3Config): S3Client {
  return new S3Client({
    endpoint: config.endpoint || undefined,
    region: config.region,
    forcePathStyle: config.forcePathStyle,
    credentials: { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey },
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
}

const KEY_PREFIX = /^[a-z0-9][a-z0-9-]*(\/[a-z0-9][a-z0-9-]*)*$/;

/**
 * A fresh object key `<prefix>/<random UUID>`. Keys never contain anything a user typed (file names stay in the
 * database), so no upload can choose or guess where it lands. The prefix is fixed by code: lower-case segments.
 */
export function newObjectKey(prefix: string): string {
  if (!KEY_PREFIX.test(prefix)) throw new RangeError(`object key prefix must be lower-case segments, got "${prefix}"`);
  return `${prefix}/${randomUUID()}`;
}

/** `attachment` with an ASCII fallback name and the exact name in RFC 5987 encoding (RFC 6266 §4.3). */
export function attachmentDisposition(filename: string): string {
  const ascii = filename.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  const encoded = encodeURIComponent(filename).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}

export interface ObjectHead {
  sizeBytes: number;
  contentType: string | null;
  etag: string | null;
  lastModified: Date | null;
}

export interface PresignedPut {
  url: string;
  method: "PUT";
  /** Headers the uploader must send as they are (they are part of the signature). */
  headers: Record<string, string>;
  expiresAt: Date;
}

/** Thrown by getObjectBytes when an object is larger than the caller allows. */
export class ObjectTooLarge extends Error {
  constructor(
    readonly key: string,
    readonly maxBytes: number,
  ) {
    super(`object ${key} is larger than ${maxBytes} bytes`);
    this.name = "ObjectTooLarge";
  }
}

const isNotFound = (error: unknown) => {
  const e = error as { name?: string; $metadata?: { httpStatusCode?: number } };
  return e?.$metadata?.httpStatusCode === 404 || e?.name === "NotFound" || e?.name === "NoSuchKey" || e?.name === "NoSuchBucket";
};

export interface ObjectStore {
  readonly client: S3Client;
  readonly bucket: string;
  putObject(key: string, body: Uint8Array, options?: { contentType?: string; cacheControl?: string }): Promise<void>;
  /** The object's bytes, or null when there is none; refuses (ObjectTooLarge) past `maxBytes` without reading on. */
  getObjectBytes(key: string, options?: { maxBytes?: number }): Promise<Buffer | null>;
  /** The object as a stream for an HTTP answer, or null when there is none. */
  getObjectStream(key: string): Promise<{ body: ReadableStream<Uint8Array>; sizeBytes: number | null; contentType: string | null } | null>;
  headObject(key: string): Promise<ObjectHead | null>;
  deleteObject(key: string): Promise<void>;
  /** Deletes up to any number of keys, 1000 per request; missing keys are not an error. */
  deleteObjects(keys: readonly string[]): Promise<void>;
  /** A URL the browser can PUT exactly `contentLength` bytes to (and the given content type, when set). */
  presignPut(key: string, contentLength: number, contentType?: string, expiresSeconds?: number): Promise<PresignedPut>;
  /** A download URL whose answer carries Content-Disposition: attachment with `filename`. */
  presignGet(key: string, options: { filename: string; contentType?: string; expiresSeconds?: number }): Promise<string>;
  /** Creates the bucket when it does not exist. */
  ensureBucket(): Promise<void>;
  /** Resolves when the bucket answers (a load balancer's health check); throws otherwise. */
  ping(): Promise<void>;
}

export function createObjectStore(config: S3Config, client: S3Client = createS3Client(config)): ObjectStore {
  const Bucket = config.bucket;
  return {
    client,
    bucket: Bucket,

    async putObject(key, body, options = {}) {
      await client.send(
        new PutObjectCommand({ Bucket, Key: key, Body: body, ContentLength: body.length, ContentType: options.contentType, CacheControl: options.cacheControl }),
      );
    },

    async getObjectStream(key) {
      try {
        const response = await client.send(new GetObjectCommand({ Bucket, Key: key }));
        const body = response.Body as { transformToWebStream(): ReadableStream<Uint8Array> } | undefined;
        return body ? { body: body.transformToWebStream(), sizeBytes: response.ContentLength ?? null, contentType: response.ContentType ?? null } : null;
      } catch (error) {
        if (isNotFound(error)) return null;
        throw error;
      }
    },

    async getObjectBytes(key, options = {}) {
      let response;
      try {
        response = await client.send(new GetObjectCommand({ Bucket, Key: key }));
      } catch (error) {
        if (isNotFound(error)) return null;
        throw error;
      }
      const body = response.Body as AsyncIterable<Uint8Array> & { destroy?: () => void };
      const max = options.maxBytes ?? Number.POSITIVE_INFINITY;
      if (response.ContentLength !== undefined && response.ContentLength > max) {
        body.destroy?.();
        throw new ObjectTooLarge(key, max);
      }
      // Chunks are checked against the limit as they arrive, so a lying Content-Length cannot overfill memory.
      const chunks: Uint8Array[] = [];
      let total = 0;
      for await (const chunk of body) {
        total += chunk.length;
        if (total > max) {
          body.destroy?.();
          throw new ObjectTooLarge(key, max);
        }
        chunks.push(chunk);
      }
      return Buffer.concat(chunks, total);
    },

    async headObject(key) {
      try {
        const head = await client.send(new HeadObjectCommand({ Bucket, Key: key }));
        return {
          sizeBytes: head.ContentLength ?? 0,
          contentType: head.ContentType ?? null,
          etag: head.ETag ?? null,
          lastModified: head.LastModified ?? null,
        };
      } catch (error) {
        if (isNotFound(error)) return null;
        throw error;
      }
    },

    async deleteObject(key) {
      await client.send(new DeleteObjectCommand({ Bucket, Key: key }));
    },

    async deleteObjects(keys) {
      for (let i = 0; i < keys.length; i += 1000) {
        const batch = keys.slice(i, i + 1000);
        const result = await client.send(new DeleteObjectsCommand({ Bucket, Delete: { Objects: batch.map((Key) => ({ Key })), Quiet: true } }));
        const failed = (result.Errors ?? []).filter((e) => e.Code !== "NoSuchKey");
        if (failed.length > 0) throw new Error(`could not delete ${failed.length} object(s), first: ${failed[0].Key} (${failed[0].Code})`);
      }
    },

    async presignPut(key, contentLength, contentType, expiresSeconds = 900) {
      if (!Number.isInteger(contentLength) || contentLength < 0) throw new RangeError("contentLength must be a whole number of bytes");
      const signed = new Set(["content-length", ...(contentType ? ["content-type"] : [])]);
      const url = await getSignedUrl(client, new PutObjectCommand({ Bucket, Key: key, ContentLength: contentLength, ContentType: contentType }), {
        expiresIn: expiresSeconds,
        signableHeaders: signed,
      });
      const headers: Record<string, string> = contentType ? { "Content-Type": contentType } : {};
      return { url, method: "PUT", headers, expiresAt: new Date(Date.now() + expiresSeconds * 1000) };
    },

    async presignGet(key, options) {
      return getSignedUrl(
        client,
        new GetObjectCommand({
          Bucket,
          Key: key,
          ResponseContentDisposition: attachmentDisposition(options.filename),
          ResponseContentType: options.contentType,
        }),
        { expiresIn: options.expiresSeconds ?? 300 },
      );
    },

    async ping() {
      await client.send(new HeadBucketCommand({ Bucket }));
    },

    async ensureBucket() {
      try {
        await client.send(new HeadBucketCommand({ Bucket }));
        return;
      } catch (error) {
        if (!isNotFound(error)) throw error;
      }
      try {
        const location = config.region === "us-east-1" ? undefined : { LocationConstraint: config.region as BucketLocationConstraint };
        await client.send(new CreateBucketCommand({ Bucket, CreateBucketConfiguration: location }));
      } catch (error) {
        // Another app server may have created it in the meantime.
        const name = (error as { name?: string }).name;
        if (name !== "BucketAlreadyOwnedByYou" && name !== "BucketAlreadyExists") throw error;
      }
    },
  };
}
