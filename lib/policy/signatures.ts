/** Signatures: who gives which meaning, on a job in which status. */
import type { JobStatus } from "@/lib/domain/jobs";
import type { Actor } from "@/lib/domain/roles";
import type { SignatureMeaningKey } from "@/lib/domain/signatures";
import { fitApprovalRefusal } from "@/lib/policy/analyses";

export interface SignatureSubject {
  readonly meaning: SignatureMeaningKey;
  readonly job: { status: JobStatus; customerId: string; assignedInstallerId: string | null };
}

/**
 * May this actor give this signature on this job now? Performed: the assigned installer;
 * inspected: an inspector; both while the work is under way or in review. Parameters approved:
 * an engineer, on a job in review (lib/policy/analyses.fitApprovalRefusal). Approved (which issues
 * the report): an engineer, on an approved job. Accepted or rejected: a user of the job's own
 * company, on an issued job. Returns the reason when not.
 */
export function signatureRefusal(actor: Actor, { meaning, job }: SignatureSubject): string | null {
  const working = job.status === "measuring" || job.status === "in_review" || job.status === "approved";
  switch (meaning) {
    case "performed":
      if (actor.role !== "installer" || job.assignedInstallerId !== actor.id)
        return "Only the installer assigned to this job signs the work as performed.";
      return working
        ? null
        : "The work can be signed as performed while the job is measuring, in review or approved.";
    case "inspected":
      if (actor.role !== "inspector") return "Only an inspector signs as inspected.";
      return working
        ? null
        : "The job can be signed as inspected while it is measuring, in review or approved.";
    case "parameters_approved":
      return fitApprovalRefusal(actor, job);
    case "approved":
      if (actor.role !== "engineer") return "Only an application engineer approves and issues the report.";
      return job.status === "approved"
        ? null
        : "The report is issued once the job's parameters are approved.";
    case "accepted":
    case "rejected":
      if (actor.role !== "customer" || actor.customerId !== job.customerId)
        return "Only the customer's own users accept or reject the report.";
      return job.status === "issued" ? null : "Only an issued report can be accepted or rejected.";
  }
}
