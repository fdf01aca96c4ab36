import type { S3Config } from "./object-store";

/**
 * The origin browsers send presigned scan uploads to: the S3 endpoint (AWS's regional one when empty),
 * with the bucket in the host name unless addressing is path-style. The pages' CSP allows it in
 * connect-src. Apart from lib/object-store.ts so that proxy.ts does not load the AWS SDK.
 */
export function uploadOrigin(config: Pick<S3Config, "endpoint" | "region" | "bucket" | "forcePathStyle">): string {
  const url = new URL(config.endpoint || `https://s3.${config.region}.amazonaws.com`);
  if (!config.forcePathStyle) url.hostname = `${config.bucket}.${url.hostname}`;
  return url.origin;
}
