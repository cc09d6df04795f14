// Run the head fit of a sphere-probe dataset: 201 with the new analysis, or 200 with the stored
// one when the same input (dataset, options, head configuration, geometry version) was fitted before.
import { analysisJson, getAnalysis, runHeadFit } from "@/db/queries/analyses";
import { signedInRoute } from "@/lib/auth/route";
import { notFound } from "@/lib/errors";

export const runtime = "nodejs";
export const POST = signedInRoute<{ id: string }>(async (_req, actor, { id }) => {
  const { analysis, created } = await runHeadFit(actor, id);
  const d = await getAnalysis(actor, analysis.id);
  if (!d) throw notFound("analysis");
  return Response.json({ analysis: analysisJson(d), reused: !created }, { status: created ? 201 : 200 });
});
