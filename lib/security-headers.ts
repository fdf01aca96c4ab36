// The security headers of every answer, set in proxy.ts (and the API's Cache-Control in lib/api/route.ts).
// Pure: the values come in as arguments, so tests can check an https deployment without running one.

export interface SecurityConfig {
  /** APP_URL: https turns on HSTS and upgrade-insecure-requests. */
  appUrl: string;
  /** Where browsers PUT presigned scan uploads (lib/object-store.ts uploadOrigin). */
  uploadOrigin: string;
  /** `next dev`: React needs eval for its error overlay and the dev server injects styles. */
  dev: boolean;
}

const isHttps = (url: string) => url.startsWith("https://");

/** A fresh, unguessable value for one answer's CSP nonce. */
export function newNonce(): string {
  const bytes = new Uint8Array(18);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}

/**
 * The pages' Content-Security-Policy, after the Next.js guide (docs/app/guides/content-security-policy):
 * scripts and style elements only with this answer's nonce (Next.js puts it on its own scripts),
 * `strict-dynamic` for the chunks those load, no eval outside `next dev`, no framing, no plugins.
 */
export function contentSecurityPolicy(nonce: string, config: SecurityConfig): string {
  const directives = [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${config.dev ? " 'unsafe-eval'" : ""}`,
    // The planner's layout worker: a worker script carries no nonce, and 'strict-dynamic' ignores 'self' above.
    "worker-src 'self'",
    // Dev only: the dev overlay injects style elements without the nonce (and a nonce would disable unsafe-inline).
    `style-src 'self' ${config.dev ? "'unsafe-inline'" : `'nonce-${nonce}'`}`,
    "img-src 'self' blob: data:",
    "font-src 'self'",
    `connect-src 'self' ${config.uploadOrigin}`,
    // The stock-take scanner shows the camera stream; scan previews may be blobs.
    "media-src 'self' blob:",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    ...(isHttps(config.appUrl) ? ["upgrade-insecure-requests"] : []),
  ];
  return directives.join("; ");
}

/** Only the stock-take scanner needs a device: the camera, for this origin alone. */
export const permissionsPolicy = "camera=(self), microphone=(), geolocation=(), payment=(), usb=(), display-capture=()";

/** Headers every answer carries, whatever its type. */
export function baselineHeaders(config: SecurityConfig): Record<string, string> {
  return {
    "x-content-type-options": "nosniff",
    "referrer-policy": "strict-origin-when-cross-origin",
    "permissions-policy": permissionsPolicy,
    // For browsers without CSP's frame-ancestors.
    "x-frame-options": "DENY",
    ...(isHttps(config.appUrl) ? { "strict-transport-security": "max-age=31536000" } : {}),
  };
}
