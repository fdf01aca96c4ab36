/**
 * Reads a stamp code out of what a scanner or a person typed: a label's address
 * (".../stamps/CP-0142"), or the bare code in any case. Pure.
 */
export function codeFromScan(text: string): string | null {
  const trimmed = text.trim();
  if (!trimmed) return null;
  let candidate = trimmed;
  const match = /\/stamps\/([^/?#\s]+)\/?(?:[?#].*)?$/.exec(trimmed);
  if (match) {
    try {
      candidate = decodeURIComponent(match[1]);
    } catch {
      return null;
    }
  }
  candidate = candidate.toUpperCase();
  return /^[A-Z0-9][A-Z0-9._-]{0,31}$/.test(candidate) ? candidate : null;
}

/** The address a stamp's label points at. */
export function stampUrl(appUrl: string, code: string): string {
  return `${appUrl.replace(/\/$/, "")}/stamps/${encodeURIComponent(code)}`;
}

/** The address a shelf label points at: the stamp table filtered to that location. */
export function shelfUrl(appUrl: string, locationId: string): string {
  return `${appUrl.replace(/\/$/, "")}/stamps?location=${encodeURIComponent(locationId)}`;
}

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The location id in a scanned shelf label (see shelfUrl), or null when the text is not one. */
export function locationFromScan(text: string): string | null {
  let url: URL;
  try {
    url = new URL(text.trim());
  } catch {
    return null;
  }
  if (!/\/stamps\/?$/.test(url.pathname)) return null;
  const id = url.searchParams.get("location");
  return id && uuidPattern.test(id) ? id.toLowerCase() : null;
}

/** The date `days` after `from` as YYYY-MM-DD (UTC), e.g. a check-out's default due date. */
export function isoDateAfter(from: Date, days: number): string {
  return new Date(from.getTime() + days * 86_400_000).toISOString().slice(0, 10);
}
