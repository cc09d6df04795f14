// Runs before every request: security headers on every response (lib/security-headers: a
// Content-Security-Policy with a per-request nonce, no framing, no sniffing, a strict referrer
// policy, HSTS when PUBLIC_URL is https), and an early
// redirect of anonymous visitors away from the app's pages. It only redirects: every page,
// route and query checks the user again on the server.
import { NextResponse, type NextRequest } from "next/server";
import { identityFromCookies, sessionCookieJar } from "@/lib/auth/session-token";
import { env } from "@/lib/env";
import { contentSecurityPolicy, securityHeaderEntries } from "@/lib/security-headers";

const PROTECTED_PAGES = ["/jobs", "/heads", "/registers", "/dev"];

function securityHeaders(res: NextResponse, csp: string, signedIn: boolean): NextResponse {
  for (const [name, value] of securityHeaderEntries(csp)) res.headers.set(name, value);
  if (signedIn) res.headers.set("Cache-Control", "no-store");
  return res;
}

export default async function proxy(req: NextRequest) {
  const nonce = btoa(crypto.randomUUID());
  const csp = contentSecurityPolicy(nonce, env.NODE_ENV === "development");
  const token = await identityFromCookies(sessionCookieJar(req.cookies.getAll()));
  const path = req.nextUrl.pathname;
  if (!token && PROTECTED_PAGES.some((p) => path === p || path.startsWith(`${p}/`))) {
    const signIn = new URL("/login", req.url);
    // A session cookie that no longer decodes (expired, or signed with an old secret): say so.
    if (Object.keys(sessionCookieJar(req.cookies.getAll())).length)
      signIn.searchParams.set("error", "SessionEnded");
    signIn.searchParams.set("callbackUrl", `${path}${req.nextUrl.search}`);
    return securityHeaders(NextResponse.redirect(signIn), csp, false);
  }
  const requestHeaders = new Headers(req.headers);
  // Next.js reads the nonce from the request's CSP header and puts it on its own scripts.
  requestHeaders.set("x-nonce", nonce);
  requestHeaders.set("Content-Security-Policy", csp);
  return securityHeaders(NextResponse.next({ request: { headers: requestHeaders } }), csp, !!token);
}

export const config = {
  // Not the dataset upload nor the PDF check: Next buffers (and silently cuts at 10 MB) any body the
  // proxy sees; those routes read their own bodies within their limits (413 past them), and
  // lib/http's route() gives them the same security headers.
  matcher: [
    {
      source:
        "/((?!_next/static|_next/image|favicon.ico|DejaVuSans.ttf|api/jobs/[^/]+/datasets$|api/verify$).*)",
    },
  ],
};
