import { testEnv } from "./env";

export interface Session {
  cookie: string;
  /** The language cookie the sign-in set (lib/i18n/locale-cookie.ts), if any. */
  locale?: string;
}

const cookiesOf = (response: Response) => response.headers.getSetCookie().map((c) => c.split(";")[0]);

/** Signs in through the app's own Auth.js endpoints, as a browser would, and returns the session cookie. */
export async function signIn(email: string, password: string, options: { acceptLanguage?: string; cookies?: string[] } = {}): Promise<Session | null> {
  const { appUrl } = testEnv();
  const csrf = await fetch(`${appUrl}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const csrfCookies = cookiesOf(csrf);
  const response = await fetch(`${appUrl}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: [...csrfCookies, ...(options.cookies ?? [])].join("; "), origin: appUrl, ...(options.acceptLanguage ? { "accept-language": options.acceptLanguage } : {}) },
    body: new URLSearchParams({ csrfToken, email, password, callbackUrl: `${appUrl}/` }),
  });
  const session = cookiesOf(response).find((c) => c.includes("authjs.session-token="));
  const locale = cookiesOf(response).find((c) => c.startsWith("capgrid-locale="))?.split("=")[1];
  return session ? { cookie: session, locale } : null;
}

interface CallOptions {
  session?: Session;
  token?: string;
  body?: unknown;
  rawBody?: string | Uint8Array;
  headers?: Record<string, string>;
}

/** Calls the JSON API; answers the status and the parsed body. */
export async function api(method: string, path: string, options: CallOptions = {}) {
  const { appUrl } = testEnv();
  const headers: Record<string, string> = { accept: "application/json", ...options.headers };
  if (options.session) headers.cookie = options.session.cookie;
  if (options.token) headers.authorization = `Bearer ${options.token}`;
  let body: BodyInit | undefined;
  if (options.body !== undefined) {
    body = JSON.stringify(options.body);
    headers["content-type"] ??= "application/json";
  } else if (options.rawBody !== undefined) {
    body = typeof options.rawBody === "string" ? options.rawBody : new Uint8Array(options.rawBody);
  }
  const response = await fetch(`${appUrl}${path}`, { method, headers, body, redirect: "manual" });
  const text = await response.text();
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- tests read whatever the API answered
  let json: any = null;
  try {
    json = text ? JSON.parse(text) : null;
  } catch {
    json = { raw: text };
  }
  return { status: response.status, body: json };
}

export interface RawResponse {
  status: number;
  headers: Record<string, string | string[] | undefined>;
  text: string;
}

interface RawOptions {
  method?: string;
  headers?: Record<string, string>;
  body?: string | Buffer | FormData;
  /** Bind the client socket to this loopback address (any 127.x.y.z works on Linux). */
  localAddress?: string;
  /** Send the body in chunks without a Content-Length header. */
  chunked?: boolean;
}

/**
 * One HTTP request over node:http, for what fetch cannot do: choose the client's source address,
 * stream a body without Content-Length. Connects to 127.0.0.1 and names the app's host in Host.
 */
export async function rawRequest(path: string, options: RawOptions = {}): Promise<RawResponse> {
  const { request } = await import("node:http");
  const url = new URL(path, testEnv().appUrl);
  let body = options.body;
  const headers: Record<string, string> = { host: url.host, ...options.headers };
  if (body instanceof FormData) {
    const encoded = new Response(body);
    headers["content-type"] = encoded.headers.get("content-type")!;
    body = Buffer.from(await encoded.arrayBuffer());
  }
  if (body !== undefined && !options.chunked) headers["content-length"] = String(Buffer.byteLength(body));
  return new Promise((resolve, reject) => {
    const req = request(
      { host: "127.0.0.1", port: url.port, path: url.pathname + url.search, method: options.method ?? "GET", headers, localAddress: options.localAddress },
      (res) => {
        const chunks: Buffer[] = [];
        res.on("data", (c: Buffer) => chunks.push(c));
        res.on("end", () => resolve({ status: res.statusCode ?? 0, headers: res.headers, text: Buffer.concat(chunks).toString("utf8") }));
        res.on("error", reject);
      },
    );
    req.on("error", reject);
    if (body === undefined) return req.end();
    if (!options.chunked) return req.end(body);
    const bytes = Buffer.from(body as string | Buffer);
    const step = 64 * 1024;
    for (let i = 0; i < bytes.length; i += step) req.write(bytes.subarray(i, i + step));
    req.end();
  });
}

const setCookies = (headers: RawResponse["headers"]) => {
  const raw = headers["set-cookie"];
  return (Array.isArray(raw) ? raw : raw ? [raw] : []).map((c) => c.split(";")[0]);
};

/** Signs in like `signIn`, but from a chosen client address, with optional extra headers. */
export async function signInFrom(localAddress: string, email: string, password: string, extraHeaders: Record<string, string> = {}): Promise<Session | null> {
  const { appUrl } = testEnv();
  const csrf = await rawRequest("/api/auth/csrf", { localAddress, headers: extraHeaders });
  const { csrfToken } = JSON.parse(csrf.text) as { csrfToken: string };
  const response = await rawRequest("/api/auth/callback/credentials", {
    method: "POST",
    localAddress,
    headers: { ...extraHeaders, "content-type": "application/x-www-form-urlencoded", cookie: setCookies(csrf.headers).join("; "), origin: appUrl },
    body: new URLSearchParams({ csrfToken, email, password, callbackUrl: `${appUrl}/` }).toString(),
  });
  const session = setCookies(response.headers).find((c) => c.includes("authjs.session-token="));
  return session ? { cookie: session } : null;
}

/** Signs out through Auth.js's own endpoint (POST /api/auth/signout with its CSRF token), as a browser would. */
export async function signOut(session: Session): Promise<number> {
  const { appUrl } = testEnv();
  const csrf = await fetch(`${appUrl}/api/auth/csrf`, { headers: { cookie: session.cookie } });
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const response = await fetch(`${appUrl}/api/auth/signout`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: [session.cookie, ...cookiesOf(csrf)].join("; "), origin: appUrl },
    body: new URLSearchParams({ csrfToken, callbackUrl: `${appUrl}/signin` }),
  });
  return response.status;
}

/** A page as the browser gets it (no redirects followed). */
export async function page(path: string, session?: Session, headers: Record<string, string> = {}) {
  const { appUrl } = testEnv();
  const response = await fetch(`${appUrl}${path}`, { redirect: "manual", headers: { ...headers, ...(session ? { cookie: session.cookie } : {}) } });
  return { status: response.status, headers: response.headers, html: await response.text() };
}

/** The server action of the form holding a button with this text (Next renders it as a hidden `$ACTION_ID_…` field). */
export function actionIdOfForm(html: string, buttonText: string): string {
  for (const form of html.match(/<form[\s\S]*?<\/form>/g) ?? []) {
    const id = /name="\$ACTION_ID_([0-9a-f]+)"/.exec(form)?.[1];
    if (id && form.includes(`>${buttonText}<`)) return id;
  }
  throw new Error(`no server-action form with a "${buttonText}" button`);
}

/** Posts a page's form to its server action the way a browser without JavaScript does (multipart, no Next-Action header). */
export async function postAction(path: string, actionId: string, session: Session | undefined, headers: Record<string, string> = {}, fields: Record<string, string> = {}) {
  const { appUrl } = testEnv();
  const form = new FormData();
  form.append(`$ACTION_ID_${actionId}`, "");
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  const response = await fetch(`${appUrl}${path}`, {
    method: "POST",
    redirect: "manual",
    headers: { origin: appUrl, ...headers, ...(session ? { cookie: session.cookie } : {}) },
    body: form,
  });
  return { status: response.status, headers: response.headers, html: await response.text() };
}
