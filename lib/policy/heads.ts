/** A head's history of fitted parameters, across the jobs on it. */
import type { Actor } from "@/lib/domain/roles";
import { registerReadRefusal } from "./registers";

/**
 * Who reads a head's history: those who read the heads register (every job on the head) and the
 * customer (their own company's jobs on it only). Installers and inspectors work job by job.
 */
export function headHistoryRefusal(actor: Actor): string | null {
  return registerReadRefusal(actor, "heads") === null || actor.role === "customer"
    ? null
    : "The history of a head is read by engineers, the office and the head's owner.";
}

/** Does the actor see every job on a head (the service company), or only their own company's? */
export function headHistoryScope(actor: Actor): "all" | "own" {
  return registerReadRefusal(actor, "heads") === null ? "all" : "own";
}
