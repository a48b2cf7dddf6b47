import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { ApiError } from "../api/errors";
import { env } from "../config/env";
import { authenticate, revokeSessions } from "../services/accounts";
import { SignInSchema } from "../validation/account";
import { clientIp } from "./client-ip";

/**
 * next-auth configuration: e-mail and password, JWT sessions carrying the
 * user's id and roles. Cookies are HttpOnly and SameSite=Lax (next-auth's
 * defaults); the roles in the token are a hint for navigation only: guards
 * re-read them from the database before anything that matters.
 */
export function authOptions(): NextAuthOptions {
  return {
    secret: env().NEXTAUTH_SECRET,
    session: { strategy: "jwt", maxAge: 7 * 24 * 3600 },
    pages: { signIn: "/sign-in", error: "/sign-in" },
    providers: [
      CredentialsProvider({
        name: "E-mail and password",
        credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
        async authorize(credentials, req) {
          const parsed = SignInSchema.safeParse(credentials ?? {});
          if (!parsed.success) return null;
          const headers = new Headers(req?.headers as Record<string, string> | undefined);
          try {
            const account = await authenticate(parsed.data, clientIp(headers));
            return {
              id: account.id,
              email: account.email,
              name: account.displayName,
              roles: account.roles,
              sessionVersion: account.sessionVersion,
            };
          } catch (e) {
            if (e instanceof ApiError && e.code === "invalid_credentials") return null;
            // next-auth answers a thrown error with "?error=<message>": the form words this one for the owner.
            if (e instanceof ApiError && e.details?.reason === "unconfirmed") throw new Error("unconfirmed");
            throw e;
          }
        },
      }),
    ],
    callbacks: {
      async jwt({ token, user }) {
        if (user) {
          token.uid = user.id;
          token.roles = user.roles;
          token.sv = user.sessionVersion;
        }
        return token;
      },
      async session({ session, token }) {
        session.user = { ...session.user, id: token.uid, roles: token.roles ?? [], sv: token.sv ?? 0 };
        return session;
      },
    },
    events: {
      // Signing out ends every session of the account, so a copied token stops working too.
      async signOut({ token }) {
        if (token?.uid) await revokeSessions(token.uid);
      },
    },
  };
}
