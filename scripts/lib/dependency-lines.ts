import semver from "semver";

// Which release a pinned dependency could move to without leaving its line: the same major (for 0.x, the same
// minor, since 0.x minors break — the semver rule for caret ranges).

export interface LineReport {
  name: string;
  pinned: string;
  /** The newest published release of the pinned version's line (no prereleases), or null when none is known. */
  newestOfLine: string | null;
  /** The newest release of all. */
  newest: string | null;
  status: "current" | "behind" | "unknown";
}

/** The line a pinned version belongs to, as a semver range ("^16.4.6", or "~0.45.4" for 0.x). */
export function lineRange(pinned: string): string {
  const v = semver.parse(pinned);
  if (!v) throw new Error(`not a version: ${pinned}`);
  return v.major === 0 ? `~${v.version}` : `^${v.version}`;
}

export function lineReport(name: string, pinned: string, published: readonly string[]): LineReport {
  // A prerelease pin (5.0.0-beta.32) follows its prereleases and the releases of its major.
  const onPrerelease = semver.prerelease(pinned) !== null;
  const valid = published.filter((p) => semver.valid(p));
  const clean = valid.filter((p) => !semver.prerelease(p));
  const newestOfLine = semver.maxSatisfying(onPrerelease ? valid : clean, lineRange(pinned), { includePrerelease: onPrerelease });
  const newest = clean.length ? semver.rsort([...clean])[0] : null;
  const status = newestOfLine === null ? "unknown" : semver.eq(newestOfLine, pinned) || semver.lt(newestOfLine, pinned) ? "current" : "behind";
  return { name, pinned, newestOfLine, newest, status };
}
