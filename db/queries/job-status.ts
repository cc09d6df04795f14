import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import { getJobDetail } from "@/db/queries/jobs";
import { enqueueMail } from "@/db/queries/outbox";
import { jobs, users } from "@/db/schema";
import { canTransition, STATUS_LABELS, type Actor, type JobStatus } from "@/lib/auth/roles";
import { forbidden, invalid, notFound } from "@/lib/errors";
import { publicUrl } from "@/lib/env";

/** Moves that carry signatures go through the report flow (db/queries/reports.ts), not here. */
const SIGNED_MOVES: readonly JobStatus[] = ["issued", "accepted", "rejected"];

/**
 * Changes a job's status if lib/auth/roles.canTransition allows this role the move; an installer
 * may only move jobs assigned to them (visibility already limits that). Submitting for review
 * queues an e-mail to every engineer and inspector in the same transaction.
 */
export async function changeJobStatus(actor: Actor, jobId: string, to: JobStatus) {
  const d = await getJobDetail(actor, jobId);
  if (!d) throw notFound("job");
  if (SIGNED_MOVES.includes(to)) throw forbidden("Issuing, accepting and rejecting are signed on the job's report page.");
  if (!canTransition(actor.role, d.job.status, to)) {
    throw forbidden(`A ${actor.role} may not move a job from ${STATUS_LABELS[d.job.status].toLowerCase()} to ${STATUS_LABELS[to].toLowerCase()}.`);
  }
  const reviewers = to === "in_review" ? await db.select({ id: users.id, email: users.email, name: users.name }).from(users).where(and(inArray(users.role, ["engineer", "inspector"]), eq(users.disabled, false))) : [];
  return db.transaction(async (tx) => {
    const [locked] = await tx.select({ status: jobs.status }).from(jobs).where(eq(jobs.id, d.job.id)).for("update");
    if (locked?.status !== d.job.status) throw invalid("The job changed meanwhile; open it again.");
    const at = new Date();
    await tx.update(jobs).set({ status: to, updatedAt: at }).where(eq(jobs.id, d.job.id));
    await appendAudit(tx, { actorId: actor.id, actorEmail: actor.email, action: "job.status_changed", entityType: "job", entityId: d.job.id, jobId: d.job.id, oldValues: { status: d.job.status }, newValues: { status: to } });
    for (const r of reviewers) {
      await enqueueMail(tx, {
        dedupeKey: `review:${d.job.id}:${at.getTime()}:${r.id}`,
        to: r.email,
        subject: `${d.job.reference} is ready for review`,
        text: `Hello ${r.name},\n\n${actor.name} submitted ${d.job.title} (${d.job.reference}, ${d.customer.name}) for review.\nThe readings and the before/after comparison are here:\n${publicUrl}/jobs/${d.job.id}/compare\n`,
        jobId: d.job.id,
      });
    }
    return { status: to };
  });
}
