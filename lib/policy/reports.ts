/**
 * Who may do what with a job's report, each rule as `refusal(actor, subject) → reason | null`:
 * pages call it to show or hide a form, db/queries/reports.ts calls it to refuse.
 */
import type { Actor } from "@/lib/domain/roles";

export interface AmendSubject {
  /** The job's status. */
  status: string;
  /** Whether a revision has been issued already. */
  hasIssuedRevision: boolean;
}

/**
 * An amendment (a new revision that supersedes the current one) is issued by an application
 * engineer, only after a revision exists and while the job is issued or rejected.
 */
export function amendRefusal(actor: Pick<Actor, "role">, subject: AmendSubject): string | null {
  if (!subject.hasIssuedRevision) return "There is no issued revision to amend.";
  if (actor.role !== "engineer") return "Only an application engineer issues an amendment.";
  if (subject.status !== "issued" && subject.status !== "rejected")
    return "An amendment follows an issued or rejected report.";
  return null;
}

/**
 * A FAIL or undecided result is carried into the report as a deviation by an application
 * engineer, while the job is in review or approved (before the report is issued).
 */
export function deviationRefusal(actor: Pick<Actor, "role">, subject: { status: string }): string | null {
  if (actor.role !== "engineer") return "Only an application engineer records a deviation.";
  if (subject.status !== "in_review" && subject.status !== "approved")
    return "Deviations are recorded while the job is in review or approved, before the report is issued.";
  return null;
}

/** The readiness check (the blockers before issue) is the issuer's working list: staff see it, customers do not. */
export function readinessRefusal(actor: Pick<Actor, "role">): string | null {
  return actor.role === "customer" ? "The readiness of a report is for the service company's staff." : null;
}
