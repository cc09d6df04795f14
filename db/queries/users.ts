import "server-only";
import { eq, sql } from "drizzle-orm";
import type { Actor } from "@/lib/domain/roles";
import { db } from "@/db";
import { users } from "@/db/schema";
import { isUuid } from "@/lib/domain/uuid";

/** For sign-in only: the row with its password hash, matched case-insensitively. */
export async function getUserForSignIn(email: string) {
  const rows = await db
    .select()
    .from(users)
    .where(sql`lower(${users.email}) = ${email.trim().toLowerCase()}`)
    .limit(1);
  return rows[0] ?? null;
}

/** A person as the registers and pickers show them: who, how to reach them, their role and state. */
export const personColumns = {
  id: users.id,
  name: users.name,
  email: users.email,
  role: users.role,
  disabled: users.disabled,
};

// Built once: it runs on every signed-in request, so its SQL is not rebuilt each time.
const actorById = db
  .select({
    id: users.id,
    email: users.email,
    name: users.name,
    role: users.role,
    customerId: users.customerId,
    disabled: users.disabled,
    sessionsValidAfter: users.sessionsValidAfter,
  })
  .from(users)
  .where(eq(users.id, sql.placeholder("id")))
  .limit(1)
  .prepare("actor_by_id");

/**
 * The acting user, fresh from the database: a disabled user or a changed role takes effect on
 * the next request, not when the session token expires.
 */
export async function getActor(userId: string, signedInAtMs = Date.now()): Promise<Actor | null> {
  if (!isUuid(userId)) return null;
  const rows = await actorById.execute({ id: userId });
  const row = rows[0];
  if (!row || row.disabled) return null;
  // A session signed in before its account's sessions were revoked is over.
  if (row.sessionsValidAfter && signedInAtMs < row.sessionsValidAfter.getTime()) return null;
  return { id: row.id, email: row.email, name: row.name, role: row.role, customerId: row.customerId };
}

/** Ends every session of the account: tokens that signed in before now are refused. */
export async function revokeSessions(userId: string): Promise<void> {
  if (!isUuid(userId)) return;
  await db.update(users).set({ sessionsValidAfter: new Date() }).where(eq(users.id, userId));
}
