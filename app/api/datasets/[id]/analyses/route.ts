// Run the head fit of a sphere-probe dataset: 201 with the new analysis, or 200 with the stored
// one when the same input (dataset, options, head configuration, geometry version) was fitted before.
import { analysisJson, getAnalysis, runHeadFit } from "@/db/queries/analyses";
import { requireUser } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { route } from "@/lib/http";

export const runtime = "nodejs";
type Ctx = { params: Promise<{ id: string }> };

export const POST = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const { analysis, created } = await runHeadFit(actor, id);
  const d = await getAnalysis(actor, analysis.id);
  if (!d) throw notFound("analysis");
  return Response.json({ analysis: analysisJson(d), reused: !created }, { status: created ? 201 : 200 });
});
