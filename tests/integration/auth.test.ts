// Sign-in against the real database: password check, no user enumeration, rate limiting,
// disabled accounts and role changes taking effect on the next request.
import { eq } from "drizzle-orm";
import { afterEach, describe, expect, it } from "vitest";
import { POST as authPost } from "@/app/api/auth/[...nextauth]/route";
import { GET as listJobsRoute } from "@/app/api/jobs/route";
import { db } from "@/db";
import { isSignInLimited } from "@/db/queries/sign-in";
import { revokeSessions } from "@/db/queries/users";
import { signInFailures, users } from "@/db/schema";
import { authOptions } from "@/lib/auth/options";
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

  it("limits an account after 5 failures and answers 429 with a clear message", async () => {
    for (let i = 0; i < 5; i++)
      expect(await authorize("engineer@halvard.example", "wrong", `10.0.1.${i}`)).toBeNull();
    expect(await isSignInLimited("engineer@halvard.example", "10.9.9.9")).toBe(true);
    // Even the right password is refused while limited.
    expect(await authorize("engineer@halvard.example", "trammel-demo")).toBeNull();
    const body = new URLSearchParams({
      email: "engineer@halvard.example",
      password: "trammel-demo",
      csrfToken: "x",
    });
    const res = await authPost(
      request("/api/auth/callback/credentials", {
        method: "POST",
        body,
        headers: { "content-type": "application/x-www-form-urlencoded" },
      }),
      {
        params: Promise.resolve({ nextauth: ["callback", "credentials"] }),
      },
    );
    expect(res.status).toBe(429);
    const json = await res.json();
    expect(json.error.code).toBe("rate_limited");
    expect(json.error.message).toMatch(/Too many failed sign-ins/);
    expect(json.url).toContain("error=RateLimited");
  });

  it("limits an address that tries many accounts", async () => {
    for (let i = 0; i < 20; i++) await authorize(`guess${i}@halvard.example`, "wrong", "10.0.2.1");
    expect(await isSignInLimited("admin@halvard.example", "10.0.2.1")).toBe(true);
    expect(await isSignInLimited("admin@halvard.example", "10.0.2.2")).toBe(false);
  });

  it("a successful sign-in clears the account's failures", async () => {
    for (let i = 0; i < 4; i++) await authorize("installer@halvard.example", "wrong");
    expect(await authorize("installer@halvard.example", "trammel-demo")).not.toBeNull();
    expect(await isSignInLimited("installer@halvard.example", "10.0.0.1")).toBe(false);
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
