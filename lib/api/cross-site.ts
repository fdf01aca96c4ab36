const safeMethods = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * True for a state-changing request that a browser sent from another site. Browsers send
 * Sec-Fetch-Site and Origin; scripts with a Bearer token send neither and are not refused.
 */
export function isCrossSite(request: Request): boolean {
  if (safeMethods.has(request.method.toUpperCase())) return false;
  const fetchSite = request.headers.get("sec-fetch-site");
  if (fetchSite && fetchSite !== "same-origin" && fetchSite !== "none") return true;
  const origin = request.headers.get("origin");
  if (!origin) return false;
  const host = request.headers.get("x-forwarded-host") ?? request.headers.get("host");
  try {
    return new URL(origin).host !== host;
  } catch {
    return true;
  }
}
