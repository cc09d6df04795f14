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

/** How many decoded tokens each process keeps (one per signed-in browser; the oldest goes first). */
export const MAX_CACHED_TOKENS = 1000;
/** jose's clock tolerance as next-auth calls it: a token is good until 15 s after its exp. */
const CLOCK_TOLERANCE_MS = 15_000;
type Decoded = SessionIdentity & { expMs: number };
const decodedBySecret = new Map<string, Map<string, Decoded>>();

/**
 * Decodes the session cookie among `cookieJar`; null for none, a forged, tampered or expired one.
 * A token that decoded is remembered by its exact text, so the next request with the same cookie
 * skips the key derivation (HKDF) and AES-GCM decryption — twice per request, once in the proxy
 * and once in the handler. Only tokens that decrypted under the secret are remembered, and each
 * is refused again once past its own expiry; revocation stays with the caller's database read.
 */
export async function identityFromCookies(
  cookieJar: Record<string, string>,
  secret = authSecret,
  now = Date.now(),
): Promise<SessionIdentity | null> {
  const names = Object.keys(cookieJar)
    .filter((n) => n.includes("next-auth.session-token"))
    .sort();
  if (!names.length) return null;
  const key = names.map((n) => `${n}=${cookieJar[n]}`).join(";");
  let cache = decodedBySecret.get(secret);
  if (!cache) decodedBySecret.set(secret, (cache = new Map()));
  const hit = cache.get(key);
  if (hit) {
    if (now <= hit.expMs + CLOCK_TOLERANCE_MS) return { id: hit.id, signedInAt: hit.signedInAt };
    cache.delete(key);
    return null;
  }
  // Only cookies: unlike getToken's default, an Authorization: Bearer header is not a session here.
  const req = { cookies: cookieJar, headers: {} } as unknown as Parameters<typeof getToken>[0]["req"];
  const token = await getToken({ req, secret });
  const id = typeof token?.sub === "string" ? token.sub : "";
  if (!id) return null;
  const identity = { id, signedInAt: typeof token?.signedInAt === "number" ? token.signedInAt : 0 };
  // next-auth always sets exp; a token without one is not remembered.
  if (typeof token?.exp === "number") {
    if (cache.size >= MAX_CACHED_TOKENS) cache.delete(cache.keys().next().value!);
    cache.set(key, { ...identity, expMs: token.exp * 1000 });
  }
  return identity;
}

/** The session cookies (whole or in numbered chunks, with or without the __Secure- prefix) among a request's cookies. */
export function sessionCookieJar(
  all: ReadonlyArray<{ name: string; value: string }>,
): Record<string, string> {
  const jar: Record<string, string> = {};
  for (const c of all) if (c.name.includes("next-auth.session-token")) jar[c.name] = c.value;
  return jar;
}

/** The identity of the current request's session cookie. */
export async function readSessionIdentity(): Promise<SessionIdentity | null> {
  return identityFromCookies(sessionCookieJar((await cookies()).getAll()));
}
