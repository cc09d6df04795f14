/** Checklist readings: who records or corrects them, and while the job is in which status. */
import { STATUS_LABELS, type JobStatus } from "@/lib/domain/jobs";
import type { Actor } from "@/lib/domain/roles";

/** Job statuses in which checklist readings may still be recorded or corrected. */
export const READINGS_OPEN_STATUSES: readonly JobStatus[] = ["draft", "measuring"];

/**
 * May this actor record or correct a checklist reading on this job now? Readings are recorded by
 * the people at the machine: the assigned installer, or an application engineer. Never the office
 * (an administrator), so every reading is attributable to whoever took it (ISO/IEC 17025:2017
 * §7.5.1: the records identify the personnel who performed the work). While the job is draft or
 * measuring; once it is in review, approved or issued the readings are locked. Returns the reason
 * when not.
 */
export function readingsRefusal(
  actor: Actor,
  job: { status: JobStatus; assignedInstallerId: string | null },
): string | null {
  if (actor.role === "admin")
    return "Readings are recorded by the people who take them (the assigned installer or an application engineer), never from the office.";
  const mayWrite =
    actor.role === "engineer" || (actor.role === "installer" && job.assignedInstallerId === actor.id);
  if (!mayWrite)
    return "Only the installer assigned to this job (or an application engineer) records readings.";
  if (!READINGS_OPEN_STATUSES.includes(job.status))
    return `The job is ${STATUS_LABELS[job.status].toLowerCase()}; its readings are locked.`;
  return null;
}
