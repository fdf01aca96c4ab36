import "server-only";
import { cookies } from "next/headers";
import { type Locale, localeCookie } from "./config";

/**
 * Keeps the language in a cookie too, for the pages before sign-in on this browser. Called at sign-in and
 * whenever the language changes, so it follows the person's setting; the setting itself lives on the user.
 * Only in a server action or route handler (where cookies can be set).
 */
export async function rememberLocale(locale: Locale): Promise<void> {
  (await cookies()).set(localeCookie, locale, {
    path: "/",
    maxAge: 60 * 60 * 24 * 365,
    sameSite: "lax",
    httpOnly: true,
    secure: (process.env.APP_URL ?? "").startsWith("https://"),
  });
}
