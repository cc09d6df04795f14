// Sign-in against the real database: password check, no user enumeration, rate limiting,
// disabled accounts and role changes taking effect on the next request.
import { eq } from "drizzle-orm";
import { afterEach, describe, expect, it } from "vitest";
import { GET as authGet, POST as authPost } from "@/app/api/auth/[...nextauth]/route";
import { GET as listJobsRoute } from "@/app/api/jobs/route";
import { db } from "@/db";
import { isSignInLimited, signInLimit } from "@/db/queries/sign-in";
import { revokeSessions } from "@/db/queries/users";
import { signInFailures, users } from "@/db/schema";
import { authOptions } from "@/lib/auth/options";
import { requirePageUser, SESSION_ABSOLUTE_MS } from "@/lib/auth/session";
import { request, signInAs } from "./helpers";

type Authorize = (c: Record<string, string>, req: { headers: Record<string, string> }) => Promise<unknown>;
const credentials = authOptions.providers[0] as unknown as { options: { authorize: Authorize } };
const authorize = (email: string, password: string, address = "10.0.0.1") =>
  credentials.options.authorize({ email, password }, { headers: { "x-forwarded-for": address } });

afterEach(async () => {
  await db.delete(signInFailures);
  await db
    .update(users)
    .set({ disabled: false, role: "inspector", sessionsValidAfter: null })
    .where(eq(users.email, "inspector@halvard.example"));
});

describe("credentials sign-in", () => {
  it("accepts the right password and returns id, role and company", async () => {
    const user = (await authorize("buyer@marlowcreek.example", "trammel-demo")) as {
      role: string;
      customerId: string | null;
      email: string;
    };
    expect(user.role).toBe("customer");
    expect(user.customerId).toMatch(/^[0-9a-f-]{36}$/);
    expect(user.email).toBe("buyer@marlowcreek.example");
  });

  it("matches the e-mail case-insensitively", async () => {
    expect(await authorize("  Admin@Halvard.EXAMPLE ", "trammel-demo")).not.toBeNull();
  });

  it("refuses a wrong password and an unknown e-mail alike (no enumeration)", async () => {
    expect(await authorize("admin@halvard.example", "wrong")).toBeNull();
    expect(await authorize("nobody@halvard.example", "trammel-demo")).toBeNull();
  });

  // OWASP ASVS v4.0.3 2.2.1: anti-automation that a stranger cannot turn into a lock-out of the owner.
  it("5 failures for an account from one address delay that address only; the owner elsewhere signs in", async () => {
    for (let i = 0; i < 5; i++)
      expect(await authorize("engineer@halvard.example", "wrong", "10.0.1.1")).toBeNull();
    expect(await isSignInLimited("engineer@halvard.example", "10.0.1.1")).toBe(true);
    // Even the right password waits at the address that failed …
    expect(await authorize("engineer@halvard.example", "trammel-demo", "10.0.1.1")).toBeNull();
    // … but the account is not locked for its owner somewhere else (it was, for 15 minutes, before).
    expect(await isSignInLimited("engineer@halvard.example", "10.9.9.9")).toBe(false);
    expect(await authorize("engineer@halvard.example", "trammel-demo", "10.9.9.9")).not.toBeNull();
  });

  it("the delay grows with each failure past the limit and the 429 names the wait truthfully", async () => {
    const at = new Date(Date.now() - 1000);
    const row = { emailKey: "engineer@halvard.example", address: "10.0.1.2", at };
    await db.insert(signInFailures).values(Array.from({ length: 5 }, () => row));
    const first = await signInLimit("engineer@halvard.example", "10.0.1.2");
    await db.insert(signInFailures).values([row, row]);
    const third = await signInLimit("engineer@halvard.example", "10.0.1.2");
    // 1 minute after the 5th failure, 4 minutes after the 7th (doubling), both counted from the last one.
    expect(first.retryAfterS).toBeGreaterThan(55);
    expect(first.retryAfterS).toBeLessThanOrEqual(60);
    expect(third.retryAfterS).toBeGreaterThan(235);
    expect(third.retryAfterS).toBeLessThanOrEqual(240);
    const body = new URLSearchParams({ email: "engineer@halvard.example", password: "x", csrfToken: "x" });
    const res = await authPost(
      request("/api/auth/callback/credentials", {
        method: "POST",
        body,
        headers: { "content-type": "application/x-www-form-urlencoded", "x-forwarded-for": "10.0.1.2" },
      }),
      { params: Promise.resolve({ nextauth: ["callback", "credentials"] }) },
    );
    expect(res.status).toBe(429);
    expect(Number(res.headers.get("retry-after"))).toBeGreaterThan(235);
    const json = await res.json();
    expect(json.error.code).toBe("rate_limited");
    // No promise of an administrator's reset that the app cannot give, and the real wait.
    expect(json.error.message).toMatch(/Try again in 4 minutes/);
    expect(json.error.message).toMatch(/Forgot your password/);
    expect(json.url).toContain("error=RateLimited");
  });

  it("limits an address that tries many accounts", async () => {
    for (let i = 0; i < 20; i++) await authorize(`guess${i}@halvard.example`, "wrong", "10.0.2.1");
    expect(await isSignInLimited("admin@halvard.example", "10.0.2.1")).toBe(true);
    expect(await isSignInLimited("admin@halvard.example", "10.0.2.2")).toBe(false);
  });

  it("an account tried from very many addresses is slowed (not locked) everywhere: the backstop", async () => {
    for (let i = 0; i < 49; i++) await authorize("engineer@halvard.example", "wrong", `10.3.${i}.1`);
    expect(await isSignInLimited("engineer@halvard.example", "10.9.9.9")).toBe(false);
    await authorize("engineer@halvard.example", "wrong", "10.3.99.1");
    const d = await signInLimit("engineer@halvard.example", "10.9.9.9");
    expect(d.limited).toBe(true);
    expect(d.retryAfterS).toBeLessThanOrEqual(60);
  });

  it("a successful sign-in clears that address's failures for the account", async () => {
    for (let i = 0; i < 4; i++) await authorize("installer@halvard.example", "wrong");
    expect(await authorize("installer@halvard.example", "trammel-demo")).not.toBeNull();
    await authorize("installer@halvard.example", "wrong");
    expect(await isSignInLimited("installer@halvard.example", "10.0.0.1")).toBe(false);
  });

  it("X-Forwarded-For counts only as far as TRUSTED_PROXIES trusts it (unit rules in throttle.test)", async () => {
    // Unset here: a forged left-hand entry does not choose the key; the rightmost one does.
    for (let i = 0; i < 5; i++) await authorize("engineer@halvard.example", "wrong", `1.2.3.${i}, 10.0.4.1`);
    expect(await isSignInLimited("engineer@halvard.example", "10.0.4.1")).toBe(true);
  });
});

describe("sessions follow the database", () => {
  it("a disabled user is refused on the next request, without waiting for token expiry", async () => {
    await signInAs("inspector@halvard.example");
    expect((await listJobsRoute(request("/api/jobs"), undefined)).status).toBe(200);
    await db.update(users).set({ disabled: true }).where(eq(users.email, "inspector@halvard.example"));
    expect((await listJobsRoute(request("/api/jobs"), undefined)).status).toBe(401);
    expect(await authorize("inspector@halvard.example", "trammel-demo")).toBeNull();
  });

  it("a role change takes effect on the next request", async () => {
    await signInAs("inspector@halvard.example");
    const before = (await (await listJobsRoute(request("/api/jobs"), undefined)).json()) as {
      jobs: unknown[];
    };
    expect(before.jobs.length).toBeGreaterThanOrEqual(4);
    // Demoted to installer: now only the jobs assigned to them (none).
    await db.update(users).set({ role: "installer" }).where(eq(users.email, "inspector@halvard.example"));
    const after = (await (await listJobsRoute(request("/api/jobs"), undefined)).json()) as {
      jobs: unknown[];
    };
    expect(after.jobs).toHaveLength(0);
  });

  it("sign-out revokes every earlier session of the account, not later ones", async () => {
    const signedIn = Date.now() - 1000;
    const id = await signInAs("inspector@halvard.example", signedIn);
    expect((await listJobsRoute(request("/api/jobs"), undefined)).status).toBe(200);
    await revokeSessions(id!);
    expect((await listJobsRoute(request("/api/jobs"), undefined)).status).toBe(401);
    await signInAs("inspector@halvard.example", Date.now() + 1000);
    expect((await listJobsRoute(request("/api/jobs"), undefined)).status).toBe(200);
  });

  it("next-auth's sign-out event revokes the token's account", async () => {
    const id = await signInAs("inspector@halvard.example", Date.now() - 1000);
    await authOptions.events!.signOut!({ token: { sub: id! }, session: null as never });
    expect((await listJobsRoute(request("/api/jobs"), undefined)).status).toBe(401);
  });
});

// OWASP ASVS v4.0.3 3.3.1 (logout and expiry invalidate the session), 3.3.2 (an absolute lifetime
// beside the idle one), 3.3.4 / 3.7.1 (a disabled or revoked account has no session anywhere).
describe("sessions end for real, and say so", () => {
  it("GET /api/auth/session answers {} for a disabled account and clears its cookie (it answered with a session)", async () => {
    await signInAs("inspector@halvard.example");
    await db.update(users).set({ disabled: true }).where(eq(users.email, "inspector@halvard.example"));
    const res = await authGet(
      request("/api/auth/session", { headers: { cookie: "next-auth.session-token=abc; other=1" } }),
      { params: Promise.resolve({ nextauth: ["session"] }) },
    );
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({});
    expect(res.headers.get("set-cookie")).toMatch(/^next-auth\.session-token=; Path=\/; Max-Age=0/);
  });

  it("… and for a revoked session", async () => {
    const id = await signInAs("inspector@halvard.example", Date.now() - 5000);
    await revokeSessions(id!);
    const res = await authGet(request("/api/auth/session"), {
      params: Promise.resolve({ nextauth: ["session"] }),
    });
    expect(await res.json()).toEqual({});
  });

  it("a session signed in more than 12 hours ago is over, however active; the 401 says the session ended", async () => {
    await signInAs("inspector@halvard.example", Date.now() - SESSION_ABSOLUTE_MS + 60_000);
    expect((await listJobsRoute(request("/api/jobs"), undefined)).status).toBe(200);
    await signInAs("inspector@halvard.example", Date.now() - SESSION_ABSOLUTE_MS - 1000);
    const res = await listJobsRoute(request("/api/jobs"), undefined);
    expect(res.status).toBe(401);
    expect((await res.json()).error.message).toMatch(/session has ended/);
    expect(SESSION_ABSOLUTE_MS).toBe(12 * 3600_000);
  });

  it("a page visited with an ended session sends the person to sign in with the reason", async () => {
    await signInAs("inspector@halvard.example", Date.now() - SESSION_ABSOLUTE_MS - 1000);
    const err = await requirePageUser("/jobs").then(
      () => null,
      (e: unknown) => e,
    );
    expect(String((err as { digest?: string }).digest)).toContain(
      "/login?error=SessionEnded&callbackUrl=%2Fjobs",
    );
  });
});
