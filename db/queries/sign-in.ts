import "server-only";
import { and, eq, lt, sql } from "drizzle-orm";
import { db } from "@/db";
import { signInFailures } from "@/db/schema";
import { limitDecision, type LimitDecision } from "@/lib/auth/throttle";
import { env } from "@/lib/env";

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
