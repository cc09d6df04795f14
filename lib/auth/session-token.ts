/**
 * Who the session cookie says signed in, read straight from the cookie with next-auth's own
 * token reader (`getToken`: cookie name, chunked cookies, A256GCM decryption, expiry with its
 * usual 15 s tolerance). getServerSession did the same decode but also built the whole auth
 * handler, made a CSRF token and re-encrypted a fresh cookie that a server component cannot set
 * anyway — about half the CPU of a signed-in API request. The token is only an identity: role,
 * company and whether the session is still valid are read from the database by the caller.
 */
import "server-only";
import { getToken } from "next-auth/jwt";
import { cookies } from "next/headers";
import { authSecret } from "@/lib/env";

export interface SessionIdentity {
  id: string;
  /** Milliseconds since the epoch when this session signed in (0 when the token lacks it). */
  signedInAt: number;
}

/** Decodes the session cookie among `cookieJar`; null for none, a forged, tampered or expired one. */
export async function identityFromCookies(cookieJar: Record<string, string>, secret = authSecret): Promise<SessionIdentity | null> {
  // Only cookies: unlike getToken's default, an Authorization: Bearer header is not a session here.
  const req = { cookies: cookieJar, headers: {} } as unknown as Parameters<typeof getToken>[0]["req"];
  const token = await getToken({ req, secret });
  const id = typeof token?.sub === "string" ? token.sub : "";
  if (!id) return null;
  return { id, signedInAt: typeof token?.signedInAt === "number" ? token.signedInAt : 0 };
}

/** The identity of the current request's session cookie. */
export async function readSessionIdentity(): Promise<SessionIdentity | null> {
  const store = await cookies();
  const jar: Record<string, string> = {};
  for (const c of store.getAll()) if (c.name.includes("next-auth.session-token")) jar[c.name] = c.value;
  return identityFromCookies(jar);
}
