import "server-only";
import { db } from "@/db";
import { listJobAudit } from "@/db/queries/audit";
import { getJobDetail } from "@/db/queries/jobs";
import type { Actor } from "@/lib/domain/roles";

/**
 * A job's timeline from the audit trail, for an actor who may see the job (lib/policy/jobs, the
 * same rule as every read of a job); null when they may not, or when there is no such job.
 */
export async function getJobActivity(actor: Actor, jobId: string) {
  const d = await getJobDetail(actor, jobId);
  if (!d) return null;
  return listJobAudit(db, d.job.id);
}
