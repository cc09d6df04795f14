// The headers every response carries (the probe found the upload route, which the proxy does not
// see, without CSP, frame and referrer headers; and no HSTS where TLS is terminated in front).
// OWASP ASVS v4.0.3 14.4.3 (CSP), 14.4.4 (nosniff), 14.4.5 (HSTS), 14.4.6 (Referrer-Policy),
// 14.4.7 (framing refused).
import { describe, expect, it } from "vitest";
import { contentSecurityPolicy, HSTS_VALUE, securityHeaderEntries } from "@/lib/security-headers";

const asMap = (e: [string, string][]) => new Map(e.map(([k, v]) => [k.toLowerCase(), v]));

describe("security headers", () => {
  it("name CSP, nosniff, frame refusal, referrer and permissions policies", () => {
    const h = asMap(securityHeaderEntries(undefined, "http://localhost:3000"));
    expect(h.get("content-security-policy")).toContain("frame-ancestors 'none'");
    expect(h.get("content-security-policy")).toContain("script-src 'self'");
    expect(h.get("x-content-type-options")).toBe("nosniff");
    expect(h.get("x-frame-options")).toBe("DENY");
    expect(h.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
    expect(h.has("strict-transport-security")).toBe(false);
  });

  it("add HSTS for a year when PUBLIC_URL is https, and only then", () => {
    expect(
      asMap(securityHeaderEntries(undefined, "https://trammel.example")).get("strict-transport-security"),
    ).toBe(HSTS_VALUE);
    expect(HSTS_VALUE).toMatch(/max-age=31536000/);
    expect(asMap(securityHeaderEntries(undefined, undefined)).has("strict-transport-security")).toBe(false);
  });

  it("a page's policy carries its nonce; a route's policy allows no inline script", () => {
    expect(contentSecurityPolicy("abc", false)).toContain("'nonce-abc'");
    expect(contentSecurityPolicy(null, false)).not.toContain("nonce");
    expect(contentSecurityPolicy(null, false)).not.toContain("unsafe-inline' 'nonce");
  });
});
