import { testEnv } from "./env";

export interface Session {
  cookie: string;
}

const cookiesOf = (response: Response) => response.headers.getSetCookie().map((c) => c.split(";")[0]);

/** Signs in through the app's own Auth.js endpoints, as a browser would, and returns the session cookie. */
export async function signIn(email: string, password: string): Promise<Session | null> {
  const { appUrl } = testEnv();
  const csrf = await fetch(`${appUrl}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const csrfCookies = cookiesOf(csrf);
  const response = await fetch(`${appUrl}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: csrfCookies.join("; "), origin: appUrl },
    body: new URLSearchParams({ csrfToken, email, password, callbackUrl: `${appUrl}/` }),
  });
  const session = cookiesOf(response).find((c) => c.includes("authjs.session-token="));
  return session ? { cookie: session } : null;
}

interface CallOptions {
  session?: Session;
  token?: string;
  body?: unknown;
  rawBody?: string;
  headers?: Record<string, string>;
}

/** Calls the JSON API; answers the status and the parsed body. */
export async function api(method: string, path: string, options: CallOptions = {}) {
  const { appUrl } = testEnv();
  const headers: Record<string, string> = { accept: "application/json", ...options.headers };
  if (options.session) headers.cookie = options.session.cookie;
  if (options.token) headers.authorization = `Bearer ${options.token}`;
  let body: string | undefined;
  if (options.body !== undefined) {
    body = JSON.stringify(options.body);
    headers["content-type"] ??= "application/json";
  } else if (options.rawBody !== undefined) {
    body = options.rawBody;
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
