import NextAuth, { CredentialsSignin } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import "next-auth/jwt";
import { cookies, headers } from "next/headers";
import type { Role } from "@/db/schema";
import { clientAddressHeader, normalizeAddress, serverMarkerVariable } from "@/lib/client-address";
import { openSession, revokeSession, sessionLifetimeSeconds } from "@/lib/data/sessions";
import { checkCredentials } from "@/lib/data/sign-in";
import { localeAtSignIn } from "@/lib/data/users";
import { localeCookie } from "@/lib/i18n/config";
import { rememberLocale } from "@/lib/i18n/locale-cookie";
import { parseInput } from "@/lib/validation/parse";
import { signInSchema } from "@/lib/validation/users";

declare module "next-auth" {
  interface User {
    role?: Role;
    sessionVersion?: number;
  }
  interface Session {
    user: { id: string; role: Role; sessionVersion: number; sessionId: string; email: string; name: string };
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    uid?: string;
    role?: Role;
    sv?: number;
    /** The user_sessions row of this sign-in (lib/data/sessions.ts). */
    sid?: string;
  }
}

class RateLimited extends CredentialsSignin {
  code = "rateLimited";
}

/**
 * The client's address as scripts/server.ts saw it on the socket. Under any other server the header
 * could come from the client itself, so it is not read at all (the sign-in limit then counts per account).
 */
async function clientAddressOfRequest(): Promise<string | null> {
  if (process.env[serverMarkerVariable] !== "1") return null;
  return normalizeAddress((await headers()).get(clientAddressHeader));
}

export const { handlers, auth, signIn, signOut } = NextAuth({
  trustHost: true,
  // Secure cookies (and the __Secure-/__Host- names) whenever the public address is https, even when TLS ends
  // at a proxy. Read from process.env, not env(): this object is built on import, also during `next build`.
  useSecureCookies: (process.env.APP_URL ?? "").startsWith("https://"),
  logger: {
    // A wrong password is an everyday event, not a server error worth a stack trace.
    error(error) {
      if (error.name === "CredentialsSignin" || (error as { type?: string }).type === "CredentialsSignin") return;
      console.error(error);
    },
  },
  session: { strategy: "jwt", maxAge: sessionLifetimeSeconds },
  pages: { signIn: "/signin" },
  providers: [
    Credentials({
      credentials: { email: {}, password: {} },
      async authorize(raw) {
        const parsed = parseInput(signInSchema, raw);
        if (!parsed.success) return null;
        const result = await checkCredentials(parsed.data.email, parsed.data.password, await clientAddressOfRequest());
        if (result.kind === "rateLimited") throw new RateLimited();
        if (result.kind !== "ok") return null;
        const { user } = result;
        // The first sign-in takes the browser's language; from then on the cookie follows the user's setting.
        const browser = { cookie: (await cookies()).get(localeCookie)?.value, acceptLanguage: (await headers()).get("accept-language") };
        await rememberLocale(await localeAtSignIn(user.id, browser));
        return { id: user.id, email: user.email, name: user.name, role: user.role, sessionVersion: user.sessionVersion };
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        token.uid = user.id;
        token.role = user.role;
        token.sv = user.sessionVersion;
        token.sid = await openSession(user.id!);
      }
      return token;
    },
    session({ session, token }) {
      session.user = {
        ...session.user,
        id: token.uid ?? "",
        role: token.role ?? "designer",
        sessionVersion: token.sv ?? 0,
        sessionId: token.sid ?? "",
        email: token.email ?? "",
        name: token.name ?? "",
      };
      return session;
    },
  },
  events: {
    // POST /api/auth/signout and the header's button both end here: the row goes, so copies of the cookie stop working.
    async signOut(message) {
      if ("token" in message) await revokeSession(message.token?.sid);
    },
  },
});
