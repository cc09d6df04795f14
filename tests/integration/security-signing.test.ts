// The password re-entry at signing was not rate-limited: a password oracle for anyone holding a
// session. It is now counted by the sign-in limiter; past the limit signing is refused (429) for
// the delay, even with the right password, and the refusal is in the audit trail.
// OWASP ASVS v4.0.3 2.2.1 (anti-automation on every credential check) and 7.2.1 (authentication
// decisions logged).
import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { SIGNING_REENTRY_KEY } from "@/db/queries/sign-in";
import { signJobWork } from "@/db/queries/signatures";
import { getActor } from "@/db/queries/users";
import { signInFailures } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { jobIdByReference, signInAs } from "./helpers";
import { auditEventsOf } from "./fixtures";

afterAll(async () => {
  await db.delete(signInFailures);
});

async function refusal(p: Promise<unknown>): Promise<AppError> {
  const e = await p.then(
    () => null,
    (err: unknown) => err,
  );
  if (!(e instanceof AppError)) throw new Error(`expected an AppError, got ${String(e)}`);
  return e;
}

describe("password re-entry at signing", () => {
  it("five wrong passwords pause signing for the account, audited; the right one waits too", async () => {
    const id = await signInAs("inspector@halvard.example");
    const actor = (await getActor(id!))!;
    const jobId = await jobIdByReference("TR-2026-0052");
    const sign = (password: string) => signJobWork(actor, { jobId, meaning: "inspected", password });
    for (let i = 0; i < 5; i++) expect((await refusal(sign("wrong"))).status).toBe(422);
    const limited = await refusal(sign("trammel-demo"));
    expect(limited.status).toBe(429);
    expect(limited.code).toBe("rate_limited");
    expect(limited.message).toMatch(/Signing is paused for 1 minute/);
    const events = await auditEventsOf({ entityId: actor.id }, "signature.password_limited");
    expect(events.length).toBeGreaterThanOrEqual(1);
    // The failures count against the account like sign-in failures do, under their own key.
    const rows = await db
      .select()
      .from(signInFailures)
      .where(eq(signInFailures.address, SIGNING_REENTRY_KEY));
    expect(rows.length).toBe(5);
  });
});
