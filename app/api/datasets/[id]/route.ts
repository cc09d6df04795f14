// One dataset: GET its parse summary; DELETE marks it deleted (only before review; audited).
import { datasetJson, deleteDataset, getDataset } from "@/db/queries/datasets";
import { requireUser } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { route } from "@/lib/http";

export const runtime = "nodejs";
type Ctx = { params: Promise<{ id: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const d = await getDataset(actor, id);
  if (!d) throw notFound("dataset");
  return Response.json({ dataset: datasetJson(d) });
});

export const DELETE = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const row = await deleteDataset(actor, id);
  return Response.json({ id: row.id, status: row.status, deletedAt: row.deletedAt });
});
