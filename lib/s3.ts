// The app's object store, configured from the environment (S3_* in .env.example): the local fake in development
// and tests, a real bucket in production, with no code change. Scripts that run outside Next import
// lib/object-store.ts and pass their own configuration (lib/env.ts is server-only).
import { env, type Env } from "./env";
import { createObjectStore, type ObjectStore, type S3Config } from "./object-store";

export {
  attachmentDisposition,
  createObjectStore,
  createS3Client,
  newObjectKey,
  ObjectTooLarge,
  type ObjectHead,
  type ObjectStore,
  type PresignedPut,
  type S3Config,
} from "./object-store";

/** S3 configuration from the validated environment; an empty S3_ENDPOINT means AWS itself. */
export function s3ConfigFromEnv(e: Env = env()): S3Config {
  return {
    endpoint: e.S3_ENDPOINT || undefined,
    region: e.S3_REGION,
    bucket: e.S3_BUCKET,
    accessKeyId: e.S3_ACCESS_KEY_ID,
    secretAccessKey: e.S3_SECRET_ACCESS_KEY,
    forcePathStyle: e.S3_FORCE_PATH_STYLE,
  };
}

let store: ObjectStore | undefined;

/** The one store of this app server, made on first use (one S3Client, so connections are pooled). */
export function objectStore(): ObjectStore {
  store ??= createObjectStore(s3ConfigFromEnv());
  return store;
}

export const putObject: ObjectStore["putObject"] = (...args) => objectStore().putObject(...args);
export const getObjectBytes: ObjectStore["getObjectBytes"] = (...args) => objectStore().getObjectBytes(...args);
export const getObjectStream: ObjectStore["getObjectStream"] = (...args) => objectStore().getObjectStream(...args);
export const headObject: ObjectStore["headObject"] = (...args) => objectStore().headObject(...args);
export const deleteObject: ObjectStore["deleteObject"] = (...args) => objectStore().deleteObject(...args);
export const deleteObjects: ObjectStore["deleteObjects"] = (...args) => objectStore().deleteObjects(...args);
export const presignPut: ObjectStore["presignPut"] = (...args) => objectStore().presignPut(...args);
export const presignGet: ObjectStore["presignGet"] = (...args) => objectStore().presignGet(...args);
export const ensureBucket: ObjectStore["ensureBucket"] = () => objectStore().ensureBucket();
