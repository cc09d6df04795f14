/**
 * Who may help a person back into their account: clear the sign-in delay on it, or send it a
 * password reset link. The administrator only (who manages people); anyone else is refused.
 */
import type { Actor } from "@/lib/domain/roles";

export function accountRecoveryRefusal(actor: Actor, _subject: { userId: string }): string | null {
  return actor.role === "admin" ? null : "People's accounts are managed by the administrator.";
}
