import "server-only";
import { and, eq, inArray, sql } from "drizzle-orm";
import { db } from "@/db";
import { appendAudit, jobEvent } from "@/db/queries/audit";
import { activeHostMachine, activeRegisterRow } from "@/db/queries/registers-admin";
import { visibleJob } from "@/db/queries/jobs";
import { enqueueMail } from "@/db/queries/outbox";
import { activeInstaller, queueAssignmentMails } from "@/db/queries/job-mail";
import { datasets, heads, jobs, procedureTemplates, users } from "@/db/schema";
import type { JobStatus } from "@/lib/domain/jobs";
import { type Actor } from "@/lib/domain/roles";
import { jobCreateRefusal, transitionRefusal } from "@/lib/policy/jobs";
import { forbidden, invalid } from "@/lib/errors";
import { publicUrl } from "@/lib/env";
import { reviewRequestMessage } from "@/lib/mail/messages";
import { activeUsers, lockJob } from "./locks";

/** Moves that carry signatures go through the report flow (db/queries/reports.ts), not here. */
const SIGNED_MOVES: readonly JobStatus[] = ["issued", "accepted", "rejected"];

/**
 * Changes a job's status if lib/policy/jobs.transitionRefusal allows this actor the move; an installer
 * may only move jobs assigned to them (visibility already limits that). Submitting for review
 * queues an e-mail to every engineer and inspector in the same transaction.
 */
export async function changeJobStatus(actor: Actor, jobId: string, to: JobStatus) {
  const d = await visibleJob(actor, jobId);
  if (SIGNED_MOVES.includes(to))
    throw forbidden("Issuing, accepting and rejecting are signed on the job's report page.");
  const refusal = transitionRefusal(actor, { job: d.job, to });
  if (refusal) throw forbidden(refusal);
  // A job with sphere-probe data is approved by approving its fitted parameters (Analysis tab),
  // so the approval always names the parameter set the control will be given.
  if (to === "approved") {
    const probe = await db
      .select({ id: datasets.id })
      .from(datasets)
      .where(
        and(eq(datasets.jobId, d.job.id), eq(datasets.kind, "sphere_probe"), eq(datasets.status, "stored")),
      )
      .limit(1);
    if (probe.length > 0)
      throw forbidden(
        "This job has sphere-probe data: approve its fitted head parameters on the Analysis tab.",
      );
  }
  const reviewers =
    to === "in_review" ? await activeUsers(inArray(users.role, ["engineer", "inspector"])) : [];
  return db.transaction(async (tx) => {
    const locked = await lockJob(tx, d.job.id);
    if (locked?.status !== d.job.status) throw invalid("The job changed meanwhile; open it again.");
    const at = new Date();
    await tx.update(jobs).set({ status: to, updatedAt: at }).where(eq(jobs.id, d.job.id));
    await appendAudit(
      tx,
      actor,
      jobEvent(d.job.id, "job.status_changed", {
        oldValues: { status: d.job.status },
        newValues: { status: to },
      }),
    );
    for (const r of reviewers) {
      await enqueueMail(tx, {
        dedupeKey: `review:${d.job.id}:${at.getTime()}:${r.id}`,
        to: r.email,
        ...reviewRequestMessage({
          baseUrl: publicUrl,
          recipientName: r.name,
          submittedBy: actor.name,
          job: d.job,
          customerName: d.customer.name,
        }),
        jobId: d.job.id,
      });
    }
    return { status: to };
  });
}

export interface JobCreateInput {
  templateId: string;
  machineId: string;
  headId: string;
  kind: "installation" | "reverification" | "after_crash";
  title: string;
  assignedInstallerId?: string | undefined;
  decisionRule: "simple" | "guarded";
  /** The office's record fields (db/queries/job-office.ts openJob checks and fills them). */
  orderReference?: string | null | undefined;
  customerContactName?: string | null | undefined;
  customerContactEmail?: string | null | undefined;
  scheduledFor?: Date | null | undefined;
  timeZone?: string | null | undefined;
  notes?: string | null | undefined;
}

/**
 * Creates a job from a procedure version for a machine and head (administrator or engineer),
 * optionally assigned to an installer; the job keeps that version. The reference is the next
 * TR-<year>-<nnnn>. Audited; an assigned installer is e-mailed in the same transaction.
 */
export async function createJobFromTemplate(actor: Actor, input: JobCreateInput) {
  const refusal = jobCreateRefusal(actor);
  if (refusal) throw forbidden(refusal);
  const [t] = await db.select().from(procedureTemplates).where(eq(procedureTemplates.id, input.templateId));
  if (!t) throw invalid("Choose a procedure.", [{ field: "templateId", message: "No such procedure." }]);
  const m = await activeHostMachine(input.machineId);
  const h = await activeRegisterRow(heads, input.headId, "headId", "head");
  const installer = input.assignedInstallerId ? await activeInstaller(input.assignedInstallerId) : null;
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(724003)`);
    const year = new Date().getUTCFullYear();
    const [{ n } = { n: 0 }] = await tx
      .select({
        n: sql<number>`coalesce(max(substring(${jobs.reference} from '^TR-${sql.raw(String(year))}-(\\d+)$')::int), 0)`,
      })
      .from(jobs);
    const reference = `TR-${year}-${String(Number(n) + 1).padStart(4, "0")}`;
    const [row] = await tx
      .insert(jobs)
      .values({
        reference,
        title: input.title,
        kind: input.kind,
        status: "draft",
        customerId: m.customerId,
        machineId: m.id,
        headId: h.id,
        assignedInstallerId: input.assignedInstallerId ?? null,
        decisionRule: input.decisionRule,
        templateId: t.id,
        orderReference: input.orderReference ?? null,
        customerContactName: input.customerContactName ?? null,
        customerContactEmail: input.customerContactEmail ?? null,
        scheduledFor: input.scheduledFor ?? null,
        timeZone: input.scheduledFor ? (input.timeZone ?? null) : null,
        notes: input.notes ?? null,
        createdById: actor.id,
      })
      .returning();
    await appendAudit(
      tx,
      actor,
      jobEvent(row!.id, "job.created", {
        newValues: {
          reference,
          status: "draft",
          template: `${t.name} v${t.version}`,
          assignedInstallerId: row!.assignedInstallerId,
          orderReference: row!.orderReference,
          scheduledFor: row!.scheduledFor?.toISOString() ?? null,
          timeZone: row!.timeZone,
        },
      }),
    );
    await queueAssignmentMails(tx, actor, {
      job: row!,
      where: m,
      scheduledFor: row!.scheduledFor,
      timeZone: row!.timeZone,
      from: null,
      to: installer,
      at: row!.createdAt,
    });
    return row!;
  });
}
