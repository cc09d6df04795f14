// One dataset: GET its parse summary; DELETE marks it deleted (only before review; audited).
import { datasetJson, deleteDataset, getDataset } from "@/db/queries/datasets";
import { signedInRoute } from "@/lib/auth/route";
import { readRoute } from "@/lib/read-route";

export const runtime = "nodejs";
export const GET = readRoute("dataset", getDataset, (d) => Response.json({ dataset: datasetJson(d) }));

export const DELETE = signedInRoute<{ id: string }>(async (_req, actor, { id }) => {
  const row = await deleteDataset(actor, id);
  return Response.json({ id: row.id, status: row.status, deletedAt: row.deletedAt });
});
