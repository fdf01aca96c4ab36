import { createHash } from "node:crypto";
import { canonicalGeometry, type StampGeometryRecord } from "./stale";

// Fingerprints of the geometry a plan's summary was computed from. Node's crypto: the server and the seed use it,
// the browser never does (so this file is not exported from lib/plans/index.ts).

/** A short digest of an outline's path data. */
export const outlineDigest = (outline: string) => createHash("sha256").update(outline).digest("hex").slice(0, 16);

/** The fingerprint of a plan's stamp geometry records. */
export const fingerprintOf = (records: readonly StampGeometryRecord[]) => createHash("sha256").update(canonicalGeometry(records)).digest("hex");
