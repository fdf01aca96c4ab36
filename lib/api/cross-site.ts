const safeMethods = new Set(["GET", "HEAD", "OPTIONS"]);

/** "HTTP://LocalHost:80/x" → "http://localhost"; an opaque or malformed origin → null. */
export function originOf(value: string): string | null {
  try {
    const url = new URL(value);
    return url.protocol === "http:" || url.protocol === "https:" ? url.origin : null;
  } catch {
    return null;
  }
}

/**
 * True for a state-changing request that a browser sent from anywhere but the app's own origins
 * (APP_URL's, plus APP_ORIGINS; lib/env.ts): scheme, host and port must all match. Host and
 * X-Forwarded-* headers play no part, so a spoofed one cannot widen the list. Browsers send
 * Sec-Fetch-Site and Origin; scripts with a Bearer token send neither and are not refused.
 */
export function isCrossSite(request: Request, allowedOrigins: ReadonlySet<string>): boolean {
  if (safeMethods.has(request.method.toUpperCase())) return false;
  const fetchSite = request.headers.get("sec-fetch-site");
  if (fetchSite && fetchSite !== "same-origin" && fetchSite !== "none") return true;
  const origin = request.headers.get("origin");
  if (origin === null) return false;
  const normal = originOf(origin);
  return normal === null || !allowedOrigins.has(normal);
}
