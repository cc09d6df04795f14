/** Checklist readings: who records or corrects them, and while the job is in which status. */
import { STATUS_LABELS, type JobStatus } from "@/lib/domain/jobs";
import type { Actor } from "@/lib/domain/roles";

/** Job statuses in which checklist readings may still be recorded or corrected. */
export const READINGS_OPEN_STATUSES: readonly JobStatus[] = ["draft", "measuring"];

/**
 * May this actor record or correct a checklist reading on this job now? The assigned installer
 * (and an administrator, for corrections from the office) while the job is draft or measuring;
 * once it is in review, approved or issued the readings are locked. Returns the reason when not.
 */
export function readingsRefusal(
  actor: Actor,
  job: { status: JobStatus; assignedInstallerId: string | null },
): string | null {
  const mayWrite =
    actor.role === "admin" || (actor.role === "installer" && job.assignedInstallerId === actor.id);
  if (!mayWrite) return "Only the installer assigned to this job (or an administrator) records readings.";
  if (!READINGS_OPEN_STATUSES.includes(job.status))
    return `The job is ${STATUS_LABELS[job.status].toLowerCase()}; its readings are locked.`;
  return null;
}
