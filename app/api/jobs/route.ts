import { jobBoard } from "@/db/queries/job-board";
import { openJob } from "@/db/queries/job-office";
import { signedInRoute } from "@/lib/auth/route";
import { forbidden } from "@/lib/errors";
import { readJson } from "@/lib/http";
import { jobCreateRefusal } from "@/lib/policy/jobs";
import { jobBoardQuerySchema, jobOpenSchema } from "@/lib/validations/jobs";

/** The jobs the caller may see: `{ jobs, total, page, pageSize, queues }` (filters, queue and paging in the query). */
export const GET = signedInRoute(async (req, actor) => {
  // 1. who is asking; 2. what they asked for; 3. the query applies their scope.
  const query = jobBoardQuerySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  return Response.json(await jobBoard(actor, query));
});

/** Opens a job (administrator or engineer) → 201 `{ job }`; 422 names the field at fault. */
export const POST = signedInRoute(async (req, actor) => {
  const refusal = jobCreateRefusal(actor);
  if (refusal) throw forbidden(refusal);
  const input = jobOpenSchema.parse(await readJson(req));
  const job = await openJob(actor, input);
  return Response.json(
    { job: { id: job.id, reference: job.reference, status: job.status } },
    { status: 201 },
  );
});
