import { getJobDetail, jobDetailJson } from "@/db/queries/jobs";
import { requireUser } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { route } from "@/lib/http";

type Ctx = { params: Promise<{ id: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  // Another tenant's job is "not found", exactly like a missing one.
  const detail = await getJobDetail(actor, id);
  if (!detail) throw notFound("job");
  return Response.json({ job: jobDetailJson(detail) });
});
