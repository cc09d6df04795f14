import { getReadiness } from "@/db/queries/readiness";
import { requireUser } from "@/lib/auth/session";
import { forbidden, notFound } from "@/lib/errors";
import { route } from "@/lib/http";
import { readinessRefusal } from "@/lib/policy/reports";

type Ctx = { params: Promise<{ id: string }> };

/** What still stands between the job and an issued report: `{ ready, blockers: [{ code, message, href }] }`. */
export const GET = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const r = await getReadiness(actor, id);
  if (!r) throw notFound("job");
  const refusal = readinessRefusal(actor);
  if (refusal) throw forbidden(refusal);
  return Response.json(r);
});
