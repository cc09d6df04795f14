/**
 * Photos of a job: who sees them. Staff see them as they see the job. A customer sees the photos
 * of its own jobs once the report is issued, and not before: photos taken during the work are the
 * service company's working record until the report that relies on them is signed.
 */
import type { JobStatus } from "@/lib/domain/jobs";
import type { Actor } from "@/lib/domain/roles";

export function photoViewRefusal(actor: Actor, job: { status: JobStatus }): string | null {
  if (actor.role === "customer" && job.status !== "issued")
    return "Photos of a job are shown to the customer once its report is issued.";
  return null;
}
