/**
 * Who records the instruments behind a job's measurement data (probe, reference sphere, CMM): the
 * people who take the data — installers, inspectors and application engineers — while the work is
 * open; not the office (attributable records) and not customers.
 */
import type { JobStatus } from "@/lib/domain/jobs";
import type { Actor } from "@/lib/domain/roles";
import { UPLOAD_STATUSES } from "@/lib/policy/datasets";

export function jobInstrumentRefusal(actor: Actor, job: { status: JobStatus }): string | null {
  if (actor.role === "customer" || actor.role === "admin")
    return "The instruments used are recorded by the people who took the measurements.";
  return UPLOAD_STATUSES.includes(job.status)
    ? null
    : `Instruments can be added while the job is draft, measuring or in review; this job is ${job.status.replace("_", " ")}.`;
}

/** Who sees the list on the Report tab: the service company's people (customers read it in the report). */
export function jobInstrumentsListRefusal(actor: Actor): string | null {
  return actor.role === "customer" ? "Customers read the instruments used in the issued report." : null;
}
