// The probe's open redirect: a signed-in visitor to /login?callbackUrl=/%5Cevil.example was sent
// to `/\evil.example`, which a browser reads as another host.
// OWASP ASVS v4.0.3 5.1.5: redirects only to destinations on an allow list (here: our own origin).
import { describe, expect, it } from "vitest";
import LoginPage from "@/app/(auth)/login/page";
import { authOptions } from "@/lib/auth/options";
import { signInAs } from "./helpers";

/** Where Next's redirect() would send the browser (its digest is `NEXT_REDIRECT;type;url;status;`). */
async function redirectTarget(callbackUrl: string): Promise<string | null> {
  const err = await LoginPage({ searchParams: Promise.resolve({ callbackUrl }) }).then(
    () => null,
    (e: unknown) => e,
  );
  const digest = String((err as { digest?: string } | null)?.digest ?? "");
  return digest.startsWith("NEXT_REDIRECT;") ? digest.split(";")[2]! : null;
}

describe("after sign-in, only paths on this app", () => {
  it("a signed-in visit with a backslash, tab or double-slash callback goes to the jobs list", async () => {
    await signInAs("admin@halvard.example");
    for (const evil of ["/\\evil.example", "/\t/evil.example", "/\\/evil.example", "//evil.example"])
      expect(await redirectTarget(evil)).toBe("/jobs");
    expect(await redirectTarget("/jobs/abc?x=1")).toBe("/jobs/abc?x=1");
  });

  it("next-auth's redirect callback (the sign-in form's callbackUrl) keeps to the app's origin", async () => {
    const redirect = authOptions.callbacks!.redirect!;
    const baseUrl = "http://127.0.0.1:3000";
    expect(await redirect({ url: "/\\evil.example", baseUrl })).toBe(`${baseUrl}/jobs`);
    expect(await redirect({ url: "https://evil.example/x", baseUrl })).toBe(`${baseUrl}/jobs`);
    expect(await redirect({ url: `${baseUrl}/jobs/1`, baseUrl })).toBe(`${baseUrl}/jobs/1`);
    expect(await redirect({ url: "/registers", baseUrl })).toBe(`${baseUrl}/registers`);
  });
});
