// One analysis: geometry's JSON of the fit (`fit`) with the poses and residuals the page draws.
import { analysisJson, getAnalysis } from "@/db/queries/analyses";
import { requireUser } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { route } from "@/lib/http";

export const runtime = "nodejs";
type Ctx = { params: Promise<{ id: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const d = await getAnalysis(actor, id);
  if (!d) throw notFound("analysis");
  return Response.json({ analysis: analysisJson(d) });
});
