import "server-only";
import { and, eq, gt, lt, or, sql } from "drizzle-orm";
import { db } from "@/db";
import { signInFailures } from "@/db/schema";
import { env } from "@/lib/env";

/**
 * Sign-in rate limiting, kept in PostgreSQL so that every app instance sees the same counts.
 * Limited when the account has SIGNIN_MAX_FAILURES failures in the window, or the address has
 * four times as many (many accounts tried from one place).
 */
export function emailKey(email: string): string {
  return email.trim().toLowerCase();
}

export async function isSignInLimited(email: string, address: string): Promise<boolean> {
  const since = new Date(Date.now() - env.SIGNIN_WINDOW_S * 1000);
  const [row] = await db
    .select({
      byEmail: sql<number>`count(*) filter (where ${signInFailures.emailKey} = ${emailKey(email)})`.mapWith(
        Number,
      ),
      byAddress: sql<number>`count(*) filter (where ${signInFailures.address} = ${address})`.mapWith(Number),
    })
    .from(signInFailures)
    .where(
      and(
        gt(signInFailures.at, since),
        or(eq(signInFailures.emailKey, emailKey(email)), eq(signInFailures.address, address)),
      ),
    );
  return (
    (row?.byEmail ?? 0) >= env.SIGNIN_MAX_FAILURES || (row?.byAddress ?? 0) >= env.SIGNIN_MAX_FAILURES * 4
  );
}

export async function recordSignInFailure(email: string, address: string): Promise<void> {
  await db.insert(signInFailures).values({ emailKey: emailKey(email), address });
  // Keep the table small: anything older than a day is no longer needed.
  await db.delete(signInFailures).where(lt(signInFailures.at, new Date(Date.now() - 86_400_000)));
}

export async function clearSignInFailures(email: string): Promise<void> {
  await db.delete(signInFailures).where(eq(signInFailures.emailKey, emailKey(email)));
}
