// Signs in through the app's own Auth.js endpoints, as a browser would, for scripts that call the API
// with a session cookie (scripts/load-test.ts, scripts/crash-test.ts).
const cookiesOf = (response: Response) => response.headers.getSetCookie().map((c) => c.split(";")[0]);

/** The `authjs.session-token=…` cookie of a fresh session; throws when the sign-in is refused. */
export async function sessionCookie(appUrl: string, email: string, password: string): Promise<string> {
  const csrf = await fetch(`${appUrl}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const response = await fetch(`${appUrl}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookiesOf(csrf).join("; "), origin: appUrl },
    body: new URLSearchParams({ csrfToken, email, password, callbackUrl: `${appUrl}/` }),
  });
  const session = cookiesOf(response).find((c) => c.includes("authjs.session-token="));
  if (!session) throw new Error(`signing in as ${email} failed (${response.status})`);
  return session;
}

/** `--name value` from the command line, as a number, or the default. */
export function numberOption(argv: string[], name: string, fallback: number): number {
  const i = argv.indexOf(name);
  if (i < 0) return fallback;
  const value = Number(argv[i + 1]);
  if (!Number.isFinite(value) || value <= 0) throw new Error(`${name} needs a positive number`);
  return value;
}
