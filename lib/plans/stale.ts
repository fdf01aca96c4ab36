import type { StampSize } from "@/lib/layout";

// A plan keeps the geometry of every library stamp its summary was computed from. Reopening compares it with the
// stamps as they are now: a changed size, outline or coverage makes the summary stale, and says which and how.

/** One library stamp as the engine took it: size, outline (by its digest) and coverage (only without an outline). */
export interface StampGeometryRecord {
  /** "field" or "border:<index>". */
  role: string;
  code: string;
  widthMm: number;
  heightMm: number;
  /** A digest of the outline's path data, or null without one. */
  outlineDigest: string | null;
  /** The coverage ratio the engine used (only when there is no outline), or null. */
  coverage: number | null;
}

export type StaleChange = "size" | "outline" | "coverage" | "missing";

export interface StaleReason {
  role: string;
  code: string;
  changes: StaleChange[];
}

/** The record of a resolved stamp; `digest` turns an outline into a short fingerprint (the caller's hash). */
export function geometryRecord(role: string, code: string, stamp: StampSize, digest: (outline: string) => string): StampGeometryRecord {
  return {
    role,
    code,
    widthMm: stamp.widthMm,
    heightMm: stamp.heightMm,
    outlineDigest: stamp.outline ? digest(stamp.outline) : null,
    coverage: stamp.outline ? null : (stamp.coverage ?? null),
  };
}

/** One canonical text of the records (sorted by role), for a fingerprint. */
export function canonicalGeometry(records: readonly StampGeometryRecord[]): string {
  const sorted = [...records].sort((a, b) => a.role.localeCompare(b.role));
  return JSON.stringify(sorted.map((r) => [r.role, r.code, r.widthMm, r.heightMm, r.outlineDigest, r.coverage]));
}

/**
 * What changed between the geometry a summary was computed from and the stamps now (empty: not stale), role by
 * role. A stamp whose code was changed is still the same stamp: only its size, outline and coverage count.
 */
export function staleReasons(saved: readonly StampGeometryRecord[], current: ReadonlyMap<string, StampGeometryRecord>): StaleReason[] {
  const reasons: StaleReason[] = [];
  for (const before of saved) {
    const now = current.get(before.role);
    if (!now) {
      reasons.push({ role: before.role, code: before.code, changes: ["missing"] });
      continue;
    }
    const changes: StaleChange[] = [];
    if (now.widthMm !== before.widthMm || now.heightMm !== before.heightMm) changes.push("size");
    if (now.outlineDigest !== before.outlineDigest) changes.push("outline");
    if (now.coverage !== before.coverage) changes.push("coverage");
    if (changes.length) reasons.push({ role: before.role, code: now.code, changes });
  }
  return reasons;
}
