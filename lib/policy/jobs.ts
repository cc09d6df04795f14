/**
 * Jobs: who sees which, who opens them, and who moves them along the status flow. Pure, so every
 * rule is unit-tested (tests/unit/policy.test.ts); db/queries/jobs.ts turns jobScope into SQL.
 */
import {
  JOB_RECORD_CLOSED_STATUSES,
  JOB_STATUSES,
  STATUS_LABELS,
  type JobKind,
  type JobStatus,
} from "@/lib/domain/jobs";
import type { Actor, Role } from "@/lib/domain/roles";

/** Staff of the service company see every customer's jobs; installers see theirs; customers their company's. */
export type JobScope =
  | { kind: "all" }
  | { kind: "assigned"; installerId: string }
  | { kind: "customer"; customerId: string }
  | { kind: "none" };

export function jobScope(actor: Actor): JobScope {
  switch (actor.role) {
    case "admin":
    case "engineer":
    case "inspector":
      return { kind: "all" };
    case "installer":
      return { kind: "assigned", installerId: actor.id };
    case "customer":
      // A customer user without a company sees nothing rather than everything.
      return actor.customerId ? { kind: "customer", customerId: actor.customerId } : { kind: "none" };
  }
}

export interface JobOwners {
  readonly customerId: string;
  readonly assignedInstallerId: string | null;
}

/** May this actor see a job with these owner fields? The same rule as jobScope, for one row. */
export function jobRefusal(actor: Actor, job: JobOwners): string | null {
  const scope = jobScope(actor);
  const visible =
    scope.kind === "all" ||
    (scope.kind === "assigned" && job.assignedInstallerId === scope.installerId) ||
    (scope.kind === "customer" && job.customerId === scope.customerId);
  return visible ? null : "This job is not one you may see.";
}

/** Jobs are opened by the office (administrator or engineer). */
export function jobCreateRefusal(actor: Actor): string | null {
  return actor.role === "admin" || actor.role === "engineer"
    ? null
    : "Jobs are opened by the office (administrator or engineer).";
}

/**
 * The status flow: draft → measuring → in review → approved → issued → accepted | rejected,
 * with "send back" from review to measuring. Who may make each move.
 */
const TRANSITIONS: ReadonlyArray<{ from: JobStatus; to: JobStatus; roles: readonly Role[] }> = [
  { from: "draft", to: "measuring", roles: ["admin", "installer", "engineer"] },
  { from: "measuring", to: "in_review", roles: ["admin", "installer"] },
  { from: "in_review", to: "measuring", roles: ["engineer", "inspector"] },
  { from: "in_review", to: "approved", roles: ["engineer"] },
  { from: "approved", to: "issued", roles: ["engineer"] },
  { from: "issued", to: "accepted", roles: ["customer"] },
  { from: "issued", to: "rejected", roles: ["customer"] },
];

export interface JobMove {
  readonly job: { readonly status: JobStatus; readonly assignedInstallerId?: string | null };
  readonly to: JobStatus;
}

/** May this actor move the job to `to`? An installer moves only jobs assigned to them. */
export function transitionRefusal(actor: Actor, move: JobMove): string | null {
  const { job, to } = move;
  const allowed = TRANSITIONS.some(
    (t) => t.from === job.status && t.to === to && t.roles.includes(actor.role),
  );
  const notTheirs =
    actor.role === "installer" &&
    job.assignedInstallerId !== undefined &&
    job.assignedInstallerId !== actor.id;
  if (!allowed || notTheirs)
    return `A ${actor.role} may not move a job from ${STATUS_LABELS[job.status].toLowerCase()} to ${STATUS_LABELS[to].toLowerCase()}.`;
  return null;
}

/** The moves this actor may make from the job's status now (pages offer these as buttons). */
export function allowedTransitions(actor: Actor, job: JobMove["job"]): JobStatus[] {
  return JOB_STATUSES.filter((to) => transitionRefusal(actor, { job, to }) === null);
}

// ---- The office's moves: record fields, assignment, hold, release, cancel ----------------------

const OFFICE_WORDS = "the office (administrator or engineer)";
const isOffice = (actor: Actor) => actor.role === "admin" || actor.role === "engineer";
const statusWord = (s: JobStatus) => STATUS_LABELS[s].toLowerCase();

/** Statuses in which the installer may be assigned or changed (before the readings go to review). */
export const ASSIGN_STATUSES: readonly JobStatus[] = ["draft", "measuring", "on_hold"];
/** Statuses from which a job may be put on hold. */
export const HOLD_STATUSES: readonly JobStatus[] = ["draft", "measuring", "in_review"];
/** Statuses from which a job may be cancelled: anything not yet issued (issued reports are amended, never cancelled). */
export const CANCEL_STATUSES: readonly JobStatus[] = [
  "draft",
  "measuring",
  "in_review",
  "approved",
  "on_hold",
];

/** May this actor edit the job's record fields (title, order, contact, schedule, notes, condition, re-check)? */
export function jobRecordEditRefusal(actor: Actor, job: { status: JobStatus }): string | null {
  if (!isOffice(actor)) return `A job's record is kept by ${OFFICE_WORDS}.`;
  if (job.status === "cancelled") return "The job is cancelled; it stays readable and takes no more changes.";
  if (JOB_RECORD_CLOSED_STATUSES.includes(job.status))
    return `The job is ${statusWord(job.status)}; its record is fixed (amend the report instead).`;
  return null;
}

export function jobAssignRefusal(actor: Actor, job: { status: JobStatus }): string | null {
  if (!isOffice(actor)) return `Installers are assigned by ${OFFICE_WORDS}.`;
  if (!ASSIGN_STATUSES.includes(job.status))
    return `The job is ${statusWord(job.status)}; the installer can be changed only while it is draft, measuring or on hold.`;
  return null;
}

export function jobHoldRefusal(actor: Actor, job: { status: JobStatus }): string | null {
  if (!isOffice(actor)) return `Jobs are put on hold by ${OFFICE_WORDS}.`;
  if (!HOLD_STATUSES.includes(job.status))
    return `The job is ${statusWord(job.status)}; only a draft, measuring or in-review job can be put on hold.`;
  return null;
}

export function jobReleaseRefusal(actor: Actor, job: { status: JobStatus }): string | null {
  if (!isOffice(actor)) return `Jobs are released from hold by ${OFFICE_WORDS}.`;
  if (job.status !== "on_hold") return `The job is ${statusWord(job.status)}, not on hold.`;
  return null;
}

export function jobCancelRefusal(actor: Actor, job: { status: JobStatus }): string | null {
  if (!isOffice(actor)) return `Jobs are cancelled by ${OFFICE_WORDS}.`;
  if (job.status === "cancelled") return "The job is already cancelled.";
  if (!CANCEL_STATUSES.includes(job.status))
    return `The job is ${statusWord(job.status)}; an issued report is amended, never cancelled.`;
  return null;
}

/** Does this procedure version fit a new job of this kind on a head of this model? */
export function procedureApplies(
  t: {
    isCurrent: boolean;
    retiredAt: Date | null;
    jobKinds: readonly JobKind[] | null;
    headModel: string | null;
  },
  kind: JobKind,
  headModel: string | null,
): boolean {
  if (!t.isCurrent || t.retiredAt) return false;
  if (t.jobKinds && t.jobKinds.length > 0 && !t.jobKinds.includes(kind)) return false;
  if (t.headModel && t.headModel.trim().toLowerCase() !== (headModel ?? "").trim().toLowerCase())
    return false;
  return true;
}
