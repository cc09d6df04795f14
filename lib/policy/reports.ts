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
  const who = deviationRecorderRefusal(actor);
  if (who) return who;
  if (subject.status !== "in_review" && subject.status !== "approved")
    return "Deviations are recorded while the job is in review or approved, before the report is issued.";
  return null;
}

/** Who records a deviation at all: an application engineer (the job's status is checked by deviationRefusal). */
export function deviationRecorderRefusal(actor: Pick<Actor, "role">): string | null {
  return actor.role === "engineer" ? null : "Only an application engineer records a deviation.";
}

/** The readiness check (the blockers before issue) is the issuer's working list: staff see it, customers do not. */
export function readinessRefusal(actor: Pick<Actor, "role">): string | null {
  return actor.role === "customer" ? "The readiness of a report is for the service company's staff." : null;
}

/** Who approves and issues a report: an application engineer (the signature "approved"). */
export function reportIssuerRefusal(actor: Actor): string | null {
  return actor.role === "engineer" ? null : "Only an application engineer approves and issues the report.";
}

/** Who accepts or rejects a report: a user of a customer company (their own jobs only, checked on the job). */
export function reportResponderRefusal(actor: Actor): string | null {
  return actor.role === "customer" && actor.customerId
    ? null
    : "Only the customer's own users accept or reject the report.";
}

/**
 * The statement of conformity before issue is provisional (the record may still change): staff
 * see it on the job's page; a customer sees the statement of the issued report only.
 */
export function provisionalConformityRefusal(actor: Pick<Actor, "role">): string | null {
  return actor.role === "customer"
    ? "The statement of conformity is shown to the customer once the report is issued."
    : null;
}

/**
 * The draft preview (the PDF as it would be issued now, watermarked DRAFT, unsigned) is the
 * service company's working copy: staff see it, customers never (they receive the issued report).
 */
export function draftPreviewRefusal(actor: Pick<Actor, "role">): string | null {
  return actor.role === "customer" ? "The draft of a report is for the service company's staff." : null;
}
