import type { Metadata } from "next";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { JobsTable } from "@/components/jobs/jobs-table";
import { JOB_SORT_KEYS, listJobs } from "@/db/queries/jobs";
import { JOB_STATUSES, STATUS_LABELS } from "@/lib/domain/jobs";
import { jobListWords } from "@/lib/policy/navigation";
import { requirePageUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Jobs" };

const paramsSchema = z.object({
  status: z.enum(JOB_STATUSES).optional().catch(undefined),
  q: z.string().max(100).optional().catch(undefined),
  sort: z.enum(JOB_SORT_KEYS).optional().catch(undefined),
  dir: z.enum(["asc", "desc"]).optional().catch(undefined),
});

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

export default async function JobsPage({ searchParams }: Props) {
  const user = await requirePageUser("/jobs");
  const raw = await searchParams;
  const filters = paramsSchema.parse(
    Object.fromEntries(Object.entries(raw).map(([k, v]) => [k, Array.isArray(v) ? v[0] : v])),
  );
  const rows = await listJobs(user, filters);
  const params = new URLSearchParams(
    Object.entries(filters).filter((e): e is [string, string] => typeof e[1] === "string"),
  );
  const sort = {
    sort: filters.sort ?? "updated",
    dir: filters.dir ?? (filters.sort ? "asc" : "desc"),
  } as const;
  const words = jobListWords(user.role);

  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-2xl font-semibold">{words.heading}</h1>
          <p className="text-sm text-graphite-600">
            {rows.length} {rows.length === 1 ? "job" : "jobs"}
            {words.scope}
          </p>
        </div>
        <form className="flex flex-wrap items-end gap-2" role="search" aria-label="Filter jobs">
          <label className="space-y-1">
            <span className="block text-xs font-medium text-graphite-600">Search</span>
            <input
              name="q"
              defaultValue={filters.q ?? ""}
              placeholder="Reference, machine, head…"
              className="min-h-touch w-56 rounded-lg border border-graphite-300 bg-white px-3 text-sm"
            />
          </label>
          <label className="space-y-1">
            <span className="block text-xs font-medium text-graphite-600">Status</span>
            <select
              name="status"
              defaultValue={filters.status ?? ""}
              className="min-h-touch rounded-lg border border-graphite-300 bg-white px-3 text-sm"
            >
              <option value="">Any status</option>
              {JOB_STATUSES.map((s) => (
                <option key={s} value={s}>
                  {STATUS_LABELS[s]}
                </option>
              ))}
            </select>
          </label>
          {filters.sort ? <input type="hidden" name="sort" value={filters.sort} /> : null}
          {filters.dir ? <input type="hidden" name="dir" value={filters.dir} /> : null}
          <Button type="submit" variant="dark">
            Filter
          </Button>
        </form>
      </div>
      <JobsTable rows={rows} sort={sort} params={params} showCustomer={words.showCustomer} />
    </div>
  );
}
