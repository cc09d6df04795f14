/** Head fits: who runs them, who approves a parameter set, who saves views for the report. */
import { STATUS_LABELS, type JobStatus } from "@/lib/domain/jobs";
import type { Actor } from "@/lib/domain/roles";

/** Job statuses in which a new fit may be run; once approved the parameter set is fixed. */
export const HEAD_FIT_OPEN_STATUSES: readonly JobStatus[] = ["draft", "measuring", "in_review"];

/** Who runs a head fit: the people who review data (installers upload, customers read). */
export function headFitterRefusal(actor: Actor): string | null {
  return actor.role === "admin" || actor.role === "inspector" || actor.role === "engineer"
    ? null
    : "Only an application engineer, an inspector or an administrator runs a head fit.";
}

/**
 * May this actor run a (new) head fit on a dataset of this job now? Returns the reason when not.
 * Visibility of the job is checked separately (404, never 403, for a job one may not see).
 */
export function headFitRefusal(actor: Actor, job: { status: JobStatus }): string | null {
  const who = headFitterRefusal(actor);
  if (who) return who;
  if (!HEAD_FIT_OPEN_STATUSES.includes(job.status))
    return `The job is ${STATUS_LABELS[job.status].toLowerCase()}; its fitted parameters are fixed.`;
  return null;
}

/** Who approves a fitted parameter set for the job. */
export function fitApproverRefusal(actor: Actor): string | null {
  return actor.role === "engineer" ? null : "Only an application engineer approves a head's parameters.";
}

/** Parameters are approved while the job is in review (the move in review → approved). */
export function fitApprovalRefusal(actor: Actor, job: { status: JobStatus }): string | null {
  const who = fitApproverRefusal(actor);
  if (who) return who;
  return job.status === "in_review"
    ? null
    : `The job is ${STATUS_LABELS[job.status].toLowerCase()}; parameters are approved once the installer has submitted it for review.`;
}

/** Who saves a picture of a fit's 3D view for the report. */
export function viewSaveRefusal(actor: Actor): string | null {
  return actor.role === "engineer"
    ? null
    : "Only an application engineer saves views of a fit for the report.";
}
