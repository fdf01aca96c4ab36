import { NextResponse, type NextRequest } from "next/server";

// A convenience only: pages without a session cookie go to the sign-in page at once.
// Every permission is checked again on the server, in the data-access layer.
const publicPaths = ["/signin", "/forgot-password", "/set-password"];

export function proxy(request: NextRequest) {
  const { pathname, search } = request.nextUrl;
  const hasSession = request.cookies.getAll().some((c) => c.name.endsWith("authjs.session-token"));
  if (hasSession || publicPaths.some((p) => pathname === p || pathname.startsWith(`${p}/`))) return NextResponse.next();
  const url = request.nextUrl.clone();
  url.pathname = "/signin";
  url.search = pathname === "/" ? "" : `?next=${encodeURIComponent(pathname + search)}`;
  return NextResponse.redirect(url);
}

export const config = {
  // Pages only: the API answers 401 in JSON itself, and static files need no session.
  matcher: ["/((?!api/|_next/|favicon.ico|.*\\.(?:png|jpg|svg|webp|ico|woff2?)$).*)"],
};
