// Runs before every request: security headers on every response (a Content-Security-Policy
// with a per-request nonce, no framing, no sniffing, a strict referrer policy), and an early
// redirect of anonymous visitors away from the app's pages. It only redirects: every page,
// route and query checks the user again on the server.
import { NextResponse, type NextRequest } from "next/server";
import { identityFromCookies, sessionCookieJar } from "@/lib/auth/session-token";
import { env } from "@/lib/env";

const PROTECTED_PAGES = ["/jobs", "/heads", "/registers", "/dev"];

export function contentSecurityPolicy(nonce: string, dev: boolean): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ""}`,
    // React style attributes (charts, the 3D view) need inline styles; scripts stay nonce-only.
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    "connect-src 'self'",
    "worker-src 'self' blob:",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

function securityHeaders(res: NextResponse, csp: string, signedIn: boolean): NextResponse {
  res.headers.set("Content-Security-Policy", csp);
  res.headers.set("X-Content-Type-Options", "nosniff");
  res.headers.set("X-Frame-Options", "DENY");
  res.headers.set("Referrer-Policy", "strict-origin-when-cross-origin");
  res.headers.set("Permissions-Policy", "camera=(), microphone=(), geolocation=()");
  res.headers.set("Cross-Origin-Opener-Policy", "same-origin");
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
  // Not the dataset upload: Next buffers (and cuts at 10 MB) any body the proxy sees; that route streams its own.
  matcher: [
    { source: "/((?!_next/static|_next/image|favicon.ico|DejaVuSans.ttf|api/jobs/[^/]+/datasets$).*)" },
  ],
};
