import "server-only";
import { and, desc, eq, inArray, lte, sql } from "drizzle-orm";
import type { NodePgDatabase } from "drizzle-orm/node-postgres";
import { db } from "@/db";
import { outbox } from "@/db/schema";
import type * as schema from "@/db/schema";
import type { Actor } from "@/lib/domain/roles";
import { env } from "@/lib/env";
import { registerEditRefusal } from "@/lib/policy/registers";
import { forbidden } from "@/lib/errors";

type Executor = NodePgDatabase<typeof schema>;

export interface MailInput {
  dedupeKey: string;
  to: string;
  subject: string;
  text: string;
  jobId?: string | null;
}

/** Queues an e-mail in the caller's transaction; the same dedupe key never queues twice. */
export async function enqueueMail(tx: Executor, m: MailInput): Promise<void> {
  await tx
    .insert(outbox)
    .values({
      dedupeKey: m.dedupeKey,
      toAddress: m.to,
      subject: m.subject,
      textBody: m.text,
      jobId: m.jobId ?? null,
    })
    .onConflictDoNothing({ target: outbox.dedupeKey });
}

/** How long a claimed row stays invisible to other workers while it is being sent. */
export const CLAIM_LEASE_MS = 5 * 60_000;
export const MAX_ATTEMPTS = 6;
/** Backoff after the n-th failed attempt: base · 2^(n−1) (base OUTBOX_RETRY_BASE_MS, 30 s by default), at most one hour. */
export function retryDelayMs(attempts: number, baseMs = env.OUTBOX_RETRY_BASE_MS): number {
  return Math.min(baseMs * 2 ** Math.max(0, attempts - 1), 3_600_000);
}

/**
 * Claims up to `limit` due rows for one worker. `FOR UPDATE SKIP LOCKED` makes concurrent
 * workers take disjoint rows; the claim moves next_attempt_at past a lease and counts the
 * attempt, in the same statement, so a row is handed out once until the lease runs out
 * (which only happens if the worker died mid-send).
 */
export async function claimDueMessages(limit: number) {
  // The database clock decides what is due, the same clock that stamped the rows.
  return db.transaction(async (tx) => {
    const due = await tx
      .select({ id: outbox.id })
      .from(outbox)
      .where(and(eq(outbox.status, "pending"), lte(outbox.nextAttemptAt, sql`now()`)))
      .orderBy(outbox.nextAttemptAt)
      .limit(limit)
      .for("update", { skipLocked: true });
    if (due.length === 0) return [];
    return tx
      .update(outbox)
      .set({
        attempts: sql`${outbox.attempts} + 1`,
        nextAttemptAt: sql`now() + make_interval(secs => ${CLAIM_LEASE_MS / 1000})`,
      })
      .where(
        inArray(
          outbox.id,
          due.map((d) => d.id),
        ),
      )
      .returning();
  });
}

/**
 * A one-time link's token (`token=` in a set-password or reset link) in a stored body. Once the
 * message is sent the e-mail is the only copy: the token is replaced in the outbox, and the
 * database keeps only its SHA-256 (user_tokens).
 */
const TOKEN_IN_LINK = "([?&]token=)[A-Za-z0-9_-]+";
export const TOKEN_REMOVED = "(removed once sent)";

export async function markSent(id: string): Promise<void> {
  await db
    .update(outbox)
    .set({
      status: "sent",
      sentAt: new Date(),
      lastError: null,
      textBody: sql`regexp_replace(${outbox.textBody}, ${TOKEN_IN_LINK}, ${`\\1${TOKEN_REMOVED}`}, 'g')`,
      htmlBody: sql`regexp_replace(${outbox.htmlBody}, ${TOKEN_IN_LINK}, ${`\\1${TOKEN_REMOVED}`}, 'g')`,
    })
    .where(eq(outbox.id, id));
}

/** A failed send: retry later with exponential backoff, or give up after MAX_ATTEMPTS. */
export async function markFailed(id: string, attempts: number, error: string): Promise<void> {
  const giveUp = attempts >= MAX_ATTEMPTS;
  await db
    .update(outbox)
    .set({
      status: giveUp ? "failed" : "pending",
      lastError: error.slice(0, 1000),
      nextAttemptAt: sql`now() + make_interval(secs => ${retryDelayMs(attempts) / 1000})`,
    })
    .where(eq(outbox.id, id));
}

/** The dev inbox: every queued e-mail, newest first (administrators only). */
export async function listOutbox(actor: Actor, limit = 200) {
  const refusal = registerEditRefusal(actor, "outbox");
  if (refusal) throw forbidden(refusal);
  return db.select().from(outbox).orderBy(desc(outbox.createdAt)).limit(limit);
}
