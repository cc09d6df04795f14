/**
 * Procedures: who builds them and when a version may still change. The office (administrator)
 * and the application engineers write procedures; everyone on the service company's staff reads
 * them (registerReadRefusal "procedures"); customers neither.
 */
import type { Actor } from "@/lib/domain/roles";

/** The procedure (or version) an action is about; null when a new one is created. */
export interface ProcedureSubject {
  readonly retiredAt: Date | null;
}

/** May this actor create a procedure, save a version, or change its steps? */
export function procedureEditRefusal(actor: Actor, subject: ProcedureSubject | null): string | null {
  if (actor.role !== "admin" && actor.role !== "engineer")
    return "Procedures are written by the office and the application engineers.";
  if (subject?.retiredAt) return "This procedure is retired; bring it back before changing it.";
  return null;
}

/** May this actor retire a procedure or bring it back? */
export function procedureRetireRefusal(actor: Actor): string | null {
  return actor.role === "admin" || actor.role === "engineer"
    ? null
    : "Procedures are retired by the office and the application engineers.";
}
