// One procedure version with its steps and head-parameter limits; 404 when there is none.
import { getTemplate } from "@/db/queries/templates";
import { requireUser } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { route } from "@/lib/http";

export const runtime = "nodejs";
type Ctx = { params: Promise<{ id: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const procedure = await getTemplate(actor, id);
  if (!procedure) throw notFound("procedure");
  return Response.json({ procedure });
});
