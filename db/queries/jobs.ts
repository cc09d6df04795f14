import "server-only";
import { and, asc, desc, eq, ilike, or, sql, type AnyColumn, type SQL } from "drizzle-orm";
import { alias, type SelectedFields } from "drizzle-orm/pg-core";
import type { SelectResultFields } from "drizzle-orm/query-builders/select.types";
import { cache } from "react";
import { db } from "@/db";
import {
  customers,
  datasets,
  heads,
  jobs,
  machines,
  photos,
  readings,
  reports,
  signatures,
  sites,
  templateParameterLimits,
  templateSteps,
  users,
} from "@/db/schema";
import { JOB_SORT_KEYS, type JobListRow, type JobSortKey, type JobStatus } from "@/lib/domain/jobs";
import { type Actor } from "@/lib/domain/roles";
import { jobScope } from "@/lib/policy/jobs";
import { isUuid } from "@/lib/domain/uuid";
import { notFound } from "@/lib/errors";

/** The SQL form of lib/policy/jobs.jobScope: every read of jobs goes through it. */
export function jobAccessCondition(actor: Actor): SQL | undefined {
  const scope = jobScope(actor);
  switch (scope.kind) {
    case "all":
      return undefined;
    case "assigned":
      return eq(jobs.assignedInstallerId, scope.installerId);
    case "customer":
      return eq(jobs.customerId, scope.customerId);
    case "none":
      return sql`false`;
  }
}

export { JOB_SORT_KEYS, type JobSortKey };

export interface JobListFilters {
  status?: JobStatus;
  q?: string;
  sort?: JobSortKey;
  dir?: "asc" | "desc";
}

const installers = alias(users, "installer");

const listColumns = {
  id: jobs.id,
  reference: jobs.reference,
  title: jobs.title,
  kind: jobs.kind,
  status: jobs.status,
  updatedAt: jobs.updatedAt,
  scheduledFor: jobs.scheduledFor,
  timeZone: jobs.timeZone,
  customerId: jobs.customerId,
  customerName: customers.name,
  siteName: sites.name,
  machineName: machines.name,
  headSerial: heads.serial,
  headAxes: sql<string>`${heads.primaryAxis} || '/' || ${heads.secondaryAxis}`,
  installerName: installers.name,
  assignedInstallerId: jobs.assignedInstallerId,
};

export type { JobListRow };

/** The jobs list's columns and joins (customer, machine and site, head, installer). */
export function baseJobQuery() {
  return db
    .select(listColumns)
    .from(jobs)
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .innerJoin(machines, eq(machines.id, jobs.machineId))
    .innerJoin(sites, eq(sites.id, machines.siteId))
    .innerJoin(heads, eq(heads.id, jobs.headId))
    .leftJoin(installers, eq(installers.id, jobs.assignedInstallerId));
}

/** The list's conditions: the actor's scope, then the filters (over the joins of baseJobQuery). */
export function jobListConditions(actor: Actor, filters: JobListFilters = {}): (SQL | undefined)[] {
  const conditions: (SQL | undefined)[] = [jobAccessCondition(actor)];
  if (filters.status) conditions.push(eq(jobs.status, filters.status));
  const q = filters.q?.trim();
  if (q) {
    const like = `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    conditions.push(
      or(
        ilike(jobs.reference, like),
        ilike(jobs.title, like),
        ilike(customers.name, like),
        ilike(machines.name, like),
        ilike(heads.serial, like),
      ),
    );
  }
  return conditions;
}

/** The list's order: the chosen column (newest change first by default), then the reference. */
export function jobListOrder(filters: JobListFilters = {}): SQL[] {
  const sortColumn = {
    reference: jobs.reference,
    title: jobs.title,
    status: jobs.status,
    customer: customers.name,
    machine: machines.name,
    updated: jobs.updatedAt,
  }[filters.sort ?? "updated"];
  const order =
    (filters.dir ?? (filters.sort ? "asc" : "desc")) === "asc" ? asc(sortColumn) : desc(sortColumn);
  return [order, asc(jobs.reference)];
}

/** One job with its machine, head and people; null when missing *or* not visible to the actor. */
export const getJobDetail = cache(async function getJobDetail(actor: Actor, jobId: string) {
  if (!isUuid(jobId)) return null;
  const rows = await db
    .select({
      job: jobs,
      customer: { id: customers.id, name: customers.name },
      site: { id: sites.id, name: sites.name, address: sites.address },
      machine: machines,
      head: heads,
      installer: { id: installers.id, name: installers.name, email: installers.email },
    })
    .from(jobs)
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .innerJoin(machines, eq(machines.id, jobs.machineId))
    .innerJoin(sites, eq(sites.id, machines.siteId))
    .innerJoin(heads, eq(heads.id, jobs.headId))
    .leftJoin(installers, eq(installers.id, jobs.assignedInstallerId))
    .where(and(eq(jobs.id, jobId), jobAccessCondition(actor)))
    .limit(1);
  const row = rows[0];
  if (!row) return null;
  return { ...row, installer: row.installer?.id ? row.installer : null };
});
export type JobDetail = NonNullable<Awaited<ReturnType<typeof getJobDetail>>>;

/** The job as getJobDetail gives it, or 404 when there is none the actor may see. */
export async function visibleJob(actor: Actor, jobId: string): Promise<JobDetail> {
  const d = await getJobDetail(actor, jobId);
  if (!d) throw notFound("job");
  return d;
}

/** The API's JSON form of a job detail (no internal columns such as created_by). */
export function jobDetailJson(d: JobDetail) {
  return {
    id: d.job.id,
    reference: d.job.reference,
    title: d.job.title,
    kind: d.job.kind,
    status: d.job.status,
    decisionRule: d.job.decisionRule,
    scheduledFor: d.job.scheduledFor,
    timeZone: d.job.timeZone,
    orderReference: d.job.orderReference,
    customerContact: { name: d.job.customerContactName, email: d.job.customerContactEmail },
    notes: d.job.notes,
    conditionAsFound: d.job.conditionAsFound,
    nextRecheckOn: d.job.nextRecheckOn,
    heldFromStatus: d.job.heldFromStatus,
    holdReason: d.job.holdReason,
    cancelReason: d.job.cancelReason,
    updatedAt: d.job.updatedAt,
    customer: d.customer,
    site: d.site,
    machine: {
      id: d.machine.id,
      name: d.machine.name,
      builder: d.machine.builder,
      model: d.machine.model,
      serial: d.machine.serial,
      kind: d.machine.kind,
      control: d.machine.control,
    },
    head: {
      id: d.head.id,
      serial: d.head.serial,
      maker: d.head.maker,
      model: d.head.model,
      primaryAxis: d.head.primaryAxis,
      secondaryAxis: d.head.secondaryAxis,
      toolDirection: d.head.toolDirection,
      nominalPivotLengthMm: d.head.nominalPivotLengthMm,
      toolAxisOffsetMm: d.head.toolAxisOffsetMm,
    },
    installer: d.installer,
  };
}

/** Tables of records that belong to one job: each row carries its job's id. */
type JobRowsTable = typeof readings | typeof datasets | typeof photos | typeof signatures | typeof reports;

/**
 * The given columns of a job's rows in `table`, sorted by `order` (no access check: callers have
 * checked the job).
 */
export async function rowsOfJob<S extends SelectedFields>(
  table: JobRowsTable,
  columns: S,
  jobId: string,
  ...order: SQL[]
): Promise<SelectResultFields<S>[]> {
  const t = table as typeof readings;
  const rows = await db
    .select(columns)
    .from(t)
    .where(eq(t.jobId, jobId))
    .orderBy(...order);
  return rows as SelectResultFields<S>[];
}

/**
 * The rows of a procedure version in `table`, sorted by `order`; none for a job without a version
 * (no access check: callers have checked the job or the register).
 */
export async function rowsOfTemplate<T extends typeof templateSteps | typeof templateParameterLimits>(
  table: T,
  templateId: string | null,
  order: AnyColumn,
): Promise<T["$inferSelect"][]> {
  if (!templateId) return [];
  const t = table as typeof templateSteps;
  return db.select().from(t).where(eq(t.templateId, templateId)).orderBy(asc(order));
}
