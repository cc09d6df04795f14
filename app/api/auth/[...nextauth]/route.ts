// next-auth's handler, with the sign-in rate limit in front of the credentials callback so that
// too many failures answer 429 with a clear message instead of another "wrong password".
import NextAuth from "next-auth";
import { signInLimit } from "@/db/queries/sign-in";
import { authOptions, clientAddress } from "@/lib/auth/options";
import { sessionEnded } from "@/lib/auth/session";
import { rateLimitMessage } from "@/lib/auth/throttle";
import { forbidden } from "@/lib/errors";
import { crossSiteRefusal, errorResponse } from "@/lib/http";

const handler = NextAuth(authOptions);

type Ctx = { params: Promise<{ nextauth: string[] }> };

async function POST(req: Request, ctx: Ctx) {
  // Sign-in and sign-out are writes too: a page elsewhere may not post them (next-auth's CSRF token aside).
  const refusal = crossSiteRefusal(req);
  if (refusal) return errorResponse(forbidden(refusal));
  const { nextauth } = await ctx.params;
  if (nextauth.join("/") === "callback/credentials") {
    const form = await req
      .clone()
      .formData()
      .catch(() => null);
    const email = String(form?.get("email") ?? "");
    const limit = email ? await signInLimit(email, clientAddress(req.headers)) : null;
    if (limit?.limited) {
      const url = new URL(`/login?error=RateLimited&wait=${limit.retryAfterS}`, req.url).toString();
      return Response.json(
        { url, error: { code: "rate_limited", message: rateLimitMessage(limit.retryAfterS) } },
        { status: 429, headers: { "Retry-After": String(limit.retryAfterS) } },
      );
    }
  }
  return handler(req, ctx);
}

/**
 * GET /api/auth/session answers from the token alone in next-auth (and slides its expiry). Here
 * a session whose account is disabled, whose sessions were revoked or which is past its absolute
 * lifetime gets the answer for no session, `{}`, and its cookie is cleared.
 */
async function GET(req: Request, ctx: Ctx) {
  const { nextauth } = await ctx.params;
  if (nextauth.join("/") === "session" && (await sessionEnded())) {
    const res = Response.json({}, { headers: { "Cache-Control": "no-store" } });
    const names = (req.headers.get("cookie") ?? "")
      .split(";")
      .map((c) => c.split("=")[0]!.trim())
      .filter((n) => n.includes("next-auth.session-token"));
    for (const name of names)
      res.headers.append(
        "Set-Cookie",
        `${name}=; Path=/; Max-Age=0; HttpOnly; SameSite=Lax${name.startsWith("__Secure-") ? "; Secure" : ""}`,
      );
    return res;
  }
  return handler(req, ctx);
}

export { GET, POST };
