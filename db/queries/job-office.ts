import "server-only";
import { and, asc, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { appendAudit, jobEvent, type AuditEvent } from "@/db/queries/audit";
import { lockJob } from "@/db/queries/locks";
import { activeInstaller, queueAssignmentMails } from "@/db/queries/job-mail";
import { visibleJob } from "@/db/queries/jobs";
import { rowsInUse } from "@/db/queries/registers";
import { listActiveInstallers, listCustomersForSelect } from "@/db/queries/users-admin";
import { createJobFromTemplate } from "@/db/queries/job-status";
import { heads, jobs, machines, procedureTemplates, sites } from "@/db/schema";
import type { JobStatus } from "@/lib/domain/jobs";
import type { Actor } from "@/lib/domain/roles";
import { forbidden, invalid } from "@/lib/errors";
import {
  jobAssignRefusal,
  jobCancelRefusal,
  jobCreateRefusal,
  jobHoldRefusal,
  jobRecordEditRefusal,
  jobReleaseRefusal,
  procedureApplies,
} from "@/lib/policy/jobs";
import {
  scheduleOf,
  type JobMoveInput,
  type JobOpenInput,
  type JobRecordInput,
} from "@/lib/validations/jobs";

/** What the "New job" form offers: rows in use only (retired ones are left out), and active installers. */
export async function newJobChoices(actor: Actor) {
  const refusal = jobCreateRefusal(actor);
  if (refusal) throw forbidden(refusal);
  const [customerRows, siteRows, machineRows, headRows, templateRows, installerRows] = await Promise.all([
    listCustomersForSelect(),
    rowsInUse(sites, { id: sites.id, name: sites.name, customerId: sites.customerId }, sites.name),
    rowsInUse(
      machines,
      { id: machines.id, name: machines.name, siteId: machines.siteId, model: machines.model },
      machines.name,
    ),
    rowsInUse(
      heads,
      {
        id: heads.id,
        serial: heads.serial,
        maker: heads.maker,
        model: heads.model,
        machineId: heads.machineId,
      },
      heads.serial,
    ),
    db
      .select({
        id: procedureTemplates.id,
        name: procedureTemplates.name,
        version: procedureTemplates.version,
        jobKinds: procedureTemplates.jobKinds,
        headModel: procedureTemplates.headModel,
      })
      .from(procedureTemplates)
      .where(and(eq(procedureTemplates.isCurrent, true), isNull(procedureTemplates.retiredAt)))
      .orderBy(asc(procedureTemplates.name)),
    listActiveInstallers(),
  ]);
  return {
    customers: customerRows,
    sites: siteRows,
    machines: machineRows,
    heads: headRows,
    procedures: templateRows,
    installers: installerRows,
  };
}
export type NewJobChoices = Awaited<ReturnType<typeof newJobChoices>>;

/**
 * "New job" (the jobs list's form and POST /api/jobs): checks that the customer, site, machine and
 * head belong together and that the procedure is current and fits the job's kind and the head's
 * model, then opens the job through createJobFromTemplate (audited, the installer e-mailed).
 */
export async function openJob(actor: Actor, input: JobOpenInput) {
  const refusal = jobCreateRefusal(actor);
  if (refusal) throw forbidden(refusal);
  const [place] = await db
    .select({ siteId: sites.id, customerId: sites.customerId })
    .from(machines)
    .innerJoin(sites, eq(sites.id, machines.siteId))
    .where(eq(machines.id, input.machineId));
  if (!place) throw invalid("Choose a host machine.", [{ field: "machineId", message: "No such machine." }]);
  if (input.customerId && input.customerId !== place.customerId)
    throw invalid("The machine is not this customer's.", [
      { field: "machineId", message: "This machine belongs to another customer." },
    ]);
  if (input.siteId && input.siteId !== place.siteId)
    throw invalid("The machine is not at this site.", [
      { field: "machineId", message: "This machine stands at another site." },
    ]);
  const [head] = await db
    .select({ model: heads.model, machineId: heads.machineId })
    .from(heads)
    .where(eq(heads.id, input.headId));
  if (!head) throw invalid("Choose a head.", [{ field: "headId", message: "No such head." }]);
  if (head.machineId && head.machineId !== input.machineId)
    throw invalid("The head is mounted on another machine.", [
      {
        field: "headId",
        message: "This head is mounted on another machine; move it in the heads register first.",
      },
    ]);
  const [t] = await db.select().from(procedureTemplates).where(eq(procedureTemplates.id, input.templateId));
  if (!t || !procedureApplies(t, input.kind, head.model))
    throw invalid("Choose a procedure that fits.", [
      {
        field: "templateId",
        message: "Not a current procedure for this kind of job and head model.",
      },
    ]);
  // createJobFromTemplate stores an absent record field as empty.
  return createJobFromTemplate(actor, {
    templateId: input.templateId,
    machineId: input.machineId,
    headId: input.headId,
    kind: input.kind,
    title: input.title,
    decisionRule: input.decisionRule,
    assignedInstallerId: input.assignedInstallerId ?? undefined,
    orderReference: input.orderReference,
    customerContactName: input.customerContactName,
    customerContactEmail: input.customerContactEmail,
    notes: input.notes,
    ...scheduleOf(input),
  });
}

const RECORD_KEYS = [
  "title",
  "orderReference",
  "customerContactName",
  "customerContactEmail",
  "notes",
  "conditionAsFound",
  "nextRecheckOn",
] as const;

/**
 * Edits a job's record fields and/or its installer (the office; while not issued or cancelled).
 * Only the fields given change; the audit event names each old and new value; an installer change
 * e-mails the new installer and the previous one in the same transaction.
 */
export async function updateJobRecord(actor: Actor, jobId: string, input: JobRecordInput) {
  const d = await visibleJob(actor, jobId);
  const editRefusal = jobRecordEditRefusal(actor, d.job);
  if (editRefusal) throw forbidden(editRefusal);
  const changes: Partial<typeof jobs.$inferInsert> = {};
  for (const k of RECORD_KEYS) if (input[k] !== undefined) (changes as Record<string, unknown>)[k] = input[k];
  if (changes.title === null)
    throw invalid("Give the job a title.", [{ field: "title", message: "Required." }]);
  const schedule = scheduleOf(input);
  if (schedule) Object.assign(changes, schedule);

  let to: { id: string; name: string; email: string } | null = null;
  const reassigning =
    input.assignedInstallerId !== undefined && input.assignedInstallerId !== d.job.assignedInstallerId;
  if (reassigning) {
    const assignRefusal = jobAssignRefusal(actor, d.job);
    if (assignRefusal) throw forbidden(assignRefusal);
    if (input.assignedInstallerId) to = await activeInstaller(input.assignedInstallerId);
    changes.assignedInstallerId = input.assignedInstallerId;
  }
  const oldValues: Record<string, unknown> = {};
  const newValues: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(changes)) {
    const old = (d.job as Record<string, unknown>)[k];
    const norm = (x: unknown) => (x instanceof Date ? x.toISOString() : (x ?? null));
    if (norm(old) === norm(v)) continue;
    oldValues[k] = norm(old);
    newValues[k] = norm(v);
  }
  if (Object.keys(newValues).length === 0) return { job: d.job, changed: [] as string[] };
  return db.transaction(async (tx) => {
    const locked = await lockJob(tx, d.job.id);
    if (locked?.status !== d.job.status || locked.assignedInstallerId !== d.job.assignedInstallerId)
      throw invalid("The job changed meanwhile; open it again.");
    const at = new Date();
    const row = await writeJob(
      tx,
      actor,
      d.job.id,
      { ...changes, updatedAt: at },
      { action: reassigning ? "job.assigned" : "job.updated", oldValues, newValues },
    );
    if (reassigning)
      await queueAssignmentMails(tx, actor, {
        job: row,
        where: { customerName: d.customer.name, siteName: d.site.name, machineName: d.machine.name },
        scheduledFor: row.scheduledFor,
        timeZone: row.timeZone,
        from: d.installer,
        to,
        at,
      });
    return { job: row, changed: Object.keys(newValues) };
  });
}

/** The audit action of each move: job.held, job.released, job.cancelled. */
const MOVED: Record<JobMoveInput["action"], string> = {
  hold: "held",
  release: "released",
  cancel: "cancelled",
};

/**
 * Hold, release and cancel (the office). On hold remembers the status the job left and release
 * restores it; cancel needs a reason and is final: the job stays readable and refuses every write
 * (each write path allows only its own open statuses). Audited; nothing is deleted.
 */
export async function moveJob(actor: Actor, jobId: string, move: JobMoveInput) {
  const d = await visibleJob(actor, jobId);
  const refusal =
    move.action === "hold"
      ? jobHoldRefusal(actor, d.job)
      : move.action === "release"
        ? jobReleaseRefusal(actor, d.job)
        : jobCancelRefusal(actor, d.job);
  if (refusal) throw forbidden(refusal);
  let set: Partial<typeof jobs.$inferInsert>;
  let to: JobStatus;
  if (move.action === "hold") {
    to = "on_hold";
    set = { status: to, heldFromStatus: d.job.status, holdReason: move.reason ?? null };
  } else if (move.action === "release") {
    // A job put on hold before the column existed goes back to draft, the safe start.
    to = d.job.heldFromStatus ?? "draft";
    set = { status: to, heldFromStatus: null, holdReason: null };
  } else {
    to = "cancelled";
    set = { status: to, cancelReason: move.reason };
  }
  return db.transaction(async (tx) => {
    const locked = await lockJob(tx, d.job.id);
    if (locked?.status !== d.job.status) throw invalid("The job changed meanwhile; open it again.");
    return writeJob(
      tx,
      actor,
      d.job.id,
      { ...set, updatedAt: new Date() },
      {
        action: `job.${MOVED[move.action]}`,
        oldValues: { status: d.job.status },
        newValues: { status: to, ...("reason" in move && move.reason ? { reason: move.reason } : {}) },
      },
    );
  });
}

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/** Writes a change to the job's row together with the job event that records it. */
async function writeJob(
  tx: Tx,
  actor: Actor,
  jobId: string,
  set: Partial<typeof jobs.$inferInsert>,
  { action, ...values }: Pick<AuditEvent, "action" | "oldValues" | "newValues">,
) {
  const [row] = await tx.update(jobs).set(set).where(eq(jobs.id, jobId)).returning();
  await appendAudit(tx, actor, jobEvent(jobId, action, values));
  return row!;
}
