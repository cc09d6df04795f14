/**
 * Roles and what each may do. Pure: no database or framework, so every rule is unit-tested.
 * The server enforces these in db/queries and the route/action wrappers; pages only use them to
 * decide what to show.
 */
export const ROLES = ["admin", "installer", "inspector", "engineer", "customer"] as const;
export type Role = (typeof ROLES)[number];

export const JOB_STATUSES = [
  "draft",
  "measuring",
  "in_review",
  "approved",
  "issued",
  "accepted",
  "rejected",
] as const;
export type JobStatus = (typeof JOB_STATUSES)[number];

/** The acting user as the server knows it (fresh from the database on every request). */
export interface Actor {
  readonly id: string;
  readonly email: string;
  readonly name: string;
  readonly role: Role;
  /** Set for customer users only: the one company whose data they may see. */
  readonly customerId: string | null;
}

export const ROLE_LABELS: Record<Role, string> = {
  admin: "Administrator",
  installer: "Installer",
  inspector: "Inspector",
  engineer: "Application engineer",
  customer: "Customer",
};

export const STATUS_LABELS: Record<JobStatus, string> = {
  draft: "Draft",
  measuring: "Measuring",
  in_review: "In review",
  approved: "Approved",
  issued: "Issued",
  accepted: "Accepted",
  rejected: "Rejected",
};

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLES as readonly string[]).includes(value);
}

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

/** May this actor see a job with these owner fields? The same rule as jobScope, for one row. */
export function canSeeJob(
  actor: Actor,
  job: { customerId: string; assignedInstallerId: string | null },
): boolean {
  const scope = jobScope(actor);
  switch (scope.kind) {
    case "all":
      return true;
    case "assigned":
      return job.assignedInstallerId === scope.installerId;
    case "customer":
      return job.customerId === scope.customerId;
    case "none":
      return false;
  }
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

export function allowedTransitions(role: Role, from: JobStatus): JobStatus[] {
  return TRANSITIONS.filter((t) => t.from === from && t.roles.includes(role)).map((t) => t.to);
}

export function canTransition(role: Role, from: JobStatus, to: JobStatus): boolean {
  return allowedTransitions(role, from).includes(to);
}

/** Navigation entries per role: what each person needs in their working day. */
export interface NavItem {
  readonly href: string;
  readonly label: string;
}

export function navigationFor(role: Role): NavItem[] {
  const jobs: NavItem = {
    href: "/jobs",
    label: role === "installer" ? "My jobs" : role === "customer" ? "Our jobs" : "Jobs",
  };
  switch (role) {
    case "admin":
      return [jobs, { href: "/registers", label: "Registers" }];
    case "engineer":
      return [jobs, { href: "/registers/heads", label: "Heads" }];
    case "inspector":
    case "installer":
    case "customer":
      return [jobs];
  }
}

/** Pages under /registers are the administrator's (engineers may read the heads register). */
export function canReadRegister(
  role: Role,
  register: "customers" | "machines" | "heads" | "people",
): boolean {
  if (role === "admin") return true;
  return role === "engineer" && register === "heads";
}

/** Signature meanings and who gives each (21 CFR 11.50: the meaning is part of the signature). */
export const SIGNATURE_MEANINGS = ["performed", "inspected", "approved", "accepted", "rejected"] as const;
export type SignatureMeaningKey = (typeof SIGNATURE_MEANINGS)[number];

export const SIGNATURE_LABELS: Record<SignatureMeaningKey, string> = {
  performed: "Work performed",
  inspected: "Inspected",
  approved: "Approved and issued",
  accepted: "Accepted by the customer",
  rejected: "Rejected by the customer",
};

/**
 * May this actor give this signature on this job now? Performed: the assigned installer;
 * inspected: an inspector; both while the work is under way or in review. Approved (which issues
 * the report): an engineer, on an approved job. Accepted or rejected: a user of the job's own
 * company, on an issued job. Returns the reason when not.
 */
export function signatureRefusal(
  actor: Actor,
  meaning: SignatureMeaningKey,
  job: { status: JobStatus; customerId: string; assignedInstallerId: string | null },
): string | null {
  const working = job.status === "measuring" || job.status === "in_review" || job.status === "approved";
  switch (meaning) {
    case "performed":
      if (actor.role !== "installer" || job.assignedInstallerId !== actor.id)
        return "Only the installer assigned to this job signs the work as performed.";
      return working
        ? null
        : "The work can be signed as performed while the job is measuring, in review or approved.";
    case "inspected":
      if (actor.role !== "inspector") return "Only an inspector signs as inspected.";
      return working
        ? null
        : "The job can be signed as inspected while it is measuring, in review or approved.";
    case "approved":
      if (actor.role !== "engineer") return "Only an application engineer approves and issues the report.";
      return job.status === "approved"
        ? null
        : "The report is issued once the job's parameters are approved.";
    case "accepted":
    case "rejected":
      if (actor.role !== "customer" || actor.customerId !== job.customerId)
        return "Only the customer's own users accept or reject the report.";
      return job.status === "issued" ? null : "Only an issued report can be accepted or rejected.";
  }
}

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

/**
 * Who reads a head's history of fitted parameters: the administrator and engineers (every job on
 * the head) and the customer (their own company's jobs on it only). Installers and inspectors
 * work job by job and do not.
 */
export function canReadHeadHistory(role: Role): boolean {
  return canReadRegister(role, "heads") || role === "customer";
}

/** Registers an administrator keeps and who else may read them (engineers the heads, staff the instruments and procedures). */
export function canReadRegisterOf(
  role: Role,
  register: "customers" | "machines" | "heads" | "people" | "instruments" | "procedures" | "outbox",
): boolean {
  if (register === "instruments" || register === "procedures") return role !== "customer";
  if (register === "outbox") return role === "admin";
  return canReadRegister(role, register);
}

/** Who runs a head fit on a sphere-probe dataset: the people who review data (installers upload, customers read). */
export const HEAD_FIT_ROLES: readonly Role[] = ["admin", "inspector", "engineer"];
/** Job statuses in which a new fit may be run; once approved the parameter set is fixed. */
export const HEAD_FIT_OPEN_STATUSES: readonly JobStatus[] = ["draft", "measuring", "in_review"];

/**
 * May this actor run a (new) head fit on a dataset of a job in this status? Returns the reason
 * when not. Visibility of the job is checked separately (404, never 403, for a job one may not see).
 */
export function headFitRefusal(role: Role, status: JobStatus): string | null {
  if (!HEAD_FIT_ROLES.includes(role))
    return "Only an application engineer, an inspector or an administrator runs a head fit.";
  if (!HEAD_FIT_OPEN_STATUSES.includes(status))
    return `The job is ${STATUS_LABELS[status].toLowerCase()}; its fitted parameters are fixed.`;
  return null;
}
