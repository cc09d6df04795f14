import { z } from "zod";
import { JOB_SORT_KEYS, listJobs } from "@/db/queries/jobs";
import { JOB_STATUSES } from "@/lib/domain/jobs";
import { requireUser } from "@/lib/auth/session";
import { route } from "@/lib/http";

const querySchema = z.object({
  status: z.enum(JOB_STATUSES).optional(),
  q: z.string().max(100).optional(),
  sort: z.enum(JOB_SORT_KEYS).optional(),
  dir: z.enum(["asc", "desc"]).optional(),
});

export const GET = route(async (req) => {
  // 1. who is asking; 2. what they asked for; 3. the query applies their scope.
  const actor = await requireUser();
  const filters = querySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  const rows = await listJobs(actor, filters);
  return Response.json({ jobs: rows });
});
