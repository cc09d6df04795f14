// Redirect targets after sign-in and set-password: same-origin paths only.
// OWASP ASVS v4.0.3 5.1.5: URL redirects and forwards only allow destinations on an allow list.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DEFAULT_AFTER_SIGN_IN, safeRedirectPath, sameOriginPath } from "@/lib/auth/redirect";

/** How a browser would resolve the target against the app (WHATWG URL, the same parser browsers use). */
const hostAfter = (target: string) => new URL(target, "https://app.example").host;

describe("sameOriginPath", () => {
  it("keeps paths on the app, with their query and fragment", () => {
    expect(sameOriginPath("/jobs/123?tab=data#x")).toBe("/jobs/123?tab=data#x");
    expect(sameOriginPath("/")).toBe("/");
    expect(sameOriginPath("https://app.example/jobs", "https://app.example")).toBe("/jobs");
  });

  it("refuses the probe's open redirects: backslash, tab and double-slash forms", () => {
    // Each of these sends a browser to another host today (checked with the WHATWG parser).
    for (const evil of ["/\\evil.example", "/\t/evil.example", "/\\/evil.example", "//evil.example"]) {
      expect(hostAfter(evil)).toBe("evil.example");
      expect(sameOriginPath(evil)).toBeNull();
      expect(safeRedirectPath(evil)).toBe(DEFAULT_AFTER_SIGN_IN);
    }
  });

  it("refuses other hosts, schemes, encoded tricks and non-strings", () => {
    for (const evil of [
      "https://evil.example/jobs",
      "javascript:alert(1)",
      "evil.example",
      "/%5Cevil.example",
      "/%09/evil.example",
      "/\n/evil.example",
      "/jobs\u0000",
      "%2F%2Fevil.example",
      "",
    ])
      expect(sameOriginPath(evil)).toBeNull();
    expect(sameOriginPath(undefined)).toBeNull();
    expect(sameOriginPath(["/jobs"])).toBeNull();
    expect(sameOriginPath("https://evil.example/jobs", "https://app.example")).toBeNull();
  });

  it("whatever string it is given, the result is null or a path a browser keeps on the app (property)", () => {
    const pieces = fc.constantFrom(
      "/",
      "\\",
      "\t",
      "\n",
      "%5C",
      "%2F",
      "%09",
      ".",
      "evil.example",
      ":",
      "@",
      "?",
      "#",
      "a",
    );
    fc.assert(
      fc.property(
        fc.oneof(
          fc.string(),
          fc.array(pieces, { maxLength: 8 }).map((a) => a.join("")),
        ),
        (s) => {
          const p = sameOriginPath(s);
          if (p === null) return;
          expect(p.startsWith("/")).toBe(true);
          expect(p.startsWith("//")).toBe(false);
          expect(hostAfter(p)).toBe("app.example");
        },
      ),
      { numRuns: 2000 },
    );
  });
});
