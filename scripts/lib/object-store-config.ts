// The object store as the scripts see it: the same S3_* variables the app reads (lib/s3.ts), without lib/env.ts.
import { createObjectStore, type ObjectStore } from "@/lib/object-store";

export function objectStoreFromEnv(env: NodeJS.ProcessEnv = process.env): ObjectStore {
  if (!env.S3_BUCKET || !env.S3_ACCESS_KEY_ID || !env.S3_SECRET_ACCESS_KEY) throw new Error("S3_BUCKET, S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY must be set (see .env.example).");
  return createObjectStore({
    endpoint: env.S3_ENDPOINT || undefined,
    region: env.S3_REGION || "us-east-1",
    bucket: env.S3_BUCKET,
    accessKeyId: env.S3_ACCESS_KEY_ID,
    secretAccessKey: env.S3_SECRET_ACCESS_KEY,
    forcePathStyle: (env.S3_FORCE_PATH_STYLE ?? "true") !== "false",
  });
}
