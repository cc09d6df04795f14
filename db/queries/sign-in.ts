import "server-only";
import { and, eq, lt, sql } from "drizzle-orm";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import { signInFailures, users } from "@/db/schema";
import { verifyPassword } from "@/lib/auth/password";
import type { Actor } from "@/lib/domain/roles";
import { limitDecision, waitText, type LimitDecision } from "@/lib/auth/throttle";
import { env } from "@/lib/env";
import { invalid, tooManyRequests } from "@/lib/errors";

/**
 * Password guessing limits, kept in PostgreSQL so that every app instance sees the same counts.
 * Failures are counted per (account, client address), per address, and per account from any
 * address (a far higher backstop); past a limit each further try waits a delay that doubles with
 * every failure (lib/auth/throttle). A stranger failing from their own address slows only their
 * own key, not the account's owner elsewhere. Sign-in and the password re-entry at signing share
 * these counts.
 */
export function emailKey(email: string): string {
  return email.trim().toLowerCase();
}

export async function signInLimit(email: string, address: string, now = Date.now()): Promise<LimitDecision> {
  const since = new Date(now - env.SIGNIN_WINDOW_S * 1000);
  const key = emailKey(email);
  const f = signInFailures;
  const pair = sql`${f.emailKey} = ${key} and ${f.address} = ${address}`;
  const rows = await db.execute<Record<string, string | null>>(sql`
    select count(*) filter (where ${pair}) as pair,
           max(${f.at}) filter (where ${pair}) as pair_last,
           count(*) filter (where ${f.address} = ${address}) as by_address,
           max(${f.at}) filter (where ${f.address} = ${address}) as address_last,
           count(*) filter (where ${f.emailKey} = ${key}) as by_account,
           max(${f.at}) filter (where ${f.emailKey} = ${key}) as account_last
      from ${f}
     where ${f.at} > ${since} and (${f.emailKey} = ${key} or ${f.address} = ${address})`);
  const c = rows.rows[0] ?? {};
  const at = (v: string | null | undefined) => (v ? new Date(v).getTime() : 0);
  const max = env.SIGNIN_MAX_FAILURES;
  return limitDecision(
    [
      { failures: Number(c.pair ?? 0), lastAt: at(c.pair_last), threshold: max },
      { failures: Number(c.by_address ?? 0), lastAt: at(c.address_last), threshold: max * 4 },
      { failures: Number(c.by_account ?? 0), lastAt: at(c.account_last), threshold: max * 10 },
    ],
    now,
    env.SIGNIN_WINDOW_S * 1000,
  );
}

/** Kept for callers that only need yes or no. */
export async function isSignInLimited(email: string, address: string): Promise<boolean> {
  return (await signInLimit(email, address)).limited;
}

export async function recordSignInFailure(email: string, address: string): Promise<void> {
  await db.insert(signInFailures).values({ emailKey: emailKey(email), address });
  // Keep the table small: anything older than a day is no longer needed.
  await db.delete(signInFailures).where(lt(signInFailures.at, new Date(Date.now() - 86_400_000)));
}

/** After a right password: that account's failures from that address are forgotten. */
export async function clearSignInFailures(email: string, address?: string): Promise<void> {
  const byAccount = eq(signInFailures.emailKey, emailKey(email));
  await db
    .delete(signInFailures)
    .where(address === undefined ? byAccount : and(byAccount, eq(signInFailures.address, address)));
}

/** The "address" under which wrong passwords at signing are counted, beside the account's sign-in failures. */
export const SIGNING_REENTRY_KEY = "password re-entry at signing";

/**
 * The password re-entry at signing (21 CFR 11.200: the signer proves it is them, now), counted by
 * the sign-in limiter: wrong passwords are failures of the account, so a session cannot be used
 * as an oracle for guessing its password. Past the limit signing is refused with 429 for the
 * delay, and the refusal is written to the audit trail.
 */
export async function checkPasswordReentry(actor: Actor, password: string, jobId?: string): Promise<void> {
  const limit = await signInLimit(actor.email, SIGNING_REENTRY_KEY);
  if (limit.limited) {
    await db.transaction(async (tx) => {
      await appendAudit(tx, actor, {
        action: "signature.password_limited",
        entity: { type: "user", id: actor.id },
        jobId: jobId ?? null,
        newValues: { retryAfterS: limit.retryAfterS },
      });
    });
    throw tooManyRequests(
      `Too many wrong passwords. Signing is paused for ${waitText(limit.retryAfterS)}; this was recorded.`,
    );
  }
  const [row] = await db
    .select({ hash: users.passwordHash })
    .from(users)
    .where(eq(users.id, actor.id))
    .limit(1);
  if (!password || !(await verifyPassword(password, row?.hash))) {
    await recordSignInFailure(actor.email, SIGNING_REENTRY_KEY);
    throw invalid("Re-enter your password to sign.", [
      { field: "password", message: "The password does not match your account." },
    ]);
  }
  await clearSignInFailures(actor.email, SIGNING_REENTRY_KEY);
}
