import { NextResponse, type NextRequest } from "next/server";
import { isCrossSite } from "@/lib/api/cross-site";
import { appOrigins } from "@/lib/app-origins";
import { env } from "@/lib/env";
import { defaultLocale, isLocale, localeCookie, negotiateLocale } from "@/lib/i18n/config";
import { translator } from "@/lib/i18n/translator";
import { refusedPage } from "@/lib/refused-page";
import { uploadOrigin } from "@/lib/upload-origin";
import { baselineHeaders, contentSecurityPolicy, newNonce, type SecurityConfig } from "@/lib/security-headers";

// Runs for every request. It sets the security headers (lib/security-headers.ts), refuses forms and
// server actions posted from another origin, and sends pages without a session cookie to sign-in —
// a convenience only: every permission is checked again on the server, in the data-access layer.
const publicPaths = ["/signin", "/forgot-password", "/set-password"];

let cachedConfig: SecurityConfig | undefined;
function securityConfig(): SecurityConfig {
  const e = env();
  cachedConfig ??= {
    appUrl: e.APP_URL,
    uploadOrigin: uploadOrigin({ endpoint: e.S3_ENDPOINT, region: e.S3_REGION, bucket: e.S3_BUCKET, forcePathStyle: e.S3_FORCE_PATH_STYLE }),
    dev: process.env.NODE_ENV === "development",
  };
  return cachedConfig;
}

const isStaticFile = (pathname: string) => pathname.startsWith("/_next/") || /\.(?:png|jpg|svg|webp|ico|woff2?|css|js|map|txt)$/.test(pathname);

export function proxy(request: NextRequest) {
  const { pathname, search } = request.nextUrl;
  const security = securityConfig();
  const isApi = pathname.startsWith("/api/");
  const nonce = newNonce();
  const csp = contentSecurityPolicy(nonce, security);

  let response: NextResponse;
  if (!isApi && isCrossSite(request, appOrigins())) {
    // A form or server action from another origin: the framework would refuse it with a 500. Nothing runs;
    // the answer is 403 with the message page (a rewrite to a page would be proxied as a foreign URL
    // whenever the Host differs from the server's own name, so the page is written here).
    // No session is read here: the browser's cookie or its Accept-Language decides (lib/i18n/request-locale.ts for pages).
    const fromCookie = request.cookies.get(localeCookie)?.value;
    const locale = isLocale(fromCookie) ? fromCookie : (negotiateLocale(request.headers.get("accept-language")) ?? defaultLocale);
    response = new NextResponse(refusedPage(translator(locale), locale, nonce), { status: 403, headers: { "content-type": "text/html; charset=utf-8", "cache-control": "no-store" } });
  } else if (!isApi && !isStaticFile(pathname) && !hasSessionCookie(request) && !publicPaths.some((p) => pathname === p || pathname.startsWith(`${p}/`))) {
    const url = request.nextUrl.clone();
    url.pathname = "/signin";
    url.search = pathname === "/" ? "" : `?next=${encodeURIComponent(pathname + search)}`;
    response = NextResponse.redirect(url);
  } else {
    response = NextResponse.next({ request: { headers: pageRequestHeaders(request, nonce, csp) } });
  }

  for (const [name, value] of Object.entries(baselineHeaders(security))) response.headers.set(name, value);
  if (!isApi) response.headers.set("content-security-policy", csp);
  // Auth.js answers with the session and CSRF token; /api/v1 sets its own (lib/api/route.ts).
  if (pathname.startsWith("/api/auth/")) response.headers.set("cache-control", "no-store");
  return response;
}

/** The request as the page renders it: Next.js reads the nonce for its own scripts from the CSP header. */
function pageRequestHeaders(request: NextRequest, nonce: string, csp: string): Headers {
  const headers = new Headers(request.headers);
  headers.set("x-nonce", nonce);
  headers.set("content-security-policy", csp);
  return headers;
}

const hasSessionCookie = (request: NextRequest) => request.cookies.getAll().some((c) => c.name.endsWith("authjs.session-token"));

export const config = {
  // Everything: static files and API answers get their headers here too.
  matcher: ["/:path*"],
};
