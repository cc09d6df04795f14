import "server-only";
import { createHash, randomBytes } from "node:crypto";
import { and, asc, eq, gt, isNull, sql } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import { enqueueMail } from "@/db/queries/outbox";
import { rowsInUse } from "@/db/queries/registers";
import { emailKey } from "@/db/queries/sign-in";
import { customers, signInFailures, userTokens, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import type { Actor } from "@/lib/domain/roles";
import { invitationMessage } from "@/lib/mail/messages";
import { publicUrl } from "@/lib/env";
import { registerEditRefusal } from "@/lib/policy/registers";
import { AppError, forbidden, invalid, notFound } from "@/lib/errors";
import { accountRecoveryRefusal } from "@/lib/policy/account-recovery";
import type { userInviteSchema, userUpdateSchema } from "@/lib/validations/registers";

export const INVITE_TTL_MS = 72 * 3600_000;
/** A reset link works for one hour, once. */
export const RESET_TTL_MS = 3600_000;
/** At most this many reset e-mails per account per hour, however often the form is sent. */
export const RESET_MAX_PER_HOUR = 3;

/** Only a SHA-256 of a token is stored; the token itself exists only in the e-mail. */
export function tokenHash(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

function requireAdmin(actor: Actor) {
  const refusal = registerEditRefusal(actor, "people");
  if (refusal) throw forbidden(refusal);
}

/**
 * Invites a person: the account (no password yet), a one-time set-password token (72 h) and the
 * e-mail with its link, in one transaction, audited. Returns the token only to tests that call
 * this directly; the UI never shows it.
 */
export async function inviteUser(actor: Actor, input: z.infer<typeof userInviteSchema>) {
  requireAdmin(actor);
  const email = input.email.trim();
  const [dupe] = await db
    .select({ id: users.id })
    .from(users)
    .where(sql`lower(${users.email}) = ${email.toLowerCase()}`);
  if (dupe)
    throw invalid("Someone with that e-mail already has an account.", [
      { field: "email", message: "Already in use." },
    ]);
  if (input.customerId) {
    const [c] = await db
      .select({ id: customers.id })
      .from(customers)
      .where(eq(customers.id, input.customerId));
    if (!c)
      throw invalid("No such customer.", [
        { field: "customerId", message: "Choose a customer from the register." },
      ]);
  }
  const token = randomBytes(32).toString("base64url");
  return db.transaction(async (tx) => {
    const [u] = await tx
      .insert(users)
      .values({
        email,
        name: input.name,
        role: input.role,
        customerId: input.customerId ?? null,
        passwordHash: null,
      })
      .returning();
    await tx.insert(userTokens).values({
      userId: u!.id,
      purpose: "invite",
      tokenHash: tokenHash(token),
      expiresAt: new Date(Date.now() + INVITE_TTL_MS),
    });
    await enqueueMail(tx, {
      dedupeKey: `invite:${u!.id}`,
      to: email,
      ...invitationMessage({
        baseUrl: publicUrl,
        name: input.name,
        role: input.role,
        invitedBy: actor.name,
        token,
      }),
    });
    await appendAudit(tx, actor, {
      action: "user.invited",
      entity: { type: "user", id: u!.id },
      newValues: { email, name: input.name, role: input.role, customerId: input.customerId ?? null },
    });
    return { userId: u!.id, token };
  });
}

/**
 * Sets a password with a one-time token. The token is matched by its hash, must be unused and
 * unexpired, and is used up in the same transaction that stores the password.
 */
export async function setPasswordWithToken(token: string, password: string) {
  const hash = tokenHash(token);
  const passwordHash = await hashPassword(password);
  return db.transaction(async (tx) => {
    const [t] = await tx
      .select()
      .from(userTokens)
      .where(
        and(eq(userTokens.tokenHash, hash), isNull(userTokens.usedAt), gt(userTokens.expiresAt, new Date())),
      )
      .for("update");
    if (!t)
      throw new AppError(
        410,
        "token_invalid",
        "This link has expired or has already been used. Ask the administrator for a new invitation.",
      );
    // This token and every other open link of the account are used up together.
    await tx
      .update(userTokens)
      .set({ usedAt: new Date() })
      .where(and(eq(userTokens.userId, t.userId), isNull(userTokens.usedAt)));
    await tx
      .update(users)
      .set({ passwordHash, sessionsValidAfter: new Date() })
      .where(eq(users.id, t.userId));
    const [u] = await tx.select({ email: users.email }).from(users).where(eq(users.id, t.userId));
    // A new password also lifts any sign-in delay on the account.
    if (u) await tx.delete(signInFailures).where(eq(signInFailures.emailKey, emailKey(u.email)));
    await appendAudit(
      tx,
      { id: t.userId, email: u?.email ?? null },
      {
        action: "user.password_set",
        entity: { type: "user", id: t.userId },
        newValues: { purpose: t.purpose },
      },
    );
    return { email: u?.email ?? "" };
  });
}

/**
 * Disables/enables an account or changes its role. Either takes effect on the user's next
 * request (lib/auth/session reads role and disabled from the database each time); setting
 * sessionsValidAfter also ends the sessions already open.
 */
export async function updateUser(actor: Actor, input: z.infer<typeof userUpdateSchema>) {
  requireAdmin(actor);
  if (input.userId === actor.id) throw forbidden("You cannot disable yourself or change your own role.");
  const [before] = await db.select().from(users).where(eq(users.id, input.userId));
  if (!before) throw notFound("user");
  const set: Partial<typeof users.$inferInsert> = {};
  if (input.role && input.role !== before.role) {
    if ((input.role === "customer") !== Boolean(before.customerId))
      throw invalid("Customer users belong to a customer; staff to none. Invite a new account instead.", [
        { field: "role", message: "Cannot move between staff and customer." },
      ]);
    set.role = input.role;
  }
  if (input.disabled !== undefined && input.disabled !== before.disabled) set.disabled = input.disabled;
  if (Object.keys(set).length === 0) return { changed: false };
  set.sessionsValidAfter = new Date();
  await db.transaction(async (tx) => {
    await tx.update(users).set(set).where(eq(users.id, before.id));
    await appendAudit(tx, actor, {
      action: "user.updated",
      entity: { type: "user", id: before.id },
      oldValues: { role: before.role, disabled: before.disabled },
      newValues: { role: set.role ?? before.role, disabled: set.disabled ?? before.disabled },
    });
  });
  return { changed: true };
}

export async function listCustomersForSelect() {
  return rowsInUse(customers, { id: customers.id, name: customers.name }, customers.name);
}

export async function listActiveInstallers() {
  return db
    .select({ id: users.id, name: users.name })
    .from(users)
    .where(and(eq(users.role, "installer"), eq(users.disabled, false)))
    .orderBy(asc(users.name));
}

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/**
 * Makes a one-hour reset token for `user` and queues its e-mail in `tx`. Only the token's
 * SHA-256 is stored; the outbox body holds the link until it is sent (db/queries/outbox markSent).
 */
async function queueResetLink(tx: Tx, user: { id: string; email: string; name: string }, why: string) {
  const token = randomBytes(32).toString("base64url");
  const hash = tokenHash(token);
  await tx.insert(userTokens).values({
    userId: user.id,
    purpose: "reset",
    tokenHash: hash,
    expiresAt: new Date(Date.now() + RESET_TTL_MS),
  });
  await enqueueMail(tx, {
    dedupeKey: `reset:${user.id}:${hash.slice(0, 16)}`,
    to: user.email,
    subject: "Reset your Trammel password",
    text: `Hello ${user.name},\n\n${why}\nChoose a new password here within one hour (the link works once):\n${publicUrl}/set-password?token=${token}\n\nIf you did not ask for this, ignore this e-mail; your password stays as it is.\n`,
  });
  return token;
}

/**
 * "Forgot password": anyone may ask, by e-mail address. The answer is the same whether or not the
 * address has an account (no enumeration); an active account gets a reset link, at most
 * RESET_MAX_PER_HOUR an hour. Returns the token to tests only.
 */
export async function requestPasswordReset(email: string): Promise<{ token: string | null }> {
  const [u] = await db
    .select({ id: users.id, email: users.email, name: users.name, disabled: users.disabled })
    .from(users)
    .where(sql`lower(${users.email}) = ${emailKey(email)}`);
  if (!u || u.disabled) return { token: null };
  const [recent] = await db
    .select({ n: sql<number>`count(*)`.mapWith(Number) })
    .from(userTokens)
    .where(
      and(
        eq(userTokens.userId, u.id),
        eq(userTokens.purpose, "reset"),
        gt(userTokens.createdAt, new Date(Date.now() - 3600_000)),
      ),
    );
  if ((recent?.n ?? 0) >= RESET_MAX_PER_HOUR) return { token: null };
  return db.transaction(async (tx) => {
    const token = await queueResetLink(tx, u, "Someone (we hope you) asked to reset your password.");
    await appendAudit(tx, null, {
      action: "user.password_reset_requested",
      entity: { type: "user", id: u.id },
    });
    return { token };
  });
}

async function recoverable(actor: Actor, userId: string) {
  const refusal = accountRecoveryRefusal(actor, { userId });
  if (refusal) throw forbidden(refusal);
  const [u] = await db
    .select({ id: users.id, email: users.email, name: users.name, disabled: users.disabled })
    .from(users)
    .where(eq(users.id, userId));
  if (!u) throw notFound("user");
  return u;
}

/** The administrator sends a person a reset link (audited). */
export async function sendResetLink(actor: Actor, userId: string): Promise<{ token: string }> {
  const u = await recoverable(actor, userId);
  if (u.disabled) throw invalid("This account is disabled; enable it before sending a reset link.");
  return db.transaction(async (tx) => {
    const token = await queueResetLink(tx, u, `${actor.name} sent you a link to choose a new password.`);
    await appendAudit(tx, actor, { action: "user.password_reset_sent", entity: { type: "user", id: u.id } });
    return { token };
  });
}

/** The administrator lifts the sign-in delay on a person's account, from every address (audited). */
export async function clearSignInDelay(actor: Actor, userId: string): Promise<{ cleared: number }> {
  const u = await recoverable(actor, userId);
  return db.transaction(async (tx) => {
    const gone = await tx
      .delete(signInFailures)
      .where(eq(signInFailures.emailKey, emailKey(u.email)))
      .returning({ id: signInFailures.id });
    await appendAudit(tx, actor, {
      action: "user.sign_in_delay_cleared",
      entity: { type: "user", id: u.id },
      oldValues: { failures: gone.length },
    });
    return { cleared: gone.length };
  });
}
