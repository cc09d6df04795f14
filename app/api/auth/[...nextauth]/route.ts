// next-auth's handler, with the sign-in rate limit in front of the credentials callback so that
// too many failures answer 429 with a clear message instead of another "wrong password".
import NextAuth from "next-auth";
import { isSignInLimited } from "@/db/queries/sign-in";
import { authOptions, clientAddress } from "@/lib/auth/options";
import { forbidden } from "@/lib/errors";
import { crossSiteRefusal, errorResponse } from "@/lib/http";

const handler = NextAuth(authOptions);

export const RATE_LIMIT_MESSAGE =
  "Too many failed sign-ins for this account or from this address. Wait 15 minutes and try again, or ask your administrator to reset the password.";

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
    if (email && (await isSignInLimited(email, clientAddress(req.headers)))) {
      const url = new URL("/login?error=RateLimited", req.url).toString();
      return Response.json(
        { url, error: { code: "rate_limited", message: RATE_LIMIT_MESSAGE } },
        { status: 429, headers: { "Retry-After": "900" } },
      );
    }
  }
  return handler(req, ctx);
}

export { handler as GET, POST };
