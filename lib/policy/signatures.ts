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

/**
 * Segregation of duties: the person who signed the work as performed may not also approve its
 * parameters or approve and issue its report, and the reverse, unless the company allows it
 * (ALLOW_SAME_SIGNER in lib/env.ts, off by default). `given`: the job's signatures so far.
 */
export const CONFLICTING_MEANINGS: Partial<Record<SignatureMeaningKey, readonly SignatureMeaningKey[]>> = {
  performed: ["parameters_approved", "approved"],
  parameters_approved: ["performed"],
  approved: ["performed"],
};

export function sameSignerRefusal(
  actor: Pick<Actor, "id">,
  subject: {
    meaning: SignatureMeaningKey;
    given: ReadonlyArray<{ meaning: SignatureMeaningKey; signerId: string }>;
    allowSameSigner: boolean;
  },
): string | null {
  if (subject.allowSameSigner) return null;
  const conflicts = CONFLICTING_MEANINGS[subject.meaning] ?? [];
  const clash = subject.given.find((s) => s.signerId === actor.id && conflicts.includes(s.meaning));
  if (!clash) return null;
  return clash.meaning === "performed"
    ? "You signed this work as performed; another person approves it (the company does not allow one person to sign both)."
    : "You approved this job; another person signs the work as performed (the company does not allow one person to sign both).";
}
