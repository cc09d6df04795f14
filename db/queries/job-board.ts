import "server-only";
import { listJobs } from "@/db/queries/jobs";
import type { JobListRow } from "@/lib/domain/jobs";
import type { Actor } from "@/lib/domain/roles";
import { inQueue, queueCounts, type JobQueue } from "@/lib/policy/job-queues";
import type { JobBoardQuery } from "@/lib/validations/jobs";

export interface JobBoard {
  jobs: JobListRow[];
  /** Matching jobs before paging. */
  total: number;
  page: number;
  pageSize: number;
  /** The actor's queues with how many jobs wait in each (over every job they may see). */
  queues: { queue: JobQueue; label: string; count: number }[];
}

/**
 * The jobs board (the page's first render and GET /api/jobs): the jobs the actor may see through
 * listJobs (its scope, filters and sort; at most 500), narrowed to one of the actor's queues when
 * asked, one page of them, and the count waiting in each queue.
 */
export async function jobBoard(actor: Actor, query: JobBoardQuery): Promise<JobBoard> {
  const { queue, page = 1, pageSize, ...filters } = query;
  const filtered = Object.values(filters).some((v) => v !== undefined);
  const [matching, visible] = await Promise.all([
    listJobs(actor, filters),
    filtered ? listJobs(actor, {}) : null,
  ]);
  const rows = queue ? matching.filter((r) => inQueue(queue, actor, r)) : matching;
  const size = pageSize ?? Math.max(rows.length, 1);
  return {
    jobs: rows.slice((page - 1) * size, page * size),
    total: rows.length,
    page,
    pageSize: size,
    queues: queueCounts(actor, visible ?? matching),
  };
}
