// A head's fitted parameters across its jobs (installation, re-verification, after-crash), oldest
// first: the office and engineers see every job on the head; installers and inspectors every job on
// a head that one of their jobs is on (404 otherwise); a customer only their own company's jobs on
// it (404 when none).
import { getHeadFitHistory, headHistoryJson } from "@/db/queries/heads-admin";
import { requireUser } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { route } from "@/lib/http";

export const runtime = "nodejs";
type Ctx = { params: Promise<{ id: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const h = await getHeadFitHistory(actor, id);
  if (!h) throw notFound("head");
  return Response.json(headHistoryJson(h));
});
