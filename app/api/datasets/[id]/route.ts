// One dataset: GET its parse summary; DELETE marks it deleted (only before review; audited).
import { datasetJson, deleteDataset, getDataset } from "@/db/queries/datasets";
import { requireUser } from "@/lib/auth/session";
import { route } from "@/lib/http";
import { readRoute } from "@/lib/read-route";

export const runtime = "nodejs";
type Ctx = { params: Promise<{ id: string }> };

export const GET = readRoute("dataset", getDataset, (d) => Response.json({ dataset: datasetJson(d) }));

export const DELETE = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const row = await deleteDataset(actor, id);
  return Response.json({ id: row.id, status: row.status, deletedAt: row.deletedAt });
});
