/** Datasets: who uploads and deletes measurement data, and while the job is in which status. */
import type { DatasetKind } from "@/lib/domain/datasets";
import type { JobStatus } from "@/lib/domain/jobs";
import type { Actor } from "@/lib/domain/roles";

/** Uploads are taken while the work is open; once approved the record is fixed. */
export const UPLOAD_STATUSES: readonly JobStatus[] = ["draft", "measuring", "in_review"];
/** Deletion only before review. */
export const DELETE_STATUSES: readonly JobStatus[] = ["draft", "measuring"];

/** Who handles measurement data: the service company's people (customers read it). */
export function dataHandlerRefusal(actor: Actor, action: "upload" | "delete"): string | null {
  return actor.role === "customer" ? `Your role may not ${action} data.` : null;
}

/**
 * After approval two kinds of data are still taken: the tool-centre-point check, which verifies the
 * values entered in the control from the approved fit (it cannot exist before them), and the
 * ISO 230-2 positioning test of a rotary axis, which does not enter the fit and is often run once
 * the head is compensated.
 */
export const AFTER_APPROVAL_KINDS: readonly DatasetKind[] = ["tcp_check", "rotary_positioning"];

/**
 * May this actor upload to a job (they can see) in this status now? Without `kind`: could any
 * upload be taken (checked before the body is read); with it: this kind of data.
 */
export function uploadRefusal(actor: Actor, job: { status: JobStatus }, kind?: DatasetKind): string | null {
  const who = dataHandlerRefusal(actor, "upload");
  if (who) return who;
  if (UPLOAD_STATUSES.includes(job.status)) return null;
  if (job.status === "approved" && (kind === undefined || AFTER_APPROVAL_KINDS.includes(kind))) return null;
  return job.status === "approved"
    ? "Once the parameters are approved, only a tool-centre-point check or a rotary positioning test is added to the job."
    : `Data can be added while the job is draft, measuring or in review; this job is ${job.status.replace("_", " ")}.`;
}

/** May this actor delete a dataset of a job in this status now? */
export function datasetDeleteRefusal(actor: Actor, job: { status: JobStatus }): string | null {
  const who = dataHandlerRefusal(actor, "delete");
  if (who) return who;
  return DELETE_STATUSES.includes(job.status)
    ? null
    : "Data can be deleted only before review, while the job is draft or measuring.";
}
