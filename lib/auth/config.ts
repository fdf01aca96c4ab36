import NextAuth, { CredentialsSignin } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import "next-auth/jwt";
import type { Role } from "@/db/schema";
import { checkCredentials } from "@/lib/data/sign-in";
import { parseInput } from "@/lib/validation/parse";
import { signInSchema } from "@/lib/validation/users";

declare module "next-auth" {
  interface User {
    role?: Role;
    sessionVersion?: number;
  }
  interface Session {
    user: { id: string; role: Role; sessionVersion: number; email: string; name: string };
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    uid?: string;
    role?: Role;
    sv?: number;
  }
}

class RateLimited extends CredentialsSignin {
  code = "rateLimited";
}

export const { handlers, auth, signIn, signOut } = NextAuth({
  trustHost: true,
  logger: {
    // A wrong password is an everyday event, not a server error worth a stack trace.
    error(error) {
      if (error.name === "CredentialsSignin" || (error as { type?: string }).type === "CredentialsSignin") return;
      console.error(error);
    },
  },
  session: { strategy: "jwt", maxAge: 12 * 60 * 60 },
  pages: { signIn: "/signin" },
  providers: [
    Credentials({
      credentials: { email: {}, password: {} },
      async authorize(raw) {
        const parsed = parseInput(signInSchema, raw);
        if (!parsed.success) return null;
        const result = await checkCredentials(parsed.data.email, parsed.data.password);
        if (result.kind === "rateLimited") throw new RateLimited();
        if (result.kind !== "ok") return null;
        const { user } = result;
        return { id: user.id, email: user.email, name: user.name, role: user.role, sessionVersion: user.sessionVersion };
      },
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user) {
        token.uid = user.id;
        token.role = user.role;
        token.sv = user.sessionVersion;
      }
      return token;
    },
    session({ session, token }) {
      session.user = {
        ...session.user,
        id: token.uid ?? "",
        role: token.role ?? "designer",
        sessionVersion: token.sv ?? 0,
        email: token.email ?? "",
        name: token.name ?? "",
      };
      return session;
    },
  },
});
