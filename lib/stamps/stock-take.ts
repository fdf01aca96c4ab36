/**
 * The outcome of a stock-take at one site, from the stamps the records place there and the
 * sightings made during the count. Pure: plain objects in, plain objects out.
 *
 * - missing: recorded at the site, not retired, not checked out, and not seen;
 * - misplaced: seen at the site, recorded at the same site but at another location;
 * - unexpected: seen, but recorded at another site, at no location, checked out, or unknown.
 */

export interface ExpectedStamp {
  id: string;
  code: string;
  locationId: string | null;
  site: string | null;
  checkedOut: boolean;
  retired: boolean;
}

export interface Sighting {
  code: string;
  stampId: string | null;
  locationId: string | null;
}

export interface StockTakeReport {
  expected: number;
  seenExpected: number;
  missing: string[];
  misplaced: { code: string; recordedLocationId: string | null; seenLocationId: string | null }[];
  unexpected: { code: string; reason: "otherSite" | "noLocation" | "checkedOut" | "unknown" | "retired"; recordedLocationId: string | null; seenLocationId: string | null }[];
  checkedOut: string[];
}

/** `stamps` holds every stamp that is either recorded at `site` or was seen; `sightings` are this count's. */
export function stockTakeReport(site: string, stamps: ExpectedStamp[], sightings: Sighting[]): StockTakeReport {
  const byId = new Map(stamps.map((s) => [s.id, s]));
  const atSite = stamps.filter((s) => s.site === site && !s.retired);
  const expected = atSite.filter((s) => !s.checkedOut);
  const seenIds = new Set(sightings.map((s) => s.stampId).filter((id): id is string => id !== null));

  const report: StockTakeReport = {
    expected: expected.length,
    seenExpected: expected.filter((s) => seenIds.has(s.id)).length,
    missing: expected.filter((s) => !seenIds.has(s.id)).map((s) => s.code).sort(),
    misplaced: [],
    unexpected: [],
    checkedOut: atSite.filter((s) => s.checkedOut && !seenIds.has(s.id)).map((s) => s.code).sort(),
  };

  for (const sighting of sightings) {
    const stamp = sighting.stampId ? byId.get(sighting.stampId) : undefined;
    const base = { code: sighting.code, seenLocationId: sighting.locationId };
    if (!stamp) {
      report.unexpected.push({ ...base, reason: "unknown", recordedLocationId: null });
      continue;
    }
    const recorded = { ...base, code: stamp.code, recordedLocationId: stamp.locationId };
    if (stamp.retired) report.unexpected.push({ ...recorded, reason: "retired" });
    else if (stamp.checkedOut) report.unexpected.push({ ...recorded, reason: "checkedOut" });
    else if (stamp.site === null) report.unexpected.push({ ...recorded, reason: "noLocation" });
    else if (stamp.site !== site) report.unexpected.push({ ...recorded, reason: "otherSite" });
    else if (stamp.locationId !== sighting.locationId) report.misplaced.push(recorded);
  }
  report.misplaced.sort((a, b) => a.code.localeCompare(b.code));
  report.unexpected.sort((a, b) => a.code.localeCompare(b.code));
  return report;
}

/** Stamps the "move to where they were seen" action moves: misplaced ones and known unexpected ones that are not out. */
export function relocations(report: StockTakeReport): { code: string; toLocationId: string }[] {
  const moves = [
    ...report.misplaced,
    ...report.unexpected.filter((u) => u.reason === "otherSite" || u.reason === "noLocation"),
  ];
  return moves.filter((m) => m.seenLocationId !== null).map((m) => ({ code: m.code, toLocationId: m.seenLocationId! }));
}
