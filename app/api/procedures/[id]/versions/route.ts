// Save a procedure's steps: a version no job uses yet changes in place (200); otherwise the body
// becomes the next version (201) and the jobs keep theirs.
import { saveProcedureVersion } from "@/db/queries/procedures";
import { requireUser } from "@/lib/auth/session";
import { forbidden } from "@/lib/errors";
import { readJson, route } from "@/lib/http";
import { procedureEditRefusal } from "@/lib/policy/procedures";

export const runtime = "nodejs";
type Ctx = { params: Promise<{ id: string }> };

export const POST = route<Ctx>(async (req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const refusal = procedureEditRefusal(actor, null);
  if (refusal) throw forbidden(refusal);
  const { replaced, ...procedure } = await saveProcedureVersion(actor, id, await readJson(req));
  return Response.json({ procedure, replaced }, { status: replaced ? 200 : 201 });
});
