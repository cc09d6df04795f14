/**
 * What waits on whom: each role's queues on the jobs board ("to measure", "to inspect", …). The
 * one home of the rule, in two forms: `inQueue`, a predicate over one list row, and
 * `queueCondition`, the same rule as plain data that db/queries/job-board.ts writes as SQL, so
 * the board's tabs, their counts and GET /api/jobs?queue= agree for any number of jobs. A unit
 * test (tests/unit/jobs-office.test.ts) checks the two forms against each other on every status,
 * role, assignment, schedule and customer.
 */
import type { JobStatus } from "@/lib/domain/jobs";
import type { Actor, Role } from "@/lib/domain/roles";
import { closedSet } from "@/lib/domain/closed-set";

export const { values: JOB_QUEUES, labels: QUEUE_LABELS } = closedSet({
  to_schedule: "To schedule",
  to_measure: "To measure",
  to_inspect: "To inspect",
  to_approve: "To approve",
  to_issue: "To issue",
  to_accept: "To accept",
});
export type JobQueue = (typeof JOB_QUEUES)[number];

const ROLE_QUEUES: Record<Role, readonly JobQueue[]> = {
  admin: ["to_schedule"],
  installer: ["to_measure"],
  inspector: ["to_inspect"],
  engineer: ["to_approve", "to_issue"],
  customer: ["to_accept"],
};

/** The queues a role is shown, in order. */
export function queuesFor(role: Role): readonly JobQueue[] {
  return ROLE_QUEUES[role];
}

export interface QueueRow {
  readonly status: JobStatus;
  readonly assignedInstallerId: string | null;
  readonly scheduledFor: Date | string | null;
  readonly customerId: string;
}

/** Does this job wait on this actor in this queue? A queue not offered to the actor's role holds nothing. */
export function inQueue(
  queue: JobQueue,
  actor: Pick<Actor, "id" | "role" | "customerId">,
  row: QueueRow,
): boolean {
  if (!ROLE_QUEUES[actor.role].includes(queue)) return false;
  switch (queue) {
    case "to_schedule":
      return row.status === "draft" && (row.assignedInstallerId === null || row.scheduledFor === null);
    case "to_measure":
      return (row.status === "draft" || row.status === "measuring") && row.assignedInstallerId === actor.id;
    case "to_inspect":
    case "to_approve":
      return row.status === "in_review";
    case "to_issue":
      return row.status === "approved";
    case "to_accept":
      return row.status === "issued" && row.customerId === actor.customerId;
  }
}

/**
 * A queue as a condition on jobs columns: every part must hold. `statuses`: the job's status is
 * one of these; `installerId`: assigned to this user; `customerId`: the job is this customer's;
 * `unplanned`: no installer or no scheduled time yet. null: the queue holds nothing for the actor.
 */
export interface QueueCondition {
  readonly statuses: readonly JobStatus[];
  readonly installerId?: string;
  readonly customerId?: string;
  readonly unplanned?: true;
}

export function queueCondition(
  queue: JobQueue,
  actor: Pick<Actor, "id" | "role" | "customerId">,
): QueueCondition | null {
  if (!ROLE_QUEUES[actor.role].includes(queue)) return null;
  switch (queue) {
    case "to_schedule":
      return { statuses: ["draft"], unplanned: true };
    case "to_measure":
      return { statuses: ["draft", "measuring"], installerId: actor.id };
    case "to_inspect":
    case "to_approve":
      return { statuses: ["in_review"] };
    case "to_issue":
      return { statuses: ["approved"] };
    case "to_accept":
      return actor.customerId ? { statuses: ["issued"], customerId: actor.customerId } : null;
  }
}

/** A QueueCondition read over one row, as the SQL reads it over the table. */
export function conditionHolds(c: QueueCondition | null, row: QueueRow): boolean {
  if (!c) return false;
  return (
    c.statuses.includes(row.status) &&
    (c.installerId === undefined || row.assignedInstallerId === c.installerId) &&
    (c.customerId === undefined || row.customerId === c.customerId) &&
    (!c.unplanned || row.assignedInstallerId === null || row.scheduledFor === null)
  );
}

/** How many of these rows wait in each of the actor's queues. */
export function queueCounts(
  actor: Pick<Actor, "id" | "role" | "customerId">,
  rows: readonly QueueRow[],
): { queue: JobQueue; label: string; count: number }[] {
  return queuesFor(actor.role).map((queue) => ({
    queue,
    label: QUEUE_LABELS[queue],
    count: rows.filter((r) => inQueue(queue, actor, r)).length,
  }));
}
