/** A head's history of fitted parameters, across the jobs on it. */
import type { Actor } from "@/lib/domain/roles";
import { registerReadRefusal } from "./registers";

/**
 * Who reads a head's history: those who read the heads register; installers and inspectors, for
 * the heads on jobs they may see (an after-crash re-check needs the head's earlier figures); and
 * the customer, through their own company's jobs on it. Every role may ask; which heads answer is
 * `headHistoryScope`'s, applied by the query (404 for a head outside it).
 */
export function headHistoryRefusal(actor: Actor): string | null {
  return actor.role === "admin" ||
    actor.role === "engineer" ||
    actor.role === "installer" ||
    actor.role === "inspector" ||
    actor.role === "customer"
    ? null
    : "The history of a head is read by the service company and the head's owner.";
}

/**
 * Which jobs on a head the actor sees in its history:
 * - "all": every job on every head (those who read the heads register);
 * - "through-jobs": every job on the head, once one job on it is one the actor may see (installers
 *   and inspectors are the service company's own people; a head on none of their jobs is 404);
 * - "own": only the actor's own company's jobs on it (customers; none is 404).
 */
export function headHistoryScope(actor: Actor): "all" | "through-jobs" | "own" {
  if (registerReadRefusal(actor, "heads") === null) return "all";
  return actor.role === "customer" ? "own" : "through-jobs";
}
