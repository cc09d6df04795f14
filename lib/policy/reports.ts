/** Reports: who issues an amendment (a new revision) and when. Issuing itself is a signature. */
import type { JobStatus } from "@/lib/domain/jobs";
import type { Actor } from "@/lib/domain/roles";

/** Who issues an amendment: an application engineer. */
export function amenderRefusal(actor: Actor): string | null {
  return actor.role === "engineer" ? null : "Only an application engineer issues an amendment.";
}

/** An application engineer, after the report was issued or rejected. */
export function amendmentRefusal(actor: Actor, job: { status: JobStatus }): string | null {
  const who = amenderRefusal(actor);
  if (who) return who;
  if (job.status !== "issued" && job.status !== "rejected")
    return "An amendment follows an issued or rejected report.";
  return null;
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
