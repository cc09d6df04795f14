/**
 * The control loop's values (as found, values to enter, as left): who reads them on the job and
 * who records them, and when they are fixed. Customers see them in the issued report only.
 */
import { STATUS_LABELS, type JobStatus } from "@/lib/domain/jobs";
import type { ControlValueStage } from "@/lib/domain/control-values";
import type { Actor } from "@/lib/domain/roles";

/** Statuses after issue: the report printed the values, so they no longer change. */
const FIXED_STATUSES: readonly JobStatus[] = ["issued", "accepted", "rejected"];

/** The service company's staff read the control values on the job; a customer reads them in the report. */
export function controlValuesReadRefusal(actor: Pick<Actor, "role">): string | null {
  return actor.role === "customer"
    ? "The control's values are shown to the customer in the issued report."
    : null;
}

/** Who records the control's values at all: an application engineer. */
export function controlValuesRecorderRefusal(actor: Pick<Actor, "role">): string | null {
  return actor.role === "engineer" ? null : "Only an application engineer records the control's values.";
}

export interface ControlValuesSubject {
  readonly status: JobStatus;
  readonly stage: ControlValueStage;
  /** Whether the job has an approved fit (values to enter exist only then). */
  readonly hasApprovedFit: boolean;
}

/**
 * May this actor record a stage's values now? As found any time before issue; as left once a fit
 * is approved and the values to enter exist; nothing once the report is issued.
 */
export function controlValuesWriteRefusal(
  actor: Pick<Actor, "role">,
  s: ControlValuesSubject,
): string | null {
  const who = controlValuesRecorderRefusal(actor);
  if (who) return who;
  if (FIXED_STATUSES.includes(s.status))
    return `The job is ${STATUS_LABELS[s.status].toLowerCase()}; the control's values are fixed in the report.`;
  if (s.stage === "as_left" && !s.hasApprovedFit)
    return "As-left values follow the values to enter, which exist once the head's parameters are approved.";
  return null;
}

/** A refusal about the record's state (answered 409) rather than about the person (403). */
export function isStateRefusal(actor: Pick<Actor, "role">, s: ControlValuesSubject): boolean {
  return controlValuesRecorderRefusal(actor) === null && controlValuesWriteRefusal(actor, s) !== null;
}

/** Who chooses the Type B inputs of a fit's uncertainty budget: an application engineer. */
export function budgetRecorderRefusal(actor: Pick<Actor, "role">): string | null {
  return actor.role === "engineer" ? null : "Only an application engineer chooses the inputs of the budget.";
}

/** The budget's inputs are chosen until the report is issued (it prints them). */
export function budgetInputsRefusal(actor: Pick<Actor, "role">, job: { status: JobStatus }): string | null {
  const who = budgetRecorderRefusal(actor);
  if (who) return who;
  return FIXED_STATUSES.includes(job.status)
    ? `The job is ${STATUS_LABELS[job.status].toLowerCase()}; the budget printed in the report is fixed.`
    : null;
}
