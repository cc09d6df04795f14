import { comparisonJson, getComparison } from "@/db/queries/readings";
import { requireUser } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { route } from "@/lib/http";

type Ctx = { params: Promise<{ id: string }> };

/** Pre/post readings side by side with change and status, canonical units (mm, arcsec). */
export const GET = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const c = await getComparison(actor, id);
  if (!c) throw notFound("job");
  return Response.json(comparisonJson(c));
});
