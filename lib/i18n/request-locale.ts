import "server-only";
import { cookies, headers } from "next/headers";
import { unstable_rethrow } from "next/navigation";
import { currentActor } from "@/lib/session";
import { type Locale, defaultLocale, isLocale, localeCookie, negotiateLocale } from "./config";

/**
 * The language of a page or server action, in one place: the signed-in person's setting (stored on the
 * user, so it holds on every device), else the cookie (the choice made before signing in, or the last
 * person's on this browser), else the browser's Accept-Language, else English.
 */
export async function requestLocale(): Promise<Locale> {
  const actor = await currentActor().catch((error: unknown) => {
    // Next's own signals (a page that turns out dynamic at build time) are not failures: let them through.
    unstable_rethrow(error);
    console.error("the signed-in person could not be read; choosing the language without them", error);
    return null;
  });
  if (actor) return actor.locale;
  const fromCookie = (await cookies()).get(localeCookie)?.value;
  if (isLocale(fromCookie)) return fromCookie;
  return negotiateLocale((await headers()).get("accept-language")) ?? defaultLocale;
}
