/**
 * Route handlers for signed-in users: `route()`'s checks (error shape, UUID path parameters,
 * cross-site refusal), then the session's user (401 without one), then the path's parameters.
 * Every API route but health, ping and report verification starts this way; what the user may
 * do is then the query's to decide, through lib/policy.
 */
import "server-only";
import type { Actor } from "@/lib/domain/roles";
import { route } from "@/lib/http";
import { requireUser } from "./session";

type Params = Record<string, string>;

export function signedInRoute<P extends Params = Params>(
  fn: (req: Request, actor: Actor, params: P) => Promise<Response>,
) {
  return route<{ params: Promise<P> } | undefined>(async (req, ctx) => {
    const actor = await requireUser();
    return fn(req, actor, ctx ? await ctx.params : ({} as P));
  });
}
