import { sql } from "drizzle-orm";
import { db } from "@/db";

const state = globalThis as unknown as { __testSessionUserId?: string | null; __testSignedInAt?: number };

/** Acts as the given demo user (by e-mail) for the following route calls; null = anonymous. */
export async function signInAs(email: string | null, signedInAt?: number): Promise<string | null> {
  state.__testSignedInAt = signedInAt;
  if (email === null) {
    state.__testSessionUserId = null;
    return null;
  }
  const rows = await db.execute<{ id: string }>(sql`select id from users where email = ${email}`);
  const id = rows.rows[0]?.id;
  if (!id) throw new Error(`no demo user ${email}`);
  state.__testSessionUserId = id;
  return id;
}

export async function jobIdByReference(reference: string): Promise<string> {
  const rows = await db.execute<{ id: string }>(sql`select id from jobs where reference = ${reference}`);
  const id = rows.rows[0]?.id;
  if (!id) throw new Error(`no job ${reference}`);
  return id;
}

export function request(path: string, init?: RequestInit): Request {
  return new Request(`http://localhost${path}`, init);
}
