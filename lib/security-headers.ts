/**
 * The security headers every response carries, in one place: the proxy sets them on pages and
 * on the routes it sees (with a per-request script nonce), lib/http's route() on the responses
 * of the routes it does not see (the streaming upload). HSTS is sent when the public address is
 * https, i.e. when TLS is terminated in front of the app (PUBLIC_URL).
 */
import { env } from "./env";

export function contentSecurityPolicy(nonce: string | null, dev: boolean): string {
  return [
    "default-src 'self'",
    nonce
      ? `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ""}`
      : "script-src 'self'",
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

/** One year, the usual HSTS lifetime; subdomains included. */
export const HSTS_VALUE = "max-age=31536000; includeSubDomains";

/** True when the app is reached over https (PUBLIC_URL says so). */
export function servedOverHttps(publicUrl = env.PUBLIC_URL): boolean {
  return !!publicUrl && publicUrl.toLowerCase().startsWith("https:");
}

/** Header name → value; `csp` defaults to the nonce-less policy for responses that are not pages. */
export function securityHeaderEntries(
  csp = contentSecurityPolicy(null, false),
  publicUrl = env.PUBLIC_URL,
): [string, string][] {
  const headers: [string, string][] = [
    ["Content-Security-Policy", csp],
    ["X-Content-Type-Options", "nosniff"],
    ["X-Frame-Options", "DENY"],
    ["Referrer-Policy", "strict-origin-when-cross-origin"],
    ["Permissions-Policy", "camera=(), microphone=(), geolocation=()"],
    ["Cross-Origin-Opener-Policy", "same-origin"],
  ];
  if (servedOverHttps(publicUrl)) headers.push(["Strict-Transport-Security", HSTS_VALUE]);
  return headers;
}
