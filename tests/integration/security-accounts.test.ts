// Getting back into an account, and tokens at rest: "forgot password" with single-use, hashed,
// expiring tokens; the administrator clearing a sign-in delay and sending a reset link; and the
// invitation and reset links kept only as SHA-256 once their e-mail is sent (the probe found
// invitation tokens in clear in the outbox body).
// OWASP ASVS v4.0.3 2.5.1/2.5.2 (recovery secrets random, single use, no hint of existence),
// 2.3.1/2.5.4 (time-limited one-time links), 2.4.x / 8.3.4 (secrets stored as hashes, not kept
// once used), 7.2.2 (recovery actions audited).
import { createHash } from "node:crypto";
import { desc, eq, sql } from "drizzle-orm";
import nodemailer from "nodemailer";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { requestPasswordResetAction } from "@/app/(auth)/forgot-password/actions";
import { db } from "@/db";
import { isSignInLimited, recordSignInFailure } from "@/db/queries/sign-in";
import { getActor } from "@/db/queries/users";
import {
  clearSignInDelay,
  inviteUser,
  requestPasswordReset,
  sendResetLink,
  setPasswordWithToken,
} from "@/db/queries/users-admin";
import { outbox, signInFailures, userTokens, users } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { processOutbox } from "@/lib/mail/worker";
import { signInAs } from "./helpers";
import { auditEventsOf } from "./fixtures";

const sha256 = (t: string) => createHash("sha256").update(t, "utf8").digest("hex");
const actorOf = async (email: string) => (await getActor((await signInAs(email))!))!;

/** A transport that keeps what it would have sent. */
function capturing() {
  const sent: string[] = [];
  const t = nodemailer.createTransport({ jsonTransport: true });
  const orig = t.sendMail.bind(t);
  t.sendMail = (async (m: Parameters<typeof orig>[0]) => {
    sent.push(String(m.text));
    return orig(m);
  }) as typeof t.sendMail;
  return { t, sent };
}

/** Every column of every row of user_tokens and outbox as text: where a token could hide. */
async function storedText(): Promise<string> {
  const a = await db.execute(sql`select t::text as row from user_tokens t`);
  const b = await db.execute(sql`select o::text as row from outbox o`);
  return [...a.rows, ...b.rows].map((r) => String((r as { row: string }).row)).join("\n");
}

// Some tests here set new passwords; the demo accounts get their own back for the files that follow.
let saved: { id: string; passwordHash: string | null }[] = [];
beforeAll(async () => {
  saved = await db.select({ id: users.id, passwordHash: users.passwordHash }).from(users);
});
afterAll(async () => {
  await db.delete(signInFailures);
  for (const u of saved)
    await db
      .update(users)
      .set({ passwordHash: u.passwordHash, sessionsValidAfter: null })
      .where(eq(users.id, u.id));
});

describe("forgot password", () => {
  it("an active account gets a one-hour link whose token is stored only as SHA-256", async () => {
    const { token } = await requestPasswordReset("Engineer@Halvard.example");
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    const [row] = await db
      .select()
      .from(userTokens)
      .where(eq(userTokens.tokenHash, sha256(token!)));
    expect(row!.purpose).toBe("reset");
    expect(row!.expiresAt.getTime() - Date.now()).toBeLessThanOrEqual(3600_000);
    expect(row!.expiresAt.getTime() - Date.now()).toBeGreaterThan(3500_000);
    const [mail] = await db.select().from(outbox).orderBy(desc(outbox.createdAt)).limit(1);
    expect(mail!.textBody).toContain(`/set-password?token=${token}`);
  });

  it("the link works once, and a used or expired one is refused", async () => {
    const { token } = await requestPasswordReset("installer@halvard.example");
    await setPasswordWithToken(token!, "a brand new password 1");
    const again = await setPasswordWithToken(token!, "another new password 2").catch((e: unknown) => e);
    expect((again as AppError).status).toBe(410);
    const { token: late } = await requestPasswordReset("buyer@tollan.example");
    await db
      .update(userTokens)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(userTokens.tokenHash, sha256(late!)));
    expect(
      ((await setPasswordWithToken(late!, "x new password 123").catch((e) => e)) as AppError).status,
    ).toBe(410);
  });

  it("an unknown address gets the same answer and nothing is queued (no enumeration)", async () => {
    const before = (await db.select({ n: sql<number>`count(*)`.mapWith(Number) }).from(outbox))[0]!.n;
    const unknown = await requestPasswordResetAction({ email: "nobody@halvard.example" });
    const known = await requestPasswordResetAction({ email: "admin@halvard.example" });
    expect(unknown).toEqual({
      ok: true,
      data: { message: expect.stringMatching(/^If that address belongs/) },
    });
    expect(known).toEqual(unknown);
    const after = (await db.select({ n: sql<number>`count(*)`.mapWith(Number) }).from(outbox))[0]!.n;
    expect(after).toBe(before + 1);
  });

  it("at most three reset e-mails an hour per account", async () => {
    const tokens = [];
    for (let i = 0; i < 5; i++) tokens.push((await requestPasswordReset("inspector@halvard.example")).token);
    expect(tokens.filter(Boolean)).toHaveLength(3);
  });
});

describe("the administrator helps someone back in", () => {
  it("clears a sign-in delay on an account from every address, audited; others may not", async () => {
    for (let i = 0; i < 5; i++) await recordSignInFailure("engineer@halvard.example", "10.7.0.1");
    expect(await isSignInLimited("engineer@halvard.example", "10.7.0.1")).toBe(true);
    const engineer = await actorOf("engineer@halvard.example");
    const refused = await clearSignInDelay(engineer, engineer.id).catch((e: unknown) => e);
    expect((refused as AppError).status).toBe(403);
    const admin = await actorOf("admin@halvard.example");
    expect(await clearSignInDelay(admin, engineer.id)).toEqual({ cleared: 5 });
    expect(await isSignInLimited("engineer@halvard.example", "10.7.0.1")).toBe(false);
    const [event] = await auditEventsOf({ entityId: engineer.id }, "user.sign_in_delay_cleared");
    expect(event!.actorEmail).toBe("admin@halvard.example");
  });

  it("sends a reset link, audited; a new password lifts any delay and ends open sessions", async () => {
    const admin = await actorOf("admin@halvard.example");
    const [u] = await db.select().from(users).where(eq(users.email, "engineer@halvard.example"));
    const { token } = await sendResetLink(admin, u!.id);
    for (let i = 0; i < 5; i++) await recordSignInFailure("engineer@halvard.example", "10.7.0.2");
    await setPasswordWithToken(token, "engineer's new password");
    expect(await isSignInLimited("engineer@halvard.example", "10.7.0.2")).toBe(false);
    const [after] = await db.select().from(users).where(eq(users.id, u!.id));
    expect(after!.sessionsValidAfter!.getTime()).toBeGreaterThan(Date.now() - 10_000);
    const installer = await actorOf("installer@halvard.example");
    expect(((await sendResetLink(installer, u!.id).catch((e) => e)) as AppError).status).toBe(403);
  });
});

describe("tokens at rest", () => {
  it("an invitation's token is in no stored row once its e-mail is sent; the e-mail had it", async () => {
    const admin = await actorOf("admin@halvard.example");
    const { token, userId } = await inviteUser(admin, {
      email: `invitee-${Date.now()}@halvard.example`,
      name: "Invitee",
      role: "inspector",
    });
    const { token: reset } = await requestPasswordReset("admin@halvard.example");
    expect(await storedText()).toContain(token); // queued, not yet sent
    const { t, sent } = capturing();
    await processOutbox({ transport: t, limit: 500 });
    expect(sent.join("\n")).toContain(`token=${token}`);
    expect(sent.join("\n")).toContain(`token=${reset}`);
    const text = await storedText();
    expect(text).not.toContain(token);
    expect(text).not.toContain(reset!);
    expect(text).toContain(sha256(token));
    expect(text).toContain("token=(removed once sent)");
    // Other files count the inspectors a job notifies: the invitee leaves no account behind.
    await db.delete(users).where(eq(users.id, userId));
  });
});
