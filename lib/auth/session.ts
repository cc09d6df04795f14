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
import type { Actor, Role } from "./roles";
import { sameOriginPath } from "./redirect";
import { readSessionIdentity } from "./session-token";

/** Read once per request (layouts and pages share it through React's request cache). */
export const getCurrentUser = cache(async (): Promise<Actor | null> => {
  const identity = await readSessionIdentity();
  if (!identity) return null;
  return getActor(identity.id, identity.signedInAt);
});

/** For route handlers and actions: throws 401 when nobody is signed in. */
export async function requireUser(): Promise<Actor> {
  const actor = await getCurrentUser();
  if (!actor) throw unauthorized();
  return actor;
}

/** Throws 401 without a session and 403 when the role is not one of `roles`. */
export async function requireRole(...roles: Role[]): Promise<Actor> {
  const actor = await requireUser();
  if (!roles.includes(actor.role)) throw forbidden();
  return actor;
}

/** For pages: sends an anonymous visitor to the sign-in page. */
export async function requirePageUser(callbackPath?: string): Promise<Actor> {
  const actor = await getCurrentUser();
  if (!actor) {
    const back = sameOriginPath(callbackPath);
    redirect(back ? `/login?callbackUrl=${encodeURIComponent(back)}` : "/login");
  }
  return actor;
}
