/** A job's closed sets: its status flow and its kind, with one label each. */
import { closedSet } from "./closed-set";

export const { values: JOB_STATUSES, labels: STATUS_LABELS } = closedSet({
  draft: "Draft",
  measuring: "Measuring",
  in_review: "In review",
  approved: "Approved",
  issued: "Issued",
  accepted: "Accepted",
  rejected: "Rejected",
  /** Paused by the office; the job remembers the status it left (jobs.held_from_status). */
  on_hold: "On hold",
  /** Stopped for good with a reason; kept and readable, every write refused. */
  cancelled: "Cancelled",
});
export type JobStatus = (typeof JOB_STATUSES)[number];

/** Statuses after which the job's record fields (title, order, contact, schedule…) are fixed. */
export const JOB_RECORD_CLOSED_STATUSES: readonly JobStatus[] = [
  "issued",
  "accepted",
  "rejected",
  "cancelled",
];

export const { values: JOB_KINDS, labels: JOB_KIND_LABELS } = closedSet({
  installation: "Installation",
  reverification: "Re-verification",
  after_crash: "Check after a crash",
});
export type JobKind = (typeof JOB_KINDS)[number];

/** The columns the jobs list sorts by (the API's `sort` parameter). */
export const JOB_SORT_KEYS = ["reference", "title", "status", "customer", "machine", "updated"] as const;
export type JobSortKey = (typeof JOB_SORT_KEYS)[number];

/** One job as the jobs list shows it. */
export interface JobListRow {
  id: string;
  reference: string;
  title: string;
  kind: JobKind;
  status: JobStatus;
  updatedAt: Date;
  scheduledFor: Date | null;
  /** The IANA zone the schedule was given in (shown beside the time). */
  timeZone: string | null;
  customerId: string;
  customerName: string;
  siteName: string;
  machineName: string;
  headSerial: string;
  headAxes: string;
  installerName: string | null;
  assignedInstallerId: string | null;
}
