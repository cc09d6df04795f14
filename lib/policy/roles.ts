/** The one generic rule: is the actor one of these roles? (The action wrapper's `roles` option.) */
import type { Actor, Role } from "@/lib/domain/roles";

export function roleRefusal(actor: Actor, roles: readonly Role[]): string | null {
  return roles.includes(actor.role) ? null : "Your role may not do this.";
}
