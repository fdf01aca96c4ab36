import "server-only";
import { originOf } from "@/lib/api/cross-site";
import { env } from "@/lib/env";

let cached: ReadonlySet<string> | undefined;

/** The origins the app answers writes from: APP_URL's and every APP_ORIGINS entry. */
export function appOrigins(): ReadonlySet<string> {
  cached ??= new Set([originOf(env().APP_URL), ...env().APP_ORIGINS].filter((o): o is string => o !== null));
  return cached;
}
