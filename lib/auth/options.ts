/**
 * next-auth configuration: e-mail + password credentials, JWT sessions that carry id, role and
 * company, a short lifetime, and our own sign-in page.
 */
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { clearSignInFailures, recordSignInFailure, signInLimit } from "@/db/queries/sign-in";
import { getUserForSignIn, revokeSessions } from "@/db/queries/users";
import { authSecret, env } from "@/lib/env";
import { verifyPassword } from "./password";
import { isRole } from "@/lib/domain/roles";
import { DEFAULT_AFTER_SIGN_IN, sameOriginPath } from "./redirect";
import { clientAddressFrom } from "./throttle";

/** The client address the sign-in limits count, from X-Forwarded-For as far as TRUSTED_PROXIES trusts it. */
export function clientAddress(
  headers: Headers | Record<string, string | string[] | undefined> | undefined,
): string {
  const raw = !headers
    ? undefined
    : headers instanceof Headers
      ? headers.get("x-forwarded-for")
      : headers["x-forwarded-for"];
  return clientAddressFrom(Array.isArray(raw) ? raw.join(",") : raw, env.TRUSTED_PROXIES);
}

export const authOptions: NextAuthOptions = {
  secret: authSecret,
  session: { strategy: "jwt", maxAge: env.SESSION_MAX_AGE_S },
  jwt: { maxAge: env.SESSION_MAX_AGE_S },
  pages: { signIn: "/login", error: "/login" },
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: {
        email: { label: "E-mail", type: "email" },
        password: { label: "Password", type: "password" },
      },
      async authorize(credentials, req) {
        const email = String(credentials?.email ?? "").trim();
        const password = String(credentials?.password ?? "");
        if (!email || !password || email.length > 254 || password.length > 200) return null;
        const address = clientAddress(req?.headers);
        // The route handler answers 429 before this point; this check covers direct callers.
        if ((await signInLimit(email, address)).limited) return null;
        const user = await getUserForSignIn(email);
        const ok = await verifyPassword(password, user?.passwordHash);
        if (!user || !ok || user.disabled || !isRole(user.role)) {
          await recordSignInFailure(email, address);
          return null;
        }
        await clearSignInFailures(email, address);
        return {
          id: user.id,
          email: user.email,
          name: user.name,
          role: user.role,
          customerId: user.customerId,
        };
      },
    }),
  ],
  events: {
    // Signing out ends every session of the account (tokens issued before now are refused).
    async signOut({ token }) {
      if (token?.sub) await revokeSessions(token.sub);
    },
  },
  callbacks: {
    // Every callbackUrl next-auth follows goes through the one same-origin check.
    redirect({ url, baseUrl }) {
      return `${baseUrl}${sameOriginPath(url, baseUrl) ?? DEFAULT_AFTER_SIGN_IN}`;
    },
    jwt({ token, user }) {
      if (user) {
        token.role = user.role;
        token.customerId = user.customerId;
        token.signedInAt = Date.now();
      }
      return token;
    },
    session({ session, token }) {
      session.user = {
        id: token.sub ?? "",
        email: token.email ?? "",
        name: token.name ?? "",
        role: token.role ?? "customer",
        customerId: token.customerId ?? null,
        signedInAt: token.signedInAt ?? 0,
      };
      return session;
    },
  },
};
