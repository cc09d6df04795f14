import "server-only";
import { and, count, eq, inArray, isNull, or, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { baseJobQuery, jobAccessCondition, jobListConditions, jobListOrder } from "@/db/queries/jobs";
import { jobs } from "@/db/schema";
import type { JobListRow } from "@/lib/domain/jobs";
import type { Actor } from "@/lib/domain/roles";
import {
  QUEUE_LABELS,
  queueCondition,
  queuesFor,
  type JobQueue,
  type QueueCondition,
} from "@/lib/policy/job-queues";
import type { JobBoardQuery } from "@/lib/validations/jobs";

/** Without a page size, one page holds this many jobs (the largest page the API accepts). */
export const BOARD_MAX_PAGE = 500;

export interface JobBoard {
  jobs: JobListRow[];
  /** Matching jobs before paging. */
  total: number;
  page: number;
  pageSize: number;
  /** The actor's queues with how many jobs wait in each (over every job they may see). */
  queues: { queue: JobQueue; label: string; count: number }[];
}

/** lib/policy/job-queues' condition for a queue, written over the jobs table. */
export function queueSql(c: QueueCondition | null): SQL {
  if (!c) return sql`false`;
  return and(
    inArray(jobs.status, [...c.statuses]),
    c.installerId !== undefined ? eq(jobs.assignedInstallerId, c.installerId) : undefined,
    c.customerId !== undefined ? eq(jobs.customerId, c.customerId) : undefined,
    c.unplanned ? or(isNull(jobs.assignedInstallerId), isNull(jobs.scheduledFor)) : undefined,
  )!;
}

/**
 * The jobs board (the page's first render and GET /api/jobs), in SQL whatever the number of jobs:
 * the jobs the actor may see with the filters and sort of the list, narrowed to one of the
 * actor's queues when asked, one page of them (limit/offset), the number matching, and the count
 * waiting in each of the actor's queues over every job they may see (filters aside).
 */
export async function jobBoard(actor: Actor, query: JobBoardQuery): Promise<JobBoard> {
  const { queue, page = 1, pageSize = BOARD_MAX_PAGE, ...filters } = query;
  const where = and(
    ...jobListConditions(actor, filters),
    queue ? queueSql(queueCondition(queue, actor)) : undefined,
  );
  const queues = queuesFor(actor.role);
  const [rows, [{ n: total } = { n: 0 }], [counts]] = await Promise.all([
    baseJobQuery()
      .where(where)
      .orderBy(...jobListOrder(filters))
      .limit(pageSize)
      .offset((page - 1) * pageSize) as Promise<JobListRow[]>,
    db.select({ n: count() }).from(baseJobQuery().where(where).as("matching")),
    db
      .select(
        Object.fromEntries(
          queues.map((q) => [
            q,
            sql<number>`count(*) filter (where ${queueSql(queueCondition(q, actor))})`.mapWith(Number),
          ]),
        ),
      )
      .from(jobs)
      .where(jobAccessCondition(actor)),
  ]);
  return {
    jobs: rows,
    total,
    page,
    pageSize,
    queues: queues.map((q) => ({ queue: q, label: QUEUE_LABELS[q], count: counts?.[q] ?? 0 })),
  };
}
