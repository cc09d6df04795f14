// The jobs board's queues, counts and pages in SQL with more jobs than one page: 620 jobs for one
// tenant (Marlow Creek) inserted in one statement, in a pattern whose queue sizes are counted by
// hand below; each actor's totals and queue counts must grow by exactly those numbers, agree with
// the policy's predicate (lib/policy/job-queues.ts inQueue) run over every row the actor may see,
// and paging must visit every job of a queue once.
import { and, eq, like } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as listRoute } from "@/app/api/jobs/route";
import { db } from "@/db";
import { jobBoard } from "@/db/queries/job-board";
import { jobAccessCondition } from "@/db/queries/jobs";
import { jobs } from "@/db/schema";
import type { JobStatus } from "@/lib/domain/jobs";
import { inQueue, queuesFor, type JobQueue } from "@/lib/policy/job-queues";
import { actorsBeforeAll, BASE_JOB } from "./fixtures";
import { request, signInAs } from "./helpers";
import { jobBaseOf } from "./ready-job";

const N = 620;
const TAG = `TR-BULK-${Date.now().toString(36)}`;
const as = actorsBeforeAll();
type Board = Awaited<ReturnType<typeof jobBoard>>;
const before: Record<string, Board> = {};
const after: Record<string, Board> = {};
const WHO = ["admin", "installer", "inspector", "engineer", "buyer", "buyer-tollan"] as const;

/**
 * Job i: status by i mod 5 (draft, measuring, in review, approved, issued: 124 each), assigned to
 * the demo installer when i is even (310), scheduled when i is a multiple of 3.
 */
const CYCLE: JobStatus[] = ["draft", "measuring", "in_review", "approved", "issued"];
/**
 * Added to each queue, counted by hand: to measure = draft or measuring and even = i mod 10 in
 * {0, 6} = 124; to schedule = drafts (124) less those assigned and scheduled (i mod 30 = 0: 21) =
 * 103; in review 124; approved 124; issued for Marlow Creek 124, for Tollan 0.
 */
const ADDED: Record<(typeof WHO)[number], Partial<Record<JobQueue, number>> & { total: number }> = {
  admin: { total: N, to_schedule: 103 },
  installer: { total: N / 2, to_measure: 124 },
  inspector: { total: N, to_inspect: 124 },
  engineer: { total: N, to_approve: 124, to_issue: 124 },
  buyer: { total: N, to_accept: 124 },
  "buyer-tollan": { total: 0, to_accept: 0 },
};

const countsOf = (b: Board) => Object.fromEntries(b.queues.map((q) => [q.queue, q.count]));

beforeAll(async () => {
  for (const w of WHO) before[w] = await jobBoard(as[w]!, { pageSize: 5 });
  const base = await jobBaseOf(BASE_JOB);
  const when = new Date("2027-03-01T07:00:00Z");
  await db.insert(jobs).values(
    Array.from({ length: N }, (_, i) => ({
      reference: `${TAG}-${String(i).padStart(4, "0")}`,
      title: `Bulk job ${i}`,
      kind: "reverification" as const,
      status: CYCLE[i % 5]!,
      customerId: base.customerId,
      machineId: base.machineId,
      headId: base.headId,
      assignedInstallerId: i % 2 === 0 ? as.installer!.id : null,
      scheduledFor: i % 3 === 0 ? when : null,
    })),
  );
  for (const w of WHO) after[w] = await jobBoard(as[w]!, { pageSize: 5 });
}, 60_000);

afterAll(async () => {
  await db.delete(jobs).where(like(jobs.reference, `${TAG}-%`));
});

describe("jobs board over more than 500 jobs", () => {
  it.each(WHO)("%s: the total and each queue grow by the hand-counted numbers", (w) => {
    expect(after[w]!.total - before[w]!.total).toBe(ADDED[w].total);
    const b = countsOf(before[w]!);
    const a = countsOf(after[w]!);
    expect(Object.keys(a)).toEqual([...queuesFor(as[w]!.role)]);
    for (const q of queuesFor(as[w]!.role)) expect(a[q]! - b[q]!, q).toBe(ADDED[w][q]);
  });

  it.each(WHO)(
    "%s: the SQL counts equal the policy's predicate over every job the actor may see",
    async (w) => {
      const actor = as[w]!;
      const rows = await db
        .select({
          status: jobs.status,
          assignedInstallerId: jobs.assignedInstallerId,
          scheduledFor: jobs.scheduledFor,
          customerId: jobs.customerId,
        })
        .from(jobs)
        .where(jobAccessCondition(actor));
      expect(after[w]!.total).toBe(rows.length);
      for (const q of queuesFor(actor.role)) {
        const expected = rows.filter((r) => inQueue(q, actor, r)).length;
        expect(countsOf(after[w]!)[q], q).toBe(expected);
        expect((await jobBoard(actor, { queue: q, pageSize: 5 })).total, q).toBe(expected);
      }
    },
  );

  it("pages through a queue of more than one page with limit and offset, each job once", async () => {
    const engineer = as.engineer!;
    const expected = countsOf(after.engineer!).to_issue!;
    expect(expected).toBeGreaterThan(100);
    const seen = new Set<string>();
    for (let page = 1; page <= Math.ceil(expected / 50); page++) {
      const b = await jobBoard(engineer, { queue: "to_issue", pageSize: 50, page, sort: "reference" });
      expect(b.total).toBe(expected);
      expect(b.jobs.length).toBe(Math.min(50, expected - (page - 1) * 50));
      for (const j of b.jobs) {
        expect(j.status).toBe("approved");
        seen.add(j.id);
      }
    }
    expect(seen.size).toBe(expected);
    // Past the last page: nothing, and the total still says how many there are.
    const past = await jobBoard(engineer, { queue: "to_issue", pageSize: 50, page: 99 });
    expect(past).toMatchObject({ jobs: [], total: expected });
  });

  it("without a page size a page holds 500 jobs, and the total counts them all", async () => {
    const b = await jobBoard(as.admin!, {});
    expect(b.pageSize).toBe(500);
    expect(b.jobs).toHaveLength(500);
    expect(b.total).toBe(after.admin!.total);
  });

  it("GET /api/jobs?queue=to_measure&q= answers the installer's own queue over the whole table", async () => {
    await signInAs("installer@halvard.example");
    const res = await listRoute(
      request(`/api/jobs?queue=to_measure&q=${TAG}&pageSize=100&page=2`),
      undefined,
    );
    expect(res.status).toBe(200);
    const body = (await res.json()) as { total: number; jobs: { reference: string }[] };
    expect(body.total).toBe(124);
    expect(body.jobs).toHaveLength(24);
    const [own] = await db
      .select({ id: jobs.id })
      .from(jobs)
      .where(
        and(eq(jobs.reference, body.jobs[0]!.reference), eq(jobs.assignedInstallerId, as.installer!.id)),
      );
    expect(own).toBeDefined();
  });
});
