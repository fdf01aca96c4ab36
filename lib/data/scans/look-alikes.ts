import "server-only";
import { assertCan, type Actor } from "@/lib/authz";
import type { SimilarStampDto } from "@/lib/contracts/scans";
import { findStamp } from "./shared";
import { similarToStamp } from "./similar";

// Stamps whose scans look like this stamp's, mirror twins included: search by picture with this stamp's own
// stored signatures as the query.

/** Nearest other stamps by their scans' signatures (lib/scans/similar.ts), at most SIMILAR_MAX_DISTANCE away. */
export async function similarStamps(actor: Actor, code: string, limit = 8): Promise<SimilarStampDto[]> {
  assertCan(actor, "data:read");
  const stamp = await findStamp(code);
  const matches = await similarToStamp(actor, stamp.id, limit);
  return matches.map((m) => ({ code: m.stampCode, name: m.stampName, scanId: m.scanId, distance: m.distance, close: m.close, orientation: m.mirrored ? "mirrored" : "same", urls: m.urls }));
}
