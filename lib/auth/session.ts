/**
 * The one place that reads the session. The token only says who signed in; role, company and
 * whether the account is still enabled (and the session not revoked) are read fresh from the
 * database on every request.
 */
import "server-only";
import { cache } from "react";
import { redirect } from "next/navigation";
import { getActor } from "@/db/queries/users";
import { forbidden, unauthorized } from "@/lib/errors";
import type { Actor, Role } from "@/lib/domain/roles";
import { roleRefusal } from "@/lib/policy/roles";
import { sameOriginPath } from "./redirect";
import { readSessionIdentity } from "./session-token";

/**
 * However active a session stays, it ends this long after its sign-in (beside next-auth's idle
 * expiry, SESSION_MAX_AGE_S): a stolen or forgotten session cannot be kept alive for ever.
 */
export const SESSION_ABSOLUTE_MS = 12 * 3600_000;

/** True when a session that signed in at `signedInAt` is past its absolute lifetime (or never said when). */
export function pastAbsoluteLifetime(signedInAt: number, now = Date.now()): boolean {
  return !(signedInAt > 0) || now - signedInAt > SESSION_ABSOLUTE_MS;
}

/** Read once per request (layouts and pages share it through React's request cache). */
export const getCurrentUser = cache(async (): Promise<Actor | null> => {
  const identity = await readSessionIdentity();
  if (!identity || pastAbsoluteLifetime(identity.signedInAt)) return null;
  return getActor(identity.id, identity.signedInAt);
});

/**
 * True when the request carries a session that is no longer good: its account was disabled, its
 * sessions revoked (sign-out, role change, new password), or it is past its absolute lifetime.
 */
export async function sessionEnded(): Promise<boolean> {
  return (await readSessionIdentity()) !== null && (await getCurrentUser()) === null;
}

export const SESSION_ENDED_MESSAGE =
  "Your session has ended (signed out, the account changed, or 12 hours passed). Sign in again.";

/** For route handlers and actions: throws 401 when nobody is signed in, saying so when a session ended. */
export async function requireUser(): Promise<Actor> {
  const actor = await getCurrentUser();
  if (!actor) throw (await sessionEnded()) ? unauthorized(SESSION_ENDED_MESSAGE) : unauthorized();
  return actor;
}

/** Throws 401 without a session and 403 when the role is not one of `roles`. */
export async function requireRole(...roles: Role[]): Promise<Actor> {
  const actor = await requireUser();
  if (roleRefusal(actor, roles)) throw forbidden();
  return actor;
}

/** For pages: sends an anonymous visitor to the sign-in page. */
export async function requirePageUser(callbackPath?: string): Promise<Actor> {
  const actor = await getCurrentUser();
  if (!actor) {
    const query = new URLSearchParams();
    // The sign-in page tells the person their session ended, rather than just asking them to sign in.
    if (await sessionEnded()) query.set("error", "SessionEnded");
    const back = sameOriginPath(callbackPath);
    if (back) query.set("callbackUrl", back);
    redirect(query.size ? `/login?${query}` : "/login");
  }
  return actor;
}
