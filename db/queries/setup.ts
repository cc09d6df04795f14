import "server-only";
import { randomBytes } from "node:crypto";
import { sql } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import { ensureIssuerRow } from "@/db/queries/issuer";
import { enqueueMail } from "@/db/queries/outbox";
import { INVITE_TTL_MS, tokenHash } from "@/db/queries/users-admin";
import { userTokens, users } from "@/db/schema";
import { publicUrl } from "@/lib/env";
import { AppError } from "@/lib/errors";

export const firstAdminSchema = z.object({
  email: z.email({ message: "Give the administrator's e-mail: --admin-email someone@example.com" }).max(254),
  name: z.string().trim().min(2, 'Give the administrator\'s name: --admin-name "…"').max(120),
});

/**
 * The first start of a production install: on a database with no user yet, creates the first
 * administrator (no password) with a one-time set-password link (72 h), queues the link by
 * e-mail through the outbox and returns it so the command can print it. One transaction, audited
 * (as done by the system: there is no actor yet). Refused once anyone has an account; no demo data.
 */
export async function createFirstAdmin(input: z.infer<typeof firstAdminSchema>) {
  const { email, name } = firstAdminSchema.parse(input);
  const token = randomBytes(32).toString("base64url");
  return db.transaction(async (tx) => {
    // One setup at a time, even if two are started together.
    await tx.execute(sql`select pg_advisory_xact_lock(724002)`);
    const [{ n }] = (await tx.execute<{ n: number }>(sql`select count(*)::int as n from users`)).rows as [
      { n: number },
    ];
    if (n > 0)
      throw new AppError(
        409,
        "already_set_up",
        "This database already has accounts; the administrator invites people from the People register.",
      );
    const [u] = await tx.insert(users).values({ email, name, role: "admin", passwordHash: null }).returning();
    // The issuer's details start empty: no report can be issued until the administrator fills them in.
    await ensureIssuerRow(tx);
    await tx.insert(userTokens).values({
      userId: u!.id,
      purpose: "invite",
      tokenHash: tokenHash(token),
      expiresAt: new Date(Date.now() + INVITE_TTL_MS),
    });
    const link = `${publicUrl}/set-password?token=${token}`;
    await enqueueMail(tx, {
      dedupeKey: `invite:${u!.id}`,
      to: email,
      subject: "Your Trammel administrator account",
      text: `Hello ${name},\n\nTrammel is installed and you are its first administrator.\nSet your password here within 72 hours (the link works once):\n${link}\n`,
    });
    await appendAudit(tx, null, {
      action: "user.first_admin_created",
      entity: { type: "user", id: u!.id },
      newValues: { email, name, role: "admin" },
    });
    return { userId: u!.id, link };
  });
}
